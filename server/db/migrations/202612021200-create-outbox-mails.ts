import { DataTypes } from 'sequelize'
import type { MigrationContext } from '../migrate.ts'

// Mail is written here in the same transaction as the change it reports, and sent later by
// the outbox worker, so a failing SMTP server delays mail but never loses it.
export async function up({ queryInterface }: MigrationContext): Promise<void> {
  await queryInterface.createTable('outbox_mails', {
    id: { type: DataTypes.BIGINT.UNSIGNED, autoIncrement: true, primaryKey: true },
    to_address: { type: DataTypes.STRING(1000), allowNull: false },
    subject: { type: DataTypes.STRING(300), allowNull: false },
    text_body: { type: DataTypes.TEXT, allowNull: false },
    html_body: { type: DataTypes.TEXT, allowNull: true },
    attachments: { type: DataTypes.JSON, allowNull: true },
    status: {
      type: DataTypes.ENUM('pending', 'sent', 'failed'),
      allowNull: false,
      defaultValue: 'pending',
    },
    attempts: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, defaultValue: 0 },
    next_attempt_at: { type: DataTypes.DATE(3), allowNull: false },
    locked_by: { type: DataTypes.STRING(64), allowNull: true },
    locked_until: { type: DataTypes.DATE(3), allowNull: true },
    last_error: { type: DataTypes.STRING(1000), allowNull: true },
    related_type: { type: DataTypes.STRING(64), allowNull: true },
    related_id: { type: DataTypes.STRING(64), allowNull: true },
    sent_at: { type: DataTypes.DATE(3), allowNull: true },
    created_at: { type: DataTypes.DATE(3), allowNull: false },
    updated_at: { type: DataTypes.DATE(3), allowNull: false },
  })
  await queryInterface.addIndex('outbox_mails', ['status', 'next_attempt_at'])
  await queryInterface.addIndex('outbox_mails', ['related_type', 'related_id'])
}

export async function down({ queryInterface }: MigrationContext): Promise<void> {
  await queryInterface.dropTable('outbox_mails')
}
