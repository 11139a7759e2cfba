import type { MailText } from './mail-text.ts'
import { SIGN_OFF } from './mail-text.ts'

/** To an owner who attends: the works have started on site. */
export function worksStartedMail(v: {
  ownerName: string
  reference: string
  permitNumber: string
  siteAddress: string | null
  startedAt: string
  contactName: string | null
  contactPhone: string | null
  note: string | null
  /** True when no planned start reached the owner with its notice before the start. */
  shortNotice: boolean
  notice_h: number
}): MailText {
  return {
    subject: `Works started: ${v.permitNumber} (${v.reference})`,
    text:
      `Hello ${v.ownerName},\n\nThe works under permit ${v.permitNumber}` +
      (v.siteAddress ? ` at ${v.siteAddress}` : '') +
      ` started at ${v.startedAt}. Your conditions ask you to attend.\n\n` +
      (v.shortNotice
        ? `The planned start did not reach you ${v.notice_h} hours ahead as your conditions ask. ` +
          `Please contact the site straight away.\n\n`
        : '') +
      (v.note ? `Note from site: ${v.note}\n\n` : '') +
      `Contact on site: ${v.contactName ?? 'not given'}${v.contactPhone ? `, ${v.contactPhone}` : ''}.` +
      SIGN_OFF,
  }
}
