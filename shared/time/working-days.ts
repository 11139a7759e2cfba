import { addDays, format, isWeekend, parseISO } from 'date-fns'

/**
 * Working-day deadlines: weekends (Saturday, Sunday) and the configured public holidays do not
 * count. Dates are calendar dates (`YYYY-MM-DD`), independent of time zone.
 */

export type IsoDate = string

const ISO = 'yyyy-MM-dd'

/** True when `date` is neither a weekend day nor one of `holidays`. */
export function isWorkingDay(date: IsoDate, holidays: ReadonlySet<IsoDate>): boolean {
  return !isWeekend(parseISO(date)) && !holidays.has(date)
}

/**
 * The date `days` working days after `start` (the start day itself does not count): a review
 * opened on Friday with 3 working days is due on Wednesday.
 *
 * @param start - calendar date the period starts from
 * @param days - working days, integer >= 0 (0 gives `start` moved forward to a working day)
 * @param holidays - public holidays as ISO dates
 */
export function addWorkingDays(
  start: IsoDate,
  days: number,
  holidays: ReadonlySet<IsoDate>,
): IsoDate {
  if (!Number.isInteger(days) || days < 0 || days > 3650) {
    throw new RangeError(`days must be a whole number from 0 to 3650 (got ${days})`)
  }
  let d = parseISO(start)
  if (Number.isNaN(d.getTime()))
    throw new RangeError(`start must be a date YYYY-MM-DD (got ${start})`)
  let left = days
  if (left === 0) {
    while (!isWorkingDay(format(d, ISO), holidays)) d = addDays(d, 1)
    return format(d, ISO)
  }
  while (left > 0) {
    d = addDays(d, 1)
    if (isWorkingDay(format(d, ISO), holidays)) left--
  }
  return format(d, ISO)
}

/**
 * Working days from `from` to `to`: positive when `to` is later, 0 on the same day, negative
 * when `to` has passed (overdue by that many working days).
 */
export function workingDaysBetween(
  from: IsoDate,
  to: IsoDate,
  holidays: ReadonlySet<IsoDate>,
): number {
  if (from === to) return 0
  const sign = from < to ? 1 : -1
  let d = parseISO(sign > 0 ? from : to)
  const end = sign > 0 ? to : from
  let n = 0
  while (format(d, ISO) < end) {
    d = addDays(d, 1)
    if (isWorkingDay(format(d, ISO), holidays)) n++
  }
  return sign * n
}
