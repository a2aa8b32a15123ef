// Loads the published reference tables shipped in reference-data/ (book feed values with their sources) into the database.
import { readFileSync } from 'node:fs'
import { join } from 'node:path'
import { parse } from 'csv-parse/sync'
import type { Sequelize } from 'sequelize'
import { ROOT } from '../config'
import { Feed } from '../models/nutrition'
import { feedCreateSchema, type Provenance } from '../../shared/schemas/nutrition/feeds'

export const REFERENCE_FEEDS_CSV = join(ROOT, 'reference-data', 'feeds.csv')

type Row = Record<string, string>
const numberOrNull = (s: string) => (s.trim() === '' ? null : Number(s))
const list = (s: string) => s.split(/\s+/).filter(Boolean)

/** Parses feeds.csv into feed values plus key and provenance; a malformed row throws, naming its key and field. */
export function readReferenceFeeds(file = REFERENCE_FEEDS_CSV) {
  const rows = parse(readFileSync(file, 'utf8'), { columns: true, skip_empty_lines: true, trim: true }) as Row[]
  return rows.map((r) => {
    const values = feedCreateSchema.safeParse({
      name: r.name,
      kind: r.kind,
      dmPct: Number(r.dm_pct),
      cpPctDm: Number(r.cp_pct_dm),
      tdnPctDm: Number(r.tdn_pct_dm),
      ndfPctDm: numberOrNull(r.ndf_pct_dm),
      adfPctDm: numberOrNull(r.adf_pct_dm),
      caPctDm: numberOrNull(r.ca_pct_dm),
      pPctDm: numberOrNull(r.p_pct_dm),
      cuMgPerKgDm: numberOrNull(r.cu_mg_per_kg_dm),
      isGrain: r.is_grain === 'yes',
      isUrea: r.is_urea === 'yes',
      isLegume: r.is_legume === 'yes',
      cattleOnly: r.cattle_only === 'yes',
      sourceTitle: r.source_title,
      sourceDetail: r.source_detail || null,
      notes: r.notes || null,
    })
    if (!values.success) throw new Error(`reference-data/feeds.csv row "${r.key}": ${values.error.issues.map((i) => `${i.path.join('.')}: ${i.message}`).join('; ')}`)
    const provenance: Provenance = { read: list(r.read), derived: list(r.derived), fromMemory: list(r.from_memory), commonPractice: list(r.common_practice) }
    return { key: r.key, values: values.data, provenance }
  })
}

/** Upserts the reference feeds by key: a second run changes nothing that is already current and adds no duplicates. */
export async function seedReference(sequelize: Sequelize) {
  const feeds = readReferenceFeeds()
  await sequelize.transaction(async (transaction) => {
    for (const f of feeds) {
      const existing = await Feed.findOne({ where: { referenceKey: f.key }, transaction })
      const attrs = { ...f.values, operationId: null, referenceKey: f.key, provenance: f.provenance, referenceFeedId: null, priceAmount: null, priceUnit: null, bagWeightKg: null, maxKgAsFedPerHeadDay: null, available: true }
      if (existing) {
        existing.set(attrs as never)
        if (existing.changed()) {
          existing.version += 1
          await existing.save({ transaction })
        }
      } else {
        await Feed.create({ ...attrs, createdBy: null, updatedBy: null } as never, { transaction })
      }
    }
  })
  return feeds.length
}
