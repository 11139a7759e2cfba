import { DataTypes } from 'sequelize'
import type { MigrationContext } from '../migrate.ts'

// Columns of connect-session-sequelize's default model (timestamps underscored, as all our tables).
export async function up({ queryInterface }: MigrationContext): Promise<void> {
  await queryInterface.createTable('sessions', {
    sid: { type: DataTypes.STRING(36), primaryKey: true },
    expires: { type: DataTypes.DATE, allowNull: true },
    data: { type: DataTypes.TEXT, allowNull: true },
    created_at: { type: DataTypes.DATE, allowNull: false },
    updated_at: { type: DataTypes.DATE, allowNull: false },
  })
  await queryInterface.addIndex('sessions', ['expires'])
}

export async function down({ queryInterface }: MigrationContext): Promise<void> {
  await queryInterface.dropTable('sessions')
}
