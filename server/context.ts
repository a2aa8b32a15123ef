// What every route handler can reach: the database, configuration, mailer and (in development and tests) the mail sink.
import type { Request } from 'express'
import type { Sequelize } from 'sequelize'
import type { Config } from './config'
import type { Mailer } from './mail/mailer'
import type { MailSink } from './mail/sink'
import type { Logger } from './logger'

export type AppContext = {
  sequelize: Sequelize
  config: Config
  mailer: Mailer
  sink: MailSink | null
  logger: Logger
}

export function ctx(req: Request): AppContext {
  return req.app.locals.ctx as AppContext
}
