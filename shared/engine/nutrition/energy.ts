// Feed energy: the TDN → DE → ME → NEm/NEg chain and forage-test shortcuts, per kg of dry matter.
import { z } from 'zod'
import { SOURCES } from './sources'
import type { NutritionWarning } from './warning'

/** 1 kg TDN = 4.409 Mcal DE (NRC Beef 2000, p. 126, citing NRC 1976 — read). */
export const DE_PER_KG_TDN = 4.409
/** ME = 0.82 × DE (same page — read). */
export const ME_PER_DE = 0.82

/** NEm (Mcal/kg DM) from ME by the California Net Energy System cubic (NRC 1996/2000; coefficients from memory, matching the NRC 1996 corn row — derived). */
export function nemFromMe(me: number): number {
  return 1.37 * me - 0.138 * me ** 2 + 0.0105 * me ** 3 - 1.12
}
/** NEg (Mcal/kg DM) from ME by the California Net Energy System cubic (NRC 1996/2000; coefficients from memory). */
export function negFromMe(me: number): number {
  return 1.42 * me - 0.174 * me ** 2 + 0.0122 * me ** 3 - 1.65
}

export const feedEnergyInputSchema = z.object({ tdnPctDm: z.number().finite().min(0).max(200) }).strict()
export type FeedEnergyInput = z.infer<typeof feedEnergyInputSchema>

export const feedEnergySchema = z.object({
  deMcalPerKg: z.number().finite(),
  meMcalPerKg: z.number().finite(),
  nemMcalPerKg: z.number().finite(),
  negMcalPerKg: z.number().finite(),
  warnings: z.array(z.object({ code: z.string(), message: z.string(), source: z.string() })),
})
export type FeedEnergy = { deMcalPerKg: number; meMcalPerKg: number; nemMcalPerKg: number; negMcalPerKg: number; warnings: NutritionWarning[] }

/**
 * DE, ME, NEm and NEg per kg DM from TDN % DM.
 * Source: NRC, Nutrient Requirements of Beef Cattle, 7th rev. ed., Update 2000, p. 126 (DE = 4.409 × TDN, ME = 0.82 × DE, read)
 * and the NRC 1996 cubic NEm/NEg equations (coefficients from memory). The cubics are fitted over ordinary feeds: NEg falls
 * below zero just under 40 % TDN and NEm just under 25 %, so both are floored at 0 there, with a warning.
 */
export function feedEnergy(input: FeedEnergyInput): FeedEnergy {
  return energyOfTdn(feedEnergyInputSchema.parse(input).tdnPctDm)
}

const energyCache = new Map<number, FeedEnergy>()
/** `feedEnergy` for a TDN already validated (same equations and sources); results are cached per TDN value. */
export function energyOfTdn(tdnPctDm: number): FeedEnergy {
  const hit = energyCache.get(tdnPctDm)
  if (hit) return hit
  const e = computeEnergy(tdnPctDm)
  if (energyCache.size > 4096) energyCache.clear()
  energyCache.set(tdnPctDm, e)
  return e
}

function computeEnergy(tdnPctDm: number): FeedEnergy {
  const de = (DE_PER_KG_TDN * tdnPctDm) / 100
  const me = de * ME_PER_DE
  const nemRaw = nemFromMe(me)
  const negRaw = negFromMe(me)
  const warnings: NutritionWarning[] = []
  if (nemRaw <= 0) {
    warnings.push({
      code: 'nem-out-of-range',
      message: `At ${tdnPctDm} % TDN the NEm equation gives no positive value; NEm is counted as 0.`,
      source: SOURCES.nrcBeef1996Memory,
    })
  }
  if (negRaw <= 0) {
    warnings.push({
      code: 'neg-out-of-range',
      message: `At ${tdnPctDm} % TDN the NEg equation is below its range (it turns negative just under 40 % TDN); NEg is counted as 0.`,
      source: SOURCES.nrcBeef1996Memory,
    })
  }
  return { deMcalPerKg: de, meMcalPerKg: me, nemMcalPerKg: Math.max(0, nemRaw), negMcalPerKg: Math.max(0, negRaw), warnings }
}

const adfSchema = z.object({ adfPctDm: z.number().finite().min(0).max(100) }).strict()
const ndfSchema = z.object({ ndfPctDm: z.number().finite().gt(0).max(100) }).strict()

/**
 * Digestible dry matter from ADF: DDM % = 88.9 − 0.779 × ADF % (forage-testing shortcut; common practice, from memory).
 * Returned as the TDN estimate labs commonly report for forages when no TDN is given — a default the user can override.
 */
export function tdnFromAdf(input: { adfPctDm: number }): number {
  const { adfPctDm } = adfSchema.parse(input)
  return Math.max(0, 88.9 - 0.779 * adfPctDm)
}
/** Same equation under its own name: DDM % = 88.9 − 0.779 × ADF % (common practice, from memory). */
export const ddmFromAdf = tdnFromAdf

/** Forage dry-matter intake, % of body weight = 120 / NDF % (forage-testing shortcut; common practice, from memory). */
export function dmiPctBwFromNdf(input: { ndfPctDm: number }): number {
  const { ndfPctDm } = ndfSchema.parse(input)
  return 120 / ndfPctDm
}

/** Relative feed value RFV = DDM × DMI(%BW) / 1.29 (forage-testing shortcut; common practice, from memory). */
export function relativeFeedValue(input: { adfPctDm: number; ndfPctDm: number }): number {
  const ddm = tdnFromAdf({ adfPctDm: input.adfPctDm })
  return (ddm * dmiPctBwFromNdf({ ndfPctDm: input.ndfPctDm })) / 1.29
}
