// Reference tests for the hazard rules: frost wait, nitrate units and limits, grain, bloat and copper for sheep.
import { describe, expect, it } from 'vitest'
import {
  CLEMSON_NITRATE_BANDS,
  MANITOBA_NITRATE_SCALE,
  NO3_PER_NO3N_MOLAR,
  cautionSchema,
  convertNitrate,
  frostWait,
  hazards,
  nitrateGuidance,
  nitrateToPpmNo3N,
  sorghumBuPerAcreToKgPerHa,
  type Caution,
} from '../../../shared/engine/grazing/index'
import { addDays } from '../../../shared/engine/grazing/dates'
import { aField, aGroup, expectZodErrorAt } from './builders'

const codes = (cs: Caution[]) => cs.map((c) => c.code)
const find = (cs: Caution[], code: string) => cs.filter((c) => c.code === code)

describe('frostWait', () => {
  // Day 0 = 2025-10-20: partial frost day 0, partial frost day 3, killing frost day 10.
  const day = (n: number) => addDays('2025-10-20', n)
  const frosts = { partialFrostDates: [day(0), day(3)], killingFrostDates: [day(10)] }

  it('UNL BeefWatch 2024 rule (Drewnoski & Redfearn), worked example (derived): frosts on days 0 (partial), 3 (partial) and 10 (killing) → first grazing day 17', () => {
    for (let n = 0; n <= 16; n++) expect(frostWait({ ...frosts, date: day(n) }).blocked).toBe(true)
    expect(frostWait({ ...frosts, date: day(17) }).blocked).toBe(false)
    expect(frostWait({ ...frosts, date: day(12) }).firstGrazingDate).toBe(day(17))
    expect(frostWait({ ...frosts, date: day(12) }).daysLeft).toBe(5)
  })

  it('UNL BeefWatch 2024: each frost restarts the 7-day clock, so before the killing frost the partial frosts alone block days 0–9', () => {
    expect(frostWait({ ...frosts, date: day(9) }).firstGrazingDate).toBe(day(10))
    expect(frostWait({ ...frosts, date: day(9) }).governingFrost).toEqual({ date: day(3), killing: false })
    expect(frostWait({ ...frosts, date: day(9) }).killed).toBe(false)
    expect(frostWait({ ...frosts, date: day(-1) })).toMatchObject({ blocked: false, firstGrazingDate: null, killed: false })
  })

  it('G. Bates (Univ. of Tennessee) setting: 2 weeks after a non-killing frost', () => {
    const w = frostWait({ partialFrostDates: [day(0)], date: day(13), partialWaitDays: 14 })
    expect(w.blocked).toBe(true)
    expect(w.firstGrazingDate).toBe(day(14))
  })

  it('a frost later than the date does not block it yet', () => {
    expect(frostWait({ killingFrostDates: [day(5)], date: day(4) }).blocked).toBe(false)
  })

  it('hazards: strips of a sorghum field are blocked with a danger caution until the first grazing date, stating its rule and source', () => {
    const f = aField({ ...frosts })
    const cs = hazards(f, aGroup(), day(12))
    const fw = find(cs, 'frost-wait')
    expect(fw).toHaveLength(1)
    expect(fw[0]).toMatchObject({ severity: 'danger', blocksGrazing: true, until: day(17) })
    expect(fw[0].source).toContain('UNL BeefWatch 2024')
    expect(codes(hazards(f, aGroup(), day(17)))).not.toContain('frost-wait')
  })

  it('before any killing frost, an info caution says to take stock off sorghum before a forecast frost (OMAFRA ONforage 2024)', () => {
    const cs = hazards(aField(), aGroup(), '2025-10-01')
    expect(find(cs, 'frost-not-yet')[0].severity).toBe('info')
  })
})

describe('nitrate units', () => {
  it('B. Anderson (UNL, via Dairy Herd): NO3-N 2,000 ppm ≈ 8,860 ppm NO3 with the 4.43 factor; molar masses give 4.4266 (N 14.007, O 15.999, from memory)', () => {
    expect(NO3_PER_NO3N_MOLAR).toBeCloseTo(4.4266, 4)
    expect(Math.abs(convertNitrate(2000, 'ppm-NO3-N', 'ppm-NO3') - 8860) / 8860).toBeLessThan(0.001)
  })
  it('UNL via Dairy Herd: NO3-N = NO3 × 0.226', () => {
    expect(convertNitrate(1, 'ppm-NO3', 'ppm-NO3-N')).toBeCloseTo(0.226, 3)
  })
  it('UNL via Dairy Herd: the danger level 2,000–2,300 ppm NO3-N matches 9,000–10,000 ppm NO3', () => {
    expect(convertNitrate(9000, 'ppm-NO3', 'ppm-NO3-N')).toBeGreaterThan(2000)
    expect(convertNitrate(10000, 'ppm-NO3', 'ppm-NO3-N')).toBeLessThan(2300)
  })
  it('1 % = 10,000 ppm: 0.12 % NO3-N is 1,200 ppm NO3-N; 0.5 % NO3 is ≈1,130 ppm NO3-N', () => {
    expect(nitrateToPpmNo3N(0.12, 'pct-NO3-N')).toBeCloseTo(1200, 9)
    expect(nitrateToPpmNo3N(0.5, 'pct-NO3')).toBeCloseTo(5000 / NO3_PER_NO3N_MOLAR, 9)
  })
  it('Manitoba Agriculture "dangerous" from 0.9 % NO3 falls in the Clemson band that bars pregnant stock (≥2,000 ppm NO3-N)', () => {
    const top = MANITOBA_NITRATE_SCALE[MANITOBA_NITRATE_SCALE.length - 1]
    expect(top.label).toBe('dangerous')
    const g = nitrateGuidance({ value: top.fromPctNo3, unit: 'pct-NO3' })
    expect(CLEMSON_NITRATE_BANDS[g.band].notForPregnant).toBe(true)
  })
})

describe('nitrateGuidance (Clemson Agricultural Service Laboratory bands)', () => {
  it('Clemson Agricultural Service Laboratory nitrate guidelines: 1,200 ppm NO3-N for a pregnant cow → at most 50 % of ration DM; no limit when not pregnant', () => {
    expect(nitrateGuidance({ value: 1200, unit: 'ppm-NO3-N', pregnant: true })).toMatchObject({ maxDietSharePct: 50, doNotFeed: false, severity: 'caution' })
    expect(nitrateGuidance({ value: 1200, unit: 'ppm-NO3-N' })).toMatchObject({ maxDietSharePct: null, severity: 'info' })
  })
  it('Clemson Agricultural Service Laboratory nitrate guidelines: 4,500 ppm NO3-N → do not feed', () => {
    expect(nitrateGuidance({ value: 4500, unit: 'ppm-NO3-N' })).toMatchObject({ doNotFeed: true, maxDietSharePct: 0, severity: 'danger' })
  })
  it.each([
    [999, 0, null],
    [1000, 1, null],
    [1500, 2, 50],
    [2000, 3, 35],
    [3500, 4, 25],
    [4000, 5, 0],
  ])('Clemson ASL: %i ppm NO3-N is band %i with limit %s % (a shared boundary goes to the stricter band)', (ppm, band, max) => {
    const g = nitrateGuidance({ value: ppm, unit: 'ppm-NO3-N' })
    expect(g.band).toBe(band)
    expect(g.maxDietSharePct).toBe(max)
  })
  it('the same result in any unit gets the same band', () => {
    const ppmN = 2600
    for (const unit of ['ppm-NO3-N', 'ppm-NO3', 'pct-NO3-N', 'pct-NO3'] as const) {
      expect(nitrateGuidance({ value: convertNitrate(ppmN, 'ppm-NO3-N', unit), unit }).band).toBe(3)
    }
  })
  it('hazards: a pregnant group on a 2,600 ppm NO3-N field is told not to graze it (Clemson: not for pregnant animals)', () => {
    const f = aField({ nitrate: { value: 2600, unit: 'ppm-NO3-N', sampledOn: '2025-10-10' } })
    const n = find(hazards(f, aGroup({ pregnant: true }), '2025-12-01'), 'nitrate')[0]
    expect(n).toMatchObject({ severity: 'danger', blocksGrazing: true })
    const open = find(hazards(f, aGroup(), '2025-12-01'), 'nitrate')[0]
    expect(open.severity).toBe('warning')
    expect(open.message).toContain('35 %')
  })
  it('when the unit is not one a lab reports, then a ZodError names unit', () => {
    expectZodErrorAt(() => nitrateGuidance({ value: 1, unit: 'ppm' as never }), ['unit'])
  })
})

describe('grain hazards', () => {
  it('K-State eUpdate "Crop residues": grain on the ground from 8 bu/ac is a caution, from 10 bu/ac a warning', () => {
    const at = (bu: number) => find(hazards(aField({ grainOnGround: { kgPerHa: sorghumBuPerAcreToKgPerHa(bu), observedOn: '2025-12-01' } }), aGroup(), '2025-12-01'), 'grain-on-ground')
    expect(at(7.9)).toHaveLength(0)
    expect(at(8)[0].severity).toBe('caution')
    expect(at(10)[0].severity).toBe('warning')
  })

  const grainy = aField({
    legume: 'none',
    legumeShareOfWidth: 0,
    components: [
      { kind: 'sorghum-grain', kgDmPerHa: 8000, measuredOn: '2025-11-20', method: 'head-count' },
      { kind: 'sorghum-stover', kgDmPerHa: 2000, measuredOn: '2025-11-20', method: 'stover-rule' },
    ],
    killingFrostDates: ['2025-10-25'],
  })

  it('Merck Veterinary Manual ("Grain overload in ruminants", ≈10 kg kills unadapted cattle): whole-field access to a grain-heavy field is a danger for unadapted cattle (first-day diet from default preference weights)', () => {
    const cs = hazards(grainy, aGroup({ intakeKgDmPerHead: 14 }), '2025-12-01', { access: 'whole-field' })
    expect(find(cs, 'grain-overload')[0].severity).toBe('danger')
    expect(codes(cs)).toContain('grain-share')
    expect(codes(cs)).toContain('grain-adaptation')
    const adapted = hazards(grainy, aGroup({ intakeKgDmPerHead: 14, grainAdapted: true }), '2025-12-01', { access: 'whole-field' })
    expect(codes(adapted)).not.toContain('grain-overload')
    expect(codes(adapted)).not.toContain('grain-adaptation')
  })

  it('Univ. of Missouri G2079: strips sized by a 13-lb grain allowance cap the grain eaten, so overload and grain share clear for adapted cows', () => {
    const cow = aGroup({ intakeKgDmPerHead: 16, grainAdapted: true })
    const bare = hazards(grainy, cow, '2025-12-01')
    expect(codes(bare)).toContain('grain-overload')
    expect(find(bare, 'grain-share')[0].message).toContain('grain allowance')
    const capped = hazards(grainy, cow, '2025-12-01', { grainAllowanceKgPerHead: 13 * 0.45359237 })
    expect(codes(capped)).not.toContain('grain-overload')
    expect(codes(capped)).not.toContain('grain-share')
  })

  it('Univ. of Missouri G2079 (10–13 lb grain at ≈26 lb DMI, ≈33–42 % of DM, derived): a stover-heavy field raises no grain-share caution', () => {
    const stovery = aField({
      legume: 'none',
      legumeShareOfWidth: 0,
      components: [
        { kind: 'sorghum-grain', kgDmPerHa: 500, measuredOn: '2025-11-20', method: 'head-count' },
        { kind: 'sorghum-stover', kgDmPerHa: 6000, measuredOn: '2025-11-20', method: 'clipped-frame' },
      ],
    })
    expect(codes(hazards(stovery, aGroup({ grainAdapted: true }), '2025-12-01'))).not.toContain('grain-share')
  })

  it('Morrical & Rook, "Grazing corn stalks with the ewe flock": unadapted ewes are told 1–2 h a day at first and enterotoxemia vaccination', () => {
    const ewes = aGroup({ species: 'sheep', headCount: 200, bodyWeightKg: 70, intakeKgDmPerHead: 2 })
    const a = find(hazards(grainy, ewes, '2025-12-01'), 'grain-adaptation')[0]
    expect(a.message).toContain('1–2 h')
    expect(a.message).toContain('enterotoxemia')
    expect(a.source).toContain('Morrical')
  })
})

describe('bloat', () => {
  const lush = aField({
    components: [
      { kind: 'legume-forage', kgDmPerHa: 8000, basis: 'field', measuredOn: '2025-10-01', method: 'clipped-frame' },
      { kind: 'sorghum-stover', kgDmPerHa: 1500, measuredOn: '2025-10-01', method: 'clipped-frame' },
    ],
  })
  it('Alberta Agriculture "Grazing legumes and bloat"; Lehmkuhler (Univ. of Kentucky, >50 % legume): green legume above half the diet is a warning for cattle (first-day diet from default preference weights)', () => {
    const b = find(hazards(lush, aGroup(), '2025-10-05'), 'bloat')[0]
    expect(b.severity).toBe('warning')
    expect(b.message).toContain('dry roughage')
  })
  it('NSW Local Land Services (cattle more bloat-prone than sheep): the same field is one step lower for sheep', () => {
    const b = find(hazards(lush, aGroup({ species: 'sheep', bodyWeightKg: 70, intakeKgDmPerHead: 2 }), '2025-10-05'), 'bloat')[0]
    expect(b.severity).toBe('caution')
  })
  it('a frost-killed legume that is a small part of the diet raises no bloat caution (Alberta Agriculture: risk falls with maturity)', () => {
    const f = aField({ killingFrostDates: ['2025-10-25'] })
    expect(codes(hazards(f, aGroup(), '2025-12-10'))).not.toContain('bloat')
    expect(codes(hazards(aField(), aGroup(), '2025-10-16'))).toContain('bloat')
  })
})

describe('copper for sheep', () => {
  const ewes = aGroup({ id: 'ewes', name: 'Test ewes', species: 'sheep', headCount: 200, bodyWeightKg: 70, intakeKgDmPerHead: 2 })
  it('Duncan, In Practice 19(9):503: sheep diet copper 18 ppm is above the ≈15 ppm estimated maximum → warning', () => {
    expect(find(hazards(aField(), { ...ewes, dietCopperPpmDm: 18 }, '2025-12-01'), 'copper-sheep').map((c) => c.severity)).toEqual(['info', 'warning'])
  })
  it('Church & Pond 1988 via Berger (Univ. of Illinois): 12 ppm is a caution; 8 ppm only the standing reminder', () => {
    expect(find(hazards(aField(), { ...ewes, dietCopperPpmDm: 12 }, '2025-12-01'), 'copper-sheep').map((c) => c.severity)).toEqual(['info', 'caution'])
    expect(find(hazards(aField(), { ...ewes, dietCopperPpmDm: 8 }, '2025-12-01'), 'copper-sheep').map((c) => c.severity)).toEqual(['info'])
  })
  it('cattle at the same copper raise no copper caution (≈100 ppm cattle maximum, Duncan)', () => {
    expect(codes(hazards(aField(), aGroup({ dietCopperPpmDm: 18 }), '2025-12-01')).some((c) => c.startsWith('copper'))).toBe(false)
  })
  it('Berger (Univ. of Illinois): a cattle mineral set for a sheep group is a danger; cattle with their mineral on the same field is a warning', () => {
    expect(find(hazards(aField(), { ...ewes, mineral: { intendedFor: 'cattle', label: 'Test cow mineral' } }, '2025-12-01'), 'copper-cattle-mineral')[0].severity).toBe('danger')
    const cows = aGroup({ mineral: { intendedFor: 'cattle' } })
    expect(find(hazards(aField(), ewes, '2025-12-01', { groupsOnField: [cows] }), 'copper-mixed-grazing')[0].severity).toBe('warning')
  })
})

describe('every caution', () => {
  it('carries a code, severity, rule, source and evidence label, and puts a veterinarian, a licensed nutritionist and local regulations first', () => {
    const f = aField({ killingFrostDates: ['2025-11-28'], nitrate: { value: 1700, unit: 'ppm-NO3-N' }, grainOnGround: { kgPerHa: 900, observedOn: '2025-12-01' } })
    const cs = [
      ...hazards(f, aGroup({ pregnant: true }), '2025-12-01'),
      ...hazards(f, aGroup({ species: 'sheep', bodyWeightKg: 70, intakeKgDmPerHead: 2, dietCopperPpmDm: 20 }), '2025-12-01'),
    ]
    expect(cs.length).toBeGreaterThanOrEqual(6)
    for (const c of cs) {
      expect(() => cautionSchema.parse(c)).not.toThrow()
      expect(c.rule.length).toBeGreaterThan(0)
      expect(c.source.length).toBeGreaterThan(0)
      expect(c.consult).toMatch(/veterinarian/)
      expect(c.consult).toMatch(/licensed nutritionist/)
      expect(c.consult).toMatch(/local regulations/)
    }
  })
  it('when the group or date is invalid, then a ZodError names the field', () => {
    expectZodErrorAt(() => hazards(aField(), aGroup({ headCount: 0 }), '2025-12-01'), ['headCount'])
    expectZodErrorAt(() => hazards(aField(), aGroup({ species: 'goats' as never }), '2025-12-01'), ['species'])
    expectZodErrorAt(() => hazards(aField(), aGroup(), '12/01/2025'), [])
  })
})
