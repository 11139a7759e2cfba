import { DataTypes } from 'sequelize'
import type { MigrationContext } from '../migrate.ts'

// A fee paid on an invoice (bank transfer, not through the payment service) is booked by the
// permit office with the reference of the transfer; this column keeps it for the receipt.
export async function up({ queryInterface }: MigrationContext): Promise<void> {
  await queryInterface.addColumn('application_fees', 'offline_reference', {
    type: DataTypes.STRING(200),
    allowNull: true,
  })
}

export async function down({ queryInterface }: MigrationContext): Promise<void> {
  await queryInterface.removeColumn('application_fees', 'offline_reference')
}
