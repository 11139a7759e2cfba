import { DataTypes } from 'sequelize'
import type { MigrationContext } from '../migrate.ts'

// One row per issue of a permit. Granting writes issue 1; an extension or a variation writes
// the next issue (new document, new verification code) and marks the previous one superseded,
// so the rows of one number are its history. Revoking changes the current issue in place.
// `expired` is also computed from valid_to when read.
export async function up({ queryInterface }: MigrationContext): Promise<void> {
  await queryInterface.createTable('permits', {
    id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
    number: { type: DataTypes.STRING(32), allowNull: false },
    issue: { type: DataTypes.SMALLINT.UNSIGNED, allowNull: false },
    application_id: {
      type: DataTypes.INTEGER.UNSIGNED,
      allowNull: false,
      references: { model: 'applications', key: 'id' },
      onDelete: 'RESTRICT',
    },
    status: {
      type: DataTypes.ENUM('valid', 'revoked', 'expired', 'superseded'),
      allowNull: false,
    },
    change_kind: { type: DataTypes.ENUM('granted', 'extended', 'varied'), allowNull: false },
    change_reason: { type: DataTypes.STRING(2000), allowNull: true },
    valid_from: { type: DataTypes.DATEONLY, allowNull: false },
    valid_to: { type: DataTypes.DATEONLY, allowNull: false },
    conditions: { type: DataTypes.JSON, allowNull: false },
    verification_code: { type: DataTypes.STRING(16), allowNull: false },
    pdf_path: { type: DataTypes.STRING(500), allowNull: true },
    pdf_sha256: { type: DataTypes.CHAR(64), allowNull: true },
    issued_by_user_id: {
      type: DataTypes.INTEGER.UNSIGNED,
      allowNull: false,
      references: { model: 'users', key: 'id' },
      onDelete: 'RESTRICT',
    },
    issued_at: { type: DataTypes.DATE(3), allowNull: false },
    supersedes_permit_id: { type: DataTypes.INTEGER.UNSIGNED, allowNull: true },
    superseded_at: { type: DataTypes.DATE(3), allowNull: true },
    revoked_at: { type: DataTypes.DATE(3), allowNull: true },
    revoked_by_user_id: { type: DataTypes.INTEGER.UNSIGNED, allowNull: true },
    revoked_reason: { type: DataTypes.STRING(2000), allowNull: true },
    created_at: { type: DataTypes.DATE(3), allowNull: false },
    updated_at: { type: DataTypes.DATE(3), allowNull: false },
  })
  await queryInterface.addIndex('permits', ['number', 'issue'], { unique: true })
  await queryInterface.addIndex('permits', ['verification_code'], { unique: true })
  await queryInterface.addIndex('permits', ['application_id', 'issue'])
}

export async function down({ queryInterface }: MigrationContext): Promise<void> {
  await queryInterface.dropTable('permits')
}
