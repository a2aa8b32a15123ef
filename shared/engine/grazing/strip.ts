// Strip plan: strip area, fence move, days a field lasts, by forage or by grain allowance, and whole-field access.
import { z } from 'zod'
import { MAX_GRAZING_DAYS, isoDateOutSchema, isoDateSchema, positive, positiveFraction } from './common'
import { addDays } from './dates'
import { DEFAULT_PACE_M, metresToPaces } from './conversions'
import { defaultUtilization, UTILIZATION_DEFAULTS } from './animals'
import { grazingSpeciesSchema } from './field'

const common = {
  headCount: z.number().int().min(1),
  fieldAreaHa: positive(),
  /** Fence line across the field: the strip's width. */
  fenceLengthM: positive(),
  daysPerMove: z.number().int().min(1).default(1),
  start: isoDateSchema,
  paceLengthM: positive().default(DEFAULT_PACE_M),
}

export const stripPlanInputSchema = z.object({
  ...common,
  intakeKgDmPerHead: positive(),
  availableKgDmPerHa: positive(),
  utilization: positiveFraction(),
})
export type StripPlanInput = z.input<typeof stripPlanInputSchema>

export const grainStripPlanInputSchema = z.object({
  ...common,
  /** Grain offered per head per day, as-is (10–13 lb/cow/day in Univ. of Missouri Ext. G2079) [read]. */
  grainAllowanceKgPerHead: positive(),
  /** Standing grain, as-is kg/ha (bushels × 56 lb). */
  grainKgPerHa: positive(),
  /** Share of standing grain the allowance is counted against; G2079 sizes strips on all of it (1). */
  utilization: positiveFraction().default(1),
})
export type GrainStripPlanInput = z.input<typeof grainStripPlanInputSchema>

export const stripPlanSchema = z.object({
  basis: z.enum(['forage', 'grain']),
  /** Area of each strip (one fence move). */
  stripAreaHa: z.number(),
  dailyAreaHa: z.number(),
  /** Distance the fence advances at each move. */
  fenceMoveM: z.number(),
  fenceMovePaces: z.number(),
  /** Length of the field along the direction the fence advances. */
  fieldLengthM: z.number(),
  /** Whole days the field feeds the group in full (days × daily area never exceeds the field), at most MAX_GRAZING_DAYS. */
  daysOfGrazing: z.number().int(),
  /** The same without rounding down to whole days. */
  exactDays: z.number(),
  fullStrips: z.number().int(),
  /** A shorter last strip when the field does not divide evenly; 0 when it does. */
  lastStripAreaHa: z.number(),
  lastStripDays: z.number().int(),
  grazedAreaHa: z.number(),
  /** First day the field no longer feeds the group: start + daysOfGrazing. */
  endDate: isoDateOutSchema,
  /** Last day on the field; null when the field cannot feed the group one whole day. */
  lastGrazingDate: isoDateOutSchema.nullable(),
  warnings: z.array(z.string()),
})
export type StripPlan = z.infer<typeof stripPlanSchema>

/**
 * Largest whole number of days with days × dailyArea ≤ field, robust to floating-point error in either direction,
 * and never more than MAX_GRAZING_DAYS.
 */
function wholeDays(fieldAreaHa: number, dailyAreaHa: number): number {
  if (fieldAreaHa / dailyAreaHa >= MAX_GRAZING_DAYS) return MAX_GRAZING_DAYS
  let days = Math.floor(fieldAreaHa / dailyAreaHa)
  if ((days + 1) * dailyAreaHa <= fieldAreaHa) days += 1
  while (days > 0 && days * dailyAreaHa > fieldAreaHa) days -= 1
  return days
}

function plan(
  basis: 'forage' | 'grain',
  p: { headCount: number; fieldAreaHa: number; fenceLengthM: number; daysPerMove: number; start: string; paceLengthM: number },
  perHeadPerDay: number,
  usablePerHa: number,
): StripPlan {
  const dailyAreaHa = (p.headCount * perHeadPerDay) / usablePerHa
  const stripAreaHa = dailyAreaHa * p.daysPerMove
  const fenceMoveM = (stripAreaHa * 10_000) / p.fenceLengthM
  const exactDays = p.fieldAreaHa / dailyAreaHa
  const daysOfGrazing = wholeDays(p.fieldAreaHa, dailyAreaHa)
  const fullStrips = Math.floor(daysOfGrazing / p.daysPerMove)
  const lastStripDays = daysOfGrazing - fullStrips * p.daysPerMove
  const warnings: string[] = []
  if (stripAreaHa > p.fieldAreaHa) warnings.push('one strip needs more than the whole field')
  if (daysOfGrazing === MAX_GRAZING_DAYS) warnings.push(`the field outlasts ${MAX_GRAZING_DAYS} days at this rate; days are reported at that cap`)
  return {
    basis,
    stripAreaHa,
    dailyAreaHa,
    fenceMoveM,
    fenceMovePaces: metresToPaces(fenceMoveM, p.paceLengthM),
    fieldLengthM: (p.fieldAreaHa * 10_000) / p.fenceLengthM,
    daysOfGrazing,
    exactDays,
    fullStrips,
    lastStripAreaHa: lastStripDays * dailyAreaHa,
    lastStripDays,
    grazedAreaHa: daysOfGrazing * dailyAreaHa,
    endDate: addDays(p.start, daysOfGrazing),
    lastGrazingDate: daysOfGrazing > 0 ? addDays(p.start, daysOfGrazing - 1) : null,
    warnings,
  }
}

/**
 * Strips sized by forage: area = head × intake × days per move ÷ (available DM × utilization); fence move =
 * area ÷ fence length; days = field ÷ daily area. Same arithmetic as the Penn State Agronomy Guide paddock table
 * (Table 1.8-9) [read]; the strip and fence-move form is derived from it. Start strips at the water end (Jennings,
 * Univ. of Arkansas, Hay & Forage Grower) [read].
 */
export function stripPlan(input: StripPlanInput): StripPlan {
  const p = stripPlanInputSchema.parse(input)
  return plan('forage', p, p.intakeKgDmPerHead, p.availableKgDmPerHa * p.utilization)
}

/**
 * Strips sized by grain, as for standing milo: area = head × grain allowance ÷ standing grain per area
 * (Univ. of Missouri Ext. G2079, Lee, Kientzy & Bailey; R. Lee, MAFG "Move livestock to the feed") [read].
 * Once-a-day allocation suits grain crops; multi-day allocations defeat the system (R. Lee, farmtalknews 2023) [read].
 */
export function stripPlanByGrain(input: GrainStripPlanInput): StripPlan {
  const p = grainStripPlanInputSchema.parse(input)
  const out = plan('grain', p, p.grainAllowanceKgPerHead, p.grainKgPerHa * p.utilization)
  if (p.daysPerMove > 1) out.warnings.push('grain strips longer than one day let stock gorge on grain on the first day')
  return out
}

export const grainAllowanceFromStripInputSchema = z.object({
  headCount: z.number().int().min(1),
  stripAreaHa: positive(),
  grainKgPerHa: positive(),
})
/**
 * Grain each head gets from a daily strip: strip area × grain per area ÷ head
 * (SARE FNC03-474: 31 cows on 30 × 35 ft a day of 206-bu corn ≈ 9 lb each) [read; arithmetic derived].
 */
export function grainAllowanceFromStrip(input: z.input<typeof grainAllowanceFromStripInputSchema>): number {
  const p = grainAllowanceFromStripInputSchema.parse(input)
  return (p.stripAreaHa * p.grainKgPerHa) / p.headCount
}

export const wholeFieldInputSchema = z.object({
  headCount: z.number().int().min(1),
  intakeKgDmPerHead: positive(),
  availableKgDmPerHa: positive(),
  utilization: positiveFraction(),
  fieldAreaHa: positive(),
  start: isoDateSchema,
})
export const wholeFieldPlanSchema = z.object({
  daysOfGrazing: z.number().int(),
  exactDays: z.number(),
  endDate: isoDateOutSchema,
  lastGrazingDate: isoDateOutSchema.nullable(),
})
/**
 * Whole-field access: days = field × available DM × utilization ÷ (head × intake), with the lower utilization
 * free access brings (≈35 % eaten, Davis, Univ. of Missouri; strips doubled grazing days per acre, Jennings,
 * Univ. of Arkansas) [read].
 */
export function wholeFieldPlan(input: z.input<typeof wholeFieldInputSchema>): z.infer<typeof wholeFieldPlanSchema> {
  const p = wholeFieldInputSchema.parse(input)
  const dailyAreaHa = (p.headCount * p.intakeKgDmPerHead) / (p.availableKgDmPerHa * p.utilization)
  const daysOfGrazing = wholeDays(p.fieldAreaHa, dailyAreaHa)
  return {
    daysOfGrazing,
    exactDays: p.fieldAreaHa / dailyAreaHa,
    endDate: addDays(p.start, daysOfGrazing),
    lastGrazingDate: daysOfGrazing > 0 ? addDays(p.start, daysOfGrazing - 1) : null,
  }
}

export const compareAccessInputSchema = z.object({
  species: grazingSpeciesSchema,
  headCount: z.number().int().min(1),
  intakeKgDmPerHead: positive(),
  availableKgDmPerHa: positive(),
  fieldAreaHa: positive(),
  fenceLengthM: positive(),
  daysPerMove: z.number().int().min(1).default(1),
  start: isoDateSchema,
  stripUtilization: positiveFraction().optional(),
  wholeFieldUtilization: positiveFraction().optional(),
  paceLengthM: positive().default(DEFAULT_PACE_M),
})
/**
 * Strips against the whole field on the same feed, with utilization defaults by species and access
 * (animals.ts: UTILIZATION_DEFAULTS) unless given.
 */
export function compareAccess(input: z.input<typeof compareAccessInputSchema>) {
  const p = compareAccessInputSchema.parse(input)
  const stripU = p.stripUtilization ?? defaultUtilization({ species: p.species, access: 'strip', daysPerMove: p.daysPerMove }).value
  const wholeU = p.wholeFieldUtilization ?? UTILIZATION_DEFAULTS[p.species]['whole-field'].value
  const strip = stripPlan({ ...p, utilization: stripU })
  const wholeField = wholeFieldPlan({ ...p, utilization: wholeU })
  return {
    strip: { ...strip, utilization: stripU },
    wholeField: { ...wholeField, utilization: wholeU },
    extraDaysFromStrips: strip.daysOfGrazing - wholeField.daysOfGrazing,
  }
}

export const stripMoveSchema = z.object({
  index: z.number().int(),
  startDate: isoDateOutSchema,
  days: z.number().int(),
  /** Fence position before and after this move, measured from the starting (water) end. */
  fromM: z.number(),
  toM: z.number(),
  areaHa: z.number(),
})
/**
 * Each fence move of a strip plan in order, for a diagram that grows along the field and for the crew's day
 * (derived from the strip plan; start at the water end, Jennings, Univ. of Arkansas, Hay & Forage Grower) [read].
 */
export function stripSchedule(planned: StripPlan, start: string, daysPerMove: number): z.infer<typeof stripMoveSchema>[] {
  const s = isoDateSchema.parse(start)
  const n = z.number().int().min(1).parse(daysPerMove)
  const moves: z.infer<typeof stripMoveSchema>[] = []
  const perDayM = planned.fenceMoveM / n
  let day = 0
  let pos = 0
  for (let i = 0; day < planned.daysOfGrazing; i++) {
    const days = Math.min(n, planned.daysOfGrazing - day)
    const to = pos + perDayM * days
    moves.push({ index: i, startDate: addDays(s, day), days, fromM: pos, toM: to, areaHa: planned.dailyAreaHa * days })
    pos = to
    day += days
  }
  return moves
}
