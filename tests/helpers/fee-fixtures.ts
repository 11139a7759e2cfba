import { mkdtempSync } from 'node:fs'
import { tmpdir } from 'node:os'
import { join } from 'node:path'
import { randomBytes } from 'node:crypto'
import { inject } from 'vitest'
import { expect } from 'vitest'
import { parseConfig, setConfig } from '../../server/config.ts'
import { startFakePayments } from '../../scripts/fake-payments.ts'
import type { FakePayments } from '../../scripts/fake-payments.ts'
import { crsTransform } from '../../shared/geo/crs.ts'
import { DURATION_CLASSES, FEE_ACTIVITY_KINDS } from '../../shared/types/fees.ts'
import { freeScreeningSpot } from './network-fixtures.ts'
import { box, day, permitDirs } from './review-fixtures.ts'
import { createTestOrganisation, signedInAgent, startTestApp, unique } from './test-app.ts'
import type { TestApp } from './test-app.ts'

type Agent = ReturnType<TestApp['agent']>

/**
 * The app with online payment pointed at a fake payment server of this test file (in-process,
 * free port), and a street authority of its own whose schedule prices every application
 * submitted while the file runs (FEE_AUTHORITY_ORGANISATION_ID).
 */
export async function startPaymentsTestApp(): Promise<{
  app: TestApp
  fake: FakePayments
  env: Record<string, string>
  authorityId: number
  officer: Awaited<ReturnType<typeof signedInAgent>>
}> {
  const secretKey = `sk_test_${randomBytes(12).toString('hex')}`
  const webhookSecret = `whsec_${randomBytes(16).toString('hex')}`
  const fake = await startFakePayments({ secretKey, webhookSecret })
  const env: Record<string, string> = {
    ...permitDirs(),
    RECEIPT_DIR: join(mkdtempSync(join(tmpdir(), 'tw-receipts-')), 'receipts'),
    STRIPE_SECRET_KEY: secretKey,
    STRIPE_WEBHOOK_SECRET: webhookSecret,
    STRIPE_API_HOST: '127.0.0.1',
    STRIPE_API_PORT: String(fake.port),
    STRIPE_API_PROTOCOL: 'http',
  }
  const app = await startTestApp(env)
  fake.setWebhookUrl(`${app.baseUrl}/api/payments/webhook`)
  const authority = await createTestOrganisation('street_authority', unique('Test Streets Office'))
  env.FEE_AUTHORITY_ORGANISATION_ID = String(authority.id)
  setConfig(parseConfig({ ...inject('testEnv'), ...env }))
  const officer = await signedInAgent(app, 'permit_officer', authority)
  return { app, fake, env, authorityId: authority.id, officer }
}

/** Our own test prices: short works 100.00 + 10.00 per kind step, medium +50.00, long +150.00. */
export function scheduleBody(effectiveFrom: string, overrides: Record<string, unknown> = {}) {
  const classStep = { minor: 0, standard: 5000, major: 15000 }
  return {
    effectiveFrom,
    currency: 'EUR',
    entries: DURATION_CLASSES.flatMap((d) =>
      FEE_ACTIVITY_KINDS.map((k, j) => ({
        durationClass: d,
        activityKind: k,
        amount_cents: 10_000 + classStep[d] + 1000 * j,
      })),
    ),
    variationFee_cents: 4_500,
    extensionFee_cents: 3_000,
    refundBeforeReview_percent: 100,
    refundAfterReview_percent: 50,
    // Invoice by default, so that other test files sharing this database are never blocked.
    defaultPaymentTerms: 'invoice',
    ...overrides,
  }
}

const t = crsTransform(25832)

/** Draft and submit a one-day excavation where no pipe lies; returns the application id. */
export async function submitOneDayExcavation(app: TestApp, agent: Agent): Promise<number> {
  const origin = t.toGrid(await freeScreeningSpot(app.sequelize)) as [number, number]
  const draft = await agent.post('/api/applications').send({
    title: unique('Fee test'),
    siteAddress: '3 Ledger Row, Testbury',
    contactName: 'Pat Payer',
    contactPhone: '+49 170 7654321',
    startsOn: day(7),
    endsOn: day(7),
    description: 'A small pit for the fee tests.',
    activities: [
      {
        kind: 'excavation',
        label: 'Small pit',
        geometry: box(origin, 0, 0, 2, 2),
        depth_m: 1.2,
        support: 'none',
        digging: 'hand-or-vacuum',
      },
    ],
  })
  expect(draft.status).toBe(201)
  const res = await agent.post(`/api/applications/${draft.body.id}/submit`).send({ version: 0 })
  expect(res.status).toBe(200)
  return draft.body.id as number
}

/** Walk the fake's hosted page like a browser: press complete or fail, follow nothing. */
export async function pressOnPayPage(url: string, outcome: 'complete' | 'fail'): Promise<Response> {
  const page = await fetch(url)
  expect(page.status).toBe(200)
  return fetch(`${url}/${outcome}`, { method: 'POST', redirect: 'manual' })
}
