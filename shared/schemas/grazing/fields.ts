// Field and field-component schemas (SI units on the wire): server validation, client parsing, form rules and types.
import { z } from 'zod'
import { COMPONENT_KINDS, corridorLegumeSchema, estimateMethodSchema, weatheringSettingsSchema, NITRATE_REPORT_UNITS, type NitrateReportUnit } from '../../engine/grazing/index'

const isoDate = z.iso.date('Use a date as YYYY-MM-DD.')
const num = (min: number, max: number, what: string) =>
  z.number({ error: `Enter ${what} as a number.` }).min(min, `${what[0].toUpperCase()}${what.slice(1)} must be at least ${min}.`).max(max, `${what[0].toUpperCase()}${what.slice(1)} must be at most ${max}.`)
const positiveNum = (max: number, what: string) =>
  z.number({ error: `Enter ${what} as a number.` }).positive(`${what[0].toUpperCase()}${what.slice(1)} must be more than 0.`).max(max, `${what[0].toUpperCase()}${what.slice(1)} must be at most ${max}.`)

export const componentKindSchema = z.enum(COMPONENT_KINDS)
export type ComponentKind = z.infer<typeof componentKindSchema>
export const componentKindLabels: Record<ComponentKind, string> = {
  'sorghum-grain': 'Sorghum grain',
  'sorghum-stover': 'Sorghum leaf and stalk',
  'legume-forage': 'Legume forage',
  'legume-seed': 'Legume seed and pods',
}
export const legumeLabels: Record<z.infer<typeof corridorLegumeSchema>, string> = {
  cowpea: 'Cowpea',
  'forage-soybean': 'Forage soybean',
  none: 'No legume',
}
export const methodLabels: Record<z.infer<typeof estimateMethodSchema>, string> = {
  'head-count': 'head counts',
  'hand-harvest': 'hand harvest',
  'head-weight': 'head weight',
  'clipped-frame': 'clipped frames',
  'stover-rule': 'stover rule',
  visual: 'visual estimate',
  other: 'other',
}

/** Nutrient content on a DM basis, with where it came from (a lab result or a book value). */
export const componentQualityInputSchema = z.object({
  cpPctDm: num(0, 100, 'crude protein (% DM)'),
  tdnPctDm: num(0, 100, 'TDN (% DM)'),
  adfPctDm: num(0, 100, 'ADF (% DM)').optional(),
  ndfPctDm: num(0, 100, 'NDF (% DM)').optional(),
  caPctDm: num(0, 40, 'calcium (% DM)').optional(),
  pPctDm: num(0, 25, 'phosphorus (% DM)').optional(),
  source: z.object({
    kind: z.enum(['lab', 'book']),
    label: z.string().trim().min(1, 'Say which lab sample or book value this is.').max(300),
    sampledOn: isoDate.optional(),
  }),
})
export type ComponentQualityInput = z.infer<typeof componentQualityInputSchema>

export const componentInputSchema = z.object({
  kind: componentKindSchema,
  /** Dry matter per hectare on the date measured, on the basis below. */
  kgDmPerHa: num(0, 60_000, 'dry matter per hectare'),
  /** 'field': per hectare of the whole field; 'band': per hectare of the band the crop occupies (the corridor for legume parts). */
  basis: z.enum(['field', 'band']).nullable().optional(),
  measuredOn: isoDate,
  method: estimateMethodSchema,
  /** Dry-matter % as it stands (for as-fed figures); a default by kind is used when missing. */
  dmPct: positiveNum(100, 'dry matter %').nullable().optional(),
  /** A lab result of the operation (Lab results); its analysis overrides `quality` when present. */
  labResultId: z.number().int().positive().nullable().optional(),
  quality: componentQualityInputSchema.nullable().optional(),
})
export type ComponentInput = z.input<typeof componentInputSchema>
export const componentUpdateSchema = componentInputSchema.partial()

export const componentSchema = componentInputSchema.extend({
  id: z.number(),
  fieldId: z.number(),
  basis: z.enum(['field', 'band']).nullable(),
  dmPct: z.number().nullable(),
  labResultId: z.number().nullable(),
  quality: componentQualityInputSchema.nullable(),
  /** The linked lab result's analysis, resolved by the server; it takes precedence over `quality`. */
  labQuality: componentQualityInputSchema.nullable().default(null),
  updatedAt: z.string(),
})
export type Component = z.infer<typeof componentSchema>

export const nitrateInputSchema = z.object({
  value: num(0, 200_000, 'the nitrate result'),
  unit: z.enum(NITRATE_REPORT_UNITS as [NitrateReportUnit, ...NitrateReportUnit[]]),
  sampledOn: isoDate.optional(),
})

/** Prices and figures for the field's economics; every one is the user's own. */
export const fieldEconomicsSchema = z.object({
  /** The legume's nitrogen credit, kg N per hectare of field (an input: published figures are shown beside it). */
  nitrogenCreditKgNPerHa: num(0, 500, 'the nitrogen credit').default(0),
  fertilizerPricePerKgN: num(0, 100, 'the fertilizer price per kg N').default(0),
  cropCostPerHa: num(0, 20_000, 'the crop cost').default(0),
  fencePerHa: num(0, 5_000, 'the fence cost').default(0),
  laborMinutesPerDay: num(0, 600, 'the minutes a day').default(20),
  laborPricePerHour: num(0, 500, 'the labour price').default(0),
  combiningPerHa: num(0, 5_000, 'the combining cost').default(0),
  haulingPerKgGrain: num(0, 10, 'the hauling cost').default(0),
  harvestLossFraction: num(0, 0.9, 'the harvest loss').default(0),
  feedingPerHeadDay: num(0, 50, 'the feeding cost').default(0),
  feedPricePerKgDm: num(0, 50, 'the harvested feed price').default(0),
  feedWasteFraction: num(0, 0.9, 'the feed waste').default(0),
  /** The group the comparison is costed for when no strip plan uses the field. */
  headCount: z.number().int('Use a whole number of head.').min(1).max(100_000).nullable().default(null),
  intakeKgDmPerHead: num(0.1, 40, 'the intake per head').nullable().default(null),
})
export type FieldEconomics = z.infer<typeof fieldEconomicsSchema>

/** Field settings as sent; no defaults here, so a PATCH that leaves a key out keeps the stored value. */
const fieldShape = {
  name: z.string().trim().min(1, 'Give the field a name.').max(120, 'Use at most 120 characters.'),
  areaHa: positiveNum(100_000, 'the area'),
  /** Fence line across the field: each strip is this wide and the fence advances along the field. */
  fenceLengthM: positiveNum(100_000, 'the fence length'),
  rowSpacingM: positiveNum(5, 'the row spacing'),
  corridorWidthM: num(0, 5, 'the corridor width'),
  legume: corridorLegumeSchema,
  legumeShareOfWidth: num(0, 1, 'the legume share of the width'),
  killingFrostDates: z.array(isoDate).max(30, 'At most 30 frost dates.'),
  partialFrostDates: z.array(isoDate).max(30, 'At most 30 frost dates.'),
  nitrate: nitrateInputSchema.nullable(),
  grainOnGround: z.object({ kgPerHa: num(0, 20_000, 'grain on the ground'), observedOn: isoDate }).nullable(),
  weathering: weatheringSettingsSchema.nullable(),
  economics: fieldEconomicsSchema.nullable(),
  notes: z.string().max(2000, 'Use at most 2,000 characters.'),
}
/** The same with the defaults a new field takes for what it leaves out. */
const fieldCreateShape = {
  ...fieldShape,
  corridorWidthM: fieldShape.corridorWidthM.default(0),
  legumeShareOfWidth: fieldShape.legumeShareOfWidth.default(0),
  killingFrostDates: fieldShape.killingFrostDates.default([]),
  partialFrostDates: fieldShape.partialFrostDates.default([]),
  nitrate: fieldShape.nitrate.default(null),
  grainOnGround: fieldShape.grainOnGround.default(null),
  weathering: fieldShape.weathering.default(null),
  economics: fieldShape.economics.default(null),
  notes: fieldShape.notes.default(''),
}

type FieldLike = { legume: string; legumeShareOfWidth: number; corridorWidthM: number; rowSpacingM: number; components?: { kind: string }[] }
function fieldRules(f: FieldLike, ctx: z.RefinementCtx) {
  if (f.legume === 'none' && f.legumeShareOfWidth > 0) ctx.addIssue({ code: 'custom', path: ['legumeShareOfWidth'], message: 'A field without a legume has no legume share.' })
  if (f.legume === 'none' && f.corridorWidthM > 0) ctx.addIssue({ code: 'custom', path: ['corridorWidthM'], message: 'A field without a legume has no corridor.' })
  if (f.legume !== 'none' && f.legumeShareOfWidth === 0) ctx.addIssue({ code: 'custom', path: ['legumeShareOfWidth'], message: 'Give the share of the width the legume occupies.' })
  if (f.corridorWidthM > f.rowSpacingM) ctx.addIssue({ code: 'custom', path: ['corridorWidthM'], message: 'The corridor cannot be wider than the row spacing.' })
  const seen = new Set<string>()
  f.components?.forEach((c, i) => {
    if (f.legume === 'none' && c.kind.startsWith('legume')) ctx.addIssue({ code: 'custom', path: ['components', i, 'kind'], message: 'A field without a legume has no legume component.' })
    if (seen.has(c.kind)) ctx.addIssue({ code: 'custom', path: ['components', i, 'kind'], message: 'Each component appears once per field.' })
    seen.add(c.kind)
  })
}

/** Create a field, optionally with its components, in one request. */
export const fieldCreateSchema = z.object({ ...fieldCreateShape, components: z.array(componentInputSchema).max(4).default([]) }).superRefine(fieldRules)
export type FieldCreate = z.input<typeof fieldCreateSchema>
/** Field settings without components; a PATCH sends any subset and the merged field must pass this. */
export const fieldSettingsSchema = z.object(fieldShape).superRefine(fieldRules)
export const fieldUpdateSchema = z.object(fieldShape).partial()
export type FieldUpdate = z.input<typeof fieldUpdateSchema>

export const fieldSchema = z.object({
  ...fieldShape,
  id: z.number(),
  operationId: z.number(),
  notes: z.string(),
  components: z.array(componentSchema),
  createdAt: z.string(),
  updatedAt: z.string(),
})
export type Field = z.infer<typeof fieldSchema>
export const fieldListSchema = z.object({ items: z.array(fieldSchema), total: z.number() })
