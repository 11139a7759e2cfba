import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { ROLES } from '../../shared/types/roles.ts'
import type { Role } from '../../shared/types/roles.ts'
import { signedInAgent, startTestApp, unique } from '../helpers/test-app.ts'
import type { TestApp } from '../helpers/test-app.ts'

let app: TestApp
beforeAll(async () => {
  app = await startTestApp()
})
afterAll(async () => {
  await app.close()
})

// Routes that belong to exactly one role; every other role must get 403.
const ROLE_ROUTES: { role: Role; method: 'get' | 'post'; path: string }[] = [
  { role: 'admin', method: 'get', path: '/api/admin/users' },
  { role: 'admin', method: 'get', path: '/api/admin/organisations' },
  { role: 'admin', method: 'get', path: '/api/admin/audit' },
  { role: 'admin', method: 'post', path: '/api/admin/organisations' },
]

describe('role checks', () => {
  for (const route of ROLE_ROUTES) {
    for (const role of ROLES.filter((r) => r !== route.role)) {
      it(`when a ${role} calls ${route.method.toUpperCase()} ${route.path}, then it responds 403`, async () => {
        const { agent } = await signedInAgent(app, role)
        const res = await agent[route.method](route.path).send({})
        expect(res.status).toBe(403)
        expect(res.body).toEqual({
          error: {
            code: 'FORBIDDEN',
            message: 'Your role does not allow this',
            requestId: expect.any(String),
          },
        })
      })
    }
    it(`when nobody is signed in, ${route.method.toUpperCase()} ${route.path} responds 401`, async () => {
      const res = await app.agent()[route.method](route.path).send({})
      expect(res.status).toBe(401)
    })
  }
})

describe('admin: organisations and users', () => {
  it('when an admin creates an organisation and a user in it, then the user can sign in', async () => {
    const { agent } = await signedInAgent(app, 'admin')
    const orgName = unique('Test Water Board')
    const org = await agent
      .post('/api/admin/organisations')
      .send({ name: orgName, kind: 'network_owner', medium: 'water' })
    expect(org.status).toBe(201)
    expect(org.body).toEqual({
      id: expect.any(Number),
      name: orgName,
      kind: 'network_owner',
      medium: 'water',
      createdAt: expect.any(String),
    })
    const email = `${unique('eng')}@example.test`
    const user = await agent.post('/api/admin/users').send({
      email,
      name: 'Ada Testwell',
      role: 'asset_engineer',
      organisationId: org.body.id,
      password: 'a long enough password',
    })
    expect(user.status).toBe(201)
    expect(user.body.organisation.id).toBe(org.body.id)
    const again = await agent.post('/api/admin/users').send({
      email,
      name: 'Ada Again',
      role: 'asset_engineer',
      organisationId: org.body.id,
      password: 'a long enough password',
    })
    expect(again.status).toBe(409)
    expect(again.body.error).toEqual({
      code: 'CONFLICT',
      message: 'A user with this e-mail address exists',
      fields: [{ field: 'email', message: 'Already registered' }],
      requestId: expect.any(String),
    })
    const signIn = await app
      .agent()
      .post('/api/auth/sign-in')
      .send({ email, password: 'a long enough password' })
    expect(signIn.status).toBe(200)
    expect(signIn.body.user.role).toBe('asset_engineer')
  })

  it('when the password is too short, then it responds 400 naming password', async () => {
    const { agent, organisation } = await signedInAgent(app, 'admin')
    const res = await agent.post('/api/admin/users').send({
      email: `${unique('x')}@example.test`,
      name: 'Short Pass',
      role: 'applicant',
      organisationId: organisation.id,
      password: 'short',
    })
    expect(res.status).toBe(400)
    expect(res.body.error.fields).toEqual([
      { field: 'password', message: 'Use at least 12 characters' },
    ])
  })

  it('when an unknown role is given, then it responds 400 naming role', async () => {
    const { agent, organisation } = await signedInAgent(app, 'admin')
    const res = await agent.post('/api/admin/users').send({
      email: `${unique('x')}@example.test`,
      name: 'Wrong Role',
      role: 'superuser',
      organisationId: organisation.id,
      password: 'a long enough password',
    })
    expect(res.status).toBe(400)
    expect(res.body.error.fields.map((f: { field: string }) => f.field)).toEqual(['role'])
  })

  it('when an admin deactivates a user, then that user is signed out on the next request', async () => {
    const admin = await signedInAgent(app, 'admin')
    const target = await signedInAgent(app, 'applicant')
    expect((await target.agent.get('/api/auth/me')).status).toBe(200)
    const res = await admin.agent
      .patch(`/api/admin/users/${target.user.id}`)
      .send({ active: false })
    expect(res.status).toBe(200)
    expect(res.body.active).toBe(false)
    expect((await target.agent.get('/api/auth/me')).status).toBe(401)
  })
})

describe('GET /api/home', () => {
  for (const role of ROLES) {
    it(`when a ${role} asks, then it responds 200 with that role's items`, async () => {
      const { agent } = await signedInAgent(app, role)
      const res = await agent.get('/api/home')
      expect(res.status).toBe(200)
      expect(res.body.role).toBe(role)
      expect(res.body.items.length).toBeGreaterThan(0)
    })
  }
})

describe('unknown API routes', () => {
  it('responds 404 in the error envelope', async () => {
    const res = await app.agent().get('/api/no-such-thing')
    expect(res.status).toBe(404)
    expect(res.body.error.code).toBe('NOT_FOUND')
  })
})
