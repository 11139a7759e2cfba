import type { PipeInput } from '../../shared/statics/types.ts'
import type { PipeSegmentData } from '../../shared/types/network.ts'

const opt = (v: number | null): number | undefined => (v === null ? undefined : v)

/**
 * The statics engine's pipe input for a stored segment. Empty optional columns become absent
 * fields, so the engine applies (and lists in its assumptions) its material defaults.
 *
 * Cover: the engine takes one cover per pipe; a segment stores the cover at both ends and the
 * engine gets the SMALLER one. Surface loads spread least and the shallow-cover rule bites at
 * the shallow end, which is what works near a pipe are screened for. Caveat, shown with the
 * baseline: the soil load alone is larger at the deeper end, so for a segment whose covers
 * differ a lot, the baseline soil-load checks are those of its shallow end.
 */
export function pipeEngineInput(d: PipeSegmentData): PipeInput {
  return {
    material: d.material,
    outerDiameter_m: d.outerDiameter_m,
    wallThickness_m: d.wallThickness_m,
    shortTermModulus_MPa: opt(d.shortTermModulus_MPa),
    longTermModulus_MPa: opt(d.longTermModulus_MPa),
    allowableStress_MPa: opt(d.allowableStress_MPa),
    crushingStrength_kN_per_m: opt(d.crushingStrength_kN_per_m),
    beddingFactor: opt(d.beddingFactor),
    crushingSafetyFactor: opt(d.crushingSafetyFactor),
    internalPressure_kPa: d.internalPressure_kPa,
    cover_m: Math.min(d.coverStart_m, d.coverEnd_m),
    installation: d.installation,
    trenchWidth_m: opt(d.trenchWidth_m),
    wallFrictionKMu: opt(d.wallFrictionKMu),
    backfillUnitWeight_kN_per_m3: d.backfillUnitWeight_kN_per_m3,
    frictionAngle_deg: d.frictionAngle_deg,
    sidefillModulus_MPa: d.sidefillModulus_MPa,
    beddingAngle_deg: d.beddingAngle_deg,
    groundwaterAboveCrown_m: d.groundwaterAboveCrown_m,
    designTrafficPressure_kPa: d.designTrafficPressure_kPa,
    deflectionLagFactor: opt(d.deflectionLagFactor),
    deflectionLimit_pct: opt(d.deflectionLimit_pct),
  }
}
