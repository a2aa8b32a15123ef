// Evaluates a strip plan with the grazing engine: strip size, fence move, days the field lasts, whole field against strips, diet by day, hazards and the fence on a given date. Pure, so the Strip plan screen previews what Today and the server compute.
import {
  SORGHUM_GRAIN_DM_FRACTION,
  UTILIZATION_DEFAULTS,
  defaultUtilization,
  hazards,
  stripDietByDay,
  stripPlan,
  stripPlanByGrain,
  stripSchedule,
  supplyOfParsedField,
  wholeFieldPlan,
  type Caution,
  type Cited,
  type FieldSupply,
  type GrazingGroupInput,
  type StripDiet,
  type StripPlan,
} from '../../engine/grazing/index'
import { addDays, daysBetween } from '../../engine/grazing/dates'
import type { Field } from '../../schemas/grazing/fields'
import { parseEngineField, toEngineField } from './toEngine'
import type { PlanValues } from '../../schemas/grazing/plans'

export type PlanGroup = Pick<PlanValues, 'groupName' | 'species' | 'headCount' | 'bodyWeightKg' | 'intakeKgDmPerHead' | 'pregnant' | 'lactating' | 'grainAdapted' | 'mineral' | 'supplement'>
export type EvaluablePlan = PlanGroup & Pick<PlanValues, 'access' | 'daysPerMove' | 'basis' | 'grainAllowanceKgPerHead' | 'utilization' | 'startDate' | 'endDate' | 'startOffsetM' | 'paceLengthM'> & { id?: number }

export type StripMove = { index: number; startDate: string; days: number; fromM: number; toM: number; areaHa: number }

export type PlanDay = {
  date: string
  status: 'not-started' | 'grazing' | 'finished'
  /** Days since the plan started (0 on the first day). */
  dayIndex: number
  /** The move that starts on this date; null between moves of an n-day strip and with whole-field access. */
  moveToday: StripMove | null
  /** The strip the group is on, and how many there are. */
  strip: StripMove | null
  stripCount: number
  /** Where the front fence stands after today's move, from the water end of the field. */
  fenceAtM: number
  nextMoveDate: string | null
}

export type PlanEvaluation =
  | { ok: false; reason: string; field: string }
  | {
      ok: true
      supply: FieldSupply
      standingKgDmPerHa: number
      grainKgAsIsPerHa: number
      fieldAreaHa: number
      remainingAreaHa: number
      /** Length of the whole field along the direction the fence advances. */
      fieldLengthM: number
      forageIntakeKgDmPerHead: number
      utilization: { strip: Cited<number>; wholeField: Cited<number> }
      strip: StripPlan
      wholeField: { daysOfGrazing: number; exactDays: number; endDate: string; lastGrazingDate: string | null }
      /** Days the field feeds the group with the chosen access, and when that ends (the plan's own last day wins if earlier). */
      days: number
      lastGrazingDate: string | null
      extraDaysFromStrips: number
      schedule: StripMove[]
      diet: StripDiet | null
      dailyDiet: StripDiet | null
      warnings: string[]
    }

/** The group as the engine's hazard and season code read it. */
export function engineGroup(p: PlanGroup & { id?: number }, key?: string): GrazingGroupInput {
  return {
    id: key ?? `plan-${p.id ?? 0}`,
    name: p.groupName,
    species: p.species,
    headCount: p.headCount,
    bodyWeightKg: p.bodyWeightKg,
    intakeKgDmPerHead: p.intakeKgDmPerHead,
    pregnant: p.pregnant,
    lactating: p.lactating,
    grainAdapted: p.grainAdapted,
    ...(p.mineral ? { mineral: p.mineral } : {}),
    ...(p.supplement && p.supplement.kgAsFedPerHeadPerDay > 0 ? { routineSupplement: p.supplement } : {}),
  }
}

/** Forage the group takes from the field: intake less the routine supplement's DM, which replaces forage one for one (as the engine's season budget counts it). */
export function forageIntake(p: PlanGroup): number {
  const sup = p.supplement ? p.supplement.kgAsFedPerHeadPerDay * p.supplement.dmFraction : 0
  return Math.max(0, p.intakeKgDmPerHead - sup)
}

/**
 * Strip plan on the feed standing at the plan's start (fieldSupply), on the ground not yet grazed: forage basis
 * (engine stripPlan, Penn State Agronomy Guide Table 1.8-9 arithmetic) or grain basis (stripPlanByGrain, Univ. of
 * Missouri Ext. G2079), whole-field access beside it at the whole-field utilization default, the diet by day within
 * one strip (stripDietByDay), and each fence move in order (stripSchedule) measured from the water end.
 */
export function evaluatePlan(field: Field, plan: EvaluablePlan): PlanEvaluation {
  const ef = parseEngineField(field)
  const supply = supplyOfParsedField(ef, plan.startDate)
  const fieldLengthM = (field.areaHa * 10_000) / field.fenceLengthM
  if (plan.startOffsetM >= fieldLengthM) return { ok: false, reason: 'The fence already stands at the far end of the field.', field: 'startOffsetM' }
  const remainingAreaHa = field.areaHa - (plan.startOffsetM * field.fenceLengthM) / 10_000
  const standing = supply.totalKgDmPerHa
  if (!(standing > 0)) return { ok: false, reason: 'Nothing is standing on this field on the start date: enter its components first.', field: 'fieldId' }
  const intake = forageIntake(plan)
  if (!(intake > 0)) return { ok: false, reason: 'The supplement covers the whole intake: there is nothing left to graze.', field: 'supplement' }
  const grainKgAsIsPerHa = supply.byKind['sorghum-grain'] / SORGHUM_GRAIN_DM_FRACTION
  if (plan.basis === 'grain' && !(grainKgAsIsPerHa > 0)) return { ok: false, reason: 'No grain stands on this field on the start date: size the strips by forage.', field: 'basis' }

  const stripU: Cited<number> =
    plan.utilization !== null && plan.access === 'strip'
      ? { value: plan.utilization, source: 'your own figure', evidence: 'default' }
      : defaultUtilization({ species: plan.species, access: 'strip', daysPerMove: plan.daysPerMove })
  const wholeU: Cited<number> =
    plan.utilization !== null && plan.access === 'whole-field' ? { value: plan.utilization, source: 'your own figure', evidence: 'default' } : UTILIZATION_DEFAULTS[plan.species]['whole-field']

  const common = { headCount: plan.headCount, fieldAreaHa: remainingAreaHa, fenceLengthM: field.fenceLengthM, daysPerMove: plan.daysPerMove, start: plan.startDate, ...(plan.paceLengthM ? { paceLengthM: plan.paceLengthM } : {}) }
  const strip =
    plan.basis === 'grain'
      ? stripPlanByGrain({ ...common, grainAllowanceKgPerHead: plan.grainAllowanceKgPerHead as number, grainKgPerHa: grainKgAsIsPerHa })
      : stripPlan({ ...common, intakeKgDmPerHead: intake, availableKgDmPerHa: standing, utilization: stripU.value })
  const wholeField = wholeFieldPlan({ headCount: plan.headCount, intakeKgDmPerHead: intake, availableKgDmPerHa: standing, utilization: wholeU.value, fieldAreaHa: remainingAreaHa, start: plan.startDate })

  const warnings = [...strip.warnings]
  let days = plan.access === 'strip' ? strip.daysOfGrazing : wholeField.daysOfGrazing
  let lastGrazingDate = days > 0 ? addDays(plan.startDate, days - 1) : null
  if (plan.endDate !== null && lastGrazingDate !== null && plan.endDate < lastGrazingDate) {
    days = daysBetween(plan.startDate, plan.endDate) + 1
    lastGrazingDate = plan.endDate
  } else if (plan.endDate !== null && lastGrazingDate !== null && plan.endDate > lastGrazingDate) {
    warnings.push(`the field runs out on ${addDays(lastGrazingDate, 1)}, before the planned last day ${plan.endDate}`)
  }
  if (days === 0) warnings.push('the field cannot feed this group for one whole day')

  const schedule: StripMove[] =
    plan.access === 'strip' && strip.daysOfGrazing > 0
      ? stripSchedule(strip, plan.startDate, plan.daysPerMove)
          .filter((m) => m.index * plan.daysPerMove < days)
          .map((m) => ({ ...m, fromM: m.fromM + plan.startOffsetM, toM: m.toM + plan.startOffsetM }))
      : []

  const components = supply.components.filter((c) => c.kgDmPerHa > 0).map((c) => ({ kind: c.kind, kgDmPerHa: c.kgDmPerHa, quality: c.quality }))
  const dietDays = plan.access === 'strip' ? plan.daysPerMove : Math.max(1, Math.min(60, wholeField.daysOfGrazing))
  const diet = stripDietByDay({ intakeKgDmPerHead: intake, daysPerMove: dietDays, utilization: plan.access === 'strip' ? stripU.value : wholeU.value, components, start: plan.startDate })
  const dailyDiet = stripDietByDay({ intakeKgDmPerHead: intake, daysPerMove: 1, utilization: defaultUtilization({ species: plan.species, access: 'strip', daysPerMove: 1 }).value, components, start: plan.startDate })

  return {
    ok: true,
    supply,
    standingKgDmPerHa: standing,
    grainKgAsIsPerHa,
    fieldAreaHa: field.areaHa,
    remainingAreaHa,
    fieldLengthM,
    forageIntakeKgDmPerHead: intake,
    utilization: { strip: stripU, wholeField: wholeU },
    strip,
    wholeField,
    days,
    lastGrazingDate,
    extraDaysFromStrips: strip.daysOfGrazing - wholeField.daysOfGrazing,
    schedule,
    diet,
    dailyDiet,
    warnings,
  }
}

/** Where the group and its fence are on a date under an evaluated plan. */
export function planDay(plan: EvaluablePlan, ev: Extract<PlanEvaluation, { ok: true }>, date: string): PlanDay {
  const dayIndex = daysBetween(plan.startDate, date)
  const base = { date, dayIndex, stripCount: ev.schedule.length }
  if (dayIndex < 0) return { ...base, status: 'not-started', moveToday: null, strip: null, fenceAtM: plan.startOffsetM, nextMoveDate: plan.access === 'strip' ? plan.startDate : null }
  if (ev.lastGrazingDate === null || date > ev.lastGrazingDate) {
    const last = ev.schedule[ev.schedule.length - 1] ?? null
    return { ...base, status: 'finished', moveToday: null, strip: null, fenceAtM: last ? last.toM : plan.startOffsetM, nextMoveDate: null }
  }
  if (plan.access === 'whole-field') return { ...base, status: 'grazing', moveToday: null, strip: null, fenceAtM: ev.fieldLengthM, nextMoveDate: null }
  const strip = ev.schedule.find((m) => m.startDate <= date && date < addDays(m.startDate, m.days)) ?? null
  const next = strip ? ev.schedule[strip.index + 1] : undefined
  return {
    ...base,
    status: 'grazing',
    moveToday: strip && strip.startDate === date ? strip : null,
    strip,
    fenceAtM: strip ? strip.toM : plan.startOffsetM,
    nextMoveDate: next && next.startDate <= (ev.lastGrazingDate ?? '') ? next.startDate : null,
  }
}

/** Cautions for the plan's group on its field on a date, with any other groups on the same field for mixed grazing. */
export function planHazards(field: Field, plan: EvaluablePlan, date: string, others: GrazingGroupInput[] = []): Caution[] {
  return hazards(toEngineField(field), engineGroup(plan), date, {
    access: plan.access,
    daysPerMove: plan.daysPerMove,
    ...(plan.utilization !== null ? { utilization: plan.utilization } : {}),
    groupsOnField: others,
  })
}
