/** A mail's subject and plain-text body. */
export interface MailText {
  subject: string
  text: string
}

/** A full link into the client, from the public base URL. */
export const linkTo = (publicUrl: string, path: string) => `${publicUrl.replace(/\/+$/, '')}${path}`

/** The closing lines every Trenchward mail carries. */
export const SIGN_OFF =
  '\n\n-- \nThis message was sent by Trenchward. Please do not reply to it; use the links above.'
