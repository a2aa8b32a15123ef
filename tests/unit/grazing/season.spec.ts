// Tests of the season budget: agreement with the strip plan, weekly balance, frost closures, supplement and its cost.
import { describe, expect, it } from 'vitest'
import { seasonBudget, seasonBudgetSchema, stripPlan, type GrazingFieldInput } from '../../../shared/engine/grazing/index'
import { addDays } from '../../../shared/engine/grazing/dates'
import { aField, aGroup, aSeasonPlan, expectZodErrorAt } from './builders'

const noWeathering: GrazingFieldInput['weathering'] = {
  rates: {
    'sorghum-grain': { dmLossPerMonth: 0, cpDropPtsPerMonth: 0, tdnDropPtsPerMonth: 0 },
    'sorghum-stover': { dmLossPerMonth: 0, cpDropPtsPerMonth: 0, tdnDropPtsPerMonth: 0 },
    'legume-forage': { dmLossPerMonth: 0, cpDropPtsPerMonth: 0, tdnDropPtsPerMonth: 0 },
  },
}
const steady = aField({ weathering: noWeathering })

describe('seasonBudget', () => {
  it('with no weathering, one group on one field runs short on the day the strip plan says the field is used up (same Penn State arithmetic)', () => {
    const b = seasonBudget(aSeasonPlan({ fields: [steady], end: '2026-05-01' }))
    const p = stripPlan({ headCount: 80, intakeKgDmPerHead: 12, availableKgDmPerHa: 12000, utilization: 0.75, fieldAreaHa: 16, fenceLengthM: 400, start: '2025-11-15' })
    expect(p.daysOfGrazing).toBe(150)
    expect(b.firstShortfallDate).toBe(p.endDate)
    expect(b.daysFullyFed).toBe(150)
    expect(b.byField[0].usedUpOn).toBe(p.lastGrazingDate)
    expect(() => seasonBudgetSchema.parse(b)).not.toThrow()
  })

  it('every week balances: demand = grazed + routine supplement + shortfall, and the weeks add up to the season', () => {
    const b = seasonBudget(aSeasonPlan({ groups: [aGroup({ routineSupplement: { label: 'protein cube', kgAsFedPerHeadPerDay: 0.9, dmFraction: 0.9, pricePerKgAsFed: 0.45 } })] }))
    for (const w of b.weeks) expect(w.grazedKgDm + w.routineSupplementKgDm + w.shortfallKgDm).toBeCloseTo(w.demandKgDm, 6)
    expect(b.weeks.reduce((a, w) => a + w.demandKgDm, 0)).toBeCloseTo(b.totalDemandKgDm, 6)
    expect(b.weeks.reduce((a, w) => a + w.days, 0)).toBe(150)
    expect(b.weeks[0].days).toBe(7)
    expect(b.weeks[b.weeks.length - 1].weekEnd).toBe('2026-04-13')
  })

  it('the shortfall is fed as the plan\'s feed: kg as fed = kg DM ÷ DM fraction, cost = kg as fed × price', () => {
    const b = seasonBudget(aSeasonPlan())
    expect(b.shortfall.kgDm).toBeGreaterThan(0)
    expect(b.shortfall.kgAsFed).toBeCloseTo(b.shortfall.kgDm / 0.88, 6)
    expect(b.shortfall.cost).toBeCloseTo(b.shortfall.kgAsFed * 0.12, 6)
    expect(b.costPerHeadPerDay).toBeCloseTo(b.totalSupplementCost / (80 * 150), 12)
  })

  it('weathering at the default rates (no published rate exists) uses the field up sooner than a field that does not weather', () => {
    const weathered = seasonBudget(aSeasonPlan({ end: '2026-05-01' }))
    const still = seasonBudget(aSeasonPlan({ fields: [steady], end: '2026-05-01' }))
    expect(weathered.daysFullyFed).toBeLessThan(still.daysFullyFed)
  })

  it('UNL BeefWatch 2024 frost wait: a killing frost in the season closes the sorghum field for 7 days, fed as shortfall from the frost day', () => {
    const f = aField({ weathering: noWeathering, killingFrostDates: ['2025-11-20'] })
    const b = seasonBudget(aSeasonPlan({ fields: [f] }))
    expect(b.firstShortfallDate).toBe('2025-11-20')
    expect(b.byField[0].frostBlockedDays).toBe(7)
    expect(b.weeks[0].shortfallKgDm).toBeCloseTo(2 * 960, 6)
    expect(b.weeks[1].shortfallKgDm).toBeCloseTo(5 * 960, 6)
  })

  it('days a group has no field are shortfall days', () => {
    const b = seasonBudget(aSeasonPlan({ assignments: [{ groupId: 'group-a', fieldId: 'field-a', from: '2025-11-20', to: '2026-04-13' }] }))
    expect(b.firstShortfallDate).toBe('2025-11-15')
    expect(b.weeks[0].shortfallKgDm).toBeCloseTo(5 * 960, 6)
  })

  it('a routine supplement replaces forage one for one, so the field lasts longer, and its cost is counted', () => {
    const assignments = [{ groupId: 'group-a', fieldId: 'field-a', from: '2025-11-15', to: '2026-06-01' }]
    const plain = seasonBudget(aSeasonPlan({ fields: [steady], end: '2026-06-01', assignments }))
    const fed = seasonBudget(
      aSeasonPlan({
        fields: [steady],
        end: '2026-06-01',
        assignments,
        groups: [aGroup({ routineSupplement: { label: 'cube', kgAsFedPerHeadPerDay: 1, dmFraction: 0.9, pricePerKgAsFed: 0.5 } })],
      }),
    )
    expect(plain.daysFullyFed).toBe(150)
    expect(fed.daysFullyFed).toBeGreaterThan(plain.daysFullyFed)
    const days = fed.weeks.reduce((a, w) => a + w.days, 0)
    expect(fed.routineSupplement.kgAsFed).toBeCloseTo(80 * days, 6)
    expect(fed.routineSupplement.cost).toBeCloseTo(80 * days * 0.5, 6)
  })

  it('two groups sharing a field use it up sooner than one alone', () => {
    const one = seasonBudget(aSeasonPlan({ fields: [steady], end: '2026-05-01' }))
    const two = seasonBudget(
      aSeasonPlan({
        fields: [steady],
        end: '2026-05-01',
        groups: [aGroup(), aGroup({ id: 'group-b', name: 'Test heifers', headCount: 30, intakeKgDmPerHead: 9 })],
        assignments: [
          { groupId: 'group-a', fieldId: 'field-a', from: '2025-11-15', to: '2026-05-01' },
          { groupId: 'group-b', fieldId: 'field-a', from: '2025-11-15', to: '2026-05-01' },
        ],
      }),
    )
    expect(two.daysFullyFed).toBeLessThan(one.daysFullyFed)
    expect(two.byGroup).toHaveLength(2)
  })

  it('Davis (Univ. of Missouri) and Jennings (Univ. of Arkansas): whole-field access shortens the season against daily strips (whole-field 32.5 % utilization, common practice)', () => {
    const strips = seasonBudget(aSeasonPlan({ fields: [steady], end: '2026-05-01' }))
    const whole = seasonBudget(
      aSeasonPlan({ fields: [steady], end: '2026-05-01', assignments: [{ groupId: 'group-a', fieldId: 'field-a', from: '2025-11-15', to: '2026-05-01', access: 'whole-field' }] }),
    )
    expect(whole.daysFullyFed).toBeLessThan(strips.daysFullyFed / 2)
    expect(whole.shortfall.cost).toBeGreaterThan(strips.shortfall.cost)
  })

  it('a harvested-feed alternative is costed on the whole demand: intake ÷ DM ÷ (1 − waste) × price per head-day', () => {
    const b = seasonBudget(aSeasonPlan({ harvestedAlternative: { label: 'bought hay', dmFraction: 0.88, pricePerKgAsFed: 0.15, wasteFraction: 0.2 } }))
    expect(b.harvestedAlternative!.costPerHeadPerDay).toBeCloseTo((12 / 0.88 / 0.8) * 0.15, 12)
  })

  it('standing DM at week end falls as the field is grazed and weathers', () => {
    const b = seasonBudget(aSeasonPlan())
    for (let i = 1; i < b.weeks.length; i++) expect(b.weeks[i].standingKgDm).toBeLessThanOrEqual(b.weeks[i - 1].standingKgDm)
    expect(b.weeks[0].usableKgDm).toBeCloseTo(b.weeks[0].standingKgDm * 0.75, 6)
  })

  it('when an assignment names a missing field, overlaps another or the season ends before it starts, then a ZodError names the field', () => {
    expectZodErrorAt(() => seasonBudget(aSeasonPlan({ assignments: [{ groupId: 'group-a', fieldId: 'nowhere', from: '2025-11-15', to: '2026-01-01' }] })), ['assignments', 0, 'fieldId'])
    expectZodErrorAt(
      () =>
        seasonBudget(
          aSeasonPlan({
            assignments: [
              { groupId: 'group-a', fieldId: 'field-a', from: '2025-11-15', to: '2026-01-01' },
              { groupId: 'group-a', fieldId: 'field-a', from: '2025-12-15', to: '2026-02-01' },
            ],
          }),
        ),
      ['assignments', 1, 'from'],
    )
    expectZodErrorAt(() => seasonBudget(aSeasonPlan({ end: addDays('2025-11-15', -1) })), ['end'])
    expectZodErrorAt(() => seasonBudget(aSeasonPlan({ shortfallFeed: { label: 'hay', dmFraction: 0, pricePerKgAsFed: 0.1 } })), ['shortfallFeed', 'dmFraction'])
  })
})
