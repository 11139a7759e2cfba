/**
 * The few pipe dimensions every project rule needs, derived once from the design data.
 */
import { requireInRange } from './guards.ts'
import type { Installation } from './types.ts'

/** Pipe dimensions in the pipe-local frame (depths below ground, m). */
export interface PipeGeometry {
  outerDiameter_m: number
  cover_m: number
  /** Depth of the springline (pipe centre): cover + D/2. */
  springlineDepth_m: number
  /**
   * Depth of the bedding base used by the undermining rule. Project rule: taken at the pipe's
   * outside invert (cover + D), i.e. no bedding thickness is credited, which gives the largest
   * failure wedge and so the most conservative test.
   */
  beddingBaseDepth_m: number
  installation: Installation
  /** Trench width at the crown (trench installations), or null for an embankment. */
  trenchWidth_m: number | null
  frictionAngle_deg: number
  /**
   * Width of the pipe-zone fill beside the pipe wall on each side: (B − D)/2 in a trench; for an
   * embankment, where no width is recorded, D/2 (project rule).
   */
  embedmentWidth_m: number
}

/**
 * Returns the pipe geometry used by the rules.
 *
 * @param outerDiameter_m - D, m, (0, 10]
 * @param cover_m - ground to crown, m, (0, 100]
 * @param installation - 'trench' or 'embankment'
 * @param trenchWidth_m - trench width at the crown, m (>= D) for a trench, ignored otherwise
 * @param frictionAngle_deg - φ' of the soil, degrees, [0, 60]
 */
export function pipeGeometry(
  outerDiameter_m: number,
  cover_m: number,
  installation: Installation,
  trenchWidth_m: number | null | undefined,
  frictionAngle_deg: number,
): PipeGeometry {
  requireInRange('outerDiameter_m', outerDiameter_m, 0, 10, { minExclusive: true })
  requireInRange('cover_m', cover_m, 0, 100, { minExclusive: true })
  requireInRange('frictionAngle_deg', frictionAngle_deg, 0, 60)
  let width: number | null = null
  if (installation === 'trench') {
    if (trenchWidth_m === null || trenchWidth_m === undefined) {
      throw new RangeError('trenchWidth_m is required for a trench installation')
    }
    width = requireInRange('trenchWidth_m', trenchWidth_m, outerDiameter_m, 100)
  }
  return {
    outerDiameter_m,
    cover_m,
    springlineDepth_m: cover_m + outerDiameter_m / 2,
    beddingBaseDepth_m: cover_m + outerDiameter_m,
    installation,
    trenchWidth_m: width,
    frictionAngle_deg,
    embedmentWidth_m: width === null ? outerDiameter_m / 2 : (width - outerDiameter_m) / 2,
  }
}
