// Strip plans, crew records, Today and the Season over the API: worked examples, validation by field, 404 across operations, 403 by role.
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { startTestApp, type TestApp } from '../../helpers/app'
import { aFieldBody, aPlanBody, operationWithRoles, type RoleSessions } from '../../fixtures/grazing'
import { makeOperation } from '../../fixtures/builders'
import { lbPerAcreToKgPerHa, LB_KG, FT_M, ACRE_M2 } from '../../../shared/engine/units'
import { GrazingPlan, GrazingRecord } from '../../../server/models/grazing'

let t: TestApp
let s: RoleSessions
beforeAll(async () => {
  t = await startTestApp()
  s = await operationWithRoles(t.app)
})
afterAll(async () => {
  await t.close()
})

const fieldsOf = (res: { body: { error?: { fields?: { field: string }[] } } }) => (res.body.error?.fields ?? []).map((f) => f.field)
const FT = FT_M
const AC_HA = ACRE_M2 / 10_000
const noWeathering = { rates: { 'sorghum-stover': { dmLossPerMonth: 0, cpDropPtsPerMonth: 0, tdnDropPtsPerMonth: 0 }, 'sorghum-grain': { dmLossPerMonth: 0, cpDropPtsPerMonth: 0, tdnDropPtsPerMonth: 0 } } }

/** A field of `acres` with a 660-ft fence and only standing stover at 8,000 lb DM/ac, measured on the plan's start. */
async function stoverField(session = s.owner, base = s.base, acres = 40, extra: Record<string, unknown> = {}) {
  const res = await session.post(`${base}/fields`, {
    ...aFieldBody({ legume: 'none', corridorWidthM: 0, legumeShareOfWidth: 0, rowSpacingM: 0.762 }),
    areaHa: acres * AC_HA,
    fenceLengthM: 660 * FT,
    weathering: noWeathering,
    components: [{ kind: 'sorghum-stover', kgDmPerHa: lbPerAcreToKgPerHa(8000), measuredOn: '2025-11-15', method: 'clipped-frame' }],
    ...extra,
  })
  expect(res.status).toBe(201)
  return res.body as { id: number; name: string }
}

/** 40 cows of 1,200 lb eating 2.5 % of body weight (30 lb DM). */
const c21Group = { headCount: 40, bodyWeightKg: 1200 * LB_KG, intakeKgDmPerHead: 30 * LB_KG, utilization: 0.75 }

describe('POST /api/operations/:id/strip-plans', () => {
  it('strip arithmetic of Penn State Agronomy Guide Table 1.8-9 (derived): 40 cows × 30 lb DM on 8,000 lb DM/ac at 75 % and a 660-ft fence take 0.2 ac a day and the fence moves 13.2 ft; 40 ac last 200 days', async () => {
    const f = await stoverField()
    const res = await s.nutritionist.post(`${s.base}/strip-plans`, aPlanBody(f.id, c21Group))
    expect(res.status).toBe(201)
    expect(res.body).toMatchObject({ fieldId: f.id, access: 'strip', daysPerMove: 1, groupSource: 'plan', headCount: 40 })
    const ev = await s.hand.get(`${s.base}/strip-plans/${res.body.id}/evaluation?date=2025-11-20`)
    expect(ev.status).toBe(200)
    const e = ev.body.evaluation
    expect(e.ok).toBe(true)
    expect(e.strip.stripAreaHa / AC_HA).toBeCloseTo(0.2, 9)
    expect((e.strip.stripAreaHa * 10_000) / (FT * FT)).toBeCloseTo(8712, 4)
    expect(e.strip.fenceMoveM / FT).toBeCloseTo(13.2, 9)
    expect(e.days).toBe(200)
    expect(e.lastGrazingDate).toBe('2026-06-02')
    // Day 6 of the plan: five moves made before, the sixth made this morning.
    expect(ev.body.day).toMatchObject({ status: 'grazing', dayIndex: 5 })
    expect(ev.body.day.fenceAtM / FT).toBeCloseTo(6 * 13.2, 6)
  })

  it('grain allowance of Univ. of Missouri Ext. G2079 (derived): 40 cows × 10 lb grain on 100-bu milo take 0.0714 ac (3,111 ft²) a day, a 4.71-ft move on a 660-ft fence', async () => {
    const res = await s.owner.post(`${s.base}/fields`, {
      ...aFieldBody({ legume: 'none', corridorWidthM: 0, legumeShareOfWidth: 0, rowSpacingM: 0.762 }),
      areaHa: 40 * AC_HA,
      fenceLengthM: 660 * FT,
      weathering: noWeathering,
      // 100 bu × 56 lb at the 14 %-moisture basis = 4,816 lb DM/ac.
      components: [{ kind: 'sorghum-grain', kgDmPerHa: lbPerAcreToKgPerHa(100 * 56 * 0.86), measuredOn: '2025-11-15', method: 'head-count' }],
    })
    const plan = await s.owner.post(`${s.base}/strip-plans`, aPlanBody(res.body.id, { headCount: 40, bodyWeightKg: 1200 * LB_KG, intakeKgDmPerHead: 30 * LB_KG, basis: 'grain', grainAllowanceKgPerHead: 10 * LB_KG }))
    expect(plan.status).toBe(201)
    const e = (await s.owner.get(`${s.base}/strip-plans/${plan.body.id}/evaluation?date=2025-11-15`)).body.evaluation
    expect(e.strip.basis).toBe('grain')
    expect(e.strip.dailyAreaHa / AC_HA).toBeCloseTo(400 / 5600, 9)
    expect((e.strip.dailyAreaHa * 10_000) / (FT * FT)).toBeCloseTo(3111.4, 1)
    expect(e.strip.fenceMoveM / FT).toBeCloseTo(4.714, 3)
  })

  it('Penn State Agronomy Guide Table 1.8-9: one animal unit (25 lb DM) for 1 day at 80 % on 1,000 lb DM/ac needs 0.031 ac', async () => {
    const f = await stoverField(s.owner, s.base, 10, { components: [{ kind: 'sorghum-stover', kgDmPerHa: lbPerAcreToKgPerHa(1000), measuredOn: '2025-11-15', method: 'visual' }] })
    const plan = await s.owner.post(`${s.base}/strip-plans`, aPlanBody(f.id, { headCount: 1, bodyWeightKg: 1000 * LB_KG, intakeKgDmPerHead: 25 * LB_KG, utilization: 0.8 }))
    const e = (await s.owner.get(`${s.base}/strip-plans/${plan.body.id}/evaluation?date=2025-11-15`)).body.evaluation
    expect(e.strip.stripAreaHa / AC_HA).toBeCloseTo(0.03125, 9)
  })

  it('when the same group gets the whole field instead of daily strips, then the field lasts fewer days (whole-field utilization 30–35 %, common practice, against 75 % on strips, G2079)', async () => {
    const f = await stoverField()
    const { utilization: _u, ...group } = c21Group
    const strips = await s.owner.post(`${s.base}/strip-plans`, aPlanBody(f.id, group))
    const whole = await s.owner.patch(`${s.base}/strip-plans/${strips.body.id}`, { access: 'whole-field' })
    expect(whole.status).toBe(200)
    const e = (await s.owner.get(`${s.base}/strip-plans/${strips.body.id}/evaluation?date=2025-11-15`)).body.evaluation
    expect(e.utilization.strip.value).toBe(0.75)
    expect(e.utilization.wholeField.value).toBe(0.325)
    expect(e.strip.daysOfGrazing).toBe(200)
    expect(e.wholeField.daysOfGrazing).toBe(86)
    expect(e.days).toBe(86)
    expect(e.schedule).toEqual([])
  })

  it('when a 3-day strip is planned, then the diet falls in crude protein and TDN from the first day to the third (grain and leaf go first)', async () => {
    const f = (await s.owner.post(`${s.base}/fields`, aFieldBody({ killingFrostDates: [] }))).body
    const plan = await s.owner.post(`${s.base}/strip-plans`, aPlanBody(f.id, { daysPerMove: 3, startDate: '2025-10-15' }))
    const e = (await s.owner.get(`${s.base}/strip-plans/${plan.body.id}/evaluation?date=2025-10-15`)).body.evaluation
    expect(e.diet.days).toHaveLength(3)
    expect(e.diet.days[0].tdnPctDm).toBeGreaterThan(e.diet.days[2].tdnPctDm)
    expect(e.diet.days[0].grainSharePct).toBeGreaterThan(e.diet.days[2].grainSharePct)
    expect(e.dailyDiet.days).toHaveLength(1)
    expect(e.schedule[1].fromM).toBeCloseTo(e.schedule[0].toM, 9)
    expect(e.schedule[0].days).toBe(3)
  })

  it('when required values are missing or wrong, then 400 names each field and no plan is written', async () => {
    const before = await GrazingPlan.count()
    const res = await s.owner.post(`${s.base}/strip-plans`, { fieldId: 'north', headCount: 0, species: 'goats', startDate: '2025-13-01', basis: 'grain' })
    expect(res.status).toBe(400)
    expect(fieldsOf(res)).toEqual(expect.arrayContaining(['fieldId', 'groupName', 'species', 'headCount', 'bodyWeightKg', 'intakeKgDmPerHead', 'startDate']))
    expect(await GrazingPlan.count()).toBe(before)
  })

  it('when grain strips have no allowance, or the last day comes before the first, then 400 names the field', async () => {
    const f = await stoverField()
    const a = await s.owner.post(`${s.base}/strip-plans`, aPlanBody(f.id, { basis: 'grain' }))
    expect(fieldsOf(a)).toEqual(['grainAllowanceKgPerHead'])
    const b = await s.owner.post(`${s.base}/strip-plans`, aPlanBody(f.id, { endDate: '2025-11-01' }))
    expect(fieldsOf(b)).toEqual(['endDate'])
  })

  it('when the field has no grain for grain strips, or the fence already stands at the far end, then 400 names basis or startOffsetM', async () => {
    const f = await stoverField()
    const a = await s.owner.post(`${s.base}/strip-plans`, aPlanBody(f.id, { basis: 'grain', grainAllowanceKgPerHead: 4.5 }))
    expect(a.status).toBe(400)
    expect(fieldsOf(a)).toEqual(['basis'])
    const b = await s.owner.post(`${s.base}/strip-plans`, aPlanBody(f.id, { startOffsetM: 100_000 }))
    expect(fieldsOf(b)).toEqual(['startOffsetM'])
  })

  it("when the field is another operation's, then 400 names fieldId; a hand may not plan (403)", async () => {
    const other = await makeOperation(s.users.owner)
    const theirs = await stoverField(s.owner, `/api/operations/${other.id}`)
    const res = await s.owner.post(`${s.base}/strip-plans`, aPlanBody(theirs.id))
    expect(res.status).toBe(400)
    expect(fieldsOf(res)).toEqual(['fieldId'])
    const mine = await stoverField()
    expect((await s.hand.post(`${s.base}/strip-plans`, aPlanBody(mine.id))).status).toBe(403)
  })
})

describe('GET, PATCH, DELETE /api/operations/:id/strip-plans/:planId', () => {
  it('when members list and read plans, the owner changes one and deletes it, then each step shows; the hand may only read', async () => {
    const f = await stoverField()
    const created = (await s.owner.post(`${s.base}/strip-plans`, aPlanBody(f.id))).body
    expect((await s.hand.get(`${s.base}/strip-plans`)).body.items.map((p: { id: number }) => p.id)).toContain(created.id)
    expect((await s.hand.get(`${s.base}/strip-plans/${created.id}`)).body.groupName).toBe('Test cows')
    expect((await s.hand.patch(`${s.base}/strip-plans/${created.id}`, { headCount: 10 })).status).toBe(403)
    const patched = await s.nutritionist.patch(`${s.base}/strip-plans/${created.id}`, { headCount: 55, daysPerMove: 2 })
    expect(patched.status).toBe(200)
    expect(patched.body).toMatchObject({ headCount: 55, daysPerMove: 2, startDate: '2025-11-15', groupName: 'Test cows' })
    const badPatch = await s.owner.patch(`${s.base}/strip-plans/${created.id}`, { endDate: '2025-01-01' })
    expect(fieldsOf(badPatch)).toEqual(['endDate'])
    expect((await s.hand.delete(`${s.base}/strip-plans/${created.id}`)).status).toBe(403)
    expect((await s.owner.delete(`${s.base}/strip-plans/${created.id}`)).status).toBe(204)
    expect((await s.owner.get(`${s.base}/strip-plans/${created.id}`)).status).toBe(404)
  })

  it("when a member reaches another operation's plan through this one, then 404 for read, change, delete and evaluation", async () => {
    const other = await makeOperation(s.users.owner)
    const ob = `/api/operations/${other.id}`
    const theirs = (await s.owner.post(`${ob}/strip-plans`, aPlanBody((await stoverField(s.owner, ob)).id))).body
    for (const res of [
      await s.owner.get(`${s.base}/strip-plans/${theirs.id}`),
      await s.owner.patch(`${s.base}/strip-plans/${theirs.id}`, { headCount: 1 }),
      await s.owner.delete(`${s.base}/strip-plans/${theirs.id}`),
      await s.owner.get(`${s.base}/strip-plans/${theirs.id}/evaluation`),
    ]) {
      expect(res.status).toBe(404)
      expect(res.body.error.message).toBe('Strip plan not found.')
    }
    expect((await GrazingPlan.findByPk(theirs.id))!.headCount).toBe(40)
  })
})

describe('records and Today', () => {
  async function planFrom(start: string, extra: Record<string, unknown> = {}) {
    const f = await stoverField(s.owner, s.base, 40, extra)
    const p = await s.owner.post(`${s.base}/strip-plans`, aPlanBody(f.id, { ...c21Group, startDate: start, supplement: { label: 'Test range cubes', kgAsFedPerHeadPerDay: 1, dmFraction: 0.9, pricePerKgAsFed: 0.4 } }))
    expect(p.status).toBe(201)
    return { field: f, plan: p.body }
  }

  it("when the hand opens Today, then each group shows the fence move due, the strip, the supplement for the group and today's records", async () => {
    const { plan } = await planFrom('2025-12-01')
    const res = await s.hand.get(`${s.base}/today?date=2025-12-06`)
    expect(res.status).toBe(200)
    const item = res.body.items.find((i: { plan: { id: number } }) => i.plan.id === plan.id)
    // Intake 30 lb less the cubes' 0.9 kg DM is grazed: strip area = 40 × (13.608 − 0.9) ÷ (8,966.9 × 0.75) ha,
    // so the 40 ac give ⌊200 × 13.608 ÷ 12.708⌋ = 214 daily strips.
    expect(item).toMatchObject({ status: 'grazing', dayIndex: 5, stripCount: 214, blocked: false })
    const area = (40 * (30 * LB_KG - 0.9)) / (lbPerAcreToKgPerHa(8000) * 0.75)
    expect(item.move.distanceM).toBeCloseTo((area * 10_000) / (660 * FT), 9)
    expect(item.move.paces).toBeCloseTo(item.move.distanceM / (2.5 * FT), 9)
    expect(item.fenceAtM).toBeCloseTo(6 * item.move.distanceM, 6)
    expect(item.supplement).toEqual({ label: 'Test range cubes', kgAsFedPerHead: 1, kgAsFedForGroup: 40, source: 'plan' })
    expect(item.records).toEqual([])
  })

  it('when the hand records a move and a feeding without figures, then the planned move and the daily supplement are filled in and the owner sees both', async () => {
    const { plan } = await planFrom('2025-12-01')
    const moved = await s.hand.post(`${s.base}/records`, { planId: plan.id, kind: 'moved', recordedAt: '2025-12-06T12:10:00Z' })
    expect(moved.status).toBe(201)
    const fed = await s.hand.post(`${s.base}/records`, { planId: plan.id, kind: 'fed', recordedAt: '2025-12-06T12:20:00Z', note: 'cubes on the frozen side' })
    expect(fed.status).toBe(201)
    expect(fed.body).toMatchObject({ feedLabel: 'Test range cubes', amountKgAsFed: 40, recordedBy: { id: s.users.hand.id, name: s.users.hand.name } })
    const today = (await s.owner.get(`${s.base}/today?date=2025-12-06`)).body.items.find((i: { plan: { id: number } }) => i.plan.id === plan.id)
    expect(moved.body.distanceM).toBeCloseTo(today.move.distanceM, 9)
    expect(today.records.map((r: { kind: string }) => r.kind)).toEqual(['moved', 'fed'])
    const list = await s.owner.get(`${s.base}/records?date=2025-12-06&planId=${plan.id}`)
    expect(list.body.total).toBe(2)
    expect(list.body.items[0]).toMatchObject({ kind: 'fed', groupName: 'Test cows', note: 'cubes on the frozen side' })
    expect((await s.owner.get(`${s.base}/records/${moved.body.id}`)).body.kind).toBe('moved')
  })

  it('when a hand changes or deletes a record, then only their own; the owner may change anyone’s', async () => {
    const { plan } = await planFrom('2025-12-01')
    const own = (await s.owner.post(`${s.base}/records`, { planId: plan.id, kind: 'moved', recordedAt: '2025-12-02T12:00:00Z', distanceM: 4 })).body
    const hands = (await s.hand.post(`${s.base}/records`, { planId: plan.id, kind: 'moved', recordedAt: '2025-12-03T12:00:00Z', distanceM: 4 })).body
    expect((await s.hand.patch(`${s.base}/records/${own.id}`, { distanceM: 9 })).status).toBe(403)
    expect((await s.hand.delete(`${s.base}/records/${own.id}`)).status).toBe(403)
    const changed = await s.hand.patch(`${s.base}/records/${hands.id}`, { distanceM: 5, note: 'wind' })
    expect(changed.status).toBe(200)
    expect(changed.body).toMatchObject({ distanceM: 5, note: 'wind' })
    expect((await s.owner.patch(`${s.base}/records/${hands.id}`, { distanceM: 6 })).body.distanceM).toBe(6)
    expect((await s.hand.delete(`${s.base}/records/${hands.id}`)).status).toBe(204)
    expect(await GrazingRecord.count({ where: { id: hands.id } })).toBe(0)
  })

  it('when a record is malformed, then 400 names the field and nothing is written', async () => {
    const { plan } = await planFrom('2025-12-01')
    const before = await GrazingRecord.count()
    for (const [body, field] of [
      [{ planId: plan.id, kind: 'watered' }, 'kind'],
      [{ planId: plan.id, kind: 'moved', distanceM: -3 }, 'distanceM'],
      [{ planId: plan.id, kind: 'moved', recordedAt: 'this morning' }, 'recordedAt'],
      [{ planId: plan.id, kind: 'moved', recordedAt: '2099-01-01T00:00:00Z' }, 'recordedAt'],
      [{ kind: 'fed' }, 'planId'],
    ] as const) {
      const res = await s.hand.post(`${s.base}/records`, body)
      expect(res.status).toBe(400)
      expect(fieldsOf(res)).toEqual([field])
    }
    expect(await GrazingRecord.count()).toBe(before)
  })

  it("when a record or plan belongs to another operation, then 404 on reading it and 400 naming planId on recording against it", async () => {
    const other = await makeOperation(s.users.owner)
    const ob = `/api/operations/${other.id}`
    const theirPlan = (await s.owner.post(`${ob}/strip-plans`, aPlanBody((await stoverField(s.owner, ob)).id))).body
    const theirRecord = (await s.owner.post(`${ob}/records`, { planId: theirPlan.id, kind: 'moved', recordedAt: '2025-12-02T12:00:00Z' })).body
    expect((await s.owner.get(`${s.base}/records/${theirRecord.id}`)).status).toBe(404)
    expect((await s.owner.patch(`${s.base}/records/${theirRecord.id}`, { note: 'x' })).status).toBe(404)
    expect((await s.owner.delete(`${s.base}/records/${theirRecord.id}`)).status).toBe(404)
    const res = await s.hand.post(`${s.base}/records`, { planId: theirPlan.id, kind: 'moved' })
    expect(res.status).toBe(400)
    expect(fieldsOf(res)).toEqual(['planId'])
    expect((await s.outsider.get(`${s.base}/today`)).status).toBe(404)
  })

  it('UNL BeefWatch 2024 frost-wait rule: two days after a killing frost Today blocks new sorghum strips until the 7th day and names the rule, its source and who comes first', async () => {
    const { plan } = await planFrom('2025-12-01', { killingFrostDates: ['2025-12-04'] })
    const item = (await s.hand.get(`${s.base}/today?date=2025-12-06`)).body.items.find((i: { plan: { id: number } }) => i.plan.id === plan.id)
    expect(item.blocked).toBe(true)
    const frost = item.hazards.find((h: { code: string }) => h.code === 'frost-wait')
    expect(frost).toMatchObject({ blocksGrazing: true, until: '2025-12-11' })
    expect(frost.source).toContain('UNL BeefWatch 2024')
    expect(frost.consult).toContain('veterinarian')
  })
})

describe('GET and PUT /api/operations/:id/season', () => {
  it('when 40 cows strip-graze a 4-ac field (0.2 ac a day, no weathering) in a 30-day season, then the first shortfall is on day 21 and the shortfall feed is priced as fed', async () => {
    const owner = s.users.owner
    const op = await makeOperation(owner)
    const base = `/api/operations/${op.id}`
    const f = await stoverField(s.owner, base, 4)
    const plan = await s.owner.post(`${base}/strip-plans`, aPlanBody(f.id, c21Group))
    expect(plan.status).toBe(201)
    const def = await s.owner.get(`${base}/season`)
    expect(def.status).toBe(200)
    expect(def.body.settingsSaved).toBe(false)
    expect(def.body.settings.startDate).toBe('2025-11-15')
    const put = await s.owner.put(`${base}/season/settings`, {
      startDate: '2025-11-15',
      endDate: '2025-12-14',
      shortfallFeed: { label: 'Test hay', dmFraction: 0.88, pricePerKgAsFed: 0.1 },
      harvestedAlternative: { label: 'Test hay fed all winter', dmFraction: 0.88, pricePerKgAsFed: 0.1, wasteFraction: 0.2 },
      frostWaitDays: null,
    })
    expect(put.status).toBe(200)
    const season = (await s.owner.get(`${base}/season`)).body
    expect(season.settingsSaved).toBe(true)
    const b = season.budget
    expect(b.firstShortfallDate).toBe('2025-12-05')
    expect(b.daysFullyFed).toBe(20)
    const dailyNeed = 40 * 30 * LB_KG
    expect(b.shortfall.kgDm).toBeCloseTo(10 * dailyNeed, 3)
    expect(b.shortfall.cost).toBeCloseTo(((10 * dailyNeed) / 0.88) * 0.1, 3)
    expect(b.harvestedAlternative.cost).toBeCloseTo(((30 * dailyNeed) / 0.88 / 0.8) * 0.1, 3)
    expect(b.weeks).toHaveLength(5)
    expect(season.groups).toEqual([expect.objectContaining({ key: `plan-${plan.body.id}`, name: 'Test cows', headCount: 40 })])
  })

  it('when the season ends before it starts, then 400 names endDate; a hand may not change the settings (403)', async () => {
    const body = { startDate: '2025-11-15', endDate: '2025-11-01', shortfallFeed: { label: 'Hay', dmFraction: 0.88, pricePerKgAsFed: 0.1 }, harvestedAlternative: null, frostWaitDays: null }
    const res = await s.owner.put(`${s.base}/season/settings`, body)
    expect(res.status).toBe(400)
    expect(fieldsOf(res)).toEqual(['endDate'])
    expect((await s.hand.put(`${s.base}/season/settings`, { ...body, endDate: '2026-03-01' })).status).toBe(403)
  })
})
