import { DataTypes } from 'sequelize'
import type { MigrationContext } from '../migrate.ts'

export async function up({ queryInterface }: MigrationContext): Promise<void> {
  await queryInterface.createTable('applications', {
    id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
    reference: { type: DataTypes.STRING(24), allowNull: true, unique: true },
    status: {
      type: DataTypes.ENUM(
        'draft',
        'submitted',
        'with_owners',
        'ready_for_decision',
        'granted',
        'refused',
        'withdrawn',
        'expired',
        'revoked',
      ),
      allowNull: false,
      defaultValue: 'draft',
    },
    version: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, defaultValue: 0 },
    title: { type: DataTypes.STRING(160), allowNull: false },
    site_address: { type: DataTypes.STRING(240), allowNull: true },
    contact_name: { type: DataTypes.STRING(160), allowNull: true },
    contact_phone: { type: DataTypes.STRING(40), allowNull: true },
    starts_on: { type: DataTypes.DATEONLY, allowNull: true },
    ends_on: { type: DataTypes.DATEONLY, allowNull: true },
    description: { type: DataTypes.TEXT, allowNull: true },
    applicant_organisation_id: {
      type: DataTypes.INTEGER.UNSIGNED,
      allowNull: false,
      references: { model: 'organisations', key: 'id' },
      onDelete: 'RESTRICT',
    },
    created_by_user_id: {
      type: DataTypes.INTEGER.UNSIGNED,
      allowNull: false,
      references: { model: 'users', key: 'id' },
      onDelete: 'RESTRICT',
    },
    submitted_at: { type: DataTypes.DATE, allowNull: true },
    created_at: { type: DataTypes.DATE, allowNull: false },
    updated_at: { type: DataTypes.DATE, allowNull: false },
  })
  await queryInterface.addIndex('applications', ['applicant_organisation_id', 'status'])
  await queryInterface.addIndex('applications', ['status', 'starts_on', 'ends_on'])
}

export async function down({ queryInterface }: MigrationContext): Promise<void> {
  await queryInterface.dropTable('applications')
}
