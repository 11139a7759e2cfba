import { http } from './http.ts'

/** A message caught by the development mail catcher. */
export interface CaughtMailDto {
  id: string | number
  from: string
  to: string
  subject: string
  text: string | null
  html: string | null
  receivedAt: string
}

export async function fetchOutgoingMail(): Promise<CaughtMailDto[]> {
  const { items } = await http.get<{ items: CaughtMailDto[] }>('/admin/mail')
  return items
}
