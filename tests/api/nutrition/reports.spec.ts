// Reports API: a balance's PDF carries the operation, group, need against supply, the plan, cautions and the guide footer; e-mail reaches members and client addresses with the PDF attached.
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { startTestApp, type TestApp } from '../../helpers/app'
import { eweBody, makeFeed, makeForage, makeHerd } from '../../fixtures/nutrition'
import { fieldsOf, makeTeam, type Team } from './setup'
import { pdfText } from './pdfText'
import { Membership } from '../../../server/models/index'
import { REPORT_FOOTER } from '../../../shared/schemas/nutrition/balances'

let t: TestApp
let team: Team
let balanceId: number
let sheepBalanceId: number
beforeAll(async () => {
  t = await startTestApp()
  team = await makeTeam(t)
  const stover = await makeForage(team.op, { name: 'Report stover', cpPctDm: 5.5, tdnPctDm: 54 })
  const cube = await makeFeed(team.op, { name: 'Report cube', cpPctDm: 40, tdnPctDm: 76 })
  const herd = await makeHerd(team.op, { name: 'Report cows', headCount: 60 })
  const res = await team.sessions.owner.post(team.url('/balances'), { herdId: herd.id, date: '2027-01-20', baseFeeds: [{ feedId: stover.id }], supplementIds: [cube.id] })
  balanceId = res.body.id
  const ewes = await makeHerd(team.op, eweBody({ name: 'Report ewes' }))
  const s = await team.sessions.owner.post(team.url('/balances'), { herdId: ewes.id, date: '2027-02-05', baseFeeds: [{ feedId: stover.id }], supplementIds: [cube.id] })
  sheepBalanceId = s.body.id
})
afterAll(async () => {
  await t.close()
})

const binary = (res: import('supertest').Response, cb: (err: Error | null, body: Buffer) => void) => {
  const chunks: Buffer[] = []
  res.on('data', (c: Buffer) => chunks.push(c))
  res.on('end', () => cb(null, Buffer.concat(chunks)))
}

describe('GET /api/operations/:id/balances/:balanceId/report.pdf', () => {
  it('when a hand downloads the report, then it is a PDF naming the operation, the group, the plan and the footer that it is a guide to be checked', async () => {
    const res = await team.sessions.hand.get(team.url(`/balances/${balanceId}/report.pdf?units=us`)).buffer(true).parse(binary)
    expect(res.status).toBe(200)
    expect(res.headers['content-type']).toBe('application/pdf')
    const pdf = res.body as Buffer
    expect(pdf.subarray(0, 5).toString()).toBe('%PDF-')
    const text = pdfText(pdf)
    expect(text).toContain(team.op.name)
    expect(text).toContain('Report cows')
    expect(text).toContain('Need against supply')
    expect(text).toContain('Supplement plan')
    expect(text).toContain('Report cube')
    expect(text).toContain('lb as fed per head per day')
    expect(text).toContain('checked by a nutritionist or veterinarian')
    expect(REPORT_FOOTER).toContain('checked by a nutritionist or veterinarian')
  })

  it('when the metric report is asked for, then masses are in kg', async () => {
    const res = await team.sessions.owner.get(team.url(`/balances/${balanceId}/report.pdf?units=metric`)).buffer(true).parse(binary)
    const text = pdfText(res.body as Buffer)
    expect(text).toContain('kg as fed per head per day')
    expect(text).not.toContain('lb as fed per head per day')
  })

  it('when the group is sheep, then the report carries the copper caution and the veterinarian-first note', async () => {
    const res = await team.sessions.owner.get(team.url(`/balances/${sheepBalanceId}/report.pdf`)).buffer(true).parse(binary)
    const text = pdfText(res.body as Buffer)
    expect(text).toContain('Copper and sheep')
    expect(text).toContain('A veterinarian, a licensed nutritionist and local regulations come first.')
  })
})

describe('POST /api/operations/:id/balances/:balanceId/email', () => {
  it('when a nutritionist e-mails a member and a client address, then both receive the message with the PDF attached and the send is logged', async () => {
    const handMember = await Membership.findOne({ where: { operationId: team.op.id, role: 'hand' }, include: ['user'] })
    const handEmail = (handMember as unknown as { user: { email: string } }).user.email
    const client = `client-${Date.now()}@example.test`
    const res = await team.sessions.nutritionist.post(team.url(`/balances/${balanceId}/email`), { memberIds: [handMember!.id], emails: [client], message: 'Plan for the late-gestation cows.' })
    expect(res.status).toBe(201)
    expect(res.body.to).toEqual([handEmail, client])
    for (const to of [client, handEmail]) {
      const mail = await t.sink.waitFor(to)
      expect(mail.subject).toContain('Report cows')
      expect(mail.text).toContain('Plan for the late-gestation cows.')
      expect(mail.text).toContain('checked by a nutritionist or veterinarian')
      expect(mail.attachments).toEqual([expect.objectContaining({ contentType: 'application/pdf', filename: expect.stringMatching(/\.pdf$/) })])
      expect(mail.attachments[0].size).toBeGreaterThan(1000)
    }
    const log = await team.sessions.hand.get(team.url('/report-sends'))
    expect(log.body.items[0]).toMatchObject({ balanceId, recipients: [handEmail, client] })
  })

  it('when no recipient, a bad address or a member of another operation is given, then 400 names the field', async () => {
    const none = await team.sessions.owner.post(team.url(`/balances/${balanceId}/email`), {})
    expect(fieldsOf(none)).toEqual(['emails'])
    const bad = await team.sessions.owner.post(team.url(`/balances/${balanceId}/email`), { emails: ['not-an-address'] })
    expect(fieldsOf(bad)).toEqual(['emails.0'])
    const foreign = await Membership.findOne({ where: { operationId: team.other.id } })
    const other = await team.sessions.owner.post(team.url(`/balances/${balanceId}/email`), { memberIds: [foreign!.id] })
    expect(fieldsOf(other)).toEqual(['memberIds.0'])
  })

  it('when a hand tries to send, then 403; another operation gets 404', async () => {
    expect((await team.sessions.hand.post(team.url(`/balances/${balanceId}/email`), { emails: ['x@example.test'] })).status).toBe(403)
    expect((await team.sessions.outsider.post(team.otherUrl(`/balances/${balanceId}/email`), { emails: ['x@example.test'] })).status).toBe(404)
  })
})
