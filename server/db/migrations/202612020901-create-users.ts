import { DataTypes } from 'sequelize'
import type { MigrationContext } from '../migrate.ts'

export async function up({ queryInterface }: MigrationContext): Promise<void> {
  await queryInterface.createTable('users', {
    id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
    email: { type: DataTypes.STRING(254), allowNull: false, unique: true },
    name: { type: DataTypes.STRING(160), allowNull: false },
    password_hash: { type: DataTypes.STRING(100), allowNull: false },
    role: {
      type: DataTypes.ENUM('applicant', 'asset_engineer', 'permit_officer', 'admin'),
      allowNull: false,
    },
    organisation_id: {
      type: DataTypes.INTEGER.UNSIGNED,
      allowNull: false,
      references: { model: 'organisations', key: 'id' },
      onDelete: 'RESTRICT',
    },
    active: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: true },
    failed_sign_ins: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, defaultValue: 0 },
    locked_until: { type: DataTypes.DATE, allowNull: true },
    last_sign_in_at: { type: DataTypes.DATE, allowNull: true },
    created_at: { type: DataTypes.DATE, allowNull: false },
    updated_at: { type: DataTypes.DATE, allowNull: false },
  })
  await queryInterface.addIndex('users', ['organisation_id'])
}

export async function down({ queryInterface }: MigrationContext): Promise<void> {
  await queryInterface.dropTable('users')
}
