// Shared zod primitives and provenance types for the grazing engine.
import { z } from 'zod'

/** A date the engine returns: 'YYYY-MM-DD', format checked only. */
export const isoDateOutSchema = z.iso.date()
/**
 * A date given to the engine: 'YYYY-MM-DD' between 1900 and 2199, so that anything computed from it (plus at most
 * MAX_GRAZING_DAYS) still has a four-digit year. All arithmetic on it is done in UTC (see dates.ts).
 */
export const isoDateSchema = z.iso.date().refine((d) => d >= '1900-01-01' && d <= '2199-12-31', { message: 'date must fall between 1900 and 2199' })
/** Longest span a plan reports in days (100 years); a field that lasts longer is reported at this cap with a warning. */
export const MAX_GRAZING_DAYS = 36_525

/** Finite, strictly positive number (zod 4 already rejects NaN and ±Infinity). */
export const positive = () => z.number().positive()
/** Finite number ≥ 0. */
export const nonNegative = () => z.number().nonnegative()
/** Fraction in [0, 1]. */
export const fraction = () => z.number().min(0).max(1)
/** Fraction in (0, 1]: a utilization or a dry-matter fraction that must leave something to divide by. */
export const positiveFraction = () => z.number().gt(0).max(1)
/** Percentage in [0, 100]. */
export const percent = () => z.number().min(0).max(100)

/**
 * How a figure is known:
 * read = seen in the named source; derived = arithmetic on read figures or unit definitions;
 * from memory = recalled, not verified; common practice = a rule of thumb of the trade;
 * default = no published value exists, a setting the user is expected to change.
 */
export const evidenceLabelSchema = z.enum(['read', 'derived', 'from memory', 'common practice', 'default'])
export type EvidenceLabel = z.infer<typeof evidenceLabelSchema>

/** A published figure carried as data, so the UI can show the value beside its source and label. */
export interface Cited<T> {
  value: T
  source: string
  evidence: EvidenceLabel
}
