// Lab values to a DM basis: the as-fed rule, nitrate forms by molar mass, TDN from ADF by the named shortcut.
import { describe, expect, it } from 'vitest'
import { labResultCreateSchema, labValuesToDm, TDN_FROM_ADF_EQUATION } from '../../../shared/schemas/nutrition/labResults'

const parse = (v: Record<string, unknown>) => labResultCreateSchema.parse({ feedId: 1, sampleDate: '2026-11-01', labName: 'Test Lab', ...v })

describe('labValuesToDm', () => {
  it('when values are as fed, then % DM = % as fed ÷ DM fraction (NRC 1985 sheep Table 1 footnote; Britannica soybean hay 14.1 % CP at 89.1 % DM → 15.8 % DM)', () => {
    const r = labValuesToDm(parse({ basis: 'as-fed', dmPct: 89.1, cpPct: 14.1, tdnPct: 47.7 }))
    expect(r.cpPctDm).toBeCloseTo(15.8, 1)
    expect(r.tdnPctDm).toBeCloseTo(53.5, 1)
    expect(r.dmPct).toBe(89.1)
  })

  it('when nitrate is NO3, then NO3-N = NO3 ÷ 4.43 (molar masses 62/14)', () => {
    const r = labValuesToDm(parse({ dmPct: 90, cpPct: 8, tdnPct: 55, nitratePpm: 4430, nitrateForm: 'NO3' }))
    expect(r.nitrateNPpmDm).toBeCloseTo(1000, -1)
  })

  it('when TDN is missing, then it comes from ADF by the named equation (common practice, from memory) and is flagged as estimated', () => {
    const r = labValuesToDm(parse({ dmPct: 85, cpPct: 7, adfPct: 45 }))
    expect(r.tdnEstimated).toBe(true)
    expect(r.tdnPctDm).toBeCloseTo(88.9 - 0.779 * 45, 10)
    expect(TDN_FROM_ADF_EQUATION).toContain('88.9 − 0.779')
  })

  it('when ADF exceeds NDF, or an as-fed TDN exceeds the dry matter, then the schema names the field', () => {
    const a = labResultCreateSchema.safeParse({ feedId: 1, sampleDate: '2026-11-01', labName: 'L', dmPct: 80, cpPct: 8, tdnPct: 50, adfPct: 60, ndfPct: 50 })
    expect(a.success ? [] : a.error.issues.map((i) => i.path.join('.'))).toEqual(['adfPct'])
    const b = labResultCreateSchema.safeParse({ feedId: 1, sampleDate: '2026-11-01', labName: 'L', basis: 'as-fed', dmPct: 30, cpPct: 3, tdnPct: 40 })
    expect(b.success ? [] : b.error.issues.map((i) => i.path.join('.'))).toEqual(['tdnPct'])
  })
})
