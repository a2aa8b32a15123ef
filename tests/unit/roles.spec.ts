// Permission table and account schemas shared by client and server.
import { describe, expect, it } from 'vitest'
import { can, permissions } from '../../shared/schemas/roles'
import { passwordSchema, signUpSchema } from '../../shared/schemas/auth'

describe('role permissions', () => {
  it('when the role is owner, then every permission is granted', () => {
    for (const p of permissions) expect(can('owner', p)).toBe(true)
  })
  it('when the role is nutritionist, then data and reports but not members or the operation itself', () => {
    expect(can('nutritionist', 'data:edit')).toBe(true)
    expect(can('nutritionist', 'reports:send')).toBe(true)
    expect(can('nutritionist', 'members:manage')).toBe(false)
    expect(can('nutritionist', 'operation:manage')).toBe(false)
  })
  it('when the role is hand, then read and record only', () => {
    expect(permissions.filter((p) => can('hand', p))).toEqual(['operation:read', 'records:write'])
  })
  it('when there is no role, then nothing is granted', () => {
    for (const p of permissions) expect(can(null, p)).toBe(false)
  })
})

describe('password rule (NIST SP 800-63B §5.1.1.2: length and a list of common passwords)', () => {
  it('refuses fewer than 10 characters and listed common passwords, in any case', () => {
    expect(passwordSchema.safeParse('abc123def').success).toBe(false)
    expect(passwordSchema.safeParse('Password123').success).toBe(false)
    expect(passwordSchema.safeParse('QWERTYUIOP').success).toBe(false)
    expect(passwordSchema.safeParse('corridor-cows-in-march').success).toBe(true)
  })
  it('normalises e-mail to lower case and names each invalid field', () => {
    const ok = signUpSchema.parse({ name: ' A ', email: ' X@Example.TEST ', password: 'corridor-cows-in-march' })
    expect(ok.email).toBe('x@example.test')
    const bad = signUpSchema.safeParse({ name: '', email: 'nope', password: 'short' })
    expect(bad.success).toBe(false)
    expect(bad.error!.issues.map((i) => i.path.join('.')).sort()).toEqual(['email', 'name', 'password'])
  })
})
