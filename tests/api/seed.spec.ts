// The demo seeder is idempotent: a second run neither duplicates nor wipes, and keeps what users changed.
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { startTestApp, type TestApp } from '../helpers/app'
import { seedDemo, DEMO_USERS } from '../../server/seed/demo'
import { Membership, Operation, User } from '../../server/models/index'
import { QueryTypes } from 'sequelize'
import request from 'supertest'

let t: TestApp
beforeAll(async () => {
  t = await startTestApp()
})
afterAll(async () => {
  await t.close()
})

async function countAll() {
  const tables = (await t.sequelize.query<{ tablename: string }>("SELECT tablename FROM pg_tables WHERE schemaname = 'public' AND tablename <> 'schema_migrations' ORDER BY tablename", { type: QueryTypes.SELECT })).map((r) => r.tablename)
  const counts: Record<string, number> = {}
  for (const tb of tables) {
    const [row] = await t.sequelize.query<{ n: string }>(`SELECT count(*)::int AS n FROM "${tb}"`, { type: QueryTypes.SELECT })
    counts[tb] = Number(row.n)
  }
  return counts
}

describe('seedDemo', () => {
  it('when run twice, then every table has the same row count and user edits survive', async () => {
    const ids = await seedDemo(t.sequelize, t.config)
    expect(Object.keys(ids.users).sort()).toEqual(DEMO_USERS.map((u) => u.key).sort())
    const op = await Operation.findByPk(ids.operations.main)
    expect(op!.isDemo).toBe(true)
    expect(op!.name).toMatch(/invented demo/)
    const owner = await User.findByPk(ids.users.owner)
    owner!.unitSystem = 'metric'
    await owner!.save()
    const before = await countAll()
    await seedDemo(t.sequelize, t.config)
    const after = await countAll()
    expect(after).toEqual(before)
    expect((await User.findByPk(ids.users.owner))!.unitSystem).toBe('metric')
    expect(await Membership.count({ where: { userId: ids.users.hand } })).toBe(1)
  })

  it('when the demo is loaded, then the sign-in page can list the demo accounts', async () => {
    await seedDemo(t.sequelize, t.config)
    const res = await request(t.app).get('/api/auth/demo-accounts')
    expect(res.status).toBe(200)
    expect(res.body.accounts.map((a: { email: string }) => a.email)).toEqual(DEMO_USERS.map((u) => u.email))
  })
})
