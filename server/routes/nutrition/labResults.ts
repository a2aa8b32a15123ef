// Lab result routes: list, CSV export and template, read with history, create, versioned update, delete, and the CSV upload (preview, progress, confirm).
import multer from 'multer'
import { z } from 'zod'
import { ctx } from '../../context'
import { parseParam, parseQuery } from '../../middleware/validate'
import { listQuerySchema } from '../../../shared/schemas/nutrition/common'
import { LAB_UPLOAD_MAX_BYTES, labCsvColumns, uploadRowsQuerySchema } from '../../../shared/schemas/nutrition/labResults'
import { createLabResult, deleteLabResult, findLabResult, labView, listLabResults, updateLabResult } from '../../services/nutrition/labResults'
import { confirmUpload, findUpload, startUpload, uploadView } from '../../services/nutrition/labUploads'
import { exportLabResults, sendCsv } from '../../services/nutrition/exports'
import type { ScopedRouter } from '../scoped'

const labQuery = listQuerySchema.extend({ feedId: z.coerce.number().int().positive().optional(), fieldId: z.coerce.number().int().positive().optional() })
const upload = multer({ storage: multer.memoryStorage(), limits: { fileSize: LAB_UPLOAD_MAX_BYTES, files: 1, fields: 5 } })

export function labResultRoutes(r: ScopedRouter) {
  r.get('/lab-results', 'operation:read', async (req, res) => {
    res.json(await listLabResults(req.operation!.id, parseQuery(labQuery, req)))
  })
  r.get('/lab-results/export.csv', 'operation:read', async (req, res) => {
    sendCsv(res, 'lab-results', await exportLabResults(req.operation!.id))
  })
  r.get('/lab-results/template.csv', 'operation:read', (_req, res) => {
    sendCsv(res, 'lab-results-template', `${labCsvColumns.join(',')}\n`)
  })
  r.post('/lab-results', 'data:edit', async (req, res) => {
    res.status(201).json(await createLabResult(ctx(req).sequelize, req.operation!.id, req.user!, req.body))
  })
  r.post(
    '/lab-results/uploads',
    'data:edit',
    async (req, res) => {
      res.status(202).json(await startUpload(req.operation!.id, req.user!, req.file, ctx(req).logger))
    },
    upload.single('file'),
  )
  r.get('/lab-results/uploads/:uploadId', 'operation:read', async (req, res) => {
    const u = await findUpload(req.operation!.id, parseParam(req, 'uploadId'))
    const withRows = req.query.rows === '1' || req.query.rows === 'true'
    res.json(uploadView(u, withRows ? parseQuery(uploadRowsQuerySchema, req) : undefined))
  })
  r.post('/lab-results/uploads/:uploadId/confirm', 'data:edit', async (req, res) => {
    res.json(await confirmUpload(ctx(req).sequelize, req.operation!.id, req.user!, parseParam(req, 'uploadId'), req.body))
  })
  r.get('/lab-results/:labResultId', 'operation:read', async (req, res) => {
    res.json(await labView(await findLabResult(req.operation!.id, parseParam(req, 'labResultId')), { history: true }))
  })
  r.patch('/lab-results/:labResultId', 'data:edit', async (req, res) => {
    res.json(await updateLabResult(ctx(req).sequelize, req.operation!.id, req.user!, parseParam(req, 'labResultId'), req.body))
  })
  r.delete('/lab-results/:labResultId', 'data:edit', async (req, res) => {
    await deleteLabResult(ctx(req).sequelize, req.operation!.id, parseParam(req, 'labResultId'))
    res.status(204).end()
  })
}
