// Calendar helpers for the services: "today" as the server's local calendar date.
/** Today's date as YYYY-MM-DD in the server's time zone (a farm's day, not UTC's). */
export function todayIso(now: Date = new Date()): string {
  const y = now.getFullYear()
  const m = String(now.getMonth() + 1).padStart(2, '0')
  const d = String(now.getDate()).padStart(2, '0')
  return `${y}-${m}-${d}`
}
