// Unit conversions for the UI (US customary ⇄ SI), through mathjs units; exact NIST definitions.
import { unit, createUnit } from 'mathjs'

/** NIST SP 811 (2008), Appendix B: exact definitions. */
export const LB_KG = 0.45359237
export const FT_M = 0.3048
export const IN_M = 0.0254
export const ACRE_M2 = 4046.8564224
export const HA_M2 = 10_000
/** Short ton = 2000 lb (NIST Handbook 44, Appendix C). */
export const TON_KG = 2000 * LB_KG
/** Bushel of grain sorghum by weight: 56 lb (USDA standard test weight for sorghum). */
export const SORGHUM_BU_LB = 56

let defined = false
function ensureUnits() {
  if (defined) return
  defined = true
  for (const [name, definition] of [
    ['sorghumbu', `${SORGHUM_BU_LB} lbm`],
    ['shortton', '2000 lbm'],
    // mathjs's built-in acre is rounded to 4046.86 m²; the international acre is exactly 43,560 ft².
    ['intacre', '43560 ft^2'],
  ] as const) {
    try {
      createUnit(name, { definition })
    } catch {
      // already defined in this mathjs instance
    }
  }
}

export type MassUnit = 'kg' | 'lb' | 'g' | 'oz' | 'ton' | 'tonne'
export type LengthUnit = 'm' | 'ft' | 'in' | 'km' | 'mi'
export type AreaUnit = 'm2' | 'ha' | 'acre' | 'ft2'

const massMap: Record<MassUnit, string> = { kg: 'kg', lb: 'lbm', g: 'g', oz: 'ounce', ton: 'shortton', tonne: 'tonne' }
const lengthMap: Record<LengthUnit, string> = { m: 'm', ft: 'ft', in: 'inch', km: 'km', mi: 'mi' }
const areaMap: Record<AreaUnit, string> = { m2: 'm^2', ha: 'hectare', acre: 'intacre', ft2: 'ft^2' }

export function convertMass(value: number, from: MassUnit, to: MassUnit): number {
  ensureUnits()
  return unit(value, massMap[from]).toNumber(massMap[to])
}
export function convertLength(value: number, from: LengthUnit, to: LengthUnit): number {
  ensureUnits()
  return unit(value, lengthMap[from]).toNumber(lengthMap[to])
}
export function convertArea(value: number, from: AreaUnit, to: AreaUnit): number {
  ensureUnits()
  return unit(value, areaMap[from]).toNumber(areaMap[to])
}
export function bushelsToKg(bu: number): number {
  ensureUnits()
  return unit(bu, 'sorghumbu').toNumber('kg')
}
export function kgToBushels(kg: number): number {
  ensureUnits()
  return unit(kg, 'kg').toNumber('sorghumbu')
}

/** kg per hectare ⇄ lb per acre. */
export function kgPerHaToLbPerAcre(v: number): number {
  return (v / LB_KG) * (ACRE_M2 / HA_M2)
}
export function lbPerAcreToKgPerHa(v: number): number {
  return (v * LB_KG) * (HA_M2 / ACRE_M2)
}
/** °F ⇄ °C. */
export function fToC(f: number): number {
  return ((f - 32) * 5) / 9
}
export function cToF(c: number): number {
  return (c * 9) / 5 + 32
}
/** mph ⇄ km/h (1 mi = 1609.344 m exactly). */
export function mphToKph(v: number): number {
  return v * 1.609344
}
export function kphToMph(v: number): number {
  return v / 1.609344
}
