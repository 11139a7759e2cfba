import { DataTypes } from 'sequelize'
import type { MigrationContext } from '../migrate.ts'

// Photos from site (reinstatement, trial holes, other), told by their content to be images,
// stored under UPLOAD_DIR/site-photos with their SHA-256.
export async function up({ queryInterface }: MigrationContext): Promise<void> {
  await queryInterface.createTable('site_photos', {
    id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
    application_id: {
      type: DataTypes.INTEGER.UNSIGNED,
      allowNull: false,
      references: { model: 'applications', key: 'id' },
      onDelete: 'RESTRICT',
    },
    kind: { type: DataTypes.ENUM('reinstatement', 'trial_holes', 'other'), allowNull: false },
    caption: { type: DataTypes.STRING(300), allowNull: true },
    original_filename: { type: DataTypes.STRING(255), allowNull: false },
    content_type: { type: DataTypes.STRING(40), allowNull: false },
    size_bytes: { type: DataTypes.BIGINT.UNSIGNED, allowNull: false },
    sha256: { type: DataTypes.CHAR(64), allowNull: false },
    storage_name: { type: DataTypes.STRING(80), allowNull: false },
    uploaded_by_user_id: {
      type: DataTypes.INTEGER.UNSIGNED,
      allowNull: false,
      references: { model: 'users', key: 'id' },
      onDelete: 'RESTRICT',
    },
    created_at: { type: DataTypes.DATE(3), allowNull: false },
    updated_at: { type: DataTypes.DATE(3), allowNull: false },
  })
  await queryInterface.addIndex('site_photos', ['application_id', 'kind'])
}

export async function down({ queryInterface }: MigrationContext): Promise<void> {
  await queryInterface.dropTable('site_photos')
}
