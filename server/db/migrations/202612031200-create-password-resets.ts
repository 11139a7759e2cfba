import { DataTypes } from 'sequelize'
import type { MigrationContext } from '../migrate.ts'

// One-time password-reset links. Only the SHA-256 of the token is stored, so a copy of the
// database does not let anyone reset a password; a row is good until expires_at, once.
export async function up({ queryInterface }: MigrationContext): Promise<void> {
  await queryInterface.createTable('password_resets', {
    id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
    user_id: {
      type: DataTypes.INTEGER.UNSIGNED,
      allowNull: false,
      references: { model: 'users', key: 'id' },
      onDelete: 'CASCADE',
    },
    token_sha256: { type: DataTypes.CHAR(64), allowNull: false },
    expires_at: { type: DataTypes.DATE(3), allowNull: false },
    used_at: { type: DataTypes.DATE(3), allowNull: true },
    requested_ip: { type: DataTypes.STRING(64), allowNull: true },
    created_at: { type: DataTypes.DATE(3), allowNull: false },
  })
  await queryInterface.addIndex('password_resets', ['token_sha256'], { unique: true })
  await queryInterface.addIndex('password_resets', ['user_id', 'used_at'])
}

export async function down({ queryInterface }: MigrationContext): Promise<void> {
  await queryInterface.dropTable('password_resets')
}
