/**
 * Project rule: how much sidefill support (E') an excavation beside the pipe removes.
 *
 * Only an excavation beside the pipe (its footprint does not reach the pipe's outline in plan)
 * and deeper than the springline counts. With s = plan clear distance from the pipe's outside
 * wall to the excavation face:
 *   - support lost on that side (factor 0) when the face cuts into the pipe-zone fill
 *     (s ≤ embedment width), or when the excavation is unsupported, sloped or trench-boxed and the
 *     springline lies in the face's active wedge: s ≤ (depth − springline depth)·tan(45° − φ'/2);
 *   - support halved (factor 0.5) when the face is within the lateral support zone,
 *     s ≤ max(2.304·D, that wedge reach): sheet piling or bracing inside the wedge, or any
 *     excavation in the zone outside it;
 *   - otherwise no reduction (factor 1).
 * The zone 2.304·D from the wall (2.804·D from the axis) is where A127's trench correction ζ
 * still feels the native soil: Leonhardt's f reaches its cap 1.44 at b/d_a = 5.608 (methods.md
 * 3.1, check 3.6), so soil beyond half that width no longer changes the pipe-zone stiffness.
 *
 * The sides combine: each side's loss (1 − factor) adds, so E'_withWorks = E'·max(0, f_left +
 * f_right − 1). For rigid pipes the same factor scales the horizontal soil pressure q_h.
 */
import { activeWedgeReach_m } from './earth-pressure.ts'
import { distanceToAxisBand_m, sideOfAxis, type Bounds } from './footprint-geometry.ts'
import { requirePositive } from './guards.ts'
import type { PipeGeometry } from './pipe-geometry.ts'
import type { ExcavationSupport } from './types.ts'

/**
 * Half-width of the lateral support zone beyond the pipe wall, in outside diameters:
 * 5.608/2 − 1/2. Source: methods.md 3.1 and check 3.6 [C] (Leonhardt's ζ in A127 [M]).
 */
export const LATERAL_SUPPORT_ZONE_PER_DIAMETER = 5.608 / 2 - 0.5

export type LateralSupportReason =
  | 'not-beside-or-not-deep'
  | 'embedment-cut'
  | 'in-active-wedge'
  | 'in-support-zone'
  | 'outside-zone'

export interface LateralSupportRuleResult {
  /** Share of this side's support kept: 0, 0.5 or 1. */
  factor: 0 | 0.5 | 1
  /** Side of the pipe: −1 (x < 0), +1 (x > 0), 0 when the footprint reaches the pipe. */
  side: -1 | 0 | 1
  reason: LateralSupportReason
  clearDistance_m: number
  wedgeReach_m: number
  zone_m: number
}

/** Returns true for supports that do not retain the soil face in contact (none, sloped, trench box). */
export function isUnretainedSupport(support: ExcavationSupport): boolean {
  return support === 'none' || support === 'sloped' || support === 'trench-box'
}

/**
 * Applies the lateral-support rule to one excavation.
 *
 * @param bounds - plan bounds of the excavation footprint, m
 * @param depth_m - excavation depth, m, > 0
 * @param support - the excavation's support system
 * @param pipe - pipe geometry
 *
 * Source: project rule (shared/statics/README.md), on methods.md 3.1 (ζ zone), 5 (active wedge)
 * and 7.1 (loss of sidefill: E' reduced, E' = 0 the most conservative option).
 */
export function lateralSupportRule(
  bounds: Bounds,
  depth_m: number,
  support: ExcavationSupport,
  pipe: PipeGeometry,
): LateralSupportRuleResult {
  requirePositive('depth_m', depth_m)
  const side = sideOfAxis(bounds)
  const clearDistance_m = distanceToAxisBand_m(bounds, pipe.outerDiameter_m / 2)
  const zone_m = LATERAL_SUPPORT_ZONE_PER_DIAMETER * pipe.outerDiameter_m
  const below = depth_m - pipe.springlineDepth_m
  const wedgeReach_m = below > 0 ? activeWedgeReach_m(below, pipe.frictionAngle_deg) : 0
  let factor: 0 | 0.5 | 1 = 1
  let reason: LateralSupportReason = 'outside-zone'
  if (side === 0 || below <= 0) reason = 'not-beside-or-not-deep'
  else if (clearDistance_m <= pipe.embedmentWidth_m) {
    factor = 0
    reason = 'embedment-cut'
  } else if (isUnretainedSupport(support) && clearDistance_m <= wedgeReach_m) {
    factor = 0
    reason = 'in-active-wedge'
  } else if (clearDistance_m <= Math.max(zone_m, wedgeReach_m)) {
    factor = 0.5
    reason = 'in-support-zone'
  }
  return { factor, side, reason, clearDistance_m, wedgeReach_m, zone_m }
}

/**
 * Returns the share of E' kept when several excavations act, from the worst factor per side:
 * max(0, f_left + f_right − 1).
 *
 * @param results - rule results of all excavations
 *
 * Source: project rule (shared/statics/README.md).
 */
export function combinedLateralSupportFactor(results: readonly LateralSupportRuleResult[]): number {
  let left = 1
  let right = 1
  for (const result of results) {
    if (result.side < 0) left = Math.min(left, result.factor)
    if (result.side > 0) right = Math.min(right, result.factor)
  }
  return Math.max(0, left + right - 1)
}
