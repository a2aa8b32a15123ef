// Command line for the database: `migrate` applies pending migrations, `seed` loads reference data and the demo.
import { loadConfig } from '../config'
import { createSequelize, migrate } from './index'
import { seedDemo } from '../seed/demo'
import { seedReference } from '../seed/reference'

const cmd = process.argv[2]
const config = loadConfig()
const sequelize = createSequelize(config.databaseUrl)
try {
  if (cmd === 'migrate') {
    const applied = await migrate(sequelize)
    process.stdout.write(applied.length ? `applied: ${applied.join(', ')}\n` : 'no pending migrations\n')
  } else if (cmd === 'seed') {
    await migrate(sequelize)
    await seedReference(sequelize)
    await seedDemo(sequelize, config)
    process.stdout.write('reference data and demo seeded\n')
  } else {
    process.stderr.write('usage: tsx server/db/cli.ts migrate|seed\n')
    process.exitCode = 2
  }
} finally {
  await sequelize.close()
}
