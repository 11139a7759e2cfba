import type { MigrationContext } from '../migrate.ts'

// One row per pipe segment of one owner. Geometry in the deployment's projected metric CRS
// (REF_SYSTEM_ID before NOT NULL; Sequelize's GEOMETRY type cannot say it, hence raw DDL).
// Quantities carry their unit in the column name, as in the engine's field names.
// The engine uses the smaller of cover_start_m and cover_end_m (the worse end for a load from
// above); both are kept so the owner's data stay as surveyed.
export async function up({ sequelize, projectedEpsg }: MigrationContext): Promise<void> {
  await sequelize.query(`
    CREATE TABLE pipe_segments (
      id INT UNSIGNED NOT NULL AUTO_INCREMENT PRIMARY KEY,
      owner_organisation_id INT UNSIGNED NOT NULL,
      owner_ref VARCHAR(64) NOT NULL,
      medium ENUM('water','sewer','gas','district_heating','other') NOT NULL,
      material ENUM('PE100','PVC-U','GRP','steel','ductile-iron','concrete','vitrified-clay') NOT NULL,
      outer_diameter_m DOUBLE NOT NULL,
      wall_thickness_m DOUBLE NOT NULL,
      short_term_modulus_MPa DOUBLE NULL,
      long_term_modulus_MPa DOUBLE NULL,
      allowable_stress_MPa DOUBLE NULL,
      crushing_strength_kN_per_m DOUBLE NULL,
      bedding_factor DOUBLE NULL,
      crushing_safety_factor DOUBLE NULL,
      internal_pressure_kPa DOUBLE NOT NULL,
      cover_start_m DOUBLE NOT NULL,
      cover_end_m DOUBLE NOT NULL,
      installation ENUM('trench','embankment') NOT NULL,
      trench_width_m DOUBLE NULL,
      wall_friction_k_mu DOUBLE NULL,
      backfill_unit_weight_kN_per_m3 DOUBLE NOT NULL,
      friction_angle_deg DOUBLE NOT NULL,
      sidefill_modulus_MPa DOUBLE NOT NULL,
      bedding_angle_deg DOUBLE NOT NULL,
      groundwater_above_crown_m DOUBLE NOT NULL,
      design_traffic_pressure_kPa DOUBLE NOT NULL,
      deflection_lag_factor DOUBLE NULL,
      deflection_limit_pct DOUBLE NULL,
      year_laid SMALLINT UNSIGNED NULL,
      positional_accuracy_m DOUBLE NULL,
      positional_quality ENUM('surveyed','digitised','estimated','unknown') NOT NULL DEFAULT 'unknown',
      length_m DOUBLE NOT NULL,
      geom LINESTRING REF_SYSTEM_ID=${Number(projectedEpsg)} NOT NULL,
      baseline_verdict ENUM('clear','conditional','critical') NULL,
      baseline_governing_check VARCHAR(32) NULL,
      baseline_utilisation DOUBLE NULL,
      baseline_over_capacity BOOLEAN NOT NULL DEFAULT FALSE,
      baseline_result JSON NULL,
      baseline_engine_version VARCHAR(32) NULL,
      baseline_error VARCHAR(500) NULL,
      last_import_id BIGINT UNSIGNED NULL,
      version INT UNSIGNED NOT NULL DEFAULT 1,
      created_at DATETIME(3) NOT NULL,
      updated_at DATETIME(3) NOT NULL,
      UNIQUE KEY pipe_segments_owner_ref (owner_organisation_id, owner_ref),
      KEY pipe_segments_owner_medium (owner_organisation_id, medium),
      KEY pipe_segments_owner_over_capacity (owner_organisation_id, baseline_over_capacity),
      SPATIAL INDEX pipe_segments_geom (geom),
      CONSTRAINT pipe_segments_owner_fk FOREIGN KEY (owner_organisation_id)
        REFERENCES organisations (id) ON DELETE RESTRICT
    ) ENGINE=InnoDB DEFAULT CHARSET=utf8mb4 COLLATE=utf8mb4_unicode_ci`)
}

export async function down({ queryInterface }: MigrationContext): Promise<void> {
  await queryInterface.dropTable('pipe_segments')
}
