// The invented demo scenario (labelled as demo data): two operations, four demo members. Idempotent: a second run adds nothing and wipes nothing.
import bcrypt from 'bcryptjs'
import type { Sequelize, Transaction } from 'sequelize'
import { Membership, Operation, User } from '../models/index'
import type { Role } from '../../shared/schemas/roles'
import type { Config } from '../config'
import { linkGrazingDemoPlans, seedGrazingDemo } from './demoGrazing'
import { seedNutritionDemo } from './demoNutrition'

export const DEMO_PASSWORD = 'graze-demo-2026'

export const DEMO_OPERATIONS = {
  main: { name: 'Corridor Demo Ranch (invented demo)', species: 'both' as const },
  client: { name: 'Client Demo Cow-Calf (invented demo)', species: 'cattle' as const },
}

type DemoUser = { key: string; name: string; email: string; isAdmin: boolean; roles: Partial<Record<keyof typeof DEMO_OPERATIONS, Role>>; label: string }

export const DEMO_USERS: DemoUser[] = [
  { key: 'owner', name: 'Demo Owner', email: 'owner@demo.standgraze.invalid', isAdmin: false, roles: { main: 'owner', client: 'owner' }, label: 'owner of both demo operations' },
  { key: 'nutritionist', name: 'Demo Nutritionist', email: 'nutritionist@demo.standgraze.invalid', isAdmin: false, roles: { main: 'nutritionist', client: 'nutritionist' }, label: 'nutritionist in both operations' },
  { key: 'hand', name: 'Demo Hand', email: 'hand@demo.standgraze.invalid', isAdmin: false, roles: { main: 'hand' }, label: 'hand on the main operation' },
  { key: 'admin', name: 'Demo Site Admin', email: 'admin@demo.standgraze.invalid', isAdmin: true, roles: {}, label: 'site admin (no operation data)' },
]

export const demoSignIns = DEMO_USERS.map((u) => ({ email: u.email, label: u.label }))

export type DemoIds = { operations: Record<keyof typeof DEMO_OPERATIONS, number>; users: Record<string, number> }

async function findOrCreateOperation(name: string, species: 'cattle' | 'sheep' | 'both', transaction: Transaction) {
  const found = await Operation.findOne({ where: { name, isDemo: true }, transaction })
  return found ?? Operation.create({ name, species, isDemo: true }, { transaction })
}

/** Accounts and operations of the demo; later parts of the demo (herds, fields, feeds) hang off the returned ids. */
export async function seedDemoAccounts(sequelize: Sequelize, config: Config): Promise<DemoIds> {
  const hash = await bcrypt.hash(DEMO_PASSWORD, config.bcryptCost)
  return sequelize.transaction(async (transaction) => {
    const ops = {
      main: await findOrCreateOperation(DEMO_OPERATIONS.main.name, DEMO_OPERATIONS.main.species, transaction),
      client: await findOrCreateOperation(DEMO_OPERATIONS.client.name, DEMO_OPERATIONS.client.species, transaction),
    }
    const users: Record<string, number> = {}
    for (const d of DEMO_USERS) {
      let u = await User.findOne({ where: { email: d.email }, transaction })
      u ??= await User.create({ name: d.name, email: d.email, passwordHash: hash, isAdmin: d.isAdmin }, { transaction })
      users[d.key] = u.id
      for (const [opKey, role] of Object.entries(d.roles) as Array<[keyof typeof ops, Role]>) {
        const existing = await Membership.findOne({ where: { userId: u.id, operationId: ops[opKey].id }, transaction })
        if (!existing) await Membership.create({ userId: u.id, operationId: ops[opKey].id, role }, { transaction })
      }
    }
    return { operations: { main: ops.main.id, client: ops.client.id }, users }
  })
}

export async function seedDemo(sequelize: Sequelize, config: Config) {
  const ids = await seedDemoAccounts(sequelize, config)
  // Fields first: herds' balances refer to the fields they graze.
  await seedGrazingDemo(sequelize, ids)
  await seedNutritionDemo(sequelize, ids)
  // Strip plans are seeded before the herd groups exist; tie them to their groups now.
  await linkGrazingDemoPlans(ids)
  return ids
}
