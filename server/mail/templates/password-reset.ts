import type { MailText } from './mail-text.ts'
import { SIGN_OFF, linkTo } from './mail-text.ts'

/** To a user who asked for a new password: the one-time link. */
export function passwordResetMail(v: {
  publicUrl: string
  name: string
  token: string
  validMinutes: number
}): MailText {
  return {
    subject: 'Choose a new Trenchward password',
    text:
      `Hello ${v.name},\n\n` +
      `Somebody (we hope you) asked to choose a new password for this Trenchward account.\n` +
      `Open this link within ${v.validMinutes} minutes to do so; it works once:\n\n` +
      `${linkTo(v.publicUrl, `/reset-password#token=${v.token}`)}\n\n` +
      `Choosing a new password signs the account out everywhere else.\n` +
      `If you did not ask for this, ignore this message: your password stays as it is.` +
      SIGN_OFF,
  }
}
