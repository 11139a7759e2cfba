import type { BaselineDto } from '../../shared/types/network.ts'
import { checkName } from './check-names.ts'

/**
 * The baseline result in one plain sentence, before any table: which check governs, how close
 * it is to its limit, and whether the segment is over capacity with no works at all.
 */
export function baselineSentence(
  baseline: Pick<BaselineDto, 'governingCheck' | 'utilisation' | 'overCapacity' | 'error'>,
): string {
  if (baseline.error)
    return `No baseline result: the engine could not assess the stored data (${baseline.error}).`
  if (baseline.utilisation === null || baseline.governingCheck === null) {
    return 'No baseline result yet for this segment.'
  }
  const u = baseline.utilisation
  const pct = Math.round(u * 100)
  const check = checkName(baseline.governingCheck).toLowerCase()
  if (baseline.overCapacity) {
    return `Without any works, ${check} already uses ${pct} % of its limit — over capacity. Check the stored data or the pipe itself.`
  }
  if (u >= 0.8)
    return `Without any works, ${check} governs at ${pct} % of its limit — within limits, with little reserve for works.`
  return `Without any works, ${check} governs at ${pct} % of its limit — within limits.`
}
