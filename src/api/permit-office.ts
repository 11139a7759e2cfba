import type { GrantPermitInput, RefuseApplicationInput } from '../../shared/schemas/permits.ts'
import type { ApplicationDto } from '../../shared/types/application.ts'
import type { DecisionDraftDto, OfficeQueueItem, PermitDto } from '../../shared/types/permits.ts'
import type {
  ActivityFeatureCollection,
  ApplicantReviewDto,
  ReviewSegmentDto,
} from '../../shared/types/reviews.ts'
import { http } from './http.ts'

export type OfficeQueueStatus = 'open' | 'decided' | 'all'

export interface OfficeQueuePage {
  items: OfficeQueueItem[]
  total: number
}

/** An affected segment of any owner, with the full engine result. */
export type OfficeSegment = Omit<ReviewSegmentDto, 'segmentId' | 'ownerRef' | 'reruns'> & {
  owner: { id: number; name: string }
}

/** One application as the permit office sees it (every owner's segments). */
export interface OfficeApplicationDto {
  application: ApplicationDto
  reviews: ApplicantReviewDto[]
  activities: ActivityFeatureCollection
  segments: OfficeSegment[]
  permits: PermitDto[]
  caution: string
}

/** Ready ones first, then by earliest due date. */
export function fetchOfficeQueue(
  status: OfficeQueueStatus,
  pageSize = 200,
): Promise<OfficeQueuePage> {
  return http.get<OfficeQueuePage>('/permit-office/queue', { status, page: 1, pageSize })
}

export function fetchOfficeApplication(id: number): Promise<OfficeApplicationDto> {
  return http.get<OfficeApplicationDto>(`/permit-office/applications/${id}`)
}

export function fetchDecisionDraft(id: number): Promise<DecisionDraftDto> {
  return http.get<DecisionDraftDto>(`/permit-office/applications/${id}/decision-draft`)
}

export function grantPermit(id: number, input: GrantPermitInput): Promise<PermitDto> {
  return http.post<PermitDto>(`/permit-office/applications/${id}/grant`, input)
}

export function refuseApplication(
  id: number,
  input: RefuseApplicationInput,
): Promise<ApplicationDto> {
  return http.post<ApplicationDto>(`/permit-office/applications/${id}/refuse`, input)
}
