// Database connection, migrations (umzug, never sequelize.sync) and model registration.
import { Sequelize } from 'sequelize'
import { Umzug, SequelizeStorage } from 'umzug'
import { readdirSync } from 'node:fs'
import { join, dirname } from 'node:path'
import { fileURLToPath, pathToFileURL } from 'node:url'
import { initModels } from '../models/index'

const migrationsDir = join(dirname(fileURLToPath(import.meta.url)), 'migrations')

export function createSequelize(url: string) {
  const sequelize = new Sequelize(url, {
    logging: false,
    pool: { max: 10, min: 0, idle: 10_000 },
    define: { underscored: true },
  })
  initModels(sequelize)
  return sequelize
}

export type MigrationContext = { queryInterface: ReturnType<Sequelize['getQueryInterface']>; sequelize: Sequelize }
export type Migration = {
  up: (ctx: MigrationContext) => Promise<void>
  down: (ctx: MigrationContext) => Promise<void>
}

export function createMigrator(sequelize: Sequelize) {
  const files = readdirSync(migrationsDir)
    .filter((f) => /^\d{4}-.*\.ts$/.test(f))
    .sort()
  return new Umzug<MigrationContext>({
    migrations: files.map((f) => ({
      name: f.replace(/\.ts$/, ''),
      up: async ({ context }) => ((await import(pathToFileURL(join(migrationsDir, f)).href)) as Migration).up(context),
      down: async ({ context }) => ((await import(pathToFileURL(join(migrationsDir, f)).href)) as Migration).down(context),
    })),
    context: { queryInterface: sequelize.getQueryInterface(), sequelize },
    storage: new SequelizeStorage({ sequelize, tableName: 'schema_migrations' }),
    logger: undefined,
  })
}

export async function migrate(sequelize: Sequelize) {
  const applied = await createMigrator(sequelize).up()
  return applied.map((m) => m.name)
}
