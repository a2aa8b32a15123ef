// The crew's day: for each group on a field, where the fence stands, how far to move it, what to feed and how much, the cautions, and today's records.
import { Op, type Sequelize } from 'sequelize'
import { GrazingRecord } from '../../models/grazing'
import type { Today, TodayItem } from '../../../shared/schemas/grazing/records'
import { engineGroup, evaluatePlan, planDay, planHazards } from '../../../shared/adapters/grazing/planEval'
import { DEFAULT_PACE_M } from '../../../shared/engine/grazing/index'
import { addDays } from '../../../shared/engine/grazing/dates'
import { fieldsAndPlans } from './plans'
import { dayBounds, recordsJson } from './records'

/** Groups starting within this many days show on Today so the crew can get the first strip ready. */
const LOOK_AHEAD_DAYS = 3

export async function today(sequelize: Sequelize, operationId: number, date: string): Promise<Today> {
  const { fields, plans } = await fieldsAndPlans(sequelize, operationId, date)
  const fieldById = new Map(fields.map((f) => [f.id, f]))
  const [a, b] = dayBounds(date)
  const records = await GrazingRecord.findAll({ where: { operationId, recordedAt: { [Op.gte]: a, [Op.lt]: b } }, order: [['recordedAt', 'ASC'], ['id', 'ASC']] })
  const recordJson = await recordsJson(records)
  const horizon = addDays(date, LOOK_AHEAD_DAYS)
  const candidates = plans.filter((p) => p.startDate <= horizon && (p.endDate === null || p.endDate >= date))

  const items: TodayItem[] = []
  for (const plan of candidates) {
    const field = fieldById.get(plan.fieldId)
    if (!field) continue
    const fieldLengthM = (field.areaHa * 10_000) / field.fenceLengthM
    const base = {
      plan: { id: plan.id, groupName: plan.groupName, species: plan.species, headCount: plan.headCount, access: plan.access, daysPerMove: plan.daysPerMove, herdId: plan.herdId },
      field: { id: field.id, name: field.name, fenceLengthM: field.fenceLengthM, fieldLengthM, areaHa: field.areaHa, legumeShareOfWidth: field.legumeShareOfWidth },
      records: recordJson.filter((r) => r.planId === plan.id),
      supplement: plan.supplement
        ? { label: plan.supplement.label, kgAsFedPerHead: plan.supplement.kgAsFedPerHeadPerDay, kgAsFedForGroup: plan.supplement.kgAsFedPerHeadPerDay * plan.headCount, source: plan.supplementSource ?? 'plan' }
        : null,
    }
    const ev = evaluatePlan(field, plan)
    if (!ev.ok) {
      items.push({ ...base, status: 'cannot-plan', problem: ev.reason, dayIndex: 0, strip: null, stripCount: 0, move: null, fenceAtM: plan.startOffsetM, nextMoveDate: null, lastGrazingDate: null, hazards: [], blocked: false })
      continue
    }
    const day = planDay(plan, ev, date)
    if (day.status === 'finished') continue
    const others = candidates.filter((o) => o.id !== plan.id && o.fieldId === plan.fieldId && o.startDate <= date)
    const hazards = planHazards(field, plan, date, others.map((o) => engineGroup(o)))
    const pace = plan.paceLengthM ?? DEFAULT_PACE_M
    const m = day.moveToday
    items.push({
      ...base,
      status: day.status,
      problem: null,
      dayIndex: day.dayIndex,
      strip: day.strip,
      stripCount: day.stripCount,
      move: m ? { distanceM: m.toM - m.fromM, paces: (m.toM - m.fromM) / pace, fromM: m.fromM, toM: m.toM, areaHa: m.areaHa } : null,
      fenceAtM: day.fenceAtM,
      nextMoveDate: day.nextMoveDate,
      lastGrazingDate: ev.lastGrazingDate,
      hazards,
      blocked: hazards.some((h) => h.blocksGrazing),
    })
  }
  items.sort((x, y) => (x.status === y.status ? x.plan.groupName.localeCompare(y.plan.groupName) : x.status === 'grazing' ? -1 : 1))
  return { date, items }
}
