// CSV exports of every nutrition table (herds, feeds, lab results, balances, one balance's need against supply) in the user's units.
import type { Response } from 'express'
import { stringify } from 'csv-stringify/sync'
import { z } from 'zod'
import { Op } from 'sequelize'
import { Balance, Feed, Herd, LabResult } from '../../models/nutrition'
import { cToF, kphToMph, LB_KG } from '../../../shared/engine/units'
import { herdStageOn, type HerdValues } from '../../../shared/schemas/nutrition/herds'
import { coverageWord, nutrientLabels } from '../../../shared/schemas/nutrition/balances'
import { supplementPlan } from '../../../shared/adapters/nutrition/plan'
import type { FeedRef } from '../../../shared/adapters/nutrition/problem'
import type { BalanceResult } from '../../../shared/engine/nutrition/ration/schema'
import { herdValues } from './herds'
import { latestLabResults } from './feeds'
import { balanceVersion } from './balances'
import { todayIso } from './common'

export const unitsQuery = z.object({ units: z.enum(['us', 'metric']).optional() })
export type Units = 'us' | 'metric'

/** A row cap keeps one export from holding the server: far above any real operation's tables. */
const MAX_ROWS = 50_000

export function sendCsv(res: Response, name: string, csv: string) {
  res.setHeader('Content-Type', 'text/csv; charset=utf-8')
  res.setHeader('Content-Disposition', `attachment; filename="${name}-${todayIso()}.csv"`)
  res.send(csv)
}

const r = (v: number | null | undefined, d = 2) => (v == null ? '' : String(Math.round(v * 10 ** d) / 10 ** d))
const mass = (kg: number | null | undefined, u: Units, d = 2) => (kg == null ? '' : r(u === 'us' ? kg / LB_KG : kg, d))
const massUnit = (u: Units) => (u === 'us' ? 'lb' : 'kg')

function csv(header: string[], rows: unknown[][]) {
  return stringify([header, ...rows])
}

export async function exportHerds(operationId: number, units: Units = 'us') {
  const herds = await Herd.findAll({ where: { operationId }, order: [['name', 'ASC']], limit: MAX_ROWS })
  const m = massUnit(units)
  const today = todayIso()
  return csv(
    ['name', 'species', 'class', 'head_count', `body_weight_${m}`, `mature_weight_${m}`, 'bcs', 'breed', 'expected_birth_date', 'last_birth_date', `stage_on_${today}`, 'litter_size', `peak_milk_${m}_per_day`, `target_gain_${m}_per_day`, 'grazing', units === 'us' ? 'temperature_f' : 'temperature_c', units === 'us' ? 'wind_mph' : 'wind_kph', 'coat', 'mud', 'notes'],
    herds.map((h) => {
      const v: HerdValues = herdValues(h)
      const env = v.environment
      return [
        v.name, v.species, v.class, v.headCount, mass(v.bodyWeightKg, units, 0), mass(v.matureWeightKg, units, 0), v.bcs, v.breed ?? '', v.expectedBirthDate ?? '', v.lastBirthDate ?? '',
        herdStageOn(v, today).label, v.litterSize ?? '', mass(v.peakMilkKg, units, 1), mass(v.targetGainKg, units, 2), v.grazing ? 'yes' : 'no',
        env ? r(units === 'us' ? cToF(env.tempC) : env.tempC, 0) : '', env?.windKph != null ? r(units === 'us' ? kphToMph(env.windKph) : env.windKph, 0) : '', env?.coat ?? '', env?.mud ?? '', v.notes ?? '',
      ]
    }),
  )
}

export async function exportFeeds(operationId: number, units: Units = 'us') {
  const feeds = await Feed.findAll({ where: { [Op.or]: [{ operationId }, { operationId: null }] }, order: [['operationId', 'ASC NULLS LAST'], ['name', 'ASC']], limit: MAX_ROWS })
  const labs = await latestLabResults(operationId, feeds.map((f) => f.id))
  return csv(
    ['name', 'set', 'kind', 'dm_pct', 'cp_pct_dm', 'tdn_pct_dm', 'ndf_pct_dm', 'adf_pct_dm', 'ca_pct_dm', 'p_pct_dm', 'cu_mg_per_kg_dm', 'nitrate_n_ppm_dm', 'values_from_lab', 'cattle_only', 'price', 'price_per', `bag_weight_${massUnit(units)}`, 'on_hand', 'source', 'source_detail', 'values_read', 'values_from_memory', 'values_common_practice', 'values_derived'],
    feeds.map((f) => {
      const lab = labs.get(f.id)
      const val = (k: 'dmPct' | 'cpPctDm' | 'tdnPctDm' | 'ndfPctDm' | 'adfPctDm' | 'caPctDm' | 'pPctDm' | 'cuMgPerKgDm' | 'nitrateNPpmDm') => r((lab?.get(k) as number | null) ?? f.get(k), 3)
      return [
        f.name, f.operationId === null ? 'reference' : 'own', f.kind, val('dmPct'), val('cpPctDm'), val('tdnPctDm'), val('ndfPctDm'), val('adfPctDm'), val('caPctDm'), val('pPctDm'), val('cuMgPerKgDm'), val('nitrateNPpmDm'),
        lab ? `${lab.labName} ${lab.sampleDate}` : '', f.cattleOnly ? 'yes' : 'no', r(f.priceAmount), f.priceUnit ?? '', mass(f.bagWeightKg, units, 1), f.available ? 'yes' : 'no', f.sourceTitle ?? '', f.sourceDetail ?? '',
        f.provenance?.read.join(' ') ?? '', f.provenance?.fromMemory.join(' ') ?? '', f.provenance?.commonPractice.join(' ') ?? '', f.provenance?.derived.join(' ') ?? '',
      ]
    }),
  )
}

export async function exportLabResults(operationId: number) {
  const rows = await LabResult.findAll({ where: { operationId }, include: [{ model: Feed, as: 'feed', attributes: ['name'] }], order: [['sampleDate', 'DESC'], ['id', 'DESC']], limit: MAX_ROWS })
  return csv(
    ['id', 'feed', 'field_id', 'component', 'sample_date', 'lab', 'sample_ref', 'entered_basis', 'dm_pct', 'cp_pct_dm', 'tdn_pct_dm', 'tdn_estimated_from_adf', 'adf_pct_dm', 'ndf_pct_dm', 'ca_pct_dm', 'p_pct_dm', 'nitrate_n_ppm_dm', 'cu_mg_per_kg_dm', 'version', 'notes'],
    rows.map((x) => [
      x.id, (x as unknown as { feed?: Feed }).feed?.name ?? '', x.fieldId ?? '', x.component ?? '', x.sampleDate, x.labName, x.sampleRef ?? '', x.enteredBasis, r(x.dmPct, 3), r(x.cpPctDm, 3), r(x.tdnPctDm, 3), x.tdnEstimated ? 'yes' : 'no',
      r(x.adfPctDm, 3), r(x.ndfPctDm, 3), r(x.caPctDm, 3), r(x.pPctDm, 3), r(x.nitrateNPpmDm, 1), r(x.cuMgPerKgDm, 1), x.version, x.notes ?? '',
    ]),
  )
}

export async function exportBalances(operationId: number) {
  const rows = await Balance.findAll({ where: { operationId }, include: [{ model: Herd, as: 'herd', attributes: ['name'] }], order: [['updatedAt', 'DESC']], limit: MAX_ROWS })
  return csv(
    ['id', 'name', 'herd_group', 'date', 'status', 'cost_per_head_day', 'version', 'out_of_date', 'out_of_date_reason', 'updated_at'],
    rows.map((b) => [b.id, b.name ?? '', (b as unknown as { herd?: Herd }).herd?.name ?? '', b.date, b.status, r(b.costPerHeadDay, 4), b.version, b.outOfDate ? 'yes' : 'no', b.outOfDateReason ?? '', b.updatedAt.toISOString()]),
  )
}

/** One balance: need against supply, then the supplement plan for the group. */
export async function exportBalance(operationId: number, id: number, version: number | undefined, units: Units = 'us') {
  const { version: v } = await balanceVersion(operationId, id, version)
  const result = v.result as unknown as BalanceResult
  const inputs = v.inputs as { feeds: FeedRef[]; herd: { headCount: number } }
  const unit = (u: string) => (u === 'kg' ? massUnit(units) : u)
  const val = (x: number, u: string) => (u === 'kg' ? mass(x, units, 3) : r(x, 3))
  const need = result.supply.map((s) => ['need', nutrientLabels[s.nutrient] ?? s.nutrient, unit(s.unit), val(s.need, s.unit), val(s.supplied, s.unit), r(s.pctCovered, 1), coverageWord(s.pctCovered), '', '', ''])
  const plan = supplementPlan(result, inputs.feeds, inputs.herd.headCount)
  const sup = plan.rows.map((p) => ['supplement', p.name, `${massUnit(units)} as fed`, mass(p.kgAsFedPerHead, units, 3), mass(p.kgAsFedPerGroupDay, units, 1), '', '', r(p.costPerHeadDay, 4), r(p.costPerGroupDay, 2), r(p.costPerGroupWeek, 2)])
  return csv(['section', 'item', 'unit', 'need_or_per_head_day', 'supplied_or_per_group_day', 'pct_covered', 'word', 'cost_per_head_day', 'cost_per_group_day', 'cost_per_group_week'], [...need, ...sup])
}
