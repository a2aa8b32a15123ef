// Balance routes: list, CSV export, run and store, preview, a field's offer on a date, read a version, re-run, rename, delete, re-run all out of date.
import { z } from 'zod'
import { ctx } from '../../context'
import { parseBody, parseParam, parseQuery } from '../../middleware/validate'
import { isoDay, listQuerySchema } from '../../../shared/schemas/nutrition/common'
import { balanceListQuerySchema } from '../../../shared/schemas/nutrition/balances'
import {
  createBalance,
  deleteBalance,
  fieldOffer,
  getBalance,
  listBalances,
  previewBalance,
  renameBalance,
  rerunBalance,
  rerunOutOfDate,
} from '../../services/nutrition/balances'
import { exportBalance, exportBalances, sendCsv, unitsQuery } from '../../services/nutrition/exports'
import type { ScopedRouter } from '../scoped'

const balanceQuery = listQuerySchema.extend(balanceListQuerySchema.shape)
const versionQuery = z.object({ version: z.coerce.number().int().min(1).optional() })

export function balanceRoutes(r: ScopedRouter) {
  r.get('/balances', 'operation:read', async (req, res) => {
    res.json(await listBalances(req.operation!.id, parseQuery(balanceQuery, req)))
  })
  r.get('/balances/export.csv', 'operation:read', async (req, res) => {
    sendCsv(res, 'balances', await exportBalances(req.operation!.id))
  })
  r.get('/balances/field-offer', 'operation:read', async (req, res) => {
    const q = parseQuery(z.object({ fieldId: z.coerce.number().int().positive(), date: isoDay }), req)
    res.json(await fieldOffer(req.operation!.id, q.fieldId, q.date))
  })
  r.post('/balances', 'data:edit', async (req, res) => {
    res.status(201).json(await createBalance(ctx(req).sequelize, req.operation!.id, req.user!, req.body))
  })
  r.post('/balances/preview', 'operation:read', async (req, res) => {
    res.json(await previewBalance(req.operation!.id, req.body))
  })
  r.post('/balances/rerun-out-of-date', 'data:edit', async (req, res) => {
    const { ids } = parseBody(z.object({ ids: z.array(z.number().int().positive()).max(500).optional() }), req)
    res.json(await rerunOutOfDate(ctx(req).sequelize, req.operation!.id, req.user!, ids))
  })
  r.get('/balances/:balanceId', 'operation:read', async (req, res) => {
    res.json(await getBalance(req.operation!.id, parseParam(req, 'balanceId'), parseQuery(versionQuery, req).version))
  })
  r.get('/balances/:balanceId/export.csv', 'operation:read', async (req, res) => {
    const q = parseQuery(versionQuery.extend(unitsQuery.shape), req)
    sendCsv(res, `balance-${req.params.balanceId}`, await exportBalance(req.operation!.id, parseParam(req, 'balanceId'), q.version, q.units ?? req.user!.unitSystem))
  })
  r.post('/balances/:balanceId/runs', 'data:edit', async (req, res) => {
    res.status(201).json(await rerunBalance(ctx(req).sequelize, req.operation!.id, req.user!, parseParam(req, 'balanceId'), req.body))
  })
  r.patch('/balances/:balanceId', 'data:edit', async (req, res) => {
    res.json(await renameBalance(ctx(req).sequelize, req.operation!.id, parseParam(req, 'balanceId'), req.user!, req.body))
  })
  r.delete('/balances/:balanceId', 'data:edit', async (req, res) => {
    await deleteBalance(req.operation!.id, parseParam(req, 'balanceId'))
    res.status(204).end()
  })
}
