import type { MailText } from './mail-text.ts'
import { SIGN_OFF, linkTo } from './mail-text.ts'

/** To an owner's engineers: a new application reaches their pipes and needs their review. */
export function reviewOpenedMail(v: {
  publicUrl: string
  reviewId: number
  ownerName: string
  reference: string
  title: string
  siteAddress: string | null
  applicantName: string
  affectedSegmentCount: number
  worstVerdict: string | null
  dueOn: string
}): MailText {
  return {
    subject: `Please review ${v.reference}: works near ${v.affectedSegmentCount} of your pipes`,
    text:
      `Hello ${v.ownerName} team,\n\n` +
      `${v.applicantName} has applied for "${v.title}"${v.siteAddress ? ` at ${v.siteAddress}` : ''}.\n` +
      `The screening found ${v.affectedSegmentCount} of your pipe segment(s) within reach of the works` +
      `${v.worstVerdict ? `; the worst result is "${v.worstVerdict}"` : ''}.\n\n` +
      `Please accept, accept with conditions, ask a question or object by ${v.dueOn}.\n\n` +
      `Open the review: ${linkTo(v.publicUrl, `/reviews/${v.reviewId}`)}` +
      SIGN_OFF,
  }
}
