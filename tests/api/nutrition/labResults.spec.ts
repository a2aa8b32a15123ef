// Lab results API: entry on either basis (stored on DM), TDN from ADF, nitrate forms, history and 409 on concurrent edits, paging, isolation, roles.
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { startTestApp, type TestApp } from '../../helpers/app'
import { labBody, makeFeed, makeLabResult } from '../../fixtures/nutrition'
import { fieldsOf, makeTeam, type Team } from './setup'
import { LabResult, LabResultHistory } from '../../../server/models/nutrition'
import type { Feed } from '../../../server/models/nutrition'

let t: TestApp
let team: Team
let hay: Feed
beforeAll(async () => {
  t = await startTestApp()
  team = await makeTeam(t)
  hay = await makeFeed(team.op, { name: 'Lab test hay', kind: 'forage', dmPct: 88, cpPctDm: 9, tdnPctDm: 55 })
})
afterAll(async () => {
  await t.close()
})

describe('POST /api/operations/:id/lab-results', () => {
  it('when values are entered as fed, then they are stored on a DM basis: % DM = % as fed ÷ DM fraction (NRC 1985 sheep Table 1 footnote rule)', async () => {
    const res = await team.sessions.nutritionist.post(team.url('/lab-results'), labBody(hay.id, { basis: 'as-fed', dmPct: 80, cpPct: 8, tdnPct: 44, caPct: 0.4 }))
    expect(res.status).toBe(201)
    expect(res.body).toMatchObject({ enteredBasis: 'as-fed', dmPct: 80, version: 1, tdnEstimated: false })
    expect(res.body.cpPctDm).toBeCloseTo(10, 10)
    expect(res.body.tdnPctDm).toBeCloseTo(55, 10)
    expect(res.body.caPctDm).toBeCloseTo(0.5, 10)
  })

  it('when TDN is missing, then it is estimated from ADF by 88.9 − 0.779 × ADF (forage-testing shortcut; common practice, from memory)', async () => {
    const res = await team.sessions.owner.post(team.url('/lab-results'), labBody(hay.id, { tdnPct: null, adfPct: 40 }))
    expect(res.status).toBe(201)
    expect(res.body.tdnEstimated).toBe(true)
    expect(res.body.tdnPctDm).toBeCloseTo(88.9 - 0.779 * 40, 10)
  })

  it('when nitrate is reported as NO3, then it is stored as NO3-N using NO3 = 4.427 × NO3-N (molar masses 62.004 / 14.007, IUPAC atomic weights)', async () => {
    const res = await team.sessions.owner.post(team.url('/lab-results'), labBody(hay.id, { nitratePpm: 4427, nitrateForm: 'NO3' }))
    expect(res.status).toBe(201)
    expect(res.body.nitrateNPpmDm).toBeCloseTo(4427 / (62.004 / 14.007), 6)
    expect(res.body.nitrateNPpmDm).toBeCloseTo(1000, 0)
  })

  it('when required values are missing or out of range, then 400 names each field and nothing is written', async () => {
    const before = await LabResult.count({ where: { operationId: team.op.id } })
    const res = await team.sessions.owner.post(team.url('/lab-results'), { feedId: hay.id, sampleDate: 'yesterday', labName: '', dmPct: 120, cpPct: null, nitratePpm: 500 })
    expect(res.status).toBe(400)
    expect(fieldsOf(res)).toEqual(expect.arrayContaining(['sampleDate', 'labName', 'dmPct', 'cpPct', 'tdnPct', 'nitrateForm']))
    expect(await LabResult.count({ where: { operationId: team.op.id } })).toBe(before)
  })

  it('when the feed belongs to another operation, then 400 names feedId', async () => {
    const foreign = await makeFeed(team.other, { name: 'Foreign hay' })
    const res = await team.sessions.owner.post(team.url('/lab-results'), labBody(foreign.id))
    expect(res.status).toBe(400)
    expect(fieldsOf(res)).toEqual(['feedId'])
  })

  it('when a hand posts a result, then 403', async () => {
    expect((await team.sessions.hand.post(team.url('/lab-results'), labBody(hay.id))).status).toBe(403)
  })
})

describe('PATCH /api/operations/:id/lab-results/:labResultId', () => {
  it('when a nutritionist corrects a value, then the version rises and the history keeps who, when and old → new', async () => {
    const r = await makeLabResult(team.op, hay, { cpPct: 9, tdnPct: 55 })
    const res = await team.sessions.nutritionist.patch(team.url(`/lab-results/${r.id}`), { cpPct: 9.6, version: 1 })
    expect(res.status).toBe(200)
    expect(res.body).toMatchObject({ version: 2, cpPctDm: 9.6, tdnPctDm: 55 })
    expect(res.body.history).toHaveLength(1)
    expect(res.body.history[0]).toMatchObject({ version: 2, by: { name: expect.stringContaining('Test user') }, changes: [{ field: 'cpPctDm', from: 9, to: 9.6 }] })
    const got = await team.sessions.hand.get(team.url(`/lab-results/${r.id}`))
    expect(got.body.history[0].changes).toEqual([{ field: 'cpPctDm', from: 9, to: 9.6 }])
  })

  it('when two people edit the same result from version 1, then the second gets 409 with both versions and nothing is overwritten', async () => {
    const r = await makeLabResult(team.op, hay, { cpPct: 9 })
    const first = await team.sessions.owner.patch(team.url(`/lab-results/${r.id}`), { cpPct: 10, version: 1 })
    expect(first.status).toBe(200)
    const second = await team.sessions.nutritionist.patch(team.url(`/lab-results/${r.id}`), { cpPct: 11, version: 1 })
    expect(second.status).toBe(409)
    expect(second.body.error.details.current).toMatchObject({ id: r.id, version: 2, cpPctDm: 10 })
    expect(second.body.error.details.submitted).toEqual({ version: 1, changes: { cpPct: 11 } })
    const now = await LabResult.findByPk(r.id)
    expect(now!.cpPctDm).toBe(10)
    expect(await LabResultHistory.count({ where: { labResultId: r.id } })).toBe(1)
  })

  it('when an edit gives as-fed values, then untouched values keep their meaning and changed ones are converted to DM', async () => {
    const r = await makeLabResult(team.op, hay, { dmPct: 80, cpPct: 10, tdnPct: 55 })
    const res = await team.sessions.owner.patch(team.url(`/lab-results/${r.id}`), { basis: 'as-fed', cpPct: 9.6, version: 1 })
    expect(res.status).toBe(200)
    expect(res.body.cpPctDm).toBeCloseTo(12, 10)
    expect(res.body.tdnPctDm).toBeCloseTo(55, 10)
  })

  it('when an edit breaks a rule, then 400 names the field and the stored version is unchanged', async () => {
    const r = await makeLabResult(team.op, hay)
    const res = await team.sessions.owner.patch(team.url(`/lab-results/${r.id}`), { dmPct: -3, version: 1 })
    expect(res.status).toBe(400)
    expect(fieldsOf(res)).toEqual(['dmPct'])
    expect((await LabResult.findByPk(r.id))!.version).toBe(1)
  })

  it('when the version is missing, then 400 names version', async () => {
    const r = await makeLabResult(team.op, hay)
    const res = await team.sessions.owner.patch(team.url(`/lab-results/${r.id}`), { cpPct: 12 })
    expect(fieldsOf(res)).toEqual(['version'])
  })

  it('when a hand edits, then 403; another operation gets 404', async () => {
    const r = await makeLabResult(team.op, hay)
    expect((await team.sessions.hand.patch(team.url(`/lab-results/${r.id}`), { cpPct: 12, version: 1 })).status).toBe(403)
    expect((await team.sessions.outsider.patch(team.otherUrl(`/lab-results/${r.id}`), { cpPct: 12, version: 1 })).status).toBe(404)
    expect((await team.sessions.outsider.get(team.otherUrl(`/lab-results/${r.id}`))).status).toBe(404)
  })
})

describe('GET and DELETE lab results', () => {
  it('when listing by feed with paging, then pages are consistent and newest sample first on request', async () => {
    const t2 = await makeTeam(t)
    const f = await makeFeed(t2.op, { name: 'Paged hay', kind: 'forage' })
    for (const d of ['2026-10-01', '2026-10-15', '2026-11-01']) await makeLabResult(t2.op, f, { sampleDate: d })
    const res = await t2.sessions.hand.get(t2.url(`/lab-results?feedId=${f.id}&pageSize=2&sort=sampleDate&dir=desc`))
    expect(res.body.total).toBe(3)
    expect(res.body.items.map((r: { sampleDate: string }) => r.sampleDate)).toEqual(['2026-11-01', '2026-10-15'])
    expect(res.body.items[0].feedName).toBe('Paged hay')
  })

  it('when an owner deletes a result, then it and its history are gone', async () => {
    const r = await makeLabResult(team.op, hay)
    await team.sessions.owner.patch(team.url(`/lab-results/${r.id}`), { cpPct: 12, version: 1 })
    expect((await team.sessions.owner.delete(team.url(`/lab-results/${r.id}`))).status).toBe(204)
    expect((await team.sessions.owner.get(team.url(`/lab-results/${r.id}`))).status).toBe(404)
    expect(await LabResultHistory.count({ where: { labResultId: r.id } })).toBe(0)
  })

  it('when exported, then the CSV lists the operation’s results on a DM basis', async () => {
    const t2 = await makeTeam(t)
    const f = await makeFeed(t2.op, { name: 'Exported hay', kind: 'forage' })
    await makeLabResult(t2.op, f, { basis: 'as-fed', dmPct: 50, cpPct: 5, tdnPct: 30 })
    const res = await t2.sessions.owner.get(t2.url('/lab-results/export.csv'))
    const [header, line] = res.text.trim().split('\n')
    expect(header.split(',')).toContain('cp_pct_dm')
    expect(line).toContain('Exported hay')
    expect(line.split(',')[header.split(',').indexOf('cp_pct_dm')]).toBe('10')
  })
})
