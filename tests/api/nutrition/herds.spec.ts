// Herd groups API: create, read, update with a version (409 on a stale one), delete, paged lists, field-named validation, operation isolation and roles.
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { startTestApp, type TestApp } from '../../helpers/app'
import { cowBody, eweBody, makeHerd } from '../../fixtures/nutrition'
import { fieldsOf, makeTeam, type Team } from './setup'
import { addDays } from '../../../shared/schemas/nutrition/herds'
import { cattleRequirements } from '../../../shared/engine/nutrition/cattle'

let t: TestApp
let team: Team
beforeAll(async () => {
  t = await startTestApp()
  team = await makeTeam(t)
})
afterAll(async () => {
  await t.close()
})

describe('POST /api/operations/:id/herds', () => {
  it('when a nutritionist creates a group, then it is stored in SI and read back with version 1', async () => {
    const res = await team.sessions.nutritionist.post(team.url('/herds'), cowBody({ name: 'Created cows' }))
    expect(res.status).toBe(201)
    expect(res.body).toMatchObject({ name: 'Created cows', species: 'cattle', bodyWeightKg: 544, version: 1, operationId: team.op.id })
    const got = await team.sessions.hand.get(team.url(`/herds/${res.body.id}`))
    expect(got.status).toBe(200)
    expect(got.body.name).toBe('Created cows')
  })

  it('when the body is empty, then 400 names each missing field', async () => {
    const res = await team.sessions.owner.post(team.url('/herds'), {})
    expect(res.status).toBe(400)
    expect(fieldsOf(res)).toEqual(expect.arrayContaining(['name', 'species', 'class', 'headCount', 'bodyWeightKg', 'bcs']))
  })

  it('when a sheep group has a cattle class and a body condition of 7, then 400 names class and bcs', async () => {
    const res = await team.sessions.owner.post(team.url('/herds'), eweBody({ class: 'cow', bcs: 7 }))
    expect(res.status).toBe(400)
    expect(fieldsOf(res)).toEqual(expect.arrayContaining(['class', 'bcs']))
  })

  it('when a head count is fractional or a date is not a date, then 400 names them and nothing is written', async () => {
    const before = (await team.sessions.owner.get(team.url('/herds?pageSize=500'))).body.total
    const res = await team.sessions.owner.post(team.url('/herds'), cowBody({ headCount: 10.5, expectedBirthDate: '2027-02-30' }))
    expect(res.status).toBe(400)
    expect(fieldsOf(res)).toEqual(expect.arrayContaining(['headCount', 'expectedBirthDate']))
    expect((await team.sessions.owner.get(team.url('/herds?pageSize=500'))).body.total).toBe(before)
  })

  it('when a hand tries to create a group, then 403', async () => {
    const res = await team.sessions.hand.post(team.url('/herds'), cowBody())
    expect(res.status).toBe(403)
    expect(res.body.error.code).toBe('forbidden')
  })
})

describe('GET /api/operations/:id/herds', () => {
  it('when listing with pageSize 2 and sort by head count descending, then pages hold 2 and 1 rows in that order', async () => {
    const t2 = await makeTeam(t)
    for (const n of [10, 30, 20]) await makeHerd(t2.op, { name: `Group ${n}`, headCount: n })
    const p1 = await t2.sessions.owner.get(t2.url('/herds?pageSize=2&sort=headCount&dir=desc'))
    expect(p1.body.total).toBe(3)
    expect(p1.body.items.map((h: { headCount: number }) => h.headCount)).toEqual([30, 20])
    const p2 = await t2.sessions.owner.get(t2.url('/herds?pageSize=2&page=2&sort=headCount&dir=desc'))
    expect(p2.body.items.map((h: { headCount: number }) => h.headCount)).toEqual([10])
    const filtered = await t2.sessions.owner.get(t2.url('/herds?q=group 2'))
    expect(filtered.body.items.map((h: { name: string }) => h.name)).toEqual(['Group 20'])
  })

  it('when the page size is out of range, then 400 names pageSize', async () => {
    const res = await team.sessions.owner.get(team.url('/herds?pageSize=5000'))
    expect(res.status).toBe(400)
    expect(fieldsOf(res)).toContain('pageSize')
  })

  it('when another operation asks for this group, then 404', async () => {
    const h = await makeHerd(team.op, { name: 'Private cows' })
    const res = await team.sessions.outsider.get(team.otherUrl(`/herds/${h.id}`))
    expect(res.status).toBe(404)
    expect(res.body.error.message).toBe('Herd group not found.')
    const patch = await team.sessions.outsider.patch(team.otherUrl(`/herds/${h.id}`), { name: 'Taken', version: 1 })
    expect(patch.status).toBe(404)
  })
})

describe('PATCH /api/operations/:id/herds/:herdId', () => {
  it('when two people edit from the same version, then the second gets 409 with both versions and the first edit stands', async () => {
    const h = await makeHerd(team.op, { name: 'Contested cows', headCount: 40 })
    const a = await team.sessions.owner.patch(team.url(`/herds/${h.id}`), { headCount: 42, version: 1 })
    expect(a.status).toBe(200)
    expect(a.body).toMatchObject({ headCount: 42, version: 2 })
    const b = await team.sessions.nutritionist.patch(team.url(`/herds/${h.id}`), { headCount: 45, version: 1 })
    expect(b.status).toBe(409)
    expect(b.body.error.details.current).toMatchObject({ headCount: 42, version: 2 })
    expect(b.body.error.details.submitted).toEqual({ version: 1, changes: { headCount: 45 } })
    expect((await team.sessions.owner.get(team.url(`/herds/${h.id}`))).body.headCount).toBe(42)
  })

  it('when only the name is sent, then the other fields (defaults included) keep their stored values', async () => {
    const h = await makeHerd(team.op, { name: 'Dry-lot cows', grazing: false })
    const res = await team.sessions.owner.patch(team.url(`/herds/${h.id}`), { name: 'Renamed cows', version: 1 })
    expect(res.status).toBe(200)
    expect(res.body).toMatchObject({ name: 'Renamed cows', grazing: false, headCount: 40 })
  })

  it('when the merged group breaks a rule, then 400 names the field and nothing changes', async () => {
    const h = await makeHerd(team.op, { name: 'Rule cows' })
    const res = await team.sessions.owner.patch(team.url(`/herds/${h.id}`), { species: 'sheep', version: 1 })
    expect(res.status).toBe(400)
    expect(fieldsOf(res)).toContain('class')
    expect((await team.sessions.owner.get(team.url(`/herds/${h.id}`))).body).toMatchObject({ species: 'cattle', version: 1 })
  })
})

describe('DELETE /api/operations/:id/herds/:herdId', () => {
  it('when an owner deletes a group, then it is gone; a hand cannot delete', async () => {
    const h = await makeHerd(team.op, { name: 'Sold cows' })
    expect((await team.sessions.hand.delete(team.url(`/herds/${h.id}`))).status).toBe(403)
    expect((await team.sessions.owner.delete(team.url(`/herds/${h.id}`))).status).toBe(204)
    expect((await team.sessions.owner.get(team.url(`/herds/${h.id}`))).status).toBe(404)
  })
})

describe('GET /api/operations/:id/herds/:herdId/requirements', () => {
  it('when a group calving on 10 March is asked about 93 days before, then it is on day 190 and pregnancy NEm matches NRC 2000 Table 4-2 (1.166 Mcal/d, CBW 38.5 kg) with a 283-day gestation (Merck Veterinary Manual)', async () => {
    const h = await makeHerd(team.op, { name: 'Calendar cows', expectedBirthDate: '2027-03-10' })
    const date = addDays('2027-03-10', -93)
    const res = await team.sessions.hand.get(team.url(`/herds/${h.id}/requirements?date=${date}`))
    expect(res.status).toBe(200)
    expect(res.body.stage.pregnancyDay).toBe(190)
    expect(res.body.requirements.components.pregnancyNemMcal).toBeCloseTo(1.166, 2)
    const later = await team.sessions.hand.get(team.url(`/herds/${h.id}/requirements?date=2027-03-03`))
    expect(later.body.stage.pregnancyDay).toBe(276)
    const after = await team.sessions.hand.get(team.url(`/herds/${h.id}/requirements?date=2027-03-24`))
    expect(after.body.stage).toMatchObject({ pregnancyDay: null, daysInMilk: 14 })
  })

  it('when the requirements are read, then they equal the engine for the same animal on that date', async () => {
    const h = await makeHerd(team.op, { name: 'Engine cows', expectedBirthDate: '2027-03-10', environment: { tempC: -8, windKph: 16, coat: 'dry-winter' } })
    const res = await team.sessions.owner.get(team.url(`/herds/${h.id}/requirements?date=2027-01-15`))
    const engine = cattleRequirements({ class: 'cow', bodyWeightKg: 544, matureWeightKg: 544, bcs: 5, breed: 'british', grazing: true, pregnancyDay: 283 - 54, environment: { tempC: -8, windKph: 16, coat: 'dry-winter' } })
    expect(res.body.requirements).toEqual(JSON.parse(JSON.stringify(engine)))
  })

  it('when the date is malformed, then 400 names date', async () => {
    const h = await makeHerd(team.op, { name: 'Bad-date cows' })
    const res = await team.sessions.owner.get(team.url(`/herds/${h.id}/requirements?date=10-03-2027`))
    expect(res.status).toBe(400)
    expect(fieldsOf(res)).toContain('date')
  })
})
