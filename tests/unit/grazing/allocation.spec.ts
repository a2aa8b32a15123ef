// Reference tests for allocation: animal units, intake rules, utilization, paddock sizing, stocking days, strip plans.
import { describe, expect, it } from 'vitest'
import { FT_M, LB_KG, convertArea, lbPerAcreToKgPerHa } from '../../../shared/engine/units'
import {
  AU_INTAKE_KG_DM_PSU,
  AU_INTAKE_KG_DM_SRM,
  HA_PER_ACRE,
  PENN_STATE_UTILIZATION_BY_PERIOD,
  SHEEP_PER_AU_CONVENTIONAL,
  UTILIZATION_DEFAULTS,
  allotmentPerHead,
  animalUnitEquivalent,
  animalUnitMonthKgDm,
  compareAccess,
  defaultUtilization,
  grainAllowanceFromStrip,
  intakeAnimalUnits,
  intakeFromBodyWeight,
  metresToPaces,
  paddockAreaPerAnimalUnitHa,
  pennStateUtilization,
  perHaToPerAcre,
  sorghumBuPerAcreToKgPerHa,
  stockingDaysPerHa,
  stripPlan,
  stripPlanByGrain,
  stripSchedule,
  wholeFieldPlan,
} from '../../../shared/engine/grazing/index'
import { expectZodErrorAt } from './builders'

const lb = (x: number) => x * LB_KG
const acresToHa = (ac: number) => ac * HA_PER_ACRE
const haToAcres = (ha: number) => ha / HA_PER_ACRE

describe('animal units', () => {
  it('SRM Glossary 4th ed. (1998): an AU eats 26 lb DM/day ≈ 12 kg; Penn State Table 1.8-9 footnote plans on 25 lb', () => {
    expect(AU_INTAKE_KG_DM_SRM).toBeCloseTo(11.79, 2)
    expect(Math.round(AU_INTAKE_KG_DM_SRM)).toBe(12)
    expect(AU_INTAKE_KG_DM_PSU / LB_KG).toBeCloseTo(25, 10)
  })
  it('Arterburn, Progressive Cattle 2019: one AUM = 30 AU-days = 780 lb DM at 26 lb/day', () => {
    expect(animalUnitMonthKgDm() / LB_KG).toBeCloseTo(780, 9)
  })
  it('Arterburn 2019 (+0.1 AU per 100 lb) and Manske 1998 (NDSU, metabolic): a 1,200-lb cow is 1.2 AU linear, 1.147 metabolic', () => {
    expect(animalUnitEquivalent({ bodyWeightKg: lb(1200) })).toBeCloseTo(1.2, 10)
    expect(animalUnitEquivalent({ bodyWeightKg: lb(1200), method: 'metabolic' })).toBeCloseTo(1.147, 3)
  })
  it('Texas Animal Unit Equivalent chart: a 130-lb ewe at 3.5 % BW eats 4.55 lb DM/day ≈ 0.18 AU', () => {
    const intake = intakeFromBodyWeight(lb(130), 3.5)
    expect(intake / LB_KG).toBeCloseTo(4.55, 10)
    const au = intakeAnimalUnits(intake)
    expect(au).toBeCloseTo(4.55 / 26, 12)
    // The chart's 0.18 is 0.175 rounded half-up to two places.
    expect(Math.abs(au - 0.18)).toBeLessThanOrEqual(0.005 + 1e-12)
  })
  it('the conventional 5 ewes per AU (Agproud, federal grazing) is within 20 % of the intake-based ≈6 ewes per AU (Texas AUE chart)', () => {
    const ewesPerAu = 1 / intakeAnimalUnits(intakeFromBodyWeight(lb(130), 3.5))
    expect(ewesPerAu).toBeCloseTo(5.71, 2)
    expect(Math.abs(ewesPerAu - SHEEP_PER_AU_CONVENTIONAL) / ewesPerAu).toBeLessThan(0.2)
  })
  it('NCAT ATTRA "Grazier\'s Math": a 1,050-lb cow at 3 % BW eats 31.5 lb DM/day', () => {
    expect(intakeFromBodyWeight(lb(1050), 3) / LB_KG).toBeCloseTo(31.5, 10)
  })
  it('UGA SARE "Management-intensive grazing: forage allotment": a 600-lb steer eating 19.2 lb at 30 % efficiency must be allotted 64 lb', () => {
    expect(allotmentPerHead(lb(19.2), 0.3) / LB_KG).toBeCloseTo(64, 9)
  })
})

describe('utilization', () => {
  it('Penn State Agronomy Guide Table 1.8-9: 1 d 80 %, 2–3 d 75 %, 4 d 70 %, 5 d 65 %, 6–7 d 60 %', () => {
    expect([1, 2, 3, 4, 5, 6, 7].map((d) => pennStateUtilization(d).utilization)).toEqual([0.8, 0.75, 0.75, 0.7, 0.65, 0.6, 0.6])
    expect(pennStateUtilization(14)).toEqual({ utilization: 0.6, extrapolated: true })
    expect(PENN_STATE_UTILIZATION_BY_PERIOD).toHaveLength(5)
  })
  it('Corriher (Texas AgriLife): cattle defaults sit inside continuous 30–40 % and strip 70–80 %', () => {
    const whole = UTILIZATION_DEFAULTS.cattle['whole-field'].value
    const strip = UTILIZATION_DEFAULTS.cattle.strip.value
    expect(whole).toBeGreaterThanOrEqual(0.3)
    expect(whole).toBeLessThanOrEqual(0.4)
    expect(strip).toBeGreaterThanOrEqual(0.7)
    expect(strip).toBeLessThanOrEqual(0.8)
  })
  it('sheep waste less than cattle (common practice): sheep defaults are higher for each access system', () => {
    for (const access of ['strip', 'whole-field'] as const) {
      expect(UTILIZATION_DEFAULTS.sheep[access].value).toBeGreaterThan(UTILIZATION_DEFAULTS.cattle[access].value)
    }
    expect(UTILIZATION_DEFAULTS.sheep.strip.evidence).toBe('common practice')
  })
  it('longer strips lose utilization in Penn State Table 1.8-9 proportions (derived), never below the whole-field value', () => {
    const u = [1, 2, 4, 5, 7, 30].map((d) => defaultUtilization({ species: 'cattle', access: 'strip', daysPerMove: d }).value)
    expect(u[0]).toBe(0.75)
    expect(u[1]).toBeCloseTo(0.75 * (0.75 / 0.8), 12)
    for (let i = 1; i < u.length; i++) expect(u[i]).toBeLessThanOrEqual(u[i - 1])
    expect(Math.min(...u)).toBeGreaterThanOrEqual(UTILIZATION_DEFAULTS.cattle['whole-field'].value)
  })
})

describe('paddockAreaPerAnimalUnitHa', () => {
  it('Penn State Agronomy Guide Table 1.8-9: 1-day paddock, 80 %, 1,000 lb DM/ac → 0.031 ac per AU (0.03125)', () => {
    const ha = paddockAreaPerAnimalUnitHa({ grazingDays: 1, availableKgDmPerHa: lbPerAcreToKgPerHa(1000) })
    expect(haToAcres(ha)).toBeCloseTo(0.03125, 10)
    expect(Number(haToAcres(ha).toFixed(3))).toBe(0.031)
  })
  it('Penn State Agronomy Guide Table 1.8-9: 7-day paddock, 60 %, 750 lb DM/ac → 0.389 ac per AU', () => {
    const ha = paddockAreaPerAnimalUnitHa({ grazingDays: 7, availableKgDmPerHa: lbPerAcreToKgPerHa(750) })
    expect(haToAcres(ha)).toBeCloseTo(0.3889, 4)
  })
})

describe('stockingDaysPerHa', () => {
  it('R. Lee (Univ. of Missouri Ext.): 120-bu milo at 13 lb grain/cow/day gives 517 cow-days/ac at 100 % and 388 at 75 %, close to the ≈400 published', () => {
    const grain = sorghumBuPerAcreToKgPerHa(120)
    const full = perHaToPerAcre(stockingDaysPerHa({ availableKgDmPerHa: grain, utilization: 1, intakeKgDmPerHead: lb(13) }))
    const at75 = perHaToPerAcre(stockingDaysPerHa({ availableKgDmPerHa: grain, utilization: 0.75, intakeKgDmPerHead: lb(13) }))
    expect(full).toBeCloseTo(516.9, 1)
    expect(at75).toBeCloseTo(387.7, 1)
    expect(Math.abs(at75 - 400) / 400).toBeLessThan(0.05)
  })
  it('van Pletzen et al. 1991: 1,250 sheep-days/ha on maize residue is ≈506 sheep-days/ac (derived)', () => {
    expect(perHaToPerAcre(1250)).toBeCloseTo(505.9, 1)
  })
  it('the strip plan gives the same animal-days per hectare as stocking arithmetic, to within one day of rounding', () => {
    const input = { headCount: 40, intakeKgDmPerHead: 13.6, availableKgDmPerHa: 9000, utilization: 0.75, fieldAreaHa: 4, fenceLengthM: 200, start: '2025-12-01' }
    const sd = stockingDaysPerHa({ availableKgDmPerHa: 9000, utilization: 0.75, intakeKgDmPerHead: 13.6 })
    const plan = stripPlan(input)
    expect(plan.daysOfGrazing).toBe(Math.floor((sd * 4) / 40))
  })
})

describe('stripPlan (forage basis)', () => {
  // 40 cows × 1,200 lb × 2.5 % BW = 30 lb DM each; 8,000 lb DM/ac; utilization 0.75; fence 660 ft; a 10-ac field.
  const input = {
    headCount: 40,
    intakeKgDmPerHead: intakeFromBodyWeight(lb(1200), 2.5),
    availableKgDmPerHa: lbPerAcreToKgPerHa(8000),
    utilization: 0.75,
    fieldAreaHa: acresToHa(10),
    fenceLengthM: 660 * FT_M,
    daysPerMove: 1,
    start: '2025-12-01',
  }

  it('strip worked example, derived from the Penn State Agronomy Guide Table 1.8-9 arithmetic: 40 cows × 30 lb DM on 8,000 lb/ac at 75 % → 0.2 ac/day = 8,712 ft², fence moves 13.2 ft/day', () => {
    const p = stripPlan(input)
    expect(haToAcres(p.stripAreaHa)).toBeCloseTo(0.2, 10)
    expect(convertArea(p.stripAreaHa, 'ha', 'ft2')).toBeCloseTo(8712, 6)
    expect(p.fenceMoveM / FT_M).toBeCloseTo(13.2, 9)
  })

  it('the same example lasts 50 days on 10 ac and ends on the 51st day, counted in UTC', () => {
    const p = stripPlan(input)
    expect(p.daysOfGrazing).toBe(50)
    expect(p.lastGrazingDate).toBe('2026-01-19')
    expect(p.endDate).toBe('2026-01-20')
  })

  it('a pace of 2.5 ft (common practice) makes the 13.2-ft move 5.3 paces', () => {
    const p = stripPlan(input)
    expect(p.fenceMovePaces).toBeCloseTo(5.28, 2)
    expect(metresToPaces(p.fenceMoveM, 0.8)).toBeCloseTo(p.fenceMoveM / 0.8, 12)
  })

  it('3-day strips triple the strip and the move; the field still lasts 50 days, as 16 strips and a 2-day last strip', () => {
    const p = stripPlan({ ...input, daysPerMove: 3 })
    expect(haToAcres(p.stripAreaHa)).toBeCloseTo(0.6, 10)
    expect(p.fenceMoveM / FT_M).toBeCloseTo(39.6, 9)
    expect([p.daysOfGrazing, p.fullStrips, p.lastStripDays]).toEqual([50, 16, 2])
  })

  it('the schedule advances the fence from the water end to the far end without passing it', () => {
    const p = stripPlan({ ...input, daysPerMove: 3 })
    const moves = stripSchedule(p, input.start, 3)
    expect(moves).toHaveLength(17)
    expect(moves[0].fromM).toBe(0)
    expect(moves[1].startDate).toBe('2025-12-04')
    expect(moves[16].days).toBe(2)
    expect(moves[16].toM).toBeLessThanOrEqual(p.fieldLengthM * (1 + 1e-12))
    expect(moves[16].toM).toBeCloseTo(p.fieldLengthM, 6)
  })

  it('when one day needs more than the field, then no whole day is planned and the plan warns', () => {
    const p = stripPlan({ ...input, fieldAreaHa: 0.05 })
    expect(p.daysOfGrazing).toBe(0)
    expect(p.lastGrazingDate).toBeNull()
    expect(p.endDate).toBe(input.start)
    expect(p.warnings.length).toBeGreaterThan(0)
  })

  it('when an input is invalid, then a ZodError names it', () => {
    expectZodErrorAt(() => stripPlan({ ...input, headCount: 0 }), ['headCount'])
    expectZodErrorAt(() => stripPlan({ ...input, utilization: 1.2 }), ['utilization'])
    expectZodErrorAt(() => stripPlan({ ...input, start: '2025-02-30' }), ['start'])
    expectZodErrorAt(() => stripPlan({ ...input, availableKgDmPerHa: Number.POSITIVE_INFINITY }), ['availableKgDmPerHa'])
  })
})

describe('stripPlanByGrain', () => {
  it('Univ. of Missouri Ext. G2079 grain allowance, worked example (derived): 40 cows × 10 lb grain on 100-bu milo → 0.0714 ac/day = 3,111 ft², 4.71 ft/day on a 660-ft fence', () => {
    const p = stripPlanByGrain({
      headCount: 40,
      grainAllowanceKgPerHead: lb(10),
      grainKgPerHa: sorghumBuPerAcreToKgPerHa(100),
      fieldAreaHa: acresToHa(10),
      fenceLengthM: 660 * FT_M,
      start: '2025-12-01',
    })
    expect(haToAcres(p.stripAreaHa)).toBeCloseTo(0.0714, 4)
    expect(Math.round(convertArea(p.stripAreaHa, 'ha', 'ft2'))).toBe(3111)
    expect(p.fenceMoveM / FT_M).toBeCloseTo(4.71, 2)
    expect(p.basis).toBe('grain')
  })

  it('SARE FNC03-474: 31 cows on a 30 × 35 ft strip a day of 206-bu grain get 8.97 lb each (derived)', () => {
    const kg = grainAllowanceFromStrip({ headCount: 31, stripAreaHa: convertArea(30 * 35, 'ft2', 'ha'), grainKgPerHa: sorghumBuPerAcreToKgPerHa(206) })
    expect(kg / LB_KG).toBeCloseTo(8.97, 2)
  })

  it('R. Lee (farmtalknews 2023): grain strips longer than a day carry a warning', () => {
    const p = stripPlanByGrain({ headCount: 40, grainAllowanceKgPerHead: 5, grainKgPerHa: 6000, fieldAreaHa: 4, fenceLengthM: 200, daysPerMove: 3, start: '2025-12-01' })
    expect(p.warnings.some((w) => w.includes('gorge'))).toBe(true)
  })

  it('when the allowance is missing, then a ZodError names grainAllowanceKgPerHead', () => {
    expectZodErrorAt(
      () => stripPlanByGrain({ headCount: 40, grainKgPerHa: 6000, fieldAreaHa: 4, fenceLengthM: 200, start: '2025-12-01' } as never),
      ['grainAllowanceKgPerHead'],
    )
  })
})

describe('whole field against strips', () => {
  const base = { headCount: 60, intakeKgDmPerHead: 12, availableKgDmPerHa: 9000, fieldAreaHa: 12, fenceLengthM: 300, start: '2025-12-01' }

  it('Jennings (Univ. of Arkansas, Hay & Forage Grower): strips at least double grazing days over the whole field, with the cattle defaults (strip 75 %, G2079; whole field 32.5 %, common practice)', () => {
    const c = compareAccess({ ...base, species: 'cattle' })
    expect(c.strip.daysOfGrazing).toBeGreaterThanOrEqual(2 * c.wholeField.daysOfGrazing)
    expect(c.extraDaysFromStrips).toBe(c.strip.daysOfGrazing - c.wholeField.daysOfGrazing)
  })

  it('whole-field days are field × DM × utilization ÷ daily demand, rounded down', () => {
    const w = wholeFieldPlan({ ...base, utilization: 0.325 })
    expect(w.exactDays).toBeCloseTo((12 * 9000 * 0.325) / (60 * 12), 10)
    expect(w.daysOfGrazing).toBe(48)
    expect(w.endDate).toBe('2026-01-18')
  })
})

describe('plans that outlast any season', () => {
  it('when one head would take more than 100 years to graze the field, then days stop at the cap, the end date stays a real date and the plan warns', () => {
    const p = stripPlan({ headCount: 1, intakeKgDmPerHead: 0.5, availableKgDmPerHa: 6446, utilization: 0.45, fieldAreaHa: 500, fenceLengthM: 5, start: '2026-03-15' })
    expect(p.daysOfGrazing).toBe(36_525)
    expect(p.exactDays).toBeGreaterThan(36_525)
    // 2026-03-15 to 2126-03-15 is 36,524 days (24 leap days: 2100 is not a leap year), so the cap lands a day later.
    expect(p.endDate).toBe('2126-03-16')
    expect(p.warnings.some((w) => w.includes('cap'))).toBe(true)
  })
  it('when a date falls outside 1900–2199, then a ZodError names it', () => {
    expectZodErrorAt(() => stripPlan({ headCount: 1, intakeKgDmPerHead: 1, availableKgDmPerHa: 1000, utilization: 0.5, fieldAreaHa: 1, fenceLengthM: 5, start: '9999-12-31' }), ['start'])
  })
})
