import type {
  ExtendPermitInput,
  RevokePermitInput,
  VaryPermitInput,
} from '../../shared/schemas/permits.ts'
import type { PermitDto } from '../../shared/types/permits.ts'
import { config } from '../config.ts'
import { http } from './http.ts'

export interface ApplicationPermits {
  permits: PermitDto[]
  refusal: { reasons: string; at: string; by: { id: number; name: string } | string } | null
}

export function fetchApplicationPermits(applicationId: number): Promise<ApplicationPermits> {
  return http.get<ApplicationPermits>(`/applications/${applicationId}/permits`)
}

export function fetchPermit(id: number): Promise<PermitDto> {
  return http.get<PermitDto>(`/permits/${id}`)
}

/** Where the browser downloads the signed PDF of a permit issue. */
export function permitDocumentHref(id: number): string {
  return `${config.apiBase}/permits/${id}/document`
}

export function extendPermit(id: number, input: ExtendPermitInput): Promise<PermitDto> {
  return http.post<PermitDto>(`/permits/${id}/extend`, input)
}

export function varyPermit(id: number, input: VaryPermitInput): Promise<PermitDto> {
  return http.post<PermitDto>(`/permits/${id}/vary`, input)
}

export function revokePermit(id: number, input: RevokePermitInput): Promise<PermitDto> {
  return http.post<PermitDto>(`/permits/${id}/revoke`, input)
}
