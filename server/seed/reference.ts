// Loads the published reference tables shipped in reference-data/ (book feed values with their sources) into the database.
import type { Sequelize } from 'sequelize'

/** Nothing to load until the feed library's table exists; each reference table adds its loader here. */
export async function seedReference(sequelize: Sequelize) {
  void sequelize
}
