// What a field offers a herd group on a date, as Balance feeds: the entry point the Balance calls for a group on a field.
import { Field, FieldComponent } from '../../models/grazing'
import { AppError } from '../../errors'
import { isoDateSchema } from '../../../shared/schemas/common'
import { fieldFeedsFromField, type FieldFeeds } from '../../../shared/adapters/grazing/toEngine'
import { fieldJson } from './fields'
import { labQualities } from './nutritionLinks'

export type { FieldFeeds }

/**
 * Feeds of one field of the operation on a date: one 'field' feed per standing component (sorghum grain, leaf and
 * stalk, legume forage, legume seed) with DM %, CP, TDN (Ca, P when known) after weathering to that date, from the
 * component's lab result or book value; the field's nitrate result on the forage parts; `isGrain` on sorghum grain
 * and `isLegume` on the legume parts; and `fieldOffer`, each component's share of the standing DM (adds to 1).
 * `supply` is the grazing engine's fieldSupply for the same date. A field of another operation is a 404; a
 * malformed date is a 400 naming `date`.
 */
export async function fieldFeedsForBalance(operationId: number, fieldId: number, dateIso: string): Promise<FieldFeeds> {
  const date = isoDateSchema.safeParse(dateIso)
  if (!date.success) throw new AppError(400, 'validation_failed', 'The request has 1 invalid field: date.', [{ field: 'date', message: 'Use a date as YYYY-MM-DD.' }])
  const f = await Field.findOne({ where: { id: fieldId, operationId }, include: [{ model: FieldComponent, as: 'components' }] })
  if (!f) throw AppError.notFound('Field')
  const ids = (f.components ?? []).map((c) => c.labResultId).filter((x): x is number => x !== null)
  const lab = ids.length && f.sequelize ? await labQualities(f.sequelize, operationId, ids) : undefined
  return fieldFeedsFromField(fieldJson(f, f.components ?? [], lab), date.data)
}
