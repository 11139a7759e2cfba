import type {
  ApplicationDraftInput,
  ApplicationUpdateInput,
} from '../../shared/schemas/application.ts'
import type {
  ApplicationDto,
  ApplicationListItem,
  ApplicationStatus,
} from '../../shared/types/application.ts'
import type { ApplicationScreeningDto } from '../../shared/types/screening.ts'
import { http } from './http.ts'

/** One page of the applications the signed-in user may see (an applicant: their organisation's). */
export interface ApplicationListQuery {
  page: number
  pageSize: number
  status?: ApplicationStatus | null
  q?: string | null
}

export interface ApplicationPage {
  items: ApplicationListItem[]
  total: number
}

export function fetchApplications(query: ApplicationListQuery): Promise<ApplicationPage> {
  return http.get<ApplicationPage>('/applications', {
    page: query.page,
    pageSize: query.pageSize,
    status: query.status,
    q: query.q,
  })
}

export function fetchApplication(id: number): Promise<ApplicationDto> {
  return http.get<ApplicationDto>(`/applications/${id}`)
}

/** Creates a draft (the first save of a new application). */
export function createApplication(draft: ApplicationDraftInput): Promise<ApplicationDto> {
  return http.post<ApplicationDto>('/applications', draft)
}

/** Saves the whole draft; 409 CONFLICT when someone saved a newer version meanwhile. */
export function saveApplication(
  id: number,
  update: ApplicationUpdateInput,
): Promise<ApplicationDto> {
  return http.put<ApplicationDto>(`/applications/${id}`, update)
}

/** Submits the saved draft of this version; the server screens it against every nearby pipe. */
export function submitApplication(id: number, version: number): Promise<ApplicationDto> {
  return http.post<ApplicationDto>(`/applications/${id}/submit`, { version })
}

export function withdrawApplication(id: number, reason?: string): Promise<ApplicationDto> {
  return http.post<ApplicationDto>(`/applications/${id}/withdraw`, reason ? { reason } : {})
}

export function fetchScreening(id: number): Promise<ApplicationScreeningDto> {
  return http.get<ApplicationScreeningDto>(`/applications/${id}/screening`)
}
