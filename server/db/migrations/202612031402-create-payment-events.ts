import { DataTypes } from 'sequelize'
import type { MigrationContext } from '../migrate.ts'

// Every webhook event from the payment service we acted on, keyed by its event id: a replayed
// or re-sent event finds its row and is ignored, so a payment is never booked twice.
export async function up({ queryInterface }: MigrationContext): Promise<void> {
  await queryInterface.createTable('payment_events', {
    id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
    event_id: { type: DataTypes.STRING(255), allowNull: false },
    type: { type: DataTypes.STRING(120), allowNull: false },
    object_id: { type: DataTypes.STRING(255), allowNull: true },
    application_fee_id: { type: DataTypes.INTEGER.UNSIGNED, allowNull: true },
    outcome: { type: DataTypes.STRING(500), allowNull: false },
    received_at: { type: DataTypes.DATE(3), allowNull: false },
  })
  await queryInterface.addIndex('payment_events', ['event_id'], { unique: true })
}

export async function down({ queryInterface }: MigrationContext): Promise<void> {
  await queryInterface.dropTable('payment_events')
}
