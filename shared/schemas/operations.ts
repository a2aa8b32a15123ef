// Operation (farm or ranch), membership, invitation and admin schemas.
import { z } from 'zod'
import { roleSchema } from './roles'
import { emailSchema } from './auth'

export const operationCreateSchema = z.object({
  name: z.string().trim().min(2, 'Use at least 2 characters.').max(120),
  species: z.enum(['cattle', 'sheep', 'both']).default('cattle'),
})
export const operationUpdateSchema = operationCreateSchema.partial()

export const inviteCreateSchema = z.object({
  email: emailSchema,
  role: roleSchema,
})
export const memberUpdateSchema = z.object({ role: roleSchema })
export const inviteAcceptSchema = z.object({ token: z.string().min(10).max(200) })

export const adminUserUpdateSchema = z.object({
  isAdmin: z.boolean().optional(),
  disabled: z.boolean().optional(),
})

export type OperationCreate = z.input<typeof operationCreateSchema>
export type InviteCreate = z.input<typeof inviteCreateSchema>
