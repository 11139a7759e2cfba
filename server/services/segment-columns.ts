import type { PipeSegmentData } from '../../shared/types/network.ts'

/**
 * The table column of every stored design-data field, in one place, so the batch writer, the
 * edit and the export agree. Column names carry the unit as the field names do.
 */
export const SEGMENT_DATA_COLUMNS: Readonly<Record<keyof PipeSegmentData, string>> = {
  ownerRef: 'owner_ref',
  medium: 'medium',
  material: 'material',
  outerDiameter_m: 'outer_diameter_m',
  wallThickness_m: 'wall_thickness_m',
  shortTermModulus_MPa: 'short_term_modulus_MPa',
  longTermModulus_MPa: 'long_term_modulus_MPa',
  allowableStress_MPa: 'allowable_stress_MPa',
  crushingStrength_kN_per_m: 'crushing_strength_kN_per_m',
  beddingFactor: 'bedding_factor',
  crushingSafetyFactor: 'crushing_safety_factor',
  internalPressure_kPa: 'internal_pressure_kPa',
  coverStart_m: 'cover_start_m',
  coverEnd_m: 'cover_end_m',
  installation: 'installation',
  trenchWidth_m: 'trench_width_m',
  wallFrictionKMu: 'wall_friction_k_mu',
  backfillUnitWeight_kN_per_m3: 'backfill_unit_weight_kN_per_m3',
  frictionAngle_deg: 'friction_angle_deg',
  sidefillModulus_MPa: 'sidefill_modulus_MPa',
  beddingAngle_deg: 'bedding_angle_deg',
  groundwaterAboveCrown_m: 'groundwater_above_crown_m',
  designTrafficPressure_kPa: 'design_traffic_pressure_kPa',
  deflectionLagFactor: 'deflection_lag_factor',
  deflectionLimit_pct: 'deflection_limit_pct',
  yearLaid: 'year_laid',
  positionalAccuracy_m: 'positional_accuracy_m',
  positionalQuality: 'positional_quality',
}

export const SEGMENT_DATA_FIELDS = Object.keys(SEGMENT_DATA_COLUMNS) as (keyof PipeSegmentData)[]

/** WKT of a projected line, coordinates to the millimetre. */
export function gridLineWkt(grid: readonly (readonly number[])[]): string {
  return `LINESTRING(${grid.map((p) => `${(p[0] as number).toFixed(3)} ${(p[1] as number).toFixed(3)}`).join(',')})`
}
