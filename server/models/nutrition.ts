// Models for herds, feeds, lab results (with history and uploads), balances with their stored runs, and report e-mails.
import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize'
import type { Provenance } from '../../shared/schemas/nutrition/feeds'

export class Herd extends Model<InferAttributes<Herd>, InferCreationAttributes<Herd>> {
  declare id: CreationOptional<number>
  declare operationId: number
  declare name: string
  declare species: 'cattle' | 'sheep'
  declare class: string
  declare headCount: number
  declare bodyWeightKg: number
  declare matureWeightKg: number | null
  declare bcs: number
  declare breed: string | null
  declare expectedBirthDate: string | null
  declare lastBirthDate: string | null
  declare restStage: string | null
  declare litterSize: number | null
  declare peakMilkKg: number | null
  declare calfBirthWeightKg: number | null
  declare targetGainKg: number | null
  declare grazing: boolean
  declare environment: { tempC: number; windKph?: number | null; coat: string; mud?: string | null } | null
  declare notes: string | null
  declare version: CreationOptional<number>
  declare createdBy: number | null
  declare updatedBy: number | null
  declare createdAt: CreationOptional<Date>
  declare updatedAt: CreationOptional<Date>
}

export class Feed extends Model<InferAttributes<Feed>, InferCreationAttributes<Feed>> {
  declare id: CreationOptional<number>
  declare operationId: number | null
  declare referenceKey: string | null
  declare referenceFeedId: number | null
  declare name: string
  declare kind: 'forage' | 'grain' | 'supplement' | 'mineral'
  declare dmPct: number
  declare cpPctDm: number
  declare tdnPctDm: number
  declare ndfPctDm: number | null
  declare adfPctDm: number | null
  declare caPctDm: number | null
  declare pPctDm: number | null
  declare cuMgPerKgDm: number | null
  declare nitrateNPpmDm: number | null
  declare isGrain: boolean
  declare isUrea: boolean
  declare isLegume: boolean
  declare cattleOnly: boolean
  declare priceAmount: number | null
  declare priceUnit: 'ton' | 'tonne' | 'bag' | null
  declare bagWeightKg: number | null
  declare available: boolean
  declare maxKgAsFedPerHeadDay: number | null
  declare sourceTitle: string | null
  declare sourceDetail: string | null
  declare provenance: Provenance | null
  declare notes: string | null
  declare version: CreationOptional<number>
  declare createdBy: number | null
  declare updatedBy: number | null
  declare createdAt: CreationOptional<Date>
  declare updatedAt: CreationOptional<Date>
}

export class LabResult extends Model<InferAttributes<LabResult>, InferCreationAttributes<LabResult>> {
  declare id: CreationOptional<number>
  declare operationId: number
  declare feedId: number | null
  declare fieldId: number | null
  declare component: string | null
  declare sampleDate: string
  declare labName: string
  declare sampleRef: string | null
  declare enteredBasis: 'dm' | 'as-fed'
  declare nitrateForm: 'NO3' | 'NO3-N' | null
  declare dmPct: number
  declare cpPctDm: number
  declare tdnPctDm: number
  declare tdnEstimated: boolean
  declare adfPctDm: number | null
  declare ndfPctDm: number | null
  declare caPctDm: number | null
  declare pPctDm: number | null
  declare nitrateNPpmDm: number | null
  declare cuMgPerKgDm: number | null
  declare notes: string | null
  declare version: CreationOptional<number>
  declare uploadId: number | null
  declare createdBy: number | null
  declare updatedBy: number | null
  declare createdAt: CreationOptional<Date>
  declare updatedAt: CreationOptional<Date>
}

export type LabChange = { field: string; from: unknown; to: unknown }

export class LabResultHistory extends Model<InferAttributes<LabResultHistory>, InferCreationAttributes<LabResultHistory>> {
  declare id: CreationOptional<number>
  declare labResultId: number
  declare version: number
  declare userId: number | null
  declare userName: string
  declare changes: LabChange[]
  declare createdAt: CreationOptional<Date>
}

export type StoredUploadRow = { line: number; status: 'accepted' | 'refused'; reasons: { field: string; message: string }[]; target: string | null; values: Record<string, unknown> | null }

export class LabUpload extends Model<InferAttributes<LabUpload>, InferCreationAttributes<LabUpload>> {
  declare id: CreationOptional<number>
  declare operationId: number
  declare userId: number | null
  declare filename: string
  declare status: 'parsing' | 'ready' | 'failed' | 'confirmed'
  declare processed: CreationOptional<number>
  declare total: CreationOptional<number>
  declare accepted: CreationOptional<number>
  declare refused: CreationOptional<number>
  declare error: string | null
  declare rows: StoredUploadRow[] | null
  declare createdIds: number[] | null
  declare createdAt: CreationOptional<Date>
  declare updatedAt: CreationOptional<Date>
}

export class Balance extends Model<InferAttributes<Balance>, InferCreationAttributes<Balance>> {
  declare id: CreationOptional<number>
  declare operationId: number
  declare herdId: number
  declare name: string | null
  declare version: CreationOptional<number>
  declare date: string
  declare status: string
  declare costPerHeadDay: number
  declare feedIds: number[]
  declare labResultIds: number[]
  declare fieldId: number | null
  declare outOfDate: CreationOptional<boolean>
  declare outOfDateReason: string | null
  declare createdBy: number | null
  declare updatedBy: number | null
  declare createdAt: CreationOptional<Date>
  declare updatedAt: CreationOptional<Date>
}

export class BalanceVersion extends Model<InferAttributes<BalanceVersion>, InferCreationAttributes<BalanceVersion>> {
  declare id: CreationOptional<number>
  declare balanceId: number
  declare version: number
  declare selection: Record<string, unknown>
  declare inputs: Record<string, unknown>
  declare result: Record<string, unknown>
  declare labResultIds: number[]
  declare createdBy: number | null
  declare createdByName: string
  declare createdAt: CreationOptional<Date>
}

export class ReportSend extends Model<InferAttributes<ReportSend>, InferCreationAttributes<ReportSend>> {
  declare id: CreationOptional<number>
  declare operationId: number
  declare balanceId: number | null
  declare balanceVersion: number | null
  declare recipients: string[]
  declare sentBy: number | null
  declare sentByName: string
  declare createdAt: CreationOptional<Date>
}

const ts = () => ({ createdAt: { type: DataTypes.DATE }, updatedAt: { type: DataTypes.DATE } })
const dbl = (allowNull = true) => ({ type: DataTypes.DOUBLE, allowNull })
const int = (allowNull = true) => ({ type: DataTypes.INTEGER, allowNull })
const str = (n: number, allowNull = true) => ({ type: DataTypes.STRING(n), allowNull })
// Factories, not shared objects: Sequelize writes the column name into each attribute definition it is given.
const bool = () => ({ type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false })
const pk = () => ({ type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true })
const version = () => ({ type: DataTypes.INTEGER, allowNull: false, defaultValue: 1 })

export function initNutritionModels(sequelize: Sequelize) {
  Herd.init(
    {
      id: pk(),
      operationId: int(false),
      name: str(80, false),
      species: str(10, false),
      class: str(20, false),
      headCount: int(false),
      bodyWeightKg: dbl(false),
      matureWeightKg: dbl(),
      bcs: dbl(false),
      breed: str(20),
      expectedBirthDate: { type: DataTypes.DATEONLY, allowNull: true },
      lastBirthDate: { type: DataTypes.DATEONLY, allowNull: true },
      restStage: str(20),
      litterSize: int(),
      peakMilkKg: dbl(),
      calfBirthWeightKg: dbl(),
      targetGainKg: dbl(),
      grazing: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: true },
      environment: { type: DataTypes.JSONB, allowNull: true },
      notes: { type: DataTypes.TEXT, allowNull: true },
      version: version(),
      createdBy: int(),
      updatedBy: int(),
      ...ts(),
    },
    { sequelize, tableName: 'herds', underscored: true },
  )
  Feed.init(
    {
      id: pk(),
      operationId: int(),
      referenceKey: str(60),
      referenceFeedId: int(),
      name: str(120, false),
      kind: str(20, false),
      dmPct: dbl(false),
      cpPctDm: dbl(false),
      tdnPctDm: dbl(false),
      ndfPctDm: dbl(),
      adfPctDm: dbl(),
      caPctDm: dbl(),
      pPctDm: dbl(),
      cuMgPerKgDm: dbl(),
      nitrateNPpmDm: { type: DataTypes.DOUBLE, allowNull: true, field: 'nitrate_n_ppm_dm' },
      isGrain: bool(),
      isUrea: bool(),
      isLegume: bool(),
      cattleOnly: bool(),
      priceAmount: dbl(),
      priceUnit: str(10),
      bagWeightKg: dbl(),
      available: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: true },
      maxKgAsFedPerHeadDay: dbl(),
      sourceTitle: str(300),
      sourceDetail: str(300),
      provenance: { type: DataTypes.JSONB, allowNull: true },
      notes: { type: DataTypes.TEXT, allowNull: true },
      version: version(),
      createdBy: int(),
      updatedBy: int(),
      ...ts(),
    },
    { sequelize, tableName: 'feeds', underscored: true },
  )
  LabResult.init(
    {
      id: pk(),
      operationId: int(false),
      feedId: int(),
      fieldId: int(),
      component: str(20),
      sampleDate: { type: DataTypes.DATEONLY, allowNull: false },
      labName: str(120, false),
      sampleRef: str(60),
      enteredBasis: str(10, false),
      nitrateForm: str(10),
      dmPct: dbl(false),
      cpPctDm: dbl(false),
      tdnPctDm: dbl(false),
      tdnEstimated: bool(),
      adfPctDm: dbl(),
      ndfPctDm: dbl(),
      caPctDm: dbl(),
      pPctDm: dbl(),
      nitrateNPpmDm: { type: DataTypes.DOUBLE, allowNull: true, field: 'nitrate_n_ppm_dm' },
      cuMgPerKgDm: dbl(),
      notes: { type: DataTypes.TEXT, allowNull: true },
      version: version(),
      uploadId: int(),
      createdBy: int(),
      updatedBy: int(),
      ...ts(),
    },
    { sequelize, tableName: 'lab_results', underscored: true },
  )
  LabResultHistory.init(
    {
      id: pk(),
      labResultId: int(false),
      version: int(false),
      userId: int(),
      userName: str(120, false),
      changes: { type: DataTypes.JSONB, allowNull: false },
      createdAt: { type: DataTypes.DATE },
    },
    { sequelize, tableName: 'lab_result_history', underscored: true, updatedAt: false },
  )
  LabUpload.init(
    {
      id: pk(),
      operationId: int(false),
      userId: int(),
      filename: str(200, false),
      status: str(12, false),
      processed: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
      total: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
      accepted: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
      refused: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
      error: { type: DataTypes.TEXT, allowNull: true },
      rows: { type: DataTypes.JSONB, allowNull: true },
      createdIds: { type: DataTypes.JSONB, allowNull: true },
      ...ts(),
    },
    { sequelize, tableName: 'lab_uploads', underscored: true },
  )
  Balance.init(
    {
      id: pk(),
      operationId: int(false),
      herdId: int(false),
      name: str(120),
      version: version(),
      date: { type: DataTypes.DATEONLY, allowNull: false },
      status: str(30, false),
      costPerHeadDay: dbl(false),
      feedIds: { type: DataTypes.ARRAY(DataTypes.INTEGER), allowNull: false, defaultValue: [] },
      labResultIds: { type: DataTypes.ARRAY(DataTypes.INTEGER), allowNull: false, defaultValue: [] },
      fieldId: int(),
      outOfDate: bool(),
      outOfDateReason: { type: DataTypes.TEXT, allowNull: true },
      createdBy: int(),
      updatedBy: int(),
      ...ts(),
    },
    { sequelize, tableName: 'balances', underscored: true },
  )
  BalanceVersion.init(
    {
      id: pk(),
      balanceId: int(false),
      version: int(false),
      selection: { type: DataTypes.JSONB, allowNull: false },
      inputs: { type: DataTypes.JSONB, allowNull: false },
      result: { type: DataTypes.JSONB, allowNull: false },
      labResultIds: { type: DataTypes.ARRAY(DataTypes.INTEGER), allowNull: false, defaultValue: [] },
      createdBy: int(),
      createdByName: str(120, false),
      createdAt: { type: DataTypes.DATE },
    },
    { sequelize, tableName: 'balance_versions', underscored: true, updatedAt: false },
  )
  ReportSend.init(
    {
      id: pk(),
      operationId: int(false),
      balanceId: int(),
      balanceVersion: int(),
      recipients: { type: DataTypes.JSONB, allowNull: false },
      sentBy: int(),
      sentByName: str(120, false),
      createdAt: { type: DataTypes.DATE },
    },
    { sequelize, tableName: 'report_sends', underscored: true, updatedAt: false },
  )
  LabResult.belongsTo(Feed, { foreignKey: 'feedId', as: 'feed' })
  Balance.belongsTo(Herd, { foreignKey: 'herdId', as: 'herd' })
  Balance.hasMany(BalanceVersion, { foreignKey: 'balanceId', as: 'versions' })
}
