// The one authorization check for operation-scoped routes: membership (else 404) and the role's permission (else 403).
import type { NextFunction, Request, Response } from 'express'
import { AppError } from '../errors'
import { Membership, Operation } from '../models/index'
import { can, type Permission, type Role } from '../../shared/schemas/roles'

declare module 'express-serve-static-core' {
  interface Request {
    operation?: Operation
    role?: Role
  }
}

/** Mounted once on /api/operations/:operationId: a non-member, site admins included, sees 404 as if the operation did not exist. */
export async function loadOperationMembership(req: Request, _res: Response, next: NextFunction) {
  const raw = req.params.operationId
  const id = Number(raw)
  if (!Number.isInteger(id) || id <= 0 || String(id) !== raw) return next(AppError.notFound('Operation'))
  // One query per request: the membership with its operation.
  const membership = await Membership.findOne({ where: { operationId: id, userId: req.user!.id }, include: [{ model: Operation, as: 'operation' }] })
  const operation = (membership as unknown as { operation?: Operation } | null)?.operation
  if (!membership || !operation) return next(AppError.notFound('Operation'))
  req.operation = operation
  req.role = membership.role
  next()
}

/** Guards one route by permission; the permission table lives in shared/schemas/roles.ts. */
export function permit(permission: Permission) {
  return (req: Request, _res: Response, next: NextFunction) => {
    if (!req.operation || !req.role) return next(AppError.notFound('Operation'))
    if (!can(req.role, permission)) return next(AppError.forbidden())
    next()
  }
}

export function operationId(req: Request): number {
  return req.operation!.id
}
