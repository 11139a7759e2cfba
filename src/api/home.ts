import type { Role } from '../../shared/types/roles.ts'
import { http } from './http.ts'

/** One thing that needs the user's attention, with a link to where it is dealt with. */
export interface AttentionItem {
  key: string
  label: string
  count: number
  /** A client route path, e.g. '/reviews'. */
  to: string
}

export interface HomeDto {
  role: Role
  items: AttentionItem[]
}

export function fetchHome(): Promise<HomeDto> {
  return http.get<HomeDto>('/home')
}
