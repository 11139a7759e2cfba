import { DataTypes } from 'sequelize'
import type { MigrationContext } from '../migrate.ts'

// The question-and-answer thread of a review. `attachment_ref` is reserved for a stored file
// (drawings, method statements) once attachments exist; null until then.
export async function up({ queryInterface }: MigrationContext): Promise<void> {
  await queryInterface.createTable('review_messages', {
    id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
    review_id: {
      type: DataTypes.INTEGER.UNSIGNED,
      allowNull: false,
      references: { model: 'owner_reviews', key: 'id' },
      onDelete: 'CASCADE',
    },
    kind: { type: DataTypes.ENUM('question', 'answer'), allowNull: false },
    body: { type: DataTypes.TEXT, allowNull: false },
    author_user_id: {
      type: DataTypes.INTEGER.UNSIGNED,
      allowNull: false,
      references: { model: 'users', key: 'id' },
      onDelete: 'RESTRICT',
    },
    attachment_ref: { type: DataTypes.STRING(255), allowNull: true },
    created_at: { type: DataTypes.DATE(3), allowNull: false },
    updated_at: { type: DataTypes.DATE(3), allowNull: false },
  })
  await queryInterface.addIndex('review_messages', ['review_id', 'id'])
}

export async function down({ queryInterface }: MigrationContext): Promise<void> {
  await queryInterface.dropTable('review_messages')
}
