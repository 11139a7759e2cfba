import type { AddressInfo } from 'node:net'
import { simpleParser } from 'mailparser'
import { QueryTypes } from 'sequelize'
import { SMTPServer } from 'smtp-server'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { inject } from 'vitest'
import { parseConfig } from '../../server/config.ts'
import { createMigrator } from '../../server/db/migrate.ts'
import { createSequelize } from '../../server/db/sequelize.ts'
import { OutboxMail } from '../../server/models/index.ts'
import { ensureDatabase } from '../helpers/local-env.ts'
import {
  buildTwoOwnerNetwork,
  submitApplication,
  worksNearBoth,
} from '../helpers/review-fixtures.ts'
import { freePort, startServerProcess } from '../helpers/server-process.ts'
import type { ServerProcess } from '../helpers/server-process.ts'
import { createTestUser, startTestApp } from '../helpers/test-app.ts'
import type { TestApp } from '../helpers/test-app.ts'

// Its own database: the two app processes run the outbox worker and the scheduler, which would
// otherwise send the mail that other test files wait to find pending.
const DB = 'trenchward_scaleout'

describe('two app processes against one database', () => {
  let app: TestApp
  let a: ServerProcess
  let b: ServerProcess
  const received: { to: string; subject: string }[] = []
  let smtp: SMTPServer

  beforeAll(async () => {
    ensureDatabase(DB)
    const env = { ...inject('testEnv'), DB_NAME: DB }
    const setup = createSequelize(parseConfig(env))
    await createMigrator(setup, parseConfig(env).PROJECTED_EPSG).up()
    await setup.close()
    // Whatever earlier runs left in the outbox is not ours to send.
    app = await startTestApp({ DB_NAME: DB })
    await app.sequelize.query(`UPDATE outbox_mails SET status = 'failed' WHERE status = 'pending'`)

    smtp = new SMTPServer({
      authOptional: true,
      disabledCommands: ['STARTTLS'],
      onData(stream, _session, done) {
        simpleParser(stream)
          .then((m) => {
            const to = [m.to ?? []].flat().flatMap((x) => x.value.map((v) => v.address ?? ''))
            for (const t of to) received.push({ to: t, subject: m.subject ?? '' })
            done()
          })
          .catch(done)
      },
    })
    await new Promise<void>((ok) => smtp.listen(0, '127.0.0.1', () => ok()))
    const childEnv = {
      ...env,
      LOG_LEVEL: 'silent',
      SMTP_HOST: '127.0.0.1',
      SMTP_PORT: String((smtp.server.address() as AddressInfo).port),
      REMINDER_INTERVAL_S: '5',
    }
    ;[a, b] = await Promise.all([
      freePort().then((p) => startServerProcess(childEnv, p)),
      freePort().then((p) => startServerProcess(childEnv, p)),
    ])
  }, 120_000)

  afterAll(async () => {
    await Promise.all([a?.stop(), b?.stop()])
    await new Promise<void>((ok) => smtp.close(() => ok()))
    await app?.close()
  })

  it('when a user signs in on one process, then the session works on the other, and signing out there ends it on both', async () => {
    expect(a.pid).not.toBe(b.pid)
    const u = await createTestUser('applicant')
    const headers = { 'Content-Type': 'application/json', 'X-Trenchward-Client': '1' }
    const signIn = await fetch(`${a.url}/api/auth/sign-in`, {
      method: 'POST',
      headers,
      body: JSON.stringify({ email: u.email, password: u.password }),
    })
    expect(signIn.status).toBe(200)
    const cookie = signIn.headers
      .getSetCookie()
      .map((c) => c.split(';')[0])
      .join('; ')
    const me = await fetch(`${b.url}/api/auth/me`, { headers: { ...headers, Cookie: cookie } })
    expect(me.status).toBe(200)
    expect((await me.json()) as unknown).toMatchObject({ user: { email: u.email } })

    const out = await fetch(`${b.url}/api/auth/sign-out`, {
      method: 'POST',
      headers: { ...headers, Cookie: cookie },
    })
    expect(out.status).toBeLessThan(300)
    const after = await fetch(`${a.url}/api/auth/me`, { headers: { ...headers, Cookie: cookie } })
    expect(after.status).toBe(401)
  })

  it('when both processes run the outbox and the scheduler, then every mail and every reminder goes out once', async () => {
    const net = await buildTwoOwnerNetwork(app)
    const applicant = await createTestUser('applicant')
    const agent = app.agent()
    await agent
      .post('/api/auth/sign-in')
      .send({ email: applicant.email, password: applicant.password })
    const applicationId = await submitApplication(
      agent,
      worksNearBoth(net.origin),
      'Scale-out test',
    )
    // Both reviews fall due today: each owner's engineer is owed one due-day reminder.
    await app.sequelize.query(
      `UPDATE owner_reviews SET due_on = UTC_DATE() WHERE application_id = ? AND state = 'waiting'`,
      { replacements: [applicationId] },
    )
    const engineers = [net.w.email, net.g.email]
    const ours = () =>
      OutboxMail.findAll({ where: { toAddress: engineers }, order: [['id', 'ASC']] })

    // Wait until both schedulers have run at least twice (first run 10 s after start, then
    // every 5 s) and the outbox holds nothing pending for the engineers.
    const deadline = Date.now() + 60_000
    let reminders = 0
    for (;;) {
      const rows = await ours()
      reminders = rows.filter((m) => m.subject.startsWith('Reminder')).length
      if (reminders >= 2 && rows.every((m) => m.status === 'sent')) break
      if (Date.now() > deadline)
        throw new Error(`outbox: ${JSON.stringify(rows.map((m) => [m.subject, m.status]))}`)
      await new Promise((r) => setTimeout(r, 1000))
    }
    // Two more scheduler rounds on both processes must add nothing.
    await new Promise((r) => setTimeout(r, 11_000))
    const rows = await ours()
    expect(rows.filter((m) => m.subject.startsWith('Reminder'))).toHaveLength(2)
    const claimed = await app.sequelize.query<{ n: number }>(
      `SELECT COUNT(*) AS n FROM review_reminders r JOIN owner_reviews o ON o.id = r.review_id
        WHERE o.application_id = ?`,
      { replacements: [applicationId], type: QueryTypes.SELECT },
    )
    expect(Number(claimed[0]!.n)).toBe(2)
    // Each outbox row reached the SMTP server exactly once.
    for (const m of rows) {
      expect(m.status).toBe('sent')
      const hits = received.filter((r) => r.to === m.toAddress && r.subject === m.subject)
      expect(hits, m.subject).toHaveLength(1)
    }
  }, 120_000)
})
