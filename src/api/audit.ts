import { http } from './http.ts'

export interface AuditActor {
  id: number
  name: string
  email: string
}

/** One recorded event: who did what, when, on which record. */
export interface AuditEventDto {
  id: number
  at: string
  actor: AuditActor | null
  action: string
  entityType: string
  entityId: string | number | null
  details: unknown
}

export interface AuditPage {
  items: AuditEventDto[]
  total: number
}

export function fetchAuditEvents(page: number, pageSize: number): Promise<AuditPage> {
  return http.get<AuditPage>('/admin/audit', { page, pageSize })
}
