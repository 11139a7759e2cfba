import type { ActivityKind } from '../schemas/application.ts'
import type { ApplicationFeeBreakdown, FeeLine, FeeScheduleTerms } from '../types/fees.ts'
import { DURATION_CLASS_LABELS } from '../types/fees.ts'
import type { IsoDate } from '../time/working-days.ts'
import { durationClassOf, worksWorkingDays } from './duration-class.ts'

const KIND_WORDS: Record<ActivityKind, [string, string]> = {
  excavation: ['excavation', 'excavations'],
  crane: ['crane set-up', 'crane set-ups'],
  fill: ['fill or stockpile', 'fills or stockpiles'],
}

/**
 * The fee for an application under one schedule version: every activity is charged the
 * schedule's price for its kind in the works' duration class, and the lines add up. Amounts
 * are whole cents; nothing is rounded.
 *
 * @param schedule - the version in force on the submit date (see scheduleInForce)
 * @param works - the works period (calendar dates, both days included), the kinds of its
 *   activities (one entry per activity) and the public holidays that are not working days
 */
export function applicationFee(
  schedule: FeeScheduleTerms,
  works: {
    startsOn: IsoDate
    endsOn: IsoDate
    activityKinds: readonly ActivityKind[]
    holidays: ReadonlySet<IsoDate>
  },
): ApplicationFeeBreakdown {
  if (!works.activityKinds.length)
    throw new RangeError('activityKinds: at least one activity is needed')
  const workingDays = worksWorkingDays(works.startsOn, works.endsOn, works.holidays)
  const durationClass = durationClassOf(workingDays)
  const counts = new Map<ActivityKind, number>()
  for (const k of works.activityKinds) counts.set(k, (counts.get(k) ?? 0) + 1)
  const lines: FeeLine[] = []
  for (const [kind, count] of counts) {
    const entry = schedule.entries.find(
      (e) => e.durationClass === durationClass && e.activityKind === kind,
    )
    if (!entry) {
      throw new RangeError(
        `schedule of ${schedule.effectiveFrom} has no price for ${kind} in ${durationClass} works`,
      )
    }
    const words = KIND_WORDS[kind][count === 1 ? 0 : 1]
    lines.push({
      description: `${count} ${words}, ${DURATION_CLASS_LABELS[durationClass].toLowerCase()}`,
      activityKind: kind,
      count,
      unit_cents: entry.amount_cents,
      amount_cents: entry.amount_cents * count,
    })
  }
  return {
    durationClass,
    workingDays,
    lines,
    amount_cents: lines.reduce((s, l) => s + l.amount_cents, 0),
  }
}

/** The fee for an extension or a variation of a granted permit under one schedule version. */
export function changeFee(schedule: FeeScheduleTerms, change: 'extension' | 'variation'): FeeLine {
  const unit = change === 'extension' ? schedule.extensionFee_cents : schedule.variationFee_cents
  return {
    description: change === 'extension' ? 'Extension of the permit' : 'Variation of the permit',
    activityKind: null,
    count: 1,
    unit_cents: unit,
    amount_cents: unit,
  }
}
