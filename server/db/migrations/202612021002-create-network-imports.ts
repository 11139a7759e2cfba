import type { MigrationContext } from '../migrate.ts'

// One row per import job: the uploaded file (kept under the upload folder, named by the row),
// its checksum, the validate and commit passes' progress counts and the per-feature report.
export async function up({ sequelize }: MigrationContext): Promise<void> {
  await sequelize.query(`
    CREATE TABLE network_imports (
      id BIGINT UNSIGNED NOT NULL AUTO_INCREMENT PRIMARY KEY,
      owner_organisation_id INT UNSIGNED NOT NULL,
      created_by_user_id INT UNSIGNED NULL,
      format ENUM('geojson','csv') NOT NULL,
      original_filename VARCHAR(255) NOT NULL,
      file_path VARCHAR(500) NOT NULL,
      file_sha256 CHAR(64) NOT NULL,
      file_size_bytes BIGINT UNSIGNED NOT NULL,
      status ENUM('uploaded','validating','validated','rejected','committing','committed','failed') NOT NULL,
      skip_invalid BOOLEAN NULL,
      mapping_snapshot JSON NULL,
      features_total INT UNSIGNED NOT NULL DEFAULT 0,
      features_processed INT UNSIGNED NOT NULL DEFAULT 0,
      features_valid INT UNSIGNED NOT NULL DEFAULT 0,
      features_invalid INT UNSIGNED NOT NULL DEFAULT 0,
      segments_inserted INT UNSIGNED NOT NULL DEFAULT 0,
      segments_updated INT UNSIGNED NOT NULL DEFAULT 0,
      file_issues JSON NULL,
      feature_issues JSON NULL,
      feature_issues_truncated BOOLEAN NOT NULL DEFAULT FALSE,
      error_message VARCHAR(500) NULL,
      validated_at DATETIME(3) NULL,
      committed_at DATETIME(3) NULL,
      created_at DATETIME(3) NOT NULL,
      updated_at DATETIME(3) NOT NULL,
      KEY network_imports_owner (owner_organisation_id, id),
      CONSTRAINT network_imports_owner_fk FOREIGN KEY (owner_organisation_id)
        REFERENCES organisations (id) ON DELETE RESTRICT,
      CONSTRAINT network_imports_user_fk FOREIGN KEY (created_by_user_id)
        REFERENCES users (id) ON DELETE SET NULL
    ) ENGINE=InnoDB DEFAULT CHARSET=utf8mb4 COLLATE=utf8mb4_unicode_ci`)
}

export async function down({ queryInterface }: MigrationContext): Promise<void> {
  await queryInterface.dropTable('network_imports')
}
