// Strip plan schema: a herd group on a field with its access (daily strips, n-day strips or the whole field), in SI units on the wire.
import { z } from 'zod'

const isoDate = z.iso.date('Use a date as YYYY-MM-DD.')
const num = (min: number, max: number, what: string) =>
  z.number({ error: `Enter ${what} as a number.` }).min(min, `${cap(what)} must be at least ${min}.`).max(max, `${cap(what)} must be at most ${max}.`)
const pos = (max: number, what: string) => z.number({ error: `Enter ${what} as a number.` }).positive(`${cap(what)} must be more than 0.`).max(max, `${cap(what)} must be at most ${max}.`)
function cap(s: string) {
  return s[0].toUpperCase() + s.slice(1)
}

export const accessSchema = z.enum(['strip', 'whole-field'], { error: 'Choose strips or the whole field.' })
export const planBasisSchema = z.enum(['forage', 'grain'], { error: 'Size strips by forage or by grain.' })

export const planSupplementSchema = z.object({
  label: z.string().trim().min(1, 'Name the supplement.').max(120),
  kgAsFedPerHeadPerDay: num(0, 20, 'the supplement per head'),
  dmFraction: z.number({ error: 'Enter the supplement DM as a fraction.' }).gt(0, 'DM fraction must be more than 0.').max(1, 'DM fraction must be at most 1.'),
  pricePerKgAsFed: num(0, 100, 'the supplement price'),
})
export type PlanSupplement = z.infer<typeof planSupplementSchema>

export const planMineralSchema = z.object({
  label: z.string().trim().max(120).optional(),
  intendedFor: z.enum(['cattle', 'sheep', 'all-species']),
  copperPpm: num(0, 10_000, 'copper').optional(),
})

/** Plan settings as sent; no defaults, so a PATCH keeps what it leaves out. */
const planShape = {
  fieldId: z.number({ error: 'Choose a field.' }).int().positive('Choose a field.'),
  /** The herd group (Herds) this plan is for; its head count, weight and intake then come from the group. */
  herdId: z.number().int().positive().nullable(),
  groupName: z.string().trim().min(1, 'Name the group.').max(120, 'Use at most 120 characters.'),
  species: z.enum(['cattle', 'sheep'], { error: 'Choose cattle or sheep.' }),
  headCount: z.number({ error: 'Enter the head count.' }).int('Use a whole number of head.').min(1, 'At least 1 head.').max(100_000, 'At most 100,000 head.'),
  bodyWeightKg: num(5, 1500, 'the body weight'),
  intakeKgDmPerHead: pos(40, 'the intake per head'),
  pregnant: z.boolean(),
  lactating: z.boolean(),
  grainAdapted: z.boolean(),
  mineral: planMineralSchema.nullable(),
  access: accessSchema,
  daysPerMove: z.number({ error: 'Enter the days per move.' }).int('Use whole days.').min(1, 'At least 1 day per move.').max(60, 'At most 60 days per move.'),
  basis: planBasisSchema,
  /** Grain offered per head per day, as-is (10–13 lb/cow/day in Univ. of Missouri Ext. G2079). */
  grainAllowanceKgPerHead: pos(30, 'the grain allowance').nullable(),
  /** Share of standing DM eaten; null takes the default for the species and access. */
  utilization: z.number({ error: 'Enter the utilization as a fraction.' }).gt(0, 'Utilization must be more than 0.').max(1, 'Utilization must be at most 1.').nullable(),
  startDate: isoDate,
  /** Last day on the field, inclusive; null runs until the field is grazed out. */
  endDate: isoDate.nullable(),
  /** How far along the field the fence already stands at the start (ground grazed before), from the water end. */
  startOffsetM: num(0, 100_000, 'the starting fence position'),
  paceLengthM: num(0.3, 2, 'the pace length').nullable(),
  supplement: planSupplementSchema.nullable(),
  notes: z.string().max(2000, 'Use at most 2,000 characters.'),
}

type PlanLike = { basis: string; grainAllowanceKgPerHead: number | null; access: string; startDate: string; endDate: string | null; daysPerMove: number }
function planRules(p: PlanLike, ctx: z.RefinementCtx) {
  if (p.basis === 'grain' && p.grainAllowanceKgPerHead === null) ctx.addIssue({ code: 'custom', path: ['grainAllowanceKgPerHead'], message: 'Give the grain per head per day for grain-sized strips.' })
  if (p.basis === 'grain' && p.access === 'whole-field') ctx.addIssue({ code: 'custom', path: ['basis'], message: 'Whole-field access has no strips to size by grain.' })
  if (p.endDate !== null && p.endDate < p.startDate) ctx.addIssue({ code: 'custom', path: ['endDate'], message: 'The last day cannot be before the first.' })
}

const planCreateShape = {
  ...planShape,
  herdId: planShape.herdId.default(null),
  pregnant: planShape.pregnant.default(false),
  lactating: planShape.lactating.default(false),
  grainAdapted: planShape.grainAdapted.default(false),
  mineral: planShape.mineral.default(null),
  access: planShape.access.default('strip'),
  daysPerMove: planShape.daysPerMove.default(1),
  basis: planShape.basis.default('forage'),
  grainAllowanceKgPerHead: planShape.grainAllowanceKgPerHead.default(null),
  utilization: planShape.utilization.default(null),
  endDate: planShape.endDate.default(null),
  startOffsetM: planShape.startOffsetM.default(0),
  paceLengthM: planShape.paceLengthM.default(null),
  supplement: planShape.supplement.default(null),
  notes: planShape.notes.default(''),
}

export const planCreateSchema = z.object(planCreateShape).superRefine(planRules)
export type PlanCreate = z.input<typeof planCreateSchema>
export type PlanValues = z.output<typeof planCreateSchema>
export const planSettingsSchema = z.object(planShape).superRefine(planRules)
export const planUpdateSchema = z.object(planShape).partial()
export type PlanUpdate = z.input<typeof planUpdateSchema>

export const planSchema = z.object({
  ...planShape,
  id: z.number(),
  operationId: z.number(),
  notes: z.string(),
  /** Where the group's figures came from: the linked herd group (live) or the plan itself. */
  groupSource: z.enum(['herd', 'plan']),
  /** Where `supplement` came from: the group's latest balance, the plan, or none. */
  supplementSource: z.enum(['balance', 'plan']).nullable(),
  createdAt: z.string(),
  updatedAt: z.string(),
})
export type Plan = z.infer<typeof planSchema>
export const planListSchema = z.object({ items: z.array(planSchema), total: z.number() })

/** A herd group as the grazing screens see it, for choosing whom a plan is for. */
export const grazingGroupOptionSchema = z.object({
  herdId: z.number(),
  name: z.string(),
  species: z.enum(['cattle', 'sheep']),
  headCount: z.number(),
  bodyWeightKg: z.number(),
  intakeKgDmPerHead: z.number().nullable(),
  pregnant: z.boolean(),
  lactating: z.boolean(),
  supplement: planSupplementSchema.nullable(),
})
export type GrazingGroupOption = z.infer<typeof grazingGroupOptionSchema>
export const grazingGroupListSchema = z.object({ items: z.array(grazingGroupOptionSchema) })
