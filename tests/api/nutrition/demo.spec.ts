// The invented demo scenario for the nutrition side: every screen has content, stages fit the winter dates, sheep never get the cattle mineral, and a second run changes nothing.
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { startTestApp, type TestApp } from '../../helpers/app'
import { seedDemo, DEMO_OPERATIONS } from '../../../server/seed/demo'
import { seedReference } from '../../../server/seed/reference'
import { Balance, BalanceVersion, Feed, Herd, LabResult } from '../../../server/models/nutrition'
import { Field, FieldComponent } from '../../../server/models/grazing'
import { Operation } from '../../../server/models/index'
import { herdStageOn } from '../../../shared/schemas/nutrition/herds'
import { herdValues } from '../../../server/services/nutrition/herds'
import { demoWinterYear, DEMO_LAB } from '../../../server/seed/demoNutrition'

let t: TestApp
let mainId: number
let clientId: number
beforeAll(async () => {
  t = await startTestApp()
  await seedReference(t.sequelize)
  await seedDemo(t.sequelize, t.config)
  mainId = (await Operation.findOne({ where: { name: DEMO_OPERATIONS.main.name } }))!.id
  clientId = (await Operation.findOne({ where: { name: DEMO_OPERATIONS.client.name } }))!.id
}, 120_000)
afterAll(async () => {
  await t.close()
})

const counts = async () => ({
  herds: await Herd.count({ where: { operationId: [mainId, clientId] } }),
  feeds: await Feed.count({ where: { operationId: [mainId, clientId] } }),
  labs: await LabResult.count({ where: { operationId: [mainId, clientId] } }),
  balances: await Balance.count({ where: { operationId: [mainId, clientId] } }),
  versions: await BalanceVersion.count(),
})

describe('nutrition demo data', () => {
  it('when the demo is seeded, then the main operation has the four kinds of group (ewes split into twins and singles) with stages that fit the winter dates', async () => {
    const y = demoWinterYear()
    const herds = await Herd.findAll({ where: { operationId: mainId } })
    const by = (n: string) => herdValues(herds.find((h) => h.name === n)!)
    expect(herds.map((h) => h.name).sort()).toEqual(['Bred heifers', 'Late-winter ewes, singles', 'Late-winter ewes, twins', 'Spring-calving cows', 'Weaned steer calves'])
    expect(herdStageOn(by('Spring-calving cows'), `${y}-01-20`).label).toMatch(/^Late gestation/)
    expect(herdStageOn(by('Late-winter ewes, twins'), `${y}-02-01`).sheepStage).toBe('late-gestation')
    expect(herdStageOn(by('Late-winter ewes, twins'), `${y}-03-10`).sheepStage).toBe('early-lactation')
    expect((await Herd.findAll({ where: { operationId: clientId } })).map((h) => h.name)).toEqual(['Client cows'])
  })

  it('when the demo is seeded, then supplements carry prices, the cattle mineral is marked cattle-only, and every sheep balance leaves it out', async () => {
    const feeds = await Feed.findAll({ where: { operationId: mainId } })
    expect(feeds.filter((f) => f.kind !== 'forage').every((f) => f.priceAmount != null && f.priceUnit != null)).toBe(true)
    const mineral = feeds.find((f) => f.name.startsWith('Demo cattle mineral'))!
    expect(mineral.cattleOnly).toBe(true)
    const balances = await Balance.findAll({ where: { operationId: mainId }, include: [{ model: Herd, as: 'herd' }] })
    expect(balances.length).toBeGreaterThanOrEqual(6)
    for (const b of balances) {
      const v = await BalanceVersion.findOne({ where: { balanceId: b.id, version: b.version } })
      const feedsIn = (v!.inputs as { problem: { feeds: { id: string }[] } }).problem.feeds.map((f) => f.id)
      if ((b as unknown as { herd: Herd }).herd.species === 'sheep') expect(feedsIn).not.toContain(`feed-${mineral.id}`)
    }
  })

  it('when fields exist, then every component of every demo field has a lab result from the invented lab, linked to it', async () => {
    const fields = await Field.findAll({ where: { operationId: [mainId, clientId] } })
    for (const f of fields) {
      for (const c of await FieldComponent.findAll({ where: { fieldId: f.id } })) {
        expect(c.labResultId, `${f.name} ${c.kind}`).not.toBeNull()
        const lab = await LabResult.findByPk(c.labResultId!)
        expect(lab!.labName).toBe(DEMO_LAB)
      }
    }
    expect(await LabResult.count({ where: { operationId: clientId, labName: DEMO_LAB } })).toBeGreaterThanOrEqual(1)
  })

  it('when the demo is seeded a second time, then nothing is added and nothing is wiped', async () => {
    const before = await counts()
    await seedReference(t.sequelize)
    await seedDemo(t.sequelize, t.config)
    expect(await counts()).toEqual(before)
  }, 120_000)
})
