/**
 * Bending moments in a thin elastic ring (a rigid pipe's cross-section) under a uniform vertical
 * pressure on the upper half, reacted by a uniform pressure over the horizontal projection of the
 * bedding arc, plus a uniform horizontal pressure over the full height.
 *
 * Closed form (our derivation from ring compatibility, methods.md 6.2 [C]): with the angle θ
 * measured from the crown, r = mean radius, q_v = 1 and 2α the bedding angle, the statically
 * determinate moment of the loads on the arc from the crown to θ is
 *   L(θ) = sin²θ/2                                           for θ ≤ π/2
 *   L(θ) = sin θ − 1/2 (+ (sin α − sin θ)²/(2 sin α) on the bedding arc θ ≥ π − α)  for θ > π/2.
 * The closed-ring conditions (no rotation and no horizontal movement between crown and invert)
 * give the crown redundants from I0 = ∫L dθ and I1 = ∫L·cos θ dθ over [0, π]:
 *   I0 = 1 − π/8 + [α·sin²α − 2·sin α·(1 − cos α) + α/2 − sin 2α/4]/(2·sin α),  I1 = cos²α/6,
 *   m(θ) = (I0 + 2·I1)/π − (2·I1/π)·(1 − cos θ) − L(θ)   (positive = tension on the inside).
 * A uniform horizontal pressure q_h adds (−1/4, +1/4, −1/4)·q_h·r² at crown, springline, invert.
 * This reproduces the tabulated coefficients of methods.md 6.2 and Spangler's bedding constants.
 */
import { degToRad } from '../units.ts'
import { requireInRange, requireNonNegative } from './guards.ts'

/** Name of the method, as reported in check results. */
export const RING_BENDING_METHOD =
  'Elastic ring moments for the bedding angle (thin ring, uniform pressures; Roark ch. 9)'

/** Moment coefficients m (M = m·q·r²) at the three key sections; positive = tension inside. */
export interface RingMomentCoefficients {
  crown: number
  springline: number
  invert: number
}

/**
 * Returns the moment coefficients m (M = m·q_v·r²) at crown, springline and invert for a
 * vertical pressure q_v with the reaction spread over the bedding angle.
 *
 * @param beddingAngle_deg - 2α, degrees, [0, 180] (0 = line support at the invert)
 * @returns coefficients, dimensionless
 *
 * Source: thin-ring model of methods.md 6.2 [C], which reproduces MOSER 3rd ed. Table 3.3 (Spangler
 * bedding constants) and the A127 moment tables as remembered [M]; Roark's Formulas for Stress
 * and Strain, 7th ed., ch. 9 (ring theory).
 */
export function verticalLoadMomentCoefficients(beddingAngle_deg: number): RingMomentCoefficients {
  requireInRange('beddingAngle_deg', beddingAngle_deg, 0, 180)
  const alpha = degToRad(beddingAngle_deg) / 2
  const sinA = Math.sin(alpha)
  const cosA = Math.cos(alpha)
  // Bedding-arc part of I0; its limit is 0 as α → 0 (series avoids 0/0 below 1e-6 rad).
  const beddingPart =
    alpha < 1e-6
      ? 0
      : (alpha * sinA * sinA - 2 * sinA * (1 - cosA) + alpha / 2 - Math.sin(2 * alpha) / 4) /
        (2 * sinA)
  const i0 = 1 - Math.PI / 8 + beddingPart
  const i1 = (cosA * cosA) / 6
  const crown = (i0 + 2 * i1) / Math.PI
  const springline = i0 / Math.PI - 0.5
  const invert = (i0 - 2 * i1) / Math.PI + (1 - sinA) / 2
  return { crown, springline, invert }
}

/** Moment coefficients of a uniform horizontal pressure over the full height (M = m·q_h·r²). */
export const HORIZONTAL_PRESSURE_MOMENT_COEFFICIENTS: Readonly<RingMomentCoefficients> = {
  crown: -0.25,
  springline: 0.25,
  invert: -0.25,
}

/**
 * Returns the ring moments in kN·m/m at crown, springline and invert.
 *
 * @param verticalPressure_kPa - q_v over the upper half's horizontal projection, kPa, >= 0
 * @param horizontalPressure_kPa - q_h over the full height, kPa, >= 0
 * @param meanRadius_m - r, m, (0, 5]
 * @param beddingAngle_deg - 2α, degrees, [0, 180]
 * @returns moments, kN·m per metre of pipe (positive = tension inside)
 *
 * Source: methods.md 6.2 [C] (superposition of the vertical and horizontal cases).
 */
export function ringMoments_kNm_per_m(
  verticalPressure_kPa: number,
  horizontalPressure_kPa: number,
  meanRadius_m: number,
  beddingAngle_deg: number,
): RingMomentCoefficients {
  requireNonNegative('verticalPressure_kPa', verticalPressure_kPa)
  requireNonNegative('horizontalPressure_kPa', horizontalPressure_kPa)
  requireInRange('meanRadius_m', meanRadius_m, 0, 5, { minExclusive: true })
  const m = verticalLoadMomentCoefficients(beddingAngle_deg)
  const r2 = meanRadius_m * meanRadius_m
  const h = HORIZONTAL_PRESSURE_MOMENT_COEFFICIENTS
  return {
    crown: (m.crown * verticalPressure_kPa + h.crown * horizontalPressure_kPa) * r2,
    springline: (m.springline * verticalPressure_kPa + h.springline * horizontalPressure_kPa) * r2,
    invert: (m.invert * verticalPressure_kPa + h.invert * horizontalPressure_kPa) * r2,
  }
}

/**
 * Returns the largest absolute ring bending stress in MPa at crown, springline or invert,
 * σ = 6·|M|/t² (solid wall).
 *
 * @param moments - ring moments, kN·m/m
 * @param wallThickness_m - t, m, (0, 2]
 * @returns stress, MPa
 *
 * Source: elastic bending of a rectangular wall section (Roark's Formulas, 7th ed., ch. 9).
 */
export function maxRingBendingStress_MPa(
  moments: RingMomentCoefficients,
  wallThickness_m: number,
): number {
  requireInRange('wallThickness_m', wallThickness_m, 0, 2, { minExclusive: true })
  const maxMoment = Math.max(
    Math.abs(moments.crown),
    Math.abs(moments.springline),
    Math.abs(moments.invert),
  )
  return (6 * maxMoment) / (wallThickness_m * wallThickness_m) / 1000
}

/**
 * Returns the moments of a ring under two opposite line loads P (three-edge-bearing idealisation)
 * as coefficients of P·r: +1/π at the load points, −(1/2 − 1/π) at the springline.
 *
 * Source: Roark's Formulas for Stress and Strain, 7th ed., Table 9.2 [M], re-derived [C]
 * (methods.md 6.1).
 */
export function twoLineLoadMomentCoefficients(): { loadPoint: number; springline: number } {
  return { loadPoint: 1 / Math.PI, springline: -(0.5 - 1 / Math.PI) }
}

/**
 * Returns the theoretical bedding factor: the largest moment in the three-edge-bearing test
 * (W·r/π) over the largest field moment for the bedding angle (m_max/2·W·r), no lateral pressure.
 * An upper bound; published design factors are lower.
 *
 * @param beddingAngle_deg - 2α, degrees, [0, 180]
 *
 * Source: methods.md 6.3 [C] (60° → 1.69, 90° → 2.03, 120° → 2.31, 180° → 2.55).
 */
export function theoreticalBeddingFactor(beddingAngle_deg: number): number {
  const m = verticalLoadMomentCoefficients(beddingAngle_deg)
  const maxField = Math.max(Math.abs(m.crown), Math.abs(m.springline), Math.abs(m.invert)) / 2
  return twoLineLoadMomentCoefficients().loadPoint / maxField
}
