import { DataTypes } from 'sequelize'
import type { MigrationContext } from '../migrate.ts'

// One row per (application, pipe segment): the engine's full output for the worst straight
// piece of the segment, with the inputs it ran on, so every number can be traced later.
export async function up({ queryInterface }: MigrationContext): Promise<void> {
  await queryInterface.createTable('assessments', {
    id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
    application_id: {
      type: DataTypes.INTEGER.UNSIGNED,
      allowNull: false,
      references: { model: 'applications', key: 'id' },
      onDelete: 'CASCADE',
    },
    pipe_segment_id: {
      type: DataTypes.INTEGER.UNSIGNED,
      allowNull: false,
      references: { model: 'pipe_segments', key: 'id' },
      onDelete: 'CASCADE',
    },
    owner_organisation_id: {
      type: DataTypes.INTEGER.UNSIGNED,
      allowNull: false,
      references: { model: 'organisations', key: 'id' },
      onDelete: 'RESTRICT',
    },
    medium: { type: DataTypes.STRING(32), allowNull: false },
    verdict: { type: DataTypes.ENUM('clear', 'conditional', 'critical'), allowNull: false },
    governing_check: { type: DataTypes.STRING(32), allowNull: true },
    utilisation_baseline: { type: DataTypes.DOUBLE, allowNull: true },
    utilisation_with_works: { type: DataTypes.DOUBLE, allowNull: true },
    distance_m: { type: DataTypes.DOUBLE, allowNull: false },
    piece_index: { type: DataTypes.SMALLINT.UNSIGNED, allowNull: false },
    engine_input: { type: DataTypes.JSON, allowNull: false },
    result: { type: DataTypes.JSON, allowNull: false },
    engine_version: { type: DataTypes.STRING(40), allowNull: false },
    created_at: { type: DataTypes.DATE, allowNull: false },
    updated_at: { type: DataTypes.DATE, allowNull: false },
  })
  await queryInterface.addIndex('assessments', ['application_id', 'pipe_segment_id'], {
    unique: true,
  })
  await queryInterface.addIndex('assessments', ['owner_organisation_id', 'application_id'])
  await queryInterface.addIndex('assessments', ['pipe_segment_id'])
}

export async function down({ queryInterface }: MigrationContext): Promise<void> {
  await queryInterface.dropTable('assessments')
}
