// Tokens and request hygiene: forged, expired and alg:none tokens refused; malformed and oversized bodies refused; one error shape; helmet headers.
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import request from 'supertest'
import jwt from 'jsonwebtoken'
import { startTestApp, type TestApp } from '../helpers/app'
import { makeUser } from '../fixtures/builders'

let t: TestApp
beforeAll(async () => {
  t = await startTestApp()
})
afterAll(async () => {
  await t.close()
})

function b64(o: object) {
  return Buffer.from(JSON.stringify(o)).toString('base64url')
}

describe('session tokens', () => {
  it('when the token is signed with another secret, then 401', async () => {
    const u = await makeUser()
    const forged = jwt.sign({ tv: 0, csrf: 'x' }, 'some-other-secret', { algorithm: 'HS256', subject: String(u.id), expiresIn: '1h' })
    const res = await request(t.app).get('/api/auth/me').set('Cookie', `sg_session=${forged}`)
    expect(res.status).toBe(401)
  })

  it('when the token has expired, then 401', async () => {
    const u = await makeUser()
    const expired = jwt.sign({ tv: 0, csrf: 'x', exp: Math.floor(Date.now() / 1000) - 60 }, t.config.jwtSecret, { algorithm: 'HS256', subject: String(u.id) })
    const res = await request(t.app).get('/api/auth/me').set('Cookie', `sg_session=${expired}`)
    expect(res.status).toBe(401)
  })

  it('when the token says alg "none", then 401', async () => {
    const u = await makeUser()
    const none = `${b64({ alg: 'none', typ: 'JWT' })}.${b64({ sub: String(u.id), tv: 0, csrf: 'x', exp: Math.floor(Date.now() / 1000) + 3600 })}.`
    const res = await request(t.app).get('/api/auth/me').set('Cookie', `sg_session=${none}`)
    expect(res.status).toBe(401)
  })

  it('when a valid token uses another HMAC algorithm (HS512), then 401 because HS256 is pinned', async () => {
    const u = await makeUser()
    const other = jwt.sign({ tv: 0, csrf: 'x' }, t.config.jwtSecret, { algorithm: 'HS512', subject: String(u.id), expiresIn: '1h' })
    expect((await request(t.app).get('/api/auth/me').set('Cookie', `sg_session=${other}`)).status).toBe(401)
    const good = jwt.sign({ tv: 0, csrf: 'x' }, t.config.jwtSecret, { algorithm: 'HS256', subject: String(u.id), expiresIn: '1h' })
    expect((await request(t.app).get('/api/auth/me').set('Cookie', `sg_session=${good}`)).status).toBe(200)
  })
})

describe('request bodies', () => {
  it('when the JSON is malformed, then 400 malformed_json, not 500', async () => {
    const res = await request(t.app).post('/api/auth/sign-in').set('Content-Type', 'application/json').send('{"email": "a@b.c",')
    expect(res.status).toBe(400)
    expect(res.body.error.code).toBe('malformed_json')
    expect(JSON.stringify(res.body)).not.toMatch(/at .*\.ts:\d+/)
  })

  it('when the body is over the size limit, then 413', async () => {
    const res = await request(t.app)
      .post('/api/auth/sign-in')
      .set('Content-Type', 'application/json')
      .send(JSON.stringify({ email: 'a@b.c', password: 'x'.repeat(400_000) }))
    expect(res.status).toBe(413)
    expect(res.body.error.code).toBe('body_too_large')
  })
})

describe('unknown routes and headers', () => {
  it('when an /api route does not exist, then 404 JSON in the one error shape with a request id', async () => {
    const res = await request(t.app).get('/api/no-such-thing')
    expect(res.status).toBe(404)
    expect(res.body.error).toMatchObject({ status: 404, code: 'not_found' })
    expect(res.body.error.requestId).toBe(res.headers['x-request-id'])
  })

  it('when any response is sent, then helmet headers are present', async () => {
    const res = await request(t.app).get('/api/health')
    expect(res.headers['x-content-type-options']).toBe('nosniff')
    expect(res.headers['content-security-policy']).toContain("default-src 'self'")
    expect(res.headers['x-powered-by']).toBeUndefined()
  })
})
