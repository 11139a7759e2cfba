/**
 * Project rule: when an excavation makes the original trench wall lose the friction that the
 * silo factor counts on.
 *
 * The silo reduction needs stable, undisturbed native trench walls (methods.md 2.2, limits). A
 * wall is taken as disturbed when an excavation comes at or inside the horizontal reach of
 * either active (Rankine) wedge:
 *   - the trench wall's own wedge, of height = cover (the wall that carries the friction on the
 *     backfill above the crown), and
 *   - the excavation face's wedge, of height = excavation depth,
 * i.e. when the plan distance from the footprint to either wall line (x = ±B/2, measured inside
 * or outside the trench) is ≤ max(cover, depth)·tan(45° − φ'/2). A footprint that reaches or
 * crosses a wall line has distance 0. The larger of the two wedges is used whatever the support,
 * because sheeting and boxes still let the soil behind them move.
 */
import { activeWedgeReach_m } from './earth-pressure.ts'
import { distanceToLine_m, type Bounds } from './footprint-geometry.ts'
import { requirePositive } from './guards.ts'
import type { PipeGeometry } from './pipe-geometry.ts'

export interface WallFrictionRuleResult {
  /** True when the excavation disturbs a trench wall (friction no longer counted). */
  lost: boolean
  /** Horizontal reach of the governing active wedge, m. */
  reach_m: number
  /** Plan distance from the footprint to the nearer trench wall line, m (0 if it reaches it). */
  distanceToWall_m: number
}

/**
 * Applies the wall-friction rule to one excavation. For an embankment (no trench walls) the
 * result is never `lost`.
 *
 * @param bounds - plan bounds of the excavation footprint, m
 * @param depth_m - excavation depth, m, > 0
 * @param pipe - pipe geometry
 *
 * Source: project rule (shared/statics/README.md), built on the Rankine active wedge of
 * methods.md 5 and the checker advice of methods.md 2 ("Excavation beside the trench ... the trench
 * wall that carried the silo friction is lost or loosened. Set κ = 1").
 */
export function wallFrictionRule(
  bounds: Bounds,
  depth_m: number,
  pipe: PipeGeometry,
): WallFrictionRuleResult {
  requirePositive('depth_m', depth_m)
  const reach_m = activeWedgeReach_m(Math.max(pipe.cover_m, depth_m), pipe.frictionAngle_deg)
  if (pipe.trenchWidth_m === null) return { lost: false, reach_m, distanceToWall_m: Infinity }
  const half = pipe.trenchWidth_m / 2
  const distanceToWall_m = Math.min(distanceToLine_m(bounds, half), distanceToLine_m(bounds, -half))
  return { lost: distanceToWall_m <= reach_m, reach_m, distanceToWall_m }
}
