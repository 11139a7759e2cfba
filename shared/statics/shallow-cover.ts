/**
 * Shallow cover: local loads are hardly spread before they reach the pipe.
 */
import { requirePositive } from './guards.ts'

/** Absolute cover below which the pipe counts as shallow, m. Source: issue 3 ("below 1 m"). */
export const SHALLOW_COVER_LIMIT_m = 1
/** Cover in outside diameters below which the pipe counts as shallow. Source: issue 3. */
export const SHALLOW_COVER_DIAMETERS = 2

/**
 * Returns true when the cover is below 2 outside diameters or below 1 m.
 *
 * @param cover_m - ground to crown, m, > 0
 * @param outerDiameter_m - D, m, > 0
 *
 * Source: issue 3 ("cover below 2 outside diameters or below 1 m flags shallowCover").
 */
export function isShallowCover(cover_m: number, outerDiameter_m: number): boolean {
  requirePositive('cover_m', cover_m)
  requirePositive('outerDiameter_m', outerDiameter_m)
  return cover_m < SHALLOW_COVER_LIMIT_m || cover_m < SHALLOW_COVER_DIAMETERS * outerDiameter_m
}
