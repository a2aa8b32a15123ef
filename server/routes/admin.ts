// Site administration: list and update users (no operation data), and in development the mail sink's inbox.
import { Router } from 'express'
import { Op } from 'sequelize'
import { z } from 'zod'
import { ctx } from '../context'
import { requireAdmin, requireUser } from '../middleware/auth'
import { parseBody, parseParam, parseQuery } from '../middleware/validate'
import { adminUserUpdateSchema } from '../../shared/schemas/operations'
import { pageQuerySchema } from '../../shared/schemas/common'
import { User } from '../models/index'
import { AppError } from '../errors'

export function adminRouter() {
  const r = Router()
  r.use(requireUser, requireAdmin)
  r.get('/users', async (req, res) => {
    const q = parseQuery(pageQuerySchema, req)
    const where = q.q ? { [Op.or]: [{ email: { [Op.iLike]: `%${q.q}%` } }, { name: { [Op.iLike]: `%${q.q}%` } }] } : {}
    const { rows, count } = await User.findAndCountAll({ where, order: [['id', 'ASC']], limit: q.pageSize, offset: (q.page - 1) * q.pageSize })
    res.json({
      items: rows.map((u) => ({ id: u.id, name: u.name, email: u.email, isAdmin: u.isAdmin, disabled: u.disabled, createdAt: u.createdAt })),
      total: count,
      page: q.page,
      pageSize: q.pageSize,
    })
  })
  r.patch('/users/:userId', async (req, res) => {
    const input = parseBody(adminUserUpdateSchema, req)
    const id = parseParam(req, 'userId')
    if (id === req.user!.id && (input.isAdmin === false || input.disabled === true)) {
      throw new AppError(409, 'self_lockout', 'You cannot remove your own admin flag or disable yourself.')
    }
    const u = await User.findByPk(id)
    if (!u) throw AppError.notFound('User')
    if (input.isAdmin !== undefined) u.isAdmin = input.isAdmin
    if (input.disabled !== undefined) {
      u.disabled = input.disabled
      if (input.disabled) u.tokenVersion = u.tokenVersion + 1
    }
    await u.save()
    res.json({ id: u.id, name: u.name, email: u.email, isAdmin: u.isAdmin, disabled: u.disabled })
  })
  r.get('/mail', (req, res) => {
    const { sink, config } = ctx(req)
    if (!sink || config.env === 'production') throw new AppError(404, 'not_found', 'No local mail sink is running.')
    const q = parseQuery(z.object({ to: z.string().max(254).optional() }), req)
    const items = [...sink.messages].reverse().filter((m) => !q.to || m.to.includes(q.to.toLowerCase()))
    res.json({ items })
  })
  return r
}
