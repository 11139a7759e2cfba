/**
 * Thin-wall (Barlow) stresses from internal pressure.
 */
import { KPA_PER_MPA } from '../units.ts'
import { requireInRange } from './guards.ts'

/** Name of the method, as reported in check results. */
export const BARLOW_METHOD = 'Barlow thin-wall hoop stress (outside diameter)'

/**
 * Returns the hoop stress σ_θ = p·D/(2t) in MPa, with D the outside diameter (conservative).
 *
 * @param internalPressure_kPa - gauge pressure p, kPa, [0, 100 000]
 * @param outerDiameter_m - D, m, (0, 10]
 * @param wallThickness_m - t, m, (0, D/2)
 * @returns σ_θ, MPa
 *
 * Source: Barlow formula (methods.md 1; check 1.1 is the textbook identity).
 */
export function barlowHoopStress_MPa(
  internalPressure_kPa: number,
  outerDiameter_m: number,
  wallThickness_m: number,
): number {
  requireInRange('internalPressure_kPa', internalPressure_kPa, 0, 100_000)
  requireInRange('outerDiameter_m', outerDiameter_m, 0, 10, { minExclusive: true })
  requireInRange('wallThickness_m', wallThickness_m, 0, outerDiameter_m / 2, {
    minExclusive: true,
    maxExclusive: true,
  })
  return (internalPressure_kPa * outerDiameter_m) / (2 * wallThickness_m) / KPA_PER_MPA
}

/**
 * Returns the longitudinal stress of a closed-end pipe from pressure thrust, p·D/(4t), in MPa
 * (half the hoop stress).
 *
 * @param internalPressure_kPa - p, kPa, [0, 100 000]
 * @param outerDiameter_m - D, m, (0, 10]
 * @param wallThickness_m - t, m, (0, D/2)
 *
 * Source: Barlow / thin-shell identity (methods.md 1).
 */
export function barlowLongitudinalStress_MPa(
  internalPressure_kPa: number,
  outerDiameter_m: number,
  wallThickness_m: number,
): number {
  return barlowHoopStress_MPa(internalPressure_kPa, outerDiameter_m, wallThickness_m) / 2
}

/**
 * Returns the nominal pressure rating PN in bar of a plastics pressure pipe:
 * PN = 20·σ_s/(SDR − 1) (mean-diameter convention).
 *
 * @param designStress_MPa - σ_s = MRS/C, MPa, (0, 100]
 * @param standardDimensionRatio - SDR = D/t, dimensionless, (2, 200]
 *
 * Source: ISO 4065 / ISO 4427 / EN 12201 convention [M] (methods.md 1, checks 1.2, 1.3).
 */
export function plasticsPressureRating_bar(
  designStress_MPa: number,
  standardDimensionRatio: number,
): number {
  requireInRange('designStress_MPa', designStress_MPa, 0, 100, { minExclusive: true })
  requireInRange('standardDimensionRatio', standardDimensionRatio, 2, 200, { minExclusive: true })
  return (20 * designStress_MPa) / (standardDimensionRatio - 1)
}
