/**
 * Types of the statics engine's input and output. The field names are the contract of issue 3:
 * the server, the client and the CLI read them, so they are never renamed. All geometry is in
 * the pipe-local plan frame: `y` along the pipe axis, `x` across it (signed), depths positive
 * downward from the ground surface, all in metres.
 *
 * The zod schema in `shared/schemas/assessment-input.ts` validates the same shape and is checked
 * at compile time to produce values assignable to `AssessmentInput`.
 */

/** Pipe materials the engine knows. The first five behave as flexible rings, the last two as rigid. */
export type PipeMaterial =
  'PE100' | 'PVC-U' | 'GRP' | 'steel' | 'ductile-iron' | 'concrete' | 'vitrified-clay'

/** How the pipe was laid: in a trench between native walls, or under a fill (embankment). */
export type Installation = 'trench' | 'embankment'

/** One pipe's stored design data (issue 3, "Input"). Optional fields get material defaults. */
export interface PipeInput {
  material: PipeMaterial
  outerDiameter_m: number
  wallThickness_m: number
  shortTermModulus_MPa?: number | undefined
  longTermModulus_MPa?: number | undefined
  allowableStress_MPa?: number | undefined
  /** Rigid pipes: three-edge-bearing (TEB) strength per metre of pipe. */
  crushingStrength_kN_per_m?: number | undefined
  beddingFactor?: number | undefined
  crushingSafetyFactor?: number | undefined
  internalPressure_kPa: number
  /** Ground surface to pipe crown. */
  cover_m: number
  installation: Installation
  /** Trench width at crown level (trench installations). */
  trenchWidth_m?: number | undefined
  /** K·μ' of the backfill against the trench wall (Marston). */
  wallFrictionKMu?: number | undefined
  backfillUnitWeight_kN_per_m3: number
  frictionAngle_deg: number
  /** Modulus of soil reaction E' of the sidefill. */
  sidefillModulus_MPa: number
  beddingAngle_deg: number
  groundwaterAboveCrown_m: number
  designTrafficPressure_kPa: number
  deflectionLagFactor?: number | undefined
  deflectionLimit_pct?: number | undefined
}

/** An axis-aligned rectangle in the pipe-local frame. */
export interface RectangleFootprint {
  xMin_m: number
  xMax_m: number
  yMin_m: number
  yMax_m: number
}

/** A simple polygon in the pipe-local frame, vertices as [x_m, y_m] (either orientation). */
export interface PolygonFootprint {
  polygon_m: Array<[number, number]>
}

export type Footprint = RectangleFootprint | PolygonFootprint

/** How long a surface load stays: decides the pipe modulus used for it (methods.md 9). */
export type LoadDuration = 'short-term' | 'long-term'

/** Excavation support systems. */
export type ExcavationSupport = 'none' | 'sloped' | 'trench-box' | 'sheet-piling' | 'braced'

interface ActivityBase {
  id: string
  footprint: Footprint
}

/** A crane outrigger mat or similar: `load_kN` spread uniformly over the footprint. */
export interface PadActivity extends ActivityBase {
  kind: 'pad'
  load_kN: number
  loadDuration?: LoadDuration | undefined
}

/** A uniformly loaded area (stockpile, stored material) of given pressure. */
export interface AreaActivity extends ActivityBase {
  kind: 'area'
  pressure_kPa: number
  loadDuration?: LoadDuration | undefined
}

/** A fill or embankment of given height and unit weight (pressure = height · unit weight). */
export interface FillActivity extends ActivityBase {
  kind: 'fill'
  height_m: number
  unitWeight_kN_per_m3: number
  loadDuration?: LoadDuration | undefined
}

/** An excavation with a flat bottom at `depth_m` below ground. */
export interface ExcavationActivity extends ActivityBase {
  kind: 'excavation'
  depth_m: number
  support: ExcavationSupport
}

export type Activity = PadActivity | AreaActivity | FillActivity | ExcavationActivity
export type SurfaceLoadActivity = PadActivity | AreaActivity | FillActivity

/** The engine input (issue 3). */
export interface AssessmentInput {
  pipe: PipeInput
  activities: Activity[]
}

/** Options of `assessPipe`; every one has a documented default. */
export interface AssessmentOptions {
  /**
   * Clear distance from the pipe (plan, and above the crown) inside which digging must be by
   * hand or vacuum. Default 0.6 m, the widest of the published tolerance zones (methods.md
   * 10.2/10.3: DE 0.30 m, UK 0.5 m, US 18–24 in, Alberta 600 mm).
   */
  handDigDistance_m?: number
  /** Solve the minimum offset / mat size conditions numerically (default true). */
  solveConditions?: boolean
}

/** Demand, capacity and their ratio for one state. */
export interface CheckState {
  demand: number
  capacity: number
  utilisation: number
}

export type CheckId =
  'hoop-stress' | 'ring-deflection' | 'buckling' | 'crushing' | 'ring-bending' | 'exposed-span'

export interface CheckResult {
  id: CheckId
  /** Name of the published method used. */
  method: string
  /** Unit of demand and capacity. */
  unit: string
  baseline: CheckState
  withWorks: CheckState
  /** True for the check with the highest utilisation with works. */
  governing: boolean
}

export interface BaselineWithWorks {
  baseline: number
  withWorks: number
}

export interface Effects {
  siloFactor: BaselineWithWorks
  soilPressureAtCrown_kPa: BaselineWithWorks
  surchargeAtCrown_kPa: number
  sidefillModulus_MPa: BaselineWithWorks
  wallFrictionLost: boolean
  lateralSupportReduced: boolean
  undermined: boolean
  shallowCover: boolean
  /** Position along the pipe axis where the surcharge at the crown is largest. */
  surchargePeakAt_y_m: number
  /** Length of pipe left without support underneath (0 when none). */
  exposedSpan_m: number
}

export type Verdict = 'clear' | 'conditional' | 'critical'

export type ConditionCode =
  | 'min-offset'
  | 'min-mat-size'
  | 'no-stockpile-within'
  | 'keep-sheeting-until-backfilled'
  | 'support-designed-for-pipe'
  | 'hand-dig-zone'
  | 'trial-holes'
  | 'support-exposed-pipe'
  | 'restore-bedding'

export interface Condition {
  code: ConditionCode
  text: string
  reason: string
  /** The activity the condition is about, when there is one. */
  activityId?: string
  /** The number the engine solved for (metres), when there is one. */
  value_m?: number
}

/** What one activity contributes, for display. */
export interface ActivityContribution {
  id: string
  kind: Activity['kind']
  /** Added vertical stress at the crown on the axis at the surcharge peak position. */
  surchargeAtPeak_kPa: number
  /** Horizontal clear distance from the pipe's outside wall to the footprint (0 if over it). */
  clearDistance_m: number
  /** Short plain-English notes on the rules this activity triggered. */
  notes: string[]
}

/** The engine output (issue 3). */
export interface AssessmentResult {
  effects: Effects
  checks: CheckResult[]
  verdict: Verdict
  conditions: Condition[]
  assumptions: string[]
  cautions: string[]
  governingCheckId: CheckId | null
  summary: string
  activities: ActivityContribution[]
}
