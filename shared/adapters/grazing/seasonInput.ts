// Builds the engine's season plan from the stored fields, plans and herd groups, and runs the season budget; pure, so the Season screen recomputes in the browser as prices and dates change.
import { seasonBudget, type SeasonBudget, type SeasonPlanInput } from '../../engine/grazing/index'
import { addDays } from '../../engine/grazing/dates'
import type { Field } from '../../schemas/grazing/fields'
import type { Plan } from '../../schemas/grazing/plans'
import type { SeasonSettingsValues } from '../../schemas/grazing/season'
import { engineGroup } from './planEval'
import { toEngineField } from './toEngine'

export type SeasonGroup = { key: string; name: string; species: 'cattle' | 'sheep'; headCount: number; planIds: number[]; herdId: number | null }

/** The key a plan's group has in the season: the herd group when the plan is linked to one, else the plan itself. */
export function seasonGroupKey(p: Pick<Plan, 'id' | 'herdId'>): string {
  return p.herdId !== null ? `herd-${p.herdId}` : `plan-${p.id}`
}

/**
 * One assignment per plan (from its start to its last day, or the season's end), clipped to the season; a group's
 * later plan starts the day after its earlier one ends, since a group grazes one field at a time. A field's area is
 * what lies ahead of the furthest-back starting fence. Only groups with a strip plan are budgeted: a herd group with
 * no plan has no field to draw on, and the screen lists it apart rather than guess how it is fed.
 */
export function buildSeasonInput(settings: SeasonSettingsValues, fields: Field[], plans: Plan[]): { input: SeasonPlanInput; groups: SeasonGroup[] } {
  const fieldIds = new Set(fields.map((f) => f.id))
  const usable = plans
    .filter((p) => fieldIds.has(p.fieldId))
    .filter((p) => p.startDate <= settings.endDate && (p.endDate ?? settings.endDate) >= settings.startDate)
    .sort((a, b) => (a.startDate < b.startDate ? -1 : a.startDate > b.startDate ? 1 : a.id - b.id))
  const groups = new Map<string, SeasonGroup & { plan: Plan }>()
  const lastTo = new Map<string, string>()
  const assignments: SeasonPlanInput['assignments'] = []
  for (const p of usable) {
    const key = seasonGroupKey(p)
    if (!groups.has(key)) groups.set(key, { key, name: p.groupName, species: p.species, headCount: p.headCount, planIds: [], herdId: p.herdId, plan: p })
    groups.get(key)!.planIds.push(p.id)
    let from = p.startDate < settings.startDate ? settings.startDate : p.startDate
    const to = p.endDate === null || p.endDate > settings.endDate ? settings.endDate : p.endDate
    const prev = lastTo.get(key)
    if (prev && from <= prev) from = addDays(prev, 1)
    if (from > to) continue
    lastTo.set(key, to)
    assignments.push({ groupId: key, fieldId: String(p.fieldId), from, to, access: p.access, daysPerMove: p.daysPerMove, ...(p.utilization !== null ? { utilization: p.utilization } : {}) })
  }
  const engineFields = fields.map((f) => {
    const offsets = usable.filter((p) => p.fieldId === f.id).map((p) => p.startOffsetM)
    const grazedHa = offsets.length ? (Math.min(...offsets) * f.fenceLengthM) / 10_000 : 0
    return { ...toEngineField(f), areaHa: Math.max(f.areaHa - grazedHa, f.areaHa * 1e-6) }
  })
  const engineGroups = [...groups.values()].map((g) => engineGroup(g.plan, g.key))
  const input: SeasonPlanInput = {
    start: settings.startDate,
    end: settings.endDate,
    fields: engineFields,
    groups: engineGroups,
    assignments,
    shortfallFeed: settings.shortfallFeed,
    ...(settings.harvestedAlternative ? { harvestedAlternative: settings.harvestedAlternative } : {}),
    ...(settings.frostWaitDays !== null ? { frostWaitDays: settings.frostWaitDays } : {}),
  }
  const seasonGroups: SeasonGroup[] = [...groups.values()].map(({ plan: _p, ...g }) => g)
  return { input, groups: seasonGroups }
}

/** The season budget for the stored data, or null when there is no group to feed. */
export function computeSeason(settings: SeasonSettingsValues, fields: Field[], plans: Plan[]): { budget: SeasonBudget | null; groups: SeasonGroup[] } {
  const { input, groups } = buildSeasonInput(settings, fields, plans)
  if (input.groups.length === 0) return { budget: null, groups }
  return { budget: seasonBudget(input), groups }
}
