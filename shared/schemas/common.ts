// Shared zod building blocks: ids, paging, the error shape every API failure uses.
import { z } from 'zod'

export const idSchema = z.coerce.number().int().positive()
export const isoDateSchema = z.iso.date()

export const pageQuerySchema = z.object({
  page: z.coerce.number().int().min(1).default(1),
  pageSize: z.coerce.number().int().min(1).max(500).default(50),
  sort: z.string().max(40).optional(),
  q: z.string().max(200).optional(),
})
export type PageQuery = z.infer<typeof pageQuerySchema>

export type Page<T> = { items: T[]; total: number; page: number; pageSize: number }

export const fieldErrorSchema = z.object({ field: z.string(), message: z.string() })
export const apiErrorSchema = z.object({
  error: z.object({
    status: z.number(),
    code: z.string(),
    message: z.string(),
    fields: z.array(fieldErrorSchema).optional(),
    requestId: z.string().optional(),
    details: z.unknown().optional(),
  }),
})
export type ApiError = z.infer<typeof apiErrorSchema>['error']

export const unitSystemSchema = z.enum(['us', 'metric'])
export type UnitSystem = z.infer<typeof unitSystemSchema>
