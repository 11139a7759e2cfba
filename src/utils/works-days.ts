import { addDays, differenceInCalendarDays, format, parseISO } from 'date-fns'

/**
 * Calendar-day arithmetic for the works map and timeline. Days are YYYY-MM-DD strings and
 * every period is inclusive at both ends, as the coordination API counts them.
 */

export const isoDay = (d: Date): string => format(d, 'yyyy-MM-dd')

export const shiftDay = (day: string, by: number): string => isoDay(addDays(parseISO(day), by))

/** Days from `from` to `to`, counting both: 1 for a single day. */
export const daysInPeriod = (from: string, to: string): number =>
  differenceInCalendarDays(parseISO(to), parseISO(from)) + 1

/** Whether works from `startsOn` to `endsOn` are on site on `day`. */
export const activeOn = (
  works: { startsOn: string; endsOn: string } | { from: string; to: string },
  day: string,
): boolean =>
  'startsOn' in works
    ? works.startsOn <= day && day <= works.endsOn
    : works.from <= day && day <= works.to

/**
 * Where a bar from `from` to `to` sits on a timeline of the period, as fractions of its width
 * (left edge and width), clipped to the period. Null when it lies wholly outside.
 */
export function barPlacement(
  period: { from: string; to: string },
  from: string,
  to: string,
): { left: number; width: number; clippedStart: boolean; clippedEnd: boolean } | null {
  if (to < period.from || from > period.to) return null
  const total = daysInPeriod(period.from, period.to)
  const start = from < period.from ? period.from : from
  const end = to > period.to ? period.to : to
  return {
    left: (daysInPeriod(period.from, start) - 1) / total,
    width: daysInPeriod(start, end) / total,
    clippedStart: from < period.from,
    clippedEnd: to > period.to,
  }
}

/**
 * Tick days for a timeline axis: every day for short periods, otherwise Mondays (weeks) or the
 * first of each month, so labels never crowd (at most about `maxTicks`).
 */
export function axisTicks(from: string, to: string, maxTicks = 14): string[] {
  const total = daysInPeriod(from, to)
  const days = Array.from({ length: total }, (_, i) => shiftDay(from, i))
  if (total <= maxTicks) return days
  const mondays = days.filter((d) => parseISO(d).getDay() === 1)
  if (mondays.length <= maxTicks) return mondays
  const step = Math.ceil(mondays.length / maxTicks)
  const firsts = days.filter((d) => d.endsWith('-01'))
  return firsts.length >= 2 && firsts.length <= maxTicks
    ? firsts
    : mondays.filter((_, i) => i % step === 0)
}

const shortDay = new Intl.DateTimeFormat(undefined, {
  weekday: 'short',
  day: 'numeric',
  month: 'short',
})
const dayMonth = new Intl.DateTimeFormat(undefined, { day: 'numeric', month: 'short' })

/** "Tue 8 Dec" in the user's locale. */
export const formatShortDay = (day: string): string => shortDay.format(parseISO(day))

/** "8 Dec" in the user's locale. */
export const formatDayMonth = (day: string): string => dayMonth.format(parseISO(day))

/** "8 Dec – 12 Dec", or one day. */
export const formatDaySpan = (from: string, to: string): string =>
  from === to ? formatDayMonth(from) : `${formatDayMonth(from)} – ${formatDayMonth(to)}`
