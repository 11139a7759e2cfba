import type { SitePackDto } from '../../shared/types/site-works.ts'

/**
 * The site pack's own copy in localStorage, beside the service worker's: the last pack read
 * from the server, when it was read, and ticks made while offline that the server has not
 * had yet. Keys carry the application id, so two packs on one phone never mix.
 */
const key = (applicationId: number, what: string) => `trenchward.site-pack.${applicationId}.${what}`

export interface StoredPack {
  pack: SitePackDto
  /** When the server last answered, ISO. */
  syncedAt: string
}

function read<T>(k: string): T | null {
  try {
    const raw = localStorage.getItem(k)
    return raw ? (JSON.parse(raw) as T) : null
  } catch {
    return null
  }
}

function write(k: string, v: unknown): void {
  try {
    localStorage.setItem(k, JSON.stringify(v))
  } catch {
    // Storage full or disabled: the pack still works for this visit.
  }
}

export const loadStoredPack = (applicationId: number) =>
  read<StoredPack>(key(applicationId, 'pack'))

export function storePack(applicationId: number, pack: SitePackDto, syncedAt: Date): void {
  write(key(applicationId, 'pack'), { pack, syncedAt: syncedAt.toISOString() } satisfies StoredPack)
}

/** Ticks not yet on the server, by condition key, for one permit issue. */
export interface PendingTicks {
  permitId: number
  ticks: Record<string, boolean>
}

export function loadPendingTicks(applicationId: number, permitId: number): Record<string, boolean> {
  const p = read<PendingTicks>(key(applicationId, 'pending'))
  return p && p.permitId === permitId ? p.ticks : {}
}

export function storePendingTicks(
  applicationId: number,
  permitId: number,
  ticks: Record<string, boolean>,
): void {
  if (Object.keys(ticks).length === 0) localStorage.removeItem(key(applicationId, 'pending'))
  else write(key(applicationId, 'pending'), { permitId, ticks } satisfies PendingTicks)
}
