// Balances: assemble a group's inputs (herd, date, field or feeds, supplements), run the engine, store each run as a version; re-run those out of date.
import { Op, type Sequelize, type Transaction } from 'sequelize'
import { ZodError } from 'zod'
import { AppError, fieldErrorsFromZod } from '../../errors'
import { Balance, BalanceVersion, Herd } from '../../models/nutrition'
import { FieldComponent } from '../../models/grazing'
import type { User } from '../../models/index'
import { balanceRation } from '../../../shared/engine/nutrition/ration/balance'
import type { BalanceResult } from '../../../shared/engine/nutrition/ration/schema'
import {
  balanceRenameSchema,
  balanceRerunSchema,
  balanceSelectionSchema,
  type BalanceSelectionValues,
} from '../../../shared/schemas/nutrition/balances'
import { buildBalanceProblem, type BalanceFeed, type BuiltProblem, type FieldOffer } from '../../../shared/adapters/nutrition/problem'
import type { ListQuery } from '../../../shared/schemas/nutrition/common'
import { fieldFeedsForBalance } from '../grazing/fieldFeeds'
import { assertVersion, iso, ordering, paging, parseWith, pickSent, type Paged } from './common'
import { feedsForBalance, type FeedView } from './feeds'
import { herdValues } from './herds'

export type Assembled = { herd: Herd; built: BuiltProblem; field: { id: number; name: string } | null; dropped: string[] }

function toBalanceFeed(f: FeedView): BalanceFeed {
  return {
    id: f.id, name: f.name, kind: f.kind, effective: f.effective, isGrain: f.isGrain, isUrea: f.isUrea, isLegume: f.isLegume, cattleOnly: f.cattleOnly,
    available: f.available, priceAmount: f.priceAmount, priceUnit: f.priceUnit, bagWeightKg: f.bagWeightKg, maxKgAsFedPerHeadDay: f.maxKgAsFedPerHeadDay,
  }
}

/** What a field offers on the date, with the lab results its components use (so their edits mark this balance). */
export async function fieldOffer(operationId: number, fieldId: number, date: string): Promise<FieldOffer & { field: { id: number; name: string } }> {
  const ff = await fieldFeedsForBalance(operationId, fieldId, date)
  const comps = await FieldComponent.findAll({ where: { fieldId }, attributes: ['labResultId'] })
  const labResultIds = comps.map((c) => c.labResultId).filter((x): x is number => x != null)
  return { fieldName: ff.field.name, field: ff.field, feeds: ff.feeds, fieldOffer: ff.fieldOffer, labResultIds }
}

/**
 * Reads everything a run needs for the selection. With `lenient` (re-running a stored balance) feeds deleted since are
 * left out and named in `dropped`; otherwise an unknown feed is a 400 naming where it was listed.
 */
export async function assemble(operationId: number, sel: BalanceSelectionValues, lenient = false, transaction?: Transaction): Promise<Assembled> {
  const herd = await Herd.findOne({ where: { id: sel.herdId, operationId }, transaction })
  if (!herd) throw AppError.badRequest('No such herd group in this operation.', [{ field: 'herdId', message: 'No such herd group in this operation.' }])
  const dropped: string[] = []
  let baseChoices = sel.baseFeeds
  let supplementIds = sel.supplementIds
  if (lenient) {
    const all = await feedsForBalanceLenient(operationId, [...baseChoices.map((b) => b.feedId), ...supplementIds], transaction)
    baseChoices = baseChoices.filter((b) => all.has(b.feedId) || (dropped.push(`feed ${b.feedId}`), false))
    supplementIds = supplementIds.filter((id) => all.has(id) || (dropped.push(`feed ${id}`), false))
  }
  const base = await feedsForBalance(operationId, baseChoices.map((b) => b.feedId), 'baseFeeds', transaction)
  const supp = await feedsForBalance(operationId, supplementIds, 'supplementIds', transaction)
  let field: (FieldOffer & { field: { id: number; name: string } }) | null = null
  if (sel.fieldId) {
    try {
      field = await fieldOffer(operationId, sel.fieldId, sel.date)
    } catch (e) {
      if (e instanceof AppError && e.status === 404) throw AppError.badRequest('No such field in this operation.', [{ field: 'fieldId', message: 'No such field in this operation.' }])
      throw e
    }
  }
  try {
    const built = buildBalanceProblem({
      herd: herdValues(herd),
      date: sel.date,
      baseFeeds: baseChoices.map((b) => ({ feed: toBalanceFeed(base.get(b.feedId)!), sharePct: b.sharePct })),
      supplements: supplementIds.map((id) => toBalanceFeed(supp.get(id)!)),
      field,
      settings: sel.settings,
    })
    if (!built.problem.feeds.length) {
      throw AppError.badRequest('No feed is left to balance: every chosen feed was left out for this group.', [{ field: 'baseFeeds', message: 'No feed left after leaving out those not allowed or not on hand.' }])
    }
    return { herd, built, field: field?.field ?? null, dropped }
  } catch (e) {
    throw engineInputError(e)
  }
}

async function feedsForBalanceLenient(operationId: number, ids: number[], transaction?: Transaction) {
  try {
    return await feedsForBalance(operationId, ids, 'feeds', transaction)
  } catch {
    const found = new Map<number, FeedView>()
    for (const id of ids) {
      try {
        for (const [k, v] of await feedsForBalance(operationId, [id], 'feeds', transaction)) found.set(k, v)
      } catch {
        // left out: the feed was deleted
      }
    }
    return found
  }
}

/** The engine validates its own inputs; a stored herd that no longer fits them is the user's to fix, so a 400, never a 500. */
function engineInputError(e: unknown): unknown {
  if (e instanceof ZodError) {
    const fields = fieldErrorsFromZod(e).map((f) => ({ field: `engine.${f.field}`, message: f.message }))
    return new AppError(400, 'balance_input', `The engine refused these inputs: ${fields.map((f) => `${f.field} (${f.message})`).join('; ')}.`, fields)
  }
  return e
}

export async function solve(built: BuiltProblem): Promise<BalanceResult> {
  try {
    // The engine's default path, the same the Balance screen's live preview takes: certified in-thread solves with shadow prices.
    return await balanceRation(built.problem)
  } catch (e) {
    throw engineInputError(e)
  }
}

function inputsRecord(a: Assembled) {
  return {
    herd: { id: a.herd.id, ...herdValues(a.herd) },
    field: a.field,
    problem: a.built.problem,
    requirements: a.built.needs.requirements,
    stage: a.built.needs.stage,
    animal: a.built.needs.animal,
    feeds: a.built.feeds,
    excluded: a.built.excluded,
    notes: [...a.built.notes, ...a.dropped.map((d) => `${d} was deleted since the last run and is left out.`)],
  }
}

function feedIdsOf(sel: BalanceSelectionValues) {
  return [...new Set([...sel.baseFeeds.map((b) => b.feedId), ...sel.supplementIds])]
}

function versionView(v: BalanceVersion) {
  return {
    version: v.version,
    selection: v.selection,
    inputs: v.inputs,
    result: v.result,
    labResultIds: v.labResultIds,
    createdBy: { id: v.createdBy, name: v.createdByName },
    createdAt: iso(v.createdAt),
  }
}

async function balanceView(b: Balance, opts: { latest?: BalanceVersion | null; versions?: BalanceVersion[]; herdName?: string; species?: 'cattle' | 'sheep' } = {}) {
  let herdName = opts.herdName
  let species = opts.species
  if (herdName === undefined || species === undefined) {
    const h = await Herd.findByPk(b.herdId, { attributes: ['name', 'species'] })
    herdName = h?.name ?? '(deleted group)'
    species = h?.species ?? 'cattle'
  }
  return {
    id: b.id,
    operationId: b.operationId,
    herdId: b.herdId,
    herdName,
    species,
    name: b.name,
    date: b.date,
    status: b.status,
    costPerHeadDay: b.costPerHeadDay,
    outOfDate: b.outOfDate,
    outOfDateReason: b.outOfDateReason,
    version: b.version,
    ...(opts.latest ? { latest: versionView(opts.latest) } : {}),
    ...(opts.versions ? { versions: opts.versions.map((v) => ({ version: v.version, createdAt: iso(v.createdAt), createdBy: { id: v.createdBy, name: v.createdByName }, status: String((v.result as { status?: string }).status ?? '') })) } : {}),
    createdAt: iso(b.createdAt),
    updatedAt: iso(b.updatedAt),
  }
}
export type BalanceView = Awaited<ReturnType<typeof balanceView>>

async function storeRun(b: Balance | null, operationId: number, user: User, sel: BalanceSelectionValues, a: Assembled, result: BalanceResult, transaction: Transaction) {
  const common = {
    date: sel.date,
    status: result.status,
    costPerHeadDay: result.costPerHeadDay,
    feedIds: feedIdsOf(sel),
    labResultIds: a.built.labResultIds,
    fieldId: sel.fieldId ?? null,
    outOfDate: false,
    outOfDateReason: null,
    updatedBy: user.id,
  }
  if (!b) b = await Balance.create({ operationId, herdId: sel.herdId, name: sel.name ?? null, createdBy: user.id, ...common }, { transaction })
  else {
    b.set({ ...common, herdId: sel.herdId, name: sel.name ?? b.name, version: b.version + 1 })
    await b.save({ transaction })
  }
  const v = await BalanceVersion.create(
    {
      balanceId: b.id,
      version: b.version,
      selection: sel as unknown as Record<string, unknown>,
      inputs: inputsRecord(a) as unknown as Record<string, unknown>,
      result: result as unknown as Record<string, unknown>,
      labResultIds: a.built.labResultIds,
      createdBy: user.id,
      createdByName: user.name,
    },
    { transaction },
  )
  return balanceView(b, { latest: v, herdName: a.herd.name, species: a.herd.species })
}

export async function createBalance(sequelize: Sequelize, operationId: number, user: User, body: unknown) {
  const sel = parseWith(balanceSelectionSchema, body)
  const a = await assemble(operationId, sel)
  const result = await solve(a.built)
  return sequelize.transaction((t) => storeRun(null, operationId, user, sel, a, result, t))
}

/** Dry run: the same assembly and engine call without storing, for checks and for clients without the engine. */
export async function previewBalance(operationId: number, body: unknown) {
  const sel = parseWith(balanceSelectionSchema, body)
  const a = await assemble(operationId, sel)
  const result = await solve(a.built)
  return { selection: sel, inputs: inputsRecord(a), result }
}

export async function findBalance(operationId: number, id: number, transaction?: Transaction, lock = false) {
  const b = await Balance.findOne({ where: { id, operationId }, transaction, ...(lock && transaction ? { lock: transaction.LOCK.UPDATE } : {}) })
  if (!b) throw AppError.notFound('Balance')
  return b
}

export async function getBalance(operationId: number, id: number, version?: number) {
  const b = await findBalance(operationId, id)
  const versions = await BalanceVersion.findAll({ where: { balanceId: b.id }, order: [['version', 'DESC']] })
  const latest = version ? versions.find((v) => v.version === version) : versions[0]
  if (!latest) throw AppError.notFound('Balance version')
  return balanceView(b, { latest, versions })
}

/** The stored version's selection, or 404. */
export async function balanceVersion(operationId: number, id: number, version?: number) {
  const b = await findBalance(operationId, id)
  const v = await BalanceVersion.findOne({ where: { balanceId: b.id, ...(version ? { version } : { version: b.version }) } })
  if (!v) throw AppError.notFound('Balance version')
  return { balance: b, version: v }
}

/** Re-runs a balance with changed inputs (or the same ones); the version sent must be current, else 409 with both. */
export async function rerunBalance(sequelize: Sequelize, operationId: number, user: User, id: number, body: unknown) {
  const patch = parseWith(balanceRerunSchema, body)
  const { balance, version } = await balanceVersion(operationId, id)
  const sent = pickSent(patch, body)
  assertVersion(balance, patch.version, 'balance', () => ({ id: balance.id, version: balance.version, selection: version.selection, outOfDate: balance.outOfDate }), sent)
  const sel = parseWith(balanceSelectionSchema, { ...version.selection, ...sent })
  const a = await assemble(operationId, sel)
  const result = await solve(a.built)
  return sequelize.transaction(async (t) => {
    const b = await findBalance(operationId, id, t, true)
    // Someone may have re-run it while the engine was working.
    assertVersion(b, patch.version, 'balance', () => ({ id: b.id, version: b.version, outOfDate: b.outOfDate }), sent)
    return storeRun(b, operationId, user, sel, a, result, t)
  })
}

/** Re-runs every out-of-date balance of the operation (or the ones listed) with its stored inputs and today's feed values. */
export async function rerunOutOfDate(sequelize: Sequelize, operationId: number, user: User, ids?: number[]) {
  const stale = await Balance.findAll({ where: { operationId, outOfDate: true, ...(ids?.length ? { id: ids } : {}) }, order: [['id', 'ASC']] })
  const done: Array<{ id: number; version: number; status: string } | { id: number; error: string }> = []
  for (const b of stale) {
    const v = await BalanceVersion.findOne({ where: { balanceId: b.id, version: b.version } })
    if (!v) continue
    try {
      const sel = parseWith(balanceSelectionSchema, v.selection)
      const a = await assemble(operationId, sel, true)
      const result = await solve(a.built)
      const view = await sequelize.transaction(async (t) => {
        const fresh = await findBalance(operationId, b.id, t, true)
        return storeRun(fresh, operationId, user, sel, a, result, t)
      })
      done.push({ id: view.id, version: view.version, status: view.status })
    } catch (e) {
      done.push({ id: b.id, error: e instanceof AppError ? e.message : 'This balance could not be re-run.' })
    }
  }
  return { rerun: done }
}

export async function listBalances(operationId: number, q: ListQuery & { herdId?: number; outOfDate?: 'true' | 'false' }): Promise<Paged<BalanceView>> {
  const where = {
    operationId,
    ...(q.herdId ? { herdId: q.herdId } : {}),
    ...(q.outOfDate ? { outOfDate: q.outOfDate === 'true' } : {}),
    ...(q.q?.trim() ? { name: { [Op.iLike]: `%${q.q.trim().replace(/[\\%_]/g, (c) => `\\${c}`)}%` } } : {}),
  }
  const { rows, count } = await Balance.findAndCountAll({
    where,
    include: [{ model: Herd, as: 'herd', attributes: ['name', 'species'] }],
    order: ordering(q, ['date', 'name', 'status', 'costPerHeadDay', 'updatedAt', 'outOfDate'], 'updatedAt'),
    ...paging(q),
  })
  const items = await Promise.all(
    rows.map((b) => {
      const h = (b as unknown as { herd?: Herd }).herd
      return balanceView(b, { herdName: h?.name ?? '(deleted group)', species: h?.species ?? 'cattle' })
    }),
  )
  return { items, total: count, page: q.page, pageSize: q.pageSize }
}

export async function renameBalance(sequelize: Sequelize, operationId: number, id: number, user: User, body: unknown) {
  const v = parseWith(balanceRenameSchema, body)
  return sequelize.transaction(async (t) => {
    const b = await findBalance(operationId, id, t, true)
    assertVersion(b, v.version, 'balance', () => ({ id: b.id, version: b.version, name: b.name }), { name: v.name })
    // A name is not an input of the run: it changes without a new version.
    b.set({ name: v.name ?? null, updatedBy: user.id })
    await b.save({ transaction: t })
    return balanceView(b)
  })
}

export async function deleteBalance(operationId: number, id: number) {
  const b = await findBalance(operationId, id)
  await b.destroy()
}

