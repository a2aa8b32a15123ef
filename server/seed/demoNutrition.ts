// Demo herds, feeds, lab results and balances for the invented demo operations (all values invented for the demo). Idempotent: a second run adds nothing and changes nothing.
import type { Sequelize, Transaction } from 'sequelize'
import type { DemoIds } from './demo'
import { User } from '../models/index'
import { Balance, Feed, Herd, LabResult } from '../models/nutrition'
import { Field, FieldComponent } from '../models/grazing'
import { labResultCreateSchema, type LabResultInput } from '../../shared/schemas/nutrition/labResults'
import { herdCreateSchema, type HerdInput } from '../../shared/schemas/nutrition/herds'
import { feedCreateSchema, type FeedInput } from '../../shared/schemas/nutrition/feeds'
import { linkNewestToComponent, storedRow } from '../services/nutrition/labResults'
import { createBalance } from '../services/nutrition/balances'
import { LB_KG } from '../../shared/engine/units'

/** Demo lab name: invented. */
export const DEMO_LAB = 'Demo Feed Lab'
const lb = (v: number) => Math.round(v * LB_KG * 1000) / 1000

/** The winter the demo describes: the coming one from July on, the current one before. */
export function demoWinterYear(now = new Date()): number {
  return now.getUTCMonth() >= 6 ? now.getUTCFullYear() + 1 : now.getUTCFullYear()
}

export function demoHerds(y: number): { main: HerdInput[]; client: HerdInput[] } {
  return {
    main: [
      { name: 'Spring-calving cows', species: 'cattle', class: 'cow', headCount: 120, bodyWeightKg: lb(1200), matureWeightKg: lb(1200), bcs: 5, breed: 'british', expectedBirthDate: `${y}-03-10`, peakMilkKg: 8, calfBirthWeightKg: lb(85), grazing: true, environment: { tempC: -6, windKph: 16, coat: 'dry-winter', mud: 'none' }, notes: 'Invented demo group.' },
      { name: 'Bred heifers', species: 'cattle', class: 'bred-heifer', headCount: 35, bodyWeightKg: lb(900), matureWeightKg: lb(1200), bcs: 5.5, breed: 'british', expectedBirthDate: `${y}-02-25`, calfBirthWeightKg: lb(75), targetGainKg: lb(1), grazing: true, environment: { tempC: -6, windKph: 16, coat: 'dry-winter', mud: 'none' }, notes: 'Invented demo group.' },
      { name: 'Late-winter ewes, twins', species: 'sheep', class: 'ewe', headCount: 85, bodyWeightKg: 70, bcs: 3, expectedBirthDate: `${y}-02-20`, litterSize: 2, grazing: true, notes: 'Invented demo group; ewes scanned for twins, kept apart from singles.' },
      { name: 'Late-winter ewes, singles', species: 'sheep', class: 'ewe', headCount: 60, bodyWeightKg: 70, bcs: 3, expectedBirthDate: `${y}-02-20`, litterSize: 1, grazing: true, notes: 'Invented demo group.' },
      { name: 'Weaned steer calves', species: 'cattle', class: 'growing', headCount: 90, bodyWeightKg: lb(550), matureWeightKg: lb(1300), bcs: 5, breed: 'british', targetGainKg: lb(1.5), grazing: true, environment: { tempC: -6, windKph: 16, coat: 'dry-winter', mud: 'some' }, notes: 'Invented demo group.' },
    ],
    client: [
      { name: 'Client cows', species: 'cattle', class: 'cow', headCount: 36, bodyWeightKg: lb(1150), matureWeightKg: lb(1150), bcs: 5, breed: 'british', expectedBirthDate: `${y}-03-20`, peakMilkKg: 8, grazing: true, environment: { tempC: -4, windKph: 12, coat: 'dry-winter' }, notes: 'Invented demo group.' },
    ],
  }
}

type DemoFeed = FeedInput & { copyOf?: string }
export function demoFeeds(): { main: DemoFeed[]; client: DemoFeed[] } {
  const cube20: DemoFeed = { name: 'Demo range cube 20 % CP', kind: 'supplement', dmPct: 90, cpPctDm: 20, tdnPctDm: 72, caPctDm: 1.1, pPctDm: 0.8, priceAmount: 305, priceUnit: 'ton', notes: 'Invented demo product; label values invented.' }
  const mineralCattle: DemoFeed = { name: 'Demo cattle mineral (cattle only)', kind: 'mineral', dmPct: 98, cpPctDm: 0, tdnPctDm: 0, caPctDm: 16, pPctDm: 8, cuMgPerKgDm: 1200, cattleOnly: true, priceAmount: 29, priceUnit: 'bag', bagWeightKg: lb(50), notes: 'Invented demo product; label values invented. Not for sheep.' }
  const hay: DemoFeed = { name: 'Demo grass hay, round bales', kind: 'forage', dmPct: 88, cpPctDm: 8.5, tdnPctDm: 54, ndfPctDm: 64, adfPctDm: 40, caPctDm: 0.45, pPctDm: 0.18, priceAmount: 115, priceUnit: 'ton', notes: 'Invented demo hay; the lab result overrides these values.' }
  return {
    main: [
      cube20,
      { name: 'Demo range cube 38 % CP', kind: 'supplement', dmPct: 90, cpPctDm: 38, tdnPctDm: 72, caPctDm: 1.4, pPctDm: 1.0, priceAmount: 395, priceUnit: 'ton', notes: 'Invented demo product; label values invented.' },
      { name: 'Cottonseed meal (demo price)', kind: 'supplement', dmPct: 90, cpPctDm: 45, tdnPctDm: 78, ndfPctDm: 28, adfPctDm: 18, caPctDm: 0.2, pPctDm: 1.0, priceAmount: 430, priceUnit: 'ton', copyOf: 'cottonseed-meal', notes: 'Book values of the reference row; price invented for the demo.' },
      { name: 'Dried distillers grains (demo price)', kind: 'supplement', dmPct: 90, cpPctDm: 28, tdnPctDm: 95, ndfPctDm: 40, adfPctDm: 17, caPctDm: 0.05, pPctDm: 0.88, priceAmount: 255, priceUnit: 'ton', copyOf: 'ddgs', notes: 'Book values of the reference row; price invented for the demo.' },
      { name: 'Whole shelled corn (demo price)', kind: 'grain', dmPct: 88, cpPctDm: 9.5, tdnPctDm: 89, ndfPctDm: 10, adfPctDm: 3, caPctDm: 0.03, pPctDm: 0.3, isGrain: true, priceAmount: 205, priceUnit: 'ton', copyOf: 'corn-grain', notes: 'Book values of the reference row; price invented for the demo.' },
      mineralCattle,
      { name: 'Demo sheep mineral (no added copper)', kind: 'mineral', dmPct: 98, cpPctDm: 0, tdnPctDm: 0, caPctDm: 14, pPctDm: 7, cuMgPerKgDm: 0, priceAmount: 27, priceUnit: 'bag', bagWeightKg: lb(50), notes: 'Invented demo product; label values invented.' },
      { name: 'Limestone (demo price)', kind: 'mineral', dmPct: 99, cpPctDm: 0, tdnPctDm: 0, caPctDm: 37, pPctDm: 0.02, priceAmount: 7, priceUnit: 'bag', bagWeightKg: lb(50), copyOf: 'limestone', notes: 'Book values of the reference row; price invented for the demo.' },
      hay,
    ],
    client: [{ ...cube20 }, { ...mineralCattle }, { ...hay }],
  }
}

/** Invented analyses of each field component, by the field's legume (the conventional field has none). */
function componentLab(kind: string, legume: string): Omit<LabResultInput, 'sampleDate'> | null {
  const base = { labName: DEMO_LAB, basis: 'dm' as const, notes: 'Invented demo analysis.' }
  switch (kind) {
    case 'sorghum-grain':
      return { ...base, dmPct: 87, cpPct: 10.6, tdnPct: 80, ndfPct: 11, adfPct: 6, caPct: 0.04, pPct: 0.33 }
    case 'sorghum-stover':
      return { ...base, dmPct: 78, cpPct: 6.2, tdnPct: 51, ndfPct: 68, adfPct: 46, caPct: 0.45, pPct: 0.11, nitratePpm: 450, nitrateForm: 'NO3-N' }
    case 'legume-forage':
      return legume === 'forage-soybean'
        ? { ...base, dmPct: 72, cpPct: 14.5, tdnPct: 55, ndfPct: 52, adfPct: 39, caPct: 1.1, pPct: 0.24 }
        : { ...base, dmPct: 70, cpPct: 16.2, tdnPct: 58, ndfPct: 48, adfPct: 36, caPct: 1.25, pPct: 0.27 }
    case 'legume-seed':
      return { ...base, dmPct: 88, cpPct: 24, tdnPct: 78, caPct: 0.1, pPct: 0.45 }
    default:
      return null
  }
}

async function ensureHerd(operationId: number, input: HerdInput, userId: number, transaction: Transaction) {
  const found = await Herd.findOne({ where: { operationId, name: input.name }, transaction })
  if (found) return found
  const v = herdCreateSchema.parse(input)
  return Herd.create(
    {
      operationId, name: v.name, species: v.species, class: v.class, headCount: v.headCount, bodyWeightKg: v.bodyWeightKg, matureWeightKg: v.matureWeightKg ?? null, bcs: v.bcs, breed: v.breed ?? null,
      expectedBirthDate: v.expectedBirthDate ?? null, lastBirthDate: v.lastBirthDate ?? null, restStage: v.restStage ?? null, litterSize: v.litterSize ?? null, peakMilkKg: v.peakMilkKg ?? null,
      calfBirthWeightKg: v.calfBirthWeightKg ?? null, targetGainKg: v.targetGainKg ?? null, grazing: v.grazing, environment: v.environment ?? null, notes: v.notes ?? null, createdBy: userId, updatedBy: userId,
    } as never,
    { transaction },
  )
}

async function ensureFeed(operationId: number, input: DemoFeed, userId: number, transaction: Transaction) {
  const found = await Feed.findOne({ where: { operationId, name: input.name }, transaction })
  if (found) return found
  const { copyOf, ...rest } = input
  const ref = copyOf ? await Feed.findOne({ where: { referenceKey: copyOf }, transaction }) : null
  const v = feedCreateSchema.parse({ ...rest, referenceFeedId: ref?.id ?? null, sourceTitle: ref?.sourceTitle ?? 'Invented demo product label', sourceDetail: ref?.sourceDetail ?? null })
  const attrs: Record<string, unknown> = { ...v }
  for (const k of ['ndfPctDm', 'adfPctDm', 'caPctDm', 'pPctDm', 'cuMgPerKgDm', 'nitrateNPpmDm', 'priceAmount', 'priceUnit', 'bagWeightKg', 'maxKgAsFedPerHeadDay', 'referenceFeedId', 'sourceTitle', 'sourceDetail', 'notes']) attrs[k] ??= null
  return Feed.create({ ...attrs, operationId, referenceKey: null, provenance: null, createdBy: userId, updatedBy: userId } as never, { transaction })
}

async function ensureLab(operationId: number, input: LabResultInput, userId: number, transaction: Transaction) {
  const where = { operationId, labName: input.labName, sampleRef: input.sampleRef ?? null, ...(input.feedId ? { feedId: input.feedId } : { fieldId: input.fieldId, component: input.component }) }
  const found = await LabResult.findOne({ where, transaction })
  if (found) return found
  const r = await LabResult.create({ ...storedRow(labResultCreateSchema.parse(input)), operationId, uploadId: null, createdBy: userId, updatedBy: userId }, { transaction })
  await linkNewestToComponent(r, transaction)
  return r
}

/** Lab results for every component of the operation's fields (none is overwritten), linked where the component has none yet. */
async function fieldLabs(operationId: number, y: number, userId: number, transaction: Transaction) {
  const fields = await Field.findAll({ where: { operationId }, transaction, order: [['id', 'ASC']] })
  for (const f of fields) {
    const comps = await FieldComponent.findAll({ where: { fieldId: f.id }, transaction })
    for (const c of comps) {
      const lab = componentLab(c.kind, f.legume)
      if (!lab) continue
      await ensureLab(operationId, { ...lab, fieldId: f.id, component: c.kind as LabResultInput['component'], sampleDate: `${y - 1}-11-18`, sampleRef: `DEMO-${f.id}-${c.kind}` }, userId, transaction)
    }
  }
  return fields
}

type Plan = { name: string; herd: string; date: string; field?: 'cowpea' | 'forage-soybean' | 'none' | 'any'; fallbackBase: Array<{ key: string; sharePct: number }>; supplements: string[] }

export function demoBalancePlans(y: number): { main: Plan[]; client: Plan[] } {
  const corridor = [{ key: 'sorghum-leaf-standing', sharePct: 45 }, { key: 'sorghum-stem-standing', sharePct: 25 }, { key: 'sorghum-grain-rolled', sharePct: 15 }, { key: 'cowpea-forage', sharePct: 15 }]
  const conventional = [{ key: 'sorghum-leaf-standing', sharePct: 55 }, { key: 'sorghum-stem-standing', sharePct: 30 }, { key: 'sorghum-grain-rolled', sharePct: 15 }]
  const cattleSupps = ['Demo range cube 38 % CP', 'Demo range cube 20 % CP', 'Cottonseed meal (demo price)', 'Dried distillers grains (demo price)', 'Demo cattle mineral (cattle only)', 'Limestone (demo price)']
  const sheepSupps = ['Whole shelled corn (demo price)', 'Cottonseed meal (demo price)', 'Demo range cube 20 % CP', 'Demo sheep mineral (no added copper)', 'Demo cattle mineral (cattle only)', 'Limestone (demo price)']
  return {
    main: [
      { name: 'Cows, late gestation, cowpea field', herd: 'Spring-calving cows', date: `${y}-01-20`, field: 'cowpea', fallbackBase: corridor, supplements: cattleSupps },
      { name: 'Bred heifers, cowpea field', herd: 'Bred heifers', date: `${y}-01-20`, field: 'cowpea', fallbackBase: corridor, supplements: cattleSupps },
      { name: 'Twin ewes, late gestation', herd: 'Late-winter ewes, twins', date: `${y}-02-01`, field: 'forage-soybean', fallbackBase: corridor, supplements: sheepSupps },
      { name: 'Twin ewes, early lactation', herd: 'Late-winter ewes, twins', date: `${y}-03-10`, field: 'forage-soybean', fallbackBase: corridor, supplements: sheepSupps },
      { name: 'Single ewes, late gestation', herd: 'Late-winter ewes, singles', date: `${y}-02-01`, field: 'forage-soybean', fallbackBase: corridor, supplements: sheepSupps },
      { name: 'Steer calves, conventional field', herd: 'Weaned steer calves', date: `${y}-01-20`, field: 'none', fallbackBase: conventional, supplements: cattleSupps },
    ],
    client: [{ name: 'Client cows on hay and the corridor', herd: 'Client cows', date: `${y}-01-20`, fallbackBase: [], supplements: ['Demo range cube 20 % CP', 'Demo cattle mineral (cattle only)'] }],
  }
}

async function ensureBalance(operationId: number, plan: Plan, user: User, sequelize: Sequelize, extraBase: number[] = []) {
  if (await Balance.findOne({ where: { operationId, name: plan.name } })) return
  const herd = await Herd.findOne({ where: { operationId, name: plan.herd } })
  if (!herd) return
  let fieldId: number | null = null
  if (plan.field) {
    const fields = await Field.findAll({ where: { operationId }, order: [['id', 'ASC']] })
    const f = plan.field === 'any' ? fields[0] : fields.find((x) => x.legume === plan.field)
    if (f && (await FieldComponent.count({ where: { fieldId: f.id } })) > 0) fieldId = f.id
  }
  const own = await Feed.findAll({ where: { operationId } })
  const byName = new Map(own.map((f) => [f.name, f.id]))
  let baseFeeds: Array<{ feedId: number; sharePct?: number }> = extraBase.map((feedId) => ({ feedId }))
  if (!fieldId && !baseFeeds.length) {
    const refs = await Feed.findAll({ where: { referenceKey: plan.fallbackBase.map((b) => b.key) } })
    baseFeeds = plan.fallbackBase.flatMap((b) => {
      const r = refs.find((x) => x.referenceKey === b.key)
      return r ? [{ feedId: r.id, sharePct: b.sharePct }] : []
    })
  }
  if (!fieldId && !baseFeeds.length) return
  await createBalance(sequelize, operationId, user, {
    name: plan.name,
    herdId: herd.id,
    date: plan.date,
    fieldId,
    baseFeeds,
    supplementIds: plan.supplements.map((n) => byName.get(n)).filter((x): x is number => x !== undefined),
  })
}

export async function seedNutritionDemo(sequelize: Sequelize, ids: DemoIds) {
  const y = demoWinterYear()
  const nutritionistId = ids.users.nutritionist
  const herds = demoHerds(y)
  const feeds = demoFeeds()
  await sequelize.transaction(async (transaction) => {
    for (const [key, list] of [['main', herds.main], ['client', herds.client]] as const) for (const h of list) await ensureHerd(ids.operations[key], h, ids.users.owner, transaction)
    for (const [key, list] of [['main', feeds.main], ['client', feeds.client]] as const) for (const f of list) await ensureFeed(ids.operations[key], f, ids.users.owner, transaction)
    for (const key of ['main', 'client'] as const) {
      await fieldLabs(ids.operations[key], y, nutritionistId, transaction)
      const hay = await Feed.findOne({ where: { operationId: ids.operations[key], name: 'Demo grass hay, round bales' }, transaction })
      if (hay) {
        await ensureLab(ids.operations[key], { feedId: hay.id, sampleDate: `${y - 1}-10-28`, labName: DEMO_LAB, sampleRef: `DEMO-HAY-${key}`, basis: 'as-fed', dmPct: 88, cpPct: 7.4, tdnPct: 47.5, ndfPct: 57, adfPct: 36, caPct: 0.4, pPct: 0.16, notes: 'Invented demo analysis, reported as fed.' }, nutritionistId, transaction)
      }
    }
  })
  const user = await User.findByPk(nutritionistId)
  if (!user) return
  const plans = demoBalancePlans(y)
  for (const p of plans.main) await ensureBalance(ids.operations.main, p, user, sequelize)
  const clientHay = await Feed.findOne({ where: { operationId: ids.operations.client, name: 'Demo grass hay, round bales' } })
  for (const p of plans.client) {
    const clientField = await Field.findOne({ where: { operationId: ids.operations.client }, order: [['id', 'ASC']] })
    const withField = clientField && (await FieldComponent.count({ where: { fieldId: clientField.id } })) > 0 ? { ...p, field: 'any' as const } : p
    await ensureBalance(ids.operations.client, withField, user, sequelize, clientHay ? [clientHay.id] : [])
  }
}
