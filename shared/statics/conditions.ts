/**
 * Conditions solved numerically: how far an activity must move away from the pipe, or how large
 * a crane mat must be, for every check to stay at or below 1.0 (and the pipe not to be undermined
 * by an unretained face). Each search re-runs the numeric scenario with the one activity changed
 * and the others as planned.
 */
import {
  footprintBounds,
  footprintCentroid_m,
  scaleFootprintAboutCentroid,
  translateFootprintAcross,
} from './footprint-geometry.ts'
import { influenceDistance_m } from './influence-distance.ts'
import type { ResolvedPipe } from './resolve-pipe.ts'
import { evaluateScenario } from './scenario.ts'
import type { Activity } from './types.ts'

/** Resolution of the offset search, m: results are rounded up to this step. */
export const OFFSET_STEP_m = 0.1
/** Largest mat side the mat-size search proposes, m (common practice for crane mats). */
export const MAX_MAT_SIDE_m = 4
const SEARCH_TOLERANCE_m = 0.01

function acceptable(pipe: ResolvedPipe, activities: readonly Activity[]): boolean {
  return !evaluateScenario(pipe, activities).critical
}

function replaced(activities: readonly Activity[], index: number, activity: Activity): Activity[] {
  const copy = [...activities]
  copy[index] = activity
  return copy
}

/** Rounds a distance up to the next multiple of `step_m`, guarding against float noise. */
export function roundUpTo_m(value_m: number, step_m: number): number {
  return Math.ceil(value_m / step_m - 1e-9) * step_m
}

/** Result of the offset search. */
export interface OffsetSolution {
  /**
   * Smallest clear distance from the pipe centreline to the footprint's nearest edge, m, rounded
   * up to 0.1 m and never less than the pipe's half-width (no solved place is over the pipe).
   */
  distanceFromAxis_m: number
  /** Shift applied to the planned footprint, m (away from the pipe). */
  shift_m: number
}

/**
 * Returns the smallest distance from the pipe centreline to the nearest edge of the activity's
 * footprint at which the works are acceptable, moving the activity straight away from the pipe
 * (towards the side its centroid is on); null when the activity already passes, when it crosses
 * the pipe (an excavation across the pipe cannot be moved off it), or when no offset within its
 * influence distance is enough (something else fails).
 *
 * @param pipe - resolved pipe
 * @param activities - all activities as planned
 * @param index - which activity to move
 *
 * Source: project rule (shared/statics/README.md: condition solving), bisection on the offset.
 */
export function solveMinimumOffset(
  pipe: ResolvedPipe,
  activities: readonly Activity[],
  index: number,
): OffsetSolution | null {
  const activity = activities[index]
  if (!activity) throw new RangeError(`index must point at an activity (got ${index})`)
  if (acceptable(pipe, activities)) return null
  const bounds = footprintBounds(activity.footprint)
  if (activity.kind === 'excavation' && bounds.xMin_m <= 0 && bounds.xMax_m >= 0) return null
  const [cx] = footprintCentroid_m(activity.footprint)
  const direction = cx < 0 ? -1 : 1
  // Shift that brings the near edge to the axis (negative or zero when it is already clear of it).
  const nearEdge = direction > 0 ? bounds.xMin_m : -bounds.xMax_m
  const reach = influenceDistance_m(activity, 0, {
    minCover_m: pipe.cover_m,
    maxCover_m: pipe.cover_m,
    outerDiameter_m: pipe.outerDiameter_m,
    trenchWidth_m: pipe.trenchWidth_m ?? pipe.outerDiameter_m,
    frictionAngle_deg: pipe.frictionAngle_deg,
  })
  const width = bounds.xMax_m - bounds.xMin_m
  const moved = (shift: number): Activity[] =>
    replaced(activities, index, {
      ...activity,
      footprint: translateFootprintAcross(activity.footprint, direction * shift),
    })
  let low = 0
  let high = Math.max(0, -nearEdge) + width + reach + pipe.outerDiameter_m
  if (!acceptable(pipe, moved(high))) return null
  while (high - low > SEARCH_TOLERANCE_m) {
    const middle = (low + high) / 2
    if (acceptable(pipe, moved(middle))) high = middle
    else low = middle
  }
  // Never propose a place over the pipe itself: at least the pipe's half-width from the axis.
  const distanceFromAxis_m = roundUpTo_m(
    Math.max(pipe.outerDiameter_m / 2, nearEdge + high),
    OFFSET_STEP_m,
  )
  return { distanceFromAxis_m, shift_m: distanceFromAxis_m - nearEdge }
}

/** Result of the mat-size search. */
export interface MatSolution {
  /** Scale factor on both plan dimensions (>= 1). */
  scale: number
  /** Mat dimensions of the scaled bounding box, m, rounded up to 0.1 m. */
  width_m: number
  length_m: number
  area_m2: number
}

/**
 * Returns the smallest crane mat (the planned footprint scaled about its centre, same load) that
 * makes the works acceptable; null when the pad passes as planned, when even a mat of
 * MAX_MAT_SIDE_m is not enough, or for activities other than pads.
 *
 * @param pipe - resolved pipe
 * @param activities - all activities as planned
 * @param index - which pad to enlarge
 *
 * Source: project rule (shared/statics/README.md: condition solving), bisection on the scale.
 */
export function solveMinimumMatSize(
  pipe: ResolvedPipe,
  activities: readonly Activity[],
  index: number,
): MatSolution | null {
  const activity = activities[index]
  if (!activity) throw new RangeError(`index must point at an activity (got ${index})`)
  if (activity.kind !== 'pad') return null
  if (acceptable(pipe, activities)) return null
  const bounds = footprintBounds(activity.footprint)
  const largestSide = Math.max(bounds.xMax_m - bounds.xMin_m, bounds.yMax_m - bounds.yMin_m)
  const maxScale = MAX_MAT_SIDE_m / largestSide
  if (maxScale <= 1) return null
  const scaled = (scale: number): Activity[] =>
    replaced(activities, index, {
      ...activity,
      footprint: scaleFootprintAboutCentroid(activity.footprint, scale),
    })
  if (!acceptable(pipe, scaled(maxScale))) return null
  let low = 1
  let high = maxScale
  while ((high - low) * largestSide > SEARCH_TOLERANCE_m) {
    const middle = (low + high) / 2
    if (acceptable(pipe, scaled(middle))) high = middle
    else low = middle
  }
  const width_m = roundUpTo_m((bounds.xMax_m - bounds.xMin_m) * high, OFFSET_STEP_m)
  const length_m = roundUpTo_m((bounds.yMax_m - bounds.yMin_m) * high, OFFSET_STEP_m)
  return { scale: high, width_m, length_m, area_m2: width_m * length_m }
}
