/**
 * Crushing check of rigid pipes by the indirect (three-edge-bearing) design method.
 */
import { requireInRange, requireNonNegative } from './guards.ts'

/** Name of the method, as reported in check results. */
export const CRUSHING_METHOD =
  'Marston–Spangler three-edge-bearing with bedding factor (indirect design)'

/**
 * Returns the field crushing capacity in kN/m: TEB strength · bedding factor / safety factor.
 *
 * @param crushingStrength_kN_per_m - three-edge-bearing strength, kN/m, (0, 10 000]
 * @param beddingFactor - field strength / TEB strength, dimensionless, [1, 5]
 * @param safetyFactor - dimensionless, [1, 5]
 * @returns allowable field load, kN/m
 *
 * Source: MOSER, Buried Pipe Design, 3rd ed., Eq. 3.1 p.79 and Eq. 3.2 (methods.md 6.3).
 */
export function crushingCapacity_kN_per_m(
  crushingStrength_kN_per_m: number,
  beddingFactor: number,
  safetyFactor: number,
): number {
  requireInRange('crushingStrength_kN_per_m', crushingStrength_kN_per_m, 0, 10_000, {
    minExclusive: true,
  })
  requireInRange('beddingFactor', beddingFactor, 1, 5)
  requireInRange('safetyFactor', safetyFactor, 1, 5)
  return (crushingStrength_kN_per_m * beddingFactor) / safetyFactor
}

/**
 * Returns the TEB strength in kN/m a pipe needs for a field load: W·SF/BF.
 *
 * @param fieldLoad_kN_per_m - total field load W, kN/m, >= 0
 * @param safetyFactor - SF, dimensionless, [1, 5]
 * @param beddingFactor - BF, dimensionless, [1, 5]
 *
 * Source: MOSER, Buried Pipe Design, 3rd ed., Eq. 3.2 and Ex. 3.1 p.82 (methods.md 6.3, 6.6–6.8).
 */
export function requiredThreeEdgeBearingStrength_kN_per_m(
  fieldLoad_kN_per_m: number,
  safetyFactor: number,
  beddingFactor: number,
): number {
  requireNonNegative('fieldLoad_kN_per_m', fieldLoad_kN_per_m)
  requireInRange('safetyFactor', safetyFactor, 1, 5)
  requireInRange('beddingFactor', beddingFactor, 1, 5)
  return (fieldLoad_kN_per_m * safetyFactor) / beddingFactor
}

/**
 * Returns the D-load (TEB strength per metre of inside diameter) in kN/m per m.
 *
 * @param threeEdgeBearingStrength_kN_per_m - kN/m, >= 0
 * @param insideDiameter_m - m, (0, 10]
 *
 * Source: MOSER, Buried Pipe Design, 3rd ed., p.78 (methods.md 6.3).
 */
export function dLoad_kN_per_m_per_m(
  threeEdgeBearingStrength_kN_per_m: number,
  insideDiameter_m: number,
): number {
  requireNonNegative('threeEdgeBearingStrength_kN_per_m', threeEdgeBearingStrength_kN_per_m)
  requireInRange('insideDiameter_m', insideDiameter_m, 0, 10, { minExclusive: true })
  return threeEdgeBearingStrength_kN_per_m / insideDiameter_m
}
