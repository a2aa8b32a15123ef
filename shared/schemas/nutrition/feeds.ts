// Feeds: book-value reference feeds (read-only, with their source) and an operation's own feeds, supplements and minerals with prices.
import { z } from 'zod'
import { num, optNum, optText, positiveId, versionSchema } from './common'

export const feedKinds = ['forage', 'grain', 'supplement', 'mineral'] as const
export type FeedKind = (typeof feedKinds)[number]
export const feedKindLabels: Record<FeedKind, string> = { forage: 'Forage', grain: 'Grain', supplement: 'Supplement', mineral: 'Mineral' }

/** Price bases, all as fed: short ton (2,000 lb), metric tonne, or a bag of stated weight. */
export const priceUnits = ['ton', 'tonne', 'bag'] as const
export type PriceUnit = (typeof priceUnits)[number]

/** How each value of a reference row was obtained, labelled read, derived, from memory or common practice. */
export const provenanceSchema = z.object({
  read: z.array(z.string()),
  derived: z.array(z.string()),
  fromMemory: z.array(z.string()),
  commonPractice: z.array(z.string()),
})
export type Provenance = z.infer<typeof provenanceSchema>

/** Nutrient values of a feed, dry-matter basis except DM itself. */
export const feedNutrientFields = {
  dmPct: num(1, 100, 'dry matter', '% as fed'),
  cpPctDm: num(0, 300, 'crude protein', '% of DM'),
  tdnPctDm: num(0, 100, 'TDN', '% of DM'),
  ndfPctDm: optNum(0, 100, 'NDF', '% of DM'),
  adfPctDm: optNum(0, 100, 'ADF', '% of DM'),
  caPctDm: optNum(0, 40, 'calcium', '% of DM'),
  pPctDm: optNum(0, 25, 'phosphorus', '% of DM'),
  cuMgPerKgDm: optNum(0, 10_000, 'copper', 'mg/kg DM'),
  nitrateNPpmDm: optNum(0, 100_000, 'nitrate-N', 'ppm of DM'),
}

export const feedFields = z.object({
  name: z.string({ error: 'Enter a name.' }).trim().min(1, 'Enter a name.').max(120, 'Use at most 120 characters.'),
  kind: z.enum(feedKinds, { error: 'Choose forage, grain, supplement or mineral.' }),
  ...feedNutrientFields,
  isGrain: z.boolean().default(false),
  isUrea: z.boolean().default(false),
  isLegume: z.boolean().default(false),
  /** Labelled for cattle only (cattle minerals carry 300–400 mg/kg Cu): never offered to a sheep group. */
  cattleOnly: z.boolean().default(false),
  priceAmount: optNum(0, 100_000, 'price', '$'),
  priceUnit: z.enum(priceUnits).nullable().optional(),
  bagWeightKg: optNum(0.1, 2000, 'bag weight', 'kg'),
  available: z.boolean().default(true),
  maxKgAsFedPerHeadDay: optNum(0, 50, 'daily limit', 'kg as fed per head'),
  referenceFeedId: positiveId.nullable().optional(),
  sourceTitle: optText(300),
  sourceDetail: optText(300),
  notes: optText(2000),
})

function feedRules(f: z.infer<typeof feedFields>, ctx: z.RefinementCtx) {
  if (f.priceAmount != null && !f.priceUnit) ctx.addIssue({ code: 'custom', path: ['priceUnit'], message: 'Say whether the price is per ton, per tonne or per bag.' })
  if (f.priceUnit === 'bag' && f.bagWeightKg == null) ctx.addIssue({ code: 'custom', path: ['bagWeightKg'], message: 'Enter the bag weight for a price per bag.' })
  if (f.tdnPctDm > 0 && f.kind === 'mineral' && f.tdnPctDm > 20) ctx.addIssue({ code: 'custom', path: ['tdnPctDm'], message: 'A mineral carries little or no energy; check the TDN.' })
}

export const feedCreateSchema = feedFields.superRefine(feedRules)
export type FeedInput = z.input<typeof feedCreateSchema>
export type FeedValues = z.output<typeof feedCreateSchema>
export const feedUpdateSchema = feedFields.partial().extend({ version: versionSchema })
export type FeedUpdate = z.input<typeof feedUpdateSchema>

/** The values a balance uses: the latest lab result's where it has them, else the feed's own book or label values. */
export const effectiveValuesSchema = z.object({
  dmPct: z.number(),
  cpPctDm: z.number(),
  tdnPctDm: z.number(),
  ndfPctDm: z.number().nullable(),
  adfPctDm: z.number().nullable(),
  caPctDm: z.number().nullable(),
  pPctDm: z.number().nullable(),
  cuMgPerKgDm: z.number().nullable(),
  nitrateNPpmDm: z.number().nullable(),
  labResultId: z.number().nullable(),
  labResultVersion: z.number().nullable(),
  labSampleDate: z.string().nullable(),
  fromLab: z.array(z.string()),
})
export type EffectiveValues = z.infer<typeof effectiveValuesSchema>

export const feedSchema = feedFields.extend({
  id: z.number(),
  operationId: z.number().nullable(),
  isReference: z.boolean(),
  referenceKey: z.string().nullable(),
  provenance: provenanceSchema.nullable(),
  version: z.number(),
  effective: effectiveValuesSchema,
  createdAt: z.string(),
  updatedAt: z.string(),
})
export type FeedRecord = z.infer<typeof feedSchema>

export const feedListQuerySchema = z.object({
  scope: z.enum(['all', 'own', 'reference']).default('all'),
  kind: z.enum(feedKinds).optional(),
  species: z.enum(['cattle', 'sheep']).optional(),
})

/** kg as fed in one price unit (short ton = 2,000 lb exactly, NIST Handbook 44 App. C; 1 lb = 0.45359237 kg, NIST SP 811). */
export function kgAsFedPerPriceUnit(unit: PriceUnit, bagWeightKg?: number | null): number | null {
  if (unit === 'ton') return 2000 * 0.45359237
  if (unit === 'tonne') return 1000
  return bagWeightKg && bagWeightKg > 0 ? bagWeightKg : null
}

/** Cost per kg of dry matter from an as-fed price: price ÷ kg as fed per unit ÷ DM fraction (derived). */
export function costPerKgDm(f: { priceAmount?: number | null; priceUnit?: PriceUnit | null; bagWeightKg?: number | null }, dmPct: number): number | null {
  if (f.priceAmount == null || !f.priceUnit || !(dmPct > 0)) return null
  const kg = kgAsFedPerPriceUnit(f.priceUnit, f.bagWeightKg)
  if (!kg) return null
  return f.priceAmount / kg / (dmPct / 100)
}
/** Cost per kg as fed. */
export function costPerKgAsFed(f: { priceAmount?: number | null; priceUnit?: PriceUnit | null; bagWeightKg?: number | null }): number | null {
  if (f.priceAmount == null || !f.priceUnit) return null
  const kg = kgAsFedPerPriceUnit(f.priceUnit, f.bagWeightKg)
  return kg ? f.priceAmount / kg : null
}
