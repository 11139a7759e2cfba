import { DataTypes } from 'sequelize'
import type { MigrationContext } from '../migrate.ts'

// One row per start notice mailed to an owner who attends: for a planned start (sent by the
// scheduler its notice hours ahead) or for the actual start. The unique key claims the notice,
// so two processes or two runs never send it twice.
export async function up({ queryInterface }: MigrationContext): Promise<void> {
  await queryInterface.createTable('attendance_notices', {
    id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
    site_event_id: {
      type: DataTypes.INTEGER.UNSIGNED,
      allowNull: false,
      references: { model: 'site_events', key: 'id' },
      onDelete: 'RESTRICT',
    },
    owner_organisation_id: {
      type: DataTypes.INTEGER.UNSIGNED,
      allowNull: false,
      references: { model: 'organisations', key: 'id' },
      onDelete: 'RESTRICT',
    },
    notice_h: { type: DataTypes.SMALLINT.UNSIGNED, allowNull: false },
    sent_at: { type: DataTypes.DATE(3), allowNull: false },
    created_at: { type: DataTypes.DATE(3), allowNull: false },
  })
  await queryInterface.addIndex('attendance_notices', ['site_event_id', 'owner_organisation_id'], {
    unique: true,
  })
}

export async function down({ queryInterface }: MigrationContext): Promise<void> {
  await queryInterface.dropTable('attendance_notices')
}
