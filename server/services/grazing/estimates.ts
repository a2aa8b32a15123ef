// Yield worksheets: compute an estimate from head counts or clipped frames and write it into the field's component, in one transaction.
import type { Sequelize } from 'sequelize'
import { AppError } from '../../errors'
import { FieldComponent, FieldEstimate } from '../../models/grazing'
import type { Estimate, WorksheetResult } from '../../../shared/schemas/grazing/estimates'
import { worksheetSchema } from '../../../shared/schemas/grazing/estimates'
import { computeWorksheet } from '../../../shared/adapters/grazing/worksheets'
import type { z } from 'zod'
import { findField } from './fields'

type Worksheet = z.output<typeof worksheetSchema>

export function estimateJson(e: FieldEstimate): Estimate {
  return {
    id: e.id,
    fieldId: e.fieldId,
    componentId: e.componentId,
    kind: e.kind,
    method: e.method,
    measuredOn: e.measuredOn,
    inputs: e.inputs,
    result: e.result as WorksheetResult,
    createdBy: e.createdBy,
    createdAt: e.createdAt.toISOString(),
  }
}

/**
 * Saves a worksheet and writes its mean into the field: the component of that kind gets the new dry matter, date,
 * method and basis (created if the field has none yet); its quality and lab link are kept.
 */
export async function createEstimate(sequelize: Sequelize, operationId: number, fieldId: number, userId: number, w: Worksheet): Promise<{ estimate: Estimate; componentId: number }> {
  const result = computeWorksheet(w)
  return sequelize.transaction(async (transaction) => {
    const field = await findField(operationId, fieldId, transaction)
    if (field.legume === 'none' && result.kind.startsWith('legume')) {
      throw new AppError(400, 'validation_failed', 'The request body has 1 invalid field: kind.', [{ field: 'kind', message: 'A field without a legume has no legume component.' }])
    }
    const values = { kgDmPerHa: result.kgDmPerHa.mean, measuredOn: w.measuredOn, method: w.method, basis: result.basis }
    let component = (field.components ?? []).find((c) => c.kind === result.kind)
    if (component) await component.update(values, { transaction })
    else component = await FieldComponent.create({ fieldId: field.id, kind: result.kind, dmPct: null, labResultId: null, quality: null, ...values }, { transaction })
    const e = await FieldEstimate.create(
      { fieldId: field.id, componentId: component.id, kind: result.kind, method: w.method, measuredOn: w.measuredOn, inputs: w, result, createdBy: userId },
      { transaction },
    )
    return { estimate: estimateJson(e), componentId: component.id }
  })
}

export async function listEstimates(operationId: number, fieldId: number): Promise<Estimate[]> {
  await findField(operationId, fieldId)
  const rows = await FieldEstimate.findAll({ where: { fieldId }, order: [['createdAt', 'DESC'], ['id', 'DESC']] })
  return rows.map(estimateJson)
}

async function findEstimate(operationId: number, fieldId: number, estimateId: number) {
  await findField(operationId, fieldId)
  const e = await FieldEstimate.findOne({ where: { id: estimateId, fieldId } })
  if (!e) throw AppError.notFound('Estimate')
  return e
}

export async function getEstimate(operationId: number, fieldId: number, estimateId: number): Promise<Estimate> {
  return estimateJson(await findEstimate(operationId, fieldId, estimateId))
}

/** Removes the worksheet from the history; the component keeps the figure it wrote (later edits may have built on it). */
export async function deleteEstimate(operationId: number, fieldId: number, estimateId: number): Promise<void> {
  await (await findEstimate(operationId, fieldId, estimateId)).destroy()
}
