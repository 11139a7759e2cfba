import type Stripe from 'stripe'
import { UniqueConstraintError } from 'sequelize'
import type { Sequelize, Transaction } from 'sequelize'
import { ErrorCode } from '../../shared/errors.ts'
import type { ApplicationFeesDto, FeeLine } from '../../shared/types/fees.ts'
import { FEE_PURPOSE_LABELS } from '../../shared/types/fees.ts'
import { config } from '../config.ts'
import { AppError, domainRule, forbidden, notFound } from '../errors.ts'
import { logger } from '../logger.ts'
import { linkTo } from '../mail/templates/mail-text.ts'
import { Application, ApplicationFee, PaymentEvent } from '../models/index.ts'
import type { User } from '../models/index.ts'
import { listApplicationFees } from './application-fees.ts'
import { recordAudit } from './audit.ts'
import { paymentClient, webhookSecret } from './payment-gateway.ts'
import { issueReceipt } from './receipts.ts'
import { payRefunds } from './refunds.ts'
import { parseJson } from './review-dto.ts'

/** The applicant's own fee that is to be paid, or an error saying why not. */
async function payableFee(
  user: User,
  feeId: number,
): Promise<{ fee: ApplicationFee; application: Application }> {
  if (user.role !== 'applicant') throw forbidden()
  const fee = await ApplicationFee.findByPk(feeId)
  const application = fee ? await Application.findByPk(fee.applicationId) : null
  if (!fee || !application || application.applicantOrganisationId !== user.organisationId)
    throw notFound('fee', feeId)
  return { fee, application }
}

/**
 * Start an online payment of a fee: a checkout session on the payment service with the fee's
 * lines; the client sends the applicant to its hosted page. Card details are entered there only.
 */
export async function startCheckout(user: User, feeId: number): Promise<{ url: string }> {
  const { fee, application } = await payableFee(user, feeId)
  if (fee.state !== 'due')
    throw domainRule(`This fee is ${fee.state.replace('_', ' ')}; there is nothing to pay`)
  const stripe = paymentClient()
  const base = linkTo(config().publicUrl, `/applications/${application.id}`)
  const lines = parseJson<FeeLine[]>(fee.lines)
  const session = await stripe.checkout.sessions.create({
    mode: 'payment',
    success_url: `${base}?payment=returned&fee=${fee.id}`,
    cancel_url: `${base}?payment=cancelled&fee=${fee.id}`,
    client_reference_id: `fee-${fee.id}`,
    customer_email: user.email,
    line_items: lines.map((l) => ({
      quantity: l.count,
      price_data: {
        currency: fee.currency.toLowerCase(),
        unit_amount: l.unit_cents,
        product_data: {
          name: `${application.reference ?? `#${application.id}`}: ${l.description}`,
        },
      },
    })),
    metadata: {
      applicationFeeId: String(fee.id),
      applicationId: String(application.id),
      purpose: FEE_PURPOSE_LABELS[fee.purpose],
    },
  })
  if (!session.url)
    throw new AppError(
      ErrorCode.SERVICE_UNAVAILABLE,
      503,
      'The payment service did not open a payment page; try again',
    )
  await fee.update({ checkoutSessionId: session.id, lastAttemptFailed: false })
  await recordAudit({
    actorUserId: user.id,
    action: 'fee-checkout-started',
    entityType: 'application',
    entityId: application.id,
    details: { feeId: fee.id, checkoutSessionId: session.id, amount_cents: fee.amountCents },
  })
  return { url: session.url }
}

/**
 * Book a completed checkout session on its fee, inside `transaction`: the fee becomes paid and
 * a receipt is written. Idempotent: a session already booked changes nothing. A payment for a
 * fee that was cancelled meanwhile (application withdrawn) is booked and owed back in full.
 * Returns the fee id when a refund is now to be paid back.
 */
async function bookPaidSession(
  session: Stripe.Checkout.Session,
  transaction: Transaction,
  now: Date,
): Promise<{ outcome: string; feeId: number | null; refundFeeId: number | null }> {
  const feeId = Number(session.metadata?.applicationFeeId)
  const fee = Number.isInteger(feeId)
    ? await ApplicationFee.findByPk(feeId, { transaction, lock: transaction.LOCK.UPDATE })
    : null
  if (!fee) return { outcome: 'no matching fee', feeId: null, refundFeeId: null }
  if (session.payment_status !== 'paid')
    return { outcome: `not paid (${session.payment_status})`, feeId: fee.id, refundFeeId: null }
  if (
    session.amount_total !== fee.amountCents ||
    (session.currency ?? '').toUpperCase() !== fee.currency
  ) {
    logger.error({ feeId: fee.id, sessionId: session.id }, 'paid amount differs from the fee')
    return {
      outcome: 'amount or currency differs from the fee; not booked',
      feeId: fee.id,
      refundFeeId: null,
    }
  }
  const paymentIntent =
    typeof session.payment_intent === 'string'
      ? session.payment_intent
      : (session.payment_intent?.id ?? null)
  if (fee.paymentIntentId) {
    return {
      outcome:
        fee.paymentIntentId === paymentIntent
          ? 'already booked'
          : 'fee already paid by another payment',
      feeId: fee.id,
      refundFeeId: null,
    }
  }
  const wasCancelled = fee.state === 'cancelled'
  if (fee.state !== 'due' && !wasCancelled)
    return { outcome: `fee is ${fee.state}`, feeId: fee.id, refundFeeId: null }
  await fee.update(
    {
      state: wasCancelled ? 'refund_due' : 'paid',
      refundDueCents: wasCancelled ? fee.amountCents : 0,
      paidAt: now,
      paymentIntentId: paymentIntent,
      checkoutSessionId: session.id,
      lastAttemptFailed: false,
    },
    { transaction },
  )
  await issueReceipt(fee, 'payment', fee.amountCents, transaction, now)
  await recordAudit(
    {
      actorUserId: null,
      action: 'fee-paid',
      entityType: 'application',
      entityId: fee.applicationId,
      details: {
        feeId: fee.id,
        amount_cents: fee.amountCents,
        checkoutSessionId: session.id,
        paymentIntent,
      },
    },
    transaction,
  )
  return {
    outcome: wasCancelled ? 'booked; owed back, the application was closed' : 'booked',
    feeId: fee.id,
    refundFeeId: wasCancelled ? fee.id : null,
  }
}

/**
 * The applicant came back from the payment page: ask the payment service for the session (the
 * webhook may not have arrived yet) and book it when paid. Returns the application's fees.
 */
export async function confirmCheckout(
  sequelize: Sequelize,
  user: User,
  feeId: number,
  now = new Date(),
): Promise<ApplicationFeesDto> {
  const { fee, application } = await payableFee(user, feeId)
  if (fee.checkoutSessionId && fee.state === 'due') {
    const session = await paymentClient().checkout.sessions.retrieve(fee.checkoutSessionId)
    const result = await sequelize.transaction((t) => bookPaidSession(session, t, now))
    if (result.refundFeeId) await payRefunds(sequelize, [result.refundFeeId])
  }
  return listApplicationFees(user, application.id)
}

/**
 * A webhook from the payment service: the signature over the raw body is checked with the
 * webhook secret (400 when it does not match), then the event is acted on once. The event id
 * is stored in the same transaction as its effect, so a replayed event is ignored.
 */
export async function handlePaymentWebhook(
  sequelize: Sequelize,
  rawBody: Buffer,
  signature: string | undefined,
  now = new Date(),
): Promise<{ received: true; duplicate: boolean; outcome: string }> {
  const stripe = paymentClient()
  let event: Stripe.Event
  try {
    if (!signature) throw new Error('no signature header')
    event = stripe.webhooks.constructEvent(rawBody, signature, webhookSecret())
  } catch (err) {
    logger.warn({ err: (err as Error).message }, 'payment webhook rejected')
    throw new AppError(
      ErrorCode.VALIDATION_FAILED,
      400,
      'The webhook signature is missing or does not match',
      [{ field: 'Stripe-Signature', message: 'Signature check failed' }],
    )
  }
  let refundFeeId: number | null = null
  try {
    const outcome = await sequelize.transaction(async (transaction) => {
      let result: { outcome: string; feeId: number | null; refundFeeId?: number | null }
      const object = event.data.object as { id?: string }
      if (
        event.type === 'checkout.session.completed' ||
        event.type === 'checkout.session.async_payment_succeeded'
      ) {
        result = await bookPaidSession(
          event.data.object as Stripe.Checkout.Session,
          transaction,
          now,
        )
      } else if (
        event.type === 'checkout.session.expired' ||
        event.type === 'checkout.session.async_payment_failed'
      ) {
        const s = event.data.object as Stripe.Checkout.Session
        const fee = await ApplicationFee.findOne({
          where: { checkoutSessionId: s.id },
          transaction,
          lock: transaction.LOCK.UPDATE,
        })
        if (fee && fee.state === 'due')
          await fee.update({ lastAttemptFailed: true }, { transaction })
        result = {
          outcome: fee ? 'payment attempt failed' : 'no matching fee',
          feeId: fee?.id ?? null,
        }
      } else {
        result = { outcome: 'ignored', feeId: null }
      }
      refundFeeId = result.refundFeeId ?? null
      await PaymentEvent.create(
        {
          eventId: event.id,
          type: event.type,
          objectId: object.id ?? null,
          applicationFeeId: result.feeId,
          outcome: result.outcome,
          receivedAt: now,
        },
        { transaction },
      )
      return result.outcome
    })
    if (refundFeeId) await payRefunds(sequelize, [refundFeeId])
    return { received: true, duplicate: false, outcome }
  } catch (err) {
    if (err instanceof UniqueConstraintError) {
      const prev = await PaymentEvent.findOne({ where: { eventId: event.id } })
      return { received: true, duplicate: true, outcome: prev?.outcome ?? 'already handled' }
    }
    throw err
  }
}

/** The permit office retries a refund that the payment service did not take. */
export async function retryRefund(
  sequelize: Sequelize,
  user: User,
  feeId: number,
): Promise<ApplicationFeesDto> {
  if (user.role !== 'permit_officer') throw forbidden()
  const fee = await ApplicationFee.findByPk(feeId)
  if (!fee) throw notFound('fee', feeId)
  if (fee.state !== 'refund_due') throw domainRule('No refund is owed on this fee')
  if (!fee.paymentIntentId) {
    throw domainRule('This fee was paid on invoice; pay it back by transfer and book the refund')
  }
  await payRefunds(sequelize, [fee.id])
  const after = await ApplicationFee.findByPk(feeId)
  if (after?.state === 'refund_due') {
    throw new AppError(
      ErrorCode.SERVICE_UNAVAILABLE,
      503,
      'The payment service did not take the refund; try again later',
    )
  }
  return listApplicationFees(user, fee.applicationId)
}
