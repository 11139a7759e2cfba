import type { MailText } from './mail-text.ts'
import { SIGN_OFF } from './mail-text.ts'

/** To an owner with pipes near emergency works: they have started without a permit. */
export function emergencyAlertMail(v: {
  ownerName: string
  reference: string
  applicantName: string
  siteAddress: string
  activity: string
  depth_m: number | null
  reason: string
  contactName: string
  contactPhone: string
  startedAt: string
  segments: number
  nearest_m: number
  followUpDue: string
}): MailText {
  return {
    subject: `URGENT: emergency works near your pipes at ${v.siteAddress} (${v.reference})`,
    text:
      `Hello ${v.ownerName},\n\n${v.applicantName} started emergency works at ${v.siteAddress} ` +
      `at ${v.startedAt}, before any permit: ${v.activity}` +
      (v.depth_m ? `, about ${v.depth_m} m deep` : '') +
      `.\n\nWhat happened: ${v.reason}\n\n` +
      `${v.segments} of your pipe segments lie within reach; the nearest is about ` +
      `${v.nearest_m.toFixed(1)} m away.\n\n` +
      `Call the site now if you need to attend or stop the works: ${v.contactName}, ${v.contactPhone}.\n\n` +
      `The full application must follow by ${v.followUpDue}; you will then review it as usual.` +
      SIGN_OFF,
  }
}
