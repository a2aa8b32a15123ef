// Operations and roles: invite and accept through the mail sink, team management, and the role × route matrix over every operation-scoped route.
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import request from 'supertest'
import { startTestApp, type TestApp } from '../helpers/app'
import { addMember, makeOperation, makeUser, signIn, type Session } from '../fixtures/builders'
import { scopedRouteTable } from '../../server/routes/scoped'
import { can, roles, type Role } from '../../shared/schemas/roles'
import { Membership } from '../../server/models/index'

let t: TestApp
beforeAll(async () => {
  t = await startTestApp()
})
afterAll(async () => {
  await t.close()
})

describe('POST /api/operations', () => {
  it('when a user starts an operation, then they are its owner and see it in their list', async () => {
    const u = await makeUser()
    const s = await signIn(t.app, u)
    const res = await s.post('/api/operations', { name: 'Test Corridor Farm', species: 'cattle' })
    expect(res.status).toBe(201)
    expect(res.body.role).toBe('owner')
    const list = await s.get('/api/operations')
    expect(list.body.map((m: { operationId: number }) => m.operationId)).toContain(res.body.id)
  })

  it('when the name is missing, then 400 names the field', async () => {
    const s = await signIn(t.app, await makeUser())
    const res = await s.post('/api/operations', {})
    expect(res.status).toBe(400)
    expect(res.body.error.fields[0].field).toBe('name')
  })
})

describe('invitations', () => {
  it('when an owner invites by e-mail, then the invitee signs up from the link and joins with the invited role; the link works once', async () => {
    const owner = await makeUser()
    const op = await makeOperation(owner)
    const s = await signIn(t.app, owner)
    const email = `invitee-${Date.now()}@example.test`
    const inv = await s.post(`/api/operations/${op.id}/invitations`, { email, role: 'nutritionist' })
    expect(inv.status).toBe(201)
    const mail = await t.sink.waitFor(email)
    const token = decodeURIComponent(mail.text.match(/accept-invite\?token=([^\s]+)/)![1])

    const info = await request(t.app).get(`/api/invitations/${token}`)
    expect(info.status).toBe(200)
    expect(info.body).toMatchObject({ email, role: 'nutritionist', operationId: op.id })

    const up = await request(t.app).post('/api/auth/sign-up').send({ name: 'Invited Person', email, password: 'legume-corridor-55', inviteToken: token })
    expect(up.status).toBe(201)
    expect(up.body.memberships).toEqual([expect.objectContaining({ operationId: op.id, role: 'nutritionist' })])

    const reuse = await request(t.app).post('/api/auth/sign-up').send({ name: 'Other', email: `o-${email}`, password: 'legume-corridor-55', inviteToken: token })
    expect(reuse.status).toBe(400)
    expect(await Membership.count({ where: { operationId: op.id } })).toBe(2)
  })

  it('when an existing user accepts while signed in, then they join; another account cannot take their invitation', async () => {
    const owner = await makeUser()
    const op = await makeOperation(owner)
    const invitee = await makeUser()
    const stranger = await makeUser()
    const s = await signIn(t.app, owner)
    await s.post(`/api/operations/${op.id}/invitations`, { email: invitee.email, role: 'hand' })
    const token = decodeURIComponent((await t.sink.waitFor(invitee.email)).text.match(/accept-invite\?token=([^\s]+)/)![1])
    const wrong = await (await signIn(t.app, stranger)).post('/api/invitations/accept', { token })
    expect(wrong.status).toBe(403)
    const si = await signIn(t.app, invitee)
    const ok = await si.post('/api/invitations/accept', { token })
    expect(ok.status).toBe(200)
    expect(ok.body).toEqual({ operationId: op.id, role: 'hand' })
    expect((await si.get(`/api/operations/${op.id}`)).body.role).toBe('hand')
  })

  it('when the invitee is already a member, then 409', async () => {
    const owner = await makeUser()
    const op = await makeOperation(owner)
    const m = await makeUser()
    await addMember(op, m, 'hand')
    const res = await (await signIn(t.app, owner)).post(`/api/operations/${op.id}/invitations`, { email: m.email, role: 'hand' })
    expect(res.status).toBe(409)
  })
})

describe('team management', () => {
  it('when the owner changes a role and removes a member, then it takes effect; the last owner cannot be demoted', async () => {
    const owner = await makeUser()
    const op = await makeOperation(owner)
    const hand = await makeUser()
    const hm = await addMember(op, hand, 'hand')
    const s = await signIn(t.app, owner)
    expect((await s.patch(`/api/operations/${op.id}/members/${hm.id}`, { role: 'nutritionist' })).body.role).toBe('nutritionist')
    const own = await Membership.findOne({ where: { operationId: op.id, userId: owner.id } })
    const demote = await s.patch(`/api/operations/${op.id}/members/${own!.id}`, { role: 'hand' })
    expect(demote.status).toBe(409)
    expect((await s.delete(`/api/operations/${op.id}/members/${hm.id}`)).status).toBe(204)
    const hs = await signIn(t.app, hand)
    expect((await hs.get(`/api/operations/${op.id}`)).status).toBe(404)
  })

  it('when a site admin is not a member, then the operation is invisible (404)', async () => {
    const admin = await makeUser({ isAdmin: true })
    const op = await makeOperation(await makeUser())
    const s = await signIn(t.app, admin)
    expect((await s.get(`/api/operations/${op.id}`)).status).toBe(404)
    expect((await s.get(`/api/operations/${op.id}/members`)).status).toBe(404)
    expect((await s.get('/api/admin/users')).status).toBe(200)
  })

  it('when a non-admin calls an admin route, then 403', async () => {
    const s = await signIn(t.app, await makeUser())
    expect((await s.get('/api/admin/users')).status).toBe(403)
  })
})

describe('role × route matrix over every operation-scoped route', () => {
  let op: { id: number }
  const sessions = {} as Record<Role | 'outsider', Session>

  beforeAll(async () => {
    const owner = await makeUser()
    op = await makeOperation(owner)
    sessions.owner = await signIn(t.app, owner)
    for (const role of ['nutritionist', 'hand'] as const) {
      const u = await makeUser()
      await addMember(op as never, u, role)
      sessions[role] = await signIn(t.app, u)
    }
    const outsider = await makeUser()
    await makeOperation(outsider)
    sessions.outsider = await signIn(t.app, outsider)
  })

  function send(s: Session | null, method: string, url: string) {
    if (!s) return (request(t.app) as unknown as Record<string, (u: string) => request.Test>)[method](url)
    if (method === 'get') return s.get(url)
    return (s as unknown as Record<string, (u: string, b?: object) => request.Test>)[method](url, {})
  }

  const table = () => scopedRouteTable()

  it('covers at least the team routes', () => {
    expect(table().length).toBeGreaterThanOrEqual(7)
  })

  it('when each role calls each route, then it is allowed or 403 exactly as the permission table says; outsiders get 404; signed out gets 401', async () => {
    const failures: string[] = []
    for (const route of table()) {
      const url = `/api/operations/${op.id}${route.path.replace(/:[A-Za-z]+/g, '999999').replace(/\/$/, '')}`
      for (const role of roles) {
        const res = await send(sessions[role], route.method, url)
        const allowed = can(role, route.permission)
        if (allowed && res.status === 403) failures.push(`${role} ${route.method} ${route.path}: 403 but should be allowed`)
        if (allowed && res.status === 404 && res.body?.error?.message === 'Operation not found.') failures.push(`${role} ${route.method} ${route.path}: operation hidden`)
        if (!allowed && (res.status !== 403 || res.body?.error?.code !== 'forbidden')) failures.push(`${role} ${route.method} ${route.path}: ${res.status} but should be 403`)
        if (res.status >= 500) failures.push(`${role} ${route.method} ${route.path}: ${res.status}`)
      }
      const out = await send(sessions.outsider, route.method, url)
      if (out.status !== 404 || out.body?.error?.message !== 'Operation not found.') failures.push(`outsider ${route.method} ${route.path}: ${out.status}`)
      const anon = await send(null, route.method, url)
      if (anon.status !== 401) failures.push(`signed-out ${route.method} ${route.path}: ${anon.status}`)
    }
    expect(failures).toEqual([])
  })
})
