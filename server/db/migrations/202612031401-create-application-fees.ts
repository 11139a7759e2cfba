import { DataTypes } from 'sequelize'
import type { MigrationContext } from '../migrate.ts'

// One row per charge on an application: the application fee computed at submit, and one per
// extension or variation of its permit. Each keeps the schedule version and the lines it was
// computed with, so a later schedule never changes an existing fee. The online payment is
// tracked through the payment service's checkout session and payment ids; no card data.
export async function up({ queryInterface }: MigrationContext): Promise<void> {
  await queryInterface.createTable('application_fees', {
    id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
    application_id: {
      type: DataTypes.INTEGER.UNSIGNED,
      allowNull: false,
      references: { model: 'applications', key: 'id' },
      onDelete: 'RESTRICT',
    },
    fee_schedule_id: {
      type: DataTypes.INTEGER.UNSIGNED,
      allowNull: false,
      references: { model: 'fee_schedules', key: 'id' },
      onDelete: 'RESTRICT',
    },
    purpose: { type: DataTypes.ENUM('application', 'extension', 'variation'), allowNull: false },
    permit_id: { type: DataTypes.INTEGER.UNSIGNED, allowNull: true },
    duration_class: { type: DataTypes.ENUM('minor', 'standard', 'major'), allowNull: true },
    working_days: { type: DataTypes.SMALLINT.UNSIGNED, allowNull: true },
    lines: { type: DataTypes.JSON, allowNull: false },
    amount_cents: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
    currency: { type: DataTypes.CHAR(3), allowNull: false },
    payment_terms: { type: DataTypes.ENUM('pay_before_grant', 'invoice'), allowNull: false },
    state: {
      type: DataTypes.ENUM('due', 'paid', 'refund_due', 'refunded', 'cancelled', 'no_charge'),
      allowNull: false,
    },
    refund_due_cents: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, defaultValue: 0 },
    refunded_cents: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, defaultValue: 0 },
    checkout_session_id: { type: DataTypes.STRING(255), allowNull: true },
    last_attempt_failed: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false },
    payment_intent_id: { type: DataTypes.STRING(255), allowNull: true },
    refund_id: { type: DataTypes.STRING(255), allowNull: true },
    paid_at: { type: DataTypes.DATE(3), allowNull: true },
    refunded_at: { type: DataTypes.DATE(3), allowNull: true },
    created_at: { type: DataTypes.DATE(3), allowNull: false },
    updated_at: { type: DataTypes.DATE(3), allowNull: false },
  })
  await queryInterface.addIndex('application_fees', ['application_id', 'purpose'])
  await queryInterface.addIndex('application_fees', ['checkout_session_id'])
}

export async function down({ queryInterface }: MigrationContext): Promise<void> {
  await queryInterface.dropTable('application_fees')
}
