/**
 * Plain-word statements about concurrent works, for the applicant's and owner's views and for
 * mails. Pure; dates come as YYYY-MM-DD.
 */
import { format, parseISO } from 'date-fns'
import type { Verdict } from '../statics/types.ts'
import type { ConcurrentWorksSummary } from '../types/coordination.ts'

const KIND_WORDS: Record<ConcurrentWorksSummary['activityKinds'][number], string> = {
  excavation: 'excavation',
  crane: 'crane',
  fill: 'fill or stockpile',
}

const MEDIUM_WORDS: Record<string, string> = {
  water: 'water pipe',
  sewer: 'sewer',
  gas: 'gas pipe',
  district_heating: 'district heating pipe',
}

/** A pipe in plain words ("water pipe"), from the stored medium. */
export const pipeInPlainWords = (medium: string) =>
  MEDIUM_WORDS[medium] ?? `${medium.replace(/_/g, ' ')} pipe`

/** "8–10 Dec", "30 Nov–2 Dec", "8 Dec" (and the year when the two ends differ in year). */
export function dateSpanInPlainWords(from: string, to: string): string {
  const a = parseISO(from)
  const b = parseISO(to)
  if (from === to) return format(a, 'd MMM')
  if (from.slice(0, 4) !== to.slice(0, 4))
    return `${format(a, 'd MMM yyyy')}–${format(b, 'd MMM yyyy')}`
  if (from.slice(0, 7) === to.slice(0, 7)) return `${format(a, 'd')}–${format(b, 'd MMM')}`
  return `${format(a, 'd MMM')}–${format(b, 'd MMM')}`
}

/** "TW-2026-00012 (crane, 8–10 Dec)". */
export function worksInPlainWords(w: ConcurrentWorksSummary): string {
  const kinds = [...new Set(w.activityKinds)].map((k) => KIND_WORDS[k]).join(' and ')
  return `${w.reference} (${kinds}, ${dateSpanInPlainWords(w.from, w.to)})`
}

function joinList(items: string[]): string {
  if (items.length <= 1) return items.join('')
  return `${items.slice(0, -1).join(', ')} and ${items[items.length - 1]}`
}

/**
 * What concurrent works change for one pipe, e.g. "Together with TW-2026-00012 (crane, 8–10 Dec)
 * the result for this water pipe becomes critical (alone it is clear), from 8 to 10 Dec."
 */
export function combinedStatementText(
  medium: string,
  verdictAlone: Verdict,
  verdictCombined: Verdict,
  from: string,
  to: string,
  withWorks: readonly ConcurrentWorksSummary[],
): string {
  const others = joinList(withWorks.map(worksInPlainWords))
  const pipe = pipeInPlainWords(medium)
  const period =
    from === to
      ? `on ${dateSpanInPlainWords(from, to)}`
      : `from ${dateSpanInPlainWords(from, from)} to ${dateSpanInPlainWords(to, to)}`
  if (verdictCombined === verdictAlone) {
    return `Together with ${others} the result for this ${pipe} stays ${verdictCombined} ${period}; the loads add up, but not enough to change the result.`
  }
  return `Together with ${others} the result for this ${pipe} becomes ${verdictCombined} ${period} (alone it is ${verdictAlone}).`
}
