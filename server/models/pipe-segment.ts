import { DataTypes, Model } from 'sequelize'
import type {
  CreationOptional,
  InferAttributes,
  InferCreationAttributes,
  Sequelize,
} from 'sequelize'
import type { PipeMaterial, Installation, Verdict } from '../../shared/statics/types.ts'
import type { PipeMedium, PositionalQuality } from '../../shared/types/network.ts'

/**
 * One pipe segment of one network owner with its design data and baseline check. The geometry
 * column `geom` (LINESTRING in the projected CRS) is read and written with raw SQL only
 * (ST_GeomFromText with the SRID, ST_AsGeoJSON), because Sequelize drops the SRID (stack-notes P4).
 */
export class PipeSegment extends Model<
  InferAttributes<PipeSegment>,
  InferCreationAttributes<PipeSegment>
> {
  declare id: CreationOptional<number>
  declare ownerOrganisationId: number
  declare ownerRef: string
  declare medium: PipeMedium
  declare material: PipeMaterial
  declare outerDiameter_m: number
  declare wallThickness_m: number
  declare shortTermModulus_MPa: number | null
  declare longTermModulus_MPa: number | null
  declare allowableStress_MPa: number | null
  declare crushingStrength_kN_per_m: number | null
  declare beddingFactor: number | null
  declare crushingSafetyFactor: number | null
  declare internalPressure_kPa: number
  declare coverStart_m: number
  declare coverEnd_m: number
  declare installation: Installation
  declare trenchWidth_m: number | null
  declare wallFrictionKMu: number | null
  declare backfillUnitWeight_kN_per_m3: number
  declare frictionAngle_deg: number
  declare sidefillModulus_MPa: number
  declare beddingAngle_deg: number
  declare groundwaterAboveCrown_m: number
  declare designTrafficPressure_kPa: number
  declare deflectionLagFactor: number | null
  declare deflectionLimit_pct: number | null
  declare yearLaid: number | null
  declare positionalAccuracy_m: number | null
  declare positionalQuality: PositionalQuality
  declare length_m: number
  declare baselineVerdict: Verdict | null
  declare baselineGoverningCheck: string | null
  declare baselineUtilisation: number | null
  declare baselineOverCapacity: boolean
  declare baselineResult: unknown
  declare baselineEngineVersion: string | null
  declare baselineError: string | null
  declare lastImportId: number | null
  declare version: CreationOptional<number>
  declare createdAt: CreationOptional<Date>
  declare updatedAt: CreationOptional<Date>

  static initModel(sequelize: Sequelize): void {
    const num = (field: string, allowNull = false) => ({ type: DataTypes.DOUBLE, allowNull, field })
    PipeSegment.init(
      {
        id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
        ownerOrganisationId: {
          type: DataTypes.INTEGER.UNSIGNED,
          allowNull: false,
          field: 'owner_organisation_id',
        },
        ownerRef: { type: DataTypes.STRING(64), allowNull: false, field: 'owner_ref' },
        medium: { type: DataTypes.STRING(32), allowNull: false },
        material: { type: DataTypes.STRING(32), allowNull: false },
        outerDiameter_m: num('outer_diameter_m'),
        wallThickness_m: num('wall_thickness_m'),
        shortTermModulus_MPa: num('short_term_modulus_MPa', true),
        longTermModulus_MPa: num('long_term_modulus_MPa', true),
        allowableStress_MPa: num('allowable_stress_MPa', true),
        crushingStrength_kN_per_m: num('crushing_strength_kN_per_m', true),
        beddingFactor: num('bedding_factor', true),
        crushingSafetyFactor: num('crushing_safety_factor', true),
        internalPressure_kPa: num('internal_pressure_kPa'),
        coverStart_m: num('cover_start_m'),
        coverEnd_m: num('cover_end_m'),
        installation: { type: DataTypes.STRING(16), allowNull: false },
        trenchWidth_m: num('trench_width_m', true),
        wallFrictionKMu: num('wall_friction_k_mu', true),
        backfillUnitWeight_kN_per_m3: num('backfill_unit_weight_kN_per_m3'),
        frictionAngle_deg: num('friction_angle_deg'),
        sidefillModulus_MPa: num('sidefill_modulus_MPa'),
        beddingAngle_deg: num('bedding_angle_deg'),
        groundwaterAboveCrown_m: num('groundwater_above_crown_m'),
        designTrafficPressure_kPa: num('design_traffic_pressure_kPa'),
        deflectionLagFactor: num('deflection_lag_factor', true),
        deflectionLimit_pct: num('deflection_limit_pct', true),
        yearLaid: { type: DataTypes.SMALLINT.UNSIGNED, allowNull: true, field: 'year_laid' },
        positionalAccuracy_m: num('positional_accuracy_m', true),
        positionalQuality: {
          type: DataTypes.STRING(16),
          allowNull: false,
          field: 'positional_quality',
        },
        length_m: num('length_m'),
        baselineVerdict: { type: DataTypes.STRING(16), allowNull: true, field: 'baseline_verdict' },
        baselineGoverningCheck: {
          type: DataTypes.STRING(32),
          allowNull: true,
          field: 'baseline_governing_check',
        },
        baselineUtilisation: num('baseline_utilisation', true),
        baselineOverCapacity: {
          type: DataTypes.BOOLEAN,
          allowNull: false,
          field: 'baseline_over_capacity',
        },
        baselineResult: { type: DataTypes.JSON, allowNull: true, field: 'baseline_result' },
        baselineEngineVersion: {
          type: DataTypes.STRING(32),
          allowNull: true,
          field: 'baseline_engine_version',
        },
        baselineError: { type: DataTypes.STRING(500), allowNull: true, field: 'baseline_error' },
        lastImportId: { type: DataTypes.BIGINT.UNSIGNED, allowNull: true, field: 'last_import_id' },
        version: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, defaultValue: 1 },
        createdAt: { type: DataTypes.DATE(3), field: 'created_at' },
        updatedAt: { type: DataTypes.DATE(3), field: 'updated_at' },
      },
      { sequelize, tableName: 'pipe_segments', underscored: true },
    )
  }
}
