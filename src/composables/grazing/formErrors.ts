// Form rules from the shared schemas: validate what the form would send and show each message beside its input.
import type { z } from 'zod'
import { ApiRequestError } from '@/api/client'

/** Messages by field path ("samples.1.dryG"), from the schema on the client or from the server's 400. */
export function errorsFrom(schema: z.ZodType, body: unknown): Record<string, string> {
  const r = schema.safeParse(body)
  if (r.success) return {}
  const out: Record<string, string> = {}
  for (const i of r.error.issues) {
    const k = i.path.length ? i.path.join('.') : '(body)'
    out[k] ??= i.message
  }
  return out
}

export function serverErrors(e: unknown): Record<string, string> {
  if (!(e instanceof ApiRequestError)) return {}
  return Object.fromEntries((e.info.fields ?? []).map((f) => [f.field, f.message]))
}
