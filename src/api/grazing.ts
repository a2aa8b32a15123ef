// Fields, worksheets, strip plans, records, Today and Season API calls; every response is parsed with its shared schema.
import { z } from 'zod'
import { api } from './client'
import { componentSchema, fieldListSchema, fieldSchema, type ComponentInput, type FieldCreate, type FieldUpdate } from '@shared/schemas/grazing/fields'
import { estimateSchema, type WorksheetInput } from '@shared/schemas/grazing/estimates'
import { grazingGroupListSchema, planListSchema, planSchema, type PlanCreate, type PlanUpdate } from '@shared/schemas/grazing/plans'
import { recordListSchema, recordSchema, todaySchema, type RecordCreate, type RecordUpdate } from '@shared/schemas/grazing/records'
import { seasonDataSchema, seasonSettingsSchema, type SeasonSettingsValues } from '@shared/schemas/grazing/season'

const op = (id: number) => `/operations/${id}`
async function parsed<S extends z.ZodType>(schema: S, p: Promise<unknown>): Promise<z.output<S>> {
  return schema.parse(await p)
}

export const fieldsApi = {
  list: (opId: number) => parsed(fieldListSchema, api(`${op(opId)}/fields`)),
  get: (opId: number, id: number) => parsed(fieldSchema, api(`${op(opId)}/fields/${id}`)),
  create: (opId: number, body: FieldCreate) => parsed(fieldSchema, api(`${op(opId)}/fields`, { method: 'POST', body })),
  update: (opId: number, id: number, body: FieldUpdate) => parsed(fieldSchema, api(`${op(opId)}/fields/${id}`, { method: 'PATCH', body })),
  remove: (opId: number, id: number) => api<void>(`${op(opId)}/fields/${id}`, { method: 'DELETE' }),
  addComponent: (opId: number, fieldId: number, body: ComponentInput) => parsed(componentSchema, api(`${op(opId)}/fields/${fieldId}/components`, { method: 'POST', body })),
  updateComponent: (opId: number, fieldId: number, id: number, body: Partial<ComponentInput>) =>
    parsed(componentSchema, api(`${op(opId)}/fields/${fieldId}/components/${id}`, { method: 'PATCH', body })),
  removeComponent: (opId: number, fieldId: number, id: number) => api<void>(`${op(opId)}/fields/${fieldId}/components/${id}`, { method: 'DELETE' }),
  saveWorksheet: (opId: number, fieldId: number, body: WorksheetInput) =>
    parsed(z.object({ estimate: estimateSchema, field: fieldSchema }), api(`${op(opId)}/fields/${fieldId}/estimates`, { method: 'POST', body })),
  estimates: (opId: number, fieldId: number) => parsed(z.object({ items: z.array(estimateSchema) }), api(`${op(opId)}/fields/${fieldId}/estimates`)),
}

export const plansApi = {
  groups: (opId: number, date?: string) => parsed(grazingGroupListSchema, api(`${op(opId)}/grazing-groups`, { query: { date } })),
  list: (opId: number) => parsed(planListSchema, api(`${op(opId)}/strip-plans`)),
  get: (opId: number, id: number) => parsed(planSchema, api(`${op(opId)}/strip-plans/${id}`)),
  create: (opId: number, body: PlanCreate) => parsed(planSchema, api(`${op(opId)}/strip-plans`, { method: 'POST', body })),
  update: (opId: number, id: number, body: PlanUpdate) => parsed(planSchema, api(`${op(opId)}/strip-plans/${id}`, { method: 'PATCH', body })),
  remove: (opId: number, id: number) => api<void>(`${op(opId)}/strip-plans/${id}`, { method: 'DELETE' }),
}

export const crewApi = {
  today: (opId: number, date?: string) => parsed(todaySchema, api(`${op(opId)}/today`, { query: { date } })),
  records: (opId: number, query: { date?: string; planId?: number } = {}) => parsed(recordListSchema, api(`${op(opId)}/records`, { query })),
  record: (opId: number, body: RecordCreate) => parsed(recordSchema, api(`${op(opId)}/records`, { method: 'POST', body })),
  updateRecord: (opId: number, id: number, body: RecordUpdate) => parsed(recordSchema, api(`${op(opId)}/records/${id}`, { method: 'PATCH', body })),
  removeRecord: (opId: number, id: number) => api<void>(`${op(opId)}/records/${id}`, { method: 'DELETE' }),
}

export const seasonApi = {
  get: (opId: number) => parsed(seasonDataSchema, api(`${op(opId)}/season`)),
  saveSettings: (opId: number, body: SeasonSettingsValues) => parsed(seasonSettingsSchema, api(`${op(opId)}/season/settings`, { method: 'PUT', body })),
}
