// createApp: the Express application (API and, when built, the client), with no listening socket, so tests drive it directly.
import express, { type Request, type Response, type NextFunction } from 'express'
import helmet from 'helmet'
import cookieParser from 'cookie-parser'
import { pinoHttp } from 'pino-http'
import { randomUUID } from 'node:crypto'
import { existsSync } from 'node:fs'
import { join } from 'node:path'
import type { AppContext } from './context'
import { ROOT } from './config'
import { loadSession } from './middleware/auth'
import { errorHandler, notFoundApi } from './middleware/errors'
import { authRouter } from './routes/auth'
import { invitationsRouter, operationScopedRouter, operationsRouter } from './routes/operations'
import { adminRouter } from './routes/admin'
import { nutritionRoutes } from './routes/nutrition/index'
import { grazingRoutes } from './routes/grazing/index'

export function createApp(context: AppContext) {
  const { config, logger } = context
  const app = express()
  app.locals.ctx = context
  app.disable('x-powered-by')
  app.set('trust proxy', 'loopback')

  app.use(
    pinoHttp({
      logger,
      genReqId: (req, res) => {
        const id = (req.headers['x-request-id'] as string | undefined)?.slice(0, 64) || randomUUID()
        res.setHeader('x-request-id', id)
        return id
      },
      autoLogging: { ignore: (req) => !(req.url ?? '').startsWith('/api') },
      // Method, path and status are what an operator reads; headers and cookies stay out of the log.
      serializers: {
        req: (req: { id: string; method: string; url: string }) => ({ id: req.id, method: req.method, url: req.url?.split('?')[0] }),
        res: (res: { statusCode: number }) => ({ status: res.statusCode }),
      },
    }),
  )
  app.use(
    helmet({
      contentSecurityPolicy: {
        useDefaults: true,
        directives: {
          'script-src': ["'self'", "'wasm-unsafe-eval'"],
          // Vuetify writes its theme into a <style> element at run time.
          'style-src': ["'self'", "'unsafe-inline'"],
          'img-src': ["'self'", 'data:', 'blob:'],
          'worker-src': ["'self'", 'blob:'],
          'connect-src': ["'self'"],
          'font-src': ["'self'", 'data:'],
          'upgrade-insecure-requests': config.secureCookies ? [] : null,
        },
      },
      strictTransportSecurity: config.secureCookies,
    }),
  )
  app.use('/api', express.json({ limit: '256kb' }))
  app.use(cookieParser())
  app.use(loadSession(config))

  app.get('/api/health', (_req, res) => {
    res.json({ ok: true })
  })
  app.use('/api/auth', authRouter(config))
  app.use('/api/operations', operationsRouter())
  app.use('/api/operations/:operationId', operationScopedRouter([...nutritionRoutes, ...grazingRoutes]))
  app.use('/api/invitations', invitationsRouter())
  app.use('/api/admin', adminRouter())
  app.use('/api', notFoundApi)

  const dist = join(ROOT, 'dist')
  if (config.serveClient && existsSync(join(dist, 'index.html'))) {
    app.use(express.static(dist, { index: false, maxAge: '1h', setHeaders: (res, path) => { if (path.endsWith('.html')) res.setHeader('Cache-Control', 'no-cache') } }))
    app.get(/^\/(?!api\/).*/, (req: Request, res: Response, next: NextFunction) => {
      if (req.method !== 'GET') return next()
      res.setHeader('Cache-Control', 'no-cache')
      res.sendFile(join(dist, 'index.html'))
    })
  }
  app.use(errorHandler)
  return app
}
