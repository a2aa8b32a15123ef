// Accounts: sign-up, sign-in, sign-out, password change, the reset flow through the mail sink, rate limits.
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import request from 'supertest'
import bcrypt from 'bcryptjs'
import { startTestApp, type TestApp } from '../helpers/app'
import { csrfFrom, makeUser, signIn, TEST_PASSWORD } from '../fixtures/builders'
import { User, PasswordReset } from '../../server/models/index'
import { hashToken } from '../../server/services/tokens'

let t: TestApp
beforeAll(async () => {
  t = await startTestApp()
})
afterAll(async () => {
  await t.close()
})

const strong = 'winter-strips-grow-7'

describe('POST /api/auth/sign-up', () => {
  it('when the input is valid, then it creates the user with a cost-12 bcrypt hash and signs them in', async () => {
    const email = `new-${Date.now()}@example.test`
    const res = await request(t.app).post('/api/auth/sign-up').send({ name: 'New Person', email: email.toUpperCase(), password: strong })
    expect(res.status).toBe(201)
    expect(res.body.email).toBe(email)
    const cookies = ([] as string[]).concat(res.headers['set-cookie'])
    const session = cookies.find((c) => c.startsWith('sg_session='))!
    expect(session).toMatch(/HttpOnly/i)
    expect(session).toMatch(/SameSite=Lax/i)
    const user = await User.findOne({ where: { email } })
    expect(user).not.toBeNull()
    expect(bcrypt.getRounds(user!.passwordHash)).toBeGreaterThanOrEqual(12)
    expect(await bcrypt.compare(strong, user!.passwordHash)).toBe(true)
  })

  it('when the password is short or on the common-password list (NIST SP 800-63B §5.1.1.2), then 400 names the password field', async () => {
    for (const password of ['short1', 'password123', '1234567890']) {
      const res = await request(t.app).post('/api/auth/sign-up').send({ name: 'X', email: `p-${Date.now()}-${password}@example.test`, password })
      expect(res.status).toBe(400)
      expect(res.body.error.fields.map((f: { field: string }) => f.field)).toContain('password')
    }
  })

  it('when fields are missing or malformed, then 400 lists each field', async () => {
    const res = await request(t.app).post('/api/auth/sign-up').send({ email: 'not-an-email' })
    expect(res.status).toBe(400)
    const fields = res.body.error.fields.map((f: { field: string }) => f.field)
    expect(fields).toEqual(expect.arrayContaining(['name', 'email', 'password']))
  })

  it('when the e-mail is taken, then 409 and no second account', async () => {
    const u = await makeUser()
    const res = await request(t.app).post('/api/auth/sign-up').send({ name: 'Dup', email: u.email, password: strong })
    expect(res.status).toBe(409)
    expect(await User.count({ where: { email: u.email } })).toBe(1)
  })
})

describe('POST /api/auth/sign-in and sign-out', () => {
  it('when the password is right, then the session reads /api/auth/me; after sign-out it is gone', async () => {
    const u = await makeUser()
    const s = await signIn(t.app, u)
    const me = await s.get('/api/auth/me')
    expect(me.status).toBe(200)
    expect(me.body.email).toBe(u.email)
    const out = await s.post('/api/auth/sign-out')
    expect(out.status).toBe(204)
    expect((await s.get('/api/auth/me')).status).toBe(401)
    expect((await s.get('/api/auth/session')).body).toEqual({ user: null })
  })

  it('when the password is wrong, then 401 with one message that does not say which part was wrong', async () => {
    const u = await makeUser()
    const wrong = await request(t.app).post('/api/auth/sign-in').send({ email: u.email, password: 'not-the-password' })
    const unknown = await request(t.app).post('/api/auth/sign-in').send({ email: 'nobody@example.test', password: 'not-the-password' })
    expect(wrong.status).toBe(401)
    expect(unknown.status).toBe(401)
    expect(wrong.body.error.message).toBe(unknown.body.error.message)
  })

  it('when nothing is signed in, then /api/auth/me is 401', async () => {
    expect((await request(t.app).get('/api/auth/me')).status).toBe(401)
  })
})

describe('CSRF defence for cookie-authenticated writes', () => {
  it('when a write carries the session cookie but no CSRF header, then 403', async () => {
    const u = await makeUser()
    const s = await signIn(t.app, u)
    const res = await s.agent.patch('/api/auth/me/preferences').send({ unitSystem: 'metric' })
    expect(res.status).toBe(403)
    expect(res.body.error.code).toBe('csrf_failed')
    const ok = await s.patch('/api/auth/me/preferences', { unitSystem: 'metric' })
    expect(ok.status).toBe(200)
    expect(ok.body.unitSystem).toBe('metric')
  })
})

describe('POST /api/auth/password', () => {
  it('when the current password is right, then the password changes and old sessions end', async () => {
    const u = await makeUser()
    const s1 = await signIn(t.app, u)
    const s2 = await signIn(t.app, u)
    const res = await s1.post('/api/auth/password', { currentPassword: TEST_PASSWORD, newPassword: strong })
    expect(res.status).toBe(200)
    expect((await s2.get('/api/auth/me')).status).toBe(401)
    expect((await request(t.app).post('/api/auth/sign-in').send({ email: u.email, password: strong })).status).toBe(200)
  })

  it('when the current password is wrong, then 400 names currentPassword', async () => {
    const u = await makeUser()
    const s = await signIn(t.app, u)
    const res = await s.post('/api/auth/password', { currentPassword: 'wrong-password-x', newPassword: strong })
    expect(res.status).toBe(400)
    expect(res.body.error.fields[0].field).toBe('currentPassword')
  })
})

describe('password reset by e-mailed single-use token', () => {
  it('when requested, then the sink receives a link whose token resets the password once', async () => {
    const u = await makeUser()
    const res = await request(t.app).post('/api/auth/password-reset').send({ email: u.email })
    expect(res.status).toBe(202)
    const mail = await t.sink.waitFor(u.email, (m) => m.subject.includes('Reset'))
    const token = decodeURIComponent(mail.text.match(/reset-password\?token=([^\s]+)/)![1])
    const stored = await PasswordReset.findOne({ where: { userId: u.id } })
    expect(stored!.tokenHash).toBe(hashToken(token))
    expect(stored!.tokenHash).not.toContain(token)
    const ttl = stored!.expiresAt.getTime() - stored!.createdAt.getTime()
    expect(ttl).toBeGreaterThan(59 * 60 * 1000)
    expect(ttl).toBeLessThanOrEqual(60 * 60 * 1000 + 1000)

    const confirm = await request(t.app).post('/api/auth/password-reset/confirm').send({ token, password: strong })
    expect(confirm.status).toBe(200)
    expect((await request(t.app).post('/api/auth/sign-in').send({ email: u.email, password: strong })).status).toBe(200)
    const again = await request(t.app).post('/api/auth/password-reset/confirm').send({ token, password: 'another-pass-99' })
    expect(again.status).toBe(400)
    expect(again.body.error.fields[0].field).toBe('token')
  })

  it('when the token has expired, then it is refused', async () => {
    const u = await makeUser()
    await request(t.app).post('/api/auth/password-reset').send({ email: u.email })
    const mail = await t.sink.waitFor(u.email)
    const token = decodeURIComponent(mail.text.match(/reset-password\?token=([^\s]+)/)![1])
    await PasswordReset.update({ expiresAt: new Date(Date.now() - 1000) }, { where: { userId: u.id } })
    const res = await request(t.app).post('/api/auth/password-reset/confirm').send({ token, password: strong })
    expect(res.status).toBe(400)
  })

  it('when the address is unknown, then the answer is the same and no mail is sent', async () => {
    const before = t.sink.messages.length
    const res = await request(t.app).post('/api/auth/password-reset').send({ email: 'nobody-here@example.test' })
    expect(res.status).toBe(202)
    await new Promise((r) => setTimeout(r, 200))
    expect(t.sink.messages.length).toBe(before)
  })
})

describe('rate limits on sign-in and reset', () => {
  it('when sign-in is tried past the limit, then 429 with a clear message', async () => {
    const limited = await startTestApp({ rateLimit: { signInPerWindow: 3, resetPerWindow: 2, windowMs: 60_000 } })
    try {
      const u = await makeUser()
      const codes: number[] = []
      for (let i = 0; i < 4; i++) codes.push((await request(limited.app).post('/api/auth/sign-in').send({ email: u.email, password: 'wrong-password-x' })).status)
      expect(codes).toEqual([401, 401, 401, 429])
      const res = await request(limited.app).post('/api/auth/sign-in').send({ email: u.email, password: TEST_PASSWORD })
      expect(res.status).toBe(429)
      expect(res.body.error.code).toBe('rate_limited')
      expect(res.body.error.message).toMatch(/Too many sign-in attempts/)
      const r = [] as number[]
      for (let i = 0; i < 3; i++) r.push((await request(limited.app).post('/api/auth/password-reset').send({ email: u.email })).status)
      expect(r).toEqual([202, 202, 429])
    } finally {
      await limited.close()
    }
  })
})

describe('session cookie', () => {
  it('when signed in, then the CSRF cookie is readable by the page and matches the session', async () => {
    const u = await makeUser()
    const res = await request(t.app).post('/api/auth/sign-in').send({ email: u.email, password: TEST_PASSWORD })
    const csrf = csrfFrom(res)
    expect(csrf.length).toBeGreaterThan(20)
    const cookies = ([] as string[]).concat(res.headers['set-cookie'])
    expect(cookies.find((c) => c.startsWith('sg_csrf='))).not.toMatch(/HttpOnly/i)
  })
})
