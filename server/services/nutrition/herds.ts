// Herd groups of an operation: list, read, create, update (versioned; a change marks the group's balances out of date), delete.
import type { Sequelize } from 'sequelize'
import { AppError } from '../../errors'
import { Herd } from '../../models/nutrition'
import type { User } from '../../models/index'
import { herdCreateSchema, herdUpdateSchema, type HerdValues } from '../../../shared/schemas/nutrition/herds'
import type { ListQuery } from '../../../shared/schemas/nutrition/common'
import { herdNeeds } from '../../../shared/adapters/nutrition/problem'
import { applyPatch, assertVersion, iso, ordering, paging, parseWith, pickSent, textFilter, todayIso, type Paged } from './common'
import { markBalancesOutOfDate } from './staleness'

const editable = [
  'name', 'species', 'class', 'headCount', 'bodyWeightKg', 'matureWeightKg', 'bcs', 'breed', 'expectedBirthDate', 'lastBirthDate',
  'restStage', 'litterSize', 'peakMilkKg', 'calfBirthWeightKg', 'targetGainKg', 'grazing', 'environment', 'notes',
] as const

export function herdValues(h: Herd): HerdValues {
  const v = {} as Record<string, unknown>
  for (const k of editable) v[k] = h.get(k) ?? null
  v.grazing = h.grazing
  return v as HerdValues
}

export function herdView(h: Herd) {
  return { id: h.id, operationId: h.operationId, ...herdValues(h), version: h.version, createdAt: iso(h.createdAt), updatedAt: iso(h.updatedAt) }
}
export type HerdView = ReturnType<typeof herdView>

export async function listHerds(operationId: number, q: ListQuery & { species?: 'cattle' | 'sheep' }): Promise<Paged<HerdView>> {
  const where = { operationId, ...(q.species ? { species: q.species } : {}), ...(textFilter(q.q, ['name', 'class']) ?? {}) }
  const { rows, count } = await Herd.findAndCountAll({
    where,
    order: ordering(q, ['name', 'species', 'class', 'headCount', 'bodyWeightKg', 'bcs', 'expectedBirthDate', 'updatedAt'], 'name'),
    ...paging(q),
  })
  return { items: rows.map(herdView), total: count, page: q.page, pageSize: q.pageSize }
}

export async function findHerd(operationId: number, id: number): Promise<Herd> {
  const h = await Herd.findOne({ where: { id, operationId } })
  if (!h) throw AppError.notFound('Herd group')
  return h
}

export async function createHerd(operationId: number, user: User, body: unknown) {
  const v = parseWith(herdCreateSchema, body)
  const h = await Herd.create({ ...normalise(v), operationId, createdBy: user.id, updatedBy: user.id } as never)
  return herdView(h)
}

function normalise(v: HerdValues) {
  const out: Record<string, unknown> = { ...v }
  for (const k of editable) if (out[k] === undefined) out[k] = null
  out.grazing = v.grazing ?? true
  return out
}

export async function updateHerd(sequelize: Sequelize, operationId: number, user: User, id: number, body: unknown) {
  const patch = parseWith(herdUpdateSchema, body)
  return sequelize.transaction(async (transaction) => {
    const h = await Herd.findOne({ where: { id, operationId }, transaction, lock: transaction.LOCK.UPDATE })
    if (!h) throw AppError.notFound('Herd group')
    const { version, ...changes } = patch
    assertVersion(h, version, 'herd group', () => herdView(h), pickSent(changes, body))
    const merged = parseWith(herdCreateSchema, applyPatch(herdValues(h), changes, body))
    h.set({ ...normalise(merged), version: h.version + 1, updatedBy: user.id } as never)
    await h.save({ transaction })
    await markBalancesOutOfDate(operationId, { herdId: h.id }, `Herd group "${h.name}" was edited.`, transaction)
    return herdView(h)
  })
}

export async function deleteHerd(operationId: number, id: number) {
  const h = await findHerd(operationId, id)
  await h.destroy()
}

/** The group's daily needs per head on a date, from the engine (the same computation the Herds screen runs live). */
export async function herdRequirements(operationId: number, id: number, date = todayIso()) {
  const h = await findHerd(operationId, id)
  const n = herdNeeds(herdValues(h), date)
  return { herdId: h.id, date, stage: n.stage, requirements: n.requirements, notes: n.notes }
}
