// Balance reports: a PDF (pdfkit) with the operation, group, feeds, need against supply, the supplement plan, warnings, cautions and the guide footer; e-mailed with the PDF attached.
import PDFDocument from 'pdfkit'
import { AppError } from '../../errors'
import { Membership, User, type Operation } from '../../models/index'
import { ReportSend } from '../../models/nutrition'
import type { AppContext } from '../../context'
import type { BalanceResult } from '../../../shared/engine/nutrition/ration/schema'
import { REPORT_FOOTER, coverageWord, nutrientLabels, reportEmailSchema, statusLabels } from '../../../shared/schemas/nutrition/balances'
import { supplementPlan, type SupplementPlan } from '../../../shared/adapters/nutrition/plan'
import { cautionsFor, FIRST_COME } from '../../../shared/schemas/nutrition/cautions'
import { fmtMass, fmtMoney, fmtNumber, fmtPct, massUnit, nutrientDisplay, type Units } from '../../../shared/schemas/nutrition/format'
import { classLabels } from '../../../shared/schemas/nutrition/herds'
import type { ExcludedFeed, FeedRef } from '../../../shared/adapters/nutrition/problem'
import type { HerdStage } from '../../../shared/schemas/nutrition/herds'
import type { Requirements } from '../../../shared/engine/nutrition/requirements'
import type { Feed as EngineFeed } from '../../../shared/engine/nutrition/ration/schema'
import type { ListQuery } from '../../../shared/schemas/nutrition/common'
import { balanceVersion } from './balances'
import { iso, paging, parseWith } from './common'

type StoredInputs = {
  herd: { id: number; name: string; species: 'cattle' | 'sheep'; class: string; headCount: number; bodyWeightKg: number; bcs: number; litterSize?: number | null }
  field: { id: number; name: string } | null
  problem: { feeds: EngineFeed[] }
  requirements: Requirements
  stage: HerdStage
  feeds: FeedRef[]
  excluded: ExcludedFeed[]
  notes: string[]
}

/** Everything a report shows, computed once for the PDF, the e-mail text and the print view's tests. */
export async function reportData(operation: Operation, balanceId: number, version?: number) {
  const { balance, version: v } = await balanceVersion(operation.id, balanceId, version)
  const inputs = v.inputs as unknown as StoredInputs
  const result = v.result as unknown as BalanceResult
  const plan = supplementPlan(result, inputs.feeds, inputs.herd.headCount)
  const cautions = cautionsFor({
    species: inputs.herd.species,
    feeds: inputs.problem.feeds,
    result,
    onSorghumField: !!inputs.field,
    lateGestationMultiples: inputs.herd.species === 'sheep' && (inputs.herd.litterSize ?? 1) > 1 && inputs.stage.sheepStage === 'late-gestation',
  })
  return { operation, balance, version: v, inputs, result, plan, cautions }
}
type ReportData = Awaited<ReturnType<typeof reportData>>

// The PDF's standard fonts cover Latin-1 (WinAnsi); a few typographic signs are spelled out so nothing prints as garbage.
const SIGNS: Record<string, string> = { '→': '->', '≥': '>=', '≤': '<=', '≈': '~', '−': '-', '‑': '-', '₃': '3', '\u2009': ' ', '\u202f': ' ' }
function pdfText(s: string) {
  return s.replace(/[^\x20-\x7e\xa0-\xff–—‘’“”•…]/g, (c) => SIGNS[c] ?? '?')
}

const RUST = '#a4481f'
const LEGUME = '#4f7d33'
const SLATE = '#3f4b57'
const wordColour = { short: RUST, covered: LEGUME, surplus: SLATE } as const

export function filenameFor(d: Pick<ReportData, 'inputs' | 'balance' | 'version'>) {
  const slug = d.inputs.herd.name.toLowerCase().replace(/[^a-z0-9]+/g, '-').replace(/^-|-$/g, '').slice(0, 40) || 'group'
  return `standgraze-balance-${slug}-${d.balance.date}-v${d.version.version}.pdf`
}

export async function renderPdf(d: ReportData, units: Units): Promise<Buffer> {
  const doc = new PDFDocument({ size: 'LETTER', margins: { top: 50, bottom: 70, left: 50, right: 50 }, bufferPages: true, info: { Title: `Balance report: ${d.inputs.herd.name}`, Author: 'StandGraze' } })
  const chunks: Buffer[] = []
  doc.on('data', (c: Buffer) => chunks.push(c))
  const done = new Promise<Buffer>((resolve) => doc.on('end', () => resolve(Buffer.concat(chunks))))
  const W = doc.page.width - 100
  const t = (s: string, opts?: PDFKit.Mixins.TextOptions) => doc.text(pdfText(s), opts)
  const h2 = (s: string) => {
    if (doc.y > doc.page.height - 140) doc.addPage()
    doc.moveDown(0.6).font('Helvetica-Bold').fontSize(12).fillColor(SLATE)
    t(s)
    doc.font('Helvetica').fontSize(9.5).fillColor('#222222').moveDown(0.2)
  }
  const { inputs, result, plan } = d

  doc.font('Helvetica-Bold').fontSize(18).fillColor(RUST)
  t('StandGraze balance report')
  doc.font('Helvetica').fontSize(10).fillColor('#222222')
  t(`${d.operation.name}${d.operation.isDemo ? ' - demo operation, invented data' : ''}`)
  t(`Group: ${inputs.herd.name} (${classLabels[inputs.herd.class as keyof typeof classLabels] ?? inputs.herd.class}, ${inputs.herd.headCount} head, ${fmtMass(inputs.herd.bodyWeightKg, units, 0)}, body condition ${inputs.herd.bcs})`)
  t(`Date: ${d.balance.date} - ${inputs.stage.label}${inputs.field ? ` - on ${inputs.field.name}` : ''}`)
  t(`Run ${d.version.version} by ${d.version.createdByName}, ${iso(d.version.createdAt).slice(0, 16).replace('T', ' ')} UTC${d.balance.outOfDate && d.version.version === d.balance.version ? ' - OUT OF DATE: ' + (d.balance.outOfDateReason ?? '') : ''}`)
  doc.moveDown(0.3).font('Helvetica-Bold').fillColor(result.status === 'short' ? RUST : LEGUME)
  t(statusLabels[result.status] ?? result.status)
  doc.font('Helvetica').fillColor('#222222')

  h2('Feeds')
  for (const f of inputs.problem.feeds) {
    const ref = inputs.feeds.find((r) => r.engineId === f.id)
    const origin = ref?.labResultId ? 'lab result' : ref?.kind === 'field' ? 'field component' : 'book or label value'
    t(`${f.name} (${f.role}): DM ${fmtNumber(f.dmPct, 1)} %, CP ${fmtNumber(f.cpPctDm, 1)} % DM, TDN ${fmtNumber(f.tdnPctDm, 1)} % DM${f.caPctDm != null ? `, Ca ${fmtNumber(f.caPctDm, 2)} %` : ''}${f.pPctDm != null ? `, P ${fmtNumber(f.pPctDm, 2)} %` : ''}${ref?.costPerKgAsFed != null ? `, ${fmtMoney(units === 'us' ? ref.costPerKgAsFed * 0.45359237 : ref.costPerKgAsFed)}/${massUnit(units)} as fed` : ''} - ${origin}`)
  }
  for (const x of inputs.excluded) t(`Left out: ${x.name} - ${x.reason}`)

  h2('Need against supply, per head per day')
  const dmi = result.intakes.reduce((a, i) => a + i.kgDm, 0)
  const bars: Array<{ label: string; need: string; supplied: string; pct: number; word: string }> = [
    { label: nutrientLabels.dm, need: fmtMass(result.intakeCapacityKg, units), supplied: fmtMass(dmi, units), pct: (100 * dmi) / result.intakeCapacityKg, word: dmi <= result.intakeCapacityKg * 1.005 ? 'within capacity' : 'over capacity' },
    ...result.supply.map((s) => {
      const need = nutrientDisplay(s.need, s.unit, units)
      const sup = nutrientDisplay(s.supplied, s.unit, units)
      return { label: nutrientLabels[s.nutrient] ?? s.nutrient, need: `${fmtNumber(need.value)} ${need.unit}`, supplied: `${fmtNumber(sup.value)} ${sup.unit}`, pct: s.pctCovered, word: coverageWord(s.pctCovered) }
    }),
  ]
  for (const b of bars) {
    if (doc.y > doc.page.height - 110) doc.addPage()
    const y = doc.y
    doc.fontSize(9.5).fillColor('#222222')
    doc.text(pdfText(`${b.label}: need ${b.need}, supplied ${b.supplied} - ${fmtPct(b.pct)} ${b.word}`), 50, y, { width: W })
    const by = doc.y + 2
    const barW = W * 0.7
    doc.rect(50, by, barW, 7).fill('#e9e3d8')
    const colour = b.word in wordColour ? wordColour[b.word as keyof typeof wordColour] : b.word === 'over capacity' ? RUST : LEGUME
    doc.rect(50, by, Math.max(1, (barW * Math.min(b.pct, 150)) / 150), 7).fill(colour)
    doc.rect(50 + (barW * 100) / 150, by - 2, 1, 11).fill('#222222')
    doc.fillColor('#222222')
    doc.x = 50
    doc.y = by + 12
  }
  doc.fontSize(8).fillColor('#555555')
  t('Bars run to 150 % of need; the black tick marks 100 %.')
  doc.fontSize(9.5).fillColor('#222222')

  h2('What is short')
  const fieldShort = result.deficiencies.filter((x) => x.shortBy > 1e-6)
  if (!fieldShort.length) t(inputs.field ? 'The field alone covers every need.' : 'The base feeds alone cover every need.')
  for (const x of fieldShort) {
    const v = nutrientDisplay(x.shortBy, x.unit, units)
    t(`From the ${inputs.field ? 'field' : 'base feeds'} alone, ${nutrientLabels[x.nutrient] ?? x.nutrient} is short by ${fmtNumber(v.value)} ${v.unit} per head per day.`)
  }
  for (const x of result.stillShort.filter((s) => s.shortBy > 1e-6)) {
    const v = nutrientDisplay(x.shortBy, x.unit, units)
    t(`Even with the supplements on hand, ${nutrientLabels[x.nutrient] ?? x.nutrient} stays short by ${fmtNumber(v.value)} ${v.unit} per head per day.`)
  }
  t(
    result.minLegumeShareForProtein === null
      ? 'Even a diet of the legume alone would not cover protein.'
      : `Smallest legume share of diet DM that would cover protein without supplement: ${fmtPct(result.minLegumeShareForProtein * 100)}.`,
  )
  for (const c of result.conflicts) t(`Conflict: ${c}`)

  h2('Supplement plan')
  writePlan(plan, units, t)

  if (result.warnings.length) {
    h2('Warnings')
    for (const w of result.warnings) t(`${w.message} (Source: ${w.source})`)
  }
  h2('Cautions')
  for (const c of d.cautions) {
    doc.font('Helvetica-Bold')
    t(c.title)
    doc.font('Helvetica')
    t(`${c.text} ${FIRST_COME} (Source: ${c.source})`)
  }
  if (!d.cautions.length) t(FIRST_COME)
  if (inputs.notes.length || inputs.requirements.notes.length) {
    h2('Notes')
    for (const n of [...inputs.notes, ...inputs.requirements.notes]) t(n)
    doc.fontSize(8).fillColor('#555555')
    t(`Requirements from: ${inputs.requirements.sources.join('; ')}`)
  }

  const range = doc.bufferedPageRange()
  for (let i = range.start; i < range.start + range.count; i++) {
    doc.switchToPage(i)
    const bottom = doc.page.margins.bottom
    doc.page.margins.bottom = 0
    doc.fontSize(7.5).fillColor('#555555')
    doc.text(pdfText(`${REPORT_FOOTER}  Page ${i + 1} of ${range.count}.`), 50, doc.page.height - 55, { width: W, align: 'left' })
    doc.page.margins.bottom = bottom
  }
  doc.end()
  return done
}

function writePlan(plan: SupplementPlan, units: Units, t: (s: string) => unknown) {
  if (!plan.rows.length) t('No supplement is needed.')
  for (const p of plan.rows) {
    t(
      `${p.name}: ${fmtMass(p.kgAsFedPerHead, units)} as fed per head per day; ${fmtMass(p.kgAsFedPerGroupDay, units)} per group per day; ${fmtMass(p.kgAsFedPerGroupWeek, units)} per week${p.priced ? `; ${fmtMoney(p.costPerHeadDay)} per head per day, ${fmtMoney(p.costPerGroupWeek)} per week` : '; no price entered'}.`,
    )
  }
  t(`Cost: ${fmtMoney(plan.costPerHeadDay)} per head per day; ${fmtMoney(plan.costPerGroupDay)} per group per day; ${fmtMoney(plan.costPerGroupWeek)} per week (${plan.headCount} head).`)
}

export async function balancePdf(operation: Operation, balanceId: number, version: number | undefined, units: Units) {
  const d = await reportData(operation, balanceId, version)
  return { filename: filenameFor(d), pdf: await renderPdf(d, units) }
}

/** E-mails the report to members (by id) and client addresses, with the PDF attached; the send is logged. */
export async function emailReport(ctx: AppContext, operation: Operation, user: User, balanceId: number, body: unknown) {
  const input = parseWith(reportEmailSchema, body)
  const members = input.memberIds.length
    ? await Membership.findAll({ where: { operationId: operation.id, id: input.memberIds }, include: [{ model: User, as: 'user', attributes: ['email', 'name'] }] })
    : []
  const found = new Set(members.map((m) => m.id))
  const missing = input.memberIds.map((id, i) => ({ id, i })).filter((x) => !found.has(x.id))
  if (missing.length) throw AppError.badRequest('Not a member of this operation.', missing.map((m) => ({ field: `memberIds.${m.i}`, message: 'Not a member of this operation.' })))
  const to = [...new Set([...members.map((m) => (m as unknown as { user: User }).user.email), ...input.emails.map((e) => e.trim().toLowerCase())])]
  const d = await reportData(operation, balanceId, input.version)
  const units = user.unitSystem
  const pdf = await renderPdf(d, units)
  const lines = [
    `${user.name} sends you a StandGraze balance report from ${operation.name}.`,
    '',
    `Group: ${d.inputs.herd.name}, ${d.inputs.herd.headCount} head, on ${d.balance.date} (${d.inputs.stage.label}).`,
    `Result: ${statusLabels[d.result.status] ?? d.result.status}.`,
    ...d.plan.rows.map((p) => `Supplement: ${p.name}, ${fmtMass(p.kgAsFedPerHead, units)} as fed per head per day (${fmtMass(p.kgAsFedPerGroupDay, units)} for the group).`),
    `Cost: ${fmtMoney(d.plan.costPerHeadDay)} per head per day, ${fmtMoney(d.plan.costPerGroupWeek)} per week.`,
    ...(input.message ? ['', input.message] : []),
    '',
    'The full report is attached as a PDF.',
    '',
    REPORT_FOOTER,
  ]
  const sent = await ctx.mailer.send({
    to,
    subject: `StandGraze report: ${d.inputs.herd.name} on ${d.balance.date} - ${operation.name}`,
    text: lines.join('\n'),
    attachments: [{ filename: filenameFor(d), content: pdf, contentType: 'application/pdf' }],
  })
  const log = await ReportSend.create({ operationId: operation.id, balanceId: d.balance.id, balanceVersion: d.version.version, recipients: to, sentBy: user.id, sentByName: user.name })
  return { id: log.id, to, version: d.version.version, messageId: sent.messageId, sentAt: iso(log.createdAt) }
}

export async function listReportSends(operationId: number, q: ListQuery) {
  const { rows, count } = await ReportSend.findAndCountAll({ where: { operationId }, order: [['createdAt', 'DESC'], ['id', 'DESC']], ...paging(q) })
  return {
    items: rows.map((s) => ({ id: s.id, balanceId: s.balanceId, balanceVersion: s.balanceVersion, recipients: s.recipients, sentBy: { id: s.sentBy, name: s.sentByName }, sentAt: iso(s.createdAt) })),
    total: count,
    page: q.page,
    pageSize: q.pageSize,
  }
}
