// Season schemas: the operation's season settings (dates, the feed that fills a shortfall, a harvested-feed alternative) and what the Season screen receives.
import { z } from 'zod'
import { fieldSchema } from './fields'
import { grazingGroupOptionSchema, planSchema } from './plans'

const isoDate = z.iso.date('Use a date as YYYY-MM-DD.')
const frac = (what: string) => z.number({ error: `Enter ${what} as a fraction.` }).gt(0, `${what} must be more than 0.`).max(1, `${what} must be at most 1.`)
const price = z.number({ error: 'Enter the price as a number.' }).min(0, 'The price cannot be negative.').max(100, 'At most 100 per kg.')

export const pricedFeedSchema = z.object({
  label: z.string().trim().min(1, 'Name the feed.').max(120),
  dmFraction: frac('DM fraction'),
  pricePerKgAsFed: price,
})

export const seasonSettingsSchema = z
  .object({
    startDate: isoDate,
    endDate: isoDate,
    /** Feed that fills any dry-matter shortfall (hay, typically), priced as fed. */
    shortfallFeed: pricedFeedSchema,
    /** A harvested-feed alternative priced by the user, to cost the whole winter against. */
    harvestedAlternative: pricedFeedSchema.extend({ wasteFraction: z.number({ error: 'Enter the waste as a fraction.' }).min(0, 'Waste cannot be negative.').lt(1, 'Waste must be below 1.') }).nullable(),
    frostWaitDays: z.number().int('Use whole days.').min(0).max(60, 'At most 60 days.').nullable(),
  })
  .superRefine((s, ctx) => {
    if (s.endDate < s.startDate) ctx.addIssue({ code: 'custom', path: ['endDate'], message: 'The season cannot end before it starts.' })
    const days = (Date.parse(`${s.endDate}T00:00:00Z`) - Date.parse(`${s.startDate}T00:00:00Z`)) / 86_400_000
    if (days > 366) ctx.addIssue({ code: 'custom', path: ['endDate'], message: 'A season spans at most one year.' })
  })
export type SeasonSettingsValues = z.infer<typeof seasonSettingsSchema>

export const seasonGroupSchema = z.object({ key: z.string(), name: z.string(), species: z.enum(['cattle', 'sheep']), headCount: z.number(), planIds: z.array(z.number()), herdId: z.number().nullable() })

/** What the Season screen gets: the stored settings (or defaults), the fields and plans the budget is built from, the herd groups with no plan (listed, not budgeted), and the server's budget. */
export const seasonDataSchema = z.object({
  settings: seasonSettingsSchema,
  settingsSaved: z.boolean(),
  fields: z.array(fieldSchema),
  plans: z.array(planSchema),
  unplanned: z.array(grazingGroupOptionSchema),
  groups: z.array(seasonGroupSchema),
  /** The engine's seasonBudget on the stored data (null when there is no group); the client recomputes it as settings change. */
  budget: z.unknown(),
})
export type SeasonData = z.infer<typeof seasonDataSchema>
