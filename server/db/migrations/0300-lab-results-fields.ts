// Links lab results and field components both ways once both tables exist: a sample goes with its field; a component forgets a deleted lab result.
import type { MigrationContext } from '../index'

export async function up({ queryInterface: q }: MigrationContext) {
  await q.addConstraint('lab_results', {
    fields: ['field_id'],
    type: 'foreign key',
    name: 'lab_results_field_id_fkey',
    references: { table: 'fields', field: 'id' },
    // A sample of a field that is deleted goes with it.
    onDelete: 'CASCADE',
    onUpdate: 'CASCADE',
  })
  await q.addConstraint('field_components', {
    fields: ['lab_result_id'],
    type: 'foreign key',
    name: 'field_components_lab_result_id_fkey',
    references: { table: 'lab_results', field: 'id' },
    onDelete: 'SET NULL',
    onUpdate: 'CASCADE',
  })
}

export async function down({ queryInterface: q }: MigrationContext) {
  await q.removeConstraint('field_components', 'field_components_lab_result_id_fkey')
  await q.removeConstraint('lab_results', 'lab_results_field_id_fkey')
}
