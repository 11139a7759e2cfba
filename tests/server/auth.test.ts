import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { QueryTypes } from 'sequelize'
import { createTestUser, startTestApp, TEST_PASSWORD } from '../helpers/test-app.ts'
import type { TestApp } from '../helpers/test-app.ts'

let app: TestApp
beforeAll(async () => {
  app = await startTestApp()
})
afterAll(async () => {
  await app.close()
})

describe('POST /api/auth/sign-in', () => {
  it('when the password is right, then it responds 200 with the user and sets a session cookie', async () => {
    const u = await createTestUser('applicant')
    const agent = app.agent()
    const res = await agent
      .post('/api/auth/sign-in')
      .send({ email: u.email.toUpperCase(), password: TEST_PASSWORD })
    expect(res.status).toBe(200)
    expect(res.body).toEqual({
      user: {
        id: u.user.id,
        email: u.email,
        name: 'Test applicant',
        role: 'applicant',
        active: true,
        organisation: {
          id: u.organisation.id,
          name: u.organisation.name,
          kind: 'contractor',
          medium: null,
          createdAt: expect.any(String),
        },
        lastSignInAt: expect.any(String),
        createdAt: expect.any(String),
      },
    })
    const cookie = String(res.headers['set-cookie'])
    expect(cookie).toMatch(/tw\.sid=/)
    expect(cookie).toMatch(/HttpOnly/)
    expect(cookie).toMatch(/SameSite=Lax/)
    const signed = decodeURIComponent(/tw\.sid=([^;]+)/.exec(cookie)?.[1] ?? '')
    const sid = /^s:([^.]+)\./.exec(signed)?.[1]
    const rows = await app.sequelize.query<{ data: string }>(
      'SELECT data FROM sessions WHERE sid = ?',
      {
        replacements: [sid],
        type: QueryTypes.SELECT,
      },
    )
    expect(JSON.parse(rows[0]!.data).passport.user).toBe(u.user.id)
  })

  it('when the password is wrong, then it responds 401 UNAUTHENTICATED', async () => {
    const u = await createTestUser('applicant')
    const res = await app
      .agent()
      .post('/api/auth/sign-in')
      .send({ email: u.email, password: 'not the password' })
    expect(res.status).toBe(401)
    expect(res.body).toEqual({
      error: {
        code: 'UNAUTHENTICATED',
        message: 'E-mail or password is not right',
        requestId: expect.any(String),
      },
    })
  })

  it('when the e-mail is unknown, then it responds with the same 401', async () => {
    const res = await app
      .agent()
      .post('/api/auth/sign-in')
      .send({ email: 'nobody@example.test', password: 'whatever' })
    expect(res.status).toBe(401)
    expect(res.body.error.message).toBe('E-mail or password is not right')
  })

  it('when the body misses the e-mail, then it responds 400 naming the field', async () => {
    const res = await app.agent().post('/api/auth/sign-in').send({ password: 'x' })
    expect(res.status).toBe(400)
    expect(res.body).toEqual({
      error: {
        code: 'VALIDATION_FAILED',
        message: 'Some fields need attention',
        fields: [{ field: 'email', message: expect.any(String) }],
        requestId: expect.any(String),
      },
    })
  })

  it('when the body is not JSON, then it responds 400 VALIDATION_FAILED on body', async () => {
    const res = await app
      .agent()
      .post('/api/auth/sign-in')
      .set('Content-Type', 'application/json')
      .send('{"email": ')
    expect(res.status).toBe(400)
    expect(res.body.error.fields).toEqual([{ field: 'body', message: 'Not valid JSON' }])
  })

  it('when the password was wrong 5 times, then even the right one is refused with 429 for a while', async () => {
    const u = await createTestUser('permit_officer')
    for (let i = 0; i < 5; i++) {
      const r = await app
        .agent()
        .post('/api/auth/sign-in')
        .send({ email: u.email, password: `wrong-${i}` })
      expect(r.status).toBe(401)
    }
    const res = await app
      .agent()
      .post('/api/auth/sign-in')
      .send({ email: u.email, password: TEST_PASSWORD })
    expect(res.status).toBe(429)
    expect(res.body.error.code).toBe('RATE_LIMITED')
    expect(res.body.error.message).toMatch(/Too many failed sign-ins/)
    await u.user.reload()
    expect(u.user.lockedUntil!.getTime()).toBeGreaterThan(Date.now())
  })

  it('when a write request lacks the client header, then it responds 403', async () => {
    const u = await createTestUser('applicant')
    const res = await fetch(`${app.baseUrl}/api/auth/sign-in`, {
      method: 'POST',
      headers: { 'Content-Type': 'application/json' },
      body: JSON.stringify({ email: u.email, password: TEST_PASSWORD }),
    })
    expect(res.status).toBe(403)
    expect(((await res.json()) as { error: { code: string } }).error.code).toBe('FORBIDDEN')
  })

  it('when the user is deactivated, then the right password is refused', async () => {
    const u = await createTestUser('applicant')
    await u.user.update({ active: false })
    const res = await app
      .agent()
      .post('/api/auth/sign-in')
      .send({ email: u.email, password: TEST_PASSWORD })
    expect(res.status).toBe(401)
  })

  it('regenerates the session id at sign-in (no session fixation)', async () => {
    const u = await createTestUser('applicant')
    const agent = app.agent()
    const first = await agent
      .post('/api/auth/sign-in')
      .send({ email: u.email, password: TEST_PASSWORD })
    const sid1 = /tw\.sid=([^;]+)/.exec(String(first.headers['set-cookie']))?.[1]
    const second = await agent
      .post('/api/auth/sign-in')
      .send({ email: u.email, password: TEST_PASSWORD })
    const sid2 = /tw\.sid=([^;]+)/.exec(String(second.headers['set-cookie']))?.[1]
    expect(sid1).toBeTruthy()
    expect(sid2).toBeTruthy()
    expect(sid2).not.toBe(sid1)
  })
})

describe('GET /api/auth/me and POST /api/auth/sign-out', () => {
  it('when not signed in, then me responds 401', async () => {
    const res = await app.agent().get('/api/auth/me')
    expect(res.status).toBe(401)
    expect(res.body.error).toEqual({
      code: 'UNAUTHENTICATED',
      message: 'Please sign in',
      requestId: expect.any(String),
    })
  })

  it('after sign-out, me responds 401 and the sign-out is audited', async () => {
    const u = await createTestUser('asset_engineer')
    const agent = app.agent()
    await agent
      .post('/api/auth/sign-in')
      .send({ email: u.email, password: TEST_PASSWORD })
      .expect(200)
    const me = await agent.get('/api/auth/me')
    expect(me.status).toBe(200)
    expect(me.body.user.email).toBe(u.email)
    const out = await agent.post('/api/auth/sign-out')
    expect(out.status).toBe(204)
    expect((await agent.get('/api/auth/me')).status).toBe(401)
    const events = await app.sequelize.query<{ action: string }>(
      'SELECT action FROM audit_events WHERE entity_type = ? AND entity_id = ? ORDER BY id',
      { replacements: ['user', String(u.user.id)], type: QueryTypes.SELECT },
    )
    expect(events.map((e) => e.action)).toEqual(['signed-in', 'signed-out'])
  })
})
