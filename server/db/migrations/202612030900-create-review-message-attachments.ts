import { DataTypes } from 'sequelize'
import type { MigrationContext } from '../migrate.ts'

/**
 * Documents sent with an answer to an owner's question: links to the application's own
 * attachments (a document is uploaded once and may go with several answers). The never-used
 * `attachment_ref` placeholder column goes.
 */
export async function up({ queryInterface }: MigrationContext): Promise<void> {
  await queryInterface.createTable('review_message_attachments', {
    id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
    review_message_id: {
      type: DataTypes.INTEGER.UNSIGNED,
      allowNull: false,
      references: { model: 'review_messages', key: 'id' },
      onDelete: 'CASCADE',
    },
    application_attachment_id: {
      type: DataTypes.INTEGER.UNSIGNED,
      allowNull: false,
      references: { model: 'application_attachments', key: 'id' },
      onDelete: 'RESTRICT',
    },
    created_at: { type: DataTypes.DATE, allowNull: false },
    updated_at: { type: DataTypes.DATE, allowNull: false },
  })
  await queryInterface.addIndex(
    'review_message_attachments',
    ['review_message_id', 'application_attachment_id'],
    { unique: true, name: 'review_message_attachments_message_attachment' },
  )
  await queryInterface.removeColumn('review_messages', 'attachment_ref')
}

export async function down({ queryInterface }: MigrationContext): Promise<void> {
  await queryInterface.addColumn('review_messages', 'attachment_ref', {
    type: DataTypes.STRING(255),
    allowNull: true,
  })
  await queryInterface.dropTable('review_message_attachments')
}
