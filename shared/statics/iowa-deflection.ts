/**
 * Ring deflection of a flexible buried pipe by the modified Iowa formula.
 */
import { KPA_PER_MPA } from '../units.ts'
import { requireInRange, requireNonNegative } from './guards.ts'

/** Name of the method, as reported in check results. */
export const IOWA_METHOD = 'Modified Iowa formula (Spangler 1941; Watkins & Spangler 1958)'

/** Coefficient of the sidefill term of the Iowa formula. Source: MOSER 3rd ed. Eq. 3.4 p.85, p.87. */
export const IOWA_SIDEFILL_COEFFICIENT = 0.061

/** Inputs of the split (long-term / short-term) modified Iowa formula. */
export interface IowaDeflectionInput {
  /** Bedding constant K, dimensionless, [0.05, 0.15]. */
  beddingConstant: number
  /** Deflection lag factor D_L applied to the permanent pressure, dimensionless, [1, 3]. */
  lagFactor: number
  /** Permanent vertical pressure at the crown (soil, long-term surcharge), kPa, >= 0. */
  permanentPressure_kPa: number
  /** Transient vertical pressure at the crown (short-term surcharge, traffic), kPa, >= 0. */
  transientPressure_kPa: number
  /** E_long·I/r³, kPa, > 0. */
  longTermRingStiffness_kPa: number
  /** E_short·I/r³, kPa, > 0. */
  shortTermRingStiffness_kPa: number
  /** Modulus of soil reaction E', MPa, [0, 100]. */
  sidefillModulus_MPa: number
}

/**
 * Returns the ring deflection Δy/D in percent by the modified Iowa formula, split into a
 * permanent part (lag factor, long-term ring stiffness) and a transient part (no lag, short-term
 * ring stiffness):
 *
 * 100·K·( D_L·p_perm/(E_long·I/r³ + 0.061·E') + p_trans/(E_short·I/r³ + 0.061·E') ).
 *
 * @returns deflection, % of the diameter
 *
 * Source: MOSER, Buried Pipe Design, 3rd ed., Eq. 3.4 p.85 and p.87 (modified Iowa formula,
 * E' = e·r); issue 3 (split form); methods.md 7.1 and 9 (D_L = 1.0 and short-term E for
 * short-term loads).
 */
export function iowaDeflection_pct(input: IowaDeflectionInput): number {
  requireInRange('beddingConstant', input.beddingConstant, 0.05, 0.15)
  requireInRange('lagFactor', input.lagFactor, 1, 3)
  requireNonNegative('permanentPressure_kPa', input.permanentPressure_kPa)
  requireNonNegative('transientPressure_kPa', input.transientPressure_kPa)
  requireInRange('longTermRingStiffness_kPa', input.longTermRingStiffness_kPa, 0, Infinity, {
    minExclusive: true,
  })
  requireInRange('shortTermRingStiffness_kPa', input.shortTermRingStiffness_kPa, 0, Infinity, {
    minExclusive: true,
  })
  requireInRange('sidefillModulus_MPa', input.sidefillModulus_MPa, 0, 100)
  const soil_kPa = IOWA_SIDEFILL_COEFFICIENT * input.sidefillModulus_MPa * KPA_PER_MPA
  return (
    100 *
    input.beddingConstant *
    ((input.lagFactor * input.permanentPressure_kPa) /
      (input.longTermRingStiffness_kPa + soil_kPa) +
      input.transientPressure_kPa / (input.shortTermRingStiffness_kPa + soil_kPa))
  )
}
