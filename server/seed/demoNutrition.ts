// Demo herds, feeds, lab results and balances for the invented demo operations.
import type { Sequelize } from 'sequelize'
import type { DemoIds } from './demo'

export async function seedNutritionDemo(sequelize: Sequelize, ids: DemoIds) {
  void sequelize
  void ids
}
