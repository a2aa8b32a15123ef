// Tests of field supply: legume share of width, weathering defaults and overrides, frost loss, lab against book quality.
import { describe, expect, it } from 'vitest'
import { BOOK_QUALITY, WEATHERING_DEFAULTS, fieldSupply, fieldSupplySchema } from '../../../shared/engine/grazing/index'
import { DAYS_PER_MONTH } from '../../../shared/engine/grazing/dates'
import { aField, expectZodErrorAt } from './builders'

const lab = { cpPctDm: 8, tdnPctDm: 56, source: { kind: 'lab' as const, label: 'Test lab #123', sampledOn: '2025-10-16' } }

describe('fieldSupply', () => {
  it('on the day measured, sorghum counts on the whole field and the cowpea on its half of the width (clip each crop separately, common practice)', () => {
    const s = fieldSupply(aField(), '2025-10-15')
    expect(s.byKind['sorghum-grain']).toBe(5000)
    expect(s.byKind['sorghum-stover']).toBe(5500)
    expect(s.byKind['legume-forage']).toBe(1500)
    expect(s.totalKgDmPerHa).toBe(12000)
    expect(s.totalKgDm).toBe(12000 * 16)
    expect(() => fieldSupplySchema.parse(s)).not.toThrow()
  })

  it('a figure entered on the field basis is not scaled; a sorghum figure on its band is scaled by the rest of the width', () => {
    const s = fieldSupply(
      aField({
        legumeShareOfWidth: 0.4,
        components: [
          { kind: 'legume-forage', kgDmPerHa: 1000, basis: 'field', measuredOn: '2025-10-15', method: 'clipped-frame' },
          { kind: 'sorghum-stover', kgDmPerHa: 5000, basis: 'band', measuredOn: '2025-10-15', method: 'clipped-frame' },
        ],
      }),
      '2025-10-15',
    )
    expect(s.byKind['legume-forage']).toBe(1000)
    expect(s.byKind['sorghum-stover']).toBeCloseTo(3000, 9)
  })

  it('van Pletzen et al. 1991 (21 % of maize residue lost over ≈3 months): set as a 7.6 %/month compounding rate, 79 % stands 3 months on (derived)', () => {
    const monthly = 1 - Math.pow(0.79, 1 / 3)
    expect(monthly).toBeCloseTo(0.0756, 4)
    const f = aField({
      components: [{ kind: 'sorghum-stover', kgDmPerHa: 1000, measuredOn: '2025-01-01', method: 'clipped-frame' }],
      weathering: { rates: { 'sorghum-stover': { dmLossPerMonth: monthly } } },
    })
    // 3 mean Gregorian months is 91.31 days; day 91 is the nearest whole date.
    const s = fieldSupply(f, '2025-04-02')
    expect(s.byKind['sorghum-stover'] / 1000).toBeCloseTo(Math.pow(0.79, 91 / (3 * DAYS_PER_MONTH)), 12)
    expect(Math.abs(s.byKind['sorghum-stover'] / 1000 - 0.79)).toBeLessThan(0.001)
    expect(s.components[0].weatheringIsDefault).toBe(false)
  })

  it('at the default rates (labelled default: no published rate exists) stover keeps ≈0.95² of its mass and loses ≈3 TDN points in 61 days (≈2 months)', () => {
    expect(Object.values(WEATHERING_DEFAULTS).every((d) => d.evidence === 'default')).toBe(true)
    const sameDay = { ...lab, source: { ...lab.source, sampledOn: '2025-01-01' } }
    const f = aField({ components: [{ kind: 'sorghum-stover', kgDmPerHa: 1000, measuredOn: '2025-01-01', method: 'clipped-frame', quality: sameDay }] })
    const days = 61
    const s = fieldSupply(f, '2025-03-03')
    const months = days / DAYS_PER_MONTH
    expect(s.components[0].monthsWeathered).toBeCloseTo(months, 12)
    expect(s.byKind['sorghum-stover']).toBeCloseTo(1000 * Math.pow(0.95, months), 9)
    expect(s.components[0].quality.tdnPctDm).toBeCloseTo(56 - 1.5 * months, 9)
    expect(s.components[0].quality.cpPctDm).toBeCloseTo(8 - 0.3 * months, 9)
    expect(s.notes.some((n) => n.includes('default rate'))).toBe(true)
  })

  it('a killing frost after the legume was measured sheds half its forage (default), but not its seed, and not a frost after the date', () => {
    const f = aField({
      components: [
        { kind: 'legume-forage', kgDmPerHa: 2000, basis: 'field', measuredOn: '2025-10-15', method: 'clipped-frame' },
        { kind: 'legume-seed', kgDmPerHa: 400, basis: 'field', measuredOn: '2025-10-15', method: 'clipped-frame' },
      ],
      killingFrostDates: ['2025-10-20', '2025-11-30'],
      weathering: { rates: { 'legume-forage': { dmLossPerMonth: 0 }, 'legume-seed': { dmLossPerMonth: 0 } } },
    })
    expect(fieldSupply(f, '2025-10-19').byKind['legume-forage']).toBe(2000)
    const after = fieldSupply(f, '2025-10-20')
    expect(after.byKind['legume-forage']).toBe(1000)
    expect(after.byKind['legume-seed']).toBe(400)
    // A second frost does not shed the same leaf again.
    expect(fieldSupply(f, '2025-12-15').byKind['legume-forage']).toBe(1000)
    // Measured after the frost, the figure already reflects it.
    const late = aField({ ...f, components: [{ kind: 'legume-forage', kgDmPerHa: 2000, basis: 'field', measuredOn: '2025-10-25', method: 'clipped-frame' }] })
    expect(fieldSupply(late, '2025-10-26').components[0].frostLossApplied).toBe(false)
  })

  it('without a lab result the book value is used and named: cowpea forage from LSU AgCenter (Han 2012), forage soybean from UW Extension', () => {
    const cow = fieldSupply(aField(), '2025-10-15').components.find((c) => c.kind === 'legume-forage')!
    expect(cow.qualityIsBookValue).toBe(true)
    expect(cow.quality.cpPctDm).toBe(17)
    expect(cow.quality.source.label).toContain('LSU AgCenter')
    const soy = fieldSupply(aField({ legume: 'forage-soybean' }), '2025-10-15').components.find((c) => c.kind === 'legume-forage')!
    expect(soy.quality.cpPctDm).toBe(20)
    expect(soy.quality.source.label).toContain('UW Extension')
  })

  it('book legume TDN is derived from ADF with TDN = 88.9 − 0.779 × ADF (equation from memory): cowpea ADF 32 → 64, soybean ADF 30 → 65.5', () => {
    expect(88.9 - 0.779 * BOOK_QUALITY['cowpea-forage'].adfPctDm).toBeCloseTo(BOOK_QUALITY['cowpea-forage'].tdnPctDm, 0)
    expect(88.9 - 0.779 * BOOK_QUALITY['forage-soybean-forage'].adfPctDm).toBeCloseTo(BOOK_QUALITY['forage-soybean-forage'].tdnPctDm, 1)
  })

  it('a lab result is used as given, with its source, and the supply weights CP and TDN by dry matter', () => {
    const f = aField({
      legume: 'none',
      legumeShareOfWidth: 0,
      components: [
        { kind: 'sorghum-grain', kgDmPerHa: 3000, measuredOn: '2025-10-15', method: 'head-count', quality: { ...lab, cpPctDm: 11, tdnPctDm: 80 } },
        { kind: 'sorghum-stover', kgDmPerHa: 1000, measuredOn: '2025-10-15', method: 'clipped-frame', quality: lab },
      ],
    })
    const s = fieldSupply(f, '2025-10-15')
    expect(s.components[1].quality.source.label).toBe('Test lab #123')
    expect(s.components[1].qualityIsBookValue).toBe(false)
    expect(s.cpPctDm).toBeCloseTo((3000 * 11 + 1000 * 8) / 4000, 12)
    expect(s.tdnPctDm).toBeCloseTo((3000 * 80 + 1000 * 56) / 4000, 12)
  })

  it('a lab result ages from its own sample date: sampled a month after the mass was measured, it has lost a month less', () => {
    const q = { cpPctDm: 8, tdnPctDm: 56, source: { kind: 'lab' as const, label: 'Test lab #124', sampledOn: '2025-02-01' } }
    const f = aField({ components: [{ kind: 'sorghum-stover', kgDmPerHa: 1000, measuredOn: '2025-01-01', method: 'clipped-frame', quality: q }] })
    const s = fieldSupply(f, '2025-03-01')
    expect(s.components[0].quality.tdnPctDm).toBeCloseTo(56 - (1.5 * 28) / DAYS_PER_MONTH, 9)
    expect(s.components[0].monthsWeathered).toBeCloseTo(59 / DAYS_PER_MONTH, 9)
  })

  it('asked for a date before the measurement, the figure stands as measured (no weathering backwards)', () => {
    const s = fieldSupply(aField(), '2025-09-01')
    expect(s.totalKgDmPerHa).toBe(12000)
    expect(s.components.every((c) => c.monthsWeathered === 0)).toBe(true)
  })

  it('after years of weathering, quality stops at zero and mass stays finite and non-negative', () => {
    const s = fieldSupply(aField(), '2035-10-15')
    for (const c of s.components) {
      expect(c.quality.cpPctDm).toBeGreaterThanOrEqual(0)
      expect(c.quality.tdnPctDm).toBeGreaterThanOrEqual(0)
      expect(Number.isFinite(c.kgDmPerHa)).toBe(true)
    }
    expect(() => fieldSupplySchema.parse(s)).not.toThrow()
  })

  it('when a field without a legume has a legume share or a legume component, then a ZodError names the field', () => {
    expectZodErrorAt(() => fieldSupply(aField({ legume: 'none' }), '2025-10-15'), ['legumeShareOfWidth'])
    expectZodErrorAt(() => fieldSupply(aField({ legume: 'none', legumeShareOfWidth: 0 }), '2025-10-15'), ['components', 2, 'kind'])
    expectZodErrorAt(() => fieldSupply(aField({ areaHa: -1 }), '2025-10-15'), ['areaHa'])
    expectZodErrorAt(() => fieldSupply(aField({ killingFrostDates: ['2025-13-01'] }), '2025-10-15'), ['killingFrostDates', 0])
  })
})
