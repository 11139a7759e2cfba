import { format } from 'date-fns'
import { addWorkingDays, workingDaysBetween } from '../../shared/time/working-days.ts'
import type { ReviewClock, ReviewState } from '../../shared/types/reviews.ts'
import { OPEN_REVIEW_STATES } from '../../shared/types/reviews.ts'

/** The calendar date of `now` in the server's time zone, YYYY-MM-DD. */
export const isoToday = (now: Date = new Date()) => format(now, 'yyyy-MM-dd')

/** The due date of a review opened on `openedOn`: the configured number of working days later. */
export function reviewDueOn(
  openedOn: string,
  periodWorkingDays: number,
  holidays: ReadonlySet<string>,
): string {
  return addWorkingDays(openedOn, periodWorkingDays, holidays)
}

/**
 * Working days left when the clock is paused on `today`: never below zero, so an overdue review
 * that gets its answer is due on the day the answer arrives.
 */
export function remainingWorkingDays(
  today: string,
  dueOn: string,
  holidays: ReadonlySet<string>,
): number {
  return Math.max(0, workingDaysBetween(today, dueOn, holidays))
}

/** The clock of a review as of `today`: due in N working days, overdue, paused. */
export function reviewClock(
  r: {
    state: ReviewState
    openedOn: string
    dueOn: string | null
    pausedAt: Date | null
    remainingWorkingDays: number | null
  },
  today: string,
  holidays: ReadonlySet<string>,
): ReviewClock {
  const open = OPEN_REVIEW_STATES.includes(r.state)
  const paused = r.pausedAt !== null
  const dueIn = r.dueOn && !paused ? workingDaysBetween(today, r.dueOn, holidays) : null
  return {
    openedOn: r.openedOn,
    dueOn: paused ? null : r.dueOn,
    paused,
    remainingWorkingDays: paused ? r.remainingWorkingDays : null,
    dueInWorkingDays: open ? dueIn : null,
    overdue: open && !paused && r.dueOn !== null && r.dueOn < today,
  }
}
