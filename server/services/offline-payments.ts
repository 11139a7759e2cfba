import type { Sequelize } from 'sequelize'
import type { OfflineMovementInput } from '../../shared/schemas/fees.ts'
import type { ApplicationFeesDto } from '../../shared/types/fees.ts'
import { domainRule, forbidden, notFound } from '../errors.ts'
import { ApplicationFee } from '../models/index.ts'
import type { User } from '../models/index.ts'
import { listApplicationFees } from './application-fees.ts'
import { recordAudit } from './audit.ts'
import { issueReceipt } from './receipts.ts'

/**
 * The permit office books a fee paid on invoice (outside the payment service) with the
 * transfer's reference: the fee becomes paid and a numbered receipt is mailed.
 */
export async function recordOfflinePayment(
  sequelize: Sequelize,
  user: User,
  feeId: number,
  input: OfflineMovementInput,
  now = new Date(),
): Promise<ApplicationFeesDto> {
  if (user.role !== 'permit_officer') throw forbidden()
  const applicationId = await sequelize.transaction(async (transaction) => {
    const fee = await ApplicationFee.findByPk(feeId, { transaction, lock: transaction.LOCK.UPDATE })
    if (!fee) throw notFound('fee', feeId)
    if (fee.state !== 'due')
      throw domainRule(`This fee is ${fee.state.replace('_', ' ')}; there is nothing to book`)
    await fee.update(
      { state: 'paid', paidAt: now, offlineReference: input.reference },
      { transaction },
    )
    await issueReceipt(fee, 'payment', fee.amountCents, transaction, now)
    await recordAudit(
      {
        actorUserId: user.id,
        action: 'fee-paid-offline',
        entityType: 'application',
        entityId: fee.applicationId,
        details: { feeId: fee.id, amount_cents: fee.amountCents, reference: input.reference },
      },
      transaction,
    )
    return fee.applicationId
  })
  return listApplicationFees(user, applicationId)
}

/**
 * The permit office books the refund of a fee that was paid on invoice, once it has paid the
 * owed share back by transfer: the fee becomes refunded and a refund note is mailed.
 */
export async function recordOfflineRefund(
  sequelize: Sequelize,
  user: User,
  feeId: number,
  input: OfflineMovementInput,
  now = new Date(),
): Promise<ApplicationFeesDto> {
  if (user.role !== 'permit_officer') throw forbidden()
  const applicationId = await sequelize.transaction(async (transaction) => {
    const fee = await ApplicationFee.findByPk(feeId, { transaction, lock: transaction.LOCK.UPDATE })
    if (!fee) throw notFound('fee', feeId)
    if (fee.state !== 'refund_due') throw domainRule('No refund is owed on this fee')
    if (fee.paymentIntentId)
      throw domainRule('This fee was paid online; its refund goes back through the payment service')
    const amount = fee.refundDueCents
    await fee.update(
      {
        state: 'refunded',
        refundedCents: fee.refundedCents + amount,
        refundDueCents: 0,
        refundedAt: now,
        offlineReference: input.reference,
      },
      { transaction },
    )
    await issueReceipt(fee, 'refund', amount, transaction, now)
    await recordAudit(
      {
        actorUserId: user.id,
        action: 'fee-refunded-offline',
        entityType: 'application',
        entityId: fee.applicationId,
        details: { feeId: fee.id, amount_cents: amount, reference: input.reference },
      },
      transaction,
    )
    return fee.applicationId
  })
  return listApplicationFees(user, applicationId)
}
