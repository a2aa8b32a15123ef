// Routes for strip plans, the herd groups they can be for, the crew's records, Today and the Season.
import { z } from 'zod'
import { ctx } from '../../context'
import { parseBody, parseParam, parseQuery } from '../../middleware/validate'
import type { ScopedRouter } from '../scoped'
import { isoDateSchema } from '../../../shared/schemas/common'
import { planCreateSchema, planUpdateSchema } from '../../../shared/schemas/grazing/plans'
import { recordCreateSchema, recordListQuerySchema, recordUpdateSchema } from '../../../shared/schemas/grazing/records'
import { seasonSettingsSchema } from '../../../shared/schemas/grazing/season'
import * as plans from '../../services/grazing/plans'
import * as records from '../../services/grazing/records'
import { today } from '../../services/grazing/today'
import { getSeason, saveSeasonSettings } from '../../services/grazing/season'
import { listHerdGroups } from '../../services/grazing/nutritionLinks'
import { todayIso } from '../../services/dates'

const dateQuery = z.object({ date: isoDateSchema.optional() })

export function planRoutes(r: ScopedRouter) {
  r.get('/grazing-groups', 'operation:read', async (req, res) => {
    const { date } = parseQuery(dateQuery, req)
    res.json({ items: await listHerdGroups(ctx(req).sequelize, req.operation!.id, date ?? todayIso()) })
  })

  r.get('/strip-plans', 'operation:read', async (req, res) => {
    const items = await plans.listPlans(ctx(req).sequelize, req.operation!.id)
    res.json({ items, total: items.length })
  })
  r.post('/strip-plans', 'data:edit', async (req, res) => {
    res.status(201).json(await plans.createPlan(ctx(req).sequelize, req.operation!.id, parseBody(planCreateSchema, req)))
  })
  r.get('/strip-plans/:planId', 'operation:read', async (req, res) => {
    res.json(await plans.getPlan(ctx(req).sequelize, req.operation!.id, parseParam(req, 'planId')))
  })
  r.patch('/strip-plans/:planId', 'data:edit', async (req, res) => {
    const id = parseParam(req, 'planId')
    res.json(await plans.updatePlan(ctx(req).sequelize, req.operation!.id, id, parseBody(planUpdateSchema, req)))
  })
  r.delete('/strip-plans/:planId', 'data:edit', async (req, res) => {
    await plans.deletePlan(req.operation!.id, parseParam(req, 'planId'))
    res.status(204).end()
  })
  r.get('/strip-plans/:planId/evaluation', 'operation:read', async (req, res) => {
    const id = parseParam(req, 'planId')
    const { date } = parseQuery(dateQuery, req)
    res.json(await plans.planEvaluation(ctx(req).sequelize, req.operation!.id, id, date ?? todayIso()))
  })

  r.get('/records', 'operation:read', async (req, res) => {
    const items = await records.listRecords(req.operation!.id, parseQuery(recordListQuerySchema, req))
    res.json({ items, total: items.length })
  })
  r.post('/records', 'records:write', async (req, res) => {
    res.status(201).json(await records.createRecord(ctx(req).sequelize, req.operation!.id, req.user!.id, parseBody(recordCreateSchema, req)))
  })
  r.get('/records/:recordId', 'operation:read', async (req, res) => {
    res.json(await records.getRecord(req.operation!.id, parseParam(req, 'recordId')))
  })
  r.patch('/records/:recordId', 'records:write', async (req, res) => {
    const id = parseParam(req, 'recordId')
    res.json(await records.updateRecord(req.operation!.id, req.user!.id, req.role!, id, parseBody(recordUpdateSchema, req)))
  })
  r.delete('/records/:recordId', 'records:write', async (req, res) => {
    await records.deleteRecord(req.operation!.id, req.user!.id, req.role!, parseParam(req, 'recordId'))
    res.status(204).end()
  })

  r.get('/today', 'operation:read', async (req, res) => {
    const { date } = parseQuery(dateQuery, req)
    res.json(await today(ctx(req).sequelize, req.operation!.id, date ?? todayIso()))
  })

  r.get('/season', 'operation:read', async (req, res) => {
    res.json(await getSeason(ctx(req).sequelize, req.operation!.id))
  })
  r.put('/season/settings', 'data:edit', async (req, res) => {
    res.json(await saveSeasonSettings(req.operation!.id, parseBody(seasonSettingsSchema, req)))
  })
}
