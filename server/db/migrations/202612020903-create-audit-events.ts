import { DataTypes } from 'sequelize'
import type { MigrationContext } from '../migrate.ts'

export async function up({ queryInterface }: MigrationContext): Promise<void> {
  await queryInterface.createTable('audit_events', {
    id: { type: DataTypes.BIGINT.UNSIGNED, autoIncrement: true, primaryKey: true },
    at: { type: DataTypes.DATE(3), allowNull: false },
    actor_user_id: {
      type: DataTypes.INTEGER.UNSIGNED,
      allowNull: true,
      references: { model: 'users', key: 'id' },
      onDelete: 'SET NULL',
    },
    action: { type: DataTypes.STRING(64), allowNull: false },
    entity_type: { type: DataTypes.STRING(64), allowNull: false },
    entity_id: { type: DataTypes.STRING(64), allowNull: true },
    details: { type: DataTypes.JSON, allowNull: true },
    ip: { type: DataTypes.STRING(64), allowNull: true },
  })
  await queryInterface.addIndex('audit_events', ['entity_type', 'entity_id'])
  await queryInterface.addIndex('audit_events', ['at'])
}

export async function down({ queryInterface }: MigrationContext): Promise<void> {
  await queryInterface.dropTable('audit_events')
}
