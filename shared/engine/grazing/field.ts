// Field and herd-group shapes the grazing engine reads, as plain zod-typed objects a database row maps onto.
import { z } from 'zod'
import { evidenceLabelSchema, fraction, isoDateSchema, nonNegative, percent, positive, positiveFraction } from './common'
import { NITRATE_REPORT_UNITS, type NitrateReportUnit } from './conversions'

export const COMPONENT_KINDS = ['sorghum-grain', 'sorghum-stover', 'legume-forage', 'legume-seed'] as const
export const componentKindSchema = z.enum(COMPONENT_KINDS)
export type ComponentKind = z.infer<typeof componentKindSchema>

export const corridorLegumeSchema = z.enum(['cowpea', 'forage-soybean', 'none'])
export type CorridorLegume = z.infer<typeof corridorLegumeSchema>

export const grazingSpeciesSchema = z.enum(['cattle', 'sheep'])
export type GrazingSpecies = z.infer<typeof grazingSpeciesSchema>

/** How a component's dry matter was estimated; the worksheets in yield.ts write the first five. */
export const estimateMethodSchema = z.enum([
  'head-count',
  'hand-harvest',
  'head-weight',
  'clipped-frame',
  'stover-rule',
  'visual',
  'other',
])

export const qualitySourceSchema = z.object({
  kind: z.enum(['lab', 'book']),
  /** Lab name and sample id, or the book's title, edition and table. */
  label: z.string().min(1),
  sampledOn: isoDateSchema.optional(),
  evidence: evidenceLabelSchema.optional(),
})

/** Nutrient content on a dry-matter basis; CP and TDN are required because every downstream check uses them. */
export const componentQualitySchema = z.object({
  cpPctDm: percent(),
  tdnPctDm: percent(),
  adfPctDm: percent().optional(),
  ndfPctDm: percent().optional(),
  caPctDm: percent().optional(),
  pPctDm: percent().optional(),
  source: qualitySourceSchema,
})
export type ComponentQuality = z.infer<typeof componentQualitySchema>

export const fieldComponentSchema = z.object({
  kind: componentKindSchema,
  /** Dry matter per hectare on the date measured, on the basis below. */
  kgDmPerHa: nonNegative(),
  /**
   * 'field': per hectare of the whole field (a head count over the full row spacing is this).
   * 'band': per hectare of the band the crop occupies — the legume corridor for legume parts, the rest of the width
   * for sorghum parts — as when a frame is clipped inside the corridor.
   * Defaults: sorghum parts 'field', legume parts 'band'.
   */
  basis: z.enum(['field', 'band']).optional(),
  measuredOn: isoDateSchema,
  method: estimateMethodSchema,
  /** Lab result or book value; when omitted the engine uses BOOK_QUALITY and says so. */
  quality: componentQualitySchema.optional(),
})
export type FieldComponent = z.infer<typeof fieldComponentSchema>

export const weatheringRateSchema = z.object({
  /** Fraction of the remaining dry matter lost per month, compounding. */
  dmLossPerMonth: fraction(),
  /** Percentage points of CP (DM basis) lost per month. */
  cpDropPtsPerMonth: nonNegative(),
  /** Percentage points of TDN (DM basis) lost per month. */
  tdnDropPtsPerMonth: nonNegative(),
})
export type WeatheringRate = z.infer<typeof weatheringRateSchema>

/** Per-field overrides of the weathering defaults in weathering.ts; anything left out keeps its default. */
export const weatheringSettingsSchema = z.object({
  rates: z.partialRecord(componentKindSchema, weatheringRateSchema.partial()).optional(),
  /** Fraction of legume forage dry matter lost once, at the first killing frost after it was measured. */
  legumeForageLossAtKillingFrost: fraction().optional(),
})
export type WeatheringSettings = z.infer<typeof weatheringSettingsSchema>

export const nitrateResultSchema = z.object({
  value: nonNegative(),
  unit: z.enum(NITRATE_REPORT_UNITS as [NitrateReportUnit, ...NitrateReportUnit[]]),
  sampledOn: isoDateSchema.optional(),
})
export type NitrateResult = z.infer<typeof nitrateResultSchema>

export const grazingFieldSchema = z
  .object({
    id: z.string().min(1),
    name: z.string().min(1),
    areaHa: positive(),
    /** Length of the fence line across the field: each strip is this wide and advances along the other side. */
    fenceLengthM: positive(),
    rowSpacingM: positive(),
    /** Width of the legume corridor between sorghum rows or twin rows; 0 for conventional rows. */
    corridorWidthM: nonNegative().default(0),
    legume: corridorLegumeSchema,
    /** Share of the field's width under the legume (corridor ÷ row-pattern width). */
    legumeShareOfWidth: fraction().default(0),
    components: z.array(fieldComponentSchema),
    /** Killing frosts (≈ −4 °C / 24 °F for sorghum, UNL BeefWatch 2024). */
    killingFrostDates: z.array(isoDateSchema).default([]),
    /** Frosts that did not kill the sorghum; each one also restarts the prussic-acid wait. */
    partialFrostDates: z.array(isoDateSchema).default([]),
    nitrate: nitrateResultSchema.optional(),
    /** Loose grain or downed heads on the ground, as kg grain per hectare (scouted). */
    grainOnGround: z.object({ kgPerHa: nonNegative(), observedOn: isoDateSchema }).optional(),
    weathering: weatheringSettingsSchema.optional(),
  })
  .superRefine((f, ctx) => {
    if (f.legume === 'none' && f.legumeShareOfWidth > 0) {
      ctx.addIssue({ code: 'custom', path: ['legumeShareOfWidth'], message: 'a field without a legume has no legume share' })
    }
    f.components.forEach((c, i) => {
      if (f.legume === 'none' && c.kind.startsWith('legume')) {
        ctx.addIssue({ code: 'custom', path: ['components', i, 'kind'], message: 'legume component on a field without a legume' })
      }
    })
  })
export type GrazingField = z.infer<typeof grazingFieldSchema>
export type GrazingFieldInput = z.input<typeof grazingFieldSchema>

export const groupMineralSchema = z.object({
  label: z.string().optional(),
  /** The species the product is labelled for; a cattle mineral must never go to sheep. */
  intendedFor: z.enum(['cattle', 'sheep', 'all-species']),
  copperPpm: nonNegative().optional(),
})

export const routineSupplementSchema = z.object({
  label: z.string().min(1),
  kgAsFedPerHeadPerDay: nonNegative(),
  dmFraction: positiveFraction(),
  pricePerKgAsFed: nonNegative(),
})
export type RoutineSupplement = z.infer<typeof routineSupplementSchema>

export const grazingGroupSchema = z.object({
  id: z.string().min(1),
  name: z.string().min(1),
  species: grazingSpeciesSchema,
  headCount: z.number().int().min(1),
  bodyWeightKg: positive(),
  /** Dry-matter intake per head per day, from the nutrition engine or a %-of-body-weight rule (animals.ts). */
  intakeKgDmPerHead: positive(),
  pregnant: z.boolean().default(false),
  lactating: z.boolean().default(false),
  /** Stepped up onto grain over the past weeks; unadapted stock need a slow start on standing grain. */
  grainAdapted: z.boolean().default(false),
  mineral: groupMineralSchema.optional(),
  /** Copper in the whole diet, mg/kg DM, when a ration has been analysed. */
  dietCopperPpmDm: nonNegative().optional(),
  /** A daily supplement fed on top of grazing (from a Balance); it replaces forage dry matter one for one. */
  routineSupplement: routineSupplementSchema.optional(),
})
export type GrazingGroup = z.infer<typeof grazingGroupSchema>
export type GrazingGroupInput = z.input<typeof grazingGroupSchema>

/** Default basis of a component's per-hectare figure: legume parts are clipped in their corridor (common practice). */
export function defaultBasis(kind: ComponentKind): 'field' | 'band' {
  return kind.startsWith('legume') ? 'band' : 'field'
}

/**
 * Share of the field's area a component's figure applies to: a corridor legume counts only on its share of the width
 * (clip each crop separately and record its share of the width, common practice).
 */
export function widthShare(field: Pick<GrazingField, 'legumeShareOfWidth'>, c: Pick<FieldComponent, 'kind' | 'basis'>): number {
  const basis = c.basis ?? defaultBasis(c.kind)
  if (basis === 'field') return 1
  return c.kind.startsWith('legume') ? field.legumeShareOfWidth : 1 - field.legumeShareOfWidth
}

export function isSorghum(kind: ComponentKind): boolean {
  return kind === 'sorghum-grain' || kind === 'sorghum-stover'
}
