// Building blocks shared by the nutrition schemas: optional numbers that may be cleared, ISO dates, versions, list queries.
import { z } from 'zod'
import { pageQuerySchema } from '../common'

/** A finite number within [min, max], with a message that names the range; the UI converts units before checking. */
export function num(min: number, max: number, what: string, unit = '') {
  const u = unit ? ` ${unit}` : ''
  return z
    .number({ error: `Enter ${what} as a number.` })
    .refine((v) => Number.isFinite(v), `Enter ${what} as a number.`)
    .refine((v) => v >= min && v <= max, `${capital(what)} must be between ${min} and ${max}${u}.`)
}

/** Same as num, but null (cleared) or absent is allowed. */
export function optNum(min: number, max: number, what: string, unit = '') {
  return num(min, max, what, unit).nullable().optional()
}

export function capital(s: string) {
  return s.charAt(0).toUpperCase() + s.slice(1)
}

export const isoDay = z.iso.date({ error: 'Use a date as YYYY-MM-DD.' })
export const optText = (max: number) => z.string().trim().max(max, `Use at most ${max} characters.`).nullable().optional()
export const versionSchema = z.number({ error: 'Send the version you edited.' }).int().min(1)
export const positiveId = z.number().int().positive()

/** List query for every nutrition table: paging, a sort key and a free-text filter. */
export const listQuerySchema = pageQuerySchema.extend({
  dir: z.enum(['asc', 'desc']).default('asc'),
})
export type ListQuery = z.infer<typeof listQuerySchema>

/** Who did something and when, as the API reports it. */
export const actorSchema = z.object({ id: z.number().nullable(), name: z.string() })
export type Actor = z.infer<typeof actorSchema>
