import type { MigrationContext } from '../migrate.ts'

// Geometry in the deployment's projected metric CRS. MariaDB takes the SRID as
// REF_SYSTEM_ID before NOT NULL; Sequelize's GEOMETRY type cannot say it, hence raw DDL.
export async function up({ sequelize, projectedEpsg }: MigrationContext): Promise<void> {
  await sequelize.query(`
    CREATE TABLE streets (
      id INT UNSIGNED NOT NULL AUTO_INCREMENT PRIMARY KEY,
      name VARCHAR(160) NOT NULL,
      category VARCHAR(32) NOT NULL,
      geom LINESTRING REF_SYSTEM_ID=${Number(projectedEpsg)} NOT NULL,
      created_at DATETIME NOT NULL,
      updated_at DATETIME NOT NULL,
      SPATIAL INDEX streets_geom (geom),
      INDEX streets_name (name)
    ) ENGINE=InnoDB DEFAULT CHARSET=utf8mb4 COLLATE=utf8mb4_unicode_ci`)
}

export async function down({ queryInterface }: MigrationContext): Promise<void> {
  await queryInterface.dropTable('streets')
}
