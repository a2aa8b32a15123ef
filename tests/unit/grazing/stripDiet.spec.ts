// Tests of the diet by day within a strip: quality falls from the first day to the last unless the fence moves daily.
import { describe, expect, it } from 'vitest'
import { DIET_POOLS, LEAF_TO_STEM_RATIO, fieldSupply, stripDietByDay, stripDietSchema } from '../../../shared/engine/grazing/index'
import { aField, expectZodErrorAt } from './builders'

const grain = { kind: 'sorghum-grain' as const, kgDmPerHa: 4800, quality: { cpPctDm: 11.5, tdnPctDm: 82 } }
const stover = { kind: 'sorghum-stover' as const, kgDmPerHa: 5000, quality: { cpPctDm: 7, tdnPctDm: 54 } }
const legume = { kind: 'legume-forage' as const, kgDmPerHa: 800, quality: { cpPctDm: 16, tdnPctDm: 62 } }
const components = [grain, stover, legume]

describe('stripDietByDay', () => {
  it('in a 7-day strip, TDN and grain share fall every day from the first to the last (default preference weights; order from R. Lee, Univ. of Missouri: heads go first)', () => {
    const d = stripDietByDay({ intakeKgDmPerHead: 12, daysPerMove: 7, utilization: 0.6, components, start: '2025-12-01' })
    expect(() => stripDietSchema.parse(d)).not.toThrow()
    expect(d.days).toHaveLength(7)
    for (let i = 1; i < 7; i++) {
      expect(d.days[i].tdnPctDm).toBeLessThan(d.days[i - 1].tdnPctDm)
      expect(d.days[i].grainSharePct).toBeLessThan(d.days[i - 1].grainSharePct)
    }
    expect(d.tdnDropPts).toBeGreaterThan(0)
    expect(d.tdnDropPts).toBeCloseTo(d.days[0].tdnPctDm - d.days[6].tdnPctDm, 12)
    expect(d.days[6].date).toBe('2025-12-07')
  })

  it('each day stock eat their intake, and over the strip they eat utilization × what it held', () => {
    const d = stripDietByDay({ intakeKgDmPerHead: 12, daysPerMove: 5, utilization: 0.65, components })
    for (const day of d.days) expect(day.intakeKgDm).toBeCloseTo(12, 9)
    const eaten = d.days.reduce((a, x) => a + x.intakeKgDm, 0)
    expect(eaten).toBeCloseTo(60, 9)
  })

  it('with a daily move, the single day is the same diet every day, between the first and last day of a 7-day strip (default preference weights)', () => {
    const daily = stripDietByDay({ intakeKgDmPerHead: 12, daysPerMove: 1, utilization: 0.75, components })
    const week = stripDietByDay({ intakeKgDmPerHead: 12, daysPerMove: 7, utilization: 0.6, components })
    expect(daily.days).toHaveLength(1)
    expect(daily.tdnDropPts).toBe(0)
    expect(daily.days[0].tdnPctDm).toBeLessThan(week.days[0].tdnPctDm)
    expect(daily.days[0].tdnPctDm).toBeGreaterThan(week.days[6].tdnPctDm)
  })

  it('without selection (equal preferences) every day is the field composition, so the model selects only through its weights', () => {
    const equal = Object.fromEntries(DIET_POOLS.map((p) => [p, 1]))
    const d = stripDietByDay({ intakeKgDmPerHead: 10, daysPerMove: 4, utilization: 0.7, components, preference: equal })
    const share = (4800 / (4800 + 5000 + 800)) * 100
    for (const day of d.days) expect(day.grainSharePct).toBeCloseTo(share, 9)
  })

  it('when everything is eaten (utilization 1), the strip mean equals the DM-weighted field quality: the leaf/stalk split keeps the stover value', () => {
    const d = stripDietByDay({ intakeKgDmPerHead: 10, daysPerMove: 6, utilization: 1, components })
    const total = 4800 + 5000 + 800
    expect(d.meanCpPctDm).toBeCloseTo((4800 * 11.5 + 5000 * 7 + 800 * 16) / total, 9)
    expect(d.meanTdnPctDm).toBeCloseTo((4800 * 82 + 5000 * 54 + 800 * 62) / total, 9)
  })

  it('K-State "Crop residues" Table 1 midpoints: leaf CP is ≈1.96 × stem CP and leaf TDN ≈1.09 × stem TDN (derived); stover leaf share 0.4 (from memory)', () => {
    expect(LEAF_TO_STEM_RATIO.cp).toBeCloseTo(1.961, 3)
    expect(LEAF_TO_STEM_RATIO.tdn).toBeCloseTo(1.089, 3)
    const d = stripDietByDay({ intakeKgDmPerHead: 10, daysPerMove: 3, utilization: 0.6, components: [stover] })
    // Leaf goes first, so CP falls day by day; with 40 % left behind, mostly stalk, what is eaten beats the stover mean.
    expect(d.days[0].cpPctDm).toBeGreaterThan(d.days[1].cpPctDm)
    expect(d.days[1].cpPctDm).toBeGreaterThan(d.days[2].cpPctDm)
    expect(d.meanCpPctDm).toBeGreaterThan(7)
    const all = stripDietByDay({ intakeKgDmPerHead: 10, daysPerMove: 3, utilization: 1, components: [stover] })
    expect(all.days[2].cpPctDm).toBeLessThan(7)
  })

  it('takes fieldSupply components directly', () => {
    const s = fieldSupply(aField(), '2025-12-01')
    const d = stripDietByDay({ intakeKgDmPerHead: 12, daysPerMove: 3, utilization: 0.7, components: s.components })
    expect(d.days[0].legumeSharePct).toBeGreaterThan(0)
    expect(d.maxGrainSharePct).toBe(d.days[0].grainSharePct)
  })

  it('when the strip has no dry matter or the utilization is out of range, then a ZodError names the field', () => {
    expectZodErrorAt(() => stripDietByDay({ intakeKgDmPerHead: 10, daysPerMove: 3, utilization: 0.6, components: [{ ...grain, kgDmPerHa: 0 }] }), ['components'])
    expectZodErrorAt(() => stripDietByDay({ intakeKgDmPerHead: 10, daysPerMove: 3, utilization: 0, components }), ['utilization'])
    expectZodErrorAt(() => stripDietByDay({ intakeKgDmPerHead: 10, daysPerMove: 0, utilization: 0.6, components }), ['daysPerMove'])
  })
})
