import type { MailText } from './mail-text.ts'
import { SIGN_OFF, linkTo } from './mail-text.ts'

/** To the applicant: a payment was received or a refund paid back; the PDF is attached. */
export function receiptMail(v: {
  publicUrl: string
  applicationId: number
  reference: string
  receiptNumber: string
  kind: 'payment' | 'refund'
  amount: string
  purpose: string
}): MailText {
  return v.kind === 'payment'
    ? {
        subject: `Receipt ${v.receiptNumber}: ${v.amount} received (${v.reference})`,
        text:
          `Hello,\n\nThank you: we have received ${v.amount} for "${v.purpose}" on application ` +
          `${v.reference}. Your receipt ${v.receiptNumber} is attached as a PDF; you can also ` +
          `download it from the application.\n\n` +
          `Application: ${linkTo(v.publicUrl, `/applications/${v.applicationId}`)}` +
          SIGN_OFF,
      }
    : {
        subject: `Refund ${v.receiptNumber}: ${v.amount} paid back (${v.reference})`,
        text:
          `Hello,\n\nWe have paid back ${v.amount} of the fee for "${v.purpose}" on application ` +
          `${v.reference}, to the card or account you paid from. The refund note ` +
          `${v.receiptNumber} is attached as a PDF.\n\n` +
          `Application: ${linkTo(v.publicUrl, `/applications/${v.applicationId}`)}` +
          SIGN_OFF,
      }
}
