import type { MailText } from './mail-text.ts'
import { SIGN_OFF, linkTo } from './mail-text.ts'

/** To the applicant: a permit was granted, extended or varied; the signed PDF is attached. */
export function permitIssuedMail(v: {
  publicUrl: string
  applicationId: number
  reference: string
  permitNumber: string
  issue: number
  changeKind: 'granted' | 'extended' | 'varied'
  validFrom: string
  validTo: string
  conditionCount: number
  verificationCode: string
  reason: string | null
}): MailText {
  const what =
    v.changeKind === 'granted'
      ? 'has been granted'
      : v.changeKind === 'extended'
        ? 'has been extended'
        : 'has been changed (its conditions were varied)'
  return {
    subject: `Permit ${v.permitNumber} ${what.split(' (')[0]} (${v.reference})`,
    text:
      `Hello,\n\nYour permit ${v.permitNumber} for application ${v.reference} ${what}.\n` +
      `This is issue ${v.issue} of the permit; it replaces any earlier issue.\n\n` +
      `Valid from ${v.validFrom} to ${v.validTo}, with ${v.conditionCount} condition(s).\n` +
      (v.reason ? `Reason for the change: ${v.reason}\n` : '') +
      `\nThe signed permit is attached as a PDF. Keep it on site with its conditions.\n` +
      `Anyone can check it at ${linkTo(v.publicUrl, `/verify/${v.verificationCode}`)} ` +
      `(code ${v.verificationCode}).\n\n` +
      `Application: ${linkTo(v.publicUrl, `/applications/${v.applicationId}`)}` +
      SIGN_OFF,
  }
}
