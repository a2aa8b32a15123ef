// The Balance screen's state: what the user picks, a live re-balance in the browser with the same engine as the server, and the stored runs.
import { computed, reactive, ref, shallowRef, watch } from 'vue'
import { balancesApi, feedsApi, herdsApi } from '@/api/nutrition'
import { fieldsApi } from '@/api/grazing'
import { balanceInBrowser } from './engine'
import type { Herd } from '@shared/schemas/nutrition/herds'
import type { FeedRecord } from '@shared/schemas/nutrition/feeds'
import type { BalanceRecord, BalanceSelection } from '@shared/schemas/nutrition/balances'
import { buildBalanceProblem, type BalanceFeed, type ExcludedFeed, type FeedRef, type FieldOffer } from '@shared/adapters/nutrition/problem'
import { supplementPlan, type SupplementPlan } from '@shared/adapters/nutrition/plan'
import { cautionsFor, type Caution } from '@shared/schemas/nutrition/cautions'
import type { BalanceResult, Feed as EngineFeed } from '@shared/engine/nutrition/ration/schema'
import type { Requirements } from '@shared/engine/nutrition/requirements'
import type { HerdStage } from '@shared/schemas/nutrition/herds'

export type BalanceView = {
  result: BalanceResult
  feeds: FeedRef[]
  problemFeeds: EngineFeed[]
  excluded: ExcludedFeed[]
  headCount: number
  herdName: string
  species: 'cattle' | 'sheep'
  stage: HerdStage
  requirements: Requirements
  notes: string[]
  onField: boolean
  fieldName: string | null
  plan: SupplementPlan
  cautions: Caution[]
}

type Selection = {
  herdId: number | null
  date: string
  source: 'field' | 'feeds'
  fieldId: number | null
  baseFeeds: { feedId: number; sharePct: number | null }[]
  supplementIds: number[]
  maxGrainSharePct: number | null
  intakeFactor: number | null
}

function view(args: { result: BalanceResult; feeds: FeedRef[]; problemFeeds: EngineFeed[]; excluded: ExcludedFeed[]; herd: { name: string; headCount: number; species: 'cattle' | 'sheep'; litterSize?: number | null }; stage: HerdStage; requirements: Requirements; notes: string[]; fieldName: string | null }): BalanceView {
  return {
    ...args,
    headCount: args.herd.headCount,
    herdName: args.herd.name,
    species: args.herd.species,
    onField: !!args.fieldName,
    plan: supplementPlan(args.result, args.feeds, args.herd.headCount),
    cautions: cautionsFor({
      species: args.herd.species,
      feeds: args.problemFeeds,
      result: args.result,
      onSorghumField: !!args.fieldName,
      lateGestationMultiples: args.herd.species === 'sheep' && (args.herd.litterSize ?? 1) > 1 && args.stage.sheepStage === 'late-gestation',
    }),
  }
}

/** The screen's view of a stored run (its inputs and the server's result). */
export function viewOfStored(b: BalanceRecord): BalanceView | null {
  const v = b.latest
  if (!v) return null
  const i = v.inputs as { herd: { name: string; headCount: number; species: 'cattle' | 'sheep'; litterSize?: number | null }; field: { name: string } | null; problem: { feeds: EngineFeed[] }; feeds: FeedRef[]; excluded: ExcludedFeed[]; stage: HerdStage; requirements: Requirements; notes: string[] }
  return view({ result: v.result as unknown as BalanceResult, feeds: i.feeds, problemFeeds: i.problem.feeds, excluded: i.excluded, herd: i.herd, stage: i.stage, requirements: i.requirements, notes: i.notes, fieldName: i.field?.name ?? null })
}

export function useBalance(opId: () => number) {
  const today = new Date().toISOString().slice(0, 10)
  const herds = shallowRef<Herd[]>([])
  const feeds = shallowRef<FeedRecord[]>([])
  const fields = shallowRef<{ id: number; name: string; legume: string }[]>([])
  const balances = shallowRef<BalanceRecord[]>([])
  const loadState = ref<'idle' | 'loading' | 'done' | 'error'>('idle')
  const loadError = shallowRef<Error | null>(null)

  const sel = reactive<Selection>({ herdId: null, date: today, source: 'feeds', fieldId: null, baseFeeds: [], supplementIds: [], maxGrainSharePct: null, intakeFactor: null })
  const offer = shallowRef<(FieldOffer & { field: { id: number; name: string } }) | null>(null)
  const offerError = shallowRef<Error | null>(null)

  const liveState = ref<'idle' | 'computing' | 'done' | 'error'>('idle')
  const liveError = shallowRef<Error | null>(null)
  const live = shallowRef<BalanceView | null>(null)

  const saved = shallowRef<BalanceRecord | null>(null)
  const dirty = ref(false)
  const saveState = ref<'idle' | 'saving' | 'done' | 'error'>('idle')
  const saveError = shallowRef<Error | null>(null)

  const herd = computed(() => herds.value.find((h) => h.id === sel.herdId) ?? null)
  const feedById = computed(() => new Map(feeds.value.map((f) => [f.id, f])))

  async function loadAll() {
    loadState.value = 'loading'
    try {
      const [h, own, refs, b] = await Promise.all([
        herdsApi.list(opId(), { pageSize: 500, sort: 'name' }),
        feedsApi.list(opId(), { scope: 'own', pageSize: 500, sort: 'name' }),
        feedsApi.list(opId(), { scope: 'reference', pageSize: 500, sort: 'name' }),
        balancesApi.list(opId(), { pageSize: 200, sort: 'updatedAt', dir: 'desc' }),
      ])
      herds.value = h.items
      feeds.value = [...own.items, ...refs.items]
      balances.value = b.items
      try {
        fields.value = (await fieldsApi.list(opId())).items.map((f) => ({ id: f.id, name: f.name, legume: f.legume }))
      } catch {
        fields.value = []
      }
      loadState.value = 'done'
    } catch (e) {
      loadError.value = e as Error
      loadState.value = 'error'
    }
  }
  async function reloadBalances() {
    balances.value = (await balancesApi.list(opId(), { pageSize: 200, sort: 'updatedAt', dir: 'desc' })).items
  }

  const toBalanceFeed = (f: FeedRecord): BalanceFeed => ({
    id: f.id, name: f.name, kind: f.kind, effective: f.effective, isGrain: f.isGrain, isUrea: f.isUrea, isLegume: f.isLegume, cattleOnly: f.cattleOnly, available: f.available,
    priceAmount: f.priceAmount, priceUnit: f.priceUnit, bagWeightKg: f.bagWeightKg, maxKgAsFedPerHeadDay: f.maxKgAsFedPerHeadDay,
  })

  /** The selection as the API takes it. */
  const selection = computed<BalanceSelection | null>(() => {
    if (!sel.herdId) return null
    return {
      name: saved.value?.name ?? null,
      herdId: sel.herdId,
      date: sel.date,
      fieldId: sel.source === 'field' ? sel.fieldId : null,
      baseFeeds: sel.source === 'feeds' ? sel.baseFeeds.map((b) => ({ feedId: b.feedId, sharePct: b.sharePct })) : [],
      supplementIds: [...sel.supplementIds],
      settings: { maxGrainSharePct: sel.maxGrainSharePct, intakeFactor: sel.intakeFactor },
    }
  })

  watch(
    () => [sel.source, sel.fieldId, sel.date] as const,
    async ([source, fieldId, date]) => {
      offer.value = null
      offerError.value = null
      if (source !== 'field' || !fieldId) return
      try {
        offer.value = await balancesApi.fieldOffer(opId(), fieldId, date)
      } catch (e) {
        offerError.value = e as Error
      }
    },
  )

  let seq = 0
  async function rebalance() {
    const h = herd.value
    if (!h || loadState.value !== 'done') return
    if (sel.source === 'field' && !offer.value) return
    if (sel.source === 'feeds' && !sel.baseFeeds.length) {
      live.value = null
      liveState.value = 'idle'
      return
    }
    const mine = ++seq
    liveState.value = 'computing'
    liveError.value = null
    try {
      const built = buildBalanceProblem({
        herd: h,
        date: sel.date,
        baseFeeds: sel.source === 'feeds' ? sel.baseFeeds.flatMap((b) => (feedById.value.get(b.feedId) ? [{ feed: toBalanceFeed(feedById.value.get(b.feedId)!), sharePct: b.sharePct }] : [])) : [],
        supplements: sel.supplementIds.flatMap((id) => (feedById.value.get(id) ? [toBalanceFeed(feedById.value.get(id)!)] : [])),
        field: sel.source === 'field' ? offer.value : null,
        settings: { maxGrainSharePct: sel.maxGrainSharePct, intakeFactor: sel.intakeFactor },
      })
      const result = await balanceInBrowser(built.problem)
      if (mine !== seq) return
      live.value = view({ result, feeds: built.feeds, problemFeeds: built.problem.feeds, excluded: built.excluded, herd: h, stage: built.needs.stage, requirements: built.needs.requirements, notes: built.notes, fieldName: sel.source === 'field' ? (offer.value?.field.name ?? null) : null })
      liveState.value = 'done'
    } catch (e) {
      if (mine !== seq) return
      liveError.value = e instanceof Error ? e : new Error(String(e))
      liveState.value = 'error'
    }
  }
  let timer: ReturnType<typeof setTimeout> | null = null
  const schedule = () => {
    if (timer) clearTimeout(timer)
    timer = setTimeout(() => void rebalance(), 120)
  }
  // A change the user makes leaves the stored run for the live preview; data arriving (a field's offer) only re-computes.
  watch(
    () => JSON.stringify(sel),
    () => {
      if (!applying) dirty.value = true
      schedule()
    },
  )
  watch([offer, loadState], schedule)

  /** The stored run as the screen shows it. */
  const stored = computed<BalanceView | null>(() => (saved.value ? viewOfStored(saved.value) : null))
  /** What the screen shows: the stored run until an input changes, then the live preview. */
  const showing = computed<{ kind: 'stored' | 'live'; view: BalanceView } | null>(() => {
    if (saved.value && !dirty.value && stored.value) return { kind: 'stored', view: stored.value }
    if (live.value) return { kind: 'live', view: live.value }
    return stored.value ? { kind: 'stored', view: stored.value } : null
  })

  let applying = false
  function applySelection(s: Record<string, unknown>) {
    applying = true
    const x = s as { herdId: number; date: string; fieldId?: number | null; baseFeeds?: { feedId: number; sharePct?: number | null }[]; supplementIds?: number[]; settings?: { maxGrainSharePct?: number | null; intakeFactor?: number | null } }
    sel.herdId = x.herdId
    sel.date = x.date
    sel.fieldId = x.fieldId ?? null
    sel.source = x.fieldId ? 'field' : 'feeds'
    sel.baseFeeds = (x.baseFeeds ?? []).map((b) => ({ feedId: b.feedId, sharePct: b.sharePct ?? null }))
    sel.supplementIds = [...(x.supplementIds ?? [])]
    sel.maxGrainSharePct = x.settings?.maxGrainSharePct ?? null
    sel.intakeFactor = x.settings?.intakeFactor ?? null
    // The field offer and the watchers settle on the next tick; the stored run stays on screen until the user changes something.
    setTimeout(() => {
      applying = false
    }, 0)
  }

  async function open(id: number, version?: number) {
    const b = await balancesApi.get(opId(), id, version)
    saved.value = b
    dirty.value = false
    if (b.latest) applySelection(b.latest.selection)
    return b
  }
  function startNew() {
    saved.value = null
    dirty.value = true
  }

  async function save() {
    const s = selection.value
    if (!s) return
    saveState.value = 'saving'
    saveError.value = null
    try {
      const b = saved.value ? await balancesApi.rerun(opId(), saved.value.id, { ...s, version: saved.value.version }) : await balancesApi.create(opId(), s)
      saved.value = b
      dirty.value = false
      saveState.value = 'done'
      await reloadBalances()
    } catch (e) {
      saveError.value = e as Error
      saveState.value = 'error'
    }
  }

  const rerunState = ref<'idle' | 'running' | 'done' | 'error'>('idle')
  const rerunError = shallowRef<Error | null>(null)
  async function rerunOutOfDate(ids?: number[]) {
    rerunState.value = 'running'
    rerunError.value = null
    try {
      const r = await balancesApi.rerunOutOfDate(opId(), ids)
      await reloadBalances()
      if (saved.value) await open(saved.value.id)
      rerunState.value = 'done'
      return r
    } catch (e) {
      rerunError.value = e as Error
      rerunState.value = 'error'
    }
  }

  return {
    today, herds, feeds, fields, balances, loadState, loadError, sel, offer, offerError, herd, live, liveState, liveError, saved, dirty, stored, showing,
    saveState, saveError, rerunState, rerunError, selection, loadAll, open, startNew, save, rerunOutOfDate, reloadBalances, rebalance,
  }
}
