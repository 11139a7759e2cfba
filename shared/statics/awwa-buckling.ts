/**
 * Buckling of a buried flexible pipe: the AWWA allowable buckling pressure with its water
 * buoyancy factor, soil support factor and design factor, and the unsupported ring as a floor.
 */
import { KPA_PER_MPA, UNIT_WEIGHT_WATER_kN_per_m3 } from '../units.ts'
import { requireInRange, requireNonNegative, requirePositive } from './guards.ts'

/** Name of the method, as reported in check results. */
export const AWWA_BUCKLING_METHOD = 'AWWA M45 buckling (AWWA M11 / C950 form)'

/**
 * Returns the AWWA empirical soil support coefficient B' = 1/(1 + 4·e^(−0.213·H)), H in m
 * (dimensionless). The metric constant 0.213 is the US 0.065 per foot converted.
 *
 * @param cover_m - cover H, m, (0, 100]
 *
 * Source: AWWA M11 / M45 via MOSER, Buried Pipe Design, 3rd ed., p.113 (methods.md 8.2; the
 * metric form is [C]).
 */
export function awwaSoilSupportFactor(cover_m: number): number {
  requireInRange('cover_m', cover_m, 0, 100, { minExclusive: true })
  return 1 / (1 + 4 * Math.exp(-0.213 * cover_m))
}

/**
 * Returns the water buoyancy factor R_w = 1 − 0.33·h_w/H (dimensionless, [0.67, 1]).
 *
 * @param groundwaterAboveCrown_m - h_w, m, [0, H]
 * @param cover_m - H, m, (0, 100]
 *
 * Source: AWWA M11 / M45 via MOSER, Buried Pipe Design, 3rd ed., p.113 (methods.md 8.2).
 */
export function waterBuoyancyFactor(groundwaterAboveCrown_m: number, cover_m: number): number {
  requireInRange('cover_m', cover_m, 0, 100, { minExclusive: true })
  requireInRange('groundwaterAboveCrown_m', groundwaterAboveCrown_m, 0, cover_m)
  return 1 - (0.33 * groundwaterAboveCrown_m) / cover_m
}

/**
 * Returns the AWWA buckling design factor FS: 2.5 when H/D ≥ 2, otherwise 3.0.
 *
 * @param cover_m - H, m, > 0
 * @param outerDiameter_m - D, m, > 0
 *
 * Source: AWWA M11 / M45 via MOSER, Buried Pipe Design, 3rd ed., p.113 (methods.md 8.2).
 */
export function awwaBucklingDesignFactor(cover_m: number, outerDiameter_m: number): number {
  requirePositive('cover_m', cover_m)
  requirePositive('outerDiameter_m', outerDiameter_m)
  return cover_m / outerDiameter_m >= 2 ? 2.5 : 3.0
}

/**
 * Returns the AWWA allowable buckling pressure in kPa:
 * q_a = (1/FS)·√(32·R_w·B'·E'·E·I/D_m³).
 *
 * @param designFactor - FS, dimensionless, [1, 10]
 * @param waterBuoyancy - R_w, dimensionless, [0, 1]
 * @param soilSupport - B', dimensionless, [0, 1]
 * @param sidefillModulus_MPa - E', MPa, [0, 100]
 * @param stiffnessOverMeanDiameterCubed_kPa - E·I/D_m³ (long-term E), kPa, > 0
 * @returns q_a, kPa
 *
 * Source: AWWA M11 ch. 6 / M45 / C950 via MOSER, Buried Pipe Design, 3rd ed., p.113 [S];
 * a page quoting AWWA M11 ch. 6 [S2] (methods.md 8.2).
 */
export function awwaAllowableBucklingPressure_kPa(
  designFactor: number,
  waterBuoyancy: number,
  soilSupport: number,
  sidefillModulus_MPa: number,
  stiffnessOverMeanDiameterCubed_kPa: number,
): number {
  requireInRange('designFactor', designFactor, 1, 10)
  requireInRange('waterBuoyancy', waterBuoyancy, 0, 1)
  requireInRange('soilSupport', soilSupport, 0, 1)
  requireInRange('sidefillModulus_MPa', sidefillModulus_MPa, 0, 100)
  requirePositive('stiffnessOverMeanDiameterCubed_kPa', stiffnessOverMeanDiameterCubed_kPa)
  return (
    Math.sqrt(
      32 *
        waterBuoyancy *
        soilSupport *
        sidefillModulus_MPa *
        KPA_PER_MPA *
        stiffnessOverMeanDiameterCubed_kPa,
    ) / designFactor
  )
}

/**
 * Returns the critical external pressure of an unsupported ring in plane stress,
 * p_cr = 3·E·I/r³, in kPa.
 *
 * @param ringStiffness_kPa - E·I/r³, kPa, > 0
 *
 * Source: MOSER, Buried Pipe Design, 3rd ed., Eq. 3.13 p.111 (methods.md 8.1).
 */
export function unsupportedRingBucklingPressure_kPa(ringStiffness_kPa: number): number {
  requirePositive('ringStiffness_kPa', ringStiffness_kPa)
  return 3 * ringStiffness_kPa
}

/**
 * Returns the critical external pressure of a long unsupported tube in plane strain,
 * p_cr = 2E/(1 − ν²)·(t/D)³, in MPa.
 *
 * @param modulus_MPa - E, MPa, (0, 300 000]
 * @param poissonRatio - ν, dimensionless, [0, 0.5)
 * @param diameterOverThickness - D/t, dimensionless, (2, 1000]
 * @returns p_cr, MPa
 *
 * Source: MOSER, Buried Pipe Design, 3rd ed., Eq. 3.14 p.111 (methods.md 8.1).
 */
export function unsupportedTubeBucklingPressure_MPa(
  modulus_MPa: number,
  poissonRatio: number,
  diameterOverThickness: number,
): number {
  requireInRange('modulus_MPa', modulus_MPa, 0, 300_000, { minExclusive: true })
  requireInRange('poissonRatio', poissonRatio, 0, 0.5, { maxExclusive: true })
  requireInRange('diameterOverThickness', diameterOverThickness, 2, 1000, { minExclusive: true })
  const ratio = 1 / diameterOverThickness
  return ((2 * modulus_MPa) / (1 - poissonRatio * poissonRatio)) * ratio * ratio * ratio
}

/**
 * Returns the AWWA buckling demand in kPa: γ_w·h_w + R_w·p_soil + p_surcharge + p_traffic.
 *
 * @param groundwaterAboveCrown_m - h_w, m, >= 0
 * @param waterBuoyancy - R_w, dimensionless, [0, 1]
 * @param soilPressure_kPa - soil pressure at the crown, kPa, >= 0
 * @param surcharge_kPa - surcharge at the crown, kPa, >= 0
 * @param traffic_kPa - live load at the crown, kPa, >= 0
 *
 * Source: AWWA M11 / M45 load combination with live load [M] (methods.md 8.2); issue 3.
 */
export function awwaBucklingDemand_kPa(
  groundwaterAboveCrown_m: number,
  waterBuoyancy: number,
  soilPressure_kPa: number,
  surcharge_kPa: number,
  traffic_kPa: number,
): number {
  requireNonNegative('groundwaterAboveCrown_m', groundwaterAboveCrown_m)
  requireInRange('waterBuoyancy', waterBuoyancy, 0, 1)
  requireNonNegative('soilPressure_kPa', soilPressure_kPa)
  requireNonNegative('surcharge_kPa', surcharge_kPa)
  requireNonNegative('traffic_kPa', traffic_kPa)
  return (
    UNIT_WEIGHT_WATER_kN_per_m3 * groundwaterAboveCrown_m +
    waterBuoyancy * soilPressure_kPa +
    surcharge_kPa +
    traffic_kPa
  )
}
