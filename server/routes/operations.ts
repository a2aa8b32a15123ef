// Operation routes: the user's operations, creating one, invitation look-up and acceptance, and the operation-scoped Team routes.
import { Router } from 'express'
import { ctx } from '../context'
import { requireUser } from '../middleware/auth'
import { loadOperationMembership } from '../middleware/operation'
import { parseBody, parseParam } from '../middleware/validate'
import { inviteAcceptSchema, inviteCreateSchema, memberUpdateSchema, operationCreateSchema, operationUpdateSchema } from '../../shared/schemas/operations'
import { acceptInvitation, changeRole, createOperation, findInvitation, invite, listMembers, removeMember, revokeInvitation } from '../services/operations'
import { describeUser } from '../services/accounts'
import { scoped, type ScopedRouter } from './scoped'
import { AppError } from '../errors'

/** Routes under /api/operations/:operationId — every one behind loadOperationMembership and a permission. */
export function operationScopedRouter(extra: Array<(r: ScopedRouter) => void> = []) {
  const router = Router({ mergeParams: true })
  router.use(requireUser, loadOperationMembership)
  const r = scoped(router)

  r.get('/', 'operation:read', (req, res) => {
    const op = req.operation!
    res.json({ id: op.id, name: op.name, species: op.species, isDemo: op.isDemo, role: req.role })
  })
  r.patch('/', 'operation:manage', async (req, res) => {
    const input = parseBody(operationUpdateSchema, req)
    await req.operation!.update(input)
    const op = req.operation!
    res.json({ id: op.id, name: op.name, species: op.species, isDemo: op.isDemo, role: req.role })
  })
  r.get('/members', 'operation:read', async (req, res) => {
    res.json(await listMembers(req.operation!.id))
  })
  r.post('/invitations', 'members:manage', async (req, res) => {
    const input = parseBody(inviteCreateSchema, req)
    const { config, mailer } = ctx(req)
    res.status(201).json(await invite(config, mailer, req.operation!, req.user!, input.email, input.role))
  })
  r.delete('/invitations/:invitationId', 'members:manage', async (req, res) => {
    await revokeInvitation(req.operation!.id, parseParam(req, 'invitationId'))
    res.status(204).end()
  })
  r.patch('/members/:memberId', 'members:manage', async (req, res) => {
    const input = parseBody(memberUpdateSchema, req)
    const m = await changeRole(ctx(req).sequelize, req.operation!.id, parseParam(req, 'memberId'), input.role)
    res.json({ id: m.id, role: m.role })
  })
  r.delete('/members/:memberId', 'members:manage', async (req, res) => {
    await removeMember(ctx(req).sequelize, req.operation!.id, parseParam(req, 'memberId'))
    res.status(204).end()
  })
  for (const add of extra) add(r)
  return router
}

export function operationsRouter() {
  const r = Router()
  r.get('/', requireUser, async (req, res) => {
    res.json((await describeUser(req.user!)).memberships)
  })
  r.post('/', requireUser, async (req, res) => {
    const input = parseBody(operationCreateSchema, req)
    const op = await createOperation(ctx(req).sequelize, req.user!, input)
    res.status(201).json({ id: op.id, name: op.name, species: op.species, isDemo: op.isDemo, role: 'owner' })
  })
  return r
}

export function invitationsRouter() {
  const r = Router()
  // Public: the accept page shows what the invitation is for before the invitee signs in or up.
  r.get('/:token', async (req, res) => {
    res.json(await findInvitation(String(req.params.token)))
  })
  r.post('/accept', requireUser, async (req, res) => {
    const input = parseBody(inviteAcceptSchema, req)
    const info = await findInvitation(input.token)
    if (info.email !== req.user!.email) {
      throw new AppError(403, 'wrong_account', `This invitation is for ${info.email}. Sign in with that address to accept it.`)
    }
    const result = await ctx(req).sequelize.transaction((t) => acceptInvitation(req.user!, input.token, t))
    res.json(result)
  })
  return r
}
