// Declares operation-scoped routes with the permission each needs, and keeps a table of them for the role × route test matrix.
import type { Request, RequestHandler, Response, Router } from 'express'
import { permit } from '../middleware/operation'
import type { Permission } from '../../shared/schemas/roles'

export type ScopedRoute = { method: 'get' | 'post' | 'put' | 'patch' | 'delete'; path: string; permission: Permission }

const table = new Map<string, ScopedRoute>()

/** Every route under /api/operations/:operationId, as declared (paths relative to that prefix). */
export function scopedRouteTable(): ScopedRoute[] {
  return [...table.values()]
}

type Handler = (req: Request, res: Response) => unknown

export function scoped(router: Router) {
  const add =
    (method: ScopedRoute['method']) =>
    (path: string, permission: Permission, handler: Handler, ...before: RequestHandler[]) => {
      table.set(`${method} ${path}`, { method, path, permission })
      router[method](path, permit(permission), ...before, handler as RequestHandler)
    }
  return { get: add('get'), post: add('post'), put: add('put'), patch: add('patch'), delete: add('delete') }
}

export type ScopedRouter = ReturnType<typeof scoped>
