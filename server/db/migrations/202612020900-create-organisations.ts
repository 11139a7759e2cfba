import { DataTypes } from 'sequelize'
import type { MigrationContext } from '../migrate.ts'

export async function up({ queryInterface }: MigrationContext): Promise<void> {
  await queryInterface.createTable('organisations', {
    id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
    name: { type: DataTypes.STRING(160), allowNull: false, unique: true },
    kind: {
      type: DataTypes.ENUM('contractor', 'network_owner', 'street_authority', 'operator'),
      allowNull: false,
    },
    medium: { type: DataTypes.STRING(32), allowNull: true },
    created_at: { type: DataTypes.DATE, allowNull: false },
    updated_at: { type: DataTypes.DATE, allowNull: false },
  })
}

export async function down({ queryInterface }: MigrationContext): Promise<void> {
  await queryInterface.dropTable('organisations')
}
