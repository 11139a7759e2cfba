import { spawnSync } from 'node:child_process'
import { existsSync } from 'node:fs'
import { createServer } from 'node:http'
import type { Server } from 'node:http'
import type { AddressInfo } from 'node:net'
import { join } from 'node:path'
import { randomBytes, randomUUID } from 'node:crypto'
import { QueryTypes } from 'sequelize'
import type { TestProject } from 'vitest/node'
import { startFakePayments } from '../../scripts/fake-payments.ts'
import { createApp } from '../../server/app.ts'
import { parseConfig, setConfig } from '../../server/config.ts'
import { createMigrator } from '../../server/db/migrate.ts'
import { createSequelize } from '../../server/db/sequelize.ts'
import { Organisation } from '../../server/models/index.ts'
import { insertStreets } from '../../server/services/streets.ts'
import { createUser } from '../../server/services/users.ts'
import type { OrganisationKind, Role } from '../../shared/types/roles.ts'
import { ensureDatabase, ROOT, testEnv } from '../helpers/local-env.ts'

const E2E_DB = 'trenchward_e2e'
const PASSWORD = 'browser test password'

// A few streets of our own so the map has something to show (tests never read demo/).
const TEST_STREETS = [
  {
    name: 'Test Street',
    category: 'main',
    coordinates: [
      [9.948, 52.6],
      [9.952, 52.6],
    ],
  },
  {
    name: 'Sample Lane',
    category: 'local',
    coordinates: [
      [9.95, 52.598],
      [9.95, 52.602],
    ],
  },
  {
    name: 'Probe Way',
    category: 'lane',
    coordinates: [
      [9.949, 52.599],
      [9.951, 52.601],
    ],
  },
]

/**
 * Once per run: the built client exists, the e2e database has the schema, one user per role
 * (new e-mails each run), the local fake payment server stands in for the payment service on
 * a free loopback port, and the real app serves client + API on another.
 */
export default async function setup(project: TestProject): Promise<() => Promise<void>> {
  const clientDir = join(ROOT, 'dist', 'client')
  if (!existsSync(join(clientDir, 'index.html'))) {
    const r = spawnSync('npx', ['vite', 'build', '--logLevel', 'warn'], {
      cwd: ROOT,
      stdio: 'inherit',
    })
    if (r.status !== 0) throw new Error('client build failed')
  }
  ensureDatabase(E2E_DB)
  const secretKey = `sk_test_${randomBytes(12).toString('hex')}`
  const webhookSecret = `whsec_${randomBytes(16).toString('hex')}`
  const payments = await startFakePayments({ secretKey, webhookSecret })
  const env = testEnv(E2E_DB, {
    CLIENT_DIST_DIR: clientDir,
    STRIPE_SECRET_KEY: secretKey,
    STRIPE_WEBHOOK_SECRET: webhookSecret,
    STRIPE_API_HOST: '127.0.0.1',
    STRIPE_API_PORT: String(payments.port),
    STRIPE_API_PROTOCOL: 'http',
  })
  const cfg = parseConfig(env)
  setConfig(cfg)
  const sequelize = createSequelize(cfg)
  await createMigrator(sequelize, cfg.PROJECTED_EPSG).up()
  const { app, close } = createApp(cfg, sequelize)

  const run = randomUUID().slice(0, 6)
  const roles: { role: Role; kind: OrganisationKind; name: string }[] = [
    { role: 'applicant', kind: 'contractor', name: 'Alex Applicant' },
    { role: 'asset_engineer', kind: 'network_owner', name: 'Eve Engineer' },
    { role: 'permit_officer', kind: 'street_authority', name: 'Owen Officer' },
    { role: 'admin', kind: 'operator', name: 'Ada Admin' },
  ]
  const users = []
  for (const r of roles) {
    const org = await Organisation.create({
      name: `E2E ${r.kind} ${run}`,
      kind: r.kind,
      medium: r.kind === 'network_owner' ? 'water' : null,
    })
    const email = `${r.role}-${run}@e2e.test`
    await createUser(
      { email, name: r.name, role: r.role, organisationId: org.id, password: PASSWORD },
      null,
    )
    users.push({ email, password: PASSWORD, role: r.role, name: r.name })
  }
  const streets = await sequelize.query<{ n: number }>('SELECT COUNT(*) AS n FROM streets', {
    type: QueryTypes.SELECT,
  })
  if (Number(streets[0]?.n ?? 0) === 0)
    await insertStreets(sequelize, cfg.PROJECTED_EPSG, TEST_STREETS)

  const server: Server = createServer(app)
  await new Promise<void>((r) => server.listen(0, '127.0.0.1', () => r()))
  const baseUrl = `http://127.0.0.1:${(server.address() as AddressInfo).port}`
  payments.setWebhookUrl(`${baseUrl}/api/payments/webhook`)
  // Links in mails and the payment page's way back must point at this server's real port.
  setConfig(parseConfig({ ...env, PUBLIC_URL: baseUrl }))
  project.provide('baseUrl', baseUrl)
  project.provide('e2eUsers', users)

  return async () => {
    close()
    await new Promise<void>((r) => server.close(() => r()))
    await payments.close()
    await sequelize.close()
  }
}
