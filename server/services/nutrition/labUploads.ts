// Lab CSV uploads: parse and check every row in small slices (the event loop stays free), keep a preview, then write only the confirmed rows in one transaction.
import { parse } from 'csv-parse'
import { Readable } from 'node:stream'
import { ForeignKeyConstraintError, Op, type Sequelize } from 'sequelize'
import { AppError } from '../../errors'
import { Feed, LabResult, LabUpload, type StoredUploadRow } from '../../models/nutrition'
import { Field } from '../../models/grazing'
import type { User } from '../../models/index'
import type { Logger } from '../../logger'
import {
  LAB_UPLOAD_MAX_ROWS,
  labComponents,
  labCsvColumns,
  labResultCreateSchema,
  uploadConfirmSchema,
  type LabResultValues,
} from '../../../shared/schemas/nutrition/labResults'
import { parseWith } from './common'
import { linkNewestToComponent, storedRow } from './labResults'
import { markBalancesOutOfDate } from './staleness'

/** Rows checked between yields to the event loop, and progress writes. */
const SLICE = 200
/** Rows per INSERT inside the confirming transaction. */
const INSERT_CHUNK = 500

const yieldToLoop = () => new Promise<void>((resolve) => setImmediate(resolve))

/** CSV column → schema field, so a refused row names the column the user sees in the file. */
const columnOf: Record<string, string> = {
  feedId: 'feed', fieldId: 'field_id', component: 'component', sampleDate: 'sample_date', labName: 'lab', sampleRef: 'sample_ref', basis: 'basis',
  dmPct: 'dm', cpPct: 'cp', tdnPct: 'tdn', adfPct: 'adf', ndfPct: 'ndf', caPct: 'ca', pPct: 'p', nitratePpm: 'nitrate', nitrateForm: 'nitrate_form',
  cuMgPerKg: 'cu', notes: 'notes',
}
const numericColumns: Record<string, string> = { dm: 'dmPct', cp: 'cpPct', tdn: 'tdnPct', adf: 'adfPct', ndf: 'ndfPct', ca: 'caPct', p: 'pPct', nitrate: 'nitratePpm', cu: 'cuMgPerKg' }

export function uploadView(u: LabUpload, rows?: { page: number; pageSize: number; status?: 'accepted' | 'refused' }) {
  const all = u.rows ?? []
  const filtered = rows?.status ? all.filter((r) => r.status === rows.status) : all
  return {
    id: u.id,
    filename: u.filename,
    status: u.status,
    processed: u.processed,
    total: u.total,
    accepted: u.accepted,
    refused: u.refused,
    error: u.error,
    ...(rows
      ? {
          rows: filtered.slice((rows.page - 1) * rows.pageSize, rows.page * rows.pageSize),
          rowsTotal: filtered.length,
          acceptedLines: all.filter((r) => r.status === 'accepted').map((r) => r.line),
        }
      : {}),
    createdIds: u.createdIds ?? [],
  }
}

export async function findUpload(operationId: number, id: number) {
  const u = await LabUpload.findOne({ where: { id, operationId } })
  if (!u) throw AppError.notFound('Upload')
  return u
}

/** Stores the file's preview record and checks it in the background; the caller polls for progress. */
export async function startUpload(operationId: number, user: User, file: { originalname: string; buffer: Buffer } | undefined, logger: Logger) {
  if (!file) throw AppError.badRequest('Attach a CSV file.', [{ field: 'file', message: 'Attach a CSV file.' }])
  if (!/\.(csv|txt)$/i.test(file.originalname)) throw AppError.badRequest('The file must be a .csv file.', [{ field: 'file', message: 'Use a .csv file.' }])
  if (file.buffer.includes(0)) throw AppError.badRequest('The file is not text; save it from the spreadsheet as CSV.', [{ field: 'file', message: 'Not a text CSV file.' }])
  const u = await LabUpload.create({ operationId, userId: user.id, filename: file.originalname.slice(0, 200), status: 'parsing', error: null, rows: null, createdIds: null })
  void checkUpload(u, file.buffer).catch(async (err: unknown) => {
    logger.error({ err }, 'lab upload check failed')
    await u.update({ status: 'failed', error: 'The file could not be checked; nothing was saved.' }).catch(() => undefined)
  })
  return uploadView(u)
}

type Lookup = { feeds: Map<string, number>; fields: Set<number> }

async function lookups(operationId: number): Promise<Lookup> {
  const feeds = new Map<string, number>()
  // Reference feeds first so that an operation's own feed of the same name wins.
  const rows = await Feed.findAll({ where: { [Op.or]: [{ operationId }, { operationId: null }] }, attributes: ['id', 'name', 'operationId'], order: [['operationId', 'ASC NULLS FIRST']] })
  for (const f of rows) feeds.set(f.name.trim().toLowerCase(), f.id)
  const fields = new Set((await Field.findAll({ where: { operationId }, attributes: ['id'] })).map((f) => f.id))
  return { feeds, fields }
}

const header = (h: string) => h.trim().toLowerCase().replace(/[\s-]+/g, '_')

/** The file in 16 KB pieces, so the parser works through it a piece per turn of the event loop. */
function* slices(buffer: Buffer, size = 16 * 1024) {
  for (let i = 0; i < buffer.length; i += size) yield buffer.subarray(i, i + size)
}

async function checkUpload(u: LabUpload, buffer: Buffer) {
  const records: { line: number; record: Record<string, string> }[] = []
  let columns: string[] = []
  const parser = Readable.from(slices(buffer)).pipe(
    parse({
      bom: true,
      columns: (h: string[]) => (columns = h.map(header)),
      skip_empty_lines: true,
      trim: true,
      relax_column_count: true,
      info: true,
      max_record_size: 10_000,
    }),
  )
  try {
    for await (const item of parser as AsyncIterable<{ record: Record<string, string>; info: { lines: number } }>) {
      records.push({ line: item.info.lines, record: item.record })
      if (records.length > LAB_UPLOAD_MAX_ROWS) {
        await u.update({ status: 'failed', error: `The file has more than ${LAB_UPLOAD_MAX_ROWS.toLocaleString('en-US')} rows; split it and upload each part.` })
        return
      }
    }
  } catch (e) {
    await u.update({ status: 'failed', error: `The file is not valid CSV: ${(e as Error).message}` })
    return
  }
  const unknown = columns.filter((c) => !(labCsvColumns as readonly string[]).includes(c))
  const missing = ['sample_date', 'lab', 'dm', 'cp'].filter((c) => !columns.includes(c))
  if (!columns.includes('feed') && !(columns.includes('field_id') && columns.includes('component'))) missing.push('feed (or field_id and component)')
  if (!columns.includes('tdn') && !columns.includes('adf')) missing.push('tdn or adf')
  if (unknown.length || missing.length) {
    const parts = [missing.length ? `missing column${missing.length > 1 ? 's' : ''} ${missing.join(', ')}` : '', unknown.length ? `unknown column${unknown.length > 1 ? 's' : ''} ${unknown.join(', ')}` : '']
    await u.update({ status: 'failed', error: `The header row has ${parts.filter(Boolean).join(' and ')}. Expected columns: ${labCsvColumns.join(', ')}.` })
    return
  }
  await u.update({ total: records.length })
  const look = await lookups(u.operationId)
  const rows: StoredUploadRow[] = []
  const seen = new Map<string, number>()
  let accepted = 0
  for (let i = 0; i < records.length; i += SLICE) {
    for (const { line, record } of records.slice(i, i + SLICE)) {
      const row = checkRow(line, record, columns.length, look, seen)
      if (row.status === 'accepted') accepted++
      rows.push(row)
    }
    await u.update({ processed: Math.min(records.length, i + SLICE) })
    await yieldToLoop()
  }
  await u.update({ status: 'ready', rows, processed: records.length, accepted, refused: records.length - accepted })
}

function checkRow(line: number, rec: Record<string, string>, width: number, look: Lookup, seen: Map<string, number>): StoredUploadRow {
  const reasons: { field: string; message: string }[] = []
  const input: Record<string, unknown> = {}
  const present = Object.keys(rec).length
  if (present !== width) reasons.push({ field: '(row)', message: `Has ${present} values; the header has ${width} columns.` })
  let target: string | null = null
  const feedName = rec.feed?.trim()
  if (feedName) {
    const id = look.feeds.get(feedName.toLowerCase())
    if (id === undefined) reasons.push({ field: 'feed', message: `No feed named "${feedName}" in this operation or the reference set.` })
    else input.feedId = id
    target = feedName
  }
  if (rec.field_id?.trim()) {
    const n = Number(rec.field_id)
    if (!Number.isInteger(n) || !look.fields.has(n)) reasons.push({ field: 'field_id', message: `No field ${rec.field_id} in this operation.` })
    else input.fieldId = n
    const c = rec.component?.trim().toLowerCase()
    if (!c || !(labComponents as readonly string[]).includes(c)) reasons.push({ field: 'component', message: `Use one of ${labComponents.join(', ')}.` })
    else input.component = c
    target = `field ${rec.field_id} ${c ?? ''}`.trim()
  }
  for (const [col, key] of Object.entries(numericColumns)) {
    const raw = rec[col]?.trim().replace(/%$/, '').trim()
    if (!raw) continue
    const n = Number(raw)
    if (!/^[-+]?(\d+\.?\d*|\.\d+)(e[-+]?\d+)?$/i.test(raw) || !Number.isFinite(n)) reasons.push({ field: col, message: `"${rec[col]}" is not a number (use a point for decimals).` })
    else input[key] = n
  }
  if (rec.sample_date) input.sampleDate = rec.sample_date.trim()
  if (rec.lab) input.labName = rec.lab
  if (rec.sample_ref) input.sampleRef = rec.sample_ref
  if (rec.notes) input.notes = rec.notes
  if (rec.basis) {
    const b = rec.basis.trim().toLowerCase().replace(/[\s_]+/g, '-')
    input.basis = b === 'as-fed' || b === 'asfed' || b === 'af' ? 'as-fed' : b === 'dm' || b === 'dry-matter' ? 'dm' : rec.basis
  }
  if (rec.nitrate_form) {
    const f = rec.nitrate_form.trim().toUpperCase().replace(/\s+/g, '').replace('_', '-')
    input.nitrateForm = f === 'NO3-N' || f === 'NO3N' ? 'NO3-N' : f === 'NO3' ? 'NO3' : rec.nitrate_form
  }
  const parsed = labResultCreateSchema.safeParse(input)
  if (!parsed.success) {
    for (const issue of parsed.error.issues) {
      const key = String(issue.path[0] ?? '(row)')
      const col = columnOf[key] ?? key
      // A feed already refused by name needs no second reason.
      if (key === 'feedId' && reasons.some((r) => r.field === 'feed')) continue
      if (!reasons.some((r) => r.field === col && r.message === issue.message)) reasons.push({ field: col, message: issue.message })
    }
  }
  if (!reasons.length && parsed.success) {
    const v = parsed.data
    const key = [v.feedId ?? `${v.fieldId}/${v.component}`, v.sampleDate, v.labName.toLowerCase(), (v.sampleRef ?? '').toLowerCase()].join('|')
    const first = seen.get(key)
    if (first !== undefined) reasons.push({ field: '(row)', message: `Same sample as line ${first} (feed, date, lab and sample reference).` })
    else seen.set(key, line)
  }
  return reasons.length
    ? { line, status: 'refused', reasons, target, values: null }
    : { line, status: 'accepted', reasons: [], target, values: (parsed as { data: LabResultValues }).data as unknown as Record<string, unknown> }
}

/** Writes the confirmed accepted rows in one transaction; any failure (a feed deleted since the preview, say) writes nothing. */
export async function confirmUpload(sequelize: Sequelize, operationId: number, user: User, id: number, body: unknown) {
  const { lines } = parseWith(uploadConfirmSchema, body)
  const u = await findUpload(operationId, id)
  if (u.status === 'confirmed') throw AppError.conflict('This upload was already saved.', { createdIds: u.createdIds ?? [] })
  if (u.status !== 'ready') throw AppError.conflict(u.status === 'parsing' ? 'The file is still being checked; wait for the preview.' : 'This upload failed its check; upload the file again.')
  const byLine = new Map((u.rows ?? []).map((r) => [r.line, r]))
  const wrong = [...new Set(lines)].filter((l) => byLine.get(l)?.status !== 'accepted')
  if (wrong.length) {
    throw AppError.badRequest(`Only accepted rows can be saved; line${wrong.length > 1 ? 's' : ''} ${wrong.slice(0, 10).join(', ')} ${wrong.length > 1 ? 'are' : 'is'} not.`, [
      { field: 'lines', message: `Not accepted: ${wrong.slice(0, 10).join(', ')}${wrong.length > 10 ? '…' : ''}.` },
    ])
  }
  const chosen = [...new Set(lines)].sort((a, b) => a - b).map((l) => byLine.get(l)!)
  let failedAt: number | null = null
  try {
    const result = await sequelize.transaction(async (transaction) => {
      const ids: number[] = []
      for (let i = 0; i < chosen.length; i += INSERT_CHUNK) {
        const chunk = chosen.slice(i, i + INSERT_CHUNK)
        failedAt = chunk[0].line
        const created = await LabResult.bulkCreate(
          chunk.map((r) => ({ ...storedRow(parseWith(labResultCreateSchema, r.values)), operationId, uploadId: u.id, createdBy: user.id, updatedBy: user.id })),
          { transaction, returning: ['id'] },
        )
        ids.push(...created.map((c) => c.id))
        for (const c of created) if (c.fieldId != null) await linkNewestToComponent(c, transaction)
        await yieldToLoop()
      }
      failedAt = null
      const feedIds = [...new Set(chosen.map((r) => r.values?.feedId as number | undefined).filter((x): x is number => typeof x === 'number'))]
      const fieldIds = [...new Set(chosen.map((r) => r.values?.fieldId as number | undefined).filter((x): x is number => typeof x === 'number'))]
      const affected = await markBalancesOutOfDate(operationId, { feedIds }, `New lab results were uploaded from ${u.filename}.`, transaction)
      for (const fieldId of fieldIds) affected.push(...(await markBalancesOutOfDate(operationId, { fieldId }, `New lab results were uploaded from ${u.filename}.`, transaction)))
      await u.update({ status: 'confirmed', createdIds: ids }, { transaction })
      return { ids, affected: [...new Set(affected)] }
    })
    return { ...uploadView(u), createdIds: result.ids, affectedBalances: result.affected }
  } catch (e) {
    if (e instanceof ForeignKeyConstraintError) {
      throw new AppError(409, 'upload_failed', `Saving stopped at the rows from line ${failedAt ?? '?'}: a feed or field they refer to no longer exists. Nothing was saved; upload the file again.`, [
        { field: 'lines', message: 'A feed or field was deleted since the preview.' },
      ])
    }
    throw e
  }
}
