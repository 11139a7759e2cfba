import type { HistoryEntryDto } from '../../shared/types/history.ts'
import { http } from './http.ts'

/** What happened to an application, oldest first. */
export function fetchApplicationHistory(applicationId: number): Promise<HistoryEntryDto[]> {
  return http.get<HistoryEntryDto[]>(`/applications/${applicationId}/history`)
}
