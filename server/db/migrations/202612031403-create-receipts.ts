import { DataTypes } from 'sequelize'
import type { MigrationContext } from '../migrate.ts'

// Receipts for payments and refunds, numbered by us: one sequence per calendar year with no
// gaps (the number is taken from receipt_counters inside the transaction that books the
// payment, so a rolled-back booking gives its number back). (year, sequence) and number are unique.
export async function up({ queryInterface }: MigrationContext): Promise<void> {
  await queryInterface.createTable('receipts', {
    id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
    number: { type: DataTypes.STRING(32), allowNull: false },
    year: { type: DataTypes.SMALLINT.UNSIGNED, allowNull: false },
    sequence: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
    application_fee_id: {
      type: DataTypes.INTEGER.UNSIGNED,
      allowNull: false,
      references: { model: 'application_fees', key: 'id' },
      onDelete: 'RESTRICT',
    },
    kind: { type: DataTypes.ENUM('payment', 'refund'), allowNull: false },
    amount_cents: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
    currency: { type: DataTypes.CHAR(3), allowNull: false },
    pdf_path: { type: DataTypes.STRING(500), allowNull: true },
    pdf_sha256: { type: DataTypes.CHAR(64), allowNull: true },
    issued_at: { type: DataTypes.DATE(3), allowNull: false },
    created_at: { type: DataTypes.DATE(3), allowNull: false },
    updated_at: { type: DataTypes.DATE(3), allowNull: false },
  })
  await queryInterface.addIndex('receipts', ['number'], { unique: true })
  await queryInterface.addIndex('receipts', ['year', 'sequence'], { unique: true })
  await queryInterface.addIndex('receipts', ['application_fee_id'])
}

export async function down({ queryInterface }: MigrationContext): Promise<void> {
  await queryInterface.dropTable('receipts')
}
