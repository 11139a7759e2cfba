import { DataTypes } from 'sequelize'
import type { MigrationContext } from '../migrate.ts'

// An applicant's request to extend or vary a granted permit: a later last day and/or a changed
// set of activities. `screening` keeps, per owner, what the engine found before and after the
// change and whether the change touches that owner's pipes; touched owners get a change review.
export async function up({ queryInterface }: MigrationContext): Promise<void> {
  await queryInterface.createTable('permit_change_requests', {
    id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
    application_id: {
      type: DataTypes.INTEGER.UNSIGNED,
      allowNull: false,
      references: { model: 'applications', key: 'id' },
      onDelete: 'RESTRICT',
    },
    permit_id: {
      type: DataTypes.INTEGER.UNSIGNED,
      allowNull: false,
      references: { model: 'permits', key: 'id' },
      onDelete: 'RESTRICT',
    },
    status: {
      type: DataTypes.ENUM('with_owners', 'ready_for_decision', 'granted', 'declined', 'withdrawn'),
      allowNull: false,
    },
    valid_to: { type: DataTypes.DATEONLY, allowNull: true },
    activities: { type: DataTypes.JSON, allowNull: true },
    reason: { type: DataTypes.STRING(2000), allowNull: false },
    screening: { type: DataTypes.JSON, allowNull: false },
    created_by_user_id: {
      type: DataTypes.INTEGER.UNSIGNED,
      allowNull: false,
      references: { model: 'users', key: 'id' },
      onDelete: 'RESTRICT',
    },
    decided_by_user_id: { type: DataTypes.INTEGER.UNSIGNED, allowNull: true },
    decided_at: { type: DataTypes.DATE(3), allowNull: true },
    decision_note: { type: DataTypes.STRING(2000), allowNull: true },
    result_permit_id: { type: DataTypes.INTEGER.UNSIGNED, allowNull: true },
    version: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, defaultValue: 0 },
    created_at: { type: DataTypes.DATE(3), allowNull: false },
    updated_at: { type: DataTypes.DATE(3), allowNull: false },
  })
  await queryInterface.addIndex('permit_change_requests', ['application_id', 'status'])
  await queryInterface.addIndex('permit_change_requests', ['status'])
}

export async function down({ queryInterface }: MigrationContext): Promise<void> {
  await queryInterface.dropTable('permit_change_requests')
}
