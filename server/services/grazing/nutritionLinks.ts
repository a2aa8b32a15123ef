// The one place the grazing side reads the nutrition side's tables (herd groups, lab results, balances), so that coupling stays visible and small.
import type { Sequelize } from 'sequelize'
import type { ComponentQualityInput } from '../../../shared/schemas/grazing/fields'

/** A herd group as grazing needs it: who eats, how much, and what supplement its latest balance prescribes. */
export type GroupInfo = {
  herdId: number
  name: string
  species: 'cattle' | 'sheep'
  headCount: number
  bodyWeightKg: number
  intakeKgDmPerHead: number | null
  pregnant: boolean
  lactating: boolean
  supplement: { label: string; kgAsFedPerHeadPerDay: number; dmFraction: number; pricePerKgAsFed: number } | null
}

export type LabQuality = ComponentQualityInput & { dmPct: number | null }

/** Herd groups of an operation; empty while the Herds table does not exist in this database. */
export async function listHerdGroups(sequelize: Sequelize, operationId: number): Promise<GroupInfo[]> {
  void sequelize
  void operationId
  return []
}

/** Analyses of the given lab results of an operation, by id; results of other operations are never returned. */
export async function labQualities(sequelize: Sequelize, operationId: number, ids: number[]): Promise<Map<number, LabQuality>> {
  void sequelize
  void operationId
  void ids
  return new Map()
}
