// Herd groups, feeds (reference and own), lab results with their edit history and CSV uploads, balances with stored runs, report e-mails.
import { DataTypes } from 'sequelize'
import type { MigrationContext } from '../index'

const timestamps = {
  created_at: { type: DataTypes.DATE, allowNull: false, defaultValue: DataTypes.NOW },
  updated_at: { type: DataTypes.DATE, allowNull: false, defaultValue: DataTypes.NOW },
}
const operation = { type: DataTypes.INTEGER, allowNull: false, references: { model: 'operations', key: 'id' }, onDelete: 'CASCADE' }
const userRef = { type: DataTypes.INTEGER, allowNull: true, references: { model: 'users', key: 'id' }, onDelete: 'SET NULL' }
const dbl = (allowNull = true) => ({ type: DataTypes.DOUBLE, allowNull })

export async function up({ queryInterface: q }: MigrationContext) {
  await q.createTable('herds', {
    id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
    operation_id: operation,
    name: { type: DataTypes.STRING(80), allowNull: false },
    species: { type: DataTypes.STRING(10), allowNull: false },
    class: { type: DataTypes.STRING(20), allowNull: false },
    head_count: { type: DataTypes.INTEGER, allowNull: false },
    body_weight_kg: dbl(false),
    mature_weight_kg: dbl(),
    bcs: dbl(false),
    breed: { type: DataTypes.STRING(20), allowNull: true },
    expected_birth_date: { type: DataTypes.DATEONLY, allowNull: true },
    last_birth_date: { type: DataTypes.DATEONLY, allowNull: true },
    rest_stage: { type: DataTypes.STRING(20), allowNull: true },
    litter_size: { type: DataTypes.INTEGER, allowNull: true },
    peak_milk_kg: dbl(),
    calf_birth_weight_kg: dbl(),
    target_gain_kg: dbl(),
    grazing: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: true },
    environment: { type: DataTypes.JSONB, allowNull: true },
    notes: { type: DataTypes.TEXT, allowNull: true },
    version: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 1 },
    created_by: userRef,
    updated_by: userRef,
    ...timestamps,
  })
  await q.addIndex('herds', ['operation_id', 'name'], { name: 'herds_operation_name' })

  await q.createTable('feeds', {
    id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
    // Null for the shipped reference feeds, which every operation reads and none edits.
    operation_id: { ...operation, allowNull: true },
    reference_key: { type: DataTypes.STRING(60), allowNull: true, unique: true },
    reference_feed_id: { type: DataTypes.INTEGER, allowNull: true, references: { model: 'feeds', key: 'id' }, onDelete: 'SET NULL' },
    name: { type: DataTypes.STRING(120), allowNull: false },
    kind: { type: DataTypes.STRING(20), allowNull: false },
    dm_pct: dbl(false),
    cp_pct_dm: dbl(false),
    tdn_pct_dm: dbl(false),
    ndf_pct_dm: dbl(),
    adf_pct_dm: dbl(),
    ca_pct_dm: dbl(),
    p_pct_dm: dbl(),
    cu_mg_per_kg_dm: dbl(),
    nitrate_n_ppm_dm: dbl(),
    is_grain: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false },
    is_urea: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false },
    is_legume: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false },
    cattle_only: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false },
    price_amount: dbl(),
    price_unit: { type: DataTypes.STRING(10), allowNull: true },
    bag_weight_kg: dbl(),
    available: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: true },
    max_kg_as_fed_per_head_day: dbl(),
    source_title: { type: DataTypes.STRING(300), allowNull: true },
    source_detail: { type: DataTypes.STRING(300), allowNull: true },
    provenance: { type: DataTypes.JSONB, allowNull: true },
    notes: { type: DataTypes.TEXT, allowNull: true },
    version: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 1 },
    created_by: userRef,
    updated_by: userRef,
    ...timestamps,
  })
  await q.addIndex('feeds', ['operation_id', 'name'], { name: 'feeds_operation_name' })

  await q.createTable('lab_results', {
    id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
    operation_id: operation,
    feed_id: { type: DataTypes.INTEGER, allowNull: true, references: { model: 'feeds', key: 'id' }, onDelete: 'CASCADE' },
    // The fields table comes from a later migration; its foreign key is added in 0300.
    field_id: { type: DataTypes.INTEGER, allowNull: true },
    component: { type: DataTypes.STRING(20), allowNull: true },
    sample_date: { type: DataTypes.DATEONLY, allowNull: false },
    lab_name: { type: DataTypes.STRING(120), allowNull: false },
    sample_ref: { type: DataTypes.STRING(60), allowNull: true },
    entered_basis: { type: DataTypes.STRING(10), allowNull: false },
    nitrate_form: { type: DataTypes.STRING(10), allowNull: true },
    dm_pct: dbl(false),
    cp_pct_dm: dbl(false),
    tdn_pct_dm: dbl(false),
    tdn_estimated: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false },
    adf_pct_dm: dbl(),
    ndf_pct_dm: dbl(),
    ca_pct_dm: dbl(),
    p_pct_dm: dbl(),
    nitrate_n_ppm_dm: dbl(),
    cu_mg_per_kg_dm: dbl(),
    notes: { type: DataTypes.TEXT, allowNull: true },
    version: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 1 },
    upload_id: { type: DataTypes.INTEGER, allowNull: true },
    created_by: userRef,
    updated_by: userRef,
    ...timestamps,
  })
  await q.addIndex('lab_results', ['operation_id', 'feed_id', 'sample_date'], { name: 'lab_results_feed_date' })
  await q.addIndex('lab_results', ['operation_id', 'field_id', 'component'], { name: 'lab_results_field_component' })

  await q.createTable('lab_result_history', {
    id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
    lab_result_id: { type: DataTypes.INTEGER, allowNull: false, references: { model: 'lab_results', key: 'id' }, onDelete: 'CASCADE' },
    version: { type: DataTypes.INTEGER, allowNull: false },
    user_id: userRef,
    user_name: { type: DataTypes.STRING(120), allowNull: false },
    changes: { type: DataTypes.JSONB, allowNull: false },
    created_at: timestamps.created_at,
  })
  await q.addIndex('lab_result_history', ['lab_result_id', 'version'], { unique: true, name: 'lab_result_history_version' })

  await q.createTable('lab_uploads', {
    id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
    operation_id: operation,
    user_id: userRef,
    filename: { type: DataTypes.STRING(200), allowNull: false },
    status: { type: DataTypes.STRING(12), allowNull: false },
    processed: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
    total: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
    accepted: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
    refused: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
    error: { type: DataTypes.TEXT, allowNull: true },
    rows: { type: DataTypes.JSONB, allowNull: true },
    created_ids: { type: DataTypes.JSONB, allowNull: true },
    ...timestamps,
  })

  await q.createTable('balances', {
    id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
    operation_id: operation,
    herd_id: { type: DataTypes.INTEGER, allowNull: false, references: { model: 'herds', key: 'id' }, onDelete: 'CASCADE' },
    name: { type: DataTypes.STRING(120), allowNull: true },
    version: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 1 },
    date: { type: DataTypes.DATEONLY, allowNull: false },
    status: { type: DataTypes.STRING(30), allowNull: false },
    cost_per_head_day: dbl(false),
    // What the current run read, so a change to any of them marks it out of date.
    feed_ids: { type: DataTypes.ARRAY(DataTypes.INTEGER), allowNull: false, defaultValue: [] },
    lab_result_ids: { type: DataTypes.ARRAY(DataTypes.INTEGER), allowNull: false, defaultValue: [] },
    field_id: { type: DataTypes.INTEGER, allowNull: true },
    out_of_date: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false },
    out_of_date_reason: { type: DataTypes.TEXT, allowNull: true },
    created_by: userRef,
    updated_by: userRef,
    ...timestamps,
  })
  await q.addIndex('balances', ['operation_id', 'herd_id'], { name: 'balances_operation_herd' })
  await q.sequelize.query('CREATE INDEX balances_lab_result_ids ON balances USING GIN (lab_result_ids)')
  await q.sequelize.query('CREATE INDEX balances_feed_ids ON balances USING GIN (feed_ids)')

  await q.createTable('balance_versions', {
    id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
    balance_id: { type: DataTypes.INTEGER, allowNull: false, references: { model: 'balances', key: 'id' }, onDelete: 'CASCADE' },
    version: { type: DataTypes.INTEGER, allowNull: false },
    selection: { type: DataTypes.JSONB, allowNull: false },
    inputs: { type: DataTypes.JSONB, allowNull: false },
    result: { type: DataTypes.JSONB, allowNull: false },
    lab_result_ids: { type: DataTypes.ARRAY(DataTypes.INTEGER), allowNull: false, defaultValue: [] },
    created_by: userRef,
    created_by_name: { type: DataTypes.STRING(120), allowNull: false },
    created_at: timestamps.created_at,
  })
  await q.addIndex('balance_versions', ['balance_id', 'version'], { unique: true, name: 'balance_versions_version' })

  await q.createTable('report_sends', {
    id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
    operation_id: operation,
    balance_id: { type: DataTypes.INTEGER, allowNull: true, references: { model: 'balances', key: 'id' }, onDelete: 'SET NULL' },
    balance_version: { type: DataTypes.INTEGER, allowNull: true },
    recipients: { type: DataTypes.JSONB, allowNull: false },
    sent_by: userRef,
    sent_by_name: { type: DataTypes.STRING(120), allowNull: false },
    created_at: timestamps.created_at,
  })
}

export async function down({ queryInterface: q }: MigrationContext) {
  for (const t of ['report_sends', 'balance_versions', 'balances', 'lab_uploads', 'lab_result_history', 'lab_results', 'feeds', 'herds']) await q.dropTable(t)
}
