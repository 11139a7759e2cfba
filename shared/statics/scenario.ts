/**
 * Numeric core of an assessment: one pipe, a set of activities, and the two states the output
 * compares (baseline = the pipe as designed; with works = with every activity at once). No text
 * is built here, so the condition solver can re-run it cheaply.
 */
import {
  awwaAllowableBucklingPressure_kPa,
  awwaBucklingDemand_kPa,
  awwaBucklingDesignFactor,
  awwaSoilSupportFactor,
  unsupportedRingBucklingPressure_kPa,
  waterBuoyancyFactor,
  AWWA_BUCKLING_METHOD,
} from './awwa-buckling.ts'
import { barlowHoopStress_MPa, BARLOW_METHOD } from './barlow-hoop.ts'
import { rankineActiveCoefficient } from './earth-pressure.ts'
import {
  allowableUnsupportedSpan_m,
  exposedPipeLineLoad_kN_per_m,
  sagLimitedSpan_m,
  tubeSecondMoment_m4,
  tubeSectionModulus_m3,
  EXPOSED_SPAN_METHOD,
} from './exposed-span.ts'
import { exposureOf, mergeExposures, type Exposure } from './exposure-rule.ts'
import { distanceToAxisBand_m, footprintBounds, type Bounds } from './footprint-geometry.ts'
import { iowaDeflection_pct, IOWA_METHOD } from './iowa-deflection.ts'
import {
  combinedLateralSupportFactor,
  lateralSupportRule,
  type LateralSupportRuleResult,
} from './lateral-support-rule.ts'
import { rigidPipeSoilLoad_kN_per_m } from './marston-load.ts'
import { MATERIAL_DEFAULTS } from './materials.ts'
import { pipeGeometry, type PipeGeometry } from './pipe-geometry.ts'
import type { ResolvedPipe } from './resolve-pipe.ts'
import {
  maxRingBendingStress_MPa,
  ringMoments_kNm_per_m,
  RING_BENDING_METHOD,
} from './ring-moments.ts'
import { meanRadius_m, ringStiffness_kPa } from './ring-stiffness.ts'
import { crushingCapacity_kN_per_m, CRUSHING_METHOD } from './rigid-crushing.ts'
import { isShallowCover } from './shallow-cover.ts'
import { siloFactor, soilPressureAtCrown_kPa, trenchActsAsEmbankment } from './silo-factor.ts'
import { spanglerBeddingConstant } from './spangler-bedding.ts'
import {
  peakAxisSurcharge,
  surfaceLoadOf,
  surfaceLoadStress_kPa,
  type SurfaceLoad,
} from './surcharge.ts'
import type { Activity, CheckId, CheckState, ExcavationActivity } from './types.ts'
import { underminingRule, type UnderminingRuleResult } from './undermining-rule.ts'
import { wallFrictionRule, type WallFrictionRuleResult } from './wall-friction-rule.ts'

/** Utilisation reported when a capacity is zero and the demand is not (never Infinity). */
export const UTILISATION_CAP = 1e6

/** One check in numbers. */
export interface NumericCheck {
  id: CheckId
  method: string
  unit: string
  baseline: CheckState
  withWorks: CheckState
}

/** What the rules found for one excavation. */
export interface ExcavationFindings {
  activity: ExcavationActivity
  bounds: Bounds
  /** Plan clear distance from the pipe's outside wall, m (0 when over or across the pipe). */
  clearDistance_m: number
  /** Clearance to the pipe's bounding box including the vertical gap above the crown, m. */
  clearance_m: number
  crossesPipe: boolean
  overPipe: boolean
  wallFriction: WallFrictionRuleResult
  lateral: LateralSupportRuleResult
  undermining: UnderminingRuleResult
  exposure: Exposure | null
}

/** Everything the text layer needs, in numbers. */
export interface Evaluation {
  pipe: ResolvedPipe
  geometry: PipeGeometry
  siloFactorBaseline: number
  siloFactorWithWorks: number
  /** True when the baseline counts wall friction at all (trench narrower than 4·D, K·μ' > 0). */
  wallFrictionCounted: boolean
  soilBaseline_kPa: number
  soilWithWorks_kPa: number
  surcharge_kPa: number
  surchargePeakY_m: number
  surchargeShortTerm_kPa: number
  surchargeLongTerm_kPa: number
  surchargeByActivity_kPa: Map<string, number>
  loads: SurfaceLoad[]
  sidefillBaseline_MPa: number
  sidefillWithWorks_MPa: number
  lateralFactor: number
  excavations: ExcavationFindings[]
  exposures: Exposure[]
  wallFrictionLost: boolean
  lateralSupportReduced: boolean
  undermined: boolean
  underminedCritical: boolean
  shallowCover: boolean
  /** Smallest cover left above the pipe by an excavation over it, m (the cover when none). */
  remainingCover_m: number
  /** Rigid pipes: soil load per metre used by the crushing check, kN/m. */
  rigidSoilLoadBaseline_kN_per_m: number
  rigidSoilLoadWithWorks_kN_per_m: number
  /** Allowable unsupported span, m (Infinity when no span check is made). */
  allowableSpan_m: number
  checks: NumericCheck[]
  maxUtilisationWithWorks: number
  critical: boolean
}

function state(demand: number, capacity: number): CheckState {
  const utilisation = capacity > 0 ? demand / capacity : demand > 0 ? UTILISATION_CAP : 0
  return { demand, capacity, utilisation: Math.min(utilisation, UTILISATION_CAP) }
}

function deflection(
  beddingConstant: number,
  lagFactor: number,
  permanent_kPa: number,
  transient_kPa: number,
  stiffLong_kPa: number,
  stiffShort_kPa: number,
  sidefill_MPa: number,
): number {
  return iowaDeflection_pct({
    beddingConstant,
    lagFactor,
    permanentPressure_kPa: permanent_kPa,
    transientPressure_kPa: transient_kPa,
    longTermRingStiffness_kPa: stiffLong_kPa,
    shortTermRingStiffness_kPa: stiffShort_kPa,
    sidefillModulus_MPa: sidefill_MPa,
  })
}

/** AWWA capacity, never below the unsupported ring's (project rule, README). */
function bucklingCapacity(
  designFactor: number,
  waterBuoyancy: number,
  soilSupport: number,
  sidefill_MPa: number,
  stiffOverDm3_kPa: number,
  ringFloor_kPa: number,
): number {
  const awwa = awwaAllowableBucklingPressure_kPa(
    designFactor,
    waterBuoyancy,
    soilSupport,
    sidefill_MPa,
    stiffOverDm3_kPa,
  )
  return Math.max(awwa, ringFloor_kPa)
}

function ringStress(
  vertical_kPa: number,
  lateral_kPa: number,
  radius_m: number,
  beddingAngle_deg: number,
  wall_m: number,
): number {
  return maxRingBendingStress_MPa(
    ringMoments_kNm_per_m(vertical_kPa, lateral_kPa, radius_m, beddingAngle_deg),
    wall_m,
  )
}

/** Returns true when the rigid-pipe ring-bending check is made (see materials.ts). */
export function ringBendingChecked(pipe: ResolvedPipe): boolean {
  return (
    pipe.behaviour === 'rigid' &&
    pipe.allowableStress_MPa !== null &&
    (pipe.allowableStressGiven || MATERIAL_DEFAULTS[pipe.material].ringBendingWithDefaultStress)
  )
}

/**
 * Evaluates both states for a resolved pipe and already checked activities.
 *
 * @param pipe - pipe data with defaults applied (resolvePipe)
 * @param activities - activities checked by checkActivities or the zod schema
 */
export function evaluateScenario(pipe: ResolvedPipe, activities: readonly Activity[]): Evaluation {
  const geometry = pipeGeometry(
    pipe.outerDiameter_m,
    pipe.cover_m,
    pipe.installation,
    pipe.trenchWidth_m,
    pipe.frictionAngle_deg,
  )
  const D = pipe.outerDiameter_m
  const t = pipe.wallThickness_m
  const H = pipe.cover_m
  const gamma = pipe.backfillUnitWeight_kN_per_m3

  // Baseline silo factor (issue 3): trench narrower than 4·D with wall friction; otherwise 1.
  const trenchWithFriction =
    pipe.installation === 'trench' &&
    pipe.trenchWidth_m !== null &&
    !trenchActsAsEmbankment(pipe.trenchWidth_m, D) &&
    pipe.wallFrictionKMu > 0
  const kappaBaseline = trenchWithFriction
    ? siloFactor(pipe.wallFrictionKMu, H, pipe.trenchWidth_m as number)
    : 1

  // Excavation rules.
  const excavations: ExcavationFindings[] = []
  const singleExposures: Exposure[] = []
  let remainingCover_m = H
  for (const activity of activities) {
    if (activity.kind !== 'excavation') continue
    const bounds = footprintBounds(activity.footprint)
    const clearDistance_m = distanceToAxisBand_m(bounds, D / 2)
    const verticalGap = Math.max(0, H - activity.depth_m)
    const crossesPipe = clearDistance_m === 0 && activity.depth_m > H
    const overPipe = clearDistance_m === 0 && activity.depth_m <= H
    if (overPipe) remainingCover_m = Math.min(remainingCover_m, H - activity.depth_m)
    const exposure = exposureOf(activity, geometry)
    if (exposure) singleExposures.push(exposure)
    excavations.push({
      activity,
      bounds,
      clearDistance_m,
      clearance_m: Math.hypot(clearDistance_m, verticalGap),
      crossesPipe,
      overPipe,
      wallFriction: wallFrictionRule(bounds, activity.depth_m, geometry),
      lateral: lateralSupportRule(bounds, activity.depth_m, activity.support, geometry),
      undermining: underminingRule(bounds, activity.depth_m, activity.support, geometry),
      exposure,
    })
  }
  const wallFrictionLost = trenchWithFriction && excavations.some((e) => e.wallFriction.lost)
  const kappaWithWorks = wallFrictionLost ? 1 : kappaBaseline
  const lateralFactor = combinedLateralSupportFactor(excavations.map((e) => e.lateral))
  const lateralSupportReduced = lateralFactor < 1
  const undermined = excavations.some((e) => e.undermining.undermined)
  const underminedCritical = excavations.some((e) => e.undermining.critical)
  const exposures = mergeExposures(singleExposures)

  // Soil pressure at the crown (issue 3 contract: κ·γ·H).
  const soilBaseline_kPa = soilPressureAtCrown_kPa(kappaBaseline, gamma, H)
  const soilWithWorks_kPa = soilPressureAtCrown_kPa(kappaWithWorks, gamma, H)

  // Surcharge: all surface loads together, peak along the axis at crown depth.
  const loads: SurfaceLoad[] = []
  for (const activity of activities)
    if (activity.kind !== 'excavation') loads.push(surfaceLoadOf(activity))
  const peak = peakAxisSurcharge(loads, H)
  const surchargeByActivity_kPa = new Map<string, number>()
  let surchargeShortTerm_kPa = 0
  let surchargeLongTerm_kPa = 0
  for (const load of loads) {
    const value = surfaceLoadStress_kPa(load, 0, peak.y_m, H)
    surchargeByActivity_kPa.set(load.id, value)
    if (load.duration === 'short-term') surchargeShortTerm_kPa += value
    else surchargeLongTerm_kPa += value
  }
  const surcharge_kPa = surchargeShortTerm_kPa + surchargeLongTerm_kPa
  const traffic_kPa = pipe.designTrafficPressure_kPa

  const sidefillBaseline_MPa = pipe.sidefillModulus_MPa
  const sidefillWithWorks_MPa = pipe.sidefillModulus_MPa * lateralFactor

  const checks: NumericCheck[] = []
  let rigidSoilLoadBaseline_kN_per_m = 0
  let rigidSoilLoadWithWorks_kN_per_m = 0

  if (pipe.behaviour === 'flexible') {
    const stiffLong = ringStiffness_kPa(pipe.longTermModulus_MPa, D, t)
    const stiffShort = ringStiffness_kPa(pipe.shortTermModulus_MPa, D, t)
    const Kb = spanglerBeddingConstant(pipe.beddingAngle_deg)
    const limit = pipe.deflectionLimit_pct as number
    checks.push({
      id: 'ring-deflection',
      method: IOWA_METHOD,
      unit: '%',
      baseline: state(
        deflection(
          Kb,
          pipe.deflectionLagFactor,
          soilBaseline_kPa,
          traffic_kPa,
          stiffLong,
          stiffShort,
          sidefillBaseline_MPa,
        ),
        limit,
      ),
      withWorks: state(
        deflection(
          Kb,
          pipe.deflectionLagFactor,
          soilWithWorks_kPa + surchargeLongTerm_kPa,
          traffic_kPa + surchargeShortTerm_kPa,
          stiffLong,
          stiffShort,
          sidefillWithWorks_MPa,
        ),
        limit,
      ),
    })

    const Rw = waterBuoyancyFactor(pipe.groundwaterAboveCrown_m, H)
    const Bprime = awwaSoilSupportFactor(H)
    const FS = awwaBucklingDesignFactor(H, D)
    // E·I/D_m³ = (E·I/r³)/8 with D_m = 2r.
    const stiffOverDm3 = stiffLong / 8
    const ringFloor_kPa = unsupportedRingBucklingPressure_kPa(stiffLong) / FS
    checks.push({
      id: 'buckling',
      method: AWWA_BUCKLING_METHOD,
      unit: 'kPa',
      baseline: state(
        awwaBucklingDemand_kPa(pipe.groundwaterAboveCrown_m, Rw, soilBaseline_kPa, 0, traffic_kPa),
        bucklingCapacity(FS, Rw, Bprime, sidefillBaseline_MPa, stiffOverDm3, ringFloor_kPa),
      ),
      withWorks: state(
        awwaBucklingDemand_kPa(
          pipe.groundwaterAboveCrown_m,
          Rw,
          soilWithWorks_kPa,
          surcharge_kPa,
          traffic_kPa,
        ),
        bucklingCapacity(FS, Rw, Bprime, sidefillWithWorks_MPa, stiffOverDm3, ringFloor_kPa),
      ),
    })
  } else {
    const B =
      pipe.installation === 'trench' && pipe.trenchWidth_m !== null ? pipe.trenchWidth_m : Infinity
    rigidSoilLoadBaseline_kN_per_m = rigidPipeSoilLoad_kN_per_m(kappaBaseline, gamma, H, B, D)
    rigidSoilLoadWithWorks_kN_per_m = rigidPipeSoilLoad_kN_per_m(kappaWithWorks, gamma, H, B, D)
    const loadBaseline = rigidSoilLoadBaseline_kN_per_m + traffic_kPa * D
    const loadWithWorks = rigidSoilLoadWithWorks_kN_per_m + (surcharge_kPa + traffic_kPa) * D
    const capacity = crushingCapacity_kN_per_m(
      pipe.crushingStrength_kN_per_m as number,
      pipe.beddingFactor,
      pipe.crushingSafetyFactor,
    )
    checks.push({
      id: 'crushing',
      method: CRUSHING_METHOD,
      unit: 'kN/m',
      baseline: state(loadBaseline, capacity),
      withWorks: state(loadWithWorks, capacity),
    })
    if (ringBendingChecked(pipe)) {
      const r = meanRadius_m(D, t)
      const Ka = rankineActiveCoefficient(pipe.frictionAngle_deg)
      const allowable = pipe.allowableStress_MPa as number
      // Lateral pressure: K_a times the baseline soil pressure in both states (the works never add
      // lateral support), scaled by the share of side support the excavations leave.
      const lateralBaseline_kPa = Ka * soilBaseline_kPa
      checks.push({
        id: 'ring-bending',
        method: RING_BENDING_METHOD,
        unit: 'MPa',
        baseline: state(
          ringStress(loadBaseline / D, lateralBaseline_kPa, r, pipe.beddingAngle_deg, t),
          allowable,
        ),
        withWorks: state(
          ringStress(
            loadWithWorks / D,
            lateralBaseline_kPa * lateralFactor,
            r,
            pipe.beddingAngle_deg,
            t,
          ),
          allowable,
        ),
      })
    }
  }

  if (pipe.internalPressure_kPa > 0) {
    const hoop = barlowHoopStress_MPa(pipe.internalPressure_kPa, D, t)
    const allowable = pipe.allowableStress_MPa as number
    checks.push({
      id: 'hoop-stress',
      method: BARLOW_METHOD,
      unit: 'MPa',
      baseline: state(hoop, allowable),
      withWorks: state(hoop, allowable),
    })
  }

  let allowableSpan_m = Infinity
  const longest = exposures[0]
  if (longest) {
    if (pipe.allowableStress_MPa === null) {
      throw new RangeError(
        `pipe.allowableStress_MPa is required to check an exposed ${pipe.material} pipe (no default)`,
      )
    }
    const w = exposedPipeLineLoad_kN_per_m(D, t, pipe.wallUnitWeight_kN_per_m3)
    const stressSpan = allowableUnsupportedSpan_m(
      pipe.allowableStress_MPa,
      tubeSectionModulus_m3(D, t),
      w,
    )
    const sagSpan = sagLimitedSpan_m(pipe.shortTermModulus_MPa, tubeSecondMoment_m4(D, t), w)
    allowableSpan_m = Math.min(stressSpan, sagSpan)
    checks.push({
      id: 'exposed-span',
      method: EXPOSED_SPAN_METHOD,
      unit: 'm',
      baseline: state(0, allowableSpan_m),
      withWorks: state(longest.span_m, allowableSpan_m),
    })
  }

  let maxUtilisationWithWorks = 0
  for (const check of checks)
    maxUtilisationWithWorks = Math.max(maxUtilisationWithWorks, check.withWorks.utilisation)

  return {
    pipe,
    geometry,
    siloFactorBaseline: kappaBaseline,
    siloFactorWithWorks: kappaWithWorks,
    wallFrictionCounted: trenchWithFriction,
    soilBaseline_kPa,
    soilWithWorks_kPa,
    surcharge_kPa,
    surchargePeakY_m: peak.y_m,
    surchargeShortTerm_kPa,
    surchargeLongTerm_kPa,
    surchargeByActivity_kPa,
    loads,
    sidefillBaseline_MPa,
    sidefillWithWorks_MPa,
    lateralFactor,
    excavations,
    exposures,
    wallFrictionLost,
    lateralSupportReduced,
    undermined,
    underminedCritical,
    shallowCover:
      isShallowCover(H, D) ||
      (remainingCover_m < H && (remainingCover_m <= 0 || isShallowCover(remainingCover_m, D))),
    remainingCover_m,
    rigidSoilLoadBaseline_kN_per_m,
    rigidSoilLoadWithWorks_kN_per_m,
    allowableSpan_m,
    checks,
    maxUtilisationWithWorks,
    critical: maxUtilisationWithWorks > 1 || underminedCritical,
  }
}
