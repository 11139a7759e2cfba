import type { FeeScheduleTerms } from '../types/fees.ts'

/**
 * What is paid back of a paid application fee when the application is refused or withdrawn.
 * Project rule (written in the schedule, shown to users): the schedule's "before review" share
 * while no owner has answered yet, its "after review" share once one has. The amount is rounded
 * down to whole cents, so we never pay back more than the share.
 *
 * @param paid_cents - the amount paid, whole cents >= 0
 * @param reviewStarted - true once any owner has recorded a decision or a question
 */
export function refundAmount_cents(
  schedule: Pick<FeeScheduleTerms, 'refundBeforeReview_percent' | 'refundAfterReview_percent'>,
  paid_cents: number,
  reviewStarted: boolean,
): number {
  if (!Number.isInteger(paid_cents) || paid_cents < 0)
    throw new RangeError(`paid_cents must be a whole number >= 0 (got ${paid_cents})`)
  const percent = reviewStarted
    ? schedule.refundAfterReview_percent
    : schedule.refundBeforeReview_percent
  if (!(percent >= 0 && percent <= 100))
    throw new RangeError(`refund percent must be 0 to 100 (got ${percent})`)
  return Math.floor((paid_cents * percent) / 100)
}
