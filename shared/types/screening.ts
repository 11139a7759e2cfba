import type { CheckId, ConditionCode, Verdict } from '../statics/types.ts'
import type { CombinedStatement } from './coordination.ts'
import type { PipeMedium } from './network.ts'

/**
 * What an applicant sees of the screening: per owner, which of its pipes the works reach, the
 * verdict, the governing check and the proposed conditions in plain words — never the owner's
 * design data.
 */
export interface AffectedPipeForApplicant {
  /** Our row id of the assessment (not the owner's pipe reference). */
  assessmentId: number
  medium: PipeMedium
  verdict: Verdict
  governingCheck: { id: CheckId; label: string; utilisationWithWorks: number } | null
  /** Plain-word statement of the result. */
  summary: string
  /** Plan distance between the works and the pipe, m (0 when they touch or cross it). */
  distance_m: number
  conditions: { code: ConditionCode; text: string; reason: string }[]
  /** The project rules that switched, in plain words (e.g. wall friction no longer counted). */
  rulesApplied: string[]
  /** The pipe's centre line in WGS84, to highlight it on the map. */
  geometry: { type: 'LineString'; coordinates: [number, number][] }
  /**
   * Other live works on this pipe at the same time, and what they change (only their reference,
   * dates and activity kinds); null when none overlap in time and place.
   */
  combined: CombinedStatement | null
}

export interface OwnerScreening {
  organisation: { id: number; name: string; medium: string | null }
  /** The worst counted verdict of the owner's pipes (works alone or with other works at once). */
  verdict: Verdict | 'not-affected'
  affected: AffectedPipeForApplicant[]
}

export interface ApplicationScreeningDto {
  applicationId: number
  screenedAt: string | null
  /** Worst verdict over every owner. */
  verdict: Verdict | 'not-affected'
  owners: OwnerScreening[]
  /** Influence zone of each activity (its footprint widened by its influence distance), WGS84. */
  influenceZones: {
    activityIndex: number
    distance_m: number
    geometry: { type: 'Polygon'; coordinates: [number, number][][] }
  }[]
  caution: string
}

export const CHECK_LABELS: Record<CheckId, string> = {
  'hoop-stress': 'Hoop stress from internal pressure',
  'ring-deflection': 'Ring deflection',
  buckling: 'Buckling of the pipe wall',
  crushing: 'Crushing strength',
  'ring-bending': 'Ring bending stress',
  'exposed-span': 'Unsupported span where exposed',
}

/** Order of severity, for taking the worst. */
export const VERDICT_RANK: Record<Verdict | 'not-affected', number> = {
  'not-affected': 0,
  clear: 1,
  conditional: 2,
  critical: 3,
}

/**
 * The verdict that counts for a pipe: the worse of the works alone and the works together with
 * other works planned at the same time (when any overlap).
 */
export function countedVerdict(
  verdict: Verdict,
  combined: { verdictCombined: Verdict } | null | undefined,
): Verdict {
  if (!combined) return verdict
  return VERDICT_RANK[combined.verdictCombined] > VERDICT_RANK[verdict]
    ? combined.verdictCombined
    : verdict
}
