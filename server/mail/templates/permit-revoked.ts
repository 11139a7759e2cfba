import type { MailText } from './mail-text.ts'
import { SIGN_OFF, linkTo } from './mail-text.ts'

/** To the applicant: the permit was revoked; works must stop. */
export function permitRevokedMail(v: {
  publicUrl: string
  applicationId: number
  reference: string
  permitNumber: string
  reason: string
}): MailText {
  return {
    subject: `Permit ${v.permitNumber} revoked (${v.reference})`,
    text:
      `Hello,\n\nThe permit office has revoked permit ${v.permitNumber} for application ` +
      `${v.reference}. It no longer allows any works; please stop work covered by it and make ` +
      `the site safe.\n\nReason: ${v.reason}\n\n` +
      `Application: ${linkTo(v.publicUrl, `/applications/${v.applicationId}`)}` +
      SIGN_OFF,
  }
}
