// Strip plans: a herd group on a field; create, read, update, delete, and the plan evaluated on a date with its hazards.
import type { Sequelize } from 'sequelize'
import { AppError, validationError } from '../../errors'
import { GrazingPlan } from '../../models/grazing'
import { planSettingsSchema, type Plan, type PlanValues } from '../../../shared/schemas/grazing/plans'
import type { Field as FieldJson } from '../../../shared/schemas/grazing/fields'
import { engineGroup, evaluatePlan, planDay, planHazards, type PlanEvaluation } from '../../../shared/adapters/grazing/planEval'
import type { z } from 'zod'
import type { planCreateSchema, planUpdateSchema } from '../../../shared/schemas/grazing/plans'
import { getField, listFields } from './fields'
import { listHerdGroups, type GroupInfo } from './nutritionLinks'
import { todayIso } from '../dates'

type PlanCreate = z.output<typeof planCreateSchema>
type PlanUpdate = z.output<typeof planUpdateSchema>

function bad(field: string, message: string) {
  return new AppError(400, 'validation_failed', `The request body has 1 invalid field: ${field}.`, [{ field, message }])
}

const iso = (d: Date) => d.toISOString()

function storedValues(p: GrazingPlan): PlanValues {
  return {
    fieldId: p.fieldId,
    herdId: p.herdId,
    groupName: p.groupName,
    species: p.species,
    headCount: p.headCount,
    bodyWeightKg: p.bodyWeightKg,
    intakeKgDmPerHead: p.intakeKgDmPerHead,
    pregnant: p.pregnant,
    lactating: p.lactating,
    grainAdapted: p.grainAdapted,
    mineral: p.mineral,
    access: p.access,
    daysPerMove: p.daysPerMove,
    basis: p.basis,
    grainAllowanceKgPerHead: p.grainAllowanceKgPerHead,
    utilization: p.utilization,
    startDate: p.startDate,
    endDate: p.endDate,
    startOffsetM: p.startOffsetM,
    paceLengthM: p.paceLengthM,
    supplement: p.supplement,
    notes: p.notes,
  }
}

/**
 * The plan as the screens use it: a plan linked to a herd group takes the group's live head count, weight, stage and
 * engine intake, and the supplement of the group's latest balance when it has one; otherwise the plan's own figures.
 */
export function planJson(p: GrazingPlan, herd?: GroupInfo): Plan {
  const v = storedValues(p)
  const fromHerd = herd && herd.herdId === p.herdId
  const supplement = fromHerd && herd.supplement ? herd.supplement : v.supplement
  return {
    ...v,
    ...(fromHerd
      ? {
          groupName: herd.name,
          species: herd.species,
          headCount: herd.headCount,
          bodyWeightKg: herd.bodyWeightKg,
          intakeKgDmPerHead: herd.intakeKgDmPerHead ?? v.intakeKgDmPerHead,
          pregnant: herd.pregnant,
          lactating: herd.lactating,
        }
      : {}),
    supplement,
    supplementSource: fromHerd && herd.supplement ? 'balance' : v.supplement ? 'plan' : null,
    groupSource: fromHerd ? 'herd' : 'plan',
    id: p.id,
    operationId: p.operationId,
    createdAt: iso(p.createdAt),
    updatedAt: iso(p.updatedAt),
  }
}

async function herdsFor(sequelize: Sequelize, operationId: number, plans: GrazingPlan[], date: string) {
  const ids = [...new Set(plans.map((p) => p.herdId).filter((x): x is number => x !== null))]
  const herds = ids.length ? await listHerdGroups(sequelize, operationId, date, ids) : []
  return new Map(herds.map((h) => [h.herdId, h]))
}

export async function listPlans(sequelize: Sequelize, operationId: number, date = todayIso()): Promise<Plan[]> {
  const rows = await GrazingPlan.findAll({ where: { operationId }, order: [['startDate', 'ASC'], ['id', 'ASC']] })
  const herds = await herdsFor(sequelize, operationId, rows, date)
  return rows.map((p) => planJson(p, p.herdId !== null ? herds.get(p.herdId) : undefined))
}

async function findPlanRow(operationId: number, planId: number) {
  const p = await GrazingPlan.findOne({ where: { id: planId, operationId } })
  if (!p) throw AppError.notFound('Strip plan')
  return p
}

export async function getPlan(sequelize: Sequelize, operationId: number, planId: number, date = todayIso()): Promise<Plan> {
  const p = await findPlanRow(operationId, planId)
  const herds = await herdsFor(sequelize, operationId, [p], date)
  return planJson(p, p.herdId !== null ? herds.get(p.herdId) : undefined)
}

/** The field a plan names must be one of this operation's (a body reference, so a 400 naming fieldId, not a 404). */
async function fieldFor(sequelize: Sequelize, operationId: number, fieldId: number): Promise<FieldJson> {
  try {
    return await getField(sequelize, operationId, fieldId)
  } catch (e) {
    if (e instanceof AppError && e.status === 404) throw bad('fieldId', 'Choose a field of this operation.')
    throw e
  }
}

/** Checks a plan against its field, its herd group and the group's other plans; returns the evaluation. */
async function check(sequelize: Sequelize, operationId: number, v: PlanValues, selfId: number | null): Promise<PlanEvaluation & { ok: true }> {
  const field = await fieldFor(sequelize, operationId, v.fieldId)
  let herd: GroupInfo | undefined
  if (v.herdId !== null) {
    ;[herd] = await listHerdGroups(sequelize, operationId, v.startDate, [v.herdId])
    if (!herd) throw bad('herdId', 'Choose a herd group of this operation.')
  }
  const effective = { ...v, ...(herd ? { species: herd.species, headCount: herd.headCount, bodyWeightKg: herd.bodyWeightKg, intakeKgDmPerHead: herd.intakeKgDmPerHead ?? v.intakeKgDmPerHead } : {}) }
  const ev = evaluatePlan(field, effective)
  if (!ev.ok) throw bad(ev.field, ev.reason)
  if (v.herdId !== null) {
    const last = ev.lastGrazingDate ?? v.startDate
    const others = (await GrazingPlan.findAll({ where: { operationId, herdId: v.herdId } })).filter((p) => p.id !== selfId)
    for (const o of others) {
      const of = await getField(sequelize, operationId, o.fieldId)
      const oe = evaluatePlan(of, storedValues(o))
      const oLast = oe.ok ? (oe.lastGrazingDate ?? o.startDate) : (o.endDate ?? o.startDate)
      if (o.startDate <= last && v.startDate <= oLast) {
        throw bad('startDate', `This herd group is already planned on ${of.name} from ${o.startDate} to ${oLast}; a group grazes one field at a time.`)
      }
    }
  }
  return ev
}

export async function createPlan(sequelize: Sequelize, operationId: number, input: PlanCreate): Promise<Plan> {
  await check(sequelize, operationId, input, null)
  const p = await GrazingPlan.create({ ...input, operationId })
  return getPlan(sequelize, operationId, p.id)
}

export async function updatePlan(sequelize: Sequelize, operationId: number, planId: number, patch: PlanUpdate): Promise<Plan> {
  const p = await findPlanRow(operationId, planId)
  const merged = planSettingsSchema.safeParse({ ...storedValues(p), ...patch })
  if (!merged.success) throw validationError(merged.error, 'request body')
  await check(sequelize, operationId, merged.data, p.id)
  await p.update(merged.data)
  return getPlan(sequelize, operationId, planId)
}

export async function deletePlan(operationId: number, planId: number): Promise<void> {
  await (await findPlanRow(operationId, planId)).destroy()
}

/** The plan evaluated on its field, where the fence stands on `date`, and the cautions for that day. */
export async function planEvaluation(sequelize: Sequelize, operationId: number, planId: number, date = todayIso()) {
  const plan = await getPlan(sequelize, operationId, planId, date)
  const field = await getField(sequelize, operationId, plan.fieldId)
  const evaluation = evaluatePlan(field, plan)
  const others = (await listPlans(sequelize, operationId, date)).filter((o) => o.id !== plan.id && o.fieldId === plan.fieldId && o.startDate <= date && (o.endDate ?? '9999-12-31') >= date)
  const hazards = planHazards(field, plan, date, others.map((o) => engineGroup(o)))
  return { plan, field: { id: field.id, name: field.name }, date, evaluation, day: evaluation.ok ? planDay(plan, evaluation, date) : null, hazards }
}

/** Fields and plans of the operation together, for screens that need both. */
export async function fieldsAndPlans(sequelize: Sequelize, operationId: number, date = todayIso()) {
  const [fields, plans] = await Promise.all([listFields(sequelize, operationId), listPlans(sequelize, operationId, date)])
  return { fields, plans }
}
