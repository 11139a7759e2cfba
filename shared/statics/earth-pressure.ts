/**
 * Lateral earth pressure coefficients and the horizontal reach of the active (Rankine) failure
 * wedge behind a vertical cut; the wall-friction, lateral-support and undermining rules use them.
 */
import { degToRad } from '../units.ts'
import { requireInRange, requireNonNegative } from './guards.ts'

/**
 * Returns Rankine's active earth pressure coefficient K_a = tan²(45° − φ'/2) (dimensionless).
 *
 * @param frictionAngle_deg - φ', degrees, [0, 60]
 *
 * Source: Rankine (1857), level ground and a smooth vertical wall (methods.md 5).
 */
export function rankineActiveCoefficient(frictionAngle_deg: number): number {
  requireInRange('frictionAngle_deg', frictionAngle_deg, 0, 60)
  const t = Math.tan(degToRad(45 - frictionAngle_deg / 2))
  return t * t
}

/**
 * Returns Rankine's passive earth pressure coefficient K_p = tan²(45° + φ'/2) (dimensionless).
 *
 * @param frictionAngle_deg - φ', degrees, [0, 60]
 *
 * Source: Rankine (1857) (methods.md 5).
 */
export function rankinePassiveCoefficient(frictionAngle_deg: number): number {
  requireInRange('frictionAngle_deg', frictionAngle_deg, 0, 60)
  const t = Math.tan(degToRad(45 + frictionAngle_deg / 2))
  return t * t
}

/**
 * Returns the at-rest earth pressure coefficient K_0 = 1 − sin φ' (dimensionless), normally
 * consolidated soil.
 *
 * @param frictionAngle_deg - φ', degrees, [0, 60]
 *
 * Source: Jaky (1944) (methods.md 5).
 */
export function atRestCoefficient(frictionAngle_deg: number): number {
  requireInRange('frictionAngle_deg', frictionAngle_deg, 0, 60)
  return 1 - Math.sin(degToRad(frictionAngle_deg))
}

/**
 * Returns the angle of the active failure plane behind a vertical cut, from the horizontal:
 * θ_a = 45° + φ'/2, in degrees.
 *
 * @param frictionAngle_deg - φ', degrees, [0, 60]
 *
 * Source: Rankine (1857) (methods.md 5, table 5.1–5.4).
 */
export function activeWedgeAngle_deg(frictionAngle_deg: number): number {
  requireInRange('frictionAngle_deg', frictionAngle_deg, 0, 60)
  return 45 + frictionAngle_deg / 2
}

/**
 * Returns the horizontal reach in m of the active wedge of a vertical face of given height,
 * measured from the face at the top of that height: height / tan(45° + φ'/2).
 *
 * @param height_m - height of the face above the level considered, m, [0, 100]
 * @param frictionAngle_deg - φ', degrees, [0, 60]
 * @returns horizontal reach, m
 *
 * Source: methods.md 5 (H_exc·tan(45° − φ'/2) = H_exc / tan(45° + φ'/2)) [M, standard]; check 5.5.
 */
export function activeWedgeReach_m(height_m: number, frictionAngle_deg: number): number {
  requireNonNegative('height_m', height_m)
  requireInRange('height_m', height_m, 0, 100)
  return height_m / Math.tan(degToRad(activeWedgeAngle_deg(frictionAngle_deg)))
}
