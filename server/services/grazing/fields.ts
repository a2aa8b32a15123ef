// Fields and their components: create, read, update, delete, with the rules that span a field and its components.
import { UniqueConstraintError, type Sequelize, type Transaction } from 'sequelize'
import { AppError, validationError } from '../../errors'
import { Field, FieldComponent } from '../../models/grazing'
import {
  componentInputSchema,
  fieldSettingsSchema,
  type Component,
  type ComponentKind,
  type Field as FieldJson,
} from '../../../shared/schemas/grazing/fields'
import type { z } from 'zod'
import type { fieldCreateSchema, fieldUpdateSchema, componentUpdateSchema } from '../../../shared/schemas/grazing/fields'
import { labQualities, type LabQuality } from './nutritionLinks'

type FieldCreate = z.output<typeof fieldCreateSchema>
type FieldUpdate = z.output<typeof fieldUpdateSchema>
type ComponentInput = z.output<typeof componentInputSchema>
type ComponentUpdate = z.output<typeof componentUpdateSchema>

const iso = (d: Date) => d.toISOString()

function fieldError(field: string, message: string) {
  return new AppError(400, 'validation_failed', `The request body has 1 invalid field: ${field}.`, [{ field, message }])
}

export function componentJson(c: FieldComponent, lab?: Map<number, LabQuality>): Component {
  const l = c.labResultId !== null ? lab?.get(c.labResultId) : undefined
  return {
    id: c.id,
    fieldId: c.fieldId,
    kind: c.kind,
    kgDmPerHa: c.kgDmPerHa,
    basis: c.basis,
    measuredOn: c.measuredOn,
    method: c.method as Component['method'],
    dmPct: l?.dmPct ?? c.dmPct,
    labResultId: c.labResultId,
    quality: c.quality,
    labQuality: l ? withoutDm(l) : null,
    updatedAt: iso(c.updatedAt),
  }
}

function withoutDm(l: LabQuality): Component['quality'] {
  const { dmPct: _dm, ...q } = l
  return q
}

const KIND_ORDER: ComponentKind[] = ['sorghum-grain', 'sorghum-stover', 'legume-forage', 'legume-seed']

/** The stored settings of a field, as the API sends them and as an update is checked against. */
function fieldSettings(f: Field) {
  return {
    name: f.name,
    areaHa: f.areaHa,
    fenceLengthM: f.fenceLengthM,
    rowSpacingM: f.rowSpacingM,
    corridorWidthM: f.corridorWidthM,
    legume: f.legume,
    legumeShareOfWidth: f.legumeShareOfWidth,
    killingFrostDates: f.killingFrostDates,
    partialFrostDates: f.partialFrostDates,
    nitrate: f.nitrate,
    grainOnGround: f.grainOnGround,
    weathering: f.weathering,
    economics: f.economics,
    notes: f.notes,
  }
}

export function fieldJson(f: Field, components: FieldComponent[], lab?: Map<number, LabQuality>): FieldJson {
  return {
    id: f.id,
    operationId: f.operationId,
    ...fieldSettings(f),
    killingFrostDates: [...f.killingFrostDates].sort(),
    partialFrostDates: [...f.partialFrostDates].sort(),
    components: components
      .slice()
      .sort((a, b) => KIND_ORDER.indexOf(a.kind) - KIND_ORDER.indexOf(b.kind))
      .map((c) => componentJson(c, lab)),
    createdAt: iso(f.createdAt),
    updatedAt: iso(f.updatedAt),
  }
}

async function withLab(sequelize: Sequelize, operationId: number, fields: Field[]): Promise<FieldJson[]> {
  const ids = fields.flatMap((f) => (f.components ?? []).map((c) => c.labResultId).filter((x): x is number => x !== null))
  const lab = ids.length ? await labQualities(sequelize, operationId, ids) : new Map<number, LabQuality>()
  return fields.map((f) => fieldJson(f, f.components ?? [], lab))
}

export async function listFields(sequelize: Sequelize, operationId: number): Promise<FieldJson[]> {
  const rows = await Field.findAll({ where: { operationId }, include: [{ model: FieldComponent, as: 'components' }], order: [['name', 'ASC']] })
  return withLab(sequelize, operationId, rows)
}

/** A field of this operation, or 404 (another operation's field is indistinguishable from a missing one). */
export async function findField(operationId: number, fieldId: number, transaction?: Transaction): Promise<Field> {
  const f = await Field.findOne({ where: { id: fieldId, operationId }, include: [{ model: FieldComponent, as: 'components' }], transaction })
  if (!f) throw AppError.notFound('Field')
  return f
}

export async function getField(sequelize: Sequelize, operationId: number, fieldId: number): Promise<FieldJson> {
  const [json] = await withLab(sequelize, operationId, [await findField(operationId, fieldId)])
  return json
}

function mapUnique(e: unknown): never {
  if (e instanceof UniqueConstraintError) {
    const fields = Object.keys(e.fields ?? {})
    if (fields.includes('name')) throw new AppError(409, 'conflict', 'This operation already has a field of that name.', [{ field: 'name', message: 'Choose a name no other field of this operation uses.' }])
    if (fields.includes('kind')) throw new AppError(409, 'conflict', 'This field already has that component; change it instead.', [{ field: 'kind', message: 'Each component appears once per field.' }])
  }
  throw e
}

function componentRow(fieldId: number, c: ComponentInput) {
  return {
    fieldId,
    kind: c.kind,
    kgDmPerHa: c.kgDmPerHa,
    basis: c.basis ?? null,
    measuredOn: c.measuredOn,
    method: c.method,
    dmPct: c.dmPct ?? null,
    labResultId: c.labResultId ?? null,
    quality: c.quality ?? null,
  }
}

export async function createField(sequelize: Sequelize, operationId: number, input: FieldCreate): Promise<FieldJson> {
  const { components, ...settings } = input
  const id = await sequelize
    .transaction(async (transaction) => {
      const f = await Field.create({ ...settings, operationId }, { transaction })
      for (const c of components) await FieldComponent.create(componentRow(f.id, c), { transaction })
      return f.id
    })
    .catch(mapUnique)
  return getField(sequelize, operationId, id)
}

export async function updateField(sequelize: Sequelize, operationId: number, fieldId: number, patch: FieldUpdate): Promise<FieldJson> {
  await sequelize
    .transaction(async (transaction) => {
      const f = await findField(operationId, fieldId, transaction)
      const merged = fieldSettingsSchema.safeParse({ ...fieldSettings(f), ...patch })
      if (!merged.success) throw validationError(merged.error, 'request body')
      if (merged.data.legume === 'none' && (f.components ?? []).some((c) => c.kind.startsWith('legume'))) {
        throw fieldError('legume', 'Remove the legume components before setting the field to no legume.')
      }
      await f.update(merged.data, { transaction })
    })
    .catch(mapUnique)
  return getField(sequelize, operationId, fieldId)
}

export async function deleteField(operationId: number, fieldId: number): Promise<void> {
  const f = await findField(operationId, fieldId)
  await f.destroy()
}

function checkComponentFits(field: Field, kind: ComponentKind) {
  if (field.legume === 'none' && kind.startsWith('legume')) throw fieldError('kind', 'A field without a legume has no legume component.')
}

export async function findComponent(operationId: number, fieldId: number, componentId: number, transaction?: Transaction) {
  const field = await findField(operationId, fieldId, transaction)
  const c = (field.components ?? []).find((x) => x.id === componentId)
  if (!c) throw AppError.notFound('Component')
  return { field, component: c }
}

export async function getComponent(sequelize: Sequelize, operationId: number, fieldId: number, componentId: number): Promise<Component> {
  const { component } = await findComponent(operationId, fieldId, componentId)
  const lab = component.labResultId !== null ? await labQualities(sequelize, operationId, [component.labResultId]) : undefined
  return componentJson(component, lab)
}

export async function createComponent(sequelize: Sequelize, operationId: number, fieldId: number, input: ComponentInput): Promise<Component> {
  const field = await findField(operationId, fieldId)
  checkComponentFits(field, input.kind)
  const c = await FieldComponent.create(componentRow(field.id, input)).catch(mapUnique)
  return getComponent(sequelize, operationId, fieldId, c.id)
}

export async function updateComponent(sequelize: Sequelize, operationId: number, fieldId: number, componentId: number, patch: ComponentUpdate): Promise<Component> {
  const { field, component } = await findComponent(operationId, fieldId, componentId)
  const merged = componentInputSchema.safeParse({
    kind: component.kind,
    kgDmPerHa: component.kgDmPerHa,
    basis: component.basis,
    measuredOn: component.measuredOn,
    method: component.method,
    dmPct: component.dmPct,
    labResultId: component.labResultId,
    quality: component.quality,
    ...patch,
  })
  if (!merged.success) throw validationError(merged.error, 'request body')
  checkComponentFits(field, merged.data.kind)
  await component.update(componentRow(field.id, merged.data)).catch(mapUnique)
  return getComponent(sequelize, operationId, fieldId, componentId)
}

export async function deleteComponent(operationId: number, fieldId: number, componentId: number): Promise<void> {
  const { component } = await findComponent(operationId, fieldId, componentId)
  await component.destroy()
}
