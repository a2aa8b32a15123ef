// The crew's records ("moved the fence", "fed the supplement") and the Today screen built from plans and records.
import { z } from 'zod'
import { cautionSchema } from '../../engine/grazing/index'

export const recordKindSchema = z.enum(['moved', 'fed'], { error: 'Record "moved" or "fed".' })

const recordShape = {
  planId: z.number({ error: 'Say which plan this is for.' }).int().positive('Say which plan this is for.'),
  kind: recordKindSchema,
  /** When it was done; the server takes the time of the request when it is left out. */
  recordedAt: z.iso.datetime({ offset: true, error: 'Use a time like 2026-01-15T07:30:00Z.' }),
  /** How far the fence was moved; the plan's move for that day when left out. */
  distanceM: z.number({ error: 'Enter the distance as a number.' }).min(0, 'The distance cannot be negative.').max(10_000, 'At most 10,000 m.').nullable(),
  feedLabel: z.string().trim().max(120, 'Use at most 120 characters.').nullable(),
  /** Supplement fed to the whole group, kg as fed; the plan's daily amount when left out. */
  amountKgAsFed: z.number({ error: 'Enter the amount as a number.' }).min(0, 'The amount cannot be negative.').max(100_000, 'At most 100,000 kg.').nullable(),
  note: z.string().max(500, 'Use at most 500 characters.'),
}

export const recordCreateSchema = z.object({
  ...recordShape,
  recordedAt: recordShape.recordedAt.optional(),
  distanceM: recordShape.distanceM.optional(),
  feedLabel: recordShape.feedLabel.optional(),
  amountKgAsFed: recordShape.amountKgAsFed.optional(),
  note: recordShape.note.default(''),
})
export type RecordCreate = z.input<typeof recordCreateSchema>
export const recordUpdateSchema = z.object(recordShape).omit({ planId: true, kind: true }).partial()
export type RecordUpdate = z.input<typeof recordUpdateSchema>

export const recordSchema = z.object({
  id: z.number(),
  operationId: z.number(),
  planId: z.number().nullable(),
  kind: recordKindSchema,
  recordedAt: z.string(),
  recordedBy: z.object({ id: z.number().nullable(), name: z.string() }),
  distanceM: z.number().nullable(),
  feedLabel: z.string().nullable(),
  amountKgAsFed: z.number().nullable(),
  note: z.string(),
  groupName: z.string().nullable(),
  fieldName: z.string().nullable(),
  createdAt: z.string(),
})
export type GrazingRecordJson = z.infer<typeof recordSchema>
export const recordListSchema = z.object({ items: z.array(recordSchema), total: z.number() })
export const recordListQuerySchema = z.object({
  date: z.iso.date('Use a date as YYYY-MM-DD.').optional(),
  planId: z.coerce.number().int().positive().optional(),
  kind: recordKindSchema.optional(),
})

const moveSchema = z.object({ index: z.number(), startDate: z.string(), days: z.number(), fromM: z.number(), toM: z.number(), areaHa: z.number() })

export const todayItemSchema = z.object({
  plan: z.object({ id: z.number(), groupName: z.string(), species: z.enum(['cattle', 'sheep']), headCount: z.number(), access: z.enum(['strip', 'whole-field']), daysPerMove: z.number(), herdId: z.number().nullable() }),
  field: z.object({ id: z.number(), name: z.string(), fenceLengthM: z.number(), fieldLengthM: z.number(), areaHa: z.number(), legumeShareOfWidth: z.number() }),
  status: z.enum(['not-started', 'grazing', 'finished', 'cannot-plan']),
  problem: z.string().nullable(),
  dayIndex: z.number(),
  strip: moveSchema.nullable(),
  stripCount: z.number(),
  /** The fence move due today; null when no move falls on this date. */
  move: z.object({ distanceM: z.number(), paces: z.number(), fromM: z.number(), toM: z.number(), areaHa: z.number() }).nullable(),
  fenceAtM: z.number(),
  nextMoveDate: z.string().nullable(),
  lastGrazingDate: z.string().nullable(),
  supplement: z.object({ label: z.string(), kgAsFedPerHead: z.number(), kgAsFedForGroup: z.number(), source: z.enum(['balance', 'plan']) }).nullable(),
  hazards: z.array(cautionSchema),
  /** Strips stay closed today (frost wait, nitrate): do not move onto new sorghum. */
  blocked: z.boolean(),
  records: z.array(recordSchema),
})
export type TodayItem = z.infer<typeof todayItemSchema>
export const todaySchema = z.object({ date: z.string(), items: z.array(todayItemSchema) })
export type Today = z.infer<typeof todaySchema>
