import { Op } from 'sequelize'
import type { PaymentTermsInput } from '../../shared/schemas/fees.ts'
import type { ApplicationFeeDto, ApplicationFeesDto, FeeLine } from '../../shared/types/fees.ts'
import { domainRule, forbidden, notFound } from '../errors.ts'
import { Application, ApplicationFee, FeeSchedule, Organisation, Receipt } from '../models/index.ts'
import type { User } from '../models/index.ts'
import { applicationForParty } from './application-parties.ts'
import { recordAudit } from './audit.ts'
import { onlinePaymentConfigured } from './payment-gateway.ts'
import { parseJson } from './review-dto.ts'
import { toReceiptDto } from './receipts.ts'

export function toFeeDto(
  fee: ApplicationFee,
  schedule: FeeSchedule,
  authorityName: string,
  receipts: Receipt[],
): ApplicationFeeDto {
  return {
    id: fee.id,
    applicationId: fee.applicationId,
    purpose: fee.purpose,
    state: fee.state,
    amount_cents: fee.amountCents,
    refunded_cents: fee.refundedCents,
    refundDue_cents: fee.state === 'refund_due' ? fee.refundDueCents : 0,
    currency: fee.currency,
    paymentTerms: fee.paymentTerms,
    lines: parseJson<FeeLine[]>(fee.lines),
    durationClass: fee.durationClass,
    workingDays: fee.workingDays,
    schedule: { id: schedule.id, effectiveFrom: schedule.effectiveFrom, authorityName },
    refundRule: {
      beforeReview_percent: Number(schedule.refundBeforeReviewPercent),
      afterReview_percent: Number(schedule.refundAfterReviewPercent),
    },
    lastAttemptFailed: fee.lastAttemptFailed,
    paidOnline: fee.paymentIntentId !== null,
    offlineReference: fee.offlineReference ?? null,
    paidAt: fee.paidAt ? fee.paidAt.toISOString() : null,
    refundedAt: fee.refundedAt ? fee.refundedAt.toISOString() : null,
    createdAt: fee.createdAt.toISOString(),
    receipts: receipts.filter((r) => r.applicationFeeId === fee.id).map(toReceiptDto),
  }
}

/** The fees of an application for its applicant, the permit office and admins. */
export async function listApplicationFees(
  user: User,
  applicationId: number,
): Promise<ApplicationFeesDto> {
  const application = await applicationForParty(user, applicationId)
  if (!application || user.role === 'asset_engineer') throw notFound('application', applicationId)
  const fees = await ApplicationFee.findAll({
    where: { applicationId },
    include: [
      {
        model: FeeSchedule,
        as: 'schedule',
        include: [{ model: Organisation, as: 'authority', attributes: ['name'] }],
      },
    ],
    order: [['id', 'ASC']],
  })
  const receipts = fees.length
    ? await Receipt.findAll({
        where: { applicationFeeId: { [Op.in]: fees.map((f) => f.id) } },
        order: [['id', 'ASC']],
      })
    : []
  return {
    fees: fees.map((f) => toFeeDto(f, f.schedule!, f.schedule!.authority?.name ?? '', receipts)),
    grantBlocked: fees.some(
      (f) =>
        f.purpose === 'application' && f.paymentTerms === 'pay_before_grant' && f.state === 'due',
    ),
    onlinePayment: onlinePaymentConfigured(),
  }
}

/** The permit office chooses how this application's fee is paid: before grant, or on invoice. */
export async function setPaymentTerms(
  user: User,
  applicationId: number,
  input: PaymentTermsInput,
): Promise<ApplicationFeesDto> {
  if (user.role !== 'permit_officer') throw forbidden()
  const fee = await ApplicationFee.findOne({ where: { applicationId, purpose: 'application' } })
  if (!fee) throw notFound('application fee of application', applicationId)
  const a = await Application.findByPk(applicationId)
  if (!a || !['submitted', 'with_owners', 'ready_for_decision'].includes(a.status)) {
    throw domainRule('The payment terms can be changed only until the application is decided')
  }
  if (fee.paymentTerms !== input.paymentTerms) {
    const before = fee.paymentTerms
    await fee.update({ paymentTerms: input.paymentTerms })
    await recordAudit({
      actorUserId: user.id,
      action: 'fee-terms-changed',
      entityType: 'application',
      entityId: applicationId,
      details: { feeId: fee.id, from: before, to: input.paymentTerms },
    })
  }
  return listApplicationFees(user, applicationId)
}

/** The stored PDF of a receipt, for the parties of its application. */
export async function receiptDocument(
  user: User,
  id: number,
): Promise<{ path: string; filename: string }> {
  const r = await Receipt.findByPk(id)
  const fee = r ? await ApplicationFee.findByPk(r.applicationFeeId) : null
  const application = fee ? await applicationForParty(user, fee.applicationId) : null
  if (!r || !application || !r.pdfPath || user.role === 'asset_engineer')
    throw notFound('receipt', id)
  return { path: r.pdfPath, filename: `${r.number}.pdf` }
}
