import type { Verdict } from '../../shared/statics/types.ts'
import { countedVerdict } from '../../shared/types/screening.ts'

/**
 * A sentence to add to a result headline when other works planned at the same time make some
 * pipes fare worse than the works alone; empty when none do.
 */
export function worseTogetherSentence(
  pipes: { verdict: Verdict; combined: { verdictCombined: Verdict } | null }[],
  where: string,
): string {
  const n = pipes.filter((p) => countedVerdict(p.verdict, p.combined) !== p.verdict).length
  if (n === 0) return ''
  const which = n === 1 ? 'one pipe fares' : `${n} pipes fare`
  return ` Together with other works planned at the same time, ${which} worse; ${where}.`
}
