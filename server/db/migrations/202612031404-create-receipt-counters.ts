import { DataTypes } from 'sequelize'
import type { MigrationContext } from '../migrate.ts'

// The last receipt number used per year. Taking a number locks the year's row (SELECT … FOR
// UPDATE), so two payments booked at once get consecutive numbers and none is skipped.
export async function up({ queryInterface }: MigrationContext): Promise<void> {
  await queryInterface.createTable('receipt_counters', {
    year: { type: DataTypes.SMALLINT.UNSIGNED, primaryKey: true },
    last_sequence: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
  })
}

export async function down({ queryInterface }: MigrationContext): Promise<void> {
  await queryInterface.dropTable('receipt_counters')
}
