// Unit conversions the grazing worksheets need beyond ../units (frames, row areas, paces, nitrate forms).
import { NO3_PER_NO3N } from '../nutrition/conversions'
import { ACRE_M2, FT_M, HA_M2, IN_M, LB_KG, SORGHUM_BU_LB } from '../units'

/** One square foot in m²: 0.09290304 exactly (NIST SP 811, 2008, App. B). */
export const FT2_M2 = FT_M * FT_M
/** 1 acre = 43,560 ft² (international acre, NIST SP 811 App. B); computed so it stays exact to float precision. */
export const FT2_PER_ACRE = ACRE_M2 / FT2_M2
/** Hectares per acre (derived from NIST definitions: 4046.8564224 m² ÷ 10,000 m²). */
export const HA_PER_ACRE = ACRE_M2 / HA_M2
/** Kilograms in one 56-lb bushel of grain sorghum (USDA standard test weight; NIST lb). */
export const SORGHUM_BU_KG = SORGHUM_BU_LB * LB_KG

/** g/m² → kg/ha: 1 g/m² × 10,000 m²/ha ÷ 1,000 g/kg = 10 kg/ha (derived from SI prefixes). */
export function gPerM2ToKgPerHa(gPerM2: number): number {
  return (gPerM2 * HA_M2) / 1000
}

/** Bushels of sorghum per acre → kg per hectare (56-lb bushel; NIST lb and acre). */
export function sorghumBuPerAcreToKgPerHa(buPerAcre: number): number {
  return (buPerAcre * SORGHUM_BU_KG) / HA_PER_ACRE
}
export function kgPerHaToSorghumBuPerAcre(kgPerHa: number): number {
  return (kgPerHa * HA_PER_ACRE) / SORGHUM_BU_KG
}

/** Per-hectare count or rate → per-acre (e.g. animal-days/ha → animal-days/ac), with the NIST SP 811 acre. */
export function perHaToPerAcre(v: number): number {
  return v * HA_PER_ACRE
}
export function perAcreToPerHa(v: number): number {
  return v / HA_PER_ACRE
}

/** Inches → metres (1 in = 0.0254 m exactly, NIST SP 811). */
export function inToM(v: number): number {
  return v * IN_M
}

/**
 * A pace of 2.5 ft (0.762 m): a walking step as the trade uses it to step off a fence move (common practice).
 * People differ; the user should calibrate it by pacing a known distance.
 */
export const DEFAULT_PACE_M = 2.5 * FT_M

/** Paces to walk for a fence move; the pace length is a setting (common practice, see {@link DEFAULT_PACE_M}). */
export function metresToPaces(metres: number, paceLengthM: number = DEFAULT_PACE_M): number {
  if (!(paceLengthM > 0)) throw new RangeError('paceLengthM must be > 0')
  return metres / paceLengthM
}

/**
 * NO3 per NO3-N by molar mass (IUPAC standard atomic weights N 14.007, O 15.999; the one ratio both engines use, defined
 * in the nutrition conversions). Its value, 4.4266, agrees with the published lab factor NO3 = 4.43 × NO3-N and its
 * inverse 0.226 (B. Anderson, Univ. of Nebraska–Lincoln, via Dairy Herd) [read].
 */
export const NO3_PER_NO3N_MOLAR = NO3_PER_NO3N

/** Reporting units a feed lab uses for nitrate on a dry-matter basis. */
export type NitrateReportUnit = 'ppm-NO3-N' | 'ppm-NO3' | 'pct-NO3-N' | 'pct-NO3'
export const NITRATE_REPORT_UNITS: readonly NitrateReportUnit[] = ['ppm-NO3-N', 'ppm-NO3', 'pct-NO3-N', 'pct-NO3']

/**
 * Any nitrate result → ppm NO3-N: NO3 ÷ 4.4266 (molar-mass ratio; the lab factor is 4.43, B. Anderson, UNL, via Dairy
 * Herd [read]), and 1 % = 10,000 ppm by definition of the units.
 */
export function nitrateToPpmNo3N(value: number, unit: NitrateReportUnit): number {
  switch (unit) {
    case 'ppm-NO3-N':
      return value
    case 'ppm-NO3':
      return value / NO3_PER_NO3N_MOLAR
    case 'pct-NO3-N':
      return value * 10_000
    case 'pct-NO3':
      return (value * 10_000) / NO3_PER_NO3N_MOLAR
  }
}

/** Convert a nitrate result between any two reporting units (same factors as {@link nitrateToPpmNo3N}). */
export function convertNitrate(value: number, from: NitrateReportUnit, to: NitrateReportUnit): number {
  const n = nitrateToPpmNo3N(value, from)
  switch (to) {
    case 'ppm-NO3-N':
      return n
    case 'ppm-NO3':
      return n * NO3_PER_NO3N_MOLAR
    case 'pct-NO3-N':
      return n / 10_000
    case 'pct-NO3':
      return (n * NO3_PER_NO3N_MOLAR) / 10_000
  }
}
