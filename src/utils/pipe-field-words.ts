/** Plain labels and units of the engine's pipe fields, for the re-run form. */
export const PIPE_FIELD_LABELS: Record<string, string> = {
  outerDiameter_m: 'Outer diameter',
  wallThickness_m: 'Wall thickness',
  shortTermModulus_MPa: 'Short-term modulus',
  longTermModulus_MPa: 'Long-term modulus',
  allowableStress_MPa: 'Allowable stress',
  crushingStrength_kN_per_m: 'Crushing strength',
  beddingFactor: 'Bedding factor',
  crushingSafetyFactor: 'Safety factor on crushing',
  internalPressure_kPa: 'Internal pressure',
  cover_m: 'Cover to the crown',
  trenchWidth_m: 'Trench width at the crown',
  wallFrictionKMu: 'Wall friction K·μ′',
  backfillUnitWeight_kN_per_m3: 'Unit weight of the backfill',
  frictionAngle_deg: 'Friction angle of the soil',
  sidefillModulus_MPa: 'Side-fill stiffness E′',
  beddingAngle_deg: 'Bedding angle',
  groundwaterAboveCrown_m: 'Groundwater above the crown',
  designTrafficPressure_kPa: 'Design traffic pressure',
  deflectionLagFactor: 'Deflection lag factor',
  deflectionLimit_pct: 'Deflection limit',
}

const UNIT_SUFFIXES: [string, string][] = [
  ['_kN_per_m3', 'kN/m³'],
  ['_kN_per_m', 'kN/m'],
  ['_MPa', 'MPa'],
  ['_kPa', 'kPa'],
  ['_deg', '°'],
  ['_pct', '%'],
  ['_m', 'm'],
]

/** The unit a field name carries (e.g. cover_m → m); empty for plain numbers. */
export function unitOfField(name: string): string {
  for (const [suffix, unit] of UNIT_SUFFIXES) if (name.endsWith(suffix)) return unit
  return ''
}
