/**
 * The orchestrator: checks the input, runs the numeric scenario, proposes conditions, decides the
 * verdict and writes the plain-English assumptions, cautions and summary of an assessment.
 */
import {
  BASELINE_CAUTION,
  DEWATERING_CAUTION,
  JOINTED_SPAN_CAUTION,
  LONGITUDINAL_CAUTION,
  SHALLOW_COVER_CAUTION,
  STANDARD_CAUTION,
} from './cautions.ts'
import { solveMinimumMatSize, solveMinimumOffset, OFFSET_STEP_m } from './conditions.ts'
import { rankineActiveCoefficient } from './earth-pressure.ts'
import { exposedPipeLineLoad_kN_per_m } from './exposed-span.ts'
import { footprintArea_m2 } from './footprint-geometry.ts'
import { fixed, joinWords, percent } from './format.ts'
import { requireInRange } from './guards.ts'
import { influenceDistance_m } from './influence-distance.ts'
import { checkActivities } from './resolve-activities.ts'
import { resolvePipe, type ResolvedPipe } from './resolve-pipe.ts'
import {
  evaluateScenario,
  ringBendingChecked,
  type Evaluation,
  type ExcavationFindings,
} from './scenario.ts'
import type {
  Activity,
  ActivityContribution,
  AssessmentInput,
  AssessmentOptions,
  AssessmentResult,
  CheckResult,
  Condition,
  ExcavationSupport,
  Verdict,
} from './types.ts'

/** Default width of the hand-dig zone, m. Source: see AssessmentOptions.handDigDistance_m. */
export const DEFAULT_HAND_DIG_DISTANCE_m = 0.6

const CHECK_NAMES: Record<CheckResult['id'], string> = {
  'hoop-stress': 'hoop stress',
  'ring-deflection': 'ring deflection',
  buckling: 'buckling',
  crushing: 'crushing',
  'ring-bending': 'ring bending',
  'exposed-span': 'exposed span',
}

const SUPPORT_NAMES: Record<ExcavationSupport, string> = {
  none: 'no support',
  sloped: 'sloped sides',
  'trench-box': 'a trench box',
  'sheet-piling': 'sheet piling',
  braced: 'braced sheeting',
}

/**
 * Assesses one pipe against a set of planned activities (issue 3): effects, checks with demand,
 * capacity and utilisation for the pipe as designed and with the works, verdict, conditions with
 * solved numbers, assumptions (inputs, defaults and project rules used) and cautions.
 *
 * @param input - pipe design data and activities in the pipe-local frame (m, kN, kPa, MPa, °)
 * @param options - hand-dig zone width (default 0.6 m) and whether to solve conditions
 * @returns the assessment; every number is finite
 * @throws RangeError naming the field (e.g. `pipe.cover_m`, `activities[1].depth_m`) for bad input
 *
 * Source: the methods of methods.md as listed per check, and the project rules of
 * shared/statics/README.md.
 */
export function assessPipe(
  input: AssessmentInput,
  options: AssessmentOptions = {},
): AssessmentResult {
  if (input === null || typeof input !== 'object') throw new RangeError('input must be an object')
  if (input.pipe === null || typeof input.pipe !== 'object')
    throw new RangeError('pipe is required')
  const handDig_m = requireInRange(
    'options.handDigDistance_m',
    options.handDigDistance_m ?? DEFAULT_HAND_DIG_DISTANCE_m,
    0,
    5,
  )
  const pipe = resolvePipe(input.pipe)
  const activities = input.activities ?? []
  checkActivities(activities)
  const evaluation = evaluateScenario(pipe, activities)

  const conditions = excavationConditions(evaluation, handDig_m)
  conditions.push(...exposureConditions(evaluation))
  if (evaluation.critical && options.solveConditions !== false) {
    conditions.push(...solvedConditions(pipe, activities))
  }

  const verdict: Verdict = evaluation.critical
    ? 'critical'
    : conditions.length > 0
      ? 'conditional'
      : 'clear'

  let governingIndex = -1
  evaluation.checks.forEach((check, i) => {
    const best = evaluation.checks[governingIndex]
    if (!best || check.withWorks.utilisation > best.withWorks.utilisation) governingIndex = i
  })
  const checks: CheckResult[] = evaluation.checks.map((check, i) => ({
    ...check,
    governing: i === governingIndex,
  }))
  const governing = checks[governingIndex]

  return {
    effects: {
      siloFactor: {
        baseline: evaluation.siloFactorBaseline,
        withWorks: evaluation.siloFactorWithWorks,
      },
      soilPressureAtCrown_kPa: {
        baseline: evaluation.soilBaseline_kPa,
        withWorks: evaluation.soilWithWorks_kPa,
      },
      surchargeAtCrown_kPa: evaluation.surcharge_kPa,
      sidefillModulus_MPa: {
        baseline: evaluation.sidefillBaseline_MPa,
        withWorks: evaluation.sidefillWithWorks_MPa,
      },
      wallFrictionLost: evaluation.wallFrictionLost,
      lateralSupportReduced: evaluation.lateralSupportReduced,
      undermined: evaluation.undermined,
      shallowCover: evaluation.shallowCover,
      surchargePeakAt_y_m: evaluation.surchargePeakY_m,
      exposedSpan_m: evaluation.exposures[0]?.span_m ?? 0,
    },
    checks,
    verdict,
    conditions,
    assumptions: assumptionsOf(evaluation, activities),
    cautions: cautionsOf(evaluation),
    governingCheckId: governing?.id ?? null,
    summary: summaryOf(evaluation, checks, verdict, conditions.length),
    activities: contributionsOf(evaluation, activities, handDig_m),
  }
}

function excavationConditions(evaluation: Evaluation, handDig_m: number): Condition[] {
  const conditions: Condition[] = []
  const { pipe } = evaluation
  const trialHoleIds: string[] = []
  for (const e of evaluation.excavations) {
    const id = e.activity.id
    if (e.clearance_m <= handDig_m) {
      conditions.push({
        code: 'hand-dig-zone',
        activityId: id,
        value_m: handDig_m,
        text: `Dig ${id} by hand or by vacuum excavation wherever it is within ${fixed(handDig_m, 2)} m of the pipe; keep machine buckets out of that zone.`,
        reason: `${id} comes to ${fixed(e.clearance_m, 2)} m of the pipe. A machine bucket can strike or drag a pipe it cannot see; the published hand-dig zones are 0.3 m to 0.6 m wide.`,
      })
    }
    const reach = influenceDistance_m(e.activity, 0, pipeEnvelope(pipe))
    if (e.clearDistance_m <= reach) trialHoleIds.push(id)
    const affects =
      (evaluation.wallFrictionCounted && e.wallFriction.lost) ||
      e.lateral.factor < 1 ||
      e.undermining.undermined
    const supported = e.activity.support !== 'none' && e.activity.support !== 'sloped'
    if (affects && supported) {
      conditions.push({
        code: 'keep-sheeting-until-backfilled',
        activityId: id,
        text: `Keep the ${SUPPORT_NAMES[e.activity.support].replace(/^a /, '')} of ${id} in place until the excavation is backfilled and compacted in layers to above the pipe's crown; withdraw it only in step with the compaction.`,
        reason:
          'The pipe relies on the soil beside and above it. Pulling the support before the backfill is compacted loosens that soil, and the effect cannot be calculated reliably.',
      })
    }
    if (e.undermining.undermined && !e.undermining.critical) {
      conditions.push({
        code: 'support-designed-for-pipe',
        activityId: id,
        text: `Have the ${SUPPORT_NAMES[e.activity.support]} of ${id} designed by a competent engineer for the pipe as an extra load (the pipe, its soil load and any surcharge, ${fixed(e.clearDistance_m, 2)} m behind the face), and submit the design to the pipe owner before digging below ${fixed(evaluation.geometry.beddingBaseDepth_m, 2)} m.`,
        reason: `${id} goes below the pipe's bedding and the pipe lies in the failure wedge of its face (reach ${fixed(e.undermining.wedgeReach_m, 2)} m); only a retaining support designed for it keeps the pipe supported.`,
      })
    }
    if (e.crossesPipe) {
      conditions.push({
        code: 'restore-bedding',
        activityId: id,
        text: `When backfilling ${id}, rebuild the bedding under the pipe and compact the sidefill beside it in thin layers, by hand near the pipe, leaving no voids under it.`,
        reason: `${id} removes the soil that supports the pipe across it; the pipe is only as good as the bedding and sidefill put back.`,
      })
    }
  }
  if (trialHoleIds.length > 0) {
    conditions.push({
      code: 'trial-holes',
      text: `Before machine digging for ${joinWords(trialHoleIds)}, locate the pipe with hand-dug trial holes and confirm its position and depth (assumed: as recorded, with ${fixed(pipe.cover_m, 2)} m of cover to the crown).`,
      reason:
        'Every result here relies on the recorded position and cover of the pipe; records can be wrong by more than the distances that matter.',
    })
  }
  return conditions
}

function exposureConditions(evaluation: Evaluation): Condition[] {
  const { pipe } = evaluation
  return evaluation.exposures.map((exposure) => {
    const spacing = Math.max(
      OFFSET_STEP_m,
      Math.floor(evaluation.allowableSpan_m / OFFSET_STEP_m + 1e-9) * OFFSET_STEP_m,
    )
    const w = exposedPipeLineLoad_kN_per_m(
      pipe.outerDiameter_m,
      pipe.wallThickness_m,
      pipe.wallUnitWeight_kN_per_m3,
    )
    return {
      code: 'support-exposed-pipe' as const,
      value_m: spacing,
      text: `Support the pipe where ${joinWords(exposure.activityIds)} expose${exposure.activityIds.length > 1 ? '' : 's'} it, at no more than ${fixed(spacing, 1)} m centres${pipe.jointed ? ' and on both sides of every joint' : ''}, in the way the pipe owner specifies; do not let it hang unsupported.`,
      reason: `The pipe is left without support over ${fixed(exposure.span_m, 2)} m. As a simply supported beam carrying its own weight and a full bore of water (${fixed(w, 2)} kN/m), it may span at most ${fixed(evaluation.allowableSpan_m, 2)} m (allowable stress ${fixed(pipe.allowableStress_MPa ?? 0, 2)} MPa, sag at most 1/360 of the span).`,
    }
  })
}

function solvedConditions(pipe: ResolvedPipe, activities: readonly Activity[]): Condition[] {
  const conditions: Condition[] = []
  activities.forEach((activity, index) => {
    const others = activities.filter((_, i) => i !== index)
    const withoutOk = !evaluateScenario(pipe, others).critical
    const aloneCritical = evaluateScenario(pipe, [activity]).critical
    if (!withoutOk && !aloneCritical) return
    const context = withoutOk ? activities : [activity]
    const at = withoutOk ? index : 0
    const scope =
      activities.length === 1
        ? ''
        : withoutOk
          ? ' with the other activities as planned'
          : ' (on its own)'
    const offset = solveMinimumOffset(pipe, context, at)
    const id = activity.id
    if (activity.kind === 'pad') {
      const mat = solveMinimumMatSize(pipe, context, at)
      if (offset) {
        conditions.push({
          code: 'min-offset',
          activityId: id,
          value_m: offset.distanceFromAxis_m,
          text: `Keep ${id} at least ${fixed(offset.distanceFromAxis_m, 1)} m from the pipe centreline (nearest edge of the mat)${mat ? ', or use the larger mat below' : ''}.`,
          reason: `As planned, ${id} overloads the pipe; from ${fixed(offset.distanceFromAxis_m, 1)} m every check stays within its limit${scope}.`,
        })
      }
      if (mat) {
        conditions.push({
          code: 'min-mat-size',
          activityId: id,
          value_m: Math.max(mat.width_m, mat.length_m),
          text: `Set ${id} on a mat of at least ${fixed(mat.width_m, 1)} m × ${fixed(mat.length_m, 1)} m (across × along the pipe), centred where planned${offset ? ', or keep it at the distance above' : ''}.`,
          reason: `Spreading the same load over a mat this large keeps every check within its limit${scope}.`,
        })
      }
    } else if (activity.kind === 'area' || activity.kind === 'fill') {
      if (offset) {
        conditions.push({
          code: 'no-stockpile-within',
          activityId: id,
          value_m: offset.distanceFromAxis_m,
          text: `Place no stockpile, fill or stored material like ${id} within ${fixed(offset.distanceFromAxis_m, 1)} m of the pipe centreline.`,
          reason: `As planned, ${id} overloads the pipe; beyond ${fixed(offset.distanceFromAxis_m, 1)} m every check stays within its limit${scope}.`,
        })
      }
    } else if (offset) {
      conditions.push({
        code: 'min-offset',
        activityId: id,
        value_m: offset.distanceFromAxis_m,
        text: `Keep the face of ${id} at least ${fixed(offset.distanceFromAxis_m, 1)} m from the pipe centreline, or redesign its support for the pipe.`,
        reason: `As planned, ${id} takes away support the pipe needs; from ${fixed(offset.distanceFromAxis_m, 1)} m every check stays within its limit and the pipe is out of the failure wedge${scope}.`,
      })
    }
  })
  return conditions
}

function pipeEnvelope(pipe: ResolvedPipe) {
  return {
    minCover_m: pipe.cover_m,
    maxCover_m: pipe.cover_m,
    outerDiameter_m: pipe.outerDiameter_m,
    trenchWidth_m: pipe.trenchWidth_m ?? pipe.outerDiameter_m,
    frictionAngle_deg: pipe.frictionAngle_deg,
  }
}

function assumptionsOf(evaluation: Evaluation, activities: readonly Activity[]): string[] {
  const { pipe, geometry } = evaluation
  const out: string[] = []
  const installation =
    pipe.installation === 'trench'
      ? `laid in a trench ${fixed(pipe.trenchWidth_m ?? 0, 2)} m wide at the crown (K·μ' ${fixed(pipe.wallFrictionKMu, 3)})`
      : 'laid under an embankment'
  out.push(
    `Pipe as recorded: ${pipe.material}, outside diameter ${fixed(pipe.outerDiameter_m, 3)} m, wall ${fixed(pipe.wallThickness_m, 3)} m, ` +
      `cover ${fixed(pipe.cover_m, 2)} m to the crown, ${installation}; backfill ${fixed(pipe.backfillUnitWeight_kN_per_m3, 1)} kN/m³ ` +
      `with φ' ${fixed(pipe.frictionAngle_deg, 1)}°, sidefill modulus E' ${fixed(pipe.sidefillModulus_MPa, 2)} MPa, bedding angle ` +
      `${fixed(pipe.beddingAngle_deg, 0)}°, groundwater ${fixed(pipe.groundwaterAboveCrown_m, 2)} m above the crown, design traffic ` +
      `${fixed(pipe.designTrafficPressure_kPa, 1)} kPa at the crown, internal pressure ${fixed(pipe.internalPressure_kPa, 0)} kPa.`,
  )
  if (pipe.behaviour === 'flexible') {
    out.push(
      `Flexible pipe: short-term modulus ${fixed(pipe.shortTermModulus_MPa, 0)} MPa, long-term modulus ${fixed(pipe.longTermModulus_MPa, 0)} MPa, ` +
        `deflection lag factor ${fixed(pipe.deflectionLagFactor, 2)} on permanent loads, deflection limit ${fixed(pipe.deflectionLimit_pct ?? 0, 1)} %` +
        `${pipe.allowableStress_MPa !== null ? `, allowable wall stress ${fixed(pipe.allowableStress_MPa, 2)} MPa` : ''}.`,
    )
    out.push(
      'Buckling capacity is never taken below that of the unsupported ring (3·E·I/r³ with the long-term modulus, divided by the same design factor).',
    )
  } else {
    out.push(
      `Rigid pipe: three-edge-bearing strength ${fixed(pipe.crushingStrength_kN_per_m ?? 0, 1)} kN/m, bedding factor ${fixed(pipe.beddingFactor, 2)}, ` +
        `safety factor ${fixed(pipe.crushingSafetyFactor, 2)}${pipe.allowableStress_MPa !== null ? `, allowable wall stress ${fixed(pipe.allowableStress_MPa, 2)} MPa` : ''}.`,
    )
    const prism = evaluation.soilBaseline_kPa * pipe.outerDiameter_m
    out.push(
      `Rigid pipe soil load: the Marston trench load over the full trench width, but not more than the embankment load (interaction factor up to 1.15): ` +
        `${fixed(evaluation.rigidSoilLoadBaseline_kN_per_m, 2)} kN/m as designed and ${fixed(evaluation.rigidSoilLoadWithWorks_kN_per_m, 2)} kN/m with the works ` +
        `(silo pressure times diameter alone would give ${fixed(prism, 2)} kN/m).`,
    )
    if (ringBendingChecked(pipe)) {
      out.push(
        `Ring bending: horizontal soil pressure taken as the active pressure K_a = ${fixed(rankineActiveCoefficient(pipe.frictionAngle_deg), 3)} times the designed soil pressure at the crown, a low estimate that keeps the bending moments on the safe side; the works never add to it.`,
      )
    } else {
      out.push(
        'Ring-bending check not made: no allowable wall stress was recorded, and reinforced concrete pipes are rated by the three-edge-bearing test, which the crushing check uses.',
      )
    }
  }
  out.push(...pipe.defaultsApplied)

  if (pipe.installation === 'embankment') {
    out.push('Embankment installation: the full soil prism bears on the pipe (silo factor 1).')
  } else if (pipe.trenchWidth_m !== null && pipe.trenchWidth_m >= 4 * pipe.outerDiameter_m) {
    out.push(
      'The trench is at least four pipe diameters wide, so it is treated as an embankment: no wall friction is counted (silo factor 1).',
    )
  } else if (evaluation.wallFrictionCounted) {
    out.push(
      `Trench-wall friction counted as designed: silo factor ${fixed(evaluation.siloFactorBaseline, 3)} for ${fixed(pipe.cover_m, 2)} m of cover in a ${fixed(pipe.trenchWidth_m ?? 0, 2)} m trench.`,
    )
  }

  for (const e of evaluation.excavations) out.push(...excavationAssumptions(evaluation, e))
  if (evaluation.lateralSupportReduced) {
    out.push(
      `Sidefill modulus with the works: ${fixed(evaluation.sidefillWithWorks_MPa, 2)} MPa (${percent(evaluation.lateralFactor)} of ${fixed(evaluation.sidefillBaseline_MPa, 2)} MPa)` +
        `${pipe.behaviour === 'rigid' ? '; the horizontal soil pressure on the pipe is scaled by the same share' : ''}.`,
    )
  }
  if (evaluation.excavations.some((e) => e.activity.depth_m > geometry.beddingBaseDepth_m)) {
    out.push(
      `The bedding base is taken at the pipe's outside invert, ${fixed(geometry.beddingBaseDepth_m, 2)} m deep: no bedding thickness is credited, which makes the failure wedge as large as it can be.`,
    )
  }
  for (const exposure of evaluation.exposures) {
    out.push(
      `${joinWords(exposure.activityIds)} expose${exposure.activityIds.length > 1 ? '' : 's'} the pipe over ${fixed(exposure.span_m, 2)} m along its axis (the footprint, plus the failure wedge beyond each face where the excavation goes below the bedding); ` +
        'the span is checked as a simply supported beam under its own weight and a full bore of water.',
    )
  }

  if (evaluation.loads.length > 0) {
    out.push(
      `Surcharge: elastic half-space (Boussinesq) stress at crown depth on the pipe axis, all pads, areas and fills added, taken at its peak along the pipe (y = ${fixed(evaluation.surchargePeakY_m, 2)} m): ${fixed(evaluation.surcharge_kPa, 2)} kPa. Rectangles by Newmark's corner formula, polygons by exact integration.`,
    )
    for (const load of evaluation.loads) {
      const area = footprintArea_m2(load.footprint)
      out.push(
        `${load.id}: ${fixed(load.pressure_kPa, 1)} kPa over ${fixed(area, 2)} m² (${load.duration}), adding ${fixed(evaluation.surchargeByActivity_kPa.get(load.id) ?? 0, 2)} kPa at the crown at the peak position.`,
      )
    }
    if (pipe.behaviour === 'flexible') {
      out.push(
        'Short-term loads (crane pads unless stated otherwise) use the short-term modulus without lag; long-term loads (areas and fills unless stated otherwise, as they may stay for weeks) use the long-term modulus with the lag factor.',
      )
    }
  }
  if (pipe.designTrafficPressure_kPa > 0 && activities.length > 0) {
    out.push(
      `The design traffic pressure (${fixed(pipe.designTrafficPressure_kPa, 1)} kPa) is kept during the works, on top of the works' own loads.`,
    )
  }
  out.push(
    "The pipe's recorded position and cover are taken as correct, and the pipe as straight along its axis through the works.",
  )
  return out
}

function excavationAssumptions(evaluation: Evaluation, e: ExcavationFindings): string[] {
  const { geometry } = evaluation
  const id = e.activity.id
  const out: string[] = []
  if (evaluation.wallFrictionCounted && e.wallFriction.lost) {
    out.push(
      e.wallFriction.distanceToWall_m === 0
        ? `Trench-wall friction no longer counted: ${id} cuts into the original trench wall (silo factor 1 with the works).`
        : `Trench-wall friction no longer counted: ${id} comes within ${fixed(e.wallFriction.distanceToWall_m, 2)} m of the original trench wall, inside the ${fixed(e.wallFriction.reach_m, 2)} m reach of its active wedge (silo factor 1 with the works).`,
    )
  }
  const lateral = e.lateral
  if (lateral.reason === 'embedment-cut') {
    out.push(
      `${id} cuts into the pipe-zone fill beside the pipe (${fixed(lateral.clearDistance_m, 2)} m from the pipe wall) below the springline: the sidefill support on that side is not counted.`,
    )
  } else if (lateral.reason === 'in-active-wedge') {
    out.push(
      `${id} is ${fixed(lateral.clearDistance_m, 2)} m from the pipe wall and ${fixed(e.activity.depth_m, 2)} m deep with ${SUPPORT_NAMES[e.activity.support]}: the pipe's springline lies in the active wedge of its face (reach ${fixed(lateral.wedgeReach_m, 2)} m), so the sidefill support on that side is not counted.`,
    )
  } else if (lateral.reason === 'in-support-zone') {
    out.push(
      `${id} is ${fixed(lateral.clearDistance_m, 2)} m from the pipe wall and deeper than the springline, within the ${fixed(Math.max(lateral.zone_m, lateral.wedgeReach_m), 2)} m zone that supports the pipe sideways: half of the sidefill support on that side is taken as lost.`,
    )
  }
  if (e.undermining.undermined) {
    out.push(
      `${id} goes ${fixed(e.activity.depth_m - geometry.beddingBaseDepth_m, 2)} m below the pipe's bedding base and its face is ${fixed(e.clearDistance_m, 2)} m from the pipe wall, inside the ${fixed(e.undermining.wedgeReach_m, 2)} m reach of the failure wedge: the pipe is undermined` +
        `${e.undermining.critical ? '.' : ` (the face is held by ${SUPPORT_NAMES[e.activity.support]}, so the verdict depends on that support being designed for the pipe).`}`,
    )
  }
  if (e.overPipe) {
    out.push(
      `${id} digs over the pipe and leaves ${fixed(evaluation.geometry.cover_m - e.activity.depth_m, 2)} m of cover above the crown; no credit is taken for the soil it removes.`,
    )
  }
  return out
}

function cautionsOf(evaluation: Evaluation): string[] {
  const { pipe } = evaluation
  const cautions = [STANDARD_CAUTION]
  if (evaluation.shallowCover) cautions.push(SHALLOW_COVER_CAUTION)
  const loadOverPipe = evaluation.loads.some(
    (load) =>
      load.bounds.xMin_m <= pipe.outerDiameter_m / 2 &&
      load.bounds.xMax_m >= -pipe.outerDiameter_m / 2,
  )
  if (loadOverPipe || evaluation.loads.some((load) => load.duration === 'long-term'))
    cautions.push(LONGITUDINAL_CAUTION)
  const waterDepth_m = pipe.cover_m - pipe.groundwaterAboveCrown_m
  if (
    pipe.groundwaterAboveCrown_m > 0 &&
    evaluation.excavations.some((e) => e.activity.depth_m > waterDepth_m)
  ) {
    cautions.push(DEWATERING_CAUTION)
  }
  if (evaluation.checks.some((check) => check.baseline.utilisation > 1))
    cautions.push(BASELINE_CAUTION)
  if (evaluation.exposures.length > 0 && pipe.jointed) cautions.push(JOINTED_SPAN_CAUTION)
  return cautions
}

function summaryOf(
  evaluation: Evaluation,
  checks: readonly CheckResult[],
  verdict: Verdict,
  conditionCount: number,
): string {
  const governing = checks.find((check) => check.governing)
  const baselineMax = checks.reduce((max, check) => Math.max(max, check.baseline.utilisation), 0)
  const traffic = evaluation.pipe.designTrafficPressure_kPa
  const before = evaluation.soilBaseline_kPa + traffic
  const after = evaluation.soilWithWorks_kPa + evaluation.surcharge_kPa + traffic
  const change = before > 0 ? after / before - 1 : 0
  let largest: string | null = null
  let largestValue = 0
  for (const [id, value] of evaluation.surchargeByActivity_kPa) {
    if (value > largestValue) {
      largestValue = value
      largest = id
    }
  }
  const parts: string[] = []
  if (change > 0.005) {
    const cause =
      largest && evaluation.surcharge_kPa > 0.5 * (after - before)
        ? ` (mostly from ${largest})`
        : ''
    parts.push(`The works raise the vertical load on the pipe by ${percent(change)}${cause}`)
  } else {
    parts.push('The works add no significant vertical load at the crown')
  }
  const support: string[] = []
  if (evaluation.wallFrictionLost) support.push('the trench-wall friction')
  if (evaluation.lateralSupportReduced)
    support.push(evaluation.lateralFactor === 0 ? 'the side support' : 'part of the side support')
  if (support.length > 0) parts[0] += ` and remove ${joinWords(support)}`
  if (governing) {
    const unchanged =
      Math.abs(governing.withWorks.utilisation - governing.baseline.utilisation) < 0.005
    if (unchanged && governing.baseline.utilisation >= baselineMax - 1e-12) {
      parts.push(
        `the highest utilisation stays at ${percent(governing.withWorks.utilisation)} (${CHECK_NAMES[governing.id]}, not changed by the works)`,
      )
    } else {
      parts.push(
        `the highest utilisation goes from ${percent(baselineMax)} to ${percent(governing.withWorks.utilisation)} (${CHECK_NAMES[governing.id]})`,
      )
    }
    let mostRaised: CheckResult | null = null
    for (const check of checks) {
      const rise = check.withWorks.utilisation - check.baseline.utilisation
      if (
        rise > 0.005 &&
        (!mostRaised || rise > mostRaised.withWorks.utilisation - mostRaised.baseline.utilisation)
      )
        mostRaised = check
    }
    if (mostRaised && mostRaised !== governing) {
      parts.push(
        `${CHECK_NAMES[mostRaised.id]} goes from ${percent(mostRaised.baseline.utilisation)} to ${percent(mostRaised.withWorks.utilisation)}`,
      )
    }
  }
  let tail: string
  if (evaluation.underminedCritical)
    tail = 'the pipe is undermined by an unsupported excavation face — not acceptable as planned.'
  else if (verdict === 'critical')
    tail =
      'over the limit — not acceptable as planned; the conditions say what would make it acceptable.'
  else if (verdict === 'conditional')
    tail = `within the limits, subject to ${conditionCount} condition${conditionCount === 1 ? '' : 's'}.`
  else tail = 'within the limits.'
  return `${parts.join('; ')} — ${tail}`
}

function contributionsOf(
  evaluation: Evaluation,
  activities: readonly Activity[],
  handDig_m: number,
): ActivityContribution[] {
  const D = evaluation.pipe.outerDiameter_m
  return activities.map((activity) => {
    const notes: string[] = []
    let clearDistance_m: number
    const excavation = evaluation.excavations.find((e) => e.activity.id === activity.id)
    if (excavation) {
      clearDistance_m = excavation.clearDistance_m
      if (evaluation.wallFrictionCounted && excavation.wallFriction.lost)
        notes.push('Trench-wall friction lost.')
      if (excavation.lateral.factor === 0) notes.push('Sidefill support on its side lost.')
      else if (excavation.lateral.factor === 0.5) notes.push('Sidefill support on its side halved.')
      if (excavation.undermining.undermined) notes.push('Undermines the pipe.')
      if (excavation.crossesPipe) notes.push('Crosses and exposes the pipe.')
      if (excavation.overPipe) notes.push('Digs over the pipe.')
      if (excavation.clearance_m <= handDig_m) notes.push('Within the hand-dig zone.')
    } else {
      const load = evaluation.loads.find((l) => l.id === activity.id)
      const b = load?.bounds
      clearDistance_m = b ? Math.max(0, b.xMin_m - D / 2, -D / 2 - b.xMax_m) : 0
      notes.push(
        `Adds ${fixed(evaluation.surchargeByActivity_kPa.get(activity.id) ?? 0, 2)} kPa at the crown at the peak position.`,
      )
    }
    return {
      id: activity.id,
      kind: activity.kind,
      surchargeAtPeak_kPa: evaluation.surchargeByActivity_kPa.get(activity.id) ?? 0,
      clearDistance_m,
      notes,
    }
  })
}
