import { createHash } from 'node:crypto'
import { mkdir, writeFile } from 'node:fs/promises'
import { join, resolve } from 'node:path'
import { QueryTypes } from 'sequelize'
import type { Transaction } from 'sequelize'
import { formatAmount } from '../../shared/fees/index.ts'
import type { FeeLine, ReceiptDto } from '../../shared/types/fees.ts'
import { FEE_PURPOSE_LABELS } from '../../shared/types/fees.ts'
import { config } from '../config.ts'
import { enqueueMail } from '../mail/outbox.ts'
import { receiptMail } from '../mail/templates/receipt-issued.ts'
import { Application, FeeSchedule, Organisation, Receipt } from '../models/index.ts'
import type { ApplicationFee } from '../models/index.ts'
import { buildReceiptPdf } from '../pdf/receipt-pdf.ts'
import { userEmail } from './mail-recipients.ts'
import { parseJson } from './review-dto.ts'

/** Our receipt number: TWR-<year>-<sequence within the year, six digits>. */
export const receiptNumber = (year: number, sequence: number) =>
  `TWR-${year}-${String(sequence).padStart(6, '0')}`

/**
 * The next receipt sequence of `year`, inside the caller's transaction. The counter row stays
 * locked until the transaction ends, so concurrent bookings queue up and a rollback gives the
 * number back: the numbers of committed receipts have no gaps.
 */
export async function nextReceiptSequence(year: number, transaction: Transaction): Promise<number> {
  const sequelize = Receipt.sequelize!
  await sequelize.query(
    'INSERT INTO receipt_counters (year, last_sequence) VALUES (?, 1) ON DUPLICATE KEY UPDATE last_sequence = last_sequence + 1',
    { replacements: [year], transaction },
  )
  const rows = await sequelize.query<{ n: number }>(
    'SELECT last_sequence AS n FROM receipt_counters WHERE year = ? FOR UPDATE',
    {
      replacements: [year],
      type: QueryTypes.SELECT,
      transaction,
    },
  )
  return Number(rows[0]!.n)
}

export const toReceiptDto = (r: Receipt): ReceiptDto => ({
  id: r.id,
  number: r.number,
  kind: r.kind,
  amount_cents: r.amountCents,
  currency: r.currency,
  issuedAt: r.issuedAt.toISOString(),
  documentUrl: `/api/receipts/${r.id}/document`,
})

/**
 * Write a receipt (payment) or refund note (refund) for a fee inside the caller's transaction:
 * take the next number, lay out the PDF, store it under RECEIPT_DIR with its SHA-256, and put
 * the mail with the PDF attached to the applicant in the outbox.
 */
export async function issueReceipt(
  fee: ApplicationFee,
  kind: 'payment' | 'refund',
  amount_cents: number,
  transaction: Transaction,
  now = new Date(),
): Promise<Receipt> {
  const cfg = config()
  const year = now.getUTCFullYear()
  const sequence = await nextReceiptSequence(year, transaction)
  const number = receiptNumber(year, sequence)
  const application = (await Application.findByPk(fee.applicationId, { transaction }))!
  const schedule = (await FeeSchedule.findByPk(fee.feeScheduleId, { transaction }))!
  const authority = await Organisation.findByPk(schedule.authorityOrganisationId, { transaction })
  const payer = await Organisation.findByPk(application.applicantOrganisationId, { transaction })
  const receipt = await Receipt.create(
    {
      number,
      year,
      sequence,
      applicationFeeId: fee.id,
      kind,
      amountCents: amount_cents,
      currency: fee.currency,
      pdfPath: null,
      pdfSha256: null,
      issuedAt: now,
    },
    { transaction },
  )
  const before = Number(schedule.refundBeforeReviewPercent)
  const after = Number(schedule.refundAfterReviewPercent)
  const pdf = await buildReceiptPdf({
    number,
    kind,
    issuedAt: now,
    currency: fee.currency,
    amount_cents,
    purpose: FEE_PURPOSE_LABELS[fee.purpose],
    lines: parseJson<FeeLine[]>(fee.lines),
    fee_cents: fee.amountCents,
    refundRule:
      kind === 'refund'
        ? `Refund rule of the fee schedule: ${before} % of the fee while no network owner has answered, ${after} % once one has. ` +
          `Paid back here: ${Math.round((amount_cents * 1000) / Math.max(1, fee.amountCents)) / 10} % of the fee.`
        : null,
    application: {
      reference: application.reference ?? `#${application.id}`,
      title: application.title,
      siteAddress: application.siteAddress,
    },
    payer: { organisation: payer?.name ?? '', contact: application.contactName },
    authority: { name: authority?.name ?? 'Street authority' },
    schedule: { effectiveFrom: schedule.effectiveFrom },
    paymentReference: fee.paymentIntentId ?? fee.offlineReference ?? null,
    paidOnline: fee.paymentIntentId !== null,
    paidAt: fee.paidAt,
  })
  const dir = resolve(cfg.receiptDir)
  await mkdir(dir, { recursive: true })
  const path = join(dir, `${number}.pdf`)
  await writeFile(path, pdf, { mode: 0o640 })
  await receipt.update(
    { pdfPath: path, pdfSha256: createHash('sha256').update(pdf).digest('hex') },
    { transaction },
  )
  const mail = receiptMail({
    publicUrl: cfg.publicUrl,
    applicationId: application.id,
    reference: application.reference ?? `#${application.id}`,
    receiptNumber: number,
    kind,
    amount: formatAmount(amount_cents, fee.currency),
    purpose: FEE_PURPOSE_LABELS[fee.purpose],
  })
  for (const to of await userEmail(application.createdByUserId, transaction)) {
    await enqueueMail(
      {
        to: [to],
        ...mail,
        attachments: [{ filename: `${number}.pdf`, path, contentType: 'application/pdf' }],
        related: { type: 'receipt', id: receipt.id },
      },
      transaction,
    )
  }
  return receipt
}
