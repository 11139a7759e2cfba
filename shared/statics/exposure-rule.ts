/**
 * Project rule: how long a stretch of pipe an excavation across it leaves without support.
 *
 * An excavation whose footprint reaches the pipe's outline in plan (|x| ≤ D/2) and whose bottom is
 * below the crown exposes the pipe. The whole length of the footprint along the pipe inside that
 * band counts as unsupported, even when the bottom stays above the invert, because digging around
 * an exposed pipe disturbs its bedding. When the bottom is below the bedding base, the soil under
 * the pipe beyond each end face lies in that face's active wedge, so the span grows by
 * (depth − bedding base depth)/tan(45° + φ'/2) at each end. Overlapping exposures merge; the
 * longest merged stretch is checked.
 */
import { activeWedgeReach_m } from './earth-pressure.ts'
import { yExtentWithinAxisBand_m } from './footprint-geometry.ts'
import type { PipeGeometry } from './pipe-geometry.ts'
import type { ExcavationActivity } from './types.ts'

/** One exposed stretch along the pipe axis. */
export interface Exposure {
  activityIds: string[]
  yStart_m: number
  yEnd_m: number
  span_m: number
}

/**
 * Returns the exposed stretch an excavation leaves, or null when it does not expose the pipe.
 *
 * @param excavation - the excavation activity
 * @param pipe - pipe geometry
 *
 * Source: project rule (shared/statics/README.md) on methods.md 10.3 (exposed span) and 5 (wedge).
 */
export function exposureOf(excavation: ExcavationActivity, pipe: PipeGeometry): Exposure | null {
  if (excavation.depth_m <= pipe.cover_m) return null
  const extent = yExtentWithinAxisBand_m(excavation.footprint, pipe.outerDiameter_m / 2)
  if (extent === null) return null
  const below = excavation.depth_m - pipe.beddingBaseDepth_m
  const extension = below > 0 ? activeWedgeReach_m(below, pipe.frictionAngle_deg) : 0
  const yStart_m = extent[0] - extension
  const yEnd_m = extent[1] + extension
  return { activityIds: [excavation.id], yStart_m, yEnd_m, span_m: yEnd_m - yStart_m }
}

/**
 * Returns the exposures merged where they overlap, longest first.
 *
 * @param exposures - single exposures
 */
export function mergeExposures(exposures: readonly Exposure[]): Exposure[] {
  const sorted = [...exposures].sort((a, b) => a.yStart_m - b.yStart_m)
  const merged: Exposure[] = []
  for (const exposure of sorted) {
    const last = merged[merged.length - 1]
    if (last && exposure.yStart_m <= last.yEnd_m) {
      last.yEnd_m = Math.max(last.yEnd_m, exposure.yEnd_m)
      last.span_m = last.yEnd_m - last.yStart_m
      last.activityIds = [...last.activityIds, ...exposure.activityIds]
    } else {
      merged.push({ ...exposure, activityIds: [...exposure.activityIds] })
    }
  }
  return merged.sort((a, b) => b.span_m - a.span_m)
}
