// Lab CSV upload API: a row-by-row preview (accepted / refused with reasons), only confirmed rows written in one transaction, nothing on a mid-file failure, and a 5,000-row file that leaves the server answering.
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { startTestApp, type TestApp } from '../../helpers/app'
import { labCsv, makeFeed, makeForage, makeHerd } from '../../fixtures/nutrition'
import { fieldsOf, makeTeam, type Team } from './setup'
import type { Session } from '../../fixtures/builders'
import { Balance, LabResult } from '../../../server/models/nutrition'
import { createBalance } from '../../../server/services/nutrition/balances'
import { User } from '../../../server/models/index'

let t: TestApp
let team: Team
beforeAll(async () => {
  t = await startTestApp()
  team = await makeTeam(t)
})
afterAll(async () => {
  await t.close()
})

function upload(s: Session, url: string, csv: string, filename = 'lab.csv') {
  return s.agent.post(url).set('X-CSRF-Token', s.csrf).attach('file', Buffer.from(csv), { filename, contentType: 'text/csv' })
}

async function until(s: Session, url: string, done: (b: { status: string }) => boolean, timeoutMs = 20_000) {
  const end = Date.now() + timeoutMs
  for (;;) {
    const r = await s.get(url)
    if (done(r.body)) return r.body
    if (Date.now() > end) throw new Error(`upload still ${r.body.status}`)
    await new Promise((res) => setTimeout(res, 50))
  }
}

describe('POST /api/operations/:id/lab-results/uploads', () => {
  it('when a file has two bad rows, then the preview refuses them with reasons naming the column, accepts the rest, and writes nothing until confirmed', async () => {
    const hay = await makeFeed(team.op, { name: 'Upload hay', kind: 'forage' })
    const csv = labCsv([
      { feed: 'Upload hay', sample_date: '2026-11-01', lab: 'Test Feed Lab', sample_ref: 'A1', basis: 'dm', dm: 85, cp: 9.5, tdn: 56 },
      { feed: 'No such hay', sample_date: '2026-11-01', lab: 'Test Feed Lab', sample_ref: 'A2', basis: 'dm', dm: 85, cp: 9, tdn: 55 },
      { feed: 'Upload hay', sample_date: '2026-11-02', lab: 'Test Feed Lab', sample_ref: 'A3', basis: 'as fed', dm: 'abc', cp: 9, tdn: 55 },
      { feed: 'Upload hay', sample_date: '2026-11-03', lab: 'Test Feed Lab', sample_ref: 'A4', basis: 'as fed', dm: 80, cp: 8, adf: 40 },
    ])
    const res = await upload(team.sessions.nutritionist, team.url('/lab-results/uploads'), csv)
    expect(res.status).toBe(202)
    const url = team.url(`/lab-results/uploads/${res.body.id}?rows=1`)
    const ready = await until(team.sessions.nutritionist, url, (b) => b.status !== 'parsing')
    expect(ready).toMatchObject({ status: 'ready', total: 4, accepted: 2, refused: 2, acceptedLines: [2, 5] })
    const refused = (ready as unknown as { rows: { line: number; status: string; reasons: { field: string; message: string }[] }[] }).rows.filter((r) => r.status === 'refused')
    expect(refused.map((r) => r.line)).toEqual([3, 4])
    expect(refused[0].reasons).toEqual([{ field: 'feed', message: 'No feed named "No such hay" in this operation or the reference set.' }])
    expect(refused[1].reasons.map((r) => r.field)).toContain('dm')
    expect(await LabResult.count({ where: { feedId: hay.id } })).toBe(0)

    const ok = await team.sessions.nutritionist.post(team.url(`/lab-results/uploads/${res.body.id}/confirm`), { lines: [2, 5] })
    expect(ok.status).toBe(200)
    expect(ok.body.createdIds).toHaveLength(2)
    const saved = await LabResult.findAll({ where: { feedId: hay.id }, order: [['sampleDate', 'ASC']] })
    expect(saved.map((r) => r.sampleRef)).toEqual(['A1', 'A4'])
    // The as-fed row was converted to DM, TDN estimated from ADF (88.9 − 0.779 × ADF, common practice).
    expect(saved[1].cpPctDm).toBeCloseTo(10, 10)
    expect(saved[1].tdnEstimated).toBe(true)
    expect(saved[1].tdnPctDm).toBeCloseTo(88.9 - 0.779 * 50, 10)

    const again = await team.sessions.nutritionist.post(team.url(`/lab-results/uploads/${res.body.id}/confirm`), { lines: [2] })
    expect(again.status).toBe(409)
  })

  it('when the confirmation lists a refused line, then 400 names lines and nothing is written', async () => {
    await makeFeed(team.op, { name: 'Refused hay', kind: 'forage' })
    const csv = labCsv([
      { feed: 'Refused hay', sample_date: '2026-11-01', lab: 'Test Feed Lab', dm: 85, cp: 9, tdn: 55 },
      { feed: 'Refused hay', sample_date: '2026-13-01', lab: 'Test Feed Lab', dm: 85, cp: 9, tdn: 55 },
    ])
    const res = await upload(team.sessions.owner, team.url('/lab-results/uploads'), csv)
    await until(team.sessions.owner, team.url(`/lab-results/uploads/${res.body.id}`), (b) => b.status !== 'parsing')
    const bad = await team.sessions.owner.post(team.url(`/lab-results/uploads/${res.body.id}/confirm`), { lines: [2, 3] })
    expect(bad.status).toBe(400)
    expect(fieldsOf(bad)).toEqual(['lines'])
    expect(await LabResult.count({ where: { uploadId: res.body.id } })).toBe(0)
  })

  it('when a feed is deleted between preview and confirm, then saving fails part-way through the file and writes nothing at all', async () => {
    const keep = await makeFeed(team.op, { name: 'Kept hay', kind: 'forage' })
    const gone = await makeFeed(team.op, { name: 'Gone hay', kind: 'forage' })
    const rows = Array.from({ length: 1200 }, (_, i) => ({ feed: i < 1100 ? 'Kept hay' : 'Gone hay', sample_date: '2026-11-01', lab: 'Test Feed Lab', sample_ref: `S${i}`, dm: 85, cp: 9, tdn: 55 }))
    const res = await upload(team.sessions.owner, team.url('/lab-results/uploads'), labCsv(rows))
    const ready = await until(team.sessions.owner, team.url(`/lab-results/uploads/${res.body.id}?rows=1&pageSize=1`), (b) => b.status !== 'parsing')
    expect(ready).toMatchObject({ status: 'ready', accepted: 1200 })
    await gone.destroy()
    const lines = (ready as unknown as { acceptedLines: number[] }).acceptedLines
    const res2 = await team.sessions.owner.post(team.url(`/lab-results/uploads/${res.body.id}/confirm`), { lines })
    expect(res2.status).toBe(409)
    expect(res2.body.error.code).toBe('upload_failed')
    expect(res2.body.error.message).toContain('Nothing was saved')
    expect(await LabResult.count({ where: { feedId: keep.id } })).toBe(0)
    expect(await LabResult.count({ where: { uploadId: res.body.id } })).toBe(0)
  })

  it('when a 5,000-row file is checked, then the server keeps answering other requests while progress climbs', async () => {
    await makeFeed(team.op, { name: 'Bulk hay', kind: 'forage' })
    const rows = Array.from({ length: 5000 }, (_, i) => ({ feed: 'Bulk hay', sample_date: '2026-11-01', lab: 'Test Feed Lab', sample_ref: `B${i}`, basis: i % 2 ? 'dm' : 'as-fed', dm: 85, cp: 9 + (i % 5) / 10, tdn: 40, adf: 35, ndf: 60 }))
    const s = team.sessions.owner
    const res = await upload(s, team.url('/lab-results/uploads'), labCsv(rows))
    expect(res.status).toBe(202)
    const seen: { processed: number; total: number; status: string }[] = []
    const latencies: number[] = []
    for (;;) {
      const t0 = performance.now()
      const other = await s.get(team.url('/herds?pageSize=1'))
      latencies.push(performance.now() - t0)
      expect(other.status).toBe(200)
      const p = await s.get(team.url(`/lab-results/uploads/${res.body.id}`))
      seen.push({ processed: p.body.processed, total: p.body.total, status: p.body.status })
      if (p.body.status !== 'parsing') break
    }
    const final = seen[seen.length - 1]
    expect(final).toMatchObject({ status: 'ready', processed: 5000, total: 5000 })
    // Other requests were answered while the file was still being checked, with progress part-way.
    expect(seen.some((x) => x.status === 'parsing' && x.processed > 0 && x.processed < 5000)).toBe(true)
    expect(Math.max(...latencies)).toBeLessThan(1000)
    const preview = await s.get(team.url(`/lab-results/uploads/${res.body.id}?rows=1&pageSize=3`))
    expect(preview.body).toMatchObject({ accepted: 5000, refused: 0, rowsTotal: 5000 })
    expect(preview.body.rows).toHaveLength(3)
  })

  it('when the header lacks required columns, then the upload fails with a message naming them', async () => {
    const res = await upload(team.sessions.owner, team.url('/lab-results/uploads'), 'feed,lab,colour\nA,B,C\n')
    const done = await until(team.sessions.owner, team.url(`/lab-results/uploads/${res.body.id}`), (b) => b.status !== 'parsing')
    expect(done.status).toBe('failed')
    expect((done as unknown as { error: string }).error).toMatch(/missing columns sample_date, dm, cp, tdn or adf and unknown column colour/)
  })

  it('when no file, a non-CSV name, or a file over the size limit is sent, then 400 or 413 naming file', async () => {
    const none = await team.sessions.owner.post(team.url('/lab-results/uploads'), {})
    expect(none.status).toBe(400)
    expect(fieldsOf(none)).toEqual(['file'])
    const pdf = await upload(team.sessions.owner, team.url('/lab-results/uploads'), 'x', 'lab.pdf')
    expect(pdf.status).toBe(400)
    const big = await upload(team.sessions.owner, team.url('/lab-results/uploads'), 'a'.repeat(5 * 1024 * 1024 + 10))
    expect(big.status).toBe(413)
  })

  it('when a hand uploads, then 403; another operation cannot read the preview', async () => {
    const res = await upload(team.sessions.hand, team.url('/lab-results/uploads'), labCsv([]))
    expect(res.status).toBe(403)
    const mine = await upload(team.sessions.owner, team.url('/lab-results/uploads'), labCsv([]))
    expect((await team.sessions.outsider.get(team.otherUrl(`/lab-results/uploads/${mine.body.id}`))).status).toBe(404)
    await until(team.sessions.owner, team.url(`/lab-results/uploads/${mine.body.id}`), (b) => b.status !== 'parsing')
  })

  it('when confirmed rows are for a feed a balance uses, then that balance is marked out of date', async () => {
    const feed = await makeForage(team.op, { name: 'Balanced stover' })
    const herd = await makeHerd(team.op, { name: 'Upload-affected cows' })
    const owner = (await User.findByPk(team.owner.id))!
    const b = await createBalance(t.sequelize, team.op.id, owner, { herdId: herd.id, date: '2027-01-15', baseFeeds: [{ feedId: feed.id }], supplementIds: [] })
    expect(b.outOfDate).toBe(false)
    const res = await upload(team.sessions.owner, team.url('/lab-results/uploads'), labCsv([{ feed: 'Balanced stover', sample_date: '2026-12-01', lab: 'Test Feed Lab', dm: 82, cp: 5, tdn: 50 }]))
    await until(team.sessions.owner, team.url(`/lab-results/uploads/${res.body.id}`), (x) => x.status !== 'parsing')
    const ok = await team.sessions.owner.post(team.url(`/lab-results/uploads/${res.body.id}/confirm`), { lines: [2] })
    expect(ok.body.affectedBalances).toEqual([b.id])
    expect((await Balance.findByPk(b.id))!.outOfDate).toBe(true)
  })
})
