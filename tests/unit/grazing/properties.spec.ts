// Property tests: strips never exceed the field, more head or less forage never lengthens a season, units round-trip, outputs stay finite.
import { describe, expect, it } from 'vitest'
import fc from 'fast-check'
import {
  convertArea,
  convertLength,
  convertMass,
  kgPerHaToLbPerAcre,
  lbPerAcreToKgPerHa,
  type AreaUnit,
  type LengthUnit,
  type MassUnit,
} from '../../../shared/engine/units'
import {
  MAX_GRAZING_DAYS,
  NITRATE_REPORT_UNITS,
  cautionSchema,
  clipPlotDm,
  clipPlotResultSchema,
  convertNitrate,
  fieldSupply,
  fieldSupplySchema,
  grainYieldFromHeads,
  grainYieldSchema,
  hazards,
  kgPerHaToSorghumBuPerAcre,
  perAcreToPerHa,
  perHaToPerAcre,
  seasonBudget,
  seasonBudgetSchema,
  sorghumBuPerAcreToKgPerHa,
  stripDietByDay,
  stripDietSchema,
  stripPlan,
  stripPlanByGrain,
  stripPlanSchema,
  wholeFieldPlan,
  type GrazingFieldInput,
  type GrazingGroupInput,
  type SeasonPlanInput,
} from '../../../shared/engine/grazing/index'
import { addDays, dayNumber, daysBetween, isoFromDayNumber } from '../../../shared/engine/grazing/dates'

const num = (min: number, max: number) => fc.double({ min, max, noNaN: true, noDefaultInfinity: true })
const dateArb = (from = '2025-09-01', span = 200) => fc.integer({ min: 0, max: span }).map((n) => addDays(from, n))

const stripInputArb = fc.record({
  headCount: fc.integer({ min: 1, max: 2000 }),
  intakeKgDmPerHead: num(0.5, 25),
  availableKgDmPerHa: num(50, 30000),
  utilization: num(0.05, 1),
  fieldAreaHa: num(0.01, 500),
  fenceLengthM: num(5, 3000),
  daysPerMove: fc.integer({ min: 1, max: 14 }),
  start: dateArb(),
})

const labArb = fc.option(
  fc.record({ cpPctDm: num(0, 40), tdnPctDm: num(0, 95), source: fc.constant({ kind: 'lab' as const, label: 'property lab' }) }),
  { nil: undefined },
)

const fieldArb = (id: string): fc.Arbitrary<GrazingFieldInput> =>
  fc
    .record({
      legume: fc.constantFrom('cowpea' as const, 'forage-soybean' as const, 'none' as const),
      share: num(0, 0.9),
      areaHa: num(1, 80),
      grain: num(0, 9000),
      stover: num(100, 12000),
      legumeKg: num(0, 6000),
      measuredOn: dateArb('2025-09-15', 60),
      killing: fc.array(dateArb('2025-10-01', 120), { maxLength: 2 }),
      partial: fc.array(dateArb('2025-10-01', 120), { maxLength: 2 }),
      grainQ: labArb,
      stoverQ: labArb,
      dmLoss: fc.option(num(0, 0.3), { nil: undefined }),
    })
    .map((r) => ({
      id,
      name: `Property field ${id}`,
      areaHa: r.areaHa,
      fenceLengthM: 200,
      rowSpacingM: 1.524,
      legume: r.legume,
      legumeShareOfWidth: r.legume === 'none' ? 0 : r.share,
      components: [
        { kind: 'sorghum-grain' as const, kgDmPerHa: r.grain, measuredOn: r.measuredOn, method: 'head-count' as const, quality: r.grainQ },
        { kind: 'sorghum-stover' as const, kgDmPerHa: r.stover, measuredOn: r.measuredOn, method: 'clipped-frame' as const, quality: r.stoverQ },
        ...(r.legume === 'none' ? [] : [{ kind: 'legume-forage' as const, kgDmPerHa: r.legumeKg, measuredOn: r.measuredOn, method: 'clipped-frame' as const }]),
      ],
      killingFrostDates: r.killing,
      partialFrostDates: r.partial,
      weathering: r.dmLoss === undefined ? undefined : { rates: { 'sorghum-stover': { dmLossPerMonth: r.dmLoss } } },
    }))

const groupArb = (id: string): fc.Arbitrary<GrazingGroupInput> =>
  fc.record({
    id: fc.constant(id),
    name: fc.constant(`Property group ${id}`),
    species: fc.constantFrom('cattle' as const, 'sheep' as const),
    headCount: fc.integer({ min: 1, max: 400 }),
    bodyWeightKg: num(30, 800),
    intakeKgDmPerHead: num(0.8, 16),
    pregnant: fc.boolean(),
    grainAdapted: fc.boolean(),
    dietCopperPpmDm: fc.option(num(0, 40), { nil: undefined }),
  })

const planArb: fc.Arbitrary<SeasonPlanInput> = fc
  .record({
    fields: fc.integer({ min: 1, max: 3 }).chain((n) => fc.tuple(...Array.from({ length: n }, (_, i) => fieldArb(`f${i}`)))),
    groups: fc.integer({ min: 1, max: 3 }).chain((n) => fc.tuple(...Array.from({ length: n }, (_, i) => groupArb(`g${i}`)))),
    days: fc.integer({ min: 20, max: 120 }),
    picks: fc.array(fc.integer({ min: 0, max: 2 }), { minLength: 3, maxLength: 3 }),
    access: fc.array(fc.constantFrom('strip' as const, 'whole-field' as const), { minLength: 3, maxLength: 3 }),
  })
  .map((r) => {
    const start = '2025-11-01'
    const end = addDays(start, r.days - 1)
    return {
      start,
      end,
      fields: r.fields,
      groups: r.groups,
      assignments: r.groups.map((g, i) => ({ groupId: g.id, fieldId: r.fields[r.picks[i] % r.fields.length].id, from: start, to: end, access: r.access[i] })),
      shortfallFeed: { label: 'hay', dmFraction: 0.88, pricePerKgAsFed: 0.12 },
    }
  })

describe('strip plan properties', () => {
  it('strip area × days never exceeds the field, and one more day would (forage basis)', () => {
    fc.assert(
      fc.property(stripInputArb, (input) => {
        const p = stripPlan(input)
        stripPlanSchema.parse(p)
        expect(p.dailyAreaHa * p.daysOfGrazing).toBeLessThanOrEqual(input.fieldAreaHa)
        // Maximal: one more day would not fit, unless the plan stopped at its 100-year cap.
        if (p.daysOfGrazing < MAX_GRAZING_DAYS) expect(p.dailyAreaHa * (p.daysOfGrazing + 1)).toBeGreaterThan(input.fieldAreaHa)
        else expect(p.warnings.some((w) => w.includes('cap'))).toBe(true)
        expect(p.stripAreaHa * p.fullStrips + p.lastStripAreaHa).toBeLessThanOrEqual(input.fieldAreaHa * (1 + 1e-12))
        expect(p.lastStripDays).toBeLessThan(input.daysPerMove)
        expect(daysBetween(input.start, p.endDate)).toBe(p.daysOfGrazing)
      }),
    )
  })

  it('strip area × days never exceeds the field (grain basis)', () => {
    fc.assert(
      fc.property(stripInputArb, num(0.5, 12), num(100, 12000), (input, allowance, grain) => {
        const p = stripPlanByGrain({ ...input, grainAllowanceKgPerHead: allowance, grainKgPerHa: grain })
        stripPlanSchema.parse(p)
        expect(p.dailyAreaHa * p.daysOfGrazing).toBeLessThanOrEqual(input.fieldAreaHa)
      }),
    )
  })

  it('more head, more intake or less forage never gives more days', () => {
    fc.assert(
      fc.property(stripInputArb, fc.integer({ min: 1, max: 500 }), num(1, 3), num(0.01, 1), (input, extra, more, less) => {
        const base = stripPlan(input).daysOfGrazing
        expect(stripPlan({ ...input, headCount: input.headCount + extra }).daysOfGrazing).toBeLessThanOrEqual(base)
        expect(stripPlan({ ...input, intakeKgDmPerHead: input.intakeKgDmPerHead * more }).daysOfGrazing).toBeLessThanOrEqual(base)
        expect(stripPlan({ ...input, availableKgDmPerHa: input.availableKgDmPerHa * less }).daysOfGrazing).toBeLessThanOrEqual(base)
      }),
    )
  })

  it('the whole field at a lower utilization never lasts longer than strips', () => {
    fc.assert(
      fc.property(stripInputArb, num(0.01, 1), (input, f) => {
        const whole = wholeFieldPlan({ ...input, utilization: input.utilization * f })
        expect(whole.daysOfGrazing).toBeLessThanOrEqual(stripPlan(input).daysOfGrazing)
      }),
    )
  })
})

describe('season budget properties', () => {
  it('more head in any group never gives a longer season, nor less supplement', () => {
    fc.assert(
      fc.property(planArb, fc.integer({ min: 0, max: 2 }), fc.integer({ min: 1, max: 300 }), (plan, gi, extra) => {
        const b1 = seasonBudget(plan)
        seasonBudgetSchema.parse(b1)
        const groups = plan.groups.map((g, i) => (i === gi % plan.groups.length ? { ...g, headCount: (g.headCount as number) + extra } : g))
        const b2 = seasonBudget({ ...plan, groups })
        expect(b2.daysFullyFed).toBeLessThanOrEqual(b1.daysFullyFed)
        expect(b2.shortfall.kgDm).toBeGreaterThanOrEqual(b1.shortfall.kgDm * (1 - 1e-9))
      }),
      { numRuns: 60 },
    )
  })

  it('less forage on the fields never gives a longer season', () => {
    fc.assert(
      fc.property(planArb, num(0, 1), (plan, s) => {
        const b1 = seasonBudget(plan)
        const fields = plan.fields.map((f) => ({ ...f, components: f.components.map((c) => ({ ...c, kgDmPerHa: c.kgDmPerHa * s })) }))
        const b2 = seasonBudget({ ...plan, fields })
        expect(b2.daysFullyFed).toBeLessThanOrEqual(b1.daysFullyFed)
        expect(b2.totalGrazedKgDm).toBeLessThanOrEqual(b1.totalGrazedKgDm * (1 + 1e-9) + 1e-6)
      }),
      { numRuns: 60 },
    )
  })
})

describe('unit round-trips', () => {
  it('nitrate results convert between every pair of lab units and back', () => {
    fc.assert(
      fc.property(num(0, 1e5), fc.constantFrom(...NITRATE_REPORT_UNITS), fc.constantFrom(...NITRATE_REPORT_UNITS), (v, a, b) => {
        expect(convertNitrate(convertNitrate(v, a, b), b, a)).toBeCloseTo(v, 6)
      }),
    )
  })

  it('kg/ha ⇄ lb/ac, sorghum bu/ac ⇄ kg/ha and per ha ⇄ per ac round-trip', () => {
    fc.assert(
      fc.property(num(0, 1e6), (v) => {
        const tol = Math.max(1e-9, v * 1e-12)
        expect(Math.abs(lbPerAcreToKgPerHa(kgPerHaToLbPerAcre(v)) - v)).toBeLessThanOrEqual(tol)
        expect(Math.abs(kgPerHaToSorghumBuPerAcre(sorghumBuPerAcreToKgPerHa(v)) - v)).toBeLessThanOrEqual(tol)
        expect(Math.abs(perAcreToPerHa(perHaToPerAcre(v)) - v)).toBeLessThanOrEqual(tol)
      }),
    )
  })

  it('mass, length and area conversions through mathjs round-trip (NIST definitions)', () => {
    const mass: MassUnit[] = ['kg', 'lb', 'g', 'oz', 'ton', 'tonne']
    const length: LengthUnit[] = ['m', 'ft', 'in', 'km', 'mi']
    const area: AreaUnit[] = ['m2', 'ha', 'acre', 'ft2']
    fc.assert(
      fc.property(num(1e-3, 1e6), fc.constantFrom(...mass), fc.constantFrom(...mass), fc.constantFrom(...length), fc.constantFrom(...length), fc.constantFrom(...area), fc.constantFrom(...area), (v, m1, m2, l1, l2, a1, a2) => {
        const rel = (x: number) => Math.abs(x - v) / v
        expect(rel(convertMass(convertMass(v, m1, m2), m2, m1))).toBeLessThan(1e-12)
        expect(rel(convertLength(convertLength(v, l1, l2), l2, l1))).toBeLessThan(1e-12)
        expect(rel(convertArea(convertArea(v, a1, a2), a2, a1))).toBeLessThan(1e-12)
      }),
      { numRuns: 60 },
    )
  })

  it('ISO dates round-trip through day numbers in UTC, and adding days then counting them back returns the count', () => {
    fc.assert(
      fc.property(fc.integer({ min: -20000, max: 60000 }), fc.integer({ min: -1000, max: 1000 }), (n, k) => {
        const iso = isoFromDayNumber(n)
        expect(dayNumber(iso)).toBe(n)
        expect(daysBetween(iso, addDays(iso, k))).toBe(k)
      }),
    )
  })
})

describe('no NaN or Infinity on valid input', () => {
  it('field supply, strip diet and hazards give finite numbers for any valid field, group and date', () => {
    fc.assert(
      fc.property(fieldArb('f0'), groupArb('g0'), dateArb('2025-09-01', 400), fc.integer({ min: 1, max: 10 }), num(0.05, 1), (field, group, date, n, u) => {
        const s = fieldSupply(field, date)
        fieldSupplySchema.parse(s)
        if (s.totalKgDmPerHa > 0) {
          const d = stripDietByDay({ intakeKgDmPerHead: group.intakeKgDmPerHead, daysPerMove: n, utilization: u, components: s.components })
          stripDietSchema.parse(d)
          for (let i = 1; i < d.days.length; i++) expect(d.days[i].grainSharePct).toBeLessThanOrEqual(d.days[i - 1].grainSharePct + 1e-9)
        }
        for (const c of hazards(field, group, date, { daysPerMove: n })) cautionSchema.parse(c)
      }),
      { numRuns: 80 },
    )
  })

  it('worksheets give finite numbers for any valid measurements', () => {
    fc.assert(
      fc.property(num(5, 80), num(1, 100), fc.integer({ min: 1, max: 8 }), fc.integer({ min: 0, max: 400 }), num(100, 5000), num(5000, 60000), (w, L, rows, heads, sph, spl) => {
        grainYieldSchema.parse(grainYieldFromHeads({ rowSpacingIn: w, rowLengthFt: L, rows, heads, seedsPerHead: sph, seedsPerLb: spl }))
      }),
    )
    fc.assert(
      fc.property(num(0.05, 2), num(1, 5000), num(0.01, 1), num(0, 500), (a, dry, frac, cont) => {
        const dryG = cont + dry
        const wetG = cont + dry / frac
        clipPlotResultSchema.parse(clipPlotDm({ frameAreaM2: a, wetG, dryG, containerG: cont }))
      }),
    )
  })
})
