// ISO calendar-date arithmetic in UTC, so a date never drifts with the viewer's time zone.
const DAY_MS = 86_400_000

/** Whole days since 1970-01-01 (UTC) for an ISO 'YYYY-MM-DD' date. */
export function dayNumber(iso: string): number {
  const y = Number(iso.slice(0, 4))
  const m = Number(iso.slice(5, 7))
  const d = Number(iso.slice(8, 10))
  return Math.round(Date.UTC(y, m - 1, d) / DAY_MS)
}

/** ISO date for a day number from {@link dayNumber}. */
export function isoFromDayNumber(n: number): string {
  return new Date(n * DAY_MS).toISOString().slice(0, 10)
}

export function addDays(iso: string, days: number): string {
  return isoFromDayNumber(dayNumber(iso) + days)
}

/** b − a in whole days (positive when b is later). */
export function daysBetween(a: string, b: string): number {
  return dayNumber(b) - dayNumber(a)
}

/** Mean Gregorian month (365.2425 d ÷ 12), used to turn per-month rates into per-day ones. */
export const DAYS_PER_MONTH = 365.2425 / 12
