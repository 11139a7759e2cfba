/**
 * Public surface of the statics engine. The server, the client preview, the CLI and the tests
 * import only from here.
 */
export { assessPipe, DEFAULT_HAND_DIG_DISTANCE_m } from './assess.ts'
export {
  influenceDistance_m,
  DEFAULT_INFLUENCE_ENVELOPE,
  type InfluenceEnvelope,
} from './influence-distance.ts'
export {
  STANDARD_CAUTION,
  SHALLOW_COVER_CAUTION,
  LONGITUDINAL_CAUTION,
  DEWATERING_CAUTION,
  BASELINE_CAUTION,
  JOINTED_SPAN_CAUTION,
} from './cautions.ts'
export { MATERIAL_DEFAULTS, isFlexibleMaterial, type MaterialDefaults } from './materials.ts'
export { PIPE_FIELD_RANGES } from './resolve-pipe.ts'
export {
  ACTIVITY_FIELD_RANGES,
  MIN_FOOTPRINT_AREA_m2,
  MAX_POLYGON_VERTICES,
  MAX_ACTIVITIES,
} from './resolve-activities.ts'
export { isSimplePolygon, footprintArea_m2, footprintBounds } from './footprint-geometry.ts'

// The published methods, for tools and tests that need a single formula.
export { siloFactor, soilPressureAtCrown_kPa, trenchActsAsEmbankment } from './silo-factor.ts'
export {
  marstonTrenchLoadCoefficient,
  marstonRigidTrenchLoad_kN_per_m,
  marstonFlexibleTrenchLoad_kN_per_m,
  prismLoad_kN_per_m,
  embankmentInteractionFactor,
  rigidPipeSoilLoad_kN_per_m,
} from './marston-load.ts'
export {
  boussinesqPointInfluenceFactor,
  boussinesqPointStress_kPa,
  newmarkCornerInfluenceFactor,
  rectangleStress_kPa,
  polygonStress_kPa,
  circleCentreStress_kPa,
  stripStress_kPa,
} from './boussinesq.ts'
export {
  rankineActiveCoefficient,
  rankinePassiveCoefficient,
  atRestCoefficient,
  activeWedgeAngle_deg,
  activeWedgeReach_m,
} from './earth-pressure.ts'
export {
  meanRadius_m,
  wallSecondMoment_m4_per_m,
  ringStiffness_kPa,
  ringStiffnessSN_kPa,
  pipeStiffnessFromSN_kPa,
} from './ring-stiffness.ts'
export {
  spanglerBeddingConstant,
  SPANGLER_BEDDING_CONSTANTS,
  US_BEDDING_FACTORS,
} from './spangler-bedding.ts'
export { iowaDeflection_pct, IOWA_METHOD, type IowaDeflectionInput } from './iowa-deflection.ts'
export {
  awwaSoilSupportFactor,
  waterBuoyancyFactor,
  awwaBucklingDesignFactor,
  awwaAllowableBucklingPressure_kPa,
  awwaBucklingDemand_kPa,
  unsupportedRingBucklingPressure_kPa,
  unsupportedTubeBucklingPressure_MPa,
  AWWA_BUCKLING_METHOD,
} from './awwa-buckling.ts'
export {
  barlowHoopStress_MPa,
  barlowLongitudinalStress_MPa,
  plasticsPressureRating_bar,
  BARLOW_METHOD,
} from './barlow-hoop.ts'
export {
  crushingCapacity_kN_per_m,
  requiredThreeEdgeBearingStrength_kN_per_m,
  dLoad_kN_per_m_per_m,
  CRUSHING_METHOD,
} from './rigid-crushing.ts'
export {
  verticalLoadMomentCoefficients,
  ringMoments_kNm_per_m,
  maxRingBendingStress_MPa,
  twoLineLoadMomentCoefficients,
  theoreticalBeddingFactor,
  HORIZONTAL_PRESSURE_MOMENT_COEFFICIENTS,
  RING_BENDING_METHOD,
  type RingMomentCoefficients,
} from './ring-moments.ts'
export {
  exposedPipeLineLoad_kN_per_m,
  tubeSectionModulus_m3,
  simplySupportedMoment_kNm,
  exposedSpanStress_MPa,
  allowableUnsupportedSpan_m,
  sagLimitedSpan_m,
  tubeSecondMoment_m4,
  EXPOSED_SPAN_SAG_RATIO,
  EXPOSED_SPAN_METHOD,
} from './exposed-span.ts'
export { pipeGeometry, type PipeGeometry } from './pipe-geometry.ts'
export { wallFrictionRule, type WallFrictionRuleResult } from './wall-friction-rule.ts'
export {
  lateralSupportRule,
  combinedLateralSupportFactor,
  LATERAL_SUPPORT_ZONE_PER_DIAMETER,
  type LateralSupportRuleResult,
} from './lateral-support-rule.ts'
export { underminingRule, type UnderminingRuleResult } from './undermining-rule.ts'
export { exposureOf, mergeExposures, type Exposure } from './exposure-rule.ts'
export { isShallowCover, SHALLOW_COVER_LIMIT_m, SHALLOW_COVER_DIAMETERS } from './shallow-cover.ts'
export { surfaceLoadPressure_kPa, defaultLoadDuration } from './surcharge.ts'

export type * from './types.ts'
