// Form helpers: a field's rule from the shared zod schema (so the form says what the server would), and server field errors by name.
import type { z } from 'zod'
import { ApiRequestError } from '@/api/client'

/** A Vuetify rule from one schema field; `toSi` converts the displayed value first. */
export function ruleFrom(schema: z.ZodType, toSi: (v: number) => number = (v) => v, required = false) {
  return (raw: unknown) => {
    if (raw === '' || raw === null || raw === undefined) return required ? 'Required.' : true
    const n = typeof raw === 'number' ? raw : Number(String(raw).replace(/,/g, ''))
    if (!Number.isFinite(n)) return 'Enter a number.'
    const r = schema.safeParse(toSi(n))
    return r.success ? true : (r.error.issues[0]?.message ?? 'Not valid.')
  }
}

export function textRule(schema: z.ZodType) {
  return (raw: unknown) => {
    const r = schema.safeParse(raw ?? '')
    return r.success ? true : (r.error.issues[0]?.message ?? 'Not valid.')
  }
}

/** The server's message for one field of a failed request, if any. */
export function serverFieldError(error: Error | null, field: string): string | undefined {
  return error instanceof ApiRequestError ? error.fieldMessage(field) : undefined
}

/** A 409's two versions, when the request failed on a stale version. */
export function conflictOf<T = Record<string, unknown>>(error: Error | null): { current: T; submitted: { version: number; changes: Record<string, unknown> } } | null {
  if (!(error instanceof ApiRequestError) || error.status !== 409) return null
  const d = error.info.details as { current?: T; submitted?: { version: number; changes: Record<string, unknown> } } | undefined
  return d?.current && d.submitted ? { current: d.current, submitted: d.submitted } : null
}
