import PDFDocument from 'pdfkit'
import { formatAmount } from '../../shared/fees/index.ts'
import type { FeeLine } from '../../shared/types/fees.ts'
import { LATO_BOLD, LATO_REGULAR } from './permit-pdf.ts'

/** Everything printed on a receipt (payment) or a refund note (refund). */
export interface ReceiptDocumentData {
  number: string
  kind: 'payment' | 'refund'
  issuedAt: Date
  currency: string
  amount_cents: number
  purpose: string
  lines: FeeLine[]
  fee_cents: number
  /** For a refund: the refund rule applied, in words. */
  refundRule: string | null
  application: { reference: string; title: string; siteAddress: string | null }
  payer: { organisation: string; contact: string | null }
  authority: { name: string }
  schedule: { effectiveFrom: string }
  paymentReference: string | null
  /** Paid through the payment service (else on invoice, booked by the permit office). */
  paidOnline: boolean
  paidAt: Date | null
}

const MARGIN = 50
const dateTime = (d: Date) => d.toISOString().slice(0, 16).replace('T', ' ') + ' UTC'

/** Lay out a one-page receipt in Lato. Returns the PDF bytes. */
export async function buildReceiptPdf(d: ReceiptDocumentData): Promise<Buffer> {
  const title = d.kind === 'payment' ? 'Receipt' : 'Refund note'
  const doc = new PDFDocument({
    size: 'A4',
    margin: MARGIN,
    info: {
      Title: `${title} ${d.number}`,
      Author: d.authority.name,
      Subject: `${title} for ${d.application.reference}`,
      Creator: 'Trenchward',
      CreationDate: d.issuedAt,
      ModDate: d.issuedAt,
    },
  })
  const chunks: Buffer[] = []
  doc.on('data', (c: Buffer) => chunks.push(c))
  const done = new Promise<Buffer>((resolve) => doc.on('end', () => resolve(Buffer.concat(chunks))))
  doc.registerFont('Lato', LATO_REGULAR)
  doc.registerFont('Lato-Bold', LATO_BOLD)
  const left = MARGIN
  const width = doc.page.width - 2 * MARGIN
  const money = (c: number) => formatAmount(c, d.currency)

  doc.font('Lato-Bold').fontSize(18).text(title, left, MARGIN)
  doc.font('Lato').fontSize(11).text(`No. ${d.number}`)
  doc
    .fontSize(9.5)
    .fillColor('#333333')
    .text(`Issued ${dateTime(d.issuedAt)}`)
  doc.fillColor('#000000')
  doc
    .font('Lato-Bold')
    .fontSize(10)
    .text(d.authority.name, left + width - 220, MARGIN, { width: 220, align: 'right' })
  doc
    .font('Lato')
    .fontSize(9)
    .text('Street authority, permit office', { width: 220, align: 'right' })

  doc.y = MARGIN + 80
  const row = (label: string, value: string) => {
    doc.font('Lato-Bold').fontSize(9.5).text(`${label}: `, left, doc.y, { continued: true, width })
    doc.font('Lato').text(value)
  }
  row(
    d.kind === 'payment' ? 'Received from' : 'Paid back to',
    d.payer.organisation + (d.payer.contact ? ` (${d.payer.contact})` : ''),
  )
  row('For', `${d.purpose}, application ${d.application.reference}: ${d.application.title}`)
  if (d.application.siteAddress) row('Site', d.application.siteAddress)
  row('Fee schedule', `in force from ${d.schedule.effectiveFrom}`)
  if (d.paidAt) row('Paid', dateTime(d.paidAt))
  if (d.paymentReference) row('Payment reference', d.paymentReference)

  // Lines of the fee.
  doc.moveDown(1)
  const cols = [left, left + 300, left + 350, left + 430]
  const tableTop = doc.y
  doc.font('Lato-Bold').fontSize(9.5)
  doc.text('Item', cols[0]!, tableTop, { width: 290 })
  doc.text('Qty', cols[1]!, tableTop, { width: 40, align: 'right' })
  doc.text('Unit', cols[2]!, tableTop, { width: 70, align: 'right' })
  doc.text('Amount', cols[3]!, tableTop, { width: width - 430, align: 'right' })
  doc
    .moveTo(left, doc.y + 2)
    .lineTo(left + width, doc.y + 2)
    .lineWidth(0.6)
    .stroke('#444444')
  doc.font('Lato').fontSize(9.5)
  let y = doc.y + 6
  for (const l of d.lines) {
    doc.text(l.description, cols[0]!, y, { width: 290 })
    const h = doc.y
    doc.text(String(l.count), cols[1]!, y, { width: 40, align: 'right' })
    doc.text(money(l.unit_cents), cols[2]!, y, { width: 70, align: 'right' })
    doc.text(money(l.amount_cents), cols[3]!, y, { width: width - 430, align: 'right' })
    y = Math.max(h, doc.y) + 4
  }
  doc
    .moveTo(left, y)
    .lineTo(left + width, y)
    .lineWidth(0.6)
    .stroke('#444444')
  doc.font('Lato-Bold').text('Fee', cols[0]!, y + 5, { width: 290 })
  doc.text(money(d.fee_cents), cols[3]!, y + 5, { width: width - 430, align: 'right' })
  doc.moveDown(1.2)

  doc.x = left
  doc
    .font('Lato-Bold')
    .fontSize(13)
    .text(
      d.kind === 'payment'
        ? `Amount received: ${money(d.amount_cents)}`
        : `Amount paid back: ${money(d.amount_cents)}`,
      left,
      doc.y,
      {
        width,
      },
    )
  if (d.refundRule) {
    doc.moveDown(0.4).font('Lato').fontSize(9.5).text(d.refundRule, { width })
  }
  doc.moveDown(1.5).font('Lato').fontSize(8).fillColor('#555555')
  doc.text(
    (d.kind === 'payment'
      ? d.paidOnline
        ? 'Paid online through the payment service; Trenchward never sees or stores card details. '
        : 'Paid on invoice and booked by the permit office. '
      : d.paidOnline
        ? 'Paid back to the card or account the fee was paid from, through the payment service. '
        : 'Paid back by the permit office by bank transfer. ') +
      `Receipt numbers run in one unbroken sequence per calendar year. Keep this ${title.toLowerCase()} with the permit file.`,
    { width },
  )
  doc.end()
  return done
}
