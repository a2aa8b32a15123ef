// Roles within an operation and what each may do; used by the server's authorization check and the client's route guards.
import { z } from 'zod'

export const roles = ['owner', 'nutritionist', 'hand'] as const
export const roleSchema = z.enum(roles)
export type Role = z.infer<typeof roleSchema>

export const permissions = [
  'operation:read', // see the operation's plans, herds, fields, feeds and records
  'operation:manage', // rename or delete the operation
  'members:manage', // invite, change roles, remove members
  'data:edit', // herds, fields, feeds, lab results, balances, plans
  'reports:send', // e-mail reports to members or clients
  'records:write', // record a fence move or a feeding
] as const
export type Permission = (typeof permissions)[number]

const grants: Record<Role, readonly Permission[]> = {
  owner: permissions,
  nutritionist: ['operation:read', 'data:edit', 'reports:send', 'records:write'],
  hand: ['operation:read', 'records:write'],
}

export function can(role: Role | null | undefined, permission: Permission): boolean {
  return !!role && grants[role].includes(permission)
}

export const roleLabels: Record<Role, string> = {
  owner: 'Owner',
  nutritionist: 'Nutritionist',
  hand: 'Hand',
}
