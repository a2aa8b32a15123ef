// Models for fields, their components and worksheets, strip plans, season settings and the crew's records.
import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type NonAttribute, type Sequelize } from 'sequelize'
import type { ComponentKind, ComponentQualityInput, FieldEconomics } from '../../shared/schemas/grazing/fields'
import type { NitrateResult, WeatheringSettings } from '../../shared/engine/grazing/index'

export class Field extends Model<InferAttributes<Field, { omit: 'components' }>, InferCreationAttributes<Field, { omit: 'components' }>> {
  declare id: CreationOptional<number>
  declare operationId: number
  declare name: string
  declare areaHa: number
  declare fenceLengthM: number
  declare rowSpacingM: number
  declare corridorWidthM: number
  declare legume: 'cowpea' | 'forage-soybean' | 'none'
  declare legumeShareOfWidth: number
  declare killingFrostDates: string[]
  declare partialFrostDates: string[]
  declare nitrate: NitrateResult | null
  declare grainOnGround: { kgPerHa: number; observedOn: string } | null
  declare weathering: WeatheringSettings | null
  declare economics: FieldEconomics | null
  declare notes: CreationOptional<string>
  declare createdAt: CreationOptional<Date>
  declare updatedAt: CreationOptional<Date>
  declare components?: NonAttribute<FieldComponent[]>
}

export class FieldComponent extends Model<InferAttributes<FieldComponent>, InferCreationAttributes<FieldComponent>> {
  declare id: CreationOptional<number>
  declare fieldId: number
  declare kind: ComponentKind
  declare kgDmPerHa: number
  declare basis: 'field' | 'band' | null
  declare measuredOn: string
  declare method: string
  declare dmPct: number | null
  declare labResultId: number | null
  declare quality: ComponentQualityInput | null
  declare createdAt: CreationOptional<Date>
  declare updatedAt: CreationOptional<Date>
}

export class FieldEstimate extends Model<InferAttributes<FieldEstimate>, InferCreationAttributes<FieldEstimate>> {
  declare id: CreationOptional<number>
  declare fieldId: number
  declare componentId: number | null
  declare kind: ComponentKind
  declare method: 'head-count' | 'clipped-frame'
  declare measuredOn: string
  declare inputs: unknown
  declare result: unknown
  declare createdBy: number | null
  declare createdAt: CreationOptional<Date>
  declare updatedAt: CreationOptional<Date>
}

export type PlanSupplement = { label: string; kgAsFedPerHeadPerDay: number; dmFraction: number; pricePerKgAsFed: number }
export type PlanMineral = { label?: string; intendedFor: 'cattle' | 'sheep' | 'all-species'; copperPpm?: number }

export class GrazingPlan extends Model<InferAttributes<GrazingPlan, { omit: 'field' }>, InferCreationAttributes<GrazingPlan, { omit: 'field' }>> {
  declare id: CreationOptional<number>
  declare operationId: number
  declare fieldId: number
  declare herdId: number | null
  declare groupName: string
  declare species: 'cattle' | 'sheep'
  declare headCount: number
  declare bodyWeightKg: number
  declare intakeKgDmPerHead: number
  declare pregnant: boolean
  declare lactating: boolean
  declare grainAdapted: boolean
  declare mineral: PlanMineral | null
  declare access: 'strip' | 'whole-field'
  declare daysPerMove: number
  declare basis: 'forage' | 'grain'
  declare grainAllowanceKgPerHead: number | null
  declare utilization: number | null
  declare startDate: string
  declare endDate: string | null
  declare startOffsetM: number
  declare paceLengthM: number | null
  declare supplement: PlanSupplement | null
  declare notes: CreationOptional<string>
  declare createdAt: CreationOptional<Date>
  declare updatedAt: CreationOptional<Date>
  declare field?: NonAttribute<Field>
}

export type FeedPriced = { label: string; dmFraction: number; pricePerKgAsFed: number }

export class SeasonSettings extends Model<InferAttributes<SeasonSettings>, InferCreationAttributes<SeasonSettings>> {
  declare id: CreationOptional<number>
  declare operationId: number
  declare startDate: string
  declare endDate: string
  declare shortfallFeed: FeedPriced
  declare harvestedAlternative: (FeedPriced & { wasteFraction: number }) | null
  declare frostWaitDays: number | null
  declare createdAt: CreationOptional<Date>
  declare updatedAt: CreationOptional<Date>
}

export class GrazingRecord extends Model<InferAttributes<GrazingRecord>, InferCreationAttributes<GrazingRecord>> {
  declare id: CreationOptional<number>
  declare operationId: number
  declare planId: number | null
  declare kind: 'moved' | 'fed'
  declare recordedAt: Date
  declare recordedBy: number | null
  declare distanceM: number | null
  declare feedLabel: string | null
  declare amountKgAsFed: number | null
  declare note: CreationOptional<string>
  declare createdAt: CreationOptional<Date>
  declare updatedAt: CreationOptional<Date>
}

const ts = { createdAt: { type: DataTypes.DATE }, updatedAt: { type: DataTypes.DATE } }
// DOUBLE PRECISION comes back from pg as a number; DATEONLY as 'YYYY-MM-DD'.
const dbl = (allowNull = false) => ({ type: DataTypes.DOUBLE, allowNull })

export function initGrazingModels(sequelize: Sequelize) {
  Field.init(
    {
      id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
      operationId: { type: DataTypes.INTEGER, allowNull: false },
      name: { type: DataTypes.STRING(120), allowNull: false },
      areaHa: dbl(),
      fenceLengthM: dbl(),
      rowSpacingM: dbl(),
      corridorWidthM: dbl(),
      legume: { type: DataTypes.STRING(20), allowNull: false },
      legumeShareOfWidth: dbl(),
      killingFrostDates: { type: DataTypes.JSONB, allowNull: false, defaultValue: [] },
      partialFrostDates: { type: DataTypes.JSONB, allowNull: false, defaultValue: [] },
      nitrate: { type: DataTypes.JSONB, allowNull: true },
      grainOnGround: { type: DataTypes.JSONB, allowNull: true },
      weathering: { type: DataTypes.JSONB, allowNull: true },
      economics: { type: DataTypes.JSONB, allowNull: true },
      notes: { type: DataTypes.TEXT, allowNull: false, defaultValue: '' },
      ...ts,
    },
    { sequelize, tableName: 'fields', underscored: true },
  )
  FieldComponent.init(
    {
      id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
      fieldId: { type: DataTypes.INTEGER, allowNull: false },
      kind: { type: DataTypes.STRING(20), allowNull: false },
      kgDmPerHa: dbl(),
      basis: { type: DataTypes.STRING(10), allowNull: true },
      measuredOn: { type: DataTypes.DATEONLY, allowNull: false },
      method: { type: DataTypes.STRING(20), allowNull: false },
      dmPct: dbl(true),
      labResultId: { type: DataTypes.INTEGER, allowNull: true },
      quality: { type: DataTypes.JSONB, allowNull: true },
      ...ts,
    },
    { sequelize, tableName: 'field_components', underscored: true },
  )
  FieldEstimate.init(
    {
      id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
      fieldId: { type: DataTypes.INTEGER, allowNull: false },
      componentId: { type: DataTypes.INTEGER, allowNull: true },
      kind: { type: DataTypes.STRING(20), allowNull: false },
      method: { type: DataTypes.STRING(20), allowNull: false },
      measuredOn: { type: DataTypes.DATEONLY, allowNull: false },
      inputs: { type: DataTypes.JSONB, allowNull: false },
      result: { type: DataTypes.JSONB, allowNull: false },
      createdBy: { type: DataTypes.INTEGER, allowNull: true },
      ...ts,
    },
    { sequelize, tableName: 'field_estimates', underscored: true },
  )
  GrazingPlan.init(
    {
      id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
      operationId: { type: DataTypes.INTEGER, allowNull: false },
      fieldId: { type: DataTypes.INTEGER, allowNull: false },
      herdId: { type: DataTypes.INTEGER, allowNull: true },
      groupName: { type: DataTypes.STRING(120), allowNull: false },
      species: { type: DataTypes.STRING(10), allowNull: false },
      headCount: { type: DataTypes.INTEGER, allowNull: false },
      bodyWeightKg: dbl(),
      intakeKgDmPerHead: dbl(),
      pregnant: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false },
      lactating: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false },
      grainAdapted: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false },
      mineral: { type: DataTypes.JSONB, allowNull: true },
      access: { type: DataTypes.STRING(12), allowNull: false },
      daysPerMove: { type: DataTypes.INTEGER, allowNull: false },
      basis: { type: DataTypes.STRING(10), allowNull: false },
      grainAllowanceKgPerHead: dbl(true),
      utilization: dbl(true),
      startDate: { type: DataTypes.DATEONLY, allowNull: false },
      endDate: { type: DataTypes.DATEONLY, allowNull: true },
      startOffsetM: dbl(),
      paceLengthM: dbl(true),
      supplement: { type: DataTypes.JSONB, allowNull: true },
      notes: { type: DataTypes.TEXT, allowNull: false, defaultValue: '' },
      ...ts,
    },
    { sequelize, tableName: 'grazing_plans', underscored: true },
  )
  SeasonSettings.init(
    {
      id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
      operationId: { type: DataTypes.INTEGER, allowNull: false, unique: true },
      startDate: { type: DataTypes.DATEONLY, allowNull: false },
      endDate: { type: DataTypes.DATEONLY, allowNull: false },
      shortfallFeed: { type: DataTypes.JSONB, allowNull: false },
      harvestedAlternative: { type: DataTypes.JSONB, allowNull: true },
      frostWaitDays: { type: DataTypes.INTEGER, allowNull: true },
      ...ts,
    },
    { sequelize, tableName: 'season_settings', underscored: true },
  )
  GrazingRecord.init(
    {
      id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
      operationId: { type: DataTypes.INTEGER, allowNull: false },
      planId: { type: DataTypes.INTEGER, allowNull: true },
      kind: { type: DataTypes.STRING(10), allowNull: false },
      recordedAt: { type: DataTypes.DATE, allowNull: false },
      recordedBy: { type: DataTypes.INTEGER, allowNull: true },
      distanceM: dbl(true),
      feedLabel: { type: DataTypes.STRING(120), allowNull: true },
      amountKgAsFed: dbl(true),
      note: { type: DataTypes.TEXT, allowNull: false, defaultValue: '' },
      ...ts,
    },
    { sequelize, tableName: 'grazing_records', underscored: true },
  )
  Field.hasMany(FieldComponent, { foreignKey: 'fieldId', as: 'components' })
  FieldComponent.belongsTo(Field, { foreignKey: 'fieldId', as: 'field' })
  GrazingPlan.belongsTo(Field, { foreignKey: 'fieldId', as: 'field' })
}
