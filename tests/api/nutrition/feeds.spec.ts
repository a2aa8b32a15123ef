// Feeds API: the reference set (loaded from reference-data/, read-only) and an operation's own feeds — CRUD, paging, validation, isolation, roles, 409.
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { startTestApp, type TestApp } from '../../helpers/app'
import { feedBody, makeFeed, makeLabResult } from '../../fixtures/nutrition'
import { fieldsOf, makeTeam, type Team } from './setup'
import { seedReference, readReferenceFeeds } from '../../../server/seed/reference'
import { Feed } from '../../../server/models/nutrition'

let t: TestApp
let team: Team
beforeAll(async () => {
  t = await startTestApp()
  await seedReference(t.sequelize)
  team = await makeTeam(t)
})
afterAll(async () => {
  await t.close()
})

describe('reference feeds', () => {
  it('when the reference set is loaded twice, then each row exists once, keyed, with its source and provenance', async () => {
    const rows = readReferenceFeeds()
    await seedReference(t.sequelize)
    expect(await Feed.count({ where: { operationId: null } })).toBe(rows.length)
    const res = await team.sessions.hand.get(team.url('/feeds?scope=reference&pageSize=100'))
    expect(res.status).toBe(200)
    expect(res.body.total).toBe(rows.length)
    for (const f of res.body.items) {
      expect(f.isReference).toBe(true)
      expect(f.sourceTitle).toBeTruthy()
      expect(f.provenance).toBeTruthy()
    }
  })

  it('when a reference row is read, then its values are those of the published guide (cottonseed meal: DM 90, CP 45, TDN 78, Ca 0.20, P 1.00 — Alabama ACES by-product guide, read)', async () => {
    const res = await team.sessions.owner.get(team.url('/feeds?scope=reference&q=cottonseed meal'))
    expect(res.body.items).toHaveLength(1)
    expect(res.body.items[0]).toMatchObject({ dmPct: 90, cpPctDm: 45, tdnPctDm: 78, caPctDm: 0.2, pPctDm: 1, provenance: { read: ['dm', 'cp', 'tdn', 'ca', 'p'], fromMemory: ['ndf', 'adf'] } })
  })

  it('when a sheep list is asked for, then feeds marked cattle-only (the cattle trace-mineral salt) are not in it', async () => {
    const all = await team.sessions.owner.get(team.url('/feeds?scope=reference&pageSize=100'))
    const sheep = await team.sessions.owner.get(team.url('/feeds?scope=reference&species=sheep&pageSize=100'))
    const salt = all.body.items.find((f: { referenceKey: string }) => f.referenceKey === 'tm-salt-cattle')
    expect(salt).toMatchObject({ cattleOnly: true, cuMgPerKgDm: 350 })
    expect(sheep.body.items.some((f: { cattleOnly: boolean }) => f.cattleOnly)).toBe(false)
    expect(sheep.body.total).toBe(all.body.total - 1)
  })

  it('when anyone edits or deletes a reference feed, then 403 read_only and it is unchanged', async () => {
    const ref = await Feed.findOne({ where: { referenceKey: 'soybean-meal-44' } })
    const res = await team.sessions.owner.patch(team.url(`/feeds/${ref!.id}`), { cpPctDm: 60, version: ref!.version })
    expect(res.status).toBe(403)
    expect(res.body.error.code).toBe('read_only')
    expect((await team.sessions.owner.delete(team.url(`/feeds/${ref!.id}`))).status).toBe(403)
    expect((await Feed.findByPk(ref!.id))!.cpPctDm).toBe(49)
  })
})

describe('own feeds', () => {
  it('when a nutritionist adds a priced supplement, then it is listed as own with version 1 and its book values as effective values', async () => {
    const res = await team.sessions.nutritionist.post(team.url('/feeds'), feedBody({ name: 'Own cube A' }))
    expect(res.status).toBe(201)
    expect(res.body).toMatchObject({ isReference: false, version: 1, priceAmount: 400, priceUnit: 'ton', effective: { cpPctDm: 38, labResultId: null } })
    const own = await team.sessions.hand.get(team.url('/feeds?scope=own&q=own cube'))
    expect(own.body.items.map((f: { name: string }) => f.name)).toEqual(['Own cube A'])
  })

  it('when a price per bag has no bag weight, or a price has no unit, then 400 names bagWeightKg or priceUnit', async () => {
    const a = await team.sessions.owner.post(team.url('/feeds'), feedBody({ priceUnit: 'bag' }))
    expect(a.status).toBe(400)
    expect(fieldsOf(a)).toEqual(['bagWeightKg'])
    const b = await team.sessions.owner.post(team.url('/feeds'), feedBody({ priceUnit: null }))
    expect(fieldsOf(b)).toEqual(['priceUnit'])
    const c = await team.sessions.owner.post(team.url('/feeds'), feedBody({ dmPct: 0, cpPctDm: -1 }))
    expect(fieldsOf(c)).toEqual(expect.arrayContaining(['dmPct', 'cpPctDm']))
  })

  it('when a feed has a lab result, then its effective values are the latest result’s, field by field', async () => {
    const f = await makeFeed(team.op, { name: 'Lab-tested hay', kind: 'forage', dmPct: 88, cpPctDm: 10, tdnPctDm: 55, caPctDm: 0.5, ndfPctDm: 60 })
    await makeLabResult(team.op, f, { sampleDate: '2026-10-01', cpPct: 8, dmPct: 86, tdnPct: 52 })
    const latest = await makeLabResult(team.op, f, { sampleDate: '2026-11-15', cpPct: 7.5, dmPct: 84, tdnPct: 50, caPct: null, pPct: 0.2 })
    const res = await team.sessions.owner.get(team.url(`/feeds/${f.id}`))
    expect(res.body.effective).toMatchObject({ cpPctDm: 7.5, dmPct: 84, tdnPctDm: 50, caPctDm: 0.5, pPctDm: 0.2, ndfPctDm: 60, labResultId: latest.id, labSampleDate: '2026-11-15' })
    expect(res.body.cpPctDm).toBe(10)
  })

  it('when two people edit the same feed, then the stale one gets 409 with both versions', async () => {
    const f = await makeFeed(team.op, { name: 'Contested cube' })
    expect((await team.sessions.owner.patch(team.url(`/feeds/${f.id}`), { priceAmount: 420, version: 1 })).status).toBe(200)
    const stale = await team.sessions.nutritionist.patch(team.url(`/feeds/${f.id}`), { priceAmount: 380, version: 1 })
    expect(stale.status).toBe(409)
    expect(stale.body.error.details.current).toMatchObject({ priceAmount: 420, version: 2 })
    expect(stale.body.error.details.submitted.changes).toEqual({ priceAmount: 380 })
  })

  it('when paging own feeds, then total and page sizes add up', async () => {
    const t2 = await makeTeam(t)
    for (const n of ['Cube 1', 'Cube 2', 'Cube 3', 'Cube 4', 'Cube 5']) await makeFeed(t2.op, { name: n })
    const p = await t2.sessions.owner.get(t2.url('/feeds?scope=own&pageSize=2&page=3&sort=name'))
    expect(p.body).toMatchObject({ total: 5, page: 3, pageSize: 2 })
    expect(p.body.items.map((f: { name: string }) => f.name)).toEqual(['Cube 5'])
  })

  it('when another operation reads, edits or deletes this operation’s feed, then 404; a hand may not write', async () => {
    const f = await makeFeed(team.op, { name: 'Private cube' })
    expect((await team.sessions.outsider.get(team.otherUrl(`/feeds/${f.id}`))).status).toBe(404)
    expect((await team.sessions.outsider.delete(team.otherUrl(`/feeds/${f.id}`))).status).toBe(404)
    expect((await team.sessions.hand.post(team.url('/feeds'), feedBody())).status).toBe(403)
    expect((await team.sessions.hand.delete(team.url(`/feeds/${f.id}`))).status).toBe(403)
    expect((await team.sessions.owner.delete(team.url(`/feeds/${f.id}`))).status).toBe(204)
    expect((await team.sessions.owner.get(team.url(`/feeds/${f.id}`))).status).toBe(404)
  })

  it('when the feeds table is exported, then the CSV has a header and one line per visible feed', async () => {
    const t2 = await makeTeam(t)
    await makeFeed(t2.op, { name: 'Export cube, "special"' })
    const res = await t2.sessions.hand.get(t2.url('/feeds/export.csv'))
    expect(res.status).toBe(200)
    expect(res.headers['content-type']).toContain('text/csv')
    const lines = res.text.trim().split('\n')
    expect(lines[0]).toContain('name,set,kind,dm_pct')
    expect(lines).toHaveLength(1 + readReferenceFeeds().length + 1)
    expect(res.text).toContain('"Export cube, ""special""",own,supplement')
  })
})
