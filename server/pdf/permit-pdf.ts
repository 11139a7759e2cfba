import PDFDocument from 'pdfkit'
import QRCode from 'qrcode'
import { drawMapExtract } from './map-extract.ts'
import type { MapExtractData } from './map-extract.ts'
import { endAndSign } from './sign-pdf.ts'
import type { SigningKey } from './signing-key.ts'

/** Debian fonts-lato: full-charset TTFs (pdfkit cannot read WOFF2; the WOFF subsets miss letters). */
export const LATO_REGULAR = '/usr/share/fonts/truetype/lato/Lato-Regular.ttf'
export const LATO_BOLD = '/usr/share/fonts/truetype/lato/Lato-Bold.ttf'

/** Everything printed on a permit. */
export interface PermitDocumentData {
  permitNumber: string
  issue: number
  changeKind: 'granted' | 'extended' | 'varied'
  changeReason: string | null
  validFrom: string
  validTo: string
  issuedAt: Date
  verificationCode: string
  verificationUrl: string
  application: {
    reference: string
    title: string
    siteAddress: string | null
    startsOn: string | null
    endsOn: string | null
    description: string | null
  }
  applicant: { organisation: string; contactName: string | null; contactPhone: string | null }
  issuer: { name: string; organisation: string }
  activities: { label: string; kind: string; keyInputs: string }[]
  conditions: { text: string; ownerName: string | null }[]
  owners: {
    name: string
    decision: string
    decidedBy: string | null
    decidedAt: Date | null
    reasons: string | null
    conditions: string[]
  }[]
  notAffectedOwnerCount: number
  screening: {
    ownerName: string
    segmentCount: number
    worstVerdict: string
    governingCheck: string | null
    utilisationWithWorks: number | null
  }[]
  map: MapExtractData
  caution: string
  certificateSha256: string
}

const A4_MARGIN = 50
const FONT = 'Lato'
const FONT_BOLD = 'Lato-Bold'

const dateTime = (d: Date) => d.toISOString().slice(0, 16).replace('T', ' ') + ' UTC'

/**
 * Lay out the permit and sign it. Returns the signed PDF bytes (PKCS#7 detached signature over
 * the whole file, which poppler's pdfsig and other validators check).
 */
export async function buildSignedPermitPdf(
  d: PermitDocumentData,
  key: SigningKey,
): Promise<Buffer> {
  const doc = new PDFDocument({
    size: 'A4',
    margin: A4_MARGIN,
    info: {
      Title: `Permit ${d.permitNumber} issue ${d.issue}`,
      Author: d.issuer.organisation,
      Subject: `Permit to work near buried pipes — ${d.application.reference}`,
      Creator: 'Trenchward',
      CreationDate: d.issuedAt,
      ModDate: d.issuedAt,
    },
  })
  doc.registerFont(FONT, LATO_REGULAR)
  doc.registerFont(FONT_BOLD, LATO_BOLD)
  const width = doc.page.width - 2 * A4_MARGIN
  const left = A4_MARGIN

  const heading = (text: string) => {
    if (doc.y > doc.page.height - 120) doc.addPage()
    doc
      .moveDown(0.6)
      .font(FONT_BOLD)
      .fontSize(12)
      .fillColor('#000000')
      .text(text, left, doc.y, { width })
    doc.moveDown(0.2).font(FONT).fontSize(9.5)
  }
  const line = (label: string, value: string) => {
    doc.font(FONT_BOLD).fontSize(9.5).text(`${label}: `, left, doc.y, { continued: true, width })
    doc.font(FONT).text(value)
  }

  // Head and verification box.
  const qr = await QRCode.toBuffer(d.verificationUrl, {
    type: 'png',
    margin: 1,
    width: 240,
    errorCorrectionLevel: 'M',
  })
  const boxW = 130
  doc
    .font(FONT_BOLD)
    .fontSize(17)
    .text('Permit to work near buried pipes', left, A4_MARGIN, { width: width - boxW - 10 })
  doc
    .font(FONT)
    .fontSize(11)
    .text(`Permit ${d.permitNumber} · issue ${d.issue}`, { width: width - boxW - 10 })
  doc.fontSize(9.5).fillColor('#333333')
  doc.text(`Valid from ${d.validFrom} to ${d.validTo} (both days included)`, {
    width: width - boxW - 10,
  })
  doc.text(`Issued ${dateTime(d.issuedAt)} by ${d.issuer.name}, ${d.issuer.organisation}`, {
    width: width - boxW - 10,
  })
  if (d.changeKind !== 'granted') {
    doc.text(
      `This issue ${d.changeKind === 'extended' ? 'extends' : 'varies'} the permit and replaces issue ${d.issue - 1}.` +
        (d.changeReason ? ` Reason: ${d.changeReason}` : ''),
      { width: width - boxW - 10 },
    )
  }
  doc.fillColor('#000000')
  const headBottom = doc.y
  const bx = left + width - boxW
  doc
    .rect(bx, A4_MARGIN - 4, boxW, 150)
    .lineWidth(0.8)
    .stroke('#444444')
  doc.image(qr, bx + 20, A4_MARGIN + 2, { width: 90 })
  doc
    .font(FONT)
    .fontSize(7.5)
    .text('Check this permit at', bx + 6, A4_MARGIN + 96, { width: boxW - 12, align: 'center' })
  doc.text(d.verificationUrl.replace(/\/verify\/.*$/, '/verify'), {
    width: boxW - 12,
    align: 'center',
  })
  doc
    .font(FONT_BOLD)
    .fontSize(11)
    .text(d.verificationCode, { width: boxW - 12, align: 'center' })
  doc.y = Math.max(headBottom, A4_MARGIN + 152)

  heading('Parties')
  line('Applicant', d.applicant.organisation)
  if (d.applicant.contactName) {
    line(
      'Site contact',
      `${d.applicant.contactName}${d.applicant.contactPhone ? `, ${d.applicant.contactPhone}` : ''}`,
    )
  }
  line('Permit office', `${d.issuer.organisation} (${d.issuer.name})`)
  line(
    'Network owners consulted',
    d.owners.length ? d.owners.map((o) => o.name).join('; ') : 'none affected',
  )

  heading('Site')
  line('Works', d.application.title)
  if (d.application.siteAddress) line('Address', d.application.siteAddress)
  line('Application', d.application.reference)
  if (d.application.startsOn && d.application.endsOn) {
    line('Planned dates', `${d.application.startsOn} to ${d.application.endsOn}`)
  }

  heading('Map extract')
  const mapH = Math.min(300, doc.page.height - A4_MARGIN - doc.y - 30)
  const mapTop = doc.y + 2
  drawMapExtract(doc, { x: left, y: mapTop, w: width, h: Math.max(180, mapH) }, d.map, {
    regular: FONT,
    bold: FONT_BOLD,
  })
  doc.x = left
  doc.y = mapTop + Math.max(180, mapH) + 18
  doc.font(FONT).fontSize(7.5).fillColor('#555555')
  doc.text(
    'Positions are as recorded by the network owners; locate pipes on site before digging. Grid north is up.',
    left,
    doc.y,
    { width },
  )
  doc.fillColor('#000000')

  doc.addPage()
  heading('Conditions of this permit')
  if (!d.conditions.length) doc.text('No conditions beyond the general duties of care.', { width })
  d.conditions.forEach((c, i) => {
    doc.font(FONT_BOLD).text(`${i + 1}. `, left, doc.y, { continued: true, width })
    doc.font(FONT).text(c.text + (c.ownerName ? ` (asked by ${c.ownerName})` : ''))
    doc.moveDown(0.25)
  })

  heading('Activities')
  d.activities.forEach((a, i) => {
    doc
      .font(FONT_BOLD)
      .text(`${i + 1}. ${a.label} (${a.kind}): `, left, doc.y, { continued: true, width })
    doc.font(FONT).text(a.keyInputs)
  })

  heading("Network owners' decisions")
  if (!d.owners.length)
    doc.text('No network owner has a pipe within reach of the works.', { width })
  for (const o of d.owners) {
    doc.font(FONT_BOLD).text(`${o.name}: ${o.decision}`, left, doc.y, { width })
    doc.font(FONT)
    if (o.decidedBy && o.decidedAt)
      doc.text(`Decided by ${o.decidedBy} on ${dateTime(o.decidedAt)}.`, { width })
    if (o.reasons) doc.text(`Remarks: ${o.reasons}`, { width })
    o.conditions.forEach((c, i) =>
      doc.text(`${String.fromCharCode(97 + (i % 26))}) ${c}`, { width, indent: 10 }),
    )
    doc.moveDown(0.3)
  }
  if (d.notAffectedOwnerCount > 0) {
    doc.text(
      `${d.notAffectedOwnerCount} other network owner(s): no pipe within reach of the works.`,
      { width },
    )
  }

  heading('Screening summary')
  if (!d.screening.length)
    doc.text('The screening found no pipe within reach of the works.', { width })
  for (const s of d.screening) {
    const u =
      s.utilisationWithWorks === null
        ? ''
        : `, highest utilisation with the works ${Math.round(s.utilisationWithWorks * 100)} %`
    doc.text(
      `${s.ownerName}: ${s.segmentCount} pipe segment(s) within reach; worst result ${s.worstVerdict}` +
        (s.governingCheck ? ` (governing check: ${s.governingCheck}${u})` : ''),
      left,
      doc.y,
      { width },
    )
  }

  heading('Caution')
  doc.text(d.caution, { width })

  heading('Electronic signature')
  doc.text(
    `This document carries an electronic signature of ${d.issuer.organisation} over its whole content. ` +
      `Any change to the file breaks the signature. Signing certificate SHA-256 fingerprint: ` +
      `${d.certificateSha256}. Check the permit's current state with the code ${d.verificationCode} ` +
      `at ${d.verificationUrl}.`,
    { width },
  )

  return endAndSign(doc, key, {
    reason: `Permit ${d.permitNumber} issue ${d.issue}`,
    name: d.issuer.organisation,
    location: d.application.siteAddress ?? d.application.reference,
    contactInfo: d.verificationUrl,
  })
}
