// Sequelize models: registered once per connection by initModels; tables come from migrations, never from sync().
import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize'
import type { Role } from '../../shared/schemas/roles'
import { initNutritionModels } from './nutrition'
import { initGrazingModels } from './grazing'

export class User extends Model<InferAttributes<User>, InferCreationAttributes<User>> {
  declare id: CreationOptional<number>
  declare name: string
  declare email: string
  declare passwordHash: string
  declare isAdmin: CreationOptional<boolean>
  declare disabled: CreationOptional<boolean>
  declare unitSystem: CreationOptional<'us' | 'metric'>
  declare tokenVersion: CreationOptional<number>
  declare createdAt: CreationOptional<Date>
  declare updatedAt: CreationOptional<Date>
}

export class Operation extends Model<InferAttributes<Operation>, InferCreationAttributes<Operation>> {
  declare id: CreationOptional<number>
  declare name: string
  declare species: CreationOptional<'cattle' | 'sheep' | 'both'>
  declare isDemo: CreationOptional<boolean>
  declare createdAt: CreationOptional<Date>
  declare updatedAt: CreationOptional<Date>
}

export class Membership extends Model<InferAttributes<Membership>, InferCreationAttributes<Membership>> {
  declare id: CreationOptional<number>
  declare userId: number
  declare operationId: number
  declare role: Role
  declare createdAt: CreationOptional<Date>
  declare updatedAt: CreationOptional<Date>
}

export class Invitation extends Model<InferAttributes<Invitation>, InferCreationAttributes<Invitation>> {
  declare id: CreationOptional<number>
  declare operationId: number
  declare email: string
  declare role: Role
  declare tokenHash: string
  declare invitedBy: number | null
  declare expiresAt: Date
  declare acceptedAt: CreationOptional<Date | null>
  declare acceptedBy: CreationOptional<number | null>
  declare revokedAt: CreationOptional<Date | null>
  declare createdAt: CreationOptional<Date>
  declare updatedAt: CreationOptional<Date>
}

export class PasswordReset extends Model<InferAttributes<PasswordReset>, InferCreationAttributes<PasswordReset>> {
  declare id: CreationOptional<number>
  declare userId: number
  declare tokenHash: string
  declare expiresAt: Date
  declare usedAt: CreationOptional<Date | null>
  declare createdAt: CreationOptional<Date>
  declare updatedAt: CreationOptional<Date>
}

const ts = {
  createdAt: { type: DataTypes.DATE },
  updatedAt: { type: DataTypes.DATE },
}

export function initModels(sequelize: Sequelize) {
  User.init(
    {
      id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
      name: { type: DataTypes.STRING(120), allowNull: false },
      email: { type: DataTypes.STRING(254), allowNull: false, unique: true },
      passwordHash: { type: DataTypes.STRING(100), allowNull: false },
      isAdmin: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false },
      disabled: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false },
      unitSystem: { type: DataTypes.STRING(10), allowNull: false, defaultValue: 'us' },
      tokenVersion: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
      ...ts,
    },
    { sequelize, tableName: 'users', underscored: true },
  )
  Operation.init(
    {
      id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
      name: { type: DataTypes.STRING(120), allowNull: false },
      species: { type: DataTypes.STRING(10), allowNull: false, defaultValue: 'cattle' },
      isDemo: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false },
      ...ts,
    },
    { sequelize, tableName: 'operations', underscored: true },
  )
  Membership.init(
    {
      id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
      userId: { type: DataTypes.INTEGER, allowNull: false },
      operationId: { type: DataTypes.INTEGER, allowNull: false },
      role: { type: DataTypes.STRING(20), allowNull: false },
      ...ts,
    },
    { sequelize, tableName: 'memberships', underscored: true },
  )
  Invitation.init(
    {
      id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
      operationId: { type: DataTypes.INTEGER, allowNull: false },
      email: { type: DataTypes.STRING(254), allowNull: false },
      role: { type: DataTypes.STRING(20), allowNull: false },
      tokenHash: { type: DataTypes.STRING(64), allowNull: false },
      invitedBy: { type: DataTypes.INTEGER, allowNull: true },
      expiresAt: { type: DataTypes.DATE, allowNull: false },
      acceptedAt: { type: DataTypes.DATE, allowNull: true },
      acceptedBy: { type: DataTypes.INTEGER, allowNull: true },
      revokedAt: { type: DataTypes.DATE, allowNull: true },
      ...ts,
    },
    { sequelize, tableName: 'invitations', underscored: true },
  )
  PasswordReset.init(
    {
      id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
      userId: { type: DataTypes.INTEGER, allowNull: false },
      tokenHash: { type: DataTypes.STRING(64), allowNull: false },
      expiresAt: { type: DataTypes.DATE, allowNull: false },
      usedAt: { type: DataTypes.DATE, allowNull: true },
      ...ts,
    },
    { sequelize, tableName: 'password_resets', underscored: true },
  )
  Membership.belongsTo(User, { foreignKey: 'userId', as: 'user' })
  Membership.belongsTo(Operation, { foreignKey: 'operationId', as: 'operation' })
  User.hasMany(Membership, { foreignKey: 'userId', as: 'memberships' })
  Operation.hasMany(Membership, { foreignKey: 'operationId', as: 'memberships' })
  Invitation.belongsTo(Operation, { foreignKey: 'operationId', as: 'operation' })
  initNutritionModels(sequelize)
  initGrazingModels(sequelize)
}
