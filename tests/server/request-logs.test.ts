import { QueryTypes } from 'sequelize'
import { afterAll, beforeAll, describe, expect, it, inject } from 'vitest'
import bcrypt from 'bcrypt'
import { loggableUrl } from '../../server/logger.ts'
import { Organisation, User } from '../../server/models/index.ts'
import { startAppProcessOnTestDb } from '../helpers/app-process.ts'

// The real server process at the most talkative level, its stdout captured.
let run: Awaited<ReturnType<typeof startAppProcessOnTestDb>>
beforeAll(async () => {
  run = await startAppProcessOnTestDb(inject('testEnv'), { LOG_LEVEL: 'trace' })
}, 120_000)
afterAll(async () => {
  await run?.stop()
})

const HEADERS = { 'X-Trenchward-Client': '1', 'Content-Type': 'application/json' }
const post = (path: string, body: unknown, cookie = '') =>
  fetch(`${run.app.baseUrl}${path}`, {
    method: 'POST',
    headers: { ...HEADERS, cookie },
    body: JSON.stringify(body),
  })

describe('request logs', () => {
  it('carry a request id per request and never a password, cookie, session id or reset token', async () => {
    const password = `Quarry-Lane-${Date.now()}-secret`
    const newPassword = `Mill-Race-${Date.now()}-secret`
    const org = await Organisation.create({
      name: `Log Test ${Date.now()}`,
      kind: 'contractor',
      medium: null,
    })
    const email = `log-test-${Date.now()}@example.test`
    await User.create({
      email,
      name: 'Log Tester',
      role: 'applicant',
      organisationId: org.id,
      passwordHash: await bcrypt.hash(password, 12),
      lockedUntil: null,
      lastSignInAt: null,
    })

    expect((await post('/api/auth/sign-in', { email, password: 'wrong-password-x' })).status).toBe(
      401,
    )
    const signIn = await post('/api/auth/sign-in', { email, password })
    expect(signIn.status).toBe(200)
    const cookie = /tw\.sid=[^;]+/.exec(signIn.headers.get('set-cookie') ?? '')![0]
    const cookieValue = cookie.slice('tw.sid='.length)
    const sid = /^s:([^.]+)\./.exec(decodeURIComponent(cookieValue))![1]!
    const me = await fetch(`${run.app.baseUrl}/api/auth/me`, { headers: { cookie } })
    expect(me.status).toBe(200)
    const requestId = me.headers.get('x-request-id')
    expect(requestId).toMatch(/^[0-9a-f-]{36}$/)

    expect((await post('/api/auth/password-reset/request', { email })).status).toBe(202)
    const [mail] = await run.sequelize.query<{ text_body: string }>(
      'SELECT text_body FROM outbox_mails WHERE to_address = ? ORDER BY id DESC LIMIT 1',
      { replacements: [email], type: QueryTypes.SELECT },
    )
    const token = /#token=([A-Za-z0-9_-]{43})/.exec(mail!.text_body)![1]!
    // A token in a query string (a mistyped link) must not reach the log either.
    await fetch(`${run.app.baseUrl}/api/auth/me?token=${token}`, { headers: { cookie } })
    expect(
      (await post('/api/auth/password-reset/complete', { token, password: newPassword })).status,
    ).toBe(204)
    expect((await post('/api/auth/sign-out', {}, cookie)).status).toBe(204)
    await new Promise((r) => setTimeout(r, 300))

    const out = run.app.output()
    const lines = out
      .split('\n')
      .filter(Boolean)
      .map((l) => JSON.parse(l) as { req?: { id?: string; url?: string }; msg?: string })
    const requestLines = lines.filter((l) => l.req?.url?.startsWith('/api/'))
    expect(requestLines.length).toBeGreaterThanOrEqual(7)
    for (const l of requestLines) expect(l.req!.id).toMatch(/^[0-9a-f-]{36}$/)
    expect(requestLines.some((l) => l.req!.id === requestId)).toBe(true)

    for (const secret of [password, newPassword, cookieValue, sid, token])
      expect(out.includes(secret), `log holds ${secret.slice(0, 6)}…`).toBe(false)
    expect(out).toContain('[redacted]')
  }, 120_000)

  it('replaces secret query values in logged URLs', () => {
    expect(loggableUrl('/api/x?token=abc&page=2&password=p#f')).toBe(
      '/api/x?token=[redacted]&page=2&password=[redacted]#f',
    )
  })
})
