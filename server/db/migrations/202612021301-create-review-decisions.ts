import { DataTypes } from 'sequelize'
import type { MigrationContext } from '../migrate.ts'

// Every decision an owner's engineer made on a review, never changed: a later decision marks
// the earlier one superseded and points at it, so the history stays complete.
export async function up({ queryInterface }: MigrationContext): Promise<void> {
  await queryInterface.createTable('review_decisions', {
    id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
    review_id: {
      type: DataTypes.INTEGER.UNSIGNED,
      allowNull: false,
      references: { model: 'owner_reviews', key: 'id' },
      onDelete: 'CASCADE',
    },
    decision: {
      type: DataTypes.ENUM(
        'accepted',
        'accepted_with_conditions',
        'information_requested',
        'objected',
      ),
      allowNull: false,
    },
    reasons: { type: DataTypes.TEXT, allowNull: true },
    conditions: { type: DataTypes.JSON, allowNull: true },
    decided_by_user_id: {
      type: DataTypes.INTEGER.UNSIGNED,
      allowNull: false,
      references: { model: 'users', key: 'id' },
      onDelete: 'RESTRICT',
    },
    decided_at: { type: DataTypes.DATE(3), allowNull: false },
    supersedes_decision_id: { type: DataTypes.INTEGER.UNSIGNED, allowNull: true },
    superseded_at: { type: DataTypes.DATE(3), allowNull: true },
    created_at: { type: DataTypes.DATE(3), allowNull: false },
    updated_at: { type: DataTypes.DATE(3), allowNull: false },
  })
  await queryInterface.addIndex('review_decisions', ['review_id', 'id'])
}

export async function down({ queryInterface }: MigrationContext): Promise<void> {
  await queryInterface.dropTable('review_decisions')
}
