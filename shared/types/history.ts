/** One entry of an application's history, as the reader may see it. */
export interface HistoryEntryDto {
  id: number
  at: string
  actor: { id: number; name: string; organisation: string | null } | null
  action: string
  /** A plain-word line for the page. */
  summary: string
  details: Record<string, unknown> | null
}
