// Balances: what the user chooses (group, date, field or feeds, supplements, settings) and each stored run (inputs, outputs, who, when).
import { z } from 'zod'
import { actorSchema, isoDay, optNum, optText, positiveId, versionSchema } from './common'

export const balanceSettingsSchema = z.object({
  /** Grain at most this share of diet DM (grain overload); unset leaves the engine's own rule and its warning. */
  maxGrainSharePct: optNum(0, 100, 'grain limit', '% of diet DM'),
  /** Multiplies predicted cattle intake (the 1996 cow equation under-predicts modern cows by 14–17 %, Gross, OSU — read). */
  intakeFactor: optNum(0.5, 1.5, 'intake factor'),
})
export type BalanceSettings = z.infer<typeof balanceSettingsSchema>

export const baseFeedChoiceSchema = z.object({
  feedId: positiveId,
  /** Share of the base diet this feed is offered at; give all or none. */
  sharePct: optNum(0, 100, 'offered share', '%'),
})

export const balanceSelectionFields = z.object({
  name: optText(120),
  herdId: positiveId,
  date: isoDay,
  /** The field the group grazes on that date; its components become the base feeds. */
  fieldId: positiveId.nullable().optional(),
  /** Or (and) a list of base feeds the group eats. */
  baseFeeds: z.array(baseFeedChoiceSchema).max(12, 'At most 12 base feeds.').default([]),
  /** Supplements and minerals on hand that the balance may use. */
  supplementIds: z.array(positiveId).max(20, 'At most 20 supplements.').default([]),
  settings: balanceSettingsSchema.default({}),
})

function selectionRules(s: z.infer<typeof balanceSelectionFields>, ctx: z.RefinementCtx) {
  if (!s.fieldId && s.baseFeeds.length === 0) ctx.addIssue({ code: 'custom', path: ['baseFeeds'], message: 'Choose the field or at least one feed the group eats.' })
  const seen = new Set<number>()
  s.baseFeeds.forEach((b, i) => {
    if (seen.has(b.feedId)) ctx.addIssue({ code: 'custom', path: ['baseFeeds', i, 'feedId'], message: 'This feed is listed twice.' })
    seen.add(b.feedId)
  })
  s.supplementIds.forEach((id, i) => {
    if (seen.has(id)) ctx.addIssue({ code: 'custom', path: ['supplementIds', i], message: 'This feed is already a base feed or listed twice.' })
    seen.add(id)
  })
  const withShare = s.baseFeeds.filter((b) => b.sharePct != null)
  if (withShare.length && (withShare.length !== s.baseFeeds.length || s.fieldId)) {
    ctx.addIssue({ code: 'custom', path: ['baseFeeds'], message: 'Give an offered share for every base feed, or for none.' })
  } else if (withShare.length) {
    const sum = withShare.reduce((a, b) => a + (b.sharePct ?? 0), 0)
    if (Math.abs(sum - 100) > 0.01) ctx.addIssue({ code: 'custom', path: ['baseFeeds'], message: `Offered shares must add up to 100 % (they add up to ${Math.round(sum * 10) / 10} %).` })
  }
}

export const balanceSelectionSchema = balanceSelectionFields.superRefine(selectionRules)
export type BalanceSelection = z.input<typeof balanceSelectionSchema>
export type BalanceSelectionValues = z.output<typeof balanceSelectionSchema>

/** Re-running with changed inputs names the version it started from; a stale version gets 409. */
export const balanceRerunSchema = balanceSelectionFields.partial().extend({ version: versionSchema })
export const balanceRenameSchema = z.object({ name: optText(120), version: versionSchema })

export const balanceVersionSchema = z.object({
  version: z.number(),
  selection: z.record(z.string(), z.unknown()),
  /** Everything the engine saw, so a stored run can be replayed and compared: problem, requirements, stage, feed snapshot. */
  inputs: z.record(z.string(), z.unknown()),
  result: z.record(z.string(), z.unknown()),
  labResultIds: z.array(z.number()),
  createdBy: actorSchema,
  createdAt: z.string(),
})
export type BalanceVersion = z.infer<typeof balanceVersionSchema>

export const balanceSchema = z.object({
  id: z.number(),
  operationId: z.number(),
  herdId: z.number(),
  herdName: z.string(),
  species: z.enum(['cattle', 'sheep']),
  name: z.string().nullable(),
  date: z.string(),
  status: z.string(),
  costPerHeadDay: z.number(),
  outOfDate: z.boolean(),
  outOfDateReason: z.string().nullable(),
  version: z.number(),
  latest: balanceVersionSchema.optional(),
  versions: z.array(z.object({ version: z.number(), createdAt: z.string(), createdBy: actorSchema, status: z.string() })).optional(),
  createdAt: z.string(),
  updatedAt: z.string(),
})
export type BalanceRecord = z.infer<typeof balanceSchema>

export const balanceListQuerySchema = z.object({
  herdId: z.coerce.number().int().positive().optional(),
  outOfDate: z.enum(['true', 'false']).optional(),
})

// ── Words and thresholds the screen, the print view and the PDF share ─────────────────────────────────────────────
export type CoverageWord = 'short' | 'covered' | 'surplus'
/** Below 99.5 % is short (solver rounding aside); above 125 % is a surplus worth seeing — a display setting, not science. */
export const COVERED_FROM_PCT = 99.5
export const SURPLUS_ABOVE_PCT = 125
export function coverageWord(pct: number): CoverageWord {
  if (pct < COVERED_FROM_PCT) return 'short'
  if (pct > SURPLUS_ABOVE_PCT) return 'surplus'
  return 'covered'
}

export const nutrientLabels: Record<string, string> = {
  dm: 'Dry matter intake',
  tdn: 'Energy (TDN)',
  nem: 'Energy for maintenance (NEm)',
  neg: 'Energy for gain (NEg)',
  cp: 'Crude protein',
  ca: 'Calcium',
  p: 'Phosphorus',
}

export const statusLabels: Record<string, string> = {
  covered: 'Covered by the field and base feeds alone',
  'covered-with-supplement': 'Covered with a supplement',
  short: 'Short: no diet from these feeds meets every need',
}

/** The footer every report carries. */
export const REPORT_FOOTER =
  'This plan is a guide computed from published equations, book values and your lab results. Have it checked by a nutritionist or veterinarian before you feed it; a veterinarian, a licensed nutritionist and local regulations come first.'

export const reportEmailSchema = z
  .object({
    memberIds: z.array(positiveId).max(50).default([]),
    emails: z.array(z.email('Enter a valid e-mail address.').max(254)).max(20, 'At most 20 addresses.').default([]),
    message: optText(2000),
    version: z.number().int().min(1).optional(),
  })
  .superRefine((v, ctx) => {
    if (v.memberIds.length === 0 && v.emails.length === 0) ctx.addIssue({ code: 'custom', path: ['emails'], message: 'Choose a member or enter an address.' })
  })
export type ReportEmail = z.input<typeof reportEmailSchema>
