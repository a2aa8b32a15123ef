// The one place the grazing side reads the nutrition side's tables (herd groups, lab results, balances), so that coupling stays visible and small.
import { Op, type Sequelize } from 'sequelize'
import { Balance, BalanceVersion, Feed, Herd, LabResult } from '../../models/nutrition'
import { herdValues } from '../nutrition/herds'
import { herdNeeds } from '../../../shared/adapters/nutrition/problem'
import { feedIdFromEngine } from '../../../shared/adapters/nutrition/problem'
import type { ComponentQualityInput } from '../../../shared/schemas/grazing/fields'
import type { GrazingGroupOption, PlanSupplement } from '../../../shared/schemas/grazing/plans'

export type GroupInfo = GrazingGroupOption
export type LabQuality = ComponentQualityInput & { dmPct: number | null }

type StoredSupplement = { feedId: string; kgDm: number; kgAsFed: number; cost: number }

/**
 * The supplement of each group's most recent balance, as one daily ration per head: the supplements' names together,
 * their as-fed amounts summed, and the DM fraction and price that reproduce their DM and cost.
 */
async function latestSupplements(operationId: number, herdIds: number[]): Promise<Map<number, PlanSupplement | null>> {
  const out = new Map<number, PlanSupplement | null>()
  if (!herdIds.length) return out
  const balances = await Balance.findAll({ where: { operationId, herdId: { [Op.in]: herdIds } }, order: [['updatedAt', 'DESC']] })
  const latest = new Map<number, Balance>()
  for (const b of balances) if (!latest.has(b.herdId)) latest.set(b.herdId, b)
  const versions = latest.size
    ? await BalanceVersion.findAll({ where: { [Op.or]: [...latest.values()].map((b) => ({ balanceId: b.id, version: b.version })) } })
    : []
  const feedIds = new Set<number>()
  const byHerd = new Map<number, StoredSupplement[]>()
  for (const [herdId, b] of latest) {
    const v = versions.find((x) => x.balanceId === b.id)
    const sups = ((v?.result as { supplements?: StoredSupplement[] } | undefined)?.supplements ?? []).filter((s) => s.kgAsFed > 0)
    byHerd.set(herdId, sups)
    for (const s of sups) {
      const id = feedIdFromEngine(s.feedId)
      if (id !== null) feedIds.add(id)
    }
  }
  const feeds = feedIds.size ? await Feed.findAll({ where: { id: { [Op.in]: [...feedIds] } }, attributes: ['id', 'name'] }) : []
  const names = new Map(feeds.map((f) => [f.id, f.name]))
  for (const [herdId, sups] of byHerd) {
    if (!sups.length) {
      out.set(herdId, null)
      continue
    }
    const kgAsFed = sups.reduce((a, s) => a + s.kgAsFed, 0)
    const kgDm = sups.reduce((a, s) => a + s.kgDm, 0)
    const cost = sups.reduce((a, s) => a + s.cost, 0)
    const label = sups.map((s) => names.get(feedIdFromEngine(s.feedId) ?? -1) ?? 'supplement').join(' + ')
    out.set(herdId, { label: label.slice(0, 120), kgAsFedPerHeadPerDay: kgAsFed, dmFraction: Math.min(1, Math.max(1e-6, kgDm / kgAsFed)), pricePerKgAsFed: cost / kgAsFed })
  }
  return out
}

/**
 * Herd groups of an operation with what grazing needs on a date: head count, weight, the dry-matter intake the
 * nutrition engine computes for the group's stage (herdNeeds), pregnant or nursing on that date, and the supplement
 * of its latest balance.
 */
export async function listHerdGroups(sequelize: Sequelize, operationId: number, date: string, ids?: number[]): Promise<GroupInfo[]> {
  void sequelize
  const herds = await Herd.findAll({ where: { operationId, ...(ids ? { id: { [Op.in]: ids } } : {}) }, order: [['name', 'ASC']] })
  const sups = await latestSupplements(operationId, herds.map((h) => h.id))
  return herds.map((h) => {
    let intake: number | null = null
    let pregnant = false
    let lactating = false
    try {
      const n = herdNeeds(herdValues(h), date)
      intake = n.requirements.dmiKg
      pregnant = n.stage.pregnancyDay !== null
      lactating = n.stage.daysInMilk !== null
    } catch {
      // A group whose stored values the engine refuses still shows; its intake is then entered on the plan.
    }
    return { herdId: h.id, name: h.name, species: h.species, headCount: h.headCount, bodyWeightKg: h.bodyWeightKg, intakeKgDmPerHead: intake, pregnant, lactating, supplement: sups.get(h.id) ?? null }
  })
}

/** Analyses of the given lab results of an operation, by id; results of other operations are never returned. */
export async function labQualities(sequelize: Sequelize, operationId: number, ids: number[]): Promise<Map<number, LabQuality>> {
  void sequelize
  const rows = await LabResult.findAll({ where: { operationId, id: { [Op.in]: [...new Set(ids)] } } })
  return new Map(
    rows.map((r) => [
      r.id,
      {
        cpPctDm: r.cpPctDm,
        tdnPctDm: r.tdnPctDm,
        ...(r.adfPctDm !== null ? { adfPctDm: r.adfPctDm } : {}),
        ...(r.ndfPctDm !== null ? { ndfPctDm: r.ndfPctDm } : {}),
        ...(r.caPctDm !== null ? { caPctDm: r.caPctDm } : {}),
        ...(r.pPctDm !== null ? { pPctDm: r.pPctDm } : {}),
        source: { kind: 'lab' as const, label: `${r.labName}${r.sampleRef ? `, sample ${r.sampleRef}` : ''}`, sampledOn: r.sampleDate },
        dmPct: r.dmPct,
      },
    ]),
  )
}
