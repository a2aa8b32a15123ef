// Yield worksheets: sorghum grain from head counts or hand harvest, stover rules, clipped-frame dry matter.
import { z } from 'zod'
import { IN_M, FT_M, LB_KG, SORGHUM_BU_LB, kgPerHaToLbPerAcre } from '../units'
import { FT2_M2, FT2_PER_ACRE, HA_PER_ACRE, gPerM2ToKgPerHa } from './conversions'
import { fraction, nonNegative, percent, positive } from './common'

/**
 * Dry-matter fraction of sorghum grain on the standard-bushel basis: 1 − 0.14. The 14 % moisture basis of the
 * 56-lb bushel is from memory; the hand-harvest formula of Mustang Seeds' "Calculations" page divides by 86 for the
 * same basis [read]. 56 × 0.86 = 48.16 lb DM per bushel (derived).
 */
export const SORGHUM_GRAIN_DM_FRACTION = 0.86
/** Moisture of the standard 56-lb sorghum bushel, % (from memory; consistent with Mustang Seeds' ÷86 [read]). */
export const SORGHUM_STANDARD_MOISTURE_PCT = 14

const rowSpacingInSchema = positive()

/**
 * Feet of row equal to 1/1000 acre: 43,560 ft² ÷ 1000 ÷ (row spacing in ft) = 522.72 ÷ spacing in inches.
 * Source: K-State Agronomy eUpdate 461/608 (Ciampitti et al., "Grain sorghum yield potential: an on-farm
 * calculation"), which gives 17.4 ft for 30-in rows [read]; the general form is derived from the acre definition.
 */
export function rowLengthForThousandthAcreFt(rowSpacingIn: number): number {
  const w = z.object({ rowSpacingIn: rowSpacingInSchema }).parse({ rowSpacingIn }).rowSpacingIn
  return FT2_PER_ACRE / 1000 / (w / 12)
}

export const rowSampleSchema = z.object({
  rowSpacingIn: rowSpacingInSchema,
  rowLengthFt: positive(),
  rows: z.number().int().min(1),
})
export type RowSampleInput = z.input<typeof rowSampleSchema>

/**
 * Area of a sampled stretch of row: acres = length (ft) × spacing (in) × rows ÷ 522,720
 * (Mustang Seeds "Calculations" reference page [read]; 522,720 = 43,560 × 12, derived).
 */
export function sampledRowAcres(input: RowSampleInput): number {
  const { rowSpacingIn, rowLengthFt, rows } = rowSampleSchema.parse(input)
  return (rowLengthFt * (rowSpacingIn / 12) * rows) / FT2_PER_ACRE
}
/** The same area in hectares (SI), from metres of row and row spacing. */
export function sampledRowAreaHa(input: RowSampleInput): number {
  const { rowSpacingIn, rowLengthFt, rows } = rowSampleSchema.parse(input)
  return (rowLengthFt * FT_M * rowSpacingIn * IN_M * rows) / 10_000
}

export const grainYieldFromHeadsInputSchema = rowSampleSchema.extend({
  heads: z.number().int().min(0),
  seedsPerHead: positive(),
  seedsPerLb: positive(),
  /** Dry-matter fraction of the grain, to give kg DM/ha for the field (default 0.86, see SORGHUM_GRAIN_DM_FRACTION). */
  grainDmFraction: fraction().gt(0).default(SORGHUM_GRAIN_DM_FRACTION),
})
export type GrainYieldFromHeadsInput = z.input<typeof grainYieldFromHeadsInputSchema>

export const grainYieldSchema = z.object({
  sampledAcres: z.number(),
  headsPerAcre: z.number(),
  lbPerAcre: z.number(),
  buPerAcre: z.number(),
  headsPerHa: z.number(),
  kgPerHa: z.number(),
  kgDmPerHa: z.number(),
})
export type GrainYield = z.infer<typeof grainYieldSchema>

/**
 * Grain sorghum yield from head counts: bu/ac = heads/ac × seeds/head ÷ seeds/lb ÷ 56, with heads/ac scaled from
 * the sampled row area. Source: K-State Agronomy eUpdates 461 (2021), 608 and 663 (Ciampitti et al.) [read];
 * 56 lb per bushel, same source [read]. Seeds/lb for harvested grain is the user's estimate: planting-seed lots run
 * 12,000–18,000 (Bean, Sorghum Checkoff "Seeding rate", 2017) [read] and stressed heads fill lighter.
 */
export function grainYieldFromHeads(input: GrainYieldFromHeadsInput): GrainYield {
  const p = grainYieldFromHeadsInputSchema.parse(input)
  const sampledAcres = (p.rowLengthFt * (p.rowSpacingIn / 12) * p.rows) / FT2_PER_ACRE
  const headsPerAcre = p.heads / sampledAcres
  const lbPerAcre = (headsPerAcre * p.seedsPerHead) / p.seedsPerLb
  const kgPerHa = (lbPerAcre * LB_KG) / HA_PER_ACRE
  return {
    sampledAcres,
    headsPerAcre,
    lbPerAcre,
    buPerAcre: lbPerAcre / SORGHUM_BU_LB,
    headsPerHa: headsPerAcre / HA_PER_ACRE,
    kgPerHa,
    kgDmPerHa: kgPerHa * p.grainDmFraction,
  }
}

/** About 0.1 lb of grain on an average sorghum head (≈2,000 kernels × ≈21 g per 1,000), Bean, High Plains Journal 2020 [read]. */
export const AVERAGE_HEAD_GRAIN_KG = 0.1 * LB_KG

export const grainYieldFromHeadWeightInputSchema = z.object({
  headsPerHa: nonNegative(),
  kgGrainPerHead: positive().default(AVERAGE_HEAD_GRAIN_KG),
})
/**
 * Quick grain estimate from head density alone: kg/ha = heads/ha × grain per head (default 0.1 lb per head,
 * Bean, "Sorghum seeding rates can vary", High Plains Journal 2020 [read]).
 */
export function grainYieldFromHeadWeight(input: z.input<typeof grainYieldFromHeadWeightInputSchema>): { kgPerHa: number; buPerAcre: number } {
  const p = grainYieldFromHeadWeightInputSchema.parse(input)
  const kgPerHa = p.headsPerHa * p.kgGrainPerHead
  return { kgPerHa, buPerAcre: (kgPerHa * HA_PER_ACRE) / (SORGHUM_BU_LB * LB_KG) }
}

export const handHarvestInputSchema = rowSampleSchema.extend({
  grainG: positive(),
  moisturePct: percent().lt(100),
  standardMoisturePct: percent().lt(100).default(SORGHUM_STANDARD_MOISTURE_PCT),
})
/**
 * Hand-harvested grain expanded to the acre and corrected to standard moisture:
 * lb/ac = (100 − moisture) × lb harvested × 6078.14 ÷ row length ft ÷ spacing in ÷ rows
 * (Mustang Seeds "Calculations" page [read]; 6078.14 = 43,560 × 12 ÷ 86, derived).
 */
export function handHarvestYield(input: z.input<typeof handHarvestInputSchema>): { lbPerAcre: number; buPerAcre: number; kgPerHa: number } {
  const p = handHarvestInputSchema.parse(input)
  const acres = (p.rowLengthFt * (p.rowSpacingIn / 12) * p.rows) / FT2_PER_ACRE
  const lbAtStandard = ((p.grainG / 1000 / LB_KG) * (100 - p.moisturePct)) / (100 - p.standardMoisturePct)
  const lbPerAcre = lbAtStandard / acres
  return { lbPerAcre, buPerAcre: lbPerAcre / SORGHUM_BU_LB, kgPerHa: (lbPerAcre * LB_KG) / HA_PER_ACRE }
}

/** Stover rules of B. Bean: total stover ≈ 60 lb DM per bushel harvested; conservative grazeable ≈ 10 lb per bushel [read]. */
export const STOVER_LB_DM_PER_BU = { total: 60, palatable: 10 } as const

export const stoverFromGrainInputSchema = z.object({
  grainKgPerHa: nonNegative(),
  rule: z.enum(['total', 'palatable']).default('total'),
})
/**
 * Stover dry matter from grain yield: lb DM per bushel × bushels (Bean, "Utilizing sorghum stalks for grazing",
 * MAFG; Sorghum Checkoff Nov 2020 [read]). The ×60 rule missed measured stover by −46 % to +66 % across hybrids in
 * Oklahoma State PSS-2607 [read], so a clipped frame beats it whenever one is taken.
 */
export function stoverFromGrain(input: z.input<typeof stoverFromGrainInputSchema>): { kgDmPerHa: number } {
  const p = stoverFromGrainInputSchema.parse(input)
  // lb stover per lb grain is the same ratio per hectare as per acre.
  return { kgDmPerHa: (p.grainKgPerHa * STOVER_LB_DM_PER_BU[p.rule]) / SORGHUM_BU_LB }
}

/**
 * Harvest index implied by the ×60 stover rule: grain DM ÷ (grain DM + stover DM) = 48.16 ÷ 108.16 ≈ 0.445
 * (derived from Bean's rule and the 14 %-moisture bushel). Published upper bounds are 0.46–0.52 by hybrid
 * ("Sorghum harvest index in relation to plant size, environment, and cultivar", Agron. J.) [read].
 */
export function harvestIndexFromStoverRule(grainDmFraction: number = SORGHUM_GRAIN_DM_FRACTION): number {
  const dm = z.object({ grainDmFraction: fraction().gt(0) }).parse({ grainDmFraction }).grainDmFraction
  const grain = SORGHUM_BU_LB * dm
  return grain / (grain + STOVER_LB_DM_PER_BU.total)
}

export const clipPlotInputSchema = z
  .object({
    frameAreaM2: positive().optional(),
    frameAreaFt2: positive().optional(),
    wetG: positive(),
    dryG: positive(),
    containerG: nonNegative().default(0),
  })
  .superRefine((v, ctx) => {
    if ((v.frameAreaM2 === undefined) === (v.frameAreaFt2 === undefined)) {
      ctx.addIssue({ code: 'custom', path: ['frameAreaM2'], message: 'give exactly one of frameAreaM2 or frameAreaFt2' })
    }
    if (v.dryG <= v.containerG) ctx.addIssue({ code: 'custom', path: ['dryG'], message: 'dryG must exceed containerG' })
    if (v.dryG > v.wetG) ctx.addIssue({ code: 'custom', path: ['dryG'], message: 'dryG cannot exceed wetG' })
  })
export type ClipPlotInput = z.input<typeof clipPlotInputSchema>

export const clipPlotResultSchema = z.object({
  dmPct: z.number(),
  kgDmPerHa: z.number(),
  lbDmPerAcre: z.number(),
  kgFreshPerHa: z.number(),
})
export type ClipPlotResult = z.infer<typeof clipPlotResultSchema>

/**
 * Dry matter from one clipped frame. DM % = (dry − container) ÷ (wet − container) × 100 (Univ. of Maine pasture
 * course, Lesson 1 App. E; FARM LLC microwave sheet) [read]; kg/ha from grams per frame area (1 g/m² = 10 kg/ha,
 * derived; lb/ac per dry gram = 96.03 ÷ frame ft², derived from NIST units). Drying to constant weight follows
 * NFTA procedure 2.1.3 (microwave) or 2.1.2 (oven) [read].
 */
export function clipPlotDm(input: ClipPlotInput): ClipPlotResult {
  const p = clipPlotInputSchema.parse(input)
  const areaM2 = p.frameAreaM2 ?? (p.frameAreaFt2 as number) * FT2_M2
  const dryNet = p.dryG - p.containerG
  const wetNet = p.wetG - p.containerG
  const kgDmPerHa = gPerM2ToKgPerHa(dryNet / areaM2)
  return {
    dmPct: (dryNet / wetNet) * 100,
    kgDmPerHa,
    lbDmPerAcre: kgPerHaToLbPerAcre(kgDmPerHa),
    kgFreshPerHa: gPerM2ToKgPerHa(wetNet / areaM2),
  }
}

/** lb DM/ac per dry gram clipped from a frame of the given size (derived: 43,560 ÷ 453.59237 ÷ ft²). */
export function lbPerAcrePerDryGram(frameAreaFt2: number): number {
  const a = z.object({ frameAreaFt2: positive() }).parse({ frameAreaFt2 }).frameAreaFt2
  return FT2_PER_ACRE / (1000 * LB_KG) / a
}

export const sampleSpreadSchema = z.object({
  n: z.number().int(),
  mean: z.number(),
  /** Sample standard deviation (n − 1); null for a single sample, where no spread can be estimated. */
  sd: z.number().nullable(),
  /** sd ÷ mean × 100; null when sd is null or the mean is 0. */
  cvPct: z.number().nullable(),
  min: z.number(),
  max: z.number(),
})
export type SampleSpread = z.infer<typeof sampleSpreadSchema>

/** Mean, sample standard deviation (n − 1, the textbook definition), coefficient of variation, min and max. */
export function sampleSpread(values: readonly number[]): SampleSpread {
  const xs = z.array(z.number()).min(1).parse(values)
  const n = xs.length
  const mean = xs.reduce((a, b) => a + b, 0) / n
  let sd: number | null = null
  if (n > 1) {
    const ss = xs.reduce((a, x) => a + (x - mean) ** 2, 0)
    sd = Math.sqrt(ss / (n - 1))
  }
  const cvPct = sd === null || mean === 0 ? null : (sd / mean) * 100
  return { n, mean, sd, cvPct, min: Math.min(...xs), max: Math.max(...xs) }
}

export const clipPlotSummarySchema = z.object({
  samples: z.array(clipPlotResultSchema),
  kgDmPerHa: sampleSpreadSchema,
  lbDmPerAcre: sampleSpreadSchema,
  dmPct: sampleSpreadSchema,
})
export type ClipPlotSummary = z.infer<typeof clipPlotSummarySchema>

/**
 * Averages several clipped frames and reports their spread; clip several plots and average them
 * (NDSU R1838, "Range and forage production sample kits", 2017 [read]).
 */
export function summarizeClipPlots(samples: readonly ClipPlotInput[]): ClipPlotSummary {
  z.array(z.unknown()).min(1).parse(samples)
  const results = samples.map((s) => clipPlotDm(s))
  return {
    samples: results,
    kgDmPerHa: sampleSpread(results.map((r) => r.kgDmPerHa)),
    lbDmPerAcre: sampleSpread(results.map((r) => r.lbDmPerAcre)),
    dmPct: sampleSpread(results.map((r) => r.dmPct)),
  }
}
