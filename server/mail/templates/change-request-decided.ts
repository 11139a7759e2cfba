import type { MailText } from './mail-text.ts'
import { SIGN_OFF, linkTo } from './mail-text.ts'

/** To the applicant: the permit office declined a requested permit change. */
export function changeRequestDeclinedMail(v: {
  publicUrl: string
  applicationId: number
  reference: string
  permitNumber: string
  note: string | null
}): MailText {
  return {
    subject: `Change to permit ${v.permitNumber} declined (${v.reference})`,
    text:
      `Hello,\n\nThe permit office declined your requested change to permit ${v.permitNumber}. ` +
      `The permit stays as it is.\n\n` +
      (v.note ? `Note: ${v.note}\n\n` : '') +
      `Application: ${linkTo(v.publicUrl, `/applications/${v.applicationId}`)}` +
      SIGN_OFF,
  }
}
