// Strip plans (a herd group on a field), the season's settings and the crew's "moved" and "fed" records.
import { DataTypes } from 'sequelize'
import type { MigrationContext } from '../index'

const timestamps = {
  created_at: { type: DataTypes.DATE, allowNull: false, defaultValue: DataTypes.NOW },
  updated_at: { type: DataTypes.DATE, allowNull: false, defaultValue: DataTypes.NOW },
}

export async function up({ queryInterface: q }: MigrationContext) {
  await q.createTable('grazing_plans', {
    id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
    operation_id: { type: DataTypes.INTEGER, allowNull: false, references: { model: 'operations', key: 'id' }, onDelete: 'CASCADE' },
    field_id: { type: DataTypes.INTEGER, allowNull: false, references: { model: 'fields', key: 'id' }, onDelete: 'CASCADE' },
    // Herd groups are the nutrition side's table; the link is kept without a foreign key until a 03xx migration adds it.
    herd_id: { type: DataTypes.INTEGER, allowNull: true },
    group_name: { type: DataTypes.STRING(120), allowNull: false },
    species: { type: DataTypes.STRING(10), allowNull: false },
    head_count: { type: DataTypes.INTEGER, allowNull: false },
    body_weight_kg: { type: DataTypes.DOUBLE, allowNull: false },
    intake_kg_dm_per_head: { type: DataTypes.DOUBLE, allowNull: false },
    pregnant: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false },
    lactating: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false },
    grain_adapted: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false },
    mineral: { type: DataTypes.JSONB, allowNull: true },
    access: { type: DataTypes.STRING(12), allowNull: false, defaultValue: 'strip' },
    days_per_move: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 1 },
    basis: { type: DataTypes.STRING(10), allowNull: false, defaultValue: 'forage' },
    grain_allowance_kg_per_head: { type: DataTypes.DOUBLE, allowNull: true },
    utilization: { type: DataTypes.DOUBLE, allowNull: true },
    start_date: { type: DataTypes.DATEONLY, allowNull: false },
    end_date: { type: DataTypes.DATEONLY, allowNull: true },
    start_offset_m: { type: DataTypes.DOUBLE, allowNull: false, defaultValue: 0 },
    pace_length_m: { type: DataTypes.DOUBLE, allowNull: true },
    supplement: { type: DataTypes.JSONB, allowNull: true },
    notes: { type: DataTypes.TEXT, allowNull: false, defaultValue: '' },
    ...timestamps,
  })
  await q.addIndex('grazing_plans', ['operation_id', 'start_date'])

  await q.createTable('season_settings', {
    id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
    operation_id: { type: DataTypes.INTEGER, allowNull: false, unique: true, references: { model: 'operations', key: 'id' }, onDelete: 'CASCADE' },
    start_date: { type: DataTypes.DATEONLY, allowNull: false },
    end_date: { type: DataTypes.DATEONLY, allowNull: false },
    shortfall_feed: { type: DataTypes.JSONB, allowNull: false },
    harvested_alternative: { type: DataTypes.JSONB, allowNull: true },
    frost_wait_days: { type: DataTypes.INTEGER, allowNull: true },
    ...timestamps,
  })

  await q.createTable('grazing_records', {
    id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
    operation_id: { type: DataTypes.INTEGER, allowNull: false, references: { model: 'operations', key: 'id' }, onDelete: 'CASCADE' },
    plan_id: { type: DataTypes.INTEGER, allowNull: true, references: { model: 'grazing_plans', key: 'id' }, onDelete: 'SET NULL' },
    kind: { type: DataTypes.STRING(10), allowNull: false },
    recorded_at: { type: DataTypes.DATE, allowNull: false },
    recorded_by: { type: DataTypes.INTEGER, allowNull: true, references: { model: 'users', key: 'id' }, onDelete: 'SET NULL' },
    distance_m: { type: DataTypes.DOUBLE, allowNull: true },
    feed_label: { type: DataTypes.STRING(120), allowNull: true },
    amount_kg_as_fed: { type: DataTypes.DOUBLE, allowNull: true },
    note: { type: DataTypes.TEXT, allowNull: false, defaultValue: '' },
    ...timestamps,
  })
  await q.addIndex('grazing_records', ['operation_id', 'recorded_at'])
}

export async function down({ queryInterface: q }: MigrationContext) {
  for (const t of ['grazing_records', 'season_settings', 'grazing_plans']) await q.dropTable(t)
}
