/**
 * Combined screening of one pipe segment: this application's activities together with those of
 * the other live applications that reach the same segment, for each period in which the same
 * works go on at once. Pure: the caller loads the data and stores the outcome.
 *
 * Project rules (conservative):
 * - Every activity of an application counts on every day of its range: we do not know which day
 *   the crane stands or the pit is open, so all of them are assumed to be there together.
 * - Within one interval every active application's activities are placed in the same pipe-local
 *   frame and checked together, so their effects add up as the engine adds them.
 * - The worst interval counts (highest verdict, then highest utilisation), and within it the
 *   worst straight piece of the segment, as in screening alone.
 */
import { pieceToRingDistance_m } from '../geo/pipe-local-frame.ts'
import type { PipePiece } from '../geo/pipe-local-frame.ts'
import { assessPipe } from '../statics/index.ts'
import type { AssessmentInput, AssessmentResult, PipeInput, Verdict } from '../statics/types.ts'
import type { ConcurrencyInterval, DateRange } from './concurrency-intervals.ts'
import { toPieceActivities } from './engine-activities.ts'
import type { GridActivity } from './engine-activities.ts'

/** One application's activities in the projected CRS, with each one's influence distance. */
export interface WorksOnSegment {
  applicationId: number
  activities: readonly GridActivity[]
  /** Influence distance of each activity (same order), metres. */
  influence_m: readonly number[]
}

/** The outcome of one combined run (one interval). */
export interface CombinedRun extends DateRange {
  /** The other applications whose works were added. */
  applicationIds: number[]
  verdict: Verdict
  /** Highest utilisation over every check with the works. */
  maxUtilisation: number
  pieceIndex: number
}

/** The worst combined run of a segment, with its full engine input and result. */
export interface CombinedScreening {
  worst: CombinedRun
  input: AssessmentInput
  result: AssessmentResult
  /** Every interval in which other works were active, in date order, for the record. */
  runs: CombinedRun[]
}

/** Highest with-works utilisation over every check of a result. */
export function maxUtilisation(r: AssessmentResult): number {
  return r.checks.reduce((m, c) => Math.max(m, c.withWorks.utilisation), 0)
}

const RANK: Record<Verdict, number> = { clear: 1, conditional: 2, critical: 3 }

/** Whether result `a` is worse than `b`: a higher verdict, or the same one at higher utilisation. */
export function isWorseResult(a: AssessmentResult, b: AssessmentResult): boolean {
  if (RANK[a.verdict] !== RANK[b.verdict]) return RANK[a.verdict] > RANK[b.verdict]
  return maxUtilisation(a) > maxUtilisation(b)
}

/**
 * Engine ids of other applications' activities get the application id in front, so that two
 * applications' `a0` stay apart in the engine's effects and conditions.
 */
export const combinedActivityId = (applicationId: number, id: string) =>
  `${id} (other works, application ${applicationId})`

/**
 * Run the engine for every interval in which other works are active and return the worst run.
 *
 * @param pipe the segment's engine input (the same as in its alone screening)
 * @param pieces the straight pieces of the segment in the projected CRS
 * @param own this application's works
 * @param others the other applications' works that reach this segment
 * @param intervals this application's range split by concurrency (see concurrency-intervals.ts)
 * @returns the worst combined run, or null when no other works are active in any interval
 */
export function worstCombinedScreening(
  pipe: PipeInput,
  pieces: readonly PipePiece[],
  own: WorksOnSegment,
  others: readonly WorksOnSegment[],
  intervals: readonly ConcurrencyInterval[],
): CombinedScreening | null {
  const byId = new Map(others.map((o) => [o.applicationId, o]))
  // The same set of works can recur in non-neighbouring intervals; its result does not change.
  const memo = new Map<
    string,
    { input: AssessmentInput; result: AssessmentResult; piece: number }
  >()
  const runs: CombinedRun[] = []
  let worst: CombinedScreening | null = null

  for (const interval of intervals) {
    const ids = interval.activeIds.filter((id) => byId.has(id))
    if (!ids.length) continue
    const key = ids.join(',')
    let best = memo.get(key)
    if (!best) {
      const sets = [own, ...ids.map((id) => byId.get(id)!)]
      const grid: GridActivity[] = []
      const reach: number[] = []
      sets.forEach((set, k) => {
        set.activities.forEach((g, i) => {
          grid.push(k === 0 ? g : { ...g, id: combinedActivityId(set.applicationId, g.id) })
          reach.push(set.influence_m[i]!)
        })
      })
      for (const piece of pieces) {
        const reached = grid.some((g, i) => pieceToRingDistance_m(piece, g.ring_grid) <= reach[i]!)
        if (!reached) continue
        const input: AssessmentInput = { pipe, activities: toPieceActivities(grid, piece) }
        const result = assessPipe(input)
        if (!best || isWorseResult(result, best.result))
          best = { input, result, piece: piece.index }
      }
      if (!best) continue
      memo.set(key, best)
    }
    const run: CombinedRun = {
      from: interval.from,
      to: interval.to,
      applicationIds: ids,
      verdict: best.result.verdict,
      maxUtilisation: maxUtilisation(best.result),
      pieceIndex: best.piece,
    }
    runs.push(run)
    if (!worst || isWorseResult(best.result, worst.result)) {
      worst = { worst: run, input: best.input, result: best.result, runs }
    }
  }
  return worst ? { ...worst, runs } : null
}
