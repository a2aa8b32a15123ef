// Lab results: entry on either basis (stored on DM), edits with history and a version check, delete; every change marks the balances that read it.
import { Op, type Sequelize, type Transaction } from 'sequelize'
import { AppError } from '../../errors'
import { Feed, LabResult, LabResultHistory, type LabChange } from '../../models/nutrition'
import { Field, FieldComponent } from '../../models/grazing'
import type { User } from '../../models/index'
import {
  labResultCreateSchema,
  labResultUpdateSchema,
  labStoredKeys,
  labStoredToDmEntry,
  labValueKeys,
  labValuesToDm,
  type LabResultValues,
} from '../../../shared/schemas/nutrition/labResults'
import type { ListQuery } from '../../../shared/schemas/nutrition/common'
import { actor, actors, assertVersion, iso, ordering, paging, parseWith, pickSent, textFilter, type Paged } from './common'
import { markBalancesOutOfDate } from './staleness'

type Meta = Pick<LabResultValues, 'feedId' | 'fieldId' | 'component' | 'sampleDate' | 'labName' | 'sampleRef' | 'notes'>
const metaKeys = ['feedId', 'fieldId', 'component', 'sampleDate', 'labName', 'sampleRef', 'notes'] as const
/** Keys whose old → new values the history keeps. */
const trackedKeys = [...metaKeys, 'enteredBasis', 'nitrateForm', ...labStoredKeys] as const

export async function labView(r: LabResult, opts: { history?: boolean; feedName?: string | null; transaction?: Transaction } = {}) {
  const transaction = opts.transaction
  const hist = opts.history ? await LabResultHistory.findAll({ where: { labResultId: r.id }, order: [['version', 'DESC']], transaction }) : []
  const names = await actors([r.createdBy, r.updatedBy])
  let feedName = opts.feedName
  if (feedName === undefined) feedName = r.feedId ? ((await Feed.findByPk(r.feedId, { attributes: ['name'], transaction }))?.name ?? null) : null
  return {
    ...plain(r, feedName ?? null, names),
    ...(opts.history
      ? { history: hist.map((h) => ({ version: h.version, changedAt: iso(h.createdAt), by: { id: h.userId, name: h.userName }, changes: h.changes })) }
      : {}),
  }
}

function plain(r: LabResult, feedName: string | null, names: Map<number, string>) {
  return {
    id: r.id,
    operationId: r.operationId,
    feedId: r.feedId,
    feedName,
    fieldId: r.fieldId,
    component: r.component,
    sampleDate: r.sampleDate,
    labName: r.labName,
    sampleRef: r.sampleRef,
    enteredBasis: r.enteredBasis,
    nitrateForm: r.nitrateForm,
    dmPct: r.dmPct,
    cpPctDm: r.cpPctDm,
    tdnPctDm: r.tdnPctDm,
    tdnEstimated: r.tdnEstimated,
    adfPctDm: r.adfPctDm,
    ndfPctDm: r.ndfPctDm,
    caPctDm: r.caPctDm,
    pPctDm: r.pPctDm,
    nitrateNPpmDm: r.nitrateNPpmDm,
    cuMgPerKgDm: r.cuMgPerKgDm,
    notes: r.notes,
    version: r.version,
    createdBy: actor(names, r.createdBy),
    updatedBy: actor(names, r.updatedBy),
    createdAt: iso(r.createdAt),
    updatedAt: iso(r.updatedAt),
  }
}
export type LabView = ReturnType<typeof plain> & { history?: unknown[] }

export async function listLabResults(operationId: number, q: ListQuery & { feedId?: number; fieldId?: number }): Promise<Paged<LabView>> {
  const where = {
    [Op.and]: [{ operationId }, q.feedId ? { feedId: q.feedId } : {}, q.fieldId ? { fieldId: q.fieldId } : {}, textFilter(q.q, ['labName', 'sampleRef', 'notes']) ?? {}],
  }
  const { rows, count } = await LabResult.findAndCountAll({
    where,
    include: [{ model: Feed, as: 'feed', attributes: ['name'] }],
    order: ordering(q, ['sampleDate', 'labName', 'dmPct', 'cpPctDm', 'tdnPctDm', 'updatedAt', 'version'], 'sampleDate'),
    ...paging(q),
  })
  const names = await actors(rows.flatMap((r) => [r.createdBy, r.updatedBy]))
  return {
    items: rows.map((r) => plain(r, (r as unknown as { feed?: Feed }).feed?.name ?? null, names)),
    total: count,
    page: q.page,
    pageSize: q.pageSize,
  }
}

export async function findLabResult(operationId: number, id: number, transaction?: Transaction, lock = false) {
  const r = await LabResult.findOne({ where: { id, operationId }, transaction, ...(lock && transaction ? { lock: transaction.LOCK.UPDATE } : {}) })
  if (!r) throw AppError.notFound('Lab result')
  return r
}

/** The sampled feed must be one the operation can see; the field must be the operation's. */
export async function checkTarget(operationId: number, v: Pick<Meta, 'feedId' | 'fieldId'>, transaction?: Transaction) {
  if (v.feedId != null) {
    const f = await Feed.findOne({ where: { id: v.feedId, [Op.or]: [{ operationId }, { operationId: null }] }, transaction, attributes: ['id', 'name'] })
    if (!f) throw AppError.badRequest('No such feed in this operation.', [{ field: 'feedId', message: 'No such feed in this operation.' }])
    return f.name
  }
  if (v.fieldId != null) {
    const f = await Field.findOne({ where: { id: v.fieldId, operationId }, transaction, attributes: ['id'] })
    if (!f) throw AppError.badRequest('No such field in this operation.', [{ field: 'fieldId', message: 'No such field in this operation.' }])
  }
  return null
}

/** Row values to store: meta fields as given, nutrients on a DM basis. */
export function storedRow(v: LabResultValues) {
  return {
    feedId: v.feedId ?? null,
    fieldId: v.fieldId ?? null,
    component: v.component ?? null,
    sampleDate: v.sampleDate,
    labName: v.labName,
    sampleRef: v.sampleRef ?? null,
    notes: v.notes ?? null,
    enteredBasis: v.basis,
    nitrateForm: v.nitrateForm ?? null,
    ...labValuesToDm(v),
  }
}

async function markFor(operationId: number, r: Pick<LabResult, 'id' | 'feedId' | 'fieldId'>, reason: string, transaction: Transaction) {
  return markBalancesOutOfDate(
    operationId,
    { labResultIds: [r.id], feedIds: r.feedId ? [r.feedId] : [], fieldId: r.fieldId ?? undefined },
    reason,
    transaction,
  )
}

function describe(r: Pick<LabResult, 'labName' | 'sampleDate'>) {
  return `lab result from ${r.labName} of ${r.sampleDate}`
}

/**
 * A field component reads its quality from one lab result (Fields keeps the link); a newer sample of that component
 * becomes the one it reads, so a new analysis reaches the field's balances.
 */
export async function linkNewestToComponent(r: Pick<LabResult, 'id' | 'fieldId' | 'component' | 'sampleDate' | 'operationId'>, transaction?: Transaction) {
  if (r.fieldId == null || r.component == null) return
  const comp = await FieldComponent.findOne({ where: { fieldId: r.fieldId, kind: r.component }, transaction })
  if (!comp) return
  if (comp.labResultId != null && comp.labResultId !== r.id) {
    const linked = await LabResult.findOne({ where: { id: comp.labResultId, operationId: r.operationId }, transaction, attributes: ['id', 'sampleDate'] })
    if (linked && linked.sampleDate > r.sampleDate) return
  }
  if (comp.labResultId !== r.id) await comp.update({ labResultId: r.id }, { transaction })
}

export async function createLabResult(sequelize: Sequelize, operationId: number, user: User, body: unknown) {
  const v = parseWith(labResultCreateSchema, body)
  return sequelize.transaction(async (transaction) => {
    const feedName = await checkTarget(operationId, v, transaction)
    const r = await LabResult.create({ ...storedRow(v), operationId, uploadId: null, createdBy: user.id, updatedBy: user.id }, { transaction })
    await linkNewestToComponent(r, transaction)
    const affected = await markFor(operationId, r, `A new ${describe(r)} was added.`, transaction)
    return { ...(await labView(r, { feedName, transaction })), affectedBalances: affected }
  })
}

/**
 * Applies an edit: values on the edit's basis (DM unless it says as-fed) over the stored record, stored on DM again; a stale
 * version is a 409 with both versions; each changed value goes to the history as old → new with who and when.
 */
export async function updateLabResult(sequelize: Sequelize, operationId: number, user: User, id: number, body: unknown) {
  const patch = parseWith(labResultUpdateSchema, body)
  const sent = pickSent(patch, body)
  return sequelize.transaction(async (transaction) => {
    const r = await findLabResult(operationId, id, transaction, true)
    const current = await labView(r, { transaction })
    assertVersion(r, patch.version, 'lab result', () => current, sent)

    // Start from the stored values on the edit's basis, so untouched values keep their meaning.
    const basis = (sent.basis as 'dm' | 'as-fed' | undefined) ?? 'dm'
    const base: Record<string, unknown> = { ...labStoredToDmEntry(r), nitrateForm: r.nitrateNPpmDm == null ? r.nitrateForm : 'NO3-N' }
    if (basis === 'as-fed') {
      for (const k of labValueKeys) if (k !== 'dmPct' && base[k] != null) base[k] = (base[k] as number) * (r.dmPct / 100)
    }
    base.basis = basis
    for (const k of metaKeys) base[k] = r.get(k)
    for (const [k, val] of Object.entries(sent)) base[k] = val
    const merged = parseWith(labResultCreateSchema, base)
    const feedName = await checkTarget(operationId, merged, transaction)
    const next = storedRow(merged)
    // The basis a result was first reported on stays unless the edit re-states it.
    next.enteredBasis = (sent.basis as 'dm' | 'as-fed' | undefined) ?? r.enteredBasis
    next.nitrateForm = (sent.nitrateForm as typeof r.nitrateForm | undefined) ?? (next.nitrateNPpmDm == null ? null : r.nitrateForm ?? 'NO3-N')

    const changes: LabChange[] = []
    for (const k of trackedKeys) {
      const from = r.get(k) ?? null
      const to = (next as Record<string, unknown>)[k] ?? null
      if (!same(from, to)) changes.push({ field: k, from, to })
    }
    if (!changes.length) return { ...(await labView(r, { history: true, feedName, transaction })), affectedBalances: [] as number[] }
    const before = { feedId: r.feedId, fieldId: r.fieldId }
    r.set({ ...next, version: r.version + 1, updatedBy: user.id })
    await r.save({ transaction })
    await LabResultHistory.create({ labResultId: r.id, version: r.version, userId: user.id, userName: user.name, changes }, { transaction })
    const list = changes.map((c) => c.field).join(', ')
    const affected = await markFor(operationId, r, `The ${describe(r)} was edited (${list}).`, transaction)
    if (before.feedId !== r.feedId || before.fieldId !== r.fieldId) {
      affected.push(...(await markFor(operationId, { id: r.id, ...before }, `A ${describe(r)} was moved to another feed.`, transaction)))
    }
    return { ...(await labView(r, { history: true, feedName, transaction })), affectedBalances: [...new Set(affected)] }
  })
}

function same(a: unknown, b: unknown) {
  if (typeof a === 'number' && typeof b === 'number') return Math.abs(a - b) <= 1e-9 * Math.max(1, Math.abs(a))
  return a === b
}

export async function deleteLabResult(sequelize: Sequelize, operationId: number, id: number) {
  await sequelize.transaction(async (transaction) => {
    const r = await findLabResult(operationId, id, transaction, true)
    await markFor(operationId, r, `The ${describe(r)} was deleted.`, transaction)
    await r.destroy({ transaction })
  })
}
