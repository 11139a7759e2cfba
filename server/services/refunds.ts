import type Stripe from 'stripe'
import type { Sequelize } from 'sequelize'
import { logger } from '../logger.ts'
import { ApplicationFee } from '../models/index.ts'
import { recordAudit } from './audit.ts'
import { paymentClient } from './payment-gateway.ts'
import { issueReceipt } from './receipts.ts'

/**
 * Pay back what is owed on each fee through the payment service, after the closing transaction
 * committed. The idempotency key is per fee, so a retry never pays back twice. A failure is
 * logged and leaves the fee `refund_due` for the permit office to retry.
 */
export async function payRefunds(
  sequelize: Sequelize,
  feeIds: readonly number[],
  now = new Date(),
): Promise<void> {
  for (const id of feeIds) {
    const fee = await ApplicationFee.findByPk(id)
    if (!fee || fee.state !== 'refund_due' || !fee.paymentIntentId) continue
    let refund: Stripe.Refund
    try {
      refund = await paymentClient().refunds.create(
        {
          payment_intent: fee.paymentIntentId,
          amount: fee.refundDueCents,
          metadata: { applicationFeeId: String(fee.id) },
        },
        { idempotencyKey: `trenchward-refund-fee-${fee.id}-${fee.refundDueCents}` },
      )
    } catch (err) {
      logger.error({ feeId: id, err: (err as Error).message }, 'refund failed; left as refund_due')
      continue
    }
    await sequelize.transaction(async (transaction) => {
      const f = (await ApplicationFee.findByPk(id, { transaction, lock: transaction.LOCK.UPDATE }))!
      if (f.state !== 'refund_due') return
      await f.update(
        {
          state: 'refunded',
          refundedCents: f.refundedCents + refund.amount,
          refundDueCents: 0,
          refundId: refund.id,
          refundedAt: now,
        },
        { transaction },
      )
      await issueReceipt(f, 'refund', refund.amount, transaction, now)
      await recordAudit(
        {
          actorUserId: null,
          action: 'fee-refunded',
          entityType: 'application',
          entityId: f.applicationId,
          details: { feeId: f.id, amount_cents: refund.amount, refundId: refund.id },
        },
        transaction,
      )
    })
  }
}
