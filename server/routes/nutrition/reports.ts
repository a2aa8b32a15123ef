// Report routes: a balance's PDF, e-mailing it (with the PDF attached) to members or a client address, and the log of reports sent.
import { z } from 'zod'
import { ctx } from '../../context'
import { parseParam, parseQuery } from '../../middleware/validate'
import { listQuerySchema } from '../../../shared/schemas/nutrition/common'
import { balancePdf, emailReport, listReportSends } from '../../services/nutrition/reports'
import { unitsQuery } from '../../services/nutrition/exports'
import type { ScopedRouter } from '../scoped'

const pdfQuery = unitsQuery.extend({ version: z.coerce.number().int().min(1).optional() })

export function reportRoutes(r: ScopedRouter) {
  r.get('/balances/:balanceId/report.pdf', 'operation:read', async (req, res) => {
    const q = parseQuery(pdfQuery, req)
    const { filename, pdf } = await balancePdf(req.operation!, parseParam(req, 'balanceId'), q.version, q.units ?? req.user!.unitSystem)
    res.setHeader('Content-Type', 'application/pdf')
    res.setHeader('Content-Disposition', `${req.query.download === '1' ? 'attachment' : 'inline'}; filename="${filename}"`)
    res.send(pdf)
  })
  r.post('/balances/:balanceId/email', 'reports:send', async (req, res) => {
    res.status(201).json(await emailReport(ctx(req), req.operation!, req.user!, parseParam(req, 'balanceId'), req.body))
  })
  r.get('/report-sends', 'operation:read', async (req, res) => {
    res.json(await listReportSends(req.operation!.id, parseQuery(listQuerySchema, req)))
  })
}
