// The Pearson square against the Montana State Univ. Extension worked examples.
import { describe, expect, it } from 'vitest'
import { pearsonSquare } from '../../../shared/engine/index'

describe('pearsonSquare (Montana State Univ. Extension, "Pearson Square Examples", read)', () => {
  it('example 1: 11 % CP from chopped hay (12.25 %) and corn silage (10.8 %) → 0.20 : 1.25 parts, 13.8 % hay and 86.2 % silage, 11.0 lb CP per 100 lb', () => {
    const r = pearsonSquare({ a: { cpPct: 12.25 }, b: { cpPct: 10.8 }, targetCpPct: 11 })
    expect(r.fracA).toBeCloseTo(0.2 / 1.45, 9)
    expect(100 * r.fracA).toBeCloseTo(13.8, 1)
    expect(100 * r.fracB).toBeCloseTo(86.2, 1)
    expect(100 * r.fracA * 0.1225).toBeCloseTo(1.69, 2)
    expect(100 * r.fracB * 0.108).toBeCloseTo(9.31, 2)
    expect(r.fracA * 12.25 + r.fracB * 10.8).toBeCloseTo(11, 9)
  })

  it('example 2: a 1,020-lb heifer needing 9.8 % CP, hay 8.95 % and a 40 % supplement → 97.3 % hay, 2.7 % supplement; at 20.4 lb DM, 19.8 lb hay and 0.55 lb supplement', () => {
    const r = pearsonSquare({ a: { cpPct: 8.95 }, b: { cpPct: 40 }, targetCpPct: 9.8 })
    expect(100 * r.fracA).toBeCloseTo(97.3, 1)
    expect(100 * r.fracB).toBeCloseTo(2.7, 1)
    expect(20.4 * r.fracA).toBeCloseTo(19.8, 1)
    // The source rounds the share to 2.7 % before multiplying, so it agrees to the first decimal.
    expect(20.4 * r.fracB).toBeCloseTo(0.55, 1)
  })

  it('example 3, pre-mixes: supplement 50 % SBM (54 %) + 50 % CGF (24 %) = 39 % CP, grain 60 % corn (10 %) + 40 % soyhulls (12 %) = 10.8 %; 15 % CP → 14.9 % supplement, 85.1 % grain (last step derived)', () => {
    const supplement = 0.5 * 54 + 0.5 * 24
    const grain = 0.6 * 10 + 0.4 * 12
    expect(supplement).toBe(39)
    expect(grain).toBeCloseTo(10.8, 12)
    const r = pearsonSquare({ a: { cpPct: supplement }, b: { cpPct: grain }, targetCpPct: 15 })
    expect(100 * r.fracA).toBeCloseTo(14.9, 1)
    expect(100 * r.fracB).toBeCloseTo(85.1, 1)
  })
})
