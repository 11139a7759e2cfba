import { DataTypes } from 'sequelize'
import type { MigrationContext } from '../migrate.ts'

// The crew's ticks against the conditions of one permit issue (a new issue starts a new list):
// `ticks` maps a condition's position and code ("0:no-machine-digging") to when and by whom it
// was ticked.
export async function up({ queryInterface }: MigrationContext): Promise<void> {
  await queryInterface.createTable('site_checklists', {
    id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
    permit_id: {
      type: DataTypes.INTEGER.UNSIGNED,
      allowNull: false,
      references: { model: 'permits', key: 'id' },
      onDelete: 'RESTRICT',
    },
    ticks: { type: DataTypes.JSON, allowNull: false },
    updated_by_user_id: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
    created_at: { type: DataTypes.DATE(3), allowNull: false },
    updated_at: { type: DataTypes.DATE(3), allowNull: false },
  })
  await queryInterface.addIndex('site_checklists', ['permit_id'], { unique: true })
}

export async function down({ queryInterface }: MigrationContext): Promise<void> {
  await queryInterface.dropTable('site_checklists')
}
