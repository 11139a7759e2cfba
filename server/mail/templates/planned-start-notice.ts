import type { MailText } from './mail-text.ts'
import { SIGN_OFF } from './mail-text.ts'

/** To an owner who attends: the works are planned to start at a given time. */
export function plannedStartNoticeMail(v: {
  ownerName: string
  reference: string
  permitNumber: string
  siteAddress: string | null
  plannedStart: string
  notice_h: number
  contactName: string | null
  contactPhone: string | null
  note: string | null
}): MailText {
  return {
    subject: `Works start planned ${v.plannedStart}: ${v.permitNumber} (${v.reference})`,
    text:
      `Hello ${v.ownerName},\n\nYour conditions on permit ${v.permitNumber} ask you to attend ` +
      `the works and to be told ${v.notice_h} hours ahead. The applicant plans to start on site ` +
      `at ${v.plannedStart}` +
      (v.siteAddress ? ` at ${v.siteAddress}` : '') +
      `.\n\n` +
      (v.note ? `Note from site: ${v.note}\n\n` : '') +
      `Contact on site: ${v.contactName ?? 'not given'}${v.contactPhone ? `, ${v.contactPhone}` : ''}.` +
      SIGN_OFF,
  }
}
