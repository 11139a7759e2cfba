import type { MailText } from './mail-text.ts'
import { SIGN_OFF, linkTo } from './mail-text.ts'

/** To an owner's engineers: a review is due soon, or due today. */
export function reviewReminderMail(v: {
  publicUrl: string
  reviewId: number
  ownerName: string
  reference: string
  title: string
  dueOn: string
  kind: 'due_soon' | 'due_today'
  dueInWorkingDays: number
}): MailText {
  const when =
    v.kind === 'due_today'
      ? v.dueInWorkingDays < 0
        ? `was due on ${v.dueOn} and is now overdue`
        : `is due today (${v.dueOn})`
      : `is due on ${v.dueOn}, in ${v.dueInWorkingDays} working day(s)`
  return {
    subject:
      v.kind === 'due_today'
        ? `Reminder: your review of ${v.reference} is due`
        : `Reminder: your review of ${v.reference} is due on ${v.dueOn}`,
    text:
      `Hello ${v.ownerName} team,\n\n` +
      `Your review of "${v.title}" (${v.reference}) ${when}.\n` +
      `The permit office cannot decide the application until every affected owner has answered.\n\n` +
      `Open the review: ${linkTo(v.publicUrl, `/reviews/${v.reviewId}`)}` +
      SIGN_OFF,
  }
}
