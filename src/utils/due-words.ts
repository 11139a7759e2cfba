import { format, parseISO } from 'date-fns'
import type { ReviewClock } from '../../shared/types/reviews.ts'

type Clock = Pick<ReviewClock, 'dueOn' | 'paused' | 'dueInWorkingDays' | 'overdue'> & {
  remainingWorkingDays?: number | null
}

const days = (n: number) => `${n} working day${n === 1 ? '' : 's'}`

/** "Tue 8 Dec" for an ISO date. */
export function shortDay(iso: string): string {
  return format(parseISO(iso), 'EEE d MMM')
}

/**
 * The due date of a review in words: "due in 3 working days (Tue 8 Dec)", "due today (…)",
 * "overdue by 2 working days (due Tue 8 Dec)", or "paused: 4 working days left".
 */
export function dueWords(clock: Clock): string {
  if (clock.paused) {
    const left = clock.remainingWorkingDays
    return left === null || left === undefined
      ? 'paused while the applicant answers'
      : `paused: ${days(left)} left once answered`
  }
  if (!clock.dueOn) return 'no due date'
  const day = shortDay(clock.dueOn)
  const n = clock.dueInWorkingDays
  if (n === null) return `due ${day}`
  if (clock.overdue || n < 0) return `overdue by ${days(Math.max(1, -n))} (due ${day})`
  if (n === 0) return `due today (${day})`
  return `due in ${days(n)} (${day})`
}
