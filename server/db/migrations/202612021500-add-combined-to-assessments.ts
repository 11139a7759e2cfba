import { DataTypes } from 'sequelize'
import type { MigrationContext } from '../migrate.ts'

/**
 * The combined screening of an assessment: the worst verdict of this application's works
 * together with other live works on the same segment at the same time, and the record of that
 * run (intervals, applications combined, engine input and result). Null when no other works
 * overlap in time and place. The index on the segment finds the works that share a segment.
 */
export async function up({ queryInterface }: MigrationContext): Promise<void> {
  await queryInterface.addColumn('assessments', 'combined_verdict', {
    type: DataTypes.ENUM('clear', 'conditional', 'critical'),
    allowNull: true,
  })
  await queryInterface.addColumn('assessments', 'combined', {
    type: DataTypes.JSON,
    allowNull: true,
  })
  await queryInterface.addIndex('assessments', ['pipe_segment_id', 'application_id'], {
    name: 'assessments_segment_application',
  })
}

export async function down({ queryInterface }: MigrationContext): Promise<void> {
  await queryInterface.removeIndex('assessments', 'assessments_segment_application')
  await queryInterface.removeColumn('assessments', 'combined')
  await queryInterface.removeColumn('assessments', 'combined_verdict')
}
