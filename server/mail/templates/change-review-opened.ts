import type { MailText } from './mail-text.ts'
import { SIGN_OFF, linkTo } from './mail-text.ts'

/** To an owner whose pipes a requested permit change touches: please review it. */
export function changeReviewOpenedMail(v: {
  publicUrl: string
  changeRequestId: number
  ownerName: string
  reference: string
  permitNumber: string
  why: string
  reason: string
  dueOn: string
}): MailText {
  return {
    subject: `Change to permit ${v.permitNumber} touches your pipes (${v.reference})`,
    text:
      `Hello ${v.ownerName},\n\nThe applicant asks to change permit ${v.permitNumber}. ` +
      `We screened the changed works again: ${v.why}\n\nWhy they ask: ${v.reason}\n\n` +
      `Please answer by ${v.dueOn}: ${linkTo(v.publicUrl, `/change-requests/${v.changeRequestId}`)}` +
      SIGN_OFF,
  }
}
