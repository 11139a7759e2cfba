import { DataTypes } from 'sequelize'
import type { MigrationContext } from '../migrate.ts'

// An owner's engineer re-ran the engine for one affected segment with corrected pipe data. The
// original assessment stays as screened; each re-run is its own row with the inputs used.
export async function up({ queryInterface }: MigrationContext): Promise<void> {
  await queryInterface.createTable('segment_reruns', {
    id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
    review_id: {
      type: DataTypes.INTEGER.UNSIGNED,
      allowNull: false,
      references: { model: 'owner_reviews', key: 'id' },
      onDelete: 'CASCADE',
    },
    assessment_id: {
      type: DataTypes.INTEGER.UNSIGNED,
      allowNull: false,
      references: { model: 'assessments', key: 'id' },
      onDelete: 'CASCADE',
    },
    engine_input: { type: DataTypes.JSON, allowNull: false },
    result: { type: DataTypes.JSON, allowNull: false },
    verdict: { type: DataTypes.ENUM('clear', 'conditional', 'critical'), allowNull: false },
    note: { type: DataTypes.STRING(1000), allowNull: true },
    engine_version: { type: DataTypes.STRING(40), allowNull: false },
    created_by_user_id: {
      type: DataTypes.INTEGER.UNSIGNED,
      allowNull: false,
      references: { model: 'users', key: 'id' },
      onDelete: 'RESTRICT',
    },
    created_at: { type: DataTypes.DATE(3), allowNull: false },
    updated_at: { type: DataTypes.DATE(3), allowNull: false },
  })
  await queryInterface.addIndex('segment_reruns', ['review_id', 'assessment_id'])
}

export async function down({ queryInterface }: MigrationContext): Promise<void> {
  await queryInterface.dropTable('segment_reruns')
}
