// Prussic-acid frost wait for sorghum: strips stay closed for a set number of days after every frost.
import { z } from 'zod'
import { isoDateOutSchema, isoDateSchema, type Cited } from './common'
import { addDays, dayNumber } from './dates'

/**
 * Wait 7 days after a killing freeze (about 24 °F) before grazing sorghum; every frost that does not kill restarts
 * the 7-day clock (UNL BeefWatch 2024, Drewnoski & Redfearn; UNL CropWatch 2023/2024) [read].
 */
export const DEFAULT_FROST_WAIT_DAYS: Cited<number> = {
  value: 7,
  source: 'UNL BeefWatch 2024 (Drewnoski & Redfearn); UNL CropWatch 2023/2024',
  evidence: 'read',
}

/** Other published waits, for the user who wants a longer margin. */
export const PUBLISHED_FROST_WAITS: readonly Cited<string>[] = [
  { value: '7 days after a killing freeze; each partial freeze restarts the clock', source: 'UNL BeefWatch 2024', evidence: 'read' },
  { value: '5–6 days after a killing frost, once the plant has dried', source: 'Seedway; Agproud "Reducing the potential of prussic acid poisoning"', evidence: 'read' },
  { value: '6–7 days after a killing frost; 2 weeks after a non-killing frost', source: 'G. Bates, Univ. of Tennessee', evidence: 'read' },
  { value: '10 days to 2 weeks', source: 'Drovers / cattlenetwork', evidence: 'read' },
  { value: 'about 2 weeks after frost in the standing-milo system', source: 'Univ. of Missouri Extension news; Provisioner', evidence: 'read' },
]

export const frostWaitInputSchema = z.object({
  killingFrostDates: z.array(isoDateSchema).default([]),
  partialFrostDates: z.array(isoDateSchema).default([]),
  date: isoDateSchema,
  waitDays: z.number().int().min(0).default(DEFAULT_FROST_WAIT_DAYS.value),
  /** Wait after a frost that did not kill; defaults to waitDays (UNL); Bates (Univ. of Tennessee) uses 14. */
  partialWaitDays: z.number().int().min(0).optional(),
})
export type FrostWaitInput = z.input<typeof frostWaitInputSchema>

export const frostWaitSchema = z.object({
  blocked: z.boolean(),
  /** First date sorghum may be grazed again after the frosts so far; null when no frost has come by the date. */
  firstGrazingDate: isoDateOutSchema.nullable(),
  daysLeft: z.number().int(),
  governingFrost: z.object({ date: isoDateOutSchema, killing: z.boolean() }).nullable(),
  /** Whether a killing frost has come by the date (the sorghum is dead, not just frosted). */
  killed: z.boolean(),
})
export type FrostWait = z.infer<typeof frostWaitSchema>

/**
 * Frost wait on a date: every frost on or before the date closes sorghum for its wait, and a later frost restarts
 * the clock (UNL BeefWatch 2024) [read]. With unequal waits the latest reopening governs, so no frost's own wait is
 * ever cut short.
 */
export function frostWait(input: FrostWaitInput): FrostWait {
  return frostWaitParsed(frostWaitInputSchema.parse(input))
}

/** {@link frostWait} on input already validated, for daily loops. */
export function frostWaitParsed(p: z.infer<typeof frostWaitInputSchema>): FrostWait {
  const today = dayNumber(p.date)
  const partialWait = p.partialWaitDays ?? p.waitDays
  let best: { reopen: number; date: string; killing: boolean } | null = null
  const consider = (date: string, killing: boolean) => {
    const d = dayNumber(date)
    if (d > today) return
    const reopen = d + (killing ? p.waitDays : partialWait)
    if (!best || reopen > best.reopen || (reopen === best.reopen && d > dayNumber(best.date))) best = { reopen, date, killing }
  }
  p.killingFrostDates.forEach((d) => consider(d, true))
  p.partialFrostDates.forEach((d) => consider(d, false))
  const killed = p.killingFrostDates.some((d) => dayNumber(d) <= today)
  const b = best as { reopen: number; date: string; killing: boolean } | null
  if (!b) return { blocked: false, firstGrazingDate: null, daysLeft: 0, governingFrost: null, killed }
  const blocked = today < b.reopen
  return {
    blocked,
    firstGrazingDate: addDays(b.date, b.reopen - dayNumber(b.date)),
    daysLeft: blocked ? b.reopen - today : 0,
    governingFrost: { date: b.date, killing: b.killing },
    killed,
  }
}
