// Account API calls.
import { api } from './client'
import { meSchema, type Me, type SignInInput, type SignUpInput } from '@shared/schemas/auth'
import type { UnitSystem } from '@shared/schemas/common'

const me = (p: Promise<unknown>) => p.then((d) => meSchema.parse(d))

export const authApi = {
  me: (): Promise<Me> => me(api('/auth/me')),
  session: (): Promise<Me | null> => api<{ user: unknown }>('/auth/session').then((d) => (d.user ? meSchema.parse(d.user) : null)),
  signIn: (body: SignInInput): Promise<Me> => me(api('/auth/sign-in', { method: 'POST', body })),
  signUp: (body: SignUpInput): Promise<Me> => me(api('/auth/sign-up', { method: 'POST', body })),
  demoAccounts: () => api<{ password: string | null; accounts: { email: string; label: string }[] }>('/auth/demo-accounts'),
  signOut: () => api<void>('/auth/sign-out', { method: 'POST' }),
  setUnits: (unitSystem: UnitSystem): Promise<Me> => me(api('/auth/me/preferences', { method: 'PATCH', body: { unitSystem } })),
  changePassword: (currentPassword: string, newPassword: string): Promise<Me> =>
    me(api('/auth/password', { method: 'POST', body: { currentPassword, newPassword } })),
  requestReset: (email: string) => api<{ message: string }>('/auth/password-reset', { method: 'POST', body: { email } }),
  confirmReset: (token: string, password: string): Promise<Me> =>
    me(api('/auth/password-reset/confirm', { method: 'POST', body: { token, password } })),
}
