// Season budget: daily dry-matter supply and demand across fields and groups, by week, with supplement and cost.
import { z } from 'zod'
import { isoDateOutSchema, isoDateSchema, nonNegative, positiveFraction } from './common'
import { addDays, dayNumber, daysBetween } from './dates'
import { grazingAccessSchema, defaultUtilization } from './animals'
import { DEFAULT_FROST_WAIT_DAYS, frostWaitParsed } from './frost'
import { grazingFieldSchema, grazingGroupSchema, isSorghum, type GrazingField } from './field'
import { supplyOfParsedField } from './supply'

export const seasonAssignmentSchema = z.object({
  groupId: z.string().min(1),
  fieldId: z.string().min(1),
  from: isoDateSchema,
  /** Last day on the field, inclusive. */
  to: isoDateSchema,
  access: grazingAccessSchema.default('strip'),
  daysPerMove: z.number().int().min(1).default(1),
  /** Overrides the species/access default of animals.ts. */
  utilization: positiveFraction().optional(),
})
export type SeasonAssignment = z.infer<typeof seasonAssignmentSchema>

export const seasonPlanSchema = z
  .object({
    start: isoDateSchema,
    /** Last day of the season, inclusive. */
    end: isoDateSchema,
    fields: z.array(grazingFieldSchema),
    groups: z.array(grazingGroupSchema).min(1),
    assignments: z.array(seasonAssignmentSchema),
    /** Feed that fills any shortfall of dry matter (hay, typically), priced as fed. */
    shortfallFeed: z.object({ label: z.string().min(1), dmFraction: positiveFraction(), pricePerKgAsFed: nonNegative() }),
    /** A harvested-feed alternative priced by the user, to cost the whole demand against. */
    harvestedAlternative: z
      .object({ label: z.string().min(1), dmFraction: positiveFraction(), pricePerKgAsFed: nonNegative(), wasteFraction: z.number().min(0).lt(1).default(0) })
      .optional(),
    frostWaitDays: z.number().int().min(0).optional(),
    partialFrostWaitDays: z.number().int().min(0).optional(),
  })
  .superRefine((p, ctx) => {
    if (dayNumber(p.end) < dayNumber(p.start)) ctx.addIssue({ code: 'custom', path: ['end'], message: 'end is before start' })
    const fieldIds = new Set(p.fields.map((f) => f.id))
    const groupIds = new Set(p.groups.map((g) => g.id))
    p.assignments.forEach((a, i) => {
      if (!fieldIds.has(a.fieldId)) ctx.addIssue({ code: 'custom', path: ['assignments', i, 'fieldId'], message: `no field ${a.fieldId}` })
      if (!groupIds.has(a.groupId)) ctx.addIssue({ code: 'custom', path: ['assignments', i, 'groupId'], message: `no group ${a.groupId}` })
      if (dayNumber(a.to) < dayNumber(a.from)) ctx.addIssue({ code: 'custom', path: ['assignments', i, 'to'], message: 'to is before from' })
      p.assignments.forEach((b, j) => {
        if (j > i && a.groupId === b.groupId && dayNumber(a.from) <= dayNumber(b.to) && dayNumber(b.from) <= dayNumber(a.to)) {
          ctx.addIssue({ code: 'custom', path: ['assignments', j, 'from'], message: `group ${a.groupId} is on two fields at once` })
        }
      })
    })
  })
export type SeasonPlan = z.infer<typeof seasonPlanSchema>
export type SeasonPlanInput = z.input<typeof seasonPlanSchema>

export const seasonWeekSchema = z.object({
  weekStart: isoDateOutSchema,
  weekEnd: isoDateOutSchema,
  days: z.number().int(),
  demandKgDm: z.number(),
  /** Eaten from the fields. */
  grazedKgDm: z.number(),
  routineSupplementKgDm: z.number(),
  shortfallKgDm: z.number(),
  /** Dry matter standing on ungrazed ground at the end of the week, and the part of it the planned access can use. */
  standingKgDm: z.number(),
  usableKgDm: z.number(),
})
export type SeasonWeek = z.infer<typeof seasonWeekSchema>

export const seasonBudgetSchema = z.object({
  weeks: z.array(seasonWeekSchema),
  firstShortfallDate: isoDateOutSchema.nullable(),
  /** Days from the start fed in full by fields and routine supplement before the first shortfall. */
  daysFullyFed: z.number().int(),
  totalDemandKgDm: z.number(),
  totalGrazedKgDm: z.number(),
  shortfall: z.object({ kgDm: z.number(), kgAsFed: z.number(), cost: z.number() }),
  routineSupplement: z.object({ kgAsFed: z.number(), cost: z.number() }),
  totalSupplementCost: z.number(),
  headDays: z.number(),
  costPerHeadPerDay: z.number(),
  harvestedAlternative: z.object({ cost: z.number(), costPerHeadPerDay: z.number() }).nullable(),
  byGroup: z.array(
    z.object({
      groupId: z.string(),
      headDays: z.number(),
      grazedKgDm: z.number(),
      shortfallKgDm: z.number(),
      firstShortfallDate: isoDateOutSchema.nullable(),
      cost: z.number(),
      costPerHeadPerDay: z.number(),
    }),
  ),
  byField: z.array(
    z.object({ fieldId: z.string(), grazedAreaHa: z.number(), remainingAreaHa: z.number(), usedUpOn: isoDateOutSchema.nullable(), frostBlockedDays: z.number().int() }),
  ),
})
export type SeasonBudget = z.infer<typeof seasonBudgetSchema>

/** Relative tolerance below which an unmet demand is rounding, not a shortfall. */
const EPS = 1e-9

/**
 * Season dry-matter budget at daily resolution. Each day every group eats its intake: routine supplement first,
 * then forage from its assigned field by taking fresh ground at (standing DM × utilization) per hectare, as in the
 * strip arithmetic of the Penn State Agronomy Guide Table 1.8-9 [read]; standing DM weathers by the field's
 * settings (fieldSupply). Sorghum fields are closed during the prussic-acid frost wait (UNL BeefWatch 2024) [read].
 * Whatever a field cannot give is a shortfall, filled with the plan's shortfall feed and costed as fed.
 */
export function seasonBudget(plan: SeasonPlanInput): SeasonBudget {
  const p = seasonPlanSchema.parse(plan)
  const nDays = daysBetween(p.start, p.end) + 1
  const fields = new Map<string, GrazingField>(p.fields.map((f) => [f.id, f]))
  const remaining = new Map<string, number>(p.fields.map((f) => [f.id, f.areaHa]))
  const usedUpOn = new Map<string, string | null>(p.fields.map((f) => [f.id, null]))
  const blockedDays = new Map<string, number>(p.fields.map((f) => [f.id, 0]))
  const hasSorghum = new Map<string, boolean>(p.fields.map((f) => [f.id, f.components.some((c) => isSorghum(c.kind))]))

  const utilOf = new Map<SeasonAssignment, number>()
  for (const a of p.assignments) {
    const g = p.groups.find((x) => x.id === a.groupId)!
    utilOf.set(a, a.utilization ?? defaultUtilization({ species: g.species, access: a.access, daysPerMove: a.daysPerMove }).value)
  }
  const assignmentsByGroup = new Map(p.groups.map((g) => [g.id, p.assignments.filter((a) => a.groupId === g.id)]))
  const assignmentsByField = new Map(p.fields.map((f) => [f.id, p.assignments.filter((a) => a.fieldId === f.id)]))

  const perGroup = new Map(
    p.groups.map((g) => [g.id, { headDays: 0, grazed: 0, shortfall: 0, first: null as string | null, routineKgAsFed: 0, routineCost: 0 }]),
  )
  const weeks: SeasonWeek[] = []
  let firstShortfall: string | null = null
  let totalDemand = 0
  let totalGrazed = 0
  let totalRoutineKgAsFed = 0
  let totalRoutineCost = 0
  let totalShortfall = 0
  let week: SeasonWeek | null = null

  for (let i = 0; i < nDays; i++) {
    const date = addDays(p.start, i)
    const today = dayNumber(date)
    if (i % 7 === 0) {
      week = { weekStart: date, weekEnd: date, days: 0, demandKgDm: 0, grazedKgDm: 0, routineSupplementKgDm: 0, shortfallKgDm: 0, standingKgDm: 0, usableKgDm: 0 }
      weeks.push(week)
    }
    const w = week as SeasonWeek
    w.weekEnd = date
    w.days += 1

    // Per-field state for the day, computed once however many groups share a field.
    const supplyPerHa = new Map<string, number>()
    const blocked = new Map<string, boolean>()
    for (const f of p.fields) {
      supplyPerHa.set(f.id, supplyOfParsedField(f, date).totalKgDmPerHa)
      const b =
        hasSorghum.get(f.id)! &&
        frostWaitParsed({
          killingFrostDates: f.killingFrostDates,
          partialFrostDates: f.partialFrostDates,
          date,
          waitDays: p.frostWaitDays ?? DEFAULT_FROST_WAIT_DAYS.value,
          partialWaitDays: p.partialFrostWaitDays,
        }).blocked
      blocked.set(f.id, b)
      if (b) blockedDays.set(f.id, blockedDays.get(f.id)! + 1)
    }

    let dayShort = false
    for (const g of p.groups) {
      const acc = perGroup.get(g.id)!
      const demand = g.headCount * g.intakeKgDmPerHead
      const rs = g.routineSupplement
      const routineDm = rs ? Math.min(demand, g.headCount * rs.kgAsFedPerHeadPerDay * rs.dmFraction) : 0
      if (rs) {
        const kgAsFed = routineDm / rs.dmFraction
        acc.routineKgAsFed += kgAsFed
        acc.routineCost += kgAsFed * rs.pricePerKgAsFed
        totalRoutineKgAsFed += kgAsFed
        totalRoutineCost += kgAsFed * rs.pricePerKgAsFed
      }
      const forageNeed = demand - routineDm
      let grazed = 0
      const a = assignmentsByGroup.get(g.id)!.find((x) => dayNumber(x.from) <= today && today <= dayNumber(x.to))
      if (a && forageNeed > 0 && !blocked.get(a.fieldId)) {
        const usablePerHa = supplyPerHa.get(a.fieldId)! * utilOf.get(a)!
        const left = remaining.get(a.fieldId)!
        if (usablePerHa > 0 && left > 0) {
          const area = Math.min(forageNeed / usablePerHa, left)
          grazed = Math.min(forageNeed, area * usablePerHa)
          const after = left - area
          remaining.set(a.fieldId, after <= fields.get(a.fieldId)!.areaHa * EPS ? 0 : after)
          if (remaining.get(a.fieldId) === 0 && usedUpOn.get(a.fieldId) === null) usedUpOn.set(a.fieldId, date)
        }
      }
      const short = forageNeed - grazed > demand * EPS ? forageNeed - grazed : 0
      acc.headDays += g.headCount
      acc.grazed += grazed
      acc.shortfall += short
      if (short > 0 && acc.first === null) acc.first = date
      if (short > 0) dayShort = true
      w.demandKgDm += demand
      w.grazedKgDm += grazed
      w.routineSupplementKgDm += routineDm
      w.shortfallKgDm += short
      totalDemand += demand
      totalGrazed += grazed
      totalShortfall += short
    }
    if (dayShort && firstShortfall === null) firstShortfall = date

    if (i % 7 === 6 || i === nDays - 1) {
      let standing = 0
      let usable = 0
      for (const f of p.fields) {
        const s = supplyPerHa.get(f.id)! * remaining.get(f.id)!
        standing += s
        // Usable with the next planned access on the field, else the last one; nothing if the plan never grazes it.
        const as = assignmentsByField.get(f.id)!
        const next = as.filter((a) => dayNumber(a.to) >= today).sort((x, y) => dayNumber(x.from) - dayNumber(y.from))[0]
        const last = as.slice().sort((x, y) => dayNumber(y.to) - dayNumber(x.to))[0]
        const pick = next ?? last
        usable += pick ? s * utilOf.get(pick)! : 0
      }
      w.standingKgDm = standing
      w.usableKgDm = usable
    }
  }

  const feed = p.shortfallFeed
  const shortfallKgAsFed = totalShortfall / feed.dmFraction
  const shortfallCost = shortfallKgAsFed * feed.pricePerKgAsFed
  const headDays = p.groups.reduce((a, g) => a + g.headCount * nDays, 0)
  const totalSupplementCost = shortfallCost + totalRoutineCost
  const alt = p.harvestedAlternative
  const altCost = alt ? (totalDemand / alt.dmFraction / (1 - alt.wasteFraction)) * alt.pricePerKgAsFed : 0

  return {
    weeks,
    firstShortfallDate: firstShortfall,
    daysFullyFed: firstShortfall === null ? nDays : daysBetween(p.start, firstShortfall),
    totalDemandKgDm: totalDemand,
    totalGrazedKgDm: totalGrazed,
    shortfall: { kgDm: totalShortfall, kgAsFed: shortfallKgAsFed, cost: shortfallCost },
    routineSupplement: { kgAsFed: totalRoutineKgAsFed, cost: totalRoutineCost },
    totalSupplementCost,
    headDays,
    costPerHeadPerDay: totalSupplementCost / headDays,
    harvestedAlternative: alt ? { cost: altCost, costPerHeadPerDay: altCost / headDays } : null,
    byGroup: p.groups.map((g) => {
      const acc = perGroup.get(g.id)!
      const cost = (acc.shortfall / feed.dmFraction) * feed.pricePerKgAsFed + acc.routineCost
      return {
        groupId: g.id,
        headDays: acc.headDays,
        grazedKgDm: acc.grazed,
        shortfallKgDm: acc.shortfall,
        firstShortfallDate: acc.first,
        cost,
        costPerHeadPerDay: cost / acc.headDays,
      }
    }),
    byField: p.fields.map((f) => ({
      fieldId: f.id,
      grazedAreaHa: f.areaHa - remaining.get(f.id)!,
      remainingAreaHa: remaining.get(f.id)!,
      usedUpOn: usedUpOn.get(f.id)!,
      frostBlockedDays: blockedDays.get(f.id)!,
    })),
  }
}
