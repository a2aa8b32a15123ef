// Account routes: sign-up, sign-in, sign-out, the signed-in user, preferences, password change and reset.
import { Router } from 'express'
import { rateLimit, ipKeyGenerator } from 'express-rate-limit'
import { ctx } from '../context'
import { clearSession, issueSession, requireUser } from '../middleware/auth'
import { parseBody } from '../middleware/validate'
import { AppError } from '../errors'
import {
  passwordChangeSchema,
  preferencesSchema,
  resetConfirmSchema,
  resetRequestSchema,
  signInSchema,
  signUpSchema,
} from '../../shared/schemas/auth'
import { changePassword, confirmPasswordReset, describeUser, requestPasswordReset, signIn, signUp } from '../services/accounts'
import type { Config } from '../config'
import { Operation } from '../models/index'
import { DEMO_PASSWORD, DEMO_USERS } from '../seed/demo'

function limiter(limit: number, windowMs: number, what: string) {
  return rateLimit({
    windowMs,
    limit,
    standardHeaders: 'draft-8',
    legacyHeaders: false,
    // Count per address and e-mail, so one user's typos do not lock out a whole farm office behind one IP.
    keyGenerator: (req) => `${ipKeyGenerator(req.ip ?? '')}|${typeof req.body?.email === 'string' ? req.body.email.trim().toLowerCase() : ''}`,
    handler: (req, res) => {
      res.status(429).json({
        error: { status: 429, code: 'rate_limited', message: `Too many ${what} attempts. Wait 15 minutes and try again.`, requestId: String(req.id ?? '') },
      })
    },
  })
}

export function authRouter(config: Config) {
  const r = Router()
  const signInLimit = limiter(config.rateLimit.signInPerWindow, config.rateLimit.windowMs, 'sign-in')
  const resetLimit = limiter(config.rateLimit.resetPerWindow, config.rateLimit.windowMs, 'password-reset')

  r.post('/sign-up', async (req, res) => {
    const input = parseBody(signUpSchema, req)
    const { sequelize } = ctx(req)
    const user = await signUp(sequelize, config, input)
    issueSession(res, user, config)
    res.status(201).json(await describeUser(user))
  })

  r.post('/sign-in', signInLimit, async (req, res) => {
    const input = parseBody(signInSchema, req)
    const user = await signIn(config, input.email, input.password)
    issueSession(res, user, config)
    res.json(await describeUser(user))
  })

  r.post('/sign-out', (_req, res) => {
    clearSession(res, config)
    res.status(204).end()
  })

  // Answers 200 either way, so a signed-out page load logs no failed request.
  r.get('/session', async (req, res) => {
    res.json({ user: req.user ? await describeUser(req.user) : null })
  })

  // The sign-in page offers the invented demo accounts while the demo is loaded.
  r.get('/demo-accounts', async (_req, res) => {
    const loaded = (await Operation.count({ where: { isDemo: true } })) > 0
    res.json(loaded ? { password: DEMO_PASSWORD, accounts: DEMO_USERS.map((u) => ({ email: u.email, label: u.label })) } : { password: null, accounts: [] })
  })

  r.get('/me', requireUser, async (req, res) => {
    res.json(await describeUser(req.user!))
  })

  r.patch('/me/preferences', requireUser, async (req, res) => {
    const input = parseBody(preferencesSchema, req)
    req.user!.unitSystem = input.unitSystem
    await req.user!.save()
    res.json(await describeUser(req.user!))
  })

  r.post('/password', requireUser, async (req, res) => {
    const input = parseBody(passwordChangeSchema, req)
    const user = await changePassword(config, req.user!, input.currentPassword, input.newPassword)
    issueSession(res, user, config)
    res.json(await describeUser(user))
  })

  r.post('/password-reset', resetLimit, async (req, res) => {
    const input = parseBody(resetRequestSchema, req)
    await requestPasswordReset(config, ctx(req).mailer, input.email)
    res.status(202).json({ message: 'If that address has an account, a reset link is on its way.' })
  })

  r.post('/password-reset/confirm', resetLimit, async (req, res) => {
    const input = parseBody(resetConfirmSchema, req)
    const user = await confirmPasswordReset(ctx(req).sequelize, config, input.token, input.password)
    if (user.disabled) throw new AppError(403, 'disabled', 'This account is disabled.')
    issueSession(res, user, config)
    res.json(await describeUser(user))
  })

  return r
}
