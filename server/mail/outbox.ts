import type { Transaction } from 'sequelize'
import { OutboxMail } from '../models/outbox-mail.ts'
import type { OutboxAttachment } from '../models/outbox-mail.ts'

export interface MailToSend {
  to: string[]
  subject: string
  text: string
  html?: string
  attachments?: OutboxAttachment[]
  related?: { type: string; id: string | number }
}

/**
 * Put a mail in the outbox, inside the caller's transaction: it exists exactly when the change
 * it reports was committed. The outbox worker sends it.
 */
export async function enqueueMail(mail: MailToSend, transaction?: Transaction): Promise<number> {
  if (!mail.to.length) throw new RangeError('to: at least one recipient is needed')
  const row = await OutboxMail.create(
    {
      toAddress: mail.to.join(', '),
      subject: mail.subject,
      textBody: mail.text,
      htmlBody: mail.html ?? null,
      attachments: mail.attachments ?? null,
      nextAttemptAt: new Date(),
      lockedBy: null,
      lockedUntil: null,
      lastError: null,
      relatedType: mail.related?.type ?? null,
      relatedId: mail.related ? String(mail.related.id) : null,
      sentAt: null,
    },
    { transaction },
  )
  return Number(row.id)
}
