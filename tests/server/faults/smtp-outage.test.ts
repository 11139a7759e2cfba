import { spawn } from 'node:child_process'
import type { ChildProcess } from 'node:child_process'
import { mkdtempSync, readdirSync, readFileSync, rmSync } from 'node:fs'
import { connect } from 'node:net'
import { tmpdir } from 'node:os'
import { join } from 'node:path'
import { Op } from 'sequelize'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { startOutboxWorker } from '../../../server/mail/outbox-worker.ts'
import { OutboxMail } from '../../../server/models/index.ts'
import { ROOT } from '../../helpers/local-env.ts'
import { createTestUser, startTestApp } from '../../helpers/test-app.ts'
import type { TestApp } from '../../helpers/test-app.ts'
import { freePort } from '../../helpers/throwaway-mariadb.ts'

const sleep = (ms: number) => new Promise((r) => setTimeout(r, ms))
const catchDir = mkdtempSync(join(tmpdir(), 'tw-fault-mail-'))
let app: TestApp
let port = 0
let smtp: ChildProcess | undefined

beforeAll(async () => {
  port = await freePort()
  app = await startTestApp({ SMTP_PORT: String(port) })
})
afterAll(async () => {
  smtp?.kill('SIGTERM')
  await app.close()
  rmSync(catchDir, { recursive: true, force: true })
})

/** The project's own fake SMTP server (scripts/fake-smtp.ts) as a separate process. */
async function startFakeSmtp(): Promise<ChildProcess> {
  const child = spawn(
    process.execPath,
    ['--import', 'tsx', join(ROOT, 'scripts', 'fake-smtp.ts'), catchDir, String(port)],
    { cwd: ROOT, stdio: 'ignore' },
  )
  for (let i = 0; i < 100; i++) {
    const open = await new Promise<boolean>((r) => {
      const s = connect(port, '127.0.0.1', () => {
        s.end()
        r(true)
      }).on('error', () => r(false))
    })
    if (open) return child
    await sleep(100)
  }
  throw new Error('fake SMTP server did not start')
}

async function waitFor(what: string, check: () => Promise<boolean>, timeout_ms = 20_000) {
  const until = Date.now() + timeout_ms
  while (Date.now() < until) {
    if (await check()) return
    await sleep(200)
  }
  throw new Error(`timed out waiting for ${what}`)
}

const caught = () =>
  readdirSync(catchDir)
    .filter((f) => f.endsWith('.json'))
    .map((f) => JSON.parse(readFileSync(join(catchDir, f), 'utf8')) as { to: string; text: string })

describe('when the SMTP server is down', () => {
  it('keeps the mails in the outbox and sends each once when the server is back', async () => {
    const users = await Promise.all([1, 2, 3, 4, 5].map(() => createTestUser('applicant')))
    const emails = users.map((u) => u.email)
    // The requests succeed while no SMTP server listens: mail is decoupled from the answer.
    for (const email of emails)
      await app.agent().post('/api/auth/password-reset/request').send({ email }).expect(202)
    const ours = { toAddress: { [Op.in]: emails } }

    const stopWorker = startOutboxWorker(app.sequelize, app.config, 200)
    try {
      await waitFor('a failed attempt on every mail', async () =>
        (await OutboxMail.findAll({ where: ours })).every((m) => m.attempts >= 1),
      )
      const waiting = await OutboxMail.findAll({ where: ours })
      expect(waiting).toHaveLength(5)
      for (const m of waiting) {
        expect(m.status).toBe('pending')
        expect(m.lastError).toMatch(/ECONNREFUSED|connect/i)
      }
      expect(caught()).toEqual([])

      smtp = await startFakeSmtp()
      // The retry wait (30 s after the first failure) is brought forward instead of slept.
      await OutboxMail.update({ nextAttemptAt: new Date(Date.now() - 1000) }, { where: ours })
      await waitFor('every mail sent', async () =>
        (await OutboxMail.findAll({ where: ours })).every((m) => m.status === 'sent'),
      )
      await sleep(1000) // a further worker round must not send anything twice
    } finally {
      stopWorker()
    }
    const mails = caught().filter((m) => emails.includes(m.to))
    expect(mails.map((m) => m.to).sort()).toEqual([...emails].sort())
    // The link in a delayed mail still works.
    const token = /#token=([A-Za-z0-9_-]{43})/.exec(mails[0]!.text)![1]!
    await app
      .agent()
      .post('/api/auth/password-reset/complete')
      .send({ token, password: 'ballast stones near the crossing' })
      .expect(204)
  }, 60_000)
})
