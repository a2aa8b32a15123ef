// Builds the real app for API tests: the test database (migrated), a mail sink on loopback, and createApp().
import type { Express } from 'express'
import { createSequelize, migrate } from '../../server/db/index'
import { loadConfig, type Config } from '../../server/config'
import { createLogger } from '../../server/logger'
import { startMail } from '../../server/mail/index'
import type { MailSink } from '../../server/mail/sink'
import { createApp } from '../../server/app'
import type { AppContext } from '../../server/context'

export type TestApp = AppContext & { app: Express; sink: MailSink; close: () => Promise<void> }

// Models bind to one connection per process, so every app in a test file shares it; it closes with the last app.
let shared: { sequelize: ReturnType<typeof createSequelize>; users: number } | null = null

export async function startTestApp(overrides: Partial<Config> = {}): Promise<TestApp> {
  const config = loadConfig({
    env: 'test',
    jwtSecret: 'test-secret-0123456789-abcdefghijklmnopqrstuvwxyz',
    publicUrl: 'http://127.0.0.1:3999',
    serveClient: false,
    logLevel: 'silent',
    rateLimit: { signInPerWindow: 1000, resetPerWindow: 1000, windowMs: 15 * 60 * 1000 },
    ...overrides,
  })
  if (!shared) {
    shared = { sequelize: createSequelize(process.env.DATABASE_URL!), users: 0 }
    await migrate(shared.sequelize)
  }
  shared.users += 1
  const sequelize = shared.sequelize
  const mail = await startMail({ ...config, smtpUrl: null })
  const sink = mail.sink!
  const mailer = mail.mailer
  const logger = createLogger('silent')
  const context = { sequelize, config, mailer, sink, logger }
  const app = createApp(context)
  return {
    ...context,
    app,
    close: async () => {
      mailer.close()
      await sink.close()
      if (shared && --shared.users === 0) {
        shared = null
        await sequelize.close()
      }
    },
  }
}
