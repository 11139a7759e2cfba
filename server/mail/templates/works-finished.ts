import type { MailText } from './mail-text.ts'
import { SIGN_OFF } from './mail-text.ts'

/** To an owner with site conditions: the works are finished; photos are on record. */
export function worksFinishedMail(v: {
  ownerName: string
  reference: string
  permitNumber: string
  siteAddress: string | null
  finishedAt: string
  photoCounts: { label: string; count: number }[]
  note: string | null
}): MailText {
  const photos = v.photoCounts.filter((p) => p.count > 0)
  return {
    subject: `Works finished: ${v.permitNumber} (${v.reference})`,
    text:
      `Hello ${v.ownerName},\n\nThe applicant recorded the works under permit ${v.permitNumber}` +
      (v.siteAddress ? ` at ${v.siteAddress}` : '') +
      ` as finished at ${v.finishedAt}.\n\n` +
      (photos.length
        ? `Photos on record: ${photos.map((p) => `${p.label} ${p.count}`).join(', ')}.\n\n`
        : 'No photos were uploaded.\n\n') +
      (v.note ? `Note from site: ${v.note}\n\n` : '') +
      SIGN_OFF.trimStart(),
  }
}
