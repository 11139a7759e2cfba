import { createHash } from 'node:crypto'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { QueryTypes } from 'sequelize'
import { passwordProblem } from '../../shared/schemas/password-rules.ts'
import { createTestUser, signedInAgent, startTestApp, TEST_PASSWORD } from '../helpers/test-app.ts'
import type { TestApp } from '../helpers/test-app.ts'

let app: TestApp
beforeAll(async () => {
  app = await startTestApp()
})
afterAll(async () => {
  await app.close()
})

const NEW_PASSWORD = 'gravel under the footway 41'

/** The token of the newest reset mail to `email`, read from the outbox like a mail reader would. */
async function tokenMailedTo(email: string): Promise<string> {
  const rows = await app.sequelize.query<{ text_body: string }>(
    `SELECT text_body FROM outbox_mails WHERE to_address = ? AND subject LIKE '%new Trenchward password%'
      ORDER BY id DESC LIMIT 1`,
    { replacements: [email], type: QueryTypes.SELECT },
  )
  const m = /\/reset-password#token=([A-Za-z0-9_-]{43})/.exec(rows[0]?.text_body ?? '')
  if (!m) throw new Error(`no reset mail to ${email}`)
  return m[1]!
}

async function auditActions(userId: number): Promise<string[]> {
  const rows = await app.sequelize.query<{ action: string }>(
    `SELECT action FROM audit_events WHERE entity_type = 'user' AND entity_id = ? ORDER BY id`,
    { replacements: [String(userId)], type: QueryTypes.SELECT },
  )
  return rows.map((r) => r.action)
}

const requestReset = (email: string) =>
  app.agent().post('/api/auth/password-reset/request').send({ email })
const completeReset = (token: string, password: string) =>
  app.agent().post('/api/auth/password-reset/complete').send({ token, password })

describe('password rules', () => {
  it('refuse short, common and e-mail passwords and accept a long plain phrase', () => {
    expect(passwordProblem('short')).toMatch(/at least 12/)
    expect(passwordProblem('password1234')).toMatch(/too common/)
    expect(passwordProblem('aaaaaaaaaaaaaaaa')).toMatch(/too common/)
    expect(passwordProblem('mia.baumann@example.test', 'Mia.Baumann@example.test')).toMatch(
      /e-mail/,
    )
    expect(passwordProblem('mia.baumann.x', 'mia.baumann.x@example.test')).toMatch(/e-mail/)
    expect(passwordProblem(NEW_PASSWORD, 'mia@example.test')).toBeNull()
  })

  it('when an admin creates a user with the e-mail as password, then it responds 400 on password', async () => {
    const admin = await signedInAgent(app, 'admin')
    const email = `rule-${Date.now()}@example.test`
    const res = await admin.agent.post('/api/admin/users').send({
      email,
      name: 'Rule Test',
      role: 'applicant',
      organisationId: admin.organisation.id,
      password: email,
    })
    expect(res.status).toBe(400)
    expect(res.body.error.fields).toEqual([
      { field: 'password', message: 'Do not use your e-mail address as the password' },
    ])
    const common = await admin.agent.post('/api/admin/users').send({
      email,
      name: 'Rule Test',
      role: 'applicant',
      organisationId: admin.organisation.id,
      password: 'qwerty123456',
    })
    expect(common.status).toBe(400)
    expect(common.body.error.fields[0].field).toBe('password')
  })
})

describe('POST /api/auth/password-reset/request', () => {
  it('answers known and unknown addresses alike, and mails only the known one', async () => {
    const u = await createTestUser('applicant')
    const known = await requestReset(u.email)
    const unknown = await requestReset(`nobody-${Date.now()}@example.test`)
    expect(known.status).toBe(202)
    expect(unknown.status).toBe(202)
    expect(unknown.body).toEqual(known.body)
    const token = await tokenMailedTo(u.email)
    // Only the hash is stored; the token appears nowhere in the table.
    const rows = await app.sequelize.query<Record<string, unknown>>(
      'SELECT * FROM password_resets WHERE user_id = ?',
      { replacements: [u.user.id], type: QueryTypes.SELECT },
    )
    expect(rows).toHaveLength(1)
    expect(rows[0]!.token_sha256).toBe(createHash('sha256').update(token).digest('hex'))
    expect(JSON.stringify(rows)).not.toContain(token)
    const ttl_ms = new Date(rows[0]!.expires_at as string).getTime() - Date.now()
    expect(ttl_ms).toBeGreaterThan(59 * 60_000)
    expect(ttl_ms).toBeLessThanOrEqual(60 * 60_000)
    expect(await auditActions(u.user.id)).toEqual(['password-reset-requested'])
  })

  it('when one address asks too often, then it responds 429 in the envelope', async () => {
    const u = await createTestUser('applicant')
    const statuses: number[] = []
    for (let i = 0; i < 6; i++) statuses.push((await requestReset(u.email)).status)
    expect(statuses).toEqual([202, 202, 202, 202, 202, 429])
    const res = await requestReset(u.email)
    expect(res.body.error.code).toBe('RATE_LIMITED')
    // At most three links per account and hour were mailed.
    const [row] = await app.sequelize.query<{ n: number }>(
      'SELECT COUNT(*) AS n FROM outbox_mails WHERE to_address = ?',
      { replacements: [u.email], type: QueryTypes.SELECT },
    )
    expect(Number(row!.n)).toBe(3)
  })

  it('when the e-mail is not an address, then it responds 400 naming email', async () => {
    const res = await requestReset('not-an-address')
    expect(res.status).toBe(400)
    expect(res.body.error.fields[0].field).toBe('email')
  })
})

describe('POST /api/auth/password-reset/complete', () => {
  it('sets the new password once, ends the other sessions and is audited', async () => {
    const u = await signedInAgent(app, 'asset_engineer')
    expect((await u.agent.get('/api/auth/me')).status).toBe(200)
    await requestReset(u.email).expect(202)
    const token = await tokenMailedTo(u.email)

    const weak = await completeReset(token, 'password1234')
    expect(weak.status).toBe(400)
    expect(weak.body.error.fields).toEqual([
      { field: 'password', message: 'This password is too common; choose a less obvious one' },
    ])
    const own = await completeReset(token, u.email)
    expect(own.status).toBe(400)
    expect(own.body.error.fields[0]).toEqual({
      field: 'password',
      message: 'Do not use your e-mail address as the password',
    })

    expect((await completeReset(token, NEW_PASSWORD)).status).toBe(204)
    // The session opened before the reset is gone.
    expect((await u.agent.get('/api/auth/me')).status).toBe(401)
    const again = await completeReset(token, `${NEW_PASSWORD} again`)
    expect(again.status).toBe(422)
    expect(again.body.error.fields).toEqual([{ field: 'token', message: 'Expired or used' }])

    const old = await app
      .agent()
      .post('/api/auth/sign-in')
      .send({ email: u.email, password: TEST_PASSWORD })
    expect(old.status).toBe(401)
    const fresh = await app
      .agent()
      .post('/api/auth/sign-in')
      .send({ email: u.email, password: NEW_PASSWORD })
    expect(fresh.status).toBe(200)
    expect(await auditActions(u.user.id)).toEqual([
      'signed-in',
      'password-reset-requested',
      'password-reset',
      'password-reset-refused',
      'sign-in-failed',
      'signed-in',
    ])
  })

  it('when the link has expired, then it responds 422 and the password stays', async () => {
    const u = await createTestUser('permit_officer')
    await requestReset(u.email).expect(202)
    const token = await tokenMailedTo(u.email)
    await app.sequelize.query('UPDATE password_resets SET expires_at = ? WHERE user_id = ?', {
      replacements: [new Date(Date.now() - 1000), u.user.id],
    })
    const res = await completeReset(token, NEW_PASSWORD)
    expect(res.status).toBe(422)
    expect(res.body.error.message).toMatch(/expired or has been used/)
    await app
      .agent()
      .post('/api/auth/sign-in')
      .send({ email: u.email, password: TEST_PASSWORD })
      .expect(200)
  })

  it('when a newer link was asked for, then the older one no longer works', async () => {
    const u = await createTestUser('applicant')
    await requestReset(u.email).expect(202)
    const first = await tokenMailedTo(u.email)
    await requestReset(u.email).expect(202)
    const second = await tokenMailedTo(u.email)
    expect(second).not.toBe(first)
    expect((await completeReset(first, NEW_PASSWORD)).status).toBe(422)
    expect((await completeReset(second, NEW_PASSWORD)).status).toBe(204)
  })

  it('lifts a sign-in lock', async () => {
    const u = await createTestUser('applicant')
    for (let i = 0; i < 5; i++)
      await app
        .agent()
        .post('/api/auth/sign-in')
        .send({ email: u.email, password: `wrong-${i}` })
    await requestReset(u.email).expect(202)
    await completeReset(await tokenMailedTo(u.email), NEW_PASSWORD).expect(204)
    await app
      .agent()
      .post('/api/auth/sign-in')
      .send({ email: u.email, password: NEW_PASSWORD })
      .expect(200)
    const actions = await auditActions(u.user.id)
    expect(actions.slice(0, 5)).toEqual([
      'sign-in-failed',
      'sign-in-failed',
      'sign-in-failed',
      'sign-in-failed',
      'account-locked',
    ])
    expect(actions.slice(5)).toEqual(['password-reset-requested', 'password-reset', 'signed-in'])
  })

  it('when the token is malformed, then it responds 400 naming token', async () => {
    const res = await completeReset('abc', NEW_PASSWORD)
    expect(res.status).toBe(400)
    expect(res.body.error.fields[0].field).toBe('token')
  })
})

describe('session expiry', () => {
  it('when a session is older than SESSION_MAX_AGE_H, then the server no longer accepts it', async () => {
    // 0.0005 h = 1.8 s
    const short = await startTestApp({ SESSION_MAX_AGE_H: '0.0005' })
    try {
      const u = await createTestUser('applicant')
      const res = await short
        .agent()
        .post('/api/auth/sign-in')
        .send({ email: u.email, password: TEST_PASSWORD })
      expect(res.status).toBe(200)
      const cookie = /tw\.sid=[^;]+/.exec(String(res.headers['set-cookie']))![0]
      const me = (c: string) =>
        fetch(`${short.baseUrl}/api/auth/me`, { headers: { cookie: c } }).then((r) => r.status)
      expect(await me(cookie)).toBe(200)
      await new Promise((r) => setTimeout(r, 2500))
      // Sent by hand, past the cookie's own expiry: the stored session has expired too.
      expect(await me(cookie)).toBe(401)
    } finally {
      await short.close()
    }
  })
})
