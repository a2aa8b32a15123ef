// Marks stored balances out of date when something they read changes: a lab result, a feed, the herd group or the field.
import { Op, type Transaction, type WhereOptions } from 'sequelize'
import { Balance } from '../../models/nutrition'

export type StaleCause = { herdId?: number; feedIds?: number[]; labResultIds?: number[]; fieldId?: number }

/** Returns the ids of the balances newly marked, so the caller can say how many are affected. */
export async function markBalancesOutOfDate(operationId: number, cause: StaleCause, reason: string, transaction?: Transaction): Promise<number[]> {
  const or: WhereOptions[] = []
  if (cause.herdId) or.push({ herdId: cause.herdId })
  if (cause.feedIds?.length) or.push({ feedIds: { [Op.overlap]: cause.feedIds } })
  if (cause.labResultIds?.length) or.push({ labResultIds: { [Op.overlap]: cause.labResultIds } })
  if (cause.fieldId) or.push({ fieldId: cause.fieldId })
  if (!or.length) return []
  const [, rows] = await Balance.update(
    { outOfDate: true, outOfDateReason: reason },
    { where: { operationId, [Op.or]: or }, returning: true, transaction, silent: true },
  )
  return rows.map((b) => b.id)
}
