// Models for herds, feeds, lab results, balances and reports.
import type { Sequelize } from 'sequelize'

export function initNutritionModels(sequelize: Sequelize) {
  void sequelize
}
