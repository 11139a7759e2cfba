import { DataTypes } from 'sequelize'
import type { MigrationContext } from '../migrate.ts'

// Urgent repairs that start before any permit: where, what, why and who to call. The owners
// whose pipes lie near are alerted at once; the full application must follow by
// `follow_up_due_at` and is linked in `follow_up_application_id`.
export async function up({ queryInterface }: MigrationContext): Promise<void> {
  await queryInterface.createTable('emergency_works', {
    id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
    reference: { type: DataTypes.STRING(24), allowNull: true },
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
    location: { type: DataTypes.JSON, allowNull: false },
    site_address: { type: DataTypes.STRING(240), allowNull: false },
    activity_kind: { type: DataTypes.ENUM('excavation', 'crane', 'fill'), allowNull: false },
    depth_m: { type: DataTypes.DECIMAL(6, 2), allowNull: true },
    reason: { type: DataTypes.STRING(2000), allowNull: false },
    contact_name: { type: DataTypes.STRING(160), allowNull: false },
    contact_phone: { type: DataTypes.STRING(40), allowNull: false },
    started_at: { type: DataTypes.DATE(3), allowNull: false },
    follow_up_due_at: { type: DataTypes.DATE(3), allowNull: false },
    follow_up_application_id: {
      type: DataTypes.INTEGER.UNSIGNED,
      allowNull: true,
      references: { model: 'applications', key: 'id' },
      onDelete: 'RESTRICT',
    },
    alerted_owners: { type: DataTypes.JSON, allowNull: false },
    finished_at: { type: DataTypes.DATE(3), allowNull: true },
    created_at: { type: DataTypes.DATE(3), allowNull: false },
    updated_at: { type: DataTypes.DATE(3), allowNull: false },
  })
  await queryInterface.addIndex('emergency_works', ['follow_up_application_id', 'follow_up_due_at'])
  await queryInterface.addIndex('emergency_works', ['applicant_organisation_id'])
}

export async function down({ queryInterface }: MigrationContext): Promise<void> {
  await queryInterface.dropTable('emergency_works')
}
