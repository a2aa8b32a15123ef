// Herd group routes: list (paged, sorted, filtered), CSV export, read, daily requirements on a date, create, update, delete.
import { z } from 'zod'
import { ctx } from '../../context'
import { parseParam, parseQuery } from '../../middleware/validate'
import { listQuerySchema } from '../../../shared/schemas/nutrition/common'
import { isoDay } from '../../../shared/schemas/nutrition/common'
import { createHerd, deleteHerd, findHerd, herdRequirements, herdView, listHerds, updateHerd } from '../../services/nutrition/herds'
import { exportHerds, sendCsv, unitsQuery } from '../../services/nutrition/exports'
import type { ScopedRouter } from '../scoped'

const herdListQuery = listQuerySchema.extend({ species: z.enum(['cattle', 'sheep']).optional() })

export function herdRoutes(r: ScopedRouter) {
  r.get('/herds', 'operation:read', async (req, res) => {
    res.json(await listHerds(req.operation!.id, parseQuery(herdListQuery, req)))
  })
  r.get('/herds/export.csv', 'operation:read', async (req, res) => {
    sendCsv(res, 'herds', await exportHerds(req.operation!.id, parseQuery(unitsQuery, req).units ?? req.user!.unitSystem))
  })
  r.post('/herds', 'data:edit', async (req, res) => {
    res.status(201).json(await createHerd(req.operation!.id, req.user!, req.body))
  })
  r.get('/herds/:herdId', 'operation:read', async (req, res) => {
    res.json(herdView(await findHerd(req.operation!.id, parseParam(req, 'herdId'))))
  })
  r.get('/herds/:herdId/requirements', 'operation:read', async (req, res) => {
    const { date } = parseQuery(z.object({ date: isoDay.optional() }), req)
    res.json(await herdRequirements(req.operation!.id, parseParam(req, 'herdId'), date))
  })
  r.patch('/herds/:herdId', 'data:edit', async (req, res) => {
    res.json(await updateHerd(ctx(req).sequelize, req.operation!.id, req.user!, parseParam(req, 'herdId'), req.body))
  })
  r.delete('/herds/:herdId', 'data:edit', async (req, res) => {
    await deleteHerd(req.operation!.id, parseParam(req, 'herdId'))
    res.status(204).end()
  })
}
