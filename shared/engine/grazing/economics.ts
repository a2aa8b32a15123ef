// Field economics: the legume's nitrogen credit at a fertilizer price, and grazing the crop against harvesting it.
import { z } from 'zod'
import { LB_KG } from '../units'
import { HA_PER_ACRE } from './conversions'
import { fraction, nonNegative, positive, positiveFraction, type EvidenceLabel } from './common'
import { SORGHUM_GRAIN_DM_FRACTION } from './yield'

export interface PublishedNitrogenFigure {
  legume: 'cowpea' | 'soybean'
  measure: 'fixed' | 'in-biomass' | 'share-from-air' | 'credit-to-next-crop' | 'uptake-from-fixation'
  low: number
  high: number
  unit: 'kg N/ha' | 'lb N/ac' | '%'
  context: string
  source: string
  evidence: EvidenceLabel
}

/**
 * Published nitrogen figures for the corridor legumes, shown beside the user's own credit. The engine never computes
 * a credit from them: credits to a following crop are largely a rotation effect, apply to the next crop only, and
 * in grazing most legume N returns unevenly in dung and urine (common practice / from memory), so the credit is an input.
 */
export const LEGUME_NITROGEN_PUBLISHED: readonly PublishedNitrogenFigure[] = [
  { legume: 'cowpea', measure: 'fixed', low: 70, high: 70, unit: 'kg N/ha', context: 'sole crop, ¹⁵N, semi-arid Tanzania; ≈60 % of plant N from fixation', source: 'Vesterager, Nielsen & Høgh-Jensen 2008, Nutr. Cycl. Agroecosyst. 80:61–73', evidence: 'read' },
  { legume: 'cowpea', measure: 'fixed', low: 36, high: 36, unit: 'kg N/ha', context: 'intercropped with maize, same trial', source: 'Vesterager, Nielsen & Høgh-Jensen 2008, Nutr. Cycl. Agroecosyst. 80:61–73', evidence: 'read' },
  { legume: 'cowpea', measure: 'share-from-air', low: 35, high: 92, unit: '%', context: 'intercropped with grain sorghum, no-till, first site', source: 'Mogale, Ayisi, Munjonji & Kifle 2023, Sustainability 15(3):2244', evidence: 'read' },
  { legume: 'cowpea', measure: 'share-from-air', low: 4, high: 70, unit: '%', context: 'intercropped with grain sorghum, no-till, second site', source: 'Mogale, Ayisi, Munjonji & Kifle 2023, Sustainability 15(3):2244', evidence: 'read' },
  { legume: 'cowpea', measure: 'in-biomass', low: 100, high: 150, unit: 'lb N/ac', context: 'cover crop, N held in the biomass', source: 'SARE, Managing Cover Crops Profitably, 3rd ed. (2007), cowpea chapter', evidence: 'read' },
  { legume: 'cowpea', measure: 'fixed', low: 40, high: 40, unit: 'lb N/ac', context: 'conservation tillage, approximate', source: 'Univ. of Georgia conservation-tillage page', evidence: 'read' },
  { legume: 'soybean', measure: 'fixed', low: 0, high: 200, unit: 'kg N/ha', context: 'fixation can meet plant demand up to ≈200 kg N/ha; partial N balance negative on average', source: 'Ciampitti & Salvagiotti 2018, Better Crops 102(3):5–7', evidence: 'read' },
  { legume: 'soybean', measure: 'uptake-from-fixation', low: 180, high: 180, unit: 'lb N/ac', context: 'of 270 lb N uptake at 60 bu/ac; upper limit ≈300 lb/ac', source: 'Pioneer agronomy summary of Salvagiotti et al. 2008, Field Crops Res. 108:1–13', evidence: 'read' },
  { legume: 'soybean', measure: 'credit-to-next-crop', low: 20, high: 60, unit: 'lb N/ac', context: 'soybean before corn, by state system; largely a rotation effect', source: 'agprofessional, "The science behind N credit for soybeans"', evidence: 'read' },
]

/** A published figure in kg N/ha (lb/ac converted with NIST SP 811 pound and acre); null for shares in %. */
export function nitrogenFigureKgPerHa(f: PublishedNitrogenFigure): { low: number; high: number } | null {
  if (f.unit === '%') return null
  if (f.unit === 'kg N/ha') return { low: f.low, high: f.high }
  const k = LB_KG / HA_PER_ACRE
  return { low: f.low * k, high: f.high * k }
}

/** Price per kg of N from a fertilizer's price and N content (e.g. urea at 46 % N, from memory). */
export function pricePerKgNitrogen(productPricePerKg: number, nFraction: number): number {
  const p = z.object({ productPricePerKg: nonNegative(), nFraction: positiveFraction() }).parse({ productPricePerKg, nFraction })
  return p.productPricePerKg / p.nFraction
}

export const nitrogenCreditInputSchema = z.object({
  /** The user's credit, kg N per hectare of field. */
  creditKgNPerHa: nonNegative(),
  fertilizerPricePerKgN: nonNegative(),
  areaHa: positive(),
})
/**
 * Value of the legume's nitrogen credit at the user's fertilizer price: credit × price per area. The credit is an
 * input, as the published credits depend on state system and crop sequence (20–60 lb N/ac for soybean before corn,
 * agprofessional; UNL Upper Big Blue recommendations) [read]; published figures (LEGUME_NITROGEN_PUBLISHED) sit
 * beside it for reference.
 */
export function legumeNitrogenCredit(input: z.input<typeof nitrogenCreditInputSchema>): { valuePerHa: number; valueForField: number; kgNForField: number } {
  const p = nitrogenCreditInputSchema.parse(input)
  const valuePerHa = p.creditKgNPerHa * p.fertilizerPricePerKgN
  return { valuePerHa, valueForField: valuePerHa * p.areaHa, kgNForField: p.creditKgNPerHa * p.areaHa }
}

export const harvestedFeedCostInputSchema = z.object({
  intakeKgDmPerHead: positive(),
  dmFraction: positiveFraction(),
  pricePerKgAsFed: nonNegative(),
  /** Share of feed wasted at feeding; Missouri's comparison assumed 20 % for hay (Drovers, "Figuring out the forage") [read]. */
  wasteFraction: fraction().lt(1).default(0),
})
/**
 * Cost per head per day of feeding a harvested feed: intake ÷ DM fraction ÷ (1 − waste) × price as fed. It rises in
 * proportion to price, as R. Lee's bought-hay figures do ($1.26, $1.62, $1.98/cow/day at $35, $45, $55 a bale;
 * MAFG) [read].
 */
export function harvestedFeedCostPerHeadPerDay(input: z.input<typeof harvestedFeedCostInputSchema>): number {
  const p = harvestedFeedCostInputSchema.parse(input)
  return (p.intakeKgDmPerHead / p.dmFraction / (1 - p.wasteFraction)) * p.pricePerKgAsFed
}

/** Minutes a day to move poly wire: about 15 (Iowa State Ext. news 2005); 20–30 (Univ. of Missouri news) [read]. */
export const FENCE_MOVE_MINUTES_PER_DAY = { low: 15, high: 30, source: 'Iowa State Ext. news 2005; Univ. of Missouri Extension news', evidence: 'read' as EvidenceLabel }

export const grazeVsHarvestInputSchema = z.object({
  /** Head-days one hectare of standing crop gives when grazed (stockingDaysPerHa). */
  headDaysPerHa: positive(),
  headCount: z.number().int().min(1),
  intakeKgDmPerHead: positive(),
  /** Costs the two ways share (rent, seed, planting); kept so the per-head-day totals are whole. */
  cropCostPerHa: nonNegative().default(0),
  grazing: z.object({
    /** Posts, reels, wire and water, spread per hectare. */
    fencePerHa: nonNegative(),
    laborMinutesPerDay: nonNegative(),
    laborPricePerHour: nonNegative(),
    otherPerHa: nonNegative().default(0),
  }),
  harvest: z.object({
    combiningPerHa: nonNegative(),
    haulingPerKgGrain: nonNegative().default(0),
    /** Grain harvested, as-is kg/ha. */
    grainKgPerHa: nonNegative(),
    grainDmFraction: positiveFraction().default(SORGHUM_GRAIN_DM_FRACTION),
    harvestLossFraction: fraction().lt(1).default(0),
    /** Machine and labour to feed, per head per day. */
    feedingPerHeadDay: nonNegative().default(0),
    /** Harvested forage bought or made to cover the rest of the intake, per kg DM. */
    feedPricePerKgDm: nonNegative(),
    feedWasteFraction: fraction().lt(1).default(0),
  }),
})
export const grazeVsHarvestSchema = z.object({
  grazing: z.object({ perHa: z.number(), perHeadDay: z.number() }),
  harvest: z.object({ perHa: z.number(), perHeadDay: z.number(), grainFedKgDm: z.number(), otherFeedKgDm: z.number(), surplusGrainKgDm: z.number() }),
  savingPerHa: z.number(),
  savingPerHeadDay: z.number(),
})
export type GrazeVsHarvest = z.infer<typeof grazeVsHarvestSchema>

/**
 * Grazing the standing crop against combining it and feeding harvested feed, for the same head-days of feeding.
 * The comparison follows the published Missouri and Ohio winter-system costings (R. Lee, MAFG: strip-grazed milo
 * $0.69 vs bought hay $1.62/cow/day; Loerch & Barker, OSU; Gerrish via Andrae) [read]; all prices are the user's.
 */
export function grazeVsHarvest(input: z.input<typeof grazeVsHarvestInputSchema>): GrazeVsHarvest {
  const p = grazeVsHarvestInputSchema.parse(input)
  const daysPerHa = p.headDaysPerHa / p.headCount
  const grazingPerHa =
    p.cropCostPerHa + p.grazing.fencePerHa + p.grazing.otherPerHa + (daysPerHa * p.grazing.laborMinutesPerDay * p.grazing.laborPricePerHour) / 60
  const h = p.harvest
  const needKgDm = p.headDaysPerHa * p.intakeKgDmPerHead
  const grainDm = h.grainKgPerHa * (1 - h.harvestLossFraction) * h.grainDmFraction
  const grainFedKgDm = Math.min(grainDm, needKgDm)
  const otherFeedKgDm = (needKgDm - grainFedKgDm) / (1 - h.feedWasteFraction)
  const harvestPerHa =
    p.cropCostPerHa +
    h.combiningPerHa +
    h.haulingPerKgGrain * h.grainKgPerHa * (1 - h.harvestLossFraction) +
    otherFeedKgDm * h.feedPricePerKgDm +
    h.feedingPerHeadDay * p.headDaysPerHa
  return {
    grazing: { perHa: grazingPerHa, perHeadDay: grazingPerHa / p.headDaysPerHa },
    harvest: { perHa: harvestPerHa, perHeadDay: harvestPerHa / p.headDaysPerHa, grainFedKgDm, otherFeedKgDm, surplusGrainKgDm: grainDm - grainFedKgDm },
    savingPerHa: harvestPerHa - grazingPerHa,
    savingPerHeadDay: (harvestPerHa - grazingPerHa) / p.headDaysPerHa,
  }
}
