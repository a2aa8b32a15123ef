// Balances API: a run stored as a version (inputs, outputs, who, when) equal to the engine's answer, re-runs with 409 on stale versions, out-of-date marking and one-action re-runs, sheep never offered cattle-only feeds, paging, isolation, roles.
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { startTestApp, type TestApp } from '../../helpers/app'
import { eweBody, labBody, makeFeed, makeForage, makeHerd } from '../../fixtures/nutrition'
import { fieldsOf, makeTeam, type Team } from './setup'
import { aFieldBody } from '../../fixtures/grazing'
import { balanceRation } from '../../../shared/engine/nutrition/ration/balance'
import { pearsonSquare } from '../../../shared/engine/nutrition/pearson'
import { BalanceVersion } from '../../../server/models/nutrition'
import type { Feed } from '../../../server/models/nutrition'

let t: TestApp
let team: Team
let stover: Feed
let cube: Feed
beforeAll(async () => {
  t = await startTestApp()
  team = await makeTeam(t)
  stover = await makeForage(team.op, { name: 'Balance stover', cpPctDm: 5.5, tdnPctDm: 54 })
  cube = await makeFeed(team.op, { name: 'Balance cube 38', cpPctDm: 42, tdnPctDm: 78, dmPct: 90, priceAmount: 420, priceUnit: 'ton' })
})
afterAll(async () => {
  await t.close()
})

async function cowsBalance(name = 'Balance cows') {
  const herd = await makeHerd(team.op, { name, expectedBirthDate: '2027-03-10' })
  const res = await team.sessions.owner.post(team.url('/balances'), { herdId: herd.id, date: '2027-01-20', baseFeeds: [{ feedId: stover.id }], supplementIds: [cube.id] })
  expect(res.status).toBe(201)
  return { herd, res }
}

describe('POST /api/operations/:id/balances', () => {
  it('when an owner runs a balance, then version 1 stores inputs, outputs, who and when, and the stored result equals the engine’s for the same inputs', async () => {
    const { res } = await cowsBalance()
    const b = res.body
    expect(b).toMatchObject({ version: 1, outOfDate: false, herdName: 'Balance cows', date: '2027-01-20' })
    expect(b.latest.createdBy.name).toContain('Test user')
    expect(Date.parse(b.latest.createdAt)).toBeGreaterThan(Date.now() - 60_000)
    const again = await balanceRation(b.latest.inputs.problem)
    expect(b.latest.result).toEqual(JSON.parse(JSON.stringify(again)))
    expect(b.latest.inputs.stage.pregnancyDay).toBe(283 - 49)
  })

  it('when the stover is short of protein, then the cube closes the gap and the intakes obey the Pearson-square mass balance (Montana State Univ. Extension, "Pearson Square Examples")', async () => {
    const { res } = await cowsBalance('Pearson cows')
    const r = res.body.latest.result
    expect(r.status).toBe('covered-with-supplement')
    const cp = r.supply.find((s: { nutrient: string }) => s.nutrient === 'cp')
    expect(cp.pctCovered).toBeGreaterThanOrEqual(99.9)
    const kg = (id: number) => r.intakes.find((i: { feedId: string }) => i.feedId === `feed-${id}`).kgDm
    const total = kg(stover.id) + kg(cube.id)
    const dietCp = (kg(stover.id) * 5.5 + kg(cube.id) * 42) / total
    const { fracB } = pearsonSquare({ a: { cpPct: 5.5 }, b: { cpPct: 42 }, targetCpPct: dietCp })
    expect(kg(cube.id) / total).toBeCloseTo(fracB, 6)
    expect(r.supplements[0]).toMatchObject({ feedId: `feed-${cube.id}` })
    // $420 per short ton as fed at 90 % DM: 420 / 907.18474 kg / 0.90 per kg DM (NIST: 1 lb = 0.45359237 kg).
    expect(r.supplements[0].cost).toBeCloseTo(r.supplements[0].kgDm * (420 / (2000 * 0.45359237) / 0.9), 9)
  })

  it('when a sheep group is offered a cattle-only mineral, then it is left out with the copper reason and never appears in the problem or the diet', async () => {
    const ewes = await makeHerd(team.op, eweBody({ name: 'Balance ewes' }))
    const cattleMineral = await makeFeed(team.op, { name: 'Cattle mineral (test)', kind: 'mineral', dmPct: 98, cpPctDm: 0, tdnPctDm: 0, caPctDm: 14, pPctDm: 7, cuMgPerKgDm: 1500, cattleOnly: true })
    const sheepMineral = await makeFeed(team.op, { name: 'Sheep mineral (test)', kind: 'mineral', dmPct: 98, cpPctDm: 0, tdnPctDm: 0, caPctDm: 14, pPctDm: 7, cuMgPerKgDm: 0 })
    const res = await team.sessions.nutritionist.post(team.url('/balances'), { herdId: ewes.id, date: '2027-02-05', baseFeeds: [{ feedId: stover.id }], supplementIds: [cube.id, cattleMineral.id, sheepMineral.id] })
    expect(res.status).toBe(201)
    const v = res.body.latest
    expect(v.inputs.excluded).toEqual([expect.objectContaining({ feedId: cattleMineral.id, reason: expect.stringContaining('never offered to a sheep group') })])
    expect(v.inputs.problem.feeds.map((f: { id: string }) => f.id)).not.toContain(`feed-${cattleMineral.id}`)
    expect(v.result.intakes.map((i: { feedId: string }) => i.feedId)).not.toContain(`feed-${cattleMineral.id}`)
    expect(v.inputs.stage.sheepStage).toBe('late-gestation')
  })

  it('when inputs are missing or name unknown feeds, then 400 names the fields and nothing is stored', async () => {
    const empty = await team.sessions.owner.post(team.url('/balances'), {})
    expect(empty.status).toBe(400)
    expect(fieldsOf(empty)).toEqual(expect.arrayContaining(['herdId', 'date']))
    const herd = await makeHerd(team.op, { name: 'Unknown-feed cows' })
    const unknown = await team.sessions.owner.post(team.url('/balances'), { herdId: herd.id, date: '2027-01-20', baseFeeds: [{ feedId: 99999999 }] })
    expect(unknown.status).toBe(400)
    expect(fieldsOf(unknown)).toEqual(['baseFeeds.0'])
    const noFeeds = await team.sessions.owner.post(team.url('/balances'), { herdId: herd.id, date: '2027-01-20', baseFeeds: [] })
    expect(fieldsOf(noFeeds)).toEqual(['baseFeeds'])
    const shares = await team.sessions.owner.post(team.url('/balances'), { herdId: herd.id, date: '2027-01-20', baseFeeds: [{ feedId: stover.id, sharePct: 60 }] })
    expect(fieldsOf(shares)).toEqual(['baseFeeds'])
    const list = await team.sessions.owner.get(team.url(`/balances?herdId=${herd.id}`))
    expect(list.body.total).toBe(0)
  })

  it('when a hand runs a balance, then 403; a hand may preview and read', async () => {
    const herd = await makeHerd(team.op, { name: 'Hand cows' })
    const body = { herdId: herd.id, date: '2027-01-20', baseFeeds: [{ feedId: stover.id }], supplementIds: [cube.id] }
    expect((await team.sessions.hand.post(team.url('/balances'), body)).status).toBe(403)
    const preview = await team.sessions.hand.post(team.url('/balances/preview'), body)
    expect(preview.status).toBe(200)
    expect(preview.body.result.status).toBe('covered-with-supplement')
  })
})

describe('re-running balances', () => {
  it('when a lab result of a feed it used is edited, then the balance is out of date with the reason, and one action re-runs it with the new value', async () => {
    const { res } = await cowsBalance('Stale cows')
    const added = await team.sessions.nutritionist.post(team.url('/lab-results'), labBody(stover.id, { cpPct: 5.5, tdnPct: 54, dmPct: 80 }))
    expect(added.body.affectedBalances).toContain(res.body.id)
    const lab = { id: added.body.id as number }
    let got = await team.sessions.owner.get(team.url(`/balances/${res.body.id}`))
    expect(got.body.outOfDate).toBe(true)
    const re1 = await team.sessions.owner.post(team.url('/balances/rerun-out-of-date'), { ids: [res.body.id] })
    expect(re1.body.rerun).toEqual([{ id: res.body.id, version: 2, status: expect.any(String) }])
    const edit = await team.sessions.nutritionist.patch(team.url(`/lab-results/${lab.id}`), { cpPct: 8, version: 1 })
    expect(edit.body.affectedBalances).toContain(res.body.id)
    got = await team.sessions.owner.get(team.url(`/balances/${res.body.id}`))
    expect(got.body).toMatchObject({ outOfDate: true, outOfDateReason: expect.stringContaining('cpPctDm') })
    const re2 = await team.sessions.owner.post(team.url('/balances/rerun-out-of-date'), {})
    expect(re2.body.rerun).toContainEqual({ id: res.body.id, version: 3, status: expect.any(String) })
    got = await team.sessions.owner.get(team.url(`/balances/${res.body.id}`))
    expect(got.body.outOfDate).toBe(false)
    const stoverIn = got.body.latest.inputs.problem.feeds.find((f: { id: string }) => f.id === `feed-${stover.id}`)
    expect(stoverIn.cpPctDm).toBe(8)
    expect(got.body.latest.labResultIds).toEqual([lab.id])
    expect(got.body.versions.map((v: { version: number }) => v.version)).toEqual([3, 2, 1])
    const v1 = await team.sessions.owner.get(team.url(`/balances/${res.body.id}?version=1`))
    expect(v1.body.latest.version).toBe(1)
    expect((await team.sessions.owner.delete(team.url(`/lab-results/${lab.id}`))).status).toBe(204)
    expect((await team.sessions.owner.get(team.url(`/balances/${res.body.id}`))).body.outOfDate).toBe(true)
  })

  it('when two people re-run from the same version, then the second gets 409 with both versions', async () => {
    const { res } = await cowsBalance('Rerun cows')
    const a = await team.sessions.owner.post(team.url(`/balances/${res.body.id}/runs`), { date: '2027-02-01', version: 1 })
    expect(a.status).toBe(201)
    expect(a.body).toMatchObject({ version: 2, date: '2027-02-01' })
    const b = await team.sessions.nutritionist.post(team.url(`/balances/${res.body.id}/runs`), { date: '2027-02-10', version: 1 })
    expect(b.status).toBe(409)
    expect(b.body.error.details.current).toMatchObject({ version: 2 })
    expect(b.body.error.details.submitted).toEqual({ version: 1, changes: { date: '2027-02-10' } })
    expect(await BalanceVersion.count({ where: { balanceId: res.body.id } })).toBe(2)
  })

  it('when renamed with the current version, then the name changes without a new run; a stale one is 409', async () => {
    const { res } = await cowsBalance('Rename cows')
    const ok = await team.sessions.owner.patch(team.url(`/balances/${res.body.id}`), { name: 'Late-gestation plan', version: 1 })
    expect(ok.body).toMatchObject({ name: 'Late-gestation plan', version: 1 })
    await team.sessions.owner.post(team.url(`/balances/${res.body.id}/runs`), { version: 1 })
    expect((await team.sessions.owner.patch(team.url(`/balances/${res.body.id}`), { name: 'x', version: 1 })).status).toBe(409)
  })
})

describe('listing, isolation and deletion', () => {
  it('when listing with paging and the out-of-date filter, then counts and pages agree', async () => {
    const t2 = await makeTeam(t)
    const f = await makeForage(t2.op, { name: 'List stover' })
    const h = await makeHerd(t2.op, { name: 'List cows' })
    for (const d of ['2027-01-01', '2027-01-08', '2027-01-15']) {
      const r = await t2.sessions.owner.post(t2.url('/balances'), { herdId: h.id, date: d, baseFeeds: [{ feedId: f.id }] })
      expect(r.status).toBe(201)
    }
    const p = await t2.sessions.hand.get(t2.url('/balances?pageSize=2&sort=date&dir=asc'))
    expect(p.body.total).toBe(3)
    expect(p.body.items.map((b: { date: string }) => b.date)).toEqual(['2027-01-01', '2027-01-08'])
    expect((await t2.sessions.hand.get(t2.url('/balances?outOfDate=true'))).body.total).toBe(0)
    const csv = await t2.sessions.hand.get(t2.url('/balances/export.csv'))
    expect(csv.text.trim().split('\n')).toHaveLength(4)
  })

  it('when another operation reads, re-runs or deletes a balance, then 404; an owner deletes it', async () => {
    const { res } = await cowsBalance('Isolated cows')
    const id = res.body.id
    expect((await team.sessions.outsider.get(team.otherUrl(`/balances/${id}`))).status).toBe(404)
    expect((await team.sessions.outsider.post(team.otherUrl(`/balances/${id}/runs`), { version: 1 })).status).toBe(404)
    expect((await team.sessions.outsider.get(team.otherUrl(`/balances/${id}/report.pdf`))).status).toBe(404)
    expect((await team.sessions.hand.delete(team.url(`/balances/${id}`))).status).toBe(403)
    expect((await team.sessions.owner.delete(team.url(`/balances/${id}`))).status).toBe(204)
    expect((await team.sessions.owner.get(team.url(`/balances/${id}`))).status).toBe(404)
  })
})

describe('balances on a field', () => {
  it('when a group balances on a field, then the field’s components are the base feeds; a new sample of a component marks the balance and the re-run uses it', async () => {
    const created = await team.sessions.owner.post(team.url('/fields'), aFieldBody())
    expect(created.status).toBe(201)
    const fieldId = created.body.id as number
    const herd = await makeHerd(team.op, { name: 'Field cows' })
    const res = await team.sessions.owner.post(team.url('/balances'), { herdId: herd.id, date: '2027-01-20', fieldId, supplementIds: [cube.id] })
    expect(res.status).toBe(201)
    const feeds = res.body.latest.inputs.problem.feeds.filter((f: { role: string }) => f.role === 'field')
    expect(feeds.map((f: { id: string }) => f.id).sort()).toEqual([`field-${fieldId}-legume-forage`, `field-${fieldId}-sorghum-grain`, `field-${fieldId}-sorghum-stover`])
    const offered = res.body.latest.inputs.problem.fieldOffer.reduce((a: number, o: { shareOfDm: number }) => a + o.shareOfDm, 0)
    expect(offered).toBeCloseTo(1, 9)

    const lab = await team.sessions.nutritionist.post(team.url('/lab-results'), { fieldId, component: 'legume-forage', sampleDate: '2027-01-20', labName: 'Test Feed Lab', basis: 'dm', dmPct: 70, cpPct: 21, tdnPct: 60 })
    expect(lab.status).toBe(201)
    expect(lab.body.affectedBalances).toContain(res.body.id)
    const comps = await team.sessions.owner.get(team.url(`/fields/${fieldId}/components`))
    const legume = (comps.body.items ?? comps.body).find((c: { kind: string }) => c.kind === 'legume-forage')
    expect(legume.labResultId).toBe(lab.body.id)
    const re = await team.sessions.owner.post(team.url('/balances/rerun-out-of-date'), { ids: [res.body.id] })
    expect(re.body.rerun).toEqual([{ id: res.body.id, version: 2, status: expect.any(String) }])
    const got = await team.sessions.owner.get(team.url(`/balances/${res.body.id}`))
    const legumeFeed = got.body.latest.inputs.problem.feeds.find((f: { id: string }) => f.id === `field-${fieldId}-legume-forage`)
    expect(legumeFeed.cpPctDm).toBeCloseTo(21, 6)
    expect(got.body.latest.labResultIds).toContain(lab.body.id)
  })
})
