/**
 * Influence distance of an activity: the horizontal distance from its footprint edge beyond which
 * it cannot change any check of a pipe. The server uses it to pick candidate pipes before it runs
 * the engine; the engine uses it (with the actual pipe's data) for the trial-holes condition.
 *
 * Surface loads (pad, area, fill): the distance d at which an upper bound of the Boussinesq
 * stress falls below a small threshold at every plausible crown depth. For any footprint lying
 * wholly at plan distance ≥ d from the point, the stress is at most
 *   - the whole load Q concentrated at distance d: 3·Q·z³/(2π·(d² + z²)^{5/2}), and
 *   - the uniform pressure q over everything outside a disc of radius d: q·(1 + d²/z²)^{−3/2},
 * so the smaller of the two is a true upper bound, whatever the footprint's shape.
 *
 * Excavations: the largest reach of the rules that depend on distance (wall friction, lateral
 * support, undermining, hand-dig zone), with plausible worst-case pipe data unless the pipe's own
 * data are given, measured to the pipe axis (adds D/2 or B/2 to wall distances).
 */
import { activeWedgeReach_m } from './earth-pressure.ts'
import { footprintArea_m2 } from './footprint-geometry.ts'
import { requireInRange, requireNonNegative, requirePositive } from './guards.ts'
import { LATERAL_SUPPORT_ZONE_PER_DIAMETER } from './lateral-support-rule.ts'
import { surfaceLoadPressure_kPa } from './surcharge.ts'
import type { Activity } from './types.ts'

/** Pipe data assumed when the pipe is not known yet; every field can be overridden. */
export interface InfluenceEnvelope {
  /** Shallowest crown depth considered, m. Default 0.3 m. */
  minCover_m: number
  /** Deepest crown depth considered, m. Default 6 m (common practice for utility mains and sewers). */
  maxCover_m: number
  /** Widest pipe considered, m. Default 2.0 m. */
  outerDiameter_m: number
  /** Widest original trench considered at crown level, m. Default 3.0 m. */
  trenchWidth_m: number
  /** Lowest soil friction angle considered, degrees. Default 15° (A127 soil group G4, new edition [M]). */
  frictionAngle_deg: number
  /** Stress below which a surface load counts as negligible at the crown, kPa. Default 1 kPa. */
  stressThreshold_kPa: number
  /** Hand-dig zone width, m. Default 0.6 m (as in AssessmentOptions). */
  handDigDistance_m: number
}

/**
 * Default envelope. Sources: methods.md 2.2 (G4 φ' = 15° in DWA-A 127-1 [S: BFT article]) and
 * 10.2 (hand-dig widths); depths, diameters and widths are common practice; the 1 kPa threshold is
 * a project choice (under 3 % of the soil pressure of 1.5 m cover).
 */
export const DEFAULT_INFLUENCE_ENVELOPE: Readonly<InfluenceEnvelope> = {
  minCover_m: 0.3,
  maxCover_m: 6,
  outerDiameter_m: 2,
  trenchWidth_m: 3,
  frictionAngle_deg: 15,
  stressThreshold_kPa: 1,
  handDigDistance_m: 0.6,
}

const DEPTH_SAMPLES = 48
const BISECTION_STEPS = 50

/** Upper bound of the stress in kPa at depth z from a load wholly at plan distance >= d. */
function stressBound_kPa(
  load_kN: number,
  pressure_kPa: number,
  distance_m: number,
  depth_m: number,
): number {
  const d2 = distance_m * distance_m
  const z2 = depth_m * depth_m
  const point = (3 * load_kN * z2 * depth_m) / (2 * Math.PI * Math.pow(d2 + z2, 2.5))
  const outsideDisc = pressure_kPa * Math.pow(1 + d2 / z2, -1.5)
  return Math.min(point, outsideDisc)
}

function maxStressBound_kPa(
  load_kN: number,
  pressure_kPa: number,
  distance_m: number,
  envelope: InfluenceEnvelope,
): number {
  let worst = 0
  for (let i = 0; i <= DEPTH_SAMPLES; i++) {
    const depth =
      envelope.minCover_m + ((envelope.maxCover_m - envelope.minCover_m) * i) / DEPTH_SAMPLES
    worst = Math.max(worst, stressBound_kPa(load_kN, pressure_kPa, distance_m, depth))
  }
  // The point bound peaks at z = d·√1.5; include that depth when it is in range.
  const peakDepth = distance_m * Math.sqrt(1.5)
  if (peakDepth > envelope.minCover_m && peakDepth < envelope.maxCover_m) {
    worst = Math.max(worst, stressBound_kPa(load_kN, pressure_kPa, distance_m, peakDepth))
  }
  return worst
}

/**
 * Returns the influence distance of an activity in m: the horizontal distance from its footprint
 * edge to a pipe axis beyond which the activity cannot change that pipe's checks; never less than
 * `minimum_m`.
 *
 * @param activity - a validated activity
 * @param minimum_m - floor of the result (e.g. the owner's protection strip), m, [0, 1000]
 * @param envelope - pipe data to assume (defaults: DEFAULT_INFLUENCE_ENVELOPE); pass the actual
 *   pipe's cover (as minCover_m and maxCover_m), diameter, trench width and φ' for a
 *   pipe-specific distance
 * @returns distance, m
 *
 * Source: project rule (shared/statics/README.md), on Boussinesq (methods.md 4.1, 4.2 circular
 * area) and the wedge rules of methods.md 5 and 10.3.
 */
export function influenceDistance_m(
  activity: Activity,
  minimum_m: number,
  envelope: Partial<InfluenceEnvelope> = {},
): number {
  requireInRange('minimum_m', minimum_m, 0, 1000)
  const e: InfluenceEnvelope = { ...DEFAULT_INFLUENCE_ENVELOPE, ...envelope }
  requirePositive('envelope.minCover_m', e.minCover_m)
  requireInRange('envelope.maxCover_m', e.maxCover_m, e.minCover_m, 100)
  requirePositive('envelope.outerDiameter_m', e.outerDiameter_m)
  requireNonNegative('envelope.trenchWidth_m', e.trenchWidth_m)
  requireInRange('envelope.frictionAngle_deg', e.frictionAngle_deg, 0, 60)
  requirePositive('envelope.stressThreshold_kPa', e.stressThreshold_kPa)
  requireNonNegative('envelope.handDigDistance_m', e.handDigDistance_m)

  if (activity.kind === 'excavation') {
    const depth = activity.depth_m
    const halfD = e.outerDiameter_m / 2
    const wallFriction =
      activeWedgeReach_m(Math.max(e.maxCover_m, depth), e.frictionAngle_deg) + e.trenchWidth_m / 2
    const belowSpringline = Math.max(0, depth - (e.minCover_m + halfD))
    const lateral =
      Math.max(
        LATERAL_SUPPORT_ZONE_PER_DIAMETER * e.outerDiameter_m,
        activeWedgeReach_m(belowSpringline, e.frictionAngle_deg),
      ) + halfD
    const handDig = e.handDigDistance_m + halfD
    return Math.max(minimum_m, wallFriction, lateral, handDig)
  }

  const pressure_kPa = surfaceLoadPressure_kPa(activity)
  const load_kN = pressure_kPa * footprintArea_m2(activity.footprint)
  if (maxStressBound_kPa(load_kN, pressure_kPa, 0, e) <= e.stressThreshold_kPa) return minimum_m
  let near = 0
  let far = 1
  while (maxStressBound_kPa(load_kN, pressure_kPa, far, e) > e.stressThreshold_kPa && far < 1e5)
    far *= 2
  for (let i = 0; i < BISECTION_STEPS && far - near > 1e-3; i++) {
    const middle = (near + far) / 2
    if (maxStressBound_kPa(load_kN, pressure_kPa, middle, e) > e.stressThreshold_kPa) near = middle
    else far = middle
  }
  return Math.max(minimum_m, far)
}
