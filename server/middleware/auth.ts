// Session handling: a signed JWT (HS256, pinned on verify) in an httpOnly cookie, plus a double-submit CSRF token for cookie-authenticated writes.
import type { NextFunction, Request, Response } from 'express'
import jwt from 'jsonwebtoken'
import { randomBytes, timingSafeEqual } from 'node:crypto'
import { AppError } from '../errors'
import { User } from '../models/index'
import type { Config } from '../config'

export const SESSION_COOKIE = 'sg_session'
export const CSRF_COOKIE = 'sg_csrf'
export const CSRF_HEADER = 'x-csrf-token'

type Claims = { sub: string; tv: number; csrf: string }

declare module 'express-serve-static-core' {
  interface Request {
    user?: User
    csrfToken?: string
  }
}

export function issueSession(res: Response, user: User, config: Config) {
  const csrf = randomBytes(24).toString('base64url')
  const token = jwt.sign({ tv: user.tokenVersion, csrf } satisfies Omit<Claims, 'sub'>, config.jwtSecret, {
    algorithm: 'HS256',
    expiresIn: config.jwtExpiresIn as jwt.SignOptions['expiresIn'],
    subject: String(user.id),
  })
  const maxAge = 12 * 60 * 60 * 1000
  res.cookie(SESSION_COOKIE, token, { httpOnly: true, sameSite: 'lax', secure: config.secureCookies, path: '/', maxAge })
  res.cookie(CSRF_COOKIE, csrf, { httpOnly: false, sameSite: 'lax', secure: config.secureCookies, path: '/', maxAge })
}

export function clearSession(res: Response, config: Config) {
  res.clearCookie(SESSION_COOKIE, { httpOnly: true, sameSite: 'lax', secure: config.secureCookies, path: '/' })
  res.clearCookie(CSRF_COOKIE, { sameSite: 'lax', secure: config.secureCookies, path: '/' })
}

function verify(token: string, secret: string): Claims | null {
  try {
    const c = jwt.verify(token, secret, { algorithms: ['HS256'] }) as jwt.JwtPayload
    if (typeof c.sub !== 'string' || typeof c.tv !== 'number' || typeof c.csrf !== 'string') return null
    return { sub: c.sub, tv: c.tv, csrf: c.csrf }
  } catch {
    return null
  }
}

function safeEqual(a: string, b: string) {
  const x = Buffer.from(a)
  const y = Buffer.from(b)
  return x.length === y.length && timingSafeEqual(x, y)
}

const SAFE = new Set(['GET', 'HEAD', 'OPTIONS'])

/** Loads the signed-in user when a valid session cookie is present; never rejects by itself. */
export function loadSession(config: Config) {
  return async (req: Request, _res: Response, next: NextFunction) => {
    const token = req.cookies?.[SESSION_COOKIE]
    if (typeof token === 'string' && token) {
      const claims = verify(token, config.jwtSecret)
      if (claims) {
        const user = await User.findByPk(Number(claims.sub))
        if (user && !user.disabled && user.tokenVersion === claims.tv) {
          req.user = user
          req.csrfToken = claims.csrf
        }
      }
    }
    next()
  }
}

/** Rejects with 401 unless signed in; for writes, also demands the CSRF header matching the session's token. */
export function requireUser(req: Request, _res: Response, next: NextFunction) {
  if (!req.user) return next(AppError.unauthorized())
  if (!SAFE.has(req.method)) {
    const header = req.get(CSRF_HEADER)
    if (!header || !req.csrfToken || !safeEqual(header, req.csrfToken)) {
      return next(new AppError(403, 'csrf_failed', 'Missing or wrong CSRF token; reload the page and try again.'))
    }
  }
  next()
}

export function requireAdmin(req: Request, _res: Response, next: NextFunction) {
  if (!req.user?.isAdmin) return next(AppError.forbidden('Only a site administrator may do that.'))
  next()
}
