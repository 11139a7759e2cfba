import type { MailText } from './mail-text.ts'
import { SIGN_OFF, linkTo } from './mail-text.ts'

/** To the applicant: the permit office refused the application. */
export function applicationRefusedMail(v: {
  publicUrl: string
  applicationId: number
  reference: string
  reasons: string
}): MailText {
  return {
    subject: `Application ${v.reference} refused`,
    text:
      `Hello,\n\nThe permit office has refused your application ${v.reference}.\n\n` +
      `Reasons:\n${v.reasons}\n\n` +
      `You can see the owners' decisions and submit a changed application: ` +
      `${linkTo(v.publicUrl, `/applications/${v.applicationId}`)}` +
      SIGN_OFF,
  }
}
