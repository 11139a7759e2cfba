import type { AssessmentInput, AssessmentResult, Verdict } from '../statics/types.ts'
import type { CombinedRun } from '../screening/combined-screening.ts'
import type { ActivityInput } from '../schemas/application.ts'
import type { ApplicationStatus } from './application.ts'
import type { PipeMedium } from './network.ts'

/**
 * Another application's works as others may see them: reference, dates and activity kinds only
 * (never the applicant's name, title or drawings).
 */
export interface ConcurrentWorksSummary {
  applicationId: number
  reference: string
  /** First and last day counted (the permit's validity once granted), YYYY-MM-DD. */
  from: string
  to: string
  activityKinds: ActivityInput['kind'][]
}

/** What an assessment stores of its combined screening (column `assessments.combined`). */
export interface StoredCombinedScreening {
  /** When it was computed, ISO time. */
  screenedAt: string
  /** The worst interval: its dates, the applications added and the verdict. */
  worst: CombinedRun
  /** Every interval with other works active, in date order (each run can be recomputed). */
  runs: CombinedRun[]
  /** The applications that appear in any run. */
  applications: ConcurrentWorksSummary[]
  /** Engine input and result of the worst run, exactly as the engine saw and returned them. */
  engineInput: AssessmentInput
  result: AssessmentResult
}

/** Plain statement about concurrent works for an applicant's or owner's view of one pipe. */
export interface CombinedStatement {
  verdictAlone: Verdict
  verdictCombined: Verdict
  /** First and last day of the worst period, YYYY-MM-DD. */
  from: string
  to: string
  /** The other works in that period. */
  withWorks: ConcurrentWorksSummary[]
  /** E.g. "Together with TW-2026-00012 (crane, 8–10 Dec) the result for this water pipe becomes critical." */
  statement: string
}

/** GeoJSON properties of one activity on the clash-view map. */
export interface CoordinationWorkProperties {
  applicationId: number
  reference: string
  title: string
  status: ApplicationStatus
  startsOn: string
  endsOn: string
  activityId: number
  kind: ActivityInput['kind']
  label: string | null
}

export interface CoordinationWorksCollection {
  type: 'FeatureCollection'
  features: {
    type: 'Feature'
    id: number
    properties: CoordinationWorkProperties
    geometry:
      | { type: 'Polygon'; coordinates: [number, number][][] }
      | { type: 'Point'; coordinates: [number, number] }
      | { type: 'MultiPoint'; coordinates: [number, number][] }
  }[]
}

export interface ClashApplication {
  applicationId: number
  reference: string
  title: string
  status: ApplicationStatus
  startsOn: string
  endsOn: string
}

/** A clash for the permit office: combined load worse than alone, or two digs in one street. */
export type Clash =
  | {
      kind: 'combined-load'
      /** First and last day of the period in which the works add up. */
      from: string
      to: string
      applications: ClashApplication[]
      segment: {
        id: number
        owner: { id: number; name: string }
        medium: PipeMedium
        /** The segment's centre line, WGS84 lon/lat (for the works map). */
        geometry: { type: 'LineString'; coordinates: [number, number][] } | null
      }
      /** Worst verdict of any one of the applications alone on this segment. */
      verdictAlone: Verdict
      verdictCombined: Verdict
      reason: string
    }
  | {
      kind: 'same-street'
      from: string
      to: string
      applications: ClashApplication[]
      street: string
      reason: string
    }

export interface ClashList {
  from: string
  to: string
  items: Clash[]
  /** The rules behind the list, in plain words. */
  rules: string[]
}

/** One street's applications on the timeline. */
export interface TimelineGroup {
  /** Nearest street name, or null when no street lies within the search distance. */
  street: string | null
  applications: (ClashApplication & { distanceToStreet_m: number | null })[]
}

export interface Timeline {
  from: string
  to: string
  groups: TimelineGroup[]
}
