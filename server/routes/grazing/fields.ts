// Routes for fields, their components, yield worksheets and the feeds a field offers on a date.
import { z } from 'zod'
import { ctx } from '../../context'
import { parseBody, parseParam, parseQuery } from '../../middleware/validate'
import type { ScopedRouter } from '../scoped'
import { componentInputSchema, componentUpdateSchema, fieldCreateSchema, fieldUpdateSchema } from '../../../shared/schemas/grazing/fields'
import { worksheetSchema } from '../../../shared/schemas/grazing/estimates'
import { isoDateSchema } from '../../../shared/schemas/common'
import * as fields from '../../services/grazing/fields'
import * as estimates from '../../services/grazing/estimates'
import { fieldFeedsForBalance } from '../../services/grazing/fieldFeeds'
import { todayIso } from '../../services/dates'

const dateQuery = z.object({ date: isoDateSchema.optional() })

export function fieldRoutes(r: ScopedRouter) {
  r.get('/fields', 'operation:read', async (req, res) => {
    const items = await fields.listFields(ctx(req).sequelize, req.operation!.id)
    res.json({ items, total: items.length })
  })
  r.post('/fields', 'data:edit', async (req, res) => {
    res.status(201).json(await fields.createField(ctx(req).sequelize, req.operation!.id, parseBody(fieldCreateSchema, req)))
  })
  r.get('/fields/:fieldId', 'operation:read', async (req, res) => {
    res.json(await fields.getField(ctx(req).sequelize, req.operation!.id, parseParam(req, 'fieldId')))
  })
  r.patch('/fields/:fieldId', 'data:edit', async (req, res) => {
    const id = parseParam(req, 'fieldId')
    res.json(await fields.updateField(ctx(req).sequelize, req.operation!.id, id, parseBody(fieldUpdateSchema, req)))
  })
  r.delete('/fields/:fieldId', 'data:edit', async (req, res) => {
    await fields.deleteField(req.operation!.id, parseParam(req, 'fieldId'))
    res.status(204).end()
  })

  r.get('/fields/:fieldId/components', 'operation:read', async (req, res) => {
    const f = await fields.getField(ctx(req).sequelize, req.operation!.id, parseParam(req, 'fieldId'))
    res.json({ items: f.components, total: f.components.length })
  })
  r.post('/fields/:fieldId/components', 'data:edit', async (req, res) => {
    const id = parseParam(req, 'fieldId')
    res.status(201).json(await fields.createComponent(ctx(req).sequelize, req.operation!.id, id, parseBody(componentInputSchema, req)))
  })
  r.get('/fields/:fieldId/components/:componentId', 'operation:read', async (req, res) => {
    res.json(await fields.getComponent(ctx(req).sequelize, req.operation!.id, parseParam(req, 'fieldId'), parseParam(req, 'componentId')))
  })
  r.patch('/fields/:fieldId/components/:componentId', 'data:edit', async (req, res) => {
    const [f, c] = [parseParam(req, 'fieldId'), parseParam(req, 'componentId')]
    res.json(await fields.updateComponent(ctx(req).sequelize, req.operation!.id, f, c, parseBody(componentUpdateSchema, req)))
  })
  r.delete('/fields/:fieldId/components/:componentId', 'data:edit', async (req, res) => {
    await fields.deleteComponent(req.operation!.id, parseParam(req, 'fieldId'), parseParam(req, 'componentId'))
    res.status(204).end()
  })

  r.get('/fields/:fieldId/estimates', 'operation:read', async (req, res) => {
    const items = await estimates.listEstimates(req.operation!.id, parseParam(req, 'fieldId'))
    res.json({ items, total: items.length })
  })
  r.post('/fields/:fieldId/estimates', 'data:edit', async (req, res) => {
    const id = parseParam(req, 'fieldId')
    const w = parseBody(worksheetSchema, req)
    const { estimate } = await estimates.createEstimate(ctx(req).sequelize, req.operation!.id, id, req.user!.id, w)
    res.status(201).json({ estimate, field: await fields.getField(ctx(req).sequelize, req.operation!.id, id) })
  })
  r.get('/fields/:fieldId/estimates/:estimateId', 'operation:read', async (req, res) => {
    res.json(await estimates.getEstimate(req.operation!.id, parseParam(req, 'fieldId'), parseParam(req, 'estimateId')))
  })
  r.delete('/fields/:fieldId/estimates/:estimateId', 'data:edit', async (req, res) => {
    await estimates.deleteEstimate(req.operation!.id, parseParam(req, 'fieldId'), parseParam(req, 'estimateId'))
    res.status(204).end()
  })

  r.get('/fields/:fieldId/feeds', 'operation:read', async (req, res) => {
    const id = parseParam(req, 'fieldId')
    const { date } = parseQuery(dateQuery, req)
    res.json(await fieldFeedsForBalance(req.operation!.id, id, date ?? todayIso()))
  })
}
