import { DataTypes } from 'sequelize'
import type { MigrationContext } from '../migrate.ts'

// What the applicant records about the works on a granted permit: a planned start (may be
// recorded again to move it), the actual start and the finish. `at` is the planned or actual
// time. The rows of one application are its site history.
export async function up({ queryInterface }: MigrationContext): Promise<void> {
  await queryInterface.createTable('site_events', {
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
    kind: { type: DataTypes.ENUM('planned_start', 'started', 'finished'), allowNull: false },
    at: { type: DataTypes.DATE(3), allowNull: false },
    note: { type: DataTypes.STRING(2000), allowNull: true },
    recorded_by_user_id: {
      type: DataTypes.INTEGER.UNSIGNED,
      allowNull: false,
      references: { model: 'users', key: 'id' },
      onDelete: 'RESTRICT',
    },
    created_at: { type: DataTypes.DATE(3), allowNull: false },
    updated_at: { type: DataTypes.DATE(3), allowNull: false },
  })
  await queryInterface.addIndex('site_events', ['application_id', 'kind'])
  await queryInterface.addIndex('site_events', ['kind', 'at'])
}

export async function down({ queryInterface }: MigrationContext): Promise<void> {
  await queryInterface.dropTable('site_events')
}
