import { createServer } from 'node:net'
import type { AddressInfo } from 'node:net'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { SMTPServer } from 'smtp-server'
import { simpleParser } from 'mailparser'
import { inject } from 'vitest'
import { parseConfig } from '../../server/config.ts'
import { enqueueMail } from '../../server/mail/outbox.ts'
import { createMailTransport, runOutboxOnce } from '../../server/mail/outbox-worker.ts'
import { OutboxMail } from '../../server/models/index.ts'
import { startTestApp, unique } from '../helpers/test-app.ts'
import type { TestApp } from '../helpers/test-app.ts'

let app: TestApp
beforeAll(async () => {
  app = await startTestApp()
})
afterAll(async () => {
  await app.close()
})

/** A loopback port nobody listens on (bound, read, released). */
async function freePort(): Promise<number> {
  const s = createServer()
  await new Promise<void>((r) => s.listen(0, '127.0.0.1', () => r()))
  const port = (s.address() as AddressInfo).port
  await new Promise<void>((r) => s.close(() => r()))
  return port
}

describe('mail outbox', () => {
  it('when the SMTP server is down, then the mail waits; when it is back, the mail goes out once', async () => {
    const port = await freePort()
    const cfg = parseConfig({ ...inject('testEnv'), SMTP_PORT: String(port) })
    const subject = unique('Review due')
    const id = await enqueueMail({
      to: ['engineer@example.test'],
      subject,
      text: 'A review is due.',
    })

    // Other tests leave mail in the shared outbox: run the worker until it has tried ours.
    const down = createMailTransport(cfg)
    for (let i = 0; i < 50 && (await OutboxMail.findByPk(id))!.attempts === 0; i++) {
      await runOutboxOnce(app.sequelize, down, cfg.MAIL_FROM, 500)
    }
    const waiting = await OutboxMail.findByPk(id)
    expect(waiting!.status).toBe('pending')
    expect(waiting!.attempts).toBe(1)
    expect(waiting!.lastError).toMatch(/ECONNREFUSED|connect/i)
    expect(waiting!.nextAttemptAt.getTime()).toBeGreaterThan(Date.now())

    // The SMTP server comes up on that port; the retry time is brought forward.
    const received: string[] = []
    const smtp = new SMTPServer({
      authOptional: true,
      disabledCommands: ['STARTTLS'],
      onData(stream, _s, cb) {
        simpleParser(stream).then((m) => {
          received.push(m.subject ?? '')
          cb()
        }, cb)
      },
    })
    await new Promise<void>((r) => smtp.listen(port, '127.0.0.1', () => r()))
    try {
      await waiting!.update({ nextAttemptAt: new Date(Date.now() - 1000) })
      const up = createMailTransport(cfg)
      for (let i = 0; i < 50 && (await OutboxMail.findByPk(id))!.status === 'pending'; i++) {
        await runOutboxOnce(app.sequelize, up, cfg.MAIL_FROM, 500)
      }
      await runOutboxOnce(app.sequelize, up, cfg.MAIL_FROM, 500)
      up.close()
    } finally {
      await new Promise<void>((r) => smtp.close(() => r()))
    }
    const done = await OutboxMail.findByPk(id)
    expect(done!.status).toBe('sent')
    expect(done!.attempts).toBe(2)
    expect(received.filter((s) => s === subject)).toHaveLength(1)
  })

  it('when the change it reports rolls back, then no mail is queued', async () => {
    const subject = unique('Rolled back')
    await expect(
      app.sequelize.transaction(async (transaction) => {
        await enqueueMail({ to: ['x@example.test'], subject, text: 'never' }, transaction)
        throw new Error('the change failed')
      }),
    ).rejects.toThrow('the change failed')
    expect(await OutboxMail.count({ where: { subject } })).toBe(0)
  })
})
