/**
 * Split one application's date range into the periods in which the set of other works going on
 * at the same time stays the same. Dates are calendar days, `YYYY-MM-DD`, both ends inclusive
 * (an application from 8 to 10 December works on the 8th, 9th and 10th).
 */
import { addDays, format, isValid, parseISO } from 'date-fns'

/** A calendar-date range, both ends inclusive. */
export interface DateRange {
  /** First day, YYYY-MM-DD. */
  from: string
  /** Last day, YYYY-MM-DD (not before `from`). */
  to: string
}

/** Another application's works and the days they take. */
export interface ConcurrentRange extends DateRange {
  id: number
}

/** A maximal period in which the same other works are active. */
export interface ConcurrencyInterval extends DateRange {
  /** Ids of the other works active on every day of the interval, ascending (may be empty). */
  activeIds: number[]
}

const ISO_DATE = /^\d{4}-\d{2}-\d{2}$/

function checkDate(value: string, name: string): void {
  if (!ISO_DATE.test(value) || !isValid(parseISO(value))) {
    throw new RangeError(`${name}: not a calendar date YYYY-MM-DD (${value})`)
  }
}

const nextDay = (d: string) => format(addDays(parseISO(d), 1), 'yyyy-MM-dd')
const previousDay = (d: string) => format(addDays(parseISO(d), -1), 'yyyy-MM-dd')

/** Whether two inclusive ranges share at least one day. */
export function rangesOverlap(a: DateRange, b: DateRange): boolean {
  return a.from <= b.to && b.from <= a.to
}

/**
 * The maximal intervals of `own` in which the set of active `others` is constant, in date
 * order; together they cover `own` exactly. Others that share no day with `own` are ignored;
 * neighbouring intervals always differ in their active set.
 *
 * @param own this application's range (inclusive dates)
 * @param others the other applications' ranges, each with its id
 * @returns the intervals, each with the ids of the other works active in it
 * @throws RangeError when a date is not YYYY-MM-DD or a range ends before it starts
 */
export function concurrencyIntervals(
  own: DateRange,
  others: readonly ConcurrentRange[],
): ConcurrencyInterval[] {
  checkDate(own.from, 'own.from')
  checkDate(own.to, 'own.to')
  if (own.to < own.from) throw new RangeError('own.to: ends before own.from')
  others.forEach((o, i) => {
    checkDate(o.from, `others[${i}].from`)
    checkDate(o.to, `others[${i}].to`)
    if (o.to < o.from) throw new RangeError(`others[${i}].to: ends before its from`)
  })

  // Clip every other range to ours; an interval starts wherever some range starts or ends.
  const clipped = others
    .filter((o) => rangesOverlap(own, o))
    .map((o) => ({
      id: o.id,
      from: o.from < own.from ? own.from : o.from,
      to: o.to > own.to ? own.to : o.to,
    }))
  const starts = new Set<string>([own.from])
  for (const o of clipped) {
    starts.add(o.from)
    if (o.to < own.to) starts.add(nextDay(o.to))
  }
  const sorted = [...starts].sort()

  const out: ConcurrencyInterval[] = []
  sorted.forEach((from, k) => {
    const to = k + 1 < sorted.length ? previousDay(sorted[k + 1]!) : own.to
    const activeIds = [
      ...new Set(clipped.filter((o) => o.from <= from && to <= o.to).map((o) => o.id)),
    ].sort((a, b) => a - b)
    const last = out[out.length - 1]
    if (last && last.activeIds.join(',') === activeIds.join(',')) last.to = to
    else out.push({ from, to, activeIds })
  })
  return out
}
