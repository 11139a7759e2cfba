import type { IsoDate } from '../time/working-days.ts'

/**
 * The schedule version in force on `date`: the one with the latest `effectiveFrom` on or before
 * it. Versions are never edited; a new version takes over from its first day. Returns null
 * when none had started yet.
 */
export function scheduleInForce<T extends { effectiveFrom: IsoDate }>(
  versions: readonly T[],
  date: IsoDate,
): T | null {
  let best: T | null = null
  for (const v of versions) {
    if (v.effectiveFrom <= date && (!best || v.effectiveFrom > best.effectiveFrom)) best = v
  }
  return best
}

/** The last day of each version (the day before the next one starts), null for the latest. */
export function effectiveUntil(
  versions: readonly { effectiveFrom: IsoDate }[],
  effectiveFrom: IsoDate,
): IsoDate | null {
  const next = versions
    .map((v) => v.effectiveFrom)
    .filter((d) => d > effectiveFrom)
    .sort()[0]
  if (!next) return null
  const d = new Date(`${next}T00:00:00Z`)
  d.setUTCDate(d.getUTCDate() - 1)
  return d.toISOString().slice(0, 10)
}
