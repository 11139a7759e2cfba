import type { MailText } from './mail-text.ts'
import { SIGN_OFF, linkTo } from './mail-text.ts'

/**
 * To the permit office and the owner's engineers: other works now planned at the same time make
 * a granted permit's screening result worse for one pipe.
 */
export function combinedWorsenedMail(v: {
  publicUrl: string
  applicationId: number
  reference: string
  ownerName: string
  statement: string
  verdictBefore: string
  verdictNow: string
}): MailText {
  return {
    subject: `Permit ${v.reference}: other works at the same time make a pipe result worse`,
    text:
      `Hello,\n\nThe permit for ${v.reference} has been granted. Since then the works planned ` +
      `near the same pipe of ${v.ownerName} have changed, and the screening of all works going on ` +
      `at the same time now gives ${v.verdictNow} instead of ${v.verdictBefore}.\n\n` +
      `${v.statement}\n\n` +
      `Please check whether the permit's conditions are still enough, or whether the works ` +
      `should be moved apart in time: ${linkTo(v.publicUrl, `/permit-office/applications/${v.applicationId}`)}\n\n` +
      `This is a screening calculation under stated assumptions; the pipe owner's engineer decides.` +
      SIGN_OFF,
  }
}
