import { DataTypes } from 'sequelize'
import type { MigrationContext } from '../migrate.ts'

export async function up({ queryInterface }: MigrationContext): Promise<void> {
  await queryInterface.createTable('application_attachments', {
    id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
    application_id: {
      type: DataTypes.INTEGER.UNSIGNED,
      allowNull: false,
      references: { model: 'applications', key: 'id' },
      onDelete: 'CASCADE',
    },
    kind: {
      type: DataTypes.ENUM('method_statement', 'lift_plan', 'drawing', 'photo', 'other'),
      allowNull: false,
    },
    original_filename: { type: DataTypes.STRING(255), allowNull: false },
    content_type: { type: DataTypes.STRING(64), allowNull: false },
    size_bytes: { type: DataTypes.BIGINT.UNSIGNED, allowNull: false },
    sha256: { type: DataTypes.CHAR(64), allowNull: false },
    storage_name: { type: DataTypes.STRING(80), allowNull: false },
    uploaded_by_user_id: {
      type: DataTypes.INTEGER.UNSIGNED,
      allowNull: false,
      references: { model: 'users', key: 'id' },
      onDelete: 'RESTRICT',
    },
    created_at: { type: DataTypes.DATE, allowNull: false },
    updated_at: { type: DataTypes.DATE, allowNull: false },
  })
  await queryInterface.addIndex('application_attachments', ['application_id'])
}

export async function down({ queryInterface }: MigrationContext): Promise<void> {
  await queryInterface.dropTable('application_attachments')
}
