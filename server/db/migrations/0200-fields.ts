// Fields, their components (grain, stover, legume forage and seed) and the yield worksheets that estimated them.
import { DataTypes } from 'sequelize'
import type { MigrationContext } from '../index'

const timestamps = {
  created_at: { type: DataTypes.DATE, allowNull: false, defaultValue: DataTypes.NOW },
  updated_at: { type: DataTypes.DATE, allowNull: false, defaultValue: DataTypes.NOW },
}

export async function up({ queryInterface: q }: MigrationContext) {
  await q.createTable('fields', {
    id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
    operation_id: { type: DataTypes.INTEGER, allowNull: false, references: { model: 'operations', key: 'id' }, onDelete: 'CASCADE' },
    name: { type: DataTypes.STRING(120), allowNull: false },
    area_ha: { type: DataTypes.DOUBLE, allowNull: false },
    fence_length_m: { type: DataTypes.DOUBLE, allowNull: false },
    row_spacing_m: { type: DataTypes.DOUBLE, allowNull: false },
    corridor_width_m: { type: DataTypes.DOUBLE, allowNull: false, defaultValue: 0 },
    legume: { type: DataTypes.STRING(20), allowNull: false },
    legume_share_of_width: { type: DataTypes.DOUBLE, allowNull: false, defaultValue: 0 },
    killing_frost_dates: { type: DataTypes.JSONB, allowNull: false, defaultValue: [] },
    partial_frost_dates: { type: DataTypes.JSONB, allowNull: false, defaultValue: [] },
    nitrate: { type: DataTypes.JSONB, allowNull: true },
    grain_on_ground: { type: DataTypes.JSONB, allowNull: true },
    weathering: { type: DataTypes.JSONB, allowNull: true },
    economics: { type: DataTypes.JSONB, allowNull: true },
    notes: { type: DataTypes.TEXT, allowNull: false, defaultValue: '' },
    ...timestamps,
  })
  await q.addIndex('fields', ['operation_id', 'name'], { unique: true, name: 'fields_operation_name_unique' })

  await q.createTable('field_components', {
    id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
    field_id: { type: DataTypes.INTEGER, allowNull: false, references: { model: 'fields', key: 'id' }, onDelete: 'CASCADE' },
    kind: { type: DataTypes.STRING(20), allowNull: false },
    kg_dm_per_ha: { type: DataTypes.DOUBLE, allowNull: false },
    basis: { type: DataTypes.STRING(10), allowNull: true },
    measured_on: { type: DataTypes.DATEONLY, allowNull: false },
    method: { type: DataTypes.STRING(20), allowNull: false },
    dm_pct: { type: DataTypes.DOUBLE, allowNull: true },
    // Lab results belong to the nutrition side; the foreign key is added by a 03xx migration once that table exists.
    lab_result_id: { type: DataTypes.INTEGER, allowNull: true },
    quality: { type: DataTypes.JSONB, allowNull: true },
    ...timestamps,
  })
  await q.addIndex('field_components', ['field_id', 'kind'], { unique: true, name: 'field_components_field_kind_unique' })

  await q.createTable('field_estimates', {
    id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
    field_id: { type: DataTypes.INTEGER, allowNull: false, references: { model: 'fields', key: 'id' }, onDelete: 'CASCADE' },
    component_id: { type: DataTypes.INTEGER, allowNull: true, references: { model: 'field_components', key: 'id' }, onDelete: 'SET NULL' },
    kind: { type: DataTypes.STRING(20), allowNull: false },
    method: { type: DataTypes.STRING(20), allowNull: false },
    measured_on: { type: DataTypes.DATEONLY, allowNull: false },
    inputs: { type: DataTypes.JSONB, allowNull: false },
    result: { type: DataTypes.JSONB, allowNull: false },
    created_by: { type: DataTypes.INTEGER, allowNull: true, references: { model: 'users', key: 'id' }, onDelete: 'SET NULL' },
    ...timestamps,
  })
  await q.addIndex('field_estimates', ['field_id', 'created_at'])
}

export async function down({ queryInterface: q }: MigrationContext) {
  for (const t of ['field_estimates', 'field_components', 'fields']) await q.dropTable(t)
}
