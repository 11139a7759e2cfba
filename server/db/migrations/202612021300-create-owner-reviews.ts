import { DataTypes } from 'sequelize'
import type { MigrationContext } from '../migrate.ts'

// One row per (application, network owner), opened on submit. `version` is the optimistic lock:
// a decision is written only with the version the engineer loaded. While the applicant is asked
// for information the clock is paused: `paused_at` is set and the working days still left are
// kept in `remaining_working_days`, to give a new due date when the answer comes.
export async function up({ queryInterface }: MigrationContext): Promise<void> {
  await queryInterface.createTable('owner_reviews', {
    id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
    application_id: {
      type: DataTypes.INTEGER.UNSIGNED,
      allowNull: false,
      references: { model: 'applications', key: 'id' },
      onDelete: 'CASCADE',
    },
    owner_organisation_id: {
      type: DataTypes.INTEGER.UNSIGNED,
      allowNull: false,
      references: { model: 'organisations', key: 'id' },
      onDelete: 'RESTRICT',
    },
    state: {
      type: DataTypes.ENUM(
        'waiting',
        'accepted',
        'accepted_with_conditions',
        'information_requested',
        'objected',
        'not_affected',
      ),
      allowNull: false,
    },
    affected_segment_count: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, defaultValue: 0 },
    worst_verdict: { type: DataTypes.STRING(16), allowNull: true },
    opened_on: { type: DataTypes.DATEONLY, allowNull: false },
    due_on: { type: DataTypes.DATEONLY, allowNull: true },
    paused_at: { type: DataTypes.DATE(3), allowNull: true },
    remaining_working_days: { type: DataTypes.INTEGER, allowNull: true },
    version: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, defaultValue: 0 },
    decided_by_user_id: {
      type: DataTypes.INTEGER.UNSIGNED,
      allowNull: true,
      references: { model: 'users', key: 'id' },
      onDelete: 'SET NULL',
    },
    decided_at: { type: DataTypes.DATE(3), allowNull: true },
    reasons: { type: DataTypes.TEXT, allowNull: true },
    conditions: { type: DataTypes.JSON, allowNull: true },
    created_at: { type: DataTypes.DATE(3), allowNull: false },
    updated_at: { type: DataTypes.DATE(3), allowNull: false },
  })
  await queryInterface.addIndex('owner_reviews', ['application_id', 'owner_organisation_id'], {
    unique: true,
  })
  await queryInterface.addIndex('owner_reviews', ['owner_organisation_id', 'state', 'due_on'])
  await queryInterface.addIndex('owner_reviews', ['state', 'due_on'])
}

export async function down({ queryInterface }: MigrationContext): Promise<void> {
  await queryInterface.dropTable('owner_reviews')
}
