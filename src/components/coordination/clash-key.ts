import type { Clash } from '../../../shared/types/coordination.ts'

/** A stable key for one clash in a list (kind, place, period and the applications in it). */
export function clashKey(c: Clash): string {
  const where = c.kind === 'combined-load' ? `segment-${c.segment.id}` : `street-${c.street}`
  const apps = c.applications.map((a) => a.applicationId).join('-')
  return `${c.kind}:${where}:${apps}:${c.from}:${c.to}`
}
