import { DataTypes } from 'sequelize'
import type { MigrationContext } from '../migrate.ts'

// One owner's review of one permit change request; only owners whose pipes the change touches
// get one. Conditions set here join the permit when the office grants the change.
export async function up({ queryInterface }: MigrationContext): Promise<void> {
  await queryInterface.createTable('change_reviews', {
    id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
    change_request_id: {
      type: DataTypes.INTEGER.UNSIGNED,
      allowNull: false,
      references: { model: 'permit_change_requests', key: 'id' },
      onDelete: 'RESTRICT',
    },
    owner_organisation_id: {
      type: DataTypes.INTEGER.UNSIGNED,
      allowNull: false,
      references: { model: 'organisations', key: 'id' },
      onDelete: 'RESTRICT',
    },
    state: {
      type: DataTypes.ENUM('waiting', 'accepted', 'accepted_with_conditions', 'objected'),
      allowNull: false,
    },
    due_on: { type: DataTypes.DATEONLY, allowNull: false },
    decided_by_user_id: { type: DataTypes.INTEGER.UNSIGNED, allowNull: true },
    decided_at: { type: DataTypes.DATE(3), allowNull: true },
    reasons: { type: DataTypes.STRING(5000), allowNull: true },
    conditions: { type: DataTypes.JSON, allowNull: true },
    created_at: { type: DataTypes.DATE(3), allowNull: false },
    updated_at: { type: DataTypes.DATE(3), allowNull: false },
  })
  await queryInterface.addIndex('change_reviews', ['change_request_id', 'owner_organisation_id'], {
    unique: true,
  })
  await queryInterface.addIndex('change_reviews', ['owner_organisation_id', 'state'])
}

export async function down({ queryInterface }: MigrationContext): Promise<void> {
  await queryInterface.dropTable('change_reviews')
}
