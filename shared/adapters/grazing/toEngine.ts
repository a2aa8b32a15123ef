// Maps the stored field and plan resources onto the grazing engine's input shapes, and a field's standing feed onto Balance feeds; pure, used by client and server alike.
import { SORGHUM_GRAIN_DM_FRACTION, nitrateToPpmNo3N, supplyOfParsedField, grazingFieldSchema, type FieldSupply, type GrazingField, type GrazingFieldInput } from '../../engine/grazing/index'
import type { Feed } from '../../engine/nutrition/ration/schema'
import { componentKindLabels, type Component, type ComponentKind, type ComponentQualityInput, type Field } from '../../schemas/grazing/fields'

/**
 * Standing dry-matter % when neither a lab result nor the user gives one. Grain: the 14 %-moisture basis of the
 * standard bushel (derived, see the engine's SORGHUM_GRAIN_DM_FRACTION). The others are defaults (from memory):
 * weathered winter stover and frost-killed legume stand fairly dry; a lab DM should replace them.
 */
export const DEFAULT_STANDING_DM_PCT: Record<ComponentKind, { value: number; evidence: 'derived' | 'from memory' }> = {
  'sorghum-grain': { value: SORGHUM_GRAIN_DM_FRACTION * 100, evidence: 'derived' },
  'sorghum-stover': { value: 80, evidence: 'from memory' },
  'legume-forage': { value: 40, evidence: 'from memory' },
  'legume-seed': { value: 88, evidence: 'from memory' },
}

/** The quality a component carries: its lab result, else the quality entered with it; undefined lets the engine use its book value. */
export function effectiveQuality(c: Pick<Component, 'labQuality' | 'quality'>): ComponentQualityInput | undefined {
  return c.labQuality ?? c.quality ?? undefined
}

/** A stored field in the engine's shape (ids become strings, as the engine keys plans by string ids). */
export function toEngineField(f: Field): GrazingFieldInput {
  return {
    id: String(f.id),
    name: f.name,
    areaHa: f.areaHa,
    fenceLengthM: f.fenceLengthM,
    rowSpacingM: f.rowSpacingM,
    corridorWidthM: f.corridorWidthM,
    legume: f.legume,
    legumeShareOfWidth: f.legumeShareOfWidth,
    components: f.components.map((c) => {
      const q = effectiveQuality(c)
      return {
        kind: c.kind,
        kgDmPerHa: c.kgDmPerHa,
        ...(c.basis ? { basis: c.basis } : {}),
        measuredOn: c.measuredOn,
        method: c.method,
        ...(q ? { quality: { ...q, source: { kind: q.source.kind, label: q.source.label, ...(q.source.sampledOn ? { sampledOn: q.source.sampledOn } : {}) } } } : {}),
      }
    }),
    killingFrostDates: f.killingFrostDates,
    partialFrostDates: f.partialFrostDates,
    ...(f.nitrate ? { nitrate: f.nitrate } : {}),
    ...(f.grainOnGround ? { grainOnGround: f.grainOnGround } : {}),
    ...(f.weathering ? { weathering: f.weathering } : {}),
  }
}

export function parseEngineField(f: Field): GrazingField {
  return grazingFieldSchema.parse(toEngineField(f))
}

/** Feed id of a field component in a Balance problem. */
export function fieldFeedId(fieldId: number, kind: ComponentKind): string {
  return `field-${fieldId}-${kind}`
}

export type FieldFeeds = {
  field: { id: number; name: string }
  date: string
  feeds: Feed[]
  fieldOffer: { feedId: string; shareOfDm: number }[]
  supply: FieldSupply
}

/**
 * What a field offers a herd group on a date, as Balance feeds: one 'field' feed per standing component, with its
 * weathered quality from fieldSupply (lab result or book value), the field's nitrate result on the forage parts
 * (nitrate collects in stalks and leaves, not in grain; UNL CropWatch 2023/2024), and the offered shares of dry matter.
 */
export function fieldFeedsFromField(f: Field, date: string): FieldFeeds {
  const supply = supplyOfParsedField(parseEngineField(f), date)
  const nitrateN = f.nitrate ? nitrateNPpm(f.nitrate) : undefined
  const byKind = new Map<ComponentKind, { kg: number; cp: number; tdn: number; ca?: number; p?: number }>()
  for (const s of supply.components) {
    if (s.kgDmPerHa <= 0) continue
    const prev = byKind.get(s.kind) ?? { kg: 0, cp: 0, tdn: 0 }
    prev.kg += s.kgDmPerHa
    prev.cp += s.kgDmPerHa * s.quality.cpPctDm
    prev.tdn += s.kgDmPerHa * s.quality.tdnPctDm
    if (s.quality.caPctDm !== undefined) prev.ca = s.quality.caPctDm
    if (s.quality.pPctDm !== undefined) prev.p = s.quality.pPctDm
    byKind.set(s.kind, prev)
  }
  const total = [...byKind.values()].reduce((a, v) => a + v.kg, 0)
  const feeds: Feed[] = []
  const fieldOffer: { feedId: string; shareOfDm: number }[] = []
  for (const [kind, v] of byKind) {
    const comp = f.components.find((c) => c.kind === kind)
    const dmPct = effectiveDmPct(comp)
    const id = fieldFeedId(f.id, kind)
    feeds.push({
      id,
      name: `${f.name}: ${componentKindLabels[kind].toLowerCase()}`,
      role: 'field',
      dmPct,
      cpPctDm: v.cp / v.kg,
      tdnPctDm: v.tdn / v.kg,
      ...(v.ca !== undefined ? { caPctDm: v.ca } : {}),
      ...(v.p !== undefined ? { pPctDm: v.p } : {}),
      ...(nitrateN !== undefined && (kind === 'sorghum-stover' || kind === 'legume-forage') ? { nitrateNPpmDm: nitrateN } : {}),
      ...(kind === 'sorghum-grain' ? { isGrain: true } : {}),
      ...(kind.startsWith('legume') ? { isLegume: true } : {}),
    })
    fieldOffer.push({ feedId: id, shareOfDm: v.kg / total })
  }
  // The Balance demands shares that add to exactly 1; put the rounding on the largest share.
  if (fieldOffer.length) {
    const sum = fieldOffer.reduce((a, o) => a + o.shareOfDm, 0)
    const largest = fieldOffer.reduce((a, o) => (o.shareOfDm > a.shareOfDm ? o : a))
    largest.shareOfDm += 1 - sum
  }
  return { field: { id: f.id, name: f.name }, date, feeds, fieldOffer, supply }
}

/** Standing DM %: the lab's, else the one entered, else the default by kind. */
export function effectiveDmPct(c: Pick<Component, 'kind' | 'dmPct'> | undefined, labDmPct?: number | null): number {
  if (labDmPct) return labDmPct
  if (c?.dmPct) return c.dmPct
  return DEFAULT_STANDING_DM_PCT[c?.kind ?? 'sorghum-stover'].value
}

function nitrateNPpm(n: NonNullable<Field['nitrate']>): number {
  return nitrateToPpmNo3N(n.value, n.unit)
}
