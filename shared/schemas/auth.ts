// Account schemas: sign-up, sign-in, password change and reset, the signed-in user's profile.
import { z } from 'zod'
import { isCommonPassword } from './commonPasswords'
import { roleSchema } from './roles'
import { unitSystemSchema } from './common'

/** NIST SP 800-63B §5.1.1.2: at least 8 characters (we ask 10) and refused when on a list of commonly used passwords. */
export const PASSWORD_MIN = 10
export const passwordSchema = z
  .string()
  .min(PASSWORD_MIN, `Use at least ${PASSWORD_MIN} characters.`)
  .max(128, 'Use at most 128 characters.')
  .refine((p) => !isCommonPassword(p), 'This password is on a list of commonly used passwords; choose another.')

export const emailSchema = z.string('Enter a valid e-mail address.').trim().toLowerCase().pipe(z.email('Enter a valid e-mail address.').max(254))

export const signUpSchema = z.object({
  name: z.string().trim().min(1, 'Enter your name.').max(120),
  email: emailSchema,
  password: passwordSchema,
  inviteToken: z.string().min(10).max(200).optional(),
})
export const signInSchema = z.object({
  email: emailSchema,
  password: z.string().min(1, 'Enter your password.').max(128),
})
export const passwordChangeSchema = z.object({
  currentPassword: z.string().min(1, 'Enter your current password.').max(128),
  newPassword: passwordSchema,
})
export const resetRequestSchema = z.object({ email: emailSchema })
export const resetConfirmSchema = z.object({ token: z.string().min(10).max(200), password: passwordSchema })
export const preferencesSchema = z.object({ unitSystem: unitSystemSchema })

export const membershipSummarySchema = z.object({
  operationId: z.number(),
  operationName: z.string(),
  role: roleSchema,
  isDemo: z.boolean(),
})
export const meSchema = z.object({
  id: z.number(),
  name: z.string(),
  email: z.string(),
  isAdmin: z.boolean(),
  unitSystem: unitSystemSchema,
  memberships: z.array(membershipSummarySchema),
})
export type Me = z.infer<typeof meSchema>
export type SignUpInput = z.input<typeof signUpSchema>
export type SignInInput = z.input<typeof signInSchema>
