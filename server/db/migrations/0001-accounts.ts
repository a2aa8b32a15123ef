// Accounts and operations: users, operations, memberships with roles, invitations, password resets.
import { DataTypes } from 'sequelize'
import type { MigrationContext } from '../index'

const timestamps = {
  created_at: { type: DataTypes.DATE, allowNull: false, defaultValue: DataTypes.NOW },
  updated_at: { type: DataTypes.DATE, allowNull: false, defaultValue: DataTypes.NOW },
}

export async function up({ queryInterface: q }: MigrationContext) {
  await q.createTable('users', {
    id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
    name: { type: DataTypes.STRING(120), allowNull: false },
    email: { type: DataTypes.STRING(254), allowNull: false, unique: true },
    password_hash: { type: DataTypes.STRING(100), allowNull: false },
    is_admin: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false },
    disabled: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false },
    unit_system: { type: DataTypes.STRING(10), allowNull: false, defaultValue: 'us' },
    token_version: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
    ...timestamps,
  })
  await q.createTable('operations', {
    id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
    name: { type: DataTypes.STRING(120), allowNull: false },
    species: { type: DataTypes.STRING(10), allowNull: false, defaultValue: 'cattle' },
    is_demo: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false },
    ...timestamps,
  })
  await q.createTable('memberships', {
    id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
    user_id: { type: DataTypes.INTEGER, allowNull: false, references: { model: 'users', key: 'id' }, onDelete: 'CASCADE' },
    operation_id: { type: DataTypes.INTEGER, allowNull: false, references: { model: 'operations', key: 'id' }, onDelete: 'CASCADE' },
    role: { type: DataTypes.STRING(20), allowNull: false },
    ...timestamps,
  })
  await q.addIndex('memberships', ['user_id', 'operation_id'], { unique: true })
  await q.createTable('invitations', {
    id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
    operation_id: { type: DataTypes.INTEGER, allowNull: false, references: { model: 'operations', key: 'id' }, onDelete: 'CASCADE' },
    email: { type: DataTypes.STRING(254), allowNull: false },
    role: { type: DataTypes.STRING(20), allowNull: false },
    token_hash: { type: DataTypes.STRING(64), allowNull: false, unique: true },
    invited_by: { type: DataTypes.INTEGER, allowNull: true, references: { model: 'users', key: 'id' }, onDelete: 'SET NULL' },
    expires_at: { type: DataTypes.DATE, allowNull: false },
    accepted_at: { type: DataTypes.DATE, allowNull: true },
    accepted_by: { type: DataTypes.INTEGER, allowNull: true, references: { model: 'users', key: 'id' }, onDelete: 'SET NULL' },
    revoked_at: { type: DataTypes.DATE, allowNull: true },
    ...timestamps,
  })
  await q.createTable('password_resets', {
    id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
    user_id: { type: DataTypes.INTEGER, allowNull: false, references: { model: 'users', key: 'id' }, onDelete: 'CASCADE' },
    token_hash: { type: DataTypes.STRING(64), allowNull: false, unique: true },
    expires_at: { type: DataTypes.DATE, allowNull: false },
    used_at: { type: DataTypes.DATE, allowNull: true },
    ...timestamps,
  })
}

export async function down({ queryInterface: q }: MigrationContext) {
  for (const t of ['password_resets', 'invitations', 'memberships', 'operations', 'users']) await q.dropTable(t)
}
