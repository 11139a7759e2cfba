import type { MailText } from './mail-text.ts'
import { SIGN_OFF, linkTo } from './mail-text.ts'

/** To an owner's engineers: the applicant answered their question; the clock runs again. */
export function answerReceivedMail(v: {
  publicUrl: string
  reviewId: number
  ownerName: string
  reference: string
  answer: string
  dueOn: string
}): MailText {
  return {
    subject: `The applicant answered your question on ${v.reference}`,
    text:
      `Hello ${v.ownerName} team,\n\nThe applicant of ${v.reference} answered:\n\n${v.answer}\n\n` +
      `Your review is running again and is now due on ${v.dueOn}.\n\n` +
      `Open the review: ${linkTo(v.publicUrl, `/reviews/${v.reviewId}`)}` +
      SIGN_OFF,
  }
}
