import { createServer } from 'node:http'
import type { AddressInfo } from 'node:net'
import { randomUUID } from 'node:crypto'
import bcrypt from 'bcrypt'
import request from 'supertest'
import { inject } from 'vitest'
import { createApp } from '../../server/app.ts'
import { parseConfig, setConfig } from '../../server/config.ts'
import type { AppConfig } from '../../server/config.ts'
import { createSequelize } from '../../server/db/sequelize.ts'
import { Organisation, User } from '../../server/models/index.ts'
import type { OrganisationKind, Role } from '../../shared/types/roles.ts'

export const TEST_PASSWORD = 'correct horse battery staple'
let passwordHash: string | undefined

export interface TestApp {
  baseUrl: string
  config: AppConfig
  sequelize: ReturnType<typeof createSequelize>
  /** A supertest agent keeping cookies, with our client header on every request. */
  agent(): ReturnType<typeof request.agent>
  close(): Promise<void>
}

/** Start the real app in-process on port 0 against the test database. */
export async function startTestApp(extraEnv: Record<string, string> = {}): Promise<TestApp> {
  const cfg = parseConfig({ ...inject('testEnv'), ...extraEnv })
  setConfig(cfg)
  const sequelize = createSequelize(cfg)
  const { app, close } = createApp(cfg, sequelize)
  const server = createServer(app)
  await new Promise<void>((r) => server.listen(0, '127.0.0.1', () => r()))
  const baseUrl = `http://127.0.0.1:${(server.address() as AddressInfo).port}`
  return {
    baseUrl,
    config: cfg,
    sequelize,
    agent: () => request.agent(baseUrl).set('X-Trenchward-Client', '1'),
    async close() {
      close()
      await new Promise<void>((r) => server.close(() => r()))
      await sequelize.close()
    },
  }
}

export const unique = (prefix: string) => `${prefix}-${randomUUID().slice(0, 8)}`

export async function createTestOrganisation(kind: OrganisationKind, name = unique(kind)) {
  return Organisation.create({ name, kind, medium: kind === 'network_owner' ? 'water' : null })
}

/** A user with TEST_PASSWORD (hashed once per test file at the production cost). */
export async function createTestUser(role: Role, organisation?: Organisation) {
  passwordHash ??= await bcrypt.hash(TEST_PASSWORD, 12)
  const kind: OrganisationKind =
    role === 'applicant'
      ? 'contractor'
      : role === 'asset_engineer'
        ? 'network_owner'
        : role === 'permit_officer'
          ? 'street_authority'
          : 'operator'
  const org = organisation ?? (await createTestOrganisation(kind))
  const user = await User.create({
    email: `${unique(role)}@example.test`,
    name: `Test ${role}`,
    role,
    organisationId: org.id,
    passwordHash,
    lockedUntil: null,
    lastSignInAt: null,
  })
  return { user, organisation: org, email: user.email, password: TEST_PASSWORD }
}

/** An agent signed in as a new user of the given role. */
export async function signedInAgent(app: TestApp, role: Role, organisation?: Organisation) {
  const u = await createTestUser(role, organisation)
  const agent = app.agent()
  const res = await agent.post('/api/auth/sign-in').send({ email: u.email, password: u.password })
  if (res.status !== 200)
    throw new Error(`sign-in failed: ${res.status} ${JSON.stringify(res.body)}`)
  return { agent, ...u }
}
