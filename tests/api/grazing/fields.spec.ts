// Fields, components, yield worksheets and field feeds: CRUD, validation by field, 404 across operations and 403 by role.
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { startTestApp, type TestApp } from '../../helpers/app'
import { aFieldBody, operationWithRoles, type RoleSessions } from '../../fixtures/grazing'
import { makeOperation } from '../../fixtures/builders'
import { Field, FieldComponent, FieldEstimate } from '../../../server/models/grazing'

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

describe('POST /api/operations/:id/fields', () => {
  it('when the owner creates a field with components, then it comes back with its layout and components in kind order', async () => {
    const body = aFieldBody({ components: [...aFieldBody().components!].reverse() })
    const res = await s.owner.post(`${s.base}/fields`, body)
    expect(res.status).toBe(201)
    expect(res.body).toMatchObject({ name: body.name, areaHa: 16, fenceLengthM: 200, legume: 'cowpea', legumeShareOfWidth: 0.5, operationId: s.op.id })
    expect(res.body.components.map((c: { kind: string }) => c.kind)).toEqual(['sorghum-grain', 'sorghum-stover', 'legume-forage'])
    expect(res.body.components[0]).toMatchObject({ kgDmPerHa: 5000, measuredOn: '2025-10-15', method: 'head-count', labResultId: null, quality: null })
  })

  it('when a nutritionist creates a field, then 201; when a hand tries, then 403 and nothing is written', async () => {
    expect((await s.nutritionist.post(`${s.base}/fields`, aFieldBody())).status).toBe(201)
    const body = aFieldBody()
    const res = await s.hand.post(`${s.base}/fields`, body)
    expect(res.status).toBe(403)
    expect(await Field.count({ where: { name: body.name } })).toBe(0)
  })

  it('when required values are missing or out of range, then 400 names each field', async () => {
    const res = await s.owner.post(`${s.base}/fields`, { areaHa: -3, fenceLengthM: 'wide', rowSpacingM: 1.5, legume: 'clover', killingFrostDates: ['4 Nov'] })
    expect(res.status).toBe(400)
    expect(fieldsOf(res)).toEqual(expect.arrayContaining(['name', 'areaHa', 'fenceLengthM', 'legume', 'killingFrostDates.0']))
  })

  it('when a field without a legume is given a legume share or a legume component, then 400 names them and no row is written', async () => {
    const body = aFieldBody({ legume: 'none', corridorWidthM: 0, legumeShareOfWidth: 0.3 })
    const res = await s.owner.post(`${s.base}/fields`, body)
    expect(res.status).toBe(400)
    expect(fieldsOf(res)).toEqual(expect.arrayContaining(['legumeShareOfWidth', 'components.2.kind']))
    expect(await Field.count({ where: { name: body.name } })).toBe(0)
  })

  it('when a component is listed twice, then 400 names the second one', async () => {
    const c = { kind: 'sorghum-grain' as const, kgDmPerHa: 4000, measuredOn: '2025-10-01', method: 'visual' as const }
    const res = await s.owner.post(`${s.base}/fields`, aFieldBody({ components: [c, c] }))
    expect(res.status).toBe(400)
    expect(fieldsOf(res)).toEqual(['components.1.kind'])
  })

  it('when a component is invalid, then nothing of the field is written (one transaction)', async () => {
    const body = aFieldBody({ components: [{ kind: 'sorghum-grain', kgDmPerHa: 4000, measuredOn: '2025-10-01', method: 'visual', quality: { cpPctDm: 11, tdnPctDm: 180, source: { kind: 'lab', label: 'x' } } }] })
    const res = await s.owner.post(`${s.base}/fields`, body)
    expect(res.status).toBe(400)
    expect(fieldsOf(res)).toEqual(['components.0.quality.tdnPctDm'])
    expect(await Field.count({ where: { name: body.name } })).toBe(0)
  })

  it('when the name is already used in the operation, then 409 names the field', async () => {
    const body = aFieldBody()
    await s.owner.post(`${s.base}/fields`, body)
    const res = await s.owner.post(`${s.base}/fields`, { ...body, components: [] })
    expect(res.status).toBe(409)
    expect(fieldsOf(res)).toEqual(['name'])
  })
})

describe('GET, PATCH and DELETE /api/operations/:id/fields/:fieldId', () => {
  it('when any member lists and reads fields, then they see them; the hand included', async () => {
    const created = (await s.owner.post(`${s.base}/fields`, aFieldBody())).body
    const list = await s.hand.get(`${s.base}/fields`)
    expect(list.status).toBe(200)
    expect(list.body.items.map((f: { id: number }) => f.id)).toContain(created.id)
    const one = await s.hand.get(`${s.base}/fields/${created.id}`)
    expect(one.status).toBe(200)
    expect(one.body.components).toHaveLength(3)
  })

  it('when the owner changes frost dates and nitrate, then the field keeps its other settings', async () => {
    const created = (await s.owner.post(`${s.base}/fields`, aFieldBody())).body
    const res = await s.owner.patch(`${s.base}/fields/${created.id}`, { killingFrostDates: ['2025-11-10', '2025-11-02'], nitrate: { value: 1200, unit: 'ppm-NO3-N' } })
    expect(res.status).toBe(200)
    expect(res.body.killingFrostDates).toEqual(['2025-11-02', '2025-11-10'])
    expect(res.body.nitrate).toEqual({ value: 1200, unit: 'ppm-NO3-N' })
    expect(res.body.areaHa).toBe(16)
  })

  it('when a change would leave legume components on a field with no legume, then 400 names legume and nothing changes', async () => {
    const created = (await s.owner.post(`${s.base}/fields`, aFieldBody())).body
    const res = await s.owner.patch(`${s.base}/fields/${created.id}`, { legume: 'none', legumeShareOfWidth: 0, corridorWidthM: 0 })
    expect(res.status).toBe(400)
    expect(fieldsOf(res)).toEqual(['legume'])
    expect((await Field.findByPk(created.id))!.legume).toBe('cowpea')
  })

  it('when a patch makes the merged field inconsistent, then 400 names the field at fault', async () => {
    const created = (await s.owner.post(`${s.base}/fields`, aFieldBody())).body
    const res = await s.owner.patch(`${s.base}/fields/${created.id}`, { corridorWidthM: 3 })
    expect(res.status).toBe(400)
    expect(fieldsOf(res)).toEqual(['corridorWidthM'])
  })

  it('when the owner deletes a field, then its components and estimates go with it and it reads 404', async () => {
    const created = (await s.owner.post(`${s.base}/fields`, aFieldBody())).body
    expect((await s.hand.delete(`${s.base}/fields/${created.id}`)).status).toBe(403)
    expect((await s.owner.delete(`${s.base}/fields/${created.id}`)).status).toBe(204)
    expect((await s.owner.get(`${s.base}/fields/${created.id}`)).status).toBe(404)
    expect(await FieldComponent.count({ where: { fieldId: created.id } })).toBe(0)
  })

  it("when a member of two operations reaches one operation's field through the other, then 404 for read, change and delete", async () => {
    const other = await makeOperation(s.users.owner)
    const theirs = (await s.owner.post(`/api/operations/${other.id}/fields`, aFieldBody())).body
    expect(theirs.id).toBeGreaterThan(0)
    for (const res of [
      await s.owner.get(`${s.base}/fields/${theirs.id}`),
      await s.owner.patch(`${s.base}/fields/${theirs.id}`, { name: 'Taken over' }),
      await s.owner.delete(`${s.base}/fields/${theirs.id}`),
      await s.owner.get(`${s.base}/fields/${theirs.id}/components`),
      await s.owner.post(`${s.base}/fields/${theirs.id}/estimates`, { method: 'clipped-frame', kind: 'legume-forage', measuredOn: '2025-10-01', frameAreaM2: 1, samples: [{ wetG: 300, dryG: 100 }] }),
    ]) {
      expect(res.status).toBe(404)
      expect(res.body.error.message).toBe('Field not found.')
    }
    expect((await Field.findByPk(theirs.id))!.name).toBe(theirs.name)
    const outsider = await s.outsider.get(`${s.base}/fields`)
    expect(outsider.status).toBe(404)
  })
})

describe('components of a field', () => {
  it('when the owner adds legume seed, changes it and removes it, then each step shows on the field', async () => {
    const f = (await s.owner.post(`${s.base}/fields`, aFieldBody())).body
    const add = await s.owner.post(`${s.base}/fields/${f.id}/components`, { kind: 'legume-seed', kgDmPerHa: 300, measuredOn: '2025-10-20', method: 'visual', quality: { cpPctDm: 24, tdnPctDm: 78, source: { kind: 'lab', label: 'Test lab sample 7' } } })
    expect(add.status).toBe(201)
    expect(add.body.quality.source.kind).toBe('lab')
    const patch = await s.nutritionist.patch(`${s.base}/fields/${f.id}/components/${add.body.id}`, { kgDmPerHa: 250 })
    expect(patch.status).toBe(200)
    expect(patch.body).toMatchObject({ kgDmPerHa: 250, kind: 'legume-seed', measuredOn: '2025-10-20' })
    expect((await s.hand.get(`${s.base}/fields/${f.id}/components/${add.body.id}`)).body.kgDmPerHa).toBe(250)
    expect((await s.hand.delete(`${s.base}/fields/${f.id}/components/${add.body.id}`)).status).toBe(403)
    expect((await s.owner.delete(`${s.base}/fields/${f.id}/components/${add.body.id}`)).status).toBe(204)
    expect((await s.owner.get(`${s.base}/fields/${f.id}/components`)).body.total).toBe(3)
  })

  it('when a component of that kind exists, then 409 names kind; when the value is negative, then 400 names kgDmPerHa', async () => {
    const f = (await s.owner.post(`${s.base}/fields`, aFieldBody())).body
    const dup = await s.owner.post(`${s.base}/fields/${f.id}/components`, { kind: 'sorghum-grain', kgDmPerHa: 100, measuredOn: '2025-10-20', method: 'visual' })
    expect(dup.status).toBe(409)
    expect(fieldsOf(dup)).toEqual(['kind'])
    const neg = await s.owner.patch(`${s.base}/fields/${f.id}/components/${f.components[0].id}`, { kgDmPerHa: -5 })
    expect(neg.status).toBe(400)
    expect(fieldsOf(neg)).toEqual(['kgDmPerHa'])
  })

  it("when a component id belongs to another field, then 404", async () => {
    const a = (await s.owner.post(`${s.base}/fields`, aFieldBody())).body
    const b = (await s.owner.post(`${s.base}/fields`, aFieldBody())).body
    const res = await s.owner.patch(`${s.base}/fields/${a.id}/components/${b.components[0].id}`, { kgDmPerHa: 1 })
    expect(res.status).toBe(404)
    expect((await FieldComponent.findByPk(b.components[0].id))!.kgDmPerHa).toBe(5000)
  })
})

describe('POST /api/operations/:id/fields/:fieldId/estimates (yield worksheets)', () => {
  it('K-State eUpdate 461/608 head-count formula, 56-lb bushel: 50 and 60 heads in 17.42 ft of 30-in row at 2,000 seeds/head and 15,000 seeds/lb average 130.95 bu/ac and write the mean into the field', async () => {
    const f = (await s.owner.post(`${s.base}/fields`, aFieldBody())).body
    const res = await s.nutritionist.post(`${s.base}/fields/${f.id}/estimates`, {
      method: 'head-count',
      measuredOn: '2025-10-25',
      rowSpacingIn: 30,
      seedsPerHead: 2000,
      seedsPerLb: 15000,
      samples: [
        { rowLengthFt: 17.424, rows: 1, heads: 50 },
        { rowLengthFt: 17.424, rows: 1, heads: 60 },
      ],
    })
    expect(res.status).toBe(201)
    const r = res.body.estimate.result
    // 50 heads per 1/1000 ac → 50,000 heads/ac × 2,000 ÷ 15,000 ÷ 56 = 119.05 bu/ac; 60 heads → 142.86 bu/ac.
    expect(r.samples[0].buPerAcre).toBeCloseTo(119.05, 2)
    expect(r.samples[1].buPerAcre).toBeCloseTo(142.86, 2)
    expect(r.buPerAcre.mean).toBeCloseTo(130.95, 2)
    expect(r.buPerAcre.sd).toBeCloseTo(16.84, 2)
    // 130.95 bu × 56 lb × 0.86 DM = 6,306.6 lb DM/ac = 7,068.9 kg DM/ha (NIST lb and acre).
    expect(r.kgDmPerHa.mean).toBeCloseTo(((130.952381 * 56 * 0.86 * 0.45359237) / 4046.8564224) * 10000, 1)
    const grain = res.body.field.components.find((c: { kind: string }) => c.kind === 'sorghum-grain')
    expect(grain).toMatchObject({ measuredOn: '2025-10-25', method: 'head-count', basis: 'field' })
    expect(grain.kgDmPerHa).toBeCloseTo(r.kgDmPerHa.mean, 6)
    expect(res.body.estimate.componentId).toBe(grain.id)
  })

  it('clipped-frame conversion (1 g/m² = 10 kg/ha; 100 dry g in a 1 m² frame ≈ 892 lb DM/ac, Univ. of Maine method): three corridor frames average with their spread and create the legume seed component', async () => {
    const f = (await s.owner.post(`${s.base}/fields`, aFieldBody())).body
    const res = await s.owner.post(`${s.base}/fields/${f.id}/estimates`, {
      method: 'clipped-frame',
      kind: 'legume-seed',
      measuredOn: '2025-10-26',
      frameAreaM2: 1,
      samples: [
        { wetG: 130, dryG: 110, containerG: 10 },
        { wetG: 250, dryG: 200 },
        { wetG: 400, dryG: 300 },
      ],
    })
    expect(res.status).toBe(201)
    const r = res.body.estimate.result
    expect(r.samples.map((x: { kgDmPerHa: number }) => x.kgDmPerHa)).toEqual([1000, 2000, 3000])
    expect(r.samples[0].lbDmPerAcre).toBeCloseTo(892.2, 1)
    // DM % = (dry − container) ÷ (wet − container): 100 ÷ 120 = 83.3 %.
    expect(r.samples[0].dmPct).toBeCloseTo(83.33, 2)
    expect(r.kgDmPerHa).toMatchObject({ n: 3, mean: 2000, sd: 1000, cvPct: 50, min: 1000, max: 3000 })
    expect(r.basis).toBe('band')
    const seed = res.body.field.components.find((c: { kind: string }) => c.kind === 'legume-seed')
    expect(seed).toMatchObject({ kgDmPerHa: 2000, method: 'clipped-frame', basis: 'band', measuredOn: '2025-10-26' })
    const list = await s.hand.get(`${s.base}/fields/${f.id}/estimates`)
    expect(list.body.items).toHaveLength(1)
    expect((await s.hand.get(`${s.base}/fields/${f.id}/estimates/${list.body.items[0].id}`)).body.kind).toBe('legume-seed')
  })

  it('when a sample is impossible, then 400 names it and neither the estimate nor the component is written', async () => {
    const f = (await s.owner.post(`${s.base}/fields`, aFieldBody())).body
    const res = await s.owner.post(`${s.base}/fields/${f.id}/estimates`, { method: 'clipped-frame', kind: 'legume-forage', measuredOn: '2025-10-26', frameAreaFt2: 4, samples: [{ wetG: 100, dryG: 50 }, { wetG: 100, dryG: 150 }] })
    expect(res.status).toBe(400)
    expect(fieldsOf(res)).toEqual(['samples.1.dryG'])
    expect(await FieldEstimate.count({ where: { fieldId: f.id } })).toBe(0)
    expect((await FieldComponent.findOne({ where: { fieldId: f.id, kind: 'legume-forage' } }))!.kgDmPerHa).toBe(3000)
  })

  it('when the worksheet is a legume one on a field with no legume, then 400 names kind; a hand may not run worksheets', async () => {
    const f = (await s.owner.post(`${s.base}/fields`, aFieldBody({ legume: 'none', corridorWidthM: 0, legumeShareOfWidth: 0, components: [] }))).body
    const w = { method: 'clipped-frame', kind: 'legume-forage', measuredOn: '2025-10-26', frameAreaM2: 1, samples: [{ wetG: 100, dryG: 50 }] }
    const res = await s.owner.post(`${s.base}/fields/${f.id}/estimates`, w)
    expect(res.status).toBe(400)
    expect(fieldsOf(res)).toEqual(['kind'])
    expect((await s.hand.post(`${s.base}/fields/${f.id}/estimates`, w)).status).toBe(403)
  })

  it('when the method is unknown, then 400 names method', async () => {
    const f = (await s.owner.post(`${s.base}/fields`, aFieldBody())).body
    const res = await s.owner.post(`${s.base}/fields/${f.id}/estimates`, { method: 'guess' })
    expect(res.status).toBe(400)
    expect(fieldsOf(res)).toEqual(['method'])
  })
})

describe('GET /api/operations/:id/fields/:fieldId/feeds', () => {
  it('when the Balance asks what a field offers on a date, then each standing component is a field feed and the offered shares add to 1', async () => {
    const f = (await s.owner.post(`${s.base}/fields`, aFieldBody())).body
    const res = await s.hand.get(`${s.base}/fields/${f.id}/feeds?date=2025-10-15`)
    expect(res.status).toBe(200)
    expect(res.body.field).toEqual({ id: f.id, name: f.name })
    expect(res.body.feeds.map((x: { role: string }) => x.role)).toEqual(['field', 'field', 'field'])
    const grain = res.body.feeds.find((x: { id: string }) => x.id === `field-${f.id}-sorghum-grain`)
    expect(grain).toMatchObject({ isGrain: true, dmPct: 86 })
    expect(res.body.feeds.find((x: { id: string }) => x.id.endsWith('legume-forage')).isLegume).toBe(true)
    const shares = res.body.fieldOffer.map((o: { shareOfDm: number }) => o.shareOfDm)
    expect(shares.reduce((a: number, b: number) => a + b, 0)).toBeCloseTo(1, 12)
    // On the measuring day nothing has weathered: 5,000 + 5,000 + 3,000 × 0.5 (cowpea on half the width) kg DM/ha.
    expect(res.body.supply.totalKgDmPerHa).toBeCloseTo(11500, 6)
    expect(shares[0]).toBeCloseTo(5000 / 11500, 9)
  })

  it('when the date is not a date, then 400 names date', async () => {
    const f = (await s.owner.post(`${s.base}/fields`, aFieldBody())).body
    const res = await s.owner.get(`${s.base}/fields/${f.id}/feeds?date=yesterday`)
    expect(res.status).toBe(400)
    expect(fieldsOf(res)).toEqual(['date'])
  })
})
