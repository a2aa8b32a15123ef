// Feed amounts in the unit a hand uses: oz or g for minerals, lb or kg to one decimal otherwise, never "0" for a fed amount.
import { describe, expect, it } from 'vitest'
import { feedAmount, OZ_KG } from '@shared/schemas/nutrition/format'

describe('feedAmount (units by NIST Handbook 44, Appendix C: 1 lb = 0.45359237 kg, 1 oz = 1/16 lb)', () => {
  it('when a mineral is fed at 2 oz a head in US units, then it reads "2.0 oz"', () => {
    expect(OZ_KG).toBeCloseTo(0.028349523125, 12)
    expect(feedAmount(2 * OZ_KG, { mineral: true, units: 'us' }).text).toBe('2.0 oz')
  })
  it('when a mineral is fed at 57 g a head in metric units, then it reads "57 g"', () => {
    expect(feedAmount(0.057, { mineral: true, units: 'metric' }).text).toBe('57 g')
  })
  it('when a mineral total reaches a pound or a kilogram, then it reads in lb or kg', () => {
    expect(feedAmount(40 * 2 * OZ_KG, { mineral: true, units: 'us' }).text).toBe('5.0 lb')
    expect(feedAmount(2.28, { mineral: true, units: 'metric' }).text).toBe('2.3 kg')
  })
  it('when a supplement is fed, then it reads in lb or kg to one decimal', () => {
    expect(feedAmount(1.5 * 0.45359237, { mineral: false, units: 'us' }).text).toBe('1.5 lb')
    expect(feedAmount(0.68, { mineral: false, units: 'metric' }).text).toBe('0.7 kg')
  })
  it('when a small amount is fed, then it never reads 0', () => {
    expect(feedAmount(0.02 * 0.45359237, { mineral: false, units: 'us' }).text).toBe('0.02 lb')
    expect(feedAmount(0.0002, { mineral: true, units: 'metric' }).text).toBe('0.2 g')
    expect(feedAmount(1e-9, { mineral: false, units: 'us' }).text).toBe('< 0.001 lb')
    expect(feedAmount(0, { mineral: false, units: 'us' }).text).toBe('0.0 lb')
  })
})
