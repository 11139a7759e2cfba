import type { LocationQueryValue } from 'vue-router'

/** The ?next= target after sign-in, only if it is a path inside this app (no open redirect). */
export function safeNext(
  next: LocationQueryValue | LocationQueryValue[] | undefined,
): string | null {
  const value = Array.isArray(next) ? next[0] : next
  if (typeof value !== 'string') return null
  if (!value.startsWith('/') || value.startsWith('//') || value.startsWith('/\\')) return null
  if (value.startsWith('/sign-in')) return null
  return value
}
