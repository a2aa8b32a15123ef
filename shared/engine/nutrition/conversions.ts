// Basis and unit conversions the nutrition screens need: as-fed ⇄ DM, nitrate forms, N ⇄ CP, Mcal ⇄ MJ.
import { z } from 'zod'

const dmPct = z.number().finite().gt(0).max(100)
const nonNeg = z.number().finite().min(0)

/** Parses positional arguments as named fields, so a ZodError names the argument that was wrong. */
function args<T extends Record<string, z.ZodType>>(shape: T, values: { [K in keyof T]: unknown }): { [K in keyof T]: z.infer<T[K]> } {
  return z.object(shape).parse(values) as { [K in keyof T]: z.infer<T[K]> }
}

/** Molar masses (IUPAC 2021 standard atomic weights): N 14.007, O 15.999 — NO3/N = 62.004/14.007. */
export const NO3_PER_NO3N = (14.007 + 3 * 15.999) / 14.007
/** CP = N × 6.25, protein averaging 16 % N (Univ. of Nebraska Beef FAQ "Urea toxicity", 2010 — read). */
export const CP_PER_N = 6.25
/** 1 Mcal = 4.184 MJ (thermochemical calorie, NIST SP 811 (2008) Appendix B: 1 cal_th = 4.184 J exactly). */
export const MJ_PER_MCAL = 4.184

/** kg as fed from kg DM: as-fed = DM ÷ DM fraction (the NRC 1985 sheep Table 1 footnote rule — read). */
export function asFedFromDm(kgDm: number, dmPctAsFed: number): number {
  const a = args({ kgDm: nonNeg, dmPctAsFed: dmPct }, { kgDm, dmPctAsFed })
  return a.kgDm / (a.dmPctAsFed / 100)
}
/** kg DM from kg as fed: DM = as-fed × DM fraction (same rule, inverted). */
export function dmFromAsFed(kgAsFed: number, dmPctAsFed: number): number {
  const a = args({ kgAsFed: nonNeg, dmPctAsFed: dmPct }, { kgAsFed, dmPctAsFed })
  return a.kgAsFed * (a.dmPctAsFed / 100)
}
/** A nutrient % as fed to % DM: % DM = % as fed ÷ DM fraction (derived). */
export function pctDmFromAsFed(pctAsFed: number, dmPctAsFed: number): number {
  const a = args({ pctAsFed: nonNeg, dmPctAsFed: dmPct }, { pctAsFed, dmPctAsFed })
  return a.pctAsFed / (a.dmPctAsFed / 100)
}
/** A nutrient % DM to % as fed (derived). */
export function pctAsFedFromDm(pctDm: number, dmPctAsFed: number): number {
  const a = args({ pctDm: nonNeg, dmPctAsFed: dmPct }, { pctDm, dmPctAsFed })
  return a.pctDm * (a.dmPctAsFed / 100)
}

/** Nitrate ion from nitrate nitrogen, same basis and unit: NO3 = NO3-N × 4.43 (molar masses 62/14 — derived). */
export function no3FromNo3N(no3N: number): number {
  return args({ no3N: nonNeg }, { no3N }).no3N * NO3_PER_NO3N
}
/** Nitrate nitrogen from nitrate ion: NO3-N = NO3 ÷ 4.43 (derived). */
export function no3NFromNo3(no3: number): number {
  return args({ no3: nonNeg }, { no3 }).no3 / NO3_PER_NO3N
}
/** ppm (mg/kg) to % of DM: 10,000 ppm = 1 % (definition). */
export function ppmToPct(ppm: number): number {
  return args({ ppm: nonNeg }, { ppm }).ppm / 10_000
}
export function pctToPpm(pct: number): number {
  return args({ pct: nonNeg }, { pct }).pct * 10_000
}
/** Crude protein from nitrogen: CP = N × 6.25 (UNL Beef FAQ — read); urea at 45 % N → 281 % CP. */
export function cpFromN(nPct: number): number {
  return args({ nPct: nonNeg }, { nPct }).nPct * CP_PER_N
}
export function mcalToMj(mcal: number): number {
  return args({ mcal: z.number().finite() }, { mcal }).mcal * MJ_PER_MCAL
}
export function mjToMcal(mj: number): number {
  return args({ mj: z.number().finite() }, { mj }).mj / MJ_PER_MCAL
}
