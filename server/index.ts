// Server entry: connect and migrate the database, seed the demo when asked, start the mail sink, listen on loopback.
import { loadConfig } from './config'
import { createLogger } from './logger'
import { createSequelize, migrate } from './db/index'
import { startMail } from './mail/index'
import { createApp } from './app'
import { seedDemo, DEMO_PASSWORD, demoSignIns } from './seed/demo'
import { seedReference } from './seed/reference'

async function main() {
  const config = loadConfig()
  const logger = createLogger(config.logLevel)
  const sequelize = createSequelize(config.databaseUrl)
  await sequelize.authenticate()
  const applied = await migrate(sequelize)
  if (applied.length) logger.info({ applied }, 'migrations applied')
  await seedReference(sequelize)
  if (process.env.SEED_DEMO !== '0') await seedDemo(sequelize, config)

  const { mailer, sink } = await startMail(config, Number(process.env.SMTP_SINK_PORT ?? 0))
  const app = createApp({ sequelize, config, mailer, sink, logger })
  const server = app.listen(config.port, config.host, () => {
    const url = `http://${config.host}:${config.port}`
    process.stdout.write(
      `\nStandGraze is running at ${url}\n` +
        (process.env.SEED_DEMO !== '0'
          ? `\nDemo sign-ins (invented demo data), password "${DEMO_PASSWORD}":\n${demoSignIns.map((d) => `  ${d.email.padEnd(40)} ${d.label}`).join('\n')}\n`
          : '') +
        (sink ? `\nOutgoing mail goes to a local sink; signed-in admins read it at ${url}/admin/mail\n` : '') +
        `\nPress Ctrl-C to stop.\n`,
    )
  })

  let stopping = false
  const stop = async (signal: string) => {
    if (stopping) return
    stopping = true
    logger.info({ signal }, 'stopping')
    server.close()
    server.closeAllConnections?.()
    mailer.close()
    await sink?.close()
    await sequelize.close()
    process.exit(0)
  }
  process.on('SIGINT', () => void stop('SIGINT'))
  process.on('SIGTERM', () => void stop('SIGTERM'))
}

main().catch((err) => {
  process.stderr.write(`StandGraze failed to start: ${err instanceof Error ? err.stack : String(err)}\n`)
  process.exit(1)
})
