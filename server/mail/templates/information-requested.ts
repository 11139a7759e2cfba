import type { MailText } from './mail-text.ts'
import { SIGN_OFF, linkTo } from './mail-text.ts'

/** To the applicant: an owner's engineer asks a question before deciding. */
export function informationRequestedMail(v: {
  publicUrl: string
  applicationId: number
  reference: string
  ownerName: string
  question: string
}): MailText {
  return {
    subject: `${v.ownerName} has a question about ${v.reference}`,
    text:
      `Hello,\n\n${v.ownerName} needs more information before deciding on your application ` +
      `${v.reference}. Their question:\n\n${v.question}\n\n` +
      `Their review is on hold until you answer; it continues with the time it had left.\n\n` +
      `Answer here: ${linkTo(v.publicUrl, `/applications/${v.applicationId}`)}` +
      SIGN_OFF,
  }
}
