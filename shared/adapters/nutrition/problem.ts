// Turns a herd group, a date and the chosen feeds into the engine's inputs; the client (live preview) and the server (stored run) call the same code.
import { cattleRequirements, type CattleAnimal } from '../../engine/nutrition/cattle'
import { sheepRequirements, type SheepAnimal } from '../../engine/nutrition/sheep'
import type { Requirements } from '../../engine/nutrition/requirements'
import type { Feed as EngineFeed, RationProblem } from '../../engine/nutrition/ration/schema'
import type { EffectiveValues, FeedKind, PriceUnit } from '../../schemas/nutrition/feeds'
import { costPerKgDm } from '../../schemas/nutrition/feeds'
import { herdStageOn, type HerdStage, type HerdValues } from '../../schemas/nutrition/herds'
import type { BalanceSettings } from '../../schemas/nutrition/balances'

/** The parts of a feed record the balance needs. */
export type BalanceFeed = {
  id: number
  name: string
  kind: FeedKind
  effective: EffectiveValues
  isGrain: boolean
  isUrea: boolean
  isLegume: boolean
  cattleOnly: boolean
  available: boolean
  priceAmount?: number | null
  priceUnit?: PriceUnit | null
  bagWeightKg?: number | null
  maxKgAsFedPerHeadDay?: number | null
}

/** What a field offers on a date, as the grazing side computes it: engine feeds with role 'field' and their offered shares. */
export type FieldOffer = { fieldName?: string; feeds: EngineFeed[]; fieldOffer: { feedId: string; shareOfDm: number }[]; labResultIds?: number[]; notes?: string[] }

/** Peak milk used for a nursing cow group with none entered: 8 kg/d, the NRC 2000 p. 45 example curve (a default to change). */
export const DEFAULT_PEAK_MILK_KG = 8

export type HerdForEngine = Pick<
  HerdValues,
  'species' | 'class' | 'bodyWeightKg' | 'matureWeightKg' | 'bcs' | 'breed' | 'expectedBirthDate' | 'lastBirthDate' | 'restStage' | 'litterSize' | 'peakMilkKg' | 'calfBirthWeightKg' | 'targetGainKg' | 'grazing' | 'environment'
>

export type HerdNeeds = {
  species: 'cattle' | 'sheep'
  stage: HerdStage
  animal: CattleAnimal | SheepAnimal
  requirements: Requirements
  notes: string[]
}

/** The engine's animal for the group on the date, and its daily requirements per head. */
export function herdNeeds(h: HerdForEngine, dateIso: string, settings: BalanceSettings = {}): HerdNeeds {
  const stage = herdStageOn(h, dateIso)
  const notes: string[] = []
  if (h.species === 'cattle') {
    const a: CattleAnimal = {
      class: h.class as CattleAnimal['class'],
      bodyWeightKg: h.bodyWeightKg,
      matureWeightKg: h.matureWeightKg ?? h.bodyWeightKg,
      bcs: h.bcs,
      grazing: h.grazing ?? true,
    }
    if (h.breed) a.breed = h.breed
    if (stage.pregnancyDay !== null) a.pregnancyDay = Math.min(300, stage.pregnancyDay)
    if (h.calfBirthWeightKg != null) a.calfBirthWeightKg = h.calfBirthWeightKg
    if (stage.daysInMilk !== null) {
      a.daysInMilk = stage.daysInMilk
      a.peakMilkKg = h.peakMilkKg ?? DEFAULT_PEAK_MILK_KG
      if (h.peakMilkKg == null) notes.push(`Peak milk taken as ${DEFAULT_PEAK_MILK_KG} kg/day (a default; enter the group's own).`)
    }
    if (h.targetGainKg != null && h.class !== 'cow') a.adgKg = h.targetGainKg
    if (h.environment) {
      a.environment = { tempC: h.environment.tempC, coat: h.environment.coat }
      if (h.environment.windKph != null) a.environment.windKph = h.environment.windKph
      if (h.environment.mud) a.environment.mud = h.environment.mud
    }
    const requirements = cattleRequirements(a, settings.intakeFactor != null ? { intakeFactor: settings.intakeFactor } : undefined)
    return { species: 'cattle', stage, animal: a, requirements, notes }
  }
  const s: SheepAnimal = {
    class: h.class as SheepAnimal['class'],
    bodyWeightKg: h.bodyWeightKg,
    bcs: h.bcs,
    stage: h.class === 'growing-lamb' ? 'maintenance' : (stage.sheepStage ?? 'maintenance'),
  }
  if (h.class === 'ram' && s.stage !== 'flushing') s.stage = 'maintenance'
  if (h.litterSize != null) s.litterSize = h.litterSize as 1 | 2 | 3
  if (h.targetGainKg != null && h.class === 'growing-lamb') s.adgG = h.targetGainKg * 1000
  if (h.environment) notes.push('Cold stress is computed for cattle only; the sheep table has no cold adjustment.')
  const requirements = sheepRequirements(s)
  return { species: 'sheep', stage, animal: s, requirements, notes }
}

export const engineFeedId = (feedId: number) => `feed-${feedId}`
export function feedIdFromEngine(id: string): number | null {
  const m = /^feed-(\d+)$/.exec(id)
  return m ? Number(m[1]) : null
}

export type ExcludedFeed = { feedId: number; name: string; reason: string }
export type FeedRef = { engineId: string; feedId: number | null; name: string; kind: FeedKind | 'field'; role: EngineFeed['role']; dmPct: number; costPerKgDm: number | null; costPerKgAsFed: number | null; labResultId: number | null; cattleOnly: boolean }

export type BuiltProblem = {
  problem: RationProblem
  needs: HerdNeeds
  excluded: ExcludedFeed[]
  feeds: FeedRef[]
  labResultIds: number[]
  notes: string[]
}

/** Copper carried by cattle minerals (300–400 mg/kg) is what makes a cattle-only label matter for sheep (Berger, Univ. of Illinois — read). */
export const CATTLE_ONLY_REASON = 'Labelled for cattle only: cattle minerals and supplements carry copper at levels toxic to sheep, so it is never offered to a sheep group.'

function toEngineFeed(f: BalanceFeed, role: EngineFeed['role']): { feed: EngineFeed; cost: number | null } {
  const e = f.effective
  const feed: EngineFeed = { id: engineFeedId(f.id), name: f.name, role, dmPct: e.dmPct, cpPctDm: e.cpPctDm, tdnPctDm: e.tdnPctDm }
  if (e.caPctDm != null) feed.caPctDm = e.caPctDm
  if (e.pPctDm != null) feed.pPctDm = e.pPctDm
  if (e.cuMgPerKgDm != null) feed.cuMgPerKgDm = e.cuMgPerKgDm
  if (e.nitrateNPpmDm != null) feed.nitrateNPpmDm = e.nitrateNPpmDm
  if (f.isGrain || f.kind === 'grain') feed.isGrain = true
  if (f.isUrea) feed.isUrea = true
  if (f.isLegume) feed.isLegume = true
  if (f.cattleOnly) feed.cattleOnly = true
  const cost = costPerKgDm(f, e.dmPct)
  if (cost != null) feed.costPerKgDm = Math.min(1000, cost)
  if (f.maxKgAsFedPerHeadDay != null) feed.maxKgDm = Math.min(100, (f.maxKgAsFedPerHeadDay * e.dmPct) / 100)
  return { feed, cost }
}

/**
 * The engine's ration problem for a group on a date: base feeds (or the field's components) as 'field' feeds, supplements
 * and minerals on hand; feeds labelled for cattle only are left out for sheep, and feeds not on hand are left out.
 */
export function buildBalanceProblem(input: {
  herd: HerdForEngine
  date: string
  baseFeeds: { feed: BalanceFeed; sharePct?: number | null }[]
  supplements: BalanceFeed[]
  field?: FieldOffer | null
  settings?: BalanceSettings
}): BuiltProblem {
  const settings = input.settings ?? {}
  const needs = herdNeeds(input.herd, input.date, settings)
  const sheep = input.herd.species === 'sheep'
  const excluded: ExcludedFeed[] = []
  const feeds: EngineFeed[] = []
  const refs: FeedRef[] = []
  const labIds = new Set<number>()
  const notes = [...needs.notes]

  const offer: { feedId: string; shareOfDm: number }[] = []
  if (input.field) {
    for (const f of input.field.feeds) {
      feeds.push(f)
      refs.push({ engineId: f.id, feedId: null, name: f.name, kind: 'field', role: f.role, dmPct: f.dmPct, costPerKgDm: f.costPerKgDm ?? null, costPerKgAsFed: null, labResultId: null, cattleOnly: !!f.cattleOnly })
    }
    offer.push(...input.field.fieldOffer)
    for (const id of input.field.labResultIds ?? []) labIds.add(id)
    notes.push(...(input.field.notes ?? []))
  }
  const add = (f: BalanceFeed, role: EngineFeed['role']) => {
    if (sheep && f.cattleOnly) {
      excluded.push({ feedId: f.id, name: f.name, reason: CATTLE_ONLY_REASON })
      return null
    }
    if (role !== 'field' && !f.available) {
      excluded.push({ feedId: f.id, name: f.name, reason: 'Marked as not on hand.' })
      return null
    }
    const { feed, cost } = toEngineFeed(f, role)
    feeds.push(feed)
    refs.push({
      engineId: feed.id, feedId: f.id, name: f.name, kind: f.kind, role, dmPct: f.effective.dmPct, costPerKgDm: cost,
      costPerKgAsFed: cost == null ? null : (cost * f.effective.dmPct) / 100, labResultId: f.effective.labResultId, cattleOnly: f.cattleOnly,
    })
    if (f.effective.labResultId != null) labIds.add(f.effective.labResultId)
    return feed
  }
  const shares = input.baseFeeds.every((b) => b.sharePct != null) && input.baseFeeds.length > 0 && !input.field
  for (const b of input.baseFeeds) {
    const feed = add(b.feed, b.feed.kind === 'mineral' ? 'mineral' : 'field')
    if (feed && shares && feed.role === 'field') offer.push({ feedId: feed.id, shareOfDm: (b.sharePct ?? 0) / 100 })
  }
  for (const s of input.supplements) add(s, s.kind === 'mineral' ? 'mineral' : 'supplement')

  // Offered shares must add up to 1 over what is left (a left-out base feed takes its share with it).
  let fieldOffer: { feedId: string; shareOfDm: number }[] | undefined
  if (offer.length) {
    const total = offer.reduce((a, o) => a + o.shareOfDm, 0)
    fieldOffer = total > 0 ? offer.map((o) => ({ feedId: o.feedId, shareOfDm: o.shareOfDm / total })) : undefined
    if (fieldOffer) {
      // Floating-point sums must land on 1 within the engine's 1e-6.
      const drift = 1 - fieldOffer.reduce((a, o) => a + o.shareOfDm, 0)
      fieldOffer[fieldOffer.length - 1].shareOfDm += drift
    }
  }
  const limits: NonNullable<RationProblem['limits']> = {}
  if (settings.maxGrainSharePct != null) limits.maxGrainShareOfDm = settings.maxGrainSharePct / 100
  const problem: RationProblem = {
    species: input.herd.species,
    requirements: needs.requirements,
    feeds,
    ...(fieldOffer ? { fieldOffer } : {}),
    ...(Object.keys(limits).length ? { limits } : {}),
    context: { pregnant: needs.stage.pregnancyDay !== null },
  }
  return { problem, needs, excluded, feeds: refs, labResultIds: [...labIds].sort((a, b) => a - b), notes }
}
