import { randomUUID } from 'node:crypto'
import { QueryTypes } from 'sequelize'
import type { Sequelize } from 'sequelize'
import nodemailer from 'nodemailer'
import type { Transporter } from 'nodemailer'
import type { AppConfig } from '../config.ts'
import { logger } from '../logger.ts'
import { OutboxMail } from '../models/outbox-mail.ts'

/** Attempts before a mail is given up as failed (it stays in the table for an admin). */
export const MAX_ATTEMPTS = 12
/** A claimed mail not finished in this time is free for another worker again. */
export const LEASE_MS = 60_000

/** Wait before attempt n+1 after n failures: 30 s, 1, 2, 4 … minutes, at most one hour. */
export const retryDelay_ms = (attempts: number) =>
  Math.min(30_000 * 2 ** Math.max(0, attempts - 1), 3_600_000)

export function createMailTransport(cfg: AppConfig): Transporter {
  return nodemailer.createTransport({
    host: cfg.SMTP_HOST,
    port: cfg.SMTP_PORT,
    secure: false,
    ignoreTLS: cfg.NODE_ENV !== 'production',
    connectionTimeout: 5_000,
    greetingTimeout: 5_000,
    socketTimeout: 10_000,
  })
}

/**
 * Send what is due, once. Safe with several app processes: each claims rows with a lease in one
 * UPDATE, so no mail is sent twice while a lease holds. Returns how many were sent and failed.
 */
export async function runOutboxOnce(
  sequelize: Sequelize,
  transport: Transporter,
  from: string,
  batch = 20,
): Promise<{ sent: number; failed: number }> {
  const worker = randomUUID()
  const now = new Date()
  await sequelize.query(
    `UPDATE outbox_mails SET locked_by = ?, locked_until = ?
      WHERE status = 'pending' AND next_attempt_at <= ? AND (locked_until IS NULL OR locked_until < ?)
      ORDER BY id LIMIT ?`,
    {
      replacements: [worker, new Date(now.getTime() + LEASE_MS), now, now, batch],
      type: QueryTypes.UPDATE,
    },
  )
  const mails = await OutboxMail.findAll({
    where: { lockedBy: worker, status: 'pending' },
    order: [['id', 'ASC']],
  })
  let sent = 0
  let failed = 0
  for (const m of mails) {
    try {
      await transport.sendMail({
        from,
        to: m.toAddress,
        subject: m.subject,
        text: m.textBody,
        html: m.htmlBody ?? undefined,
        attachments: (m.attachments ?? []).map((a) => ({
          filename: a.filename,
          path: a.path,
          contentType: a.contentType,
        })),
      })
      await m.update({
        status: 'sent',
        sentAt: new Date(),
        attempts: m.attempts + 1,
        lockedBy: null,
        lockedUntil: null,
        lastError: null,
      })
      sent++
    } catch (err) {
      const attempts = m.attempts + 1
      await m.update({
        attempts,
        status: attempts >= MAX_ATTEMPTS ? 'failed' : 'pending',
        nextAttemptAt: new Date(Date.now() + retryDelay_ms(attempts)),
        lockedBy: null,
        lockedUntil: null,
        lastError: String((err as Error).message ?? err).slice(0, 1000),
      })
      failed++
      logger.warn(
        { mailId: m.id, attempts, err: (err as Error).message },
        'mail not sent; will retry',
      )
    }
  }
  return { sent, failed }
}

/** Poll the outbox every `interval_ms` until stopped. */
export function startOutboxWorker(
  sequelize: Sequelize,
  cfg: AppConfig,
  interval_ms = 5_000,
): () => void {
  const transport = createMailTransport(cfg)
  let running = false
  const timer = setInterval(() => {
    if (running) return
    running = true
    runOutboxOnce(sequelize, transport, cfg.MAIL_FROM)
      .catch((err: unknown) => logger.error({ err }, 'outbox run failed'))
      .finally(() => {
        running = false
      })
  }, interval_ms)
  timer.unref()
  return () => {
    clearInterval(timer)
    transport.close()
  }
}
