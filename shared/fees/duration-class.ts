import type { DurationClass } from '../types/fees.ts'
import { workingDaysBetween } from '../time/working-days.ts'
import type { IsoDate } from '../time/working-days.ts'

/** Longest works, in working days, that still count as short (minor) works. */
export const MINOR_MAX_WORKING_DAYS = 3
/** Longest works, in working days, that still count as medium (standard) works. */
export const STANDARD_MAX_WORKING_DAYS = 10

/**
 * Working days the works take, the start and the end day both counted: Monday to Wednesday is
 * 3. A period of only weekend days or holidays counts as 1, since the works still occupy the street.
 */
export function worksWorkingDays(
  startsOn: IsoDate,
  endsOn: IsoDate,
  holidays: ReadonlySet<IsoDate>,
): number {
  if (endsOn < startsOn)
    throw new RangeError(`endsOn must not be before startsOn (${startsOn} to ${endsOn})`)
  // workingDaysBetween counts the days after `from`; start one day earlier to include the start.
  const dayBefore = new Date(`${startsOn}T00:00:00Z`)
  if (Number.isNaN(dayBefore.getTime()))
    throw new RangeError(`startsOn must be YYYY-MM-DD (got ${startsOn})`)
  dayBefore.setUTCDate(dayBefore.getUTCDate() - 1)
  const n = workingDaysBetween(dayBefore.toISOString().slice(0, 10), endsOn, holidays)
  return Math.max(1, n)
}

/**
 * The duration class of works lasting `workingDays` working days. Source of the bands: English
 * permit schemes' activity classes (minor ≤ 3, standard 4–10, major ≥ 11 working days),
 * shared/practice.md §1.3.
 */
export function durationClassOf(workingDays: number): DurationClass {
  if (!Number.isInteger(workingDays) || workingDays < 1)
    throw new RangeError(`workingDays must be a whole number of at least 1 (got ${workingDays})`)
  if (workingDays <= MINOR_MAX_WORKING_DAYS) return 'minor'
  if (workingDays <= STANDARD_MAX_WORKING_DAYS) return 'standard'
  return 'major'
}
