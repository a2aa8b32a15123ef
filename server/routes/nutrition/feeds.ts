// Feed routes: the reference set and the operation's own feeds — list, CSV export, read, create, update and delete (own only).
import { ctx } from '../../context'
import { parseParam, parseQuery } from '../../middleware/validate'
import { listQuerySchema } from '../../../shared/schemas/nutrition/common'
import { feedListQuerySchema } from '../../../shared/schemas/nutrition/feeds'
import { createFeed, deleteFeed, getFeed, listFeeds, updateFeed } from '../../services/nutrition/feeds'
import { exportFeeds, sendCsv, unitsQuery } from '../../services/nutrition/exports'
import type { ScopedRouter } from '../scoped'

const feedQuery = listQuerySchema.extend(feedListQuerySchema.shape)

export function feedRoutes(r: ScopedRouter) {
  r.get('/feeds', 'operation:read', async (req, res) => {
    res.json(await listFeeds(req.operation!.id, parseQuery(feedQuery, req)))
  })
  r.get('/feeds/export.csv', 'operation:read', async (req, res) => {
    sendCsv(res, 'feeds', await exportFeeds(req.operation!.id, parseQuery(unitsQuery, req).units ?? req.user!.unitSystem))
  })
  r.post('/feeds', 'data:edit', async (req, res) => {
    res.status(201).json(await createFeed(req.operation!.id, req.user!, req.body))
  })
  r.get('/feeds/:feedId', 'operation:read', async (req, res) => {
    res.json(await getFeed(req.operation!.id, parseParam(req, 'feedId')))
  })
  r.patch('/feeds/:feedId', 'data:edit', async (req, res) => {
    res.json(await updateFeed(ctx(req).sequelize, req.operation!.id, req.user!, parseParam(req, 'feedId'), req.body))
  })
  r.delete('/feeds/:feedId', 'data:edit', async (req, res) => {
    await deleteFeed(ctx(req).sequelize, req.operation!.id, parseParam(req, 'feedId'))
    res.status(204).end()
  })
}
