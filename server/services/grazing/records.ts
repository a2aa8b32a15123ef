// The crew's "moved" and "fed" records: recorded by anyone who may write records, changed only by their author or the owner.
import { Op, type Sequelize, type WhereOptions } from 'sequelize'
import { AppError } from '../../errors'
import { GrazingPlan, GrazingRecord, Field } from '../../models/grazing'
import { User } from '../../models/index'
import type { Role } from '../../../shared/schemas/roles'
import type { GrazingRecordJson } from '../../../shared/schemas/grazing/records'
import type { recordCreateSchema, recordListQuerySchema, recordUpdateSchema } from '../../../shared/schemas/grazing/records'
import type { z } from 'zod'
import { getField } from './fields'
import { getPlan } from './plans'
import { evaluatePlan, planDay } from '../../../shared/adapters/grazing/planEval'
import { todayIso } from '../dates'

type RecordCreate = z.output<typeof recordCreateSchema>
type RecordUpdate = z.output<typeof recordUpdateSchema>
type RecordQuery = z.output<typeof recordListQuerySchema>

function bad(field: string, message: string) {
  return new AppError(400, 'validation_failed', `The request body has 1 invalid field: ${field}.`, [{ field, message }])
}

/** A record more than a day ahead of the server's clock is a typing slip, not a plan. */
const FUTURE_SLACK_MS = 24 * 3600 * 1000

export async function recordsJson(rows: GrazingRecord[]): Promise<GrazingRecordJson[]> {
  const userIds = [...new Set(rows.map((r) => r.recordedBy).filter((x): x is number => x !== null))]
  const planIds = [...new Set(rows.map((r) => r.planId).filter((x): x is number => x !== null))]
  const [users, plans] = await Promise.all([
    userIds.length ? User.findAll({ where: { id: { [Op.in]: userIds } }, attributes: ['id', 'name'] }) : [],
    planIds.length ? GrazingPlan.findAll({ where: { id: { [Op.in]: planIds } }, attributes: ['id', 'groupName', 'fieldId'], include: [{ model: Field, as: 'field', attributes: ['id', 'name'] }] }) : [],
  ])
  const names = new Map(users.map((u) => [u.id, u.name]))
  const planMap = new Map(plans.map((p) => [p.id, p]))
  return rows.map((r) => {
    const p = r.planId !== null ? planMap.get(r.planId) : undefined
    return {
      id: r.id,
      operationId: r.operationId,
      planId: r.planId,
      kind: r.kind,
      recordedAt: r.recordedAt.toISOString(),
      recordedBy: { id: r.recordedBy, name: r.recordedBy !== null ? (names.get(r.recordedBy) ?? 'a former member') : 'a former member' },
      distanceM: r.distanceM,
      feedLabel: r.feedLabel,
      amountKgAsFed: r.amountKgAsFed,
      note: r.note,
      groupName: p?.groupName ?? null,
      fieldName: p?.field?.name ?? null,
      createdAt: r.createdAt.toISOString(),
    }
  })
}

/** Start and end of a calendar day in the server's time zone (a farm's day). */
export function dayBounds(date: string): [Date, Date] {
  const start = new Date(`${date}T00:00:00`)
  const end = new Date(start)
  end.setDate(end.getDate() + 1)
  return [start, end]
}

export async function listRecords(operationId: number, q: RecordQuery): Promise<GrazingRecordJson[]> {
  const where: WhereOptions = { operationId, ...(q.planId ? { planId: q.planId } : {}), ...(q.kind ? { kind: q.kind } : {}) }
  if (q.date) {
    const [a, b] = dayBounds(q.date)
    Object.assign(where, { recordedAt: { [Op.gte]: a, [Op.lt]: b } })
  }
  const rows = await GrazingRecord.findAll({ where, order: [['recordedAt', 'DESC'], ['id', 'DESC']], limit: 500 })
  return recordsJson(rows)
}

async function findRecord(operationId: number, id: number) {
  const r = await GrazingRecord.findOne({ where: { id, operationId } })
  if (!r) throw AppError.notFound('Record')
  return r
}

export async function getRecord(operationId: number, id: number): Promise<GrazingRecordJson> {
  return (await recordsJson([await findRecord(operationId, id)]))[0]
}

function localDate(d: Date): string {
  return todayIso(d)
}

/**
 * Records a fence move or a feeding. Left-out figures come from the plan: a move takes the distance due that day,
 * a feeding takes the group's daily supplement (per head × head count).
 */
export async function createRecord(sequelize: Sequelize, operationId: number, userId: number, input: RecordCreate): Promise<GrazingRecordJson> {
  let plan
  try {
    plan = await getPlan(sequelize, operationId, input.planId)
  } catch (e) {
    if (e instanceof AppError && e.status === 404) throw bad('planId', 'Choose a strip plan of this operation.')
    throw e
  }
  const at = input.recordedAt ? new Date(input.recordedAt) : new Date()
  if (at.getTime() - Date.now() > FUTURE_SLACK_MS) throw bad('recordedAt', 'That time is in the future.')
  let distanceM = input.distanceM ?? null
  let feedLabel = input.feedLabel ?? null
  let amount = input.amountKgAsFed ?? null
  if (input.kind === 'moved' && input.distanceM === undefined) {
    const ev = evaluatePlan(await getField(sequelize, operationId, plan.fieldId), plan)
    const day = ev.ok ? planDay(plan, ev, localDate(at)) : null
    distanceM = day?.moveToday ? day.moveToday.toM - day.moveToday.fromM : null
  }
  if (input.kind === 'fed' && plan.supplement) {
    if (input.feedLabel === undefined) feedLabel = plan.supplement.label
    if (input.amountKgAsFed === undefined) amount = plan.supplement.kgAsFedPerHeadPerDay * plan.headCount
  }
  const r = await GrazingRecord.create({ operationId, planId: plan.id, kind: input.kind, recordedAt: at, recordedBy: userId, distanceM, feedLabel, amountKgAsFed: amount, note: input.note })
  return getRecord(operationId, r.id)
}

/** Owners change anyone's record; everyone else only their own. */
function mayChange(r: GrazingRecord, userId: number, role: Role) {
  if (role !== 'owner' && r.recordedBy !== userId) throw AppError.forbidden('Only the person who recorded it or an owner may change this record.')
}

export async function updateRecord(operationId: number, userId: number, role: Role, id: number, patch: RecordUpdate): Promise<GrazingRecordJson> {
  const r = await findRecord(operationId, id)
  mayChange(r, userId, role)
  const at = patch.recordedAt ? new Date(patch.recordedAt) : undefined
  if (at && at.getTime() - Date.now() > FUTURE_SLACK_MS) throw bad('recordedAt', 'That time is in the future.')
  await r.update({
    ...(at ? { recordedAt: at } : {}),
    ...(patch.distanceM !== undefined ? { distanceM: patch.distanceM } : {}),
    ...(patch.feedLabel !== undefined ? { feedLabel: patch.feedLabel } : {}),
    ...(patch.amountKgAsFed !== undefined ? { amountKgAsFed: patch.amountKgAsFed } : {}),
    ...(patch.note !== undefined ? { note: patch.note } : {}),
  })
  return getRecord(operationId, id)
}

export async function deleteRecord(operationId: number, userId: number, role: Role, id: number): Promise<void> {
  const r = await findRecord(operationId, id)
  mayChange(r, userId, role)
  await r.destroy()
}
