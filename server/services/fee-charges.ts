import { QueryTypes } from 'sequelize'
import type { Transaction } from 'sequelize'
import { applicationFee, changeFee, refundAmount_cents } from '../../shared/fees/index.ts'
import type { ActivityKind } from '../../shared/schemas/application.ts'
import { config } from '../config.ts'
import { domainRule } from '../errors.ts'
import { Application, ApplicationFee, FeeSchedule } from '../models/index.ts'
import { scheduleInForceOn, scheduleTerms } from './fee-schedules.ts'
import { isoToday } from './review-clock.ts'

/**
 * Compute the application fee at submit, inside the submit transaction, with the schedule
 * version in force on the submit date. No version in force: no fee row (nothing to pay).
 */
export async function assessApplicationFee(
  application: Application,
  activityKinds: readonly ActivityKind[],
  transaction: Transaction,
  now = new Date(),
): Promise<ApplicationFee | null> {
  const schedule = await scheduleInForceOn(isoToday(now), null, transaction)
  if (!schedule || !application.startsOn || !application.endsOn) return null
  const terms = scheduleTerms(schedule)
  const fee = applicationFee(terms, {
    startsOn: application.startsOn,
    endsOn: application.endsOn,
    activityKinds,
    holidays: config().publicHolidays,
  })
  return ApplicationFee.create(
    {
      applicationId: application.id,
      feeScheduleId: schedule.id,
      purpose: 'application',
      permitId: null,
      durationClass: fee.durationClass,
      workingDays: fee.workingDays,
      lines: fee.lines,
      amountCents: fee.amount_cents,
      currency: terms.currency,
      paymentTerms: terms.defaultPaymentTerms,
      state: fee.amount_cents > 0 ? 'due' : 'no_charge',
      checkoutSessionId: null,
      paymentIntentId: null,
      refundId: null,
      paidAt: null,
      refundedAt: null,
    },
    { transaction },
  )
}

/**
 * Charge the extension or variation fee of the schedule in force today for a new permit issue,
 * inside the transaction that writes the issue. The authority is the one whose schedule priced
 * the application; with none, the rule of scheduleInForceOn.
 */
export async function chargeChangeFee(
  application: Application,
  permitId: number,
  change: 'extension' | 'variation',
  transaction: Transaction,
  now = new Date(),
): Promise<ApplicationFee | null> {
  const first = await ApplicationFee.findOne({
    where: { applicationId: application.id, purpose: 'application' },
    include: [{ model: FeeSchedule, as: 'schedule', attributes: ['authorityOrganisationId'] }],
    transaction,
  })
  const schedule = await scheduleInForceOn(
    isoToday(now),
    first?.schedule?.authorityOrganisationId ?? null,
    transaction,
  )
  if (!schedule) return null
  const terms = scheduleTerms(schedule)
  const line = changeFee(terms, change)
  return ApplicationFee.create(
    {
      applicationId: application.id,
      feeScheduleId: schedule.id,
      purpose: change,
      permitId,
      durationClass: null,
      workingDays: null,
      lines: [line],
      amountCents: line.amount_cents,
      currency: terms.currency,
      paymentTerms: first?.paymentTerms ?? terms.defaultPaymentTerms,
      state: line.amount_cents > 0 ? 'due' : 'no_charge',
      checkoutSessionId: null,
      paymentIntentId: null,
      refundId: null,
      paidAt: null,
      refundedAt: null,
    },
    { transaction },
  )
}

/** Grant is blocked while the application fee is to be paid before grant and is not paid. */
export async function assertFeeAllowsGrant(
  applicationId: number,
  transaction: Transaction,
): Promise<void> {
  const unpaid = await ApplicationFee.findOne({
    where: {
      applicationId,
      purpose: 'application',
      paymentTerms: 'pay_before_grant',
      state: 'due',
    },
    transaction,
  })
  if (unpaid) {
    throw domainRule(
      'The application fee is to be paid before the permit is granted, and it has not been paid yet; wait for the payment or switch this application to invoice',
    )
  }
}

/** True once any owner's engineer has recorded a decision or asked a question on the application. */
export async function reviewStarted(
  applicationId: number,
  transaction?: Transaction,
): Promise<boolean> {
  const rows = await Application.sequelize!.query<{ n: number }>(
    `SELECT COUNT(*) AS n FROM review_decisions d JOIN owner_reviews r ON r.id = d.review_id WHERE r.application_id = ?`,
    { replacements: [applicationId], type: QueryTypes.SELECT, transaction },
  )
  return Number(rows[0]?.n ?? 0) > 0
}

/**
 * When an application is refused or withdrawn: unpaid fees are cancelled; a paid application
 * fee is owed back by the schedule's refund rule (project rule, shown to users: the "before
 * review" share while no owner has answered, the "after review" share once one has). Fees of
 * extensions and variations are not refunded (the permit was granted and changed). Returns the
 * fees with a refund to pay back once the transaction has committed.
 */
export async function closeApplicationFees(
  applicationId: number,
  transaction: Transaction,
): Promise<number[]> {
  const fees = await ApplicationFee.findAll({
    where: { applicationId },
    transaction,
    lock: transaction.LOCK.UPDATE,
  })
  const started = await reviewStarted(applicationId, transaction)
  const refunds: number[] = []
  for (const fee of fees) {
    if (fee.state === 'due') {
      await fee.update({ state: 'cancelled' }, { transaction })
    } else if (fee.state === 'paid' && fee.purpose === 'application') {
      const schedule = (await FeeSchedule.findByPk(fee.feeScheduleId, { transaction }))!
      const amount = refundAmount_cents(scheduleTerms(schedule), fee.amountCents, started)
      if (amount > 0) {
        await fee.update({ state: 'refund_due', refundDueCents: amount }, { transaction })
        // Paid online: paid back through the payment service. Paid on invoice: the office pays
        // it back by transfer and books it (recordOfflineRefund).
        if (fee.paymentIntentId) refunds.push(fee.id)
      }
    }
  }
  return refunds
}
