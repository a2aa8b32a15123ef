// Parses request parts with the shared zod schemas; failures become a 400 listing each field.
import type { Request } from 'express'
import type { z } from 'zod'
import { validationError } from '../errors'

export function parseBody<S extends z.ZodType>(schema: S, req: Request): z.output<S> {
  const r = schema.safeParse(req.body ?? {})
  if (!r.success) throw validationError(r.error, 'request body')
  return r.data
}

export function parseQuery<S extends z.ZodType>(schema: S, req: Request): z.output<S> {
  const r = schema.safeParse(req.query ?? {})
  if (!r.success) throw validationError(r.error, 'query')
  return r.data
}

export function parseParam(req: Request, name: string): number {
  const v = Number(req.params[name])
  if (!Number.isInteger(v) || v <= 0 || String(v) !== req.params[name]) {
    throw validationError({ issues: [{ path: [name], message: 'Must be a positive whole number.' }] } as unknown as z.ZodError, 'path')
  }
  return v
}
