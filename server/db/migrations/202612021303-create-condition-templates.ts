import { DataTypes } from 'sequelize'
import type { MigrationContext } from '../migrate.ts'

// An owner's library of standard conditions. `text` holds placeholders such as {distance_m};
// `parameters` defines each one (name, label, unit, default, range) so a condition can be
// adjusted per application and still be checked.
export async function up({ queryInterface }: MigrationContext): Promise<void> {
  await queryInterface.createTable('condition_templates', {
    id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
    owner_organisation_id: {
      type: DataTypes.INTEGER.UNSIGNED,
      allowNull: false,
      references: { model: 'organisations', key: 'id' },
      onDelete: 'CASCADE',
    },
    code: { type: DataTypes.STRING(64), allowNull: false },
    title: { type: DataTypes.STRING(160), allowNull: false },
    text: { type: DataTypes.TEXT, allowNull: false },
    parameters: { type: DataTypes.JSON, allowNull: false },
    active: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: true },
    version: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, defaultValue: 0 },
    created_at: { type: DataTypes.DATE(3), allowNull: false },
    updated_at: { type: DataTypes.DATE(3), allowNull: false },
  })
  await queryInterface.addIndex('condition_templates', ['owner_organisation_id', 'code'], {
    unique: true,
  })
}

export async function down({ queryInterface }: MigrationContext): Promise<void> {
  await queryInterface.dropTable('condition_templates')
}
