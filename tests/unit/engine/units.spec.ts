// Conversions checked against exact unit definitions and the published conversion factors.
import { describe, expect, it } from 'vitest'
import {
  asFedFromDm,
  convertArea,
  convertLength,
  convertMass,
  cpFromN,
  dmFromAsFed,
  mcalToMj,
  no3FromNo3N,
  no3NFromNo3,
  pctDmFromAsFed,
  ppmToPct,
} from '../../../shared/engine/index'

describe('unit definitions (NIST SP 811, 2008, Appendix B: exact values)', () => {
  it('1 lb = 0.45359237 kg, 1 ft = 0.3048 m, 1 acre = 4046.8564224 m², 1 short ton = 907.18474 kg', () => {
    expect(convertMass(1, 'lb', 'kg')).toBeCloseTo(0.45359237, 12)
    expect(convertLength(1, 'ft', 'm')).toBeCloseTo(0.3048, 12)
    expect(convertArea(1, 'acre', 'm2')).toBeCloseTo(4046.8564224, 8)
    expect(convertMass(1, 'ton', 'kg')).toBeCloseTo(907.18474, 9)
  })
  it('1 Mcal = 4.184 MJ (thermochemical calorie, 1 cal = 4.184 J exactly)', () => {
    expect(mcalToMj(1)).toBe(4.184)
  })
})

describe('feed-basis and chemistry conversions', () => {
  it('as-fed = DM ÷ DM fraction, the NRC 1985 sheep Table 1 footnote rule (read): 1.2 kg DM of an 89 % DM hay is 1.348 kg as fed', () => {
    expect(asFedFromDm(1.2, 89)).toBeCloseTo(1.2 / 0.89, 12)
    expect(dmFromAsFed(asFedFromDm(1.2, 89), 89)).toBeCloseTo(1.2, 12)
  })
  it('soybean hay 14.1 % CP as fed at 89.1 % DM is 15.8 % CP in DM (Britannica roughage table, read; conversion derived)', () => {
    expect(pctDmFromAsFed(14.1, 89.1)).toBeCloseTo(15.8, 1)
  })
  it('NO3 = 4.43 × NO3-N (molar masses 62/14, derived) and back; 10,000 ppm = 1 %', () => {
    expect(no3FromNo3N(1000)).toBeCloseTo(4427, 0)
    expect(no3FromNo3N(1) / 4.43).toBeCloseTo(1, 2)
    expect(no3NFromNo3(no3FromNo3N(1234))).toBeCloseTo(1234, 9)
    expect(ppmToPct(10_000)).toBe(1)
  })
  it('CP = N × 6.25: urea at 45 % N is 281 % CP equivalent (UNL Beef FAQ "Urea toxicity", 2010, read)', () => {
    expect(cpFromN(45)).toBeCloseTo(281.25, 9)
    expect(Math.round(cpFromN(45))).toBe(281)
  })
})
