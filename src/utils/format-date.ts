import { formatDistanceToNowStrict, parseISO } from 'date-fns'

const dateTime = new Intl.DateTimeFormat(undefined, { dateStyle: 'medium', timeStyle: 'short' })
const dateOnly = new Intl.DateTimeFormat(undefined, { dateStyle: 'medium' })

/** Date and time in the user's locale, e.g. "8 Dec 2025, 14:05". Empty input gives a dash. */
export function formatDateTime(iso: string | null | undefined): string {
  if (!iso) return '—'
  const date = parseISO(iso)
  return Number.isNaN(date.getTime()) ? '—' : dateTime.format(date)
}

export function formatDate(iso: string | null | undefined): string {
  if (!iso) return '—'
  const date = parseISO(iso)
  return Number.isNaN(date.getTime()) ? '—' : dateOnly.format(date)
}

/** "3 hours ago", for recent events next to the exact time. */
export function formatAgo(iso: string | null | undefined, now: Date = new Date()): string {
  if (!iso) return ''
  const date = parseISO(iso)
  if (Number.isNaN(date.getTime())) return ''
  if (Math.abs(now.getTime() - date.getTime()) < 45_000) return 'just now'
  return formatDistanceToNowStrict(date, { addSuffix: true })
}
