import type {
  ChangeRequestDecisionInput,
  ChangeRequestInput,
  ChangeReviewDecisionInput,
  EmergencyWorksInput,
  PlannedStartInput,
  SiteEventInput,
} from '../../shared/schemas/site-works.ts'
import type {
  ChangeRequestDto,
  EmergencyWorksDto,
  GeoJsonCollection,
  SitePackDto,
  SitePackTick,
  SitePhotoDto,
  SitePhotoKind,
  SiteWorksDto,
} from '../../shared/types/site-works.ts'
import { http } from './http.ts'
import { uploadMultipart } from './upload.ts'
import type { UploadHandle } from './upload.ts'

/** The API path of an application's site pack (also what the service worker keeps). */
export const sitePackPath = (applicationId: number) => `/site-works/${applicationId}/pack`

export function fetchSitePack(applicationId: number): Promise<SitePackDto> {
  return http.get<SitePackDto>(sitePackPath(applicationId))
}

export function fetchSiteWorks(applicationId: number): Promise<SiteWorksDto> {
  return http.get<SiteWorksDto>(`/site-works/${applicationId}`)
}

export async function saveChecklist(
  applicationId: number,
  ticks: Record<string, boolean>,
): Promise<Record<string, SitePackTick>> {
  const res = await http.put<{ ticks: Record<string, SitePackTick> }>(
    `/site-works/${applicationId}/checklist`,
    { ticks },
  )
  return res.ticks
}

export function recordPlannedStart(applicationId: number, input: PlannedStartInput) {
  return http.post<SiteWorksDto>(`/site-works/${applicationId}/planned-start`, input)
}

export function recordStart(applicationId: number, input: SiteEventInput = {}) {
  return http.post<SiteWorksDto>(`/site-works/${applicationId}/start`, input)
}

export function recordFinish(applicationId: number, input: SiteEventInput = {}) {
  return http.post<SiteWorksDto>(`/site-works/${applicationId}/finish`, input)
}

export function uploadSitePhoto(
  applicationId: number,
  file: File,
  kind: SitePhotoKind,
  onProgress: (fraction: number) => void,
): UploadHandle<SitePhotoDto> {
  return uploadMultipart<SitePhotoDto>(
    `/site-works/${applicationId}/photos`,
    file,
    { kind },
    onProgress,
  )
}

export function fetchWorksOnSite(): Promise<GeoJsonCollection> {
  return http.get<GeoJsonCollection>('/site-works/live')
}

export function fetchChangeRequests(): Promise<{ items: ChangeRequestDto[] }> {
  return http.get<{ items: ChangeRequestDto[] }>('/change-requests')
}

export function fetchApplicationChangeRequests(applicationId: number) {
  return http.get<{ items: ChangeRequestDto[] }>(
    `/change-requests/for-application/${applicationId}`,
  )
}

export function createChangeRequest(applicationId: number, input: ChangeRequestInput) {
  return http.post<ChangeRequestDto>(`/change-requests/for-application/${applicationId}`, input)
}

export function reviewChangeRequest(id: number, input: ChangeReviewDecisionInput) {
  return http.post<ChangeRequestDto>(`/change-requests/${id}/review`, input)
}

export function decideChangeRequest(id: number, input: ChangeRequestDecisionInput) {
  return http.post<ChangeRequestDto>(`/change-requests/${id}/decision`, input)
}

export function fetchEmergencyWorks(): Promise<{ items: EmergencyWorksDto[] }> {
  return http.get<{ items: EmergencyWorksDto[] }>('/emergency-works')
}

export function reportEmergencyWorks(input: EmergencyWorksInput) {
  return http.post<EmergencyWorksDto>('/emergency-works', input)
}

export function linkEmergencyFollowUp(id: number, applicationId: number) {
  return http.post<EmergencyWorksDto>(`/emergency-works/${id}/follow-up`, { applicationId })
}
