import type { MigrationContext } from '../migrate.ts'

// The footprint is kept twice: as drawn (GeoJSON in WGS84, returned unchanged to the user) and
// in the projected CRS with a spatial index, for the searches for nearby pipes and other works.
export async function up({ sequelize, projectedEpsg }: MigrationContext): Promise<void> {
  await sequelize.query(`
    CREATE TABLE activities (
      id INT UNSIGNED NOT NULL AUTO_INCREMENT PRIMARY KEY,
      application_id INT UNSIGNED NOT NULL,
      position SMALLINT UNSIGNED NOT NULL,
      kind ENUM('excavation', 'crane', 'fill') NOT NULL,
      label VARCHAR(120) NULL,
      input JSON NOT NULL,
      geom GEOMETRY REF_SYSTEM_ID=${Number(projectedEpsg)} NOT NULL,
      created_at DATETIME NOT NULL,
      updated_at DATETIME NOT NULL,
      SPATIAL INDEX activities_geom (geom),
      INDEX activities_application (application_id, position),
      CONSTRAINT activities_application_fk FOREIGN KEY (application_id)
        REFERENCES applications (id) ON DELETE CASCADE
    ) ENGINE=InnoDB DEFAULT CHARSET=utf8mb4 COLLATE=utf8mb4_unicode_ci`)
}

export async function down({ queryInterface }: MigrationContext): Promise<void> {
  await queryInterface.dropTable('activities')
}
