import { DataTypes } from 'sequelize'
import type { MigrationContext } from '../migrate.ts'

// One row per version of a street authority's fee schedule. Versions are never edited: a new
// version takes over from its effective_from day, and fees keep the version they were computed
// with. Prices per works duration class and activity kind live in `entries` (JSON).
export async function up({ queryInterface }: MigrationContext): Promise<void> {
  await queryInterface.createTable('fee_schedules', {
    id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
    authority_organisation_id: {
      type: DataTypes.INTEGER.UNSIGNED,
      allowNull: false,
      references: { model: 'organisations', key: 'id' },
      onDelete: 'RESTRICT',
    },
    effective_from: { type: DataTypes.DATEONLY, allowNull: false },
    currency: { type: DataTypes.CHAR(3), allowNull: false },
    entries: { type: DataTypes.JSON, allowNull: false },
    variation_fee_cents: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
    extension_fee_cents: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
    refund_before_review_percent: { type: DataTypes.DECIMAL(5, 2), allowNull: false },
    refund_after_review_percent: { type: DataTypes.DECIMAL(5, 2), allowNull: false },
    default_payment_terms: {
      type: DataTypes.ENUM('pay_before_grant', 'invoice'),
      allowNull: false,
    },
    note: { type: DataTypes.STRING(2000), allowNull: true },
    created_by_user_id: {
      type: DataTypes.INTEGER.UNSIGNED,
      allowNull: false,
      references: { model: 'users', key: 'id' },
      onDelete: 'RESTRICT',
    },
    created_at: { type: DataTypes.DATE(3), allowNull: false },
    updated_at: { type: DataTypes.DATE(3), allowNull: false },
  })
  await queryInterface.addIndex('fee_schedules', ['authority_organisation_id', 'effective_from'], {
    unique: true,
  })
}

export async function down({ queryInterface }: MigrationContext): Promise<void> {
  await queryInterface.dropTable('fee_schedules')
}
