import { DataTypes } from 'sequelize'
import type { MigrationContext } from '../migrate.ts'

/**
 * What a library condition asks of the works on site: the owner attends and wants the planned
 * start this many hours ahead (null: no attendance), and photos the crew must upload
 * (reinstatement, trial holes) before the works can be recorded finished.
 */
export async function up({ queryInterface }: MigrationContext): Promise<void> {
  await queryInterface.addColumn('condition_templates', 'attendance_notice_h', {
    type: DataTypes.SMALLINT.UNSIGNED,
    allowNull: true,
  })
  await queryInterface.addColumn('condition_templates', 'photo_kinds', {
    type: DataTypes.JSON,
    allowNull: true,
  })
}

export async function down({ queryInterface }: MigrationContext): Promise<void> {
  await queryInterface.removeColumn('condition_templates', 'photo_kinds')
  await queryInterface.removeColumn('condition_templates', 'attendance_notice_h')
}
