import type { MigrationContext } from '../migrate.ts'

// One saved import mapping per network owner: which source attribute feeds which segment
// field, and the unit and format options of the owner's files (shape: shared/schemas/import-mapping.ts).
export async function up({ sequelize }: MigrationContext): Promise<void> {
  await sequelize.query(`
    CREATE TABLE import_mappings (
      id INT UNSIGNED NOT NULL AUTO_INCREMENT PRIMARY KEY,
      owner_organisation_id INT UNSIGNED NOT NULL,
      mapping JSON NOT NULL,
      updated_by_user_id INT UNSIGNED NULL,
      created_at DATETIME(3) NOT NULL,
      updated_at DATETIME(3) NOT NULL,
      UNIQUE KEY import_mappings_owner (owner_organisation_id),
      CONSTRAINT import_mappings_owner_fk FOREIGN KEY (owner_organisation_id)
        REFERENCES organisations (id) ON DELETE CASCADE,
      CONSTRAINT import_mappings_user_fk FOREIGN KEY (updated_by_user_id)
        REFERENCES users (id) ON DELETE SET NULL
    ) ENGINE=InnoDB DEFAULT CHARSET=utf8mb4 COLLATE=utf8mb4_unicode_ci`)
}

export async function down({ queryInterface }: MigrationContext): Promise<void> {
  await queryInterface.dropTable('import_mappings')
}
