// What a field supplies on a date: dry matter and quality of each component after winter weathering.
import { z } from 'zod'
import { isoDateOutSchema, isoDateSchema } from './common'
import { DAYS_PER_MONTH, dayNumber } from './dates'
import {
  componentKindSchema,
  componentQualitySchema,
  grazingFieldSchema,
  widthShare,
  type ComponentKind,
  type GrazingField,
  type GrazingFieldInput,
} from './field'
import {
  DEFAULT_LEGUME_FORAGE_LOSS_AT_KILLING_FROST,
  bookQuality,
  massRetained,
  weatheredQuality,
  weatheringRateFor,
} from './weathering'

export const componentSupplySchema = z.object({
  kind: componentKindSchema,
  measuredOn: isoDateOutSchema,
  /** The figure as entered, on its own basis. */
  measuredKgDmPerHa: z.number(),
  /** Share of the field's area that figure applies to (legume: its share of the width). */
  widthShare: z.number(),
  monthsWeathered: z.number(),
  /** Fraction of measured dry matter still standing, weathering and frost loss together. */
  retained: z.number(),
  frostLossApplied: z.boolean(),
  /** Dry matter per hectare of the whole field on the date. */
  kgDmPerHa: z.number(),
  quality: componentQualitySchema,
  qualityIsBookValue: z.boolean(),
  weatheringIsDefault: z.boolean(),
})
export type ComponentSupply = z.infer<typeof componentSupplySchema>

export const fieldSupplySchema = z.object({
  fieldId: z.string(),
  date: isoDateOutSchema,
  components: z.array(componentSupplySchema),
  totalKgDmPerHa: z.number(),
  /** Whole-field total, kg DM. */
  totalKgDm: z.number(),
  /** DM-weighted CP and TDN of everything standing (0 when nothing stands). */
  cpPctDm: z.number(),
  tdnPctDm: z.number(),
  byKind: z.record(componentKindSchema, z.number()),
  notes: z.array(z.string()),
})
export type FieldSupply = z.infer<typeof fieldSupplySchema>

/**
 * Supply of an already-validated field on a date. Hot loops (the season budget) call this directly so the field
 * is parsed once, not every day.
 */
export function supplyOfParsedField(field: GrazingField, date: string): FieldSupply {
  const day = dayNumber(date)
  const frostLoss = field.weathering?.legumeForageLossAtKillingFrost ?? DEFAULT_LEGUME_FORAGE_LOSS_AT_KILLING_FROST.value
  const killing = field.killingFrostDates.map(dayNumber)
  const byKind: Record<ComponentKind, number> = { 'sorghum-grain': 0, 'sorghum-stover': 0, 'legume-forage': 0, 'legume-seed': 0 }
  const notes = new Set<string>()
  let total = 0
  let cpMass = 0
  let tdnMass = 0
  const components: ComponentSupply[] = field.components.map((c) => {
    const measured = dayNumber(c.measuredOn)
    // A figure taken after the date cannot be weathered backwards; it stands as measured.
    const months = Math.max(0, day - measured) / DAYS_PER_MONTH
    const { rate, isDefault } = weatheringRateFor(c.kind, field.weathering)
    // Leaf shed at frost is only lost if the frost came after the legume was measured and by the date asked.
    const frostLossApplied = c.kind === 'legume-forage' && killing.some((k) => k > measured && k <= day)
    const retained = massRetained(rate.dmLossPerMonth, months) * (frostLossApplied ? 1 - frostLoss : 1)
    const share = widthShare(field, c)
    const kgDmPerHa = c.kgDmPerHa * share * retained
    const base = c.quality ?? bookQuality(c.kind, field.legume)
    // A lab result ages from the day it was sampled, which may differ from the day the mass was measured.
    const sampled = c.quality?.source.sampledOn
    const qualityMonths = sampled === undefined ? months : Math.max(0, day - dayNumber(sampled)) / DAYS_PER_MONTH
    const quality = weatheredQuality(base, rate, qualityMonths)
    if (!c.quality) notes.add(`${c.kind}: no lab result, book value used (${base.source.label})`)
    if (isDefault && months > 0) notes.add(`${c.kind}: weathering at the default rate (no published rate exists)`)
    byKind[c.kind] += kgDmPerHa
    total += kgDmPerHa
    cpMass += kgDmPerHa * quality.cpPctDm
    tdnMass += kgDmPerHa * quality.tdnPctDm
    return {
      kind: c.kind,
      measuredOn: c.measuredOn,
      measuredKgDmPerHa: c.kgDmPerHa,
      widthShare: share,
      monthsWeathered: months,
      retained,
      frostLossApplied,
      kgDmPerHa,
      quality,
      qualityIsBookValue: !c.quality,
      weatheringIsDefault: isDefault,
    }
  })
  return {
    fieldId: field.id,
    date,
    components,
    totalKgDmPerHa: total,
    totalKgDm: total * field.areaHa,
    cpPctDm: total > 0 ? cpMass / total : 0,
    tdnPctDm: total > 0 ? tdnMass / total : 0,
    byKind,
    notes: [...notes],
  }
}

/**
 * Dry matter per hectare of each component of a field on a date, after monthly weathering of mass and quality
 * (rates in weathering.ts: defaults, since no published rate exists — nearest figures van Pletzen et al. 1991 and
 * K-State "Crop residues" Table 1), with legume figures counted on the legume's share of the field width (clip
 * each crop separately and record its share of the width, common practice) and each component's quality from its
 * lab result or a book value with its source.
 */
export function fieldSupply(field: GrazingFieldInput, date: string): FieldSupply {
  const f = grazingFieldSchema.parse(field)
  const d = isoDateSchema.parse(date)
  return supplyOfParsedField(f, d)
}
