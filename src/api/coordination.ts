import type { CoordinationPeriod } from '../../shared/schemas/coordination.ts'
import type {
  ClashList,
  CoordinationWorksCollection,
  Timeline,
} from '../../shared/types/coordination.ts'
import { http } from './http.ts'

/** The activities of every live application with days in the period, as GeoJSON (WGS84). */
export function fetchCoordinationWorks(
  period: CoordinationPeriod,
  bbox?: [number, number, number, number],
): Promise<CoordinationWorksCollection> {
  return http.get<CoordinationWorksCollection>('/coordination/works', {
    from: period.from,
    to: period.to,
    bbox: bbox?.join(','),
  })
}

/** Combined-load and same-street clashes in the period, each with its reason. */
export function fetchCoordinationClashes(period: CoordinationPeriod): Promise<ClashList> {
  return http.get<ClashList>('/coordination/clashes', { from: period.from, to: period.to })
}

/** Live applications in the period grouped by their nearest street. */
export function fetchCoordinationTimeline(period: CoordinationPeriod): Promise<Timeline> {
  return http.get<Timeline>('/coordination/timeline', { from: period.from, to: period.to })
}
