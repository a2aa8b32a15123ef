// Feeds an operation can use: the shipped reference feeds (read-only) and its own; each with the values a balance would use.
import { Op, QueryTypes, type Sequelize, type Transaction } from 'sequelize'
import { AppError } from '../../errors'
import { Feed, LabResult } from '../../models/nutrition'
import type { User } from '../../models/index'
import { feedCreateSchema, feedUpdateSchema, type EffectiveValues, type FeedValues } from '../../../shared/schemas/nutrition/feeds'
import type { ListQuery } from '../../../shared/schemas/nutrition/common'
import { applyPatch, assertVersion, iso, ordering, paging, parseWith, pickSent, textFilter, type Paged } from './common'
import { markBalancesOutOfDate } from './staleness'

const editable = [
  'name', 'kind', 'dmPct', 'cpPctDm', 'tdnPctDm', 'ndfPctDm', 'adfPctDm', 'caPctDm', 'pPctDm', 'cuMgPerKgDm', 'nitrateNPpmDm',
  'isGrain', 'isUrea', 'isLegume', 'cattleOnly', 'priceAmount', 'priceUnit', 'bagWeightKg', 'available', 'maxKgAsFedPerHeadDay',
  'referenceFeedId', 'sourceTitle', 'sourceDetail', 'notes',
] as const
type OptionalNutrient = 'ndfPctDm' | 'adfPctDm' | 'caPctDm' | 'pPctDm' | 'cuMgPerKgDm' | 'nitrateNPpmDm'

export function feedValues(f: Feed): FeedValues {
  const v = {} as Record<string, unknown>
  for (const k of editable) v[k] = f.get(k) ?? null
  return v as FeedValues
}

/** The latest lab result of each feed in this operation (by sample date, then entry). */
export async function latestLabResults(operationId: number, feedIds: number[], transaction?: Transaction): Promise<Map<number, LabResult>> {
  const map = new Map<number, LabResult>()
  if (!feedIds.length) return map
  const sequelize = LabResult.sequelize!
  const rows = await sequelize.query<{ id: number }>(
    `SELECT DISTINCT ON (feed_id) id FROM lab_results WHERE operation_id = :operationId AND feed_id IN (:feedIds) ORDER BY feed_id, sample_date DESC, id DESC`,
    { replacements: { operationId, feedIds }, type: QueryTypes.SELECT, transaction },
  )
  if (!rows.length) return map
  for (const r of await LabResult.findAll({ where: { id: rows.map((x) => x.id) }, transaction })) map.set(r.feedId!, r)
  return map
}

/** The feed's own values, overlaid by its latest lab result wherever the lab reported a value. */
export function effectiveValues(f: Feed, lab: LabResult | undefined): EffectiveValues {
  const fromLab: string[] = []
  const pick = (k: OptionalNutrient): number | null => {
    const l = lab?.get(k) as number | null | undefined
    if (l != null) {
      fromLab.push(k)
      return l
    }
    return (f.get(k) as number | null) ?? null
  }
  if (lab) fromLab.push('dmPct', 'cpPctDm', 'tdnPctDm')
  return {
    dmPct: lab?.dmPct ?? f.dmPct,
    cpPctDm: lab?.cpPctDm ?? f.cpPctDm,
    tdnPctDm: lab?.tdnPctDm ?? f.tdnPctDm,
    ndfPctDm: pick('ndfPctDm'),
    adfPctDm: pick('adfPctDm'),
    caPctDm: pick('caPctDm'),
    pPctDm: pick('pPctDm'),
    cuMgPerKgDm: pick('cuMgPerKgDm'),
    nitrateNPpmDm: pick('nitrateNPpmDm'),
    labResultId: lab?.id ?? null,
    labResultVersion: lab?.version ?? null,
    labSampleDate: lab?.sampleDate ?? null,
    fromLab,
  }
}

export function feedView(f: Feed, lab?: LabResult) {
  return {
    id: f.id,
    operationId: f.operationId,
    isReference: f.operationId === null,
    referenceKey: f.referenceKey,
    provenance: f.provenance,
    ...feedValues(f),
    version: f.version,
    effective: effectiveValues(f, lab),
    createdAt: iso(f.createdAt),
    updatedAt: iso(f.updatedAt),
  }
}
export type FeedView = ReturnType<typeof feedView>

/** Feeds visible to the operation: its own and the reference set. */
const visible = (operationId: number) => ({ [Op.or]: [{ operationId }, { operationId: null }] })

export async function listFeeds(
  operationId: number,
  q: ListQuery & { scope: 'all' | 'own' | 'reference'; kind?: string; species?: 'cattle' | 'sheep' },
): Promise<Paged<FeedView>> {
  const scope = q.scope === 'own' ? { operationId } : q.scope === 'reference' ? { operationId: null } : visible(operationId)
  const where = {
    [Op.and]: [scope, q.kind ? { kind: q.kind } : {}, q.species === 'sheep' ? { cattleOnly: false } : {}, textFilter(q.q, ['name', 'sourceTitle']) ?? {}],
  }
  const { rows, count } = await Feed.findAndCountAll({
    where,
    order: ordering(q, ['name', 'kind', 'dmPct', 'cpPctDm', 'tdnPctDm', 'priceAmount', 'updatedAt'], 'name'),
    ...paging(q),
  })
  const labs = await latestLabResults(operationId, rows.map((r) => r.id))
  return { items: rows.map((r) => feedView(r, labs.get(r.id))), total: count, page: q.page, pageSize: q.pageSize }
}

export async function findVisibleFeed(operationId: number, id: number, transaction?: Transaction): Promise<Feed> {
  const f = await Feed.findOne({ where: { id, ...visible(operationId) }, transaction })
  if (!f) throw AppError.notFound('Feed')
  return f
}

export async function getFeed(operationId: number, id: number) {
  const f = await findVisibleFeed(operationId, id)
  const labs = await latestLabResults(operationId, [f.id])
  return feedView(f, labs.get(f.id))
}

/** Feeds for a balance, by id, with effective values; unknown ids are a 400 naming the list they came from. */
export async function feedsForBalance(operationId: number, ids: number[], field: string, transaction?: Transaction) {
  if (!ids.length) return new Map<number, FeedView>()
  const rows = await Feed.findAll({ where: { id: ids, ...visible(operationId) }, transaction })
  const found = new Set(rows.map((r) => r.id))
  const missing = ids.map((id, i) => ({ id, i })).filter((x) => !found.has(x.id))
  if (missing.length) {
    throw AppError.badRequest(`No such feed in this operation: ${missing.map((m) => m.id).join(', ')}.`, missing.map((m) => ({ field: `${field}.${m.i}`, message: 'No such feed in this operation.' })))
  }
  const labs = await latestLabResults(operationId, ids, transaction)
  return new Map(rows.map((r) => [r.id, feedView(r, labs.get(r.id))]))
}

function readOnly(): never {
  throw new AppError(403, 'read_only', 'Reference feeds are read-only book values. Copy one into your feeds to set a price or change a value.')
}

export async function createFeed(operationId: number, user: User, body: unknown) {
  const v = parseWith(feedCreateSchema, body)
  if (v.referenceFeedId != null) await findVisibleFeed(operationId, v.referenceFeedId)
  const f = await Feed.create({ ...nulls(v), operationId, referenceKey: null, provenance: null, createdBy: user.id, updatedBy: user.id } as never)
  return feedView(f)
}

function nulls(v: FeedValues) {
  const out: Record<string, unknown> = { ...v }
  for (const k of editable) if (out[k] === undefined) out[k] = null
  return out
}

export async function updateFeed(sequelize: Sequelize, operationId: number, user: User, id: number, body: unknown) {
  const patch = parseWith(feedUpdateSchema, body)
  return sequelize.transaction(async (transaction) => {
    const f = await Feed.findOne({ where: { id, ...visible(operationId) }, transaction, lock: transaction.LOCK.UPDATE })
    if (!f) throw AppError.notFound('Feed')
    if (f.operationId === null) readOnly()
    const { version, ...changes } = patch
    assertVersion(f, version, 'feed', () => feedView(f), pickSent(changes, body))
    const merged = parseWith(feedCreateSchema, applyPatch(feedValues(f), changes, body))
    f.set({ ...nulls(merged), version: f.version + 1, updatedBy: user.id } as never)
    await f.save({ transaction })
    await markBalancesOutOfDate(operationId, { feedIds: [f.id] }, `Feed "${f.name}" was edited.`, transaction)
    const labs = await latestLabResults(operationId, [f.id], transaction)
    return feedView(f, labs.get(f.id))
  })
}

export async function deleteFeed(sequelize: Sequelize, operationId: number, id: number) {
  await sequelize.transaction(async (transaction) => {
    const f = await Feed.findOne({ where: { id, ...visible(operationId) }, transaction })
    if (!f) throw AppError.notFound('Feed')
    if (f.operationId === null) readOnly()
    await markBalancesOutOfDate(operationId, { feedIds: [f.id] }, `Feed "${f.name}" was deleted; re-running leaves it out.`, transaction)
    await f.destroy({ transaction })
  })
}
