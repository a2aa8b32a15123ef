// Number and unit formatting shared by the screens, the print view, the PDF and the CSV export, so every figure reads the same everywhere.
import { LB_KG } from '../../engine/units'

export type Units = 'us' | 'metric'

/** kg → lb by the exact NIST definition (1 lb = 0.45359237 kg); kg stays kg in metric. */
export function massValue(kg: number, units: Units): number {
  return units === 'us' ? kg / LB_KG : kg
}
export function massFromDisplay(v: number, units: Units): number {
  return units === 'us' ? v * LB_KG : v
}
export const massUnit = (units: Units) => (units === 'us' ? 'lb' : 'kg')

/** A nutrient amount in display units: kg amounts (DM, TDN, CP) follow the switch; Mcal and g of Ca and P stay. */
export function nutrientDisplay(value: number, unit: 'kg' | 'Mcal' | 'g', units: Units): { value: number; unit: string } {
  if (unit === 'kg') return { value: massValue(value, units), unit: massUnit(units) }
  return { value, unit }
}

/** Decimal places by size: 0 from 100, 1 from 10, else 2 (3 below 0.1), so small supplements still show. */
export function smartDigits(v: number): number {
  const a = Math.abs(v)
  if (a >= 100) return 0
  if (a >= 10) return 1
  if (a >= 0.1 || a === 0) return 2
  return 3
}

export function fmtNumber(v: number, digits = smartDigits(v)): string {
  if (!Number.isFinite(v)) return '—'
  return v.toLocaleString('en-US', { minimumFractionDigits: digits, maximumFractionDigits: digits })
}

export function fmtMass(kg: number, units: Units, digits?: number): string {
  const v = massValue(kg, units)
  return `${fmtNumber(v, digits ?? smartDigits(v))} ${massUnit(units)}`
}

export function fmtMoney(v: number): string {
  if (!Number.isFinite(v)) return '—'
  const digits = Math.abs(v) < 10 ? 2 : Math.abs(v) < 1000 ? 2 : 0
  return `$${v.toLocaleString('en-US', { minimumFractionDigits: digits, maximumFractionDigits: digits })}`
}

export function fmtPct(v: number): string {
  return `${fmtNumber(v, Math.abs(v) >= 10 ? 0 : 1)} %`
}

/** °C ⇄ °F and km/h ⇄ mph for the herd's winter conditions (1 mi = 1609.344 m exactly). */
export const tempValue = (c: number, units: Units) => (units === 'us' ? (c * 9) / 5 + 32 : c)
export const tempFromDisplay = (v: number, units: Units) => (units === 'us' ? ((v - 32) * 5) / 9 : v)
export const tempUnit = (units: Units) => (units === 'us' ? '°F' : '°C')
export const windValue = (kph: number, units: Units) => (units === 'us' ? kph / 1.609344 : kph)
export const windFromDisplay = (v: number, units: Units) => (units === 'us' ? v * 1.609344 : v)
export const windUnit = (units: Units) => (units === 'us' ? 'mph' : 'km/h')

/** 1 oz (avoirdupois) = 1/16 lb = 28.349523125 g exactly (NIST Handbook 44, Appendix C). */
export const OZ_KG = LB_KG / 16

/**
 * The amount of one feed a hand puts out, in the unit that suits it: minerals in oz (US) or g (metric) a head, and in lb or kg
 * once a group's total reaches a pound or a kilogram; everything else in lb or kg to one decimal. An amount that is fed never
 * reads 0: it gets the decimals it needs (up to three), or "< 0.001".
 */
export function feedAmount(kg: number, opts: { mineral: boolean; units: Units }): { value: number; unit: string; text: string } {
  const { mineral, units } = opts
  let value: number
  let unit: string
  let digits: number
  if (mineral && kg < LB_KG && units === 'us') {
    value = kg / OZ_KG
    unit = 'oz'
    digits = 1
  } else if (mineral && kg < 1 && units === 'metric') {
    value = kg * 1000
    unit = 'g'
    digits = 0
  } else {
    value = massValue(kg, units)
    unit = massUnit(units)
    digits = 1
  }
  if (!Number.isFinite(value)) return { value, unit, text: '—' }
  while (value > 0 && Number(value.toFixed(digits)) === 0 && digits < 3) digits++
  const shown = Number(value.toFixed(digits))
  const number = value > 0 && shown === 0 ? `< ${(0.1 ** digits).toFixed(digits)}` : fmtNumber(value, digits)
  return { value, unit, text: `${number} ${unit}` }
}
