// The season across every field and group: stored settings (or sensible defaults), the data the budget is built from, and the budget itself.
import type { Sequelize } from 'sequelize'
import { SeasonSettings } from '../../models/grazing'
import type { SeasonSettingsValues } from '../../../shared/schemas/grazing/season'
import { computeSeason } from '../../../shared/adapters/grazing/seasonInput'
import { addDays } from '../../../shared/engine/grazing/dates'
import { fieldsAndPlans } from './plans'
import { listHerdGroups } from './nutritionLinks'
import { todayIso } from '../dates'

/** A winter of about five months from the first plan; the shortfall feed is unpriced until the user prices it. */
export const DEFAULT_SEASON_DAYS = 150

function defaults(firstStart: string | null): SeasonSettingsValues {
  const start = firstStart ?? todayIso()
  return {
    startDate: start,
    endDate: addDays(start, DEFAULT_SEASON_DAYS - 1),
    shortfallFeed: { label: 'Harvested feed (enter its price)', dmFraction: 0.88, pricePerKgAsFed: 0 },
    harvestedAlternative: null,
    frostWaitDays: null,
  }
}

function settingsJson(s: SeasonSettings): SeasonSettingsValues {
  return { startDate: s.startDate, endDate: s.endDate, shortfallFeed: s.shortfallFeed, harvestedAlternative: s.harvestedAlternative, frostWaitDays: s.frostWaitDays }
}

export async function getSeason(sequelize: Sequelize, operationId: number) {
  const stored = await SeasonSettings.findOne({ where: { operationId } })
  const { fields, plans } = await fieldsAndPlans(sequelize, operationId, stored?.startDate ?? todayIso())
  const firstStart = plans.length ? plans.map((p) => p.startDate).sort()[0] : null
  const settings = stored ? settingsJson(stored) : defaults(firstStart)
  const herds = await listHerdGroups(sequelize, operationId, settings.startDate)
  const planned = new Set(plans.map((p) => p.herdId).filter((x) => x !== null))
  const unplanned = herds.filter((h) => !planned.has(h.herdId))
  const { budget, groups } = computeSeason(settings, fields, plans)
  return { settings, settingsSaved: !!stored, fields, plans, unplanned, groups, budget }
}

export async function saveSeasonSettings(operationId: number, values: SeasonSettingsValues): Promise<SeasonSettingsValues> {
  const existing = await SeasonSettings.findOne({ where: { operationId } })
  if (existing) await existing.update(values)
  else await SeasonSettings.create({ operationId, ...values })
  return values
}
