/**
 * Project rule (on the published wedge test): when an excavation beside the pipe leaves the pipe's
 * support in its failure wedge.
 *
 * An excavation beside the pipe whose bottom is below the bedding base undermines the pipe when
 * its face is at or closer than (depth − bedding base depth)/tan(45° + φ'/2) to the pipe's
 * outside wall (plan). The bedding base is taken at the outside invert (no bedding thickness
 * credited) and the distance is measured to the wall, not the axis; both make the test stricter.
 * Sheet piling and bracing retain the face: the pipe is still flagged `undermined`, but the
 * verdict turns on a condition that the support is designed for the pipe's load instead of
 * being critical.
 */
import { activeWedgeReach_m } from './earth-pressure.ts'
import { distanceToAxisBand_m, sideOfAxis, type Bounds } from './footprint-geometry.ts'
import { requirePositive } from './guards.ts'
import { isUnretainedSupport } from './lateral-support-rule.ts'
import type { PipeGeometry } from './pipe-geometry.ts'
import type { ExcavationSupport } from './types.ts'

export interface UnderminingRuleResult {
  undermined: boolean
  /** True when undermined and the face is not retained (none, sloped, trench box): critical. */
  critical: boolean
  /** Horizontal reach of the wedge from the bedding base, m (0 when the bottom is not below it). */
  wedgeReach_m: number
  clearDistance_m: number
}

/**
 * Applies the undermining rule to one excavation.
 *
 * @param bounds - plan bounds of the excavation footprint, m
 * @param depth_m - excavation depth, m, > 0
 * @param support - the excavation's support system
 * @param pipe - pipe geometry
 *
 * Source: methods.md 5, "Undermining test" (s ≥ (z_exc − z_base)·cot θ, θ = 45° + φ'/2) and
 * checks 5.5–5.6; issue 3 (verdict and support exception).
 */
export function underminingRule(
  bounds: Bounds,
  depth_m: number,
  support: ExcavationSupport,
  pipe: PipeGeometry,
): UnderminingRuleResult {
  requirePositive('depth_m', depth_m)
  const clearDistance_m = distanceToAxisBand_m(bounds, pipe.outerDiameter_m / 2)
  const below = depth_m - pipe.beddingBaseDepth_m
  if (sideOfAxis(bounds) === 0 || below <= 0) {
    return { undermined: false, critical: false, wedgeReach_m: 0, clearDistance_m }
  }
  const wedgeReach_m = activeWedgeReach_m(below, pipe.frictionAngle_deg)
  const undermined = clearDistance_m <= wedgeReach_m
  return {
    undermined,
    critical: undermined && isUnretainedSupport(support),
    wedgeReach_m,
    clearDistance_m,
  }
}
