// Operation, team and invitation API calls.
import { api } from './client'
import type { Role } from '@shared/schemas/roles'

export type Member = { id: number; userId: number; name: string; email: string; role: Role; since: string }
export type PendingInvite = { id: number; email: string; role: Role; expiresAt: string; createdAt: string }
export type InvitationInfo = { email: string; role: Role; operationName: string; operationId: number }
export type OperationInfo = { id: number; name: string; species: 'cattle' | 'sheep' | 'both'; isDemo: boolean; role: Role }

export const operationsApi = {
  create: (body: { name: string; species: 'cattle' | 'sheep' | 'both' }) => api<OperationInfo>('/operations', { method: 'POST', body }),
  get: (id: number) => api<OperationInfo>(`/operations/${id}`),
  team: (id: number) => api<{ members: Member[]; invitations: PendingInvite[] }>(`/operations/${id}/members`),
  invite: (id: number, email: string, role: Role) => api<PendingInvite>(`/operations/${id}/invitations`, { method: 'POST', body: { email, role } }),
  revokeInvite: (id: number, inviteId: number) => api<void>(`/operations/${id}/invitations/${inviteId}`, { method: 'DELETE' }),
  setRole: (id: number, memberId: number, role: Role) => api<{ id: number; role: Role }>(`/operations/${id}/members/${memberId}`, { method: 'PATCH', body: { role } }),
  removeMember: (id: number, memberId: number) => api<void>(`/operations/${id}/members/${memberId}`, { method: 'DELETE' }),
  invitation: (token: string) => api<InvitationInfo>(`/invitations/${encodeURIComponent(token)}`),
  acceptInvitation: (token: string) => api<{ operationId: number; role: Role }>('/invitations/accept', { method: 'POST', body: { token } }),
}

export type AdminUser = { id: number; name: string; email: string; isAdmin: boolean; disabled: boolean; createdAt: string }
export type SinkMessage = { id: number; to: string[]; from: string; subject: string; text: string; receivedAt: string; attachments: { filename: string; size: number }[] }

export const adminApi = {
  users: (q?: string, page = 1) => api<{ items: AdminUser[]; total: number; page: number; pageSize: number }>('/admin/users', { query: { q, page } }),
  updateUser: (id: number, body: { isAdmin?: boolean; disabled?: boolean }) => api<AdminUser>(`/admin/users/${id}`, { method: 'PATCH', body }),
  mail: () => api<{ items: SinkMessage[] }>('/admin/mail'),
}
