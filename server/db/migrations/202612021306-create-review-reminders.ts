import { DataTypes } from 'sequelize'
import type { MigrationContext } from '../migrate.ts'

// The reminders sent for reviews. The unique keys are the claim: a process that inserts the
// row sends the mail in the same transaction; a second process running at the same time hits
// the key and sends nothing. At most one reminder per review and day, and one of each kind per
// due date.
export async function up({ queryInterface }: MigrationContext): Promise<void> {
  await queryInterface.createTable('review_reminders', {
    id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
    review_id: {
      type: DataTypes.INTEGER.UNSIGNED,
      allowNull: false,
      references: { model: 'owner_reviews', key: 'id' },
      onDelete: 'CASCADE',
    },
    kind: { type: DataTypes.ENUM('due_soon', 'due_today'), allowNull: false },
    due_on: { type: DataTypes.DATEONLY, allowNull: false },
    sent_on: { type: DataTypes.DATEONLY, allowNull: false },
    created_at: { type: DataTypes.DATE(3), allowNull: false },
  })
  await queryInterface.addIndex('review_reminders', ['review_id', 'sent_on'], { unique: true })
  await queryInterface.addIndex('review_reminders', ['review_id', 'kind', 'due_on'], {
    unique: true,
  })
}

export async function down({ queryInterface }: MigrationContext): Promise<void> {
  await queryInterface.dropTable('review_reminders')
}
