import { randomUUID } from 'node:crypto'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { createApp } from '../../server/app.ts'
import { apiRoutes, fillPath } from '../helpers/api-routes.ts'
import type { ApiRoute } from '../helpers/api-routes.ts'
import { ACTORS, ACTOR_ROLE, buildSecurityFixtures } from '../helpers/security-fixtures.ts'
import type { Actor, SecurityFixtures } from '../helpers/security-fixtures.ts'
import { startTestApp } from '../helpers/test-app.ts'
import type { TestApp } from '../helpers/test-app.ts'

/**
 * Every API route, called by anonymous, each role, and a user of another organisation with the
 * same role, against real rows. The route list comes from Express's router; a route without an
 * entry in MATRIX fails the first test, so a new route cannot ship without its access stated.
 *
 * Other organisations: `otherApplicant` is another contractor, `otherEngineer` the engineer of
 * a network owner whose pipes the works do not touch, `otherOfficer` an officer of another
 * street authority (one permit office per installation: officers are not split by authority,
 * so they see the same as `officer`).
 */

type Fx = SecurityFixtures
type Expect = Partial<Record<Actor, number>>

interface Entry {
  path: (fx: Fx) => Record<string, string | number>
  query?: string
  body?: (fx: Fx) => unknown
  /** Expected status per signed-in actor allowed by the route; others default to 401 / 403. */
  expect: Expect
  /** Extra checks on a 200 body: what an actor of another organisation must not see. */
  check?: (actor: Actor, body: unknown, fx: Fx) => void
}

const ids = (body: unknown): number[] =>
  ((body as { items?: { id: number }[] }).items ?? (body as { id: number }[])).map((x) => x.id)
const all = (status: number): Expect =>
  Object.fromEntries(ACTORS.filter((a) => a !== 'anonymous').map((a) => [a, status]))
const readers = (own: number, other: number): Expect => ({
  applicant: own,
  otherApplicant: other,
  officer: own,
  otherOfficer: own,
  admin: own,
})
const parties = (own: number, other: number): Expect => ({
  ...readers(own, other),
  engineer: own,
  otherEngineer: other,
})
const engineers = (own: number, other: number, admin?: number): Expect => ({
  engineer: own,
  otherEngineer: other,
  ...(admin === undefined ? {} : { admin }),
})
const office = (s: number, admin?: number): Expect => ({
  officer: s,
  otherOfficer: s,
  ...(admin === undefined ? {} : { admin }),
})
const none = () => ({})
const notListing =
  (id: (fx: Fx) => number, who: Actor[]) => (actor: Actor, body: unknown, fx: Fx) => {
    if (who.includes(actor)) expect(ids(body)).not.toContain(id(fx))
    else expect(ids(body)).toContain(id(fx))
  }

const period = () => {
  const d = (n: number) => new Date(Date.now() + n * 86_400_000).toISOString().slice(0, 10)
  return `from=${d(0)}&to=${d(30)}`
}

/** Keyed `METHOD /api/path` exactly as the router lists it. */
const MATRIX: Record<string, Entry> = {
  // Password reset by e-mailed link: public, the same answer whoever asks.
  'POST /api/auth/password-reset/request': {
    path: none,
    // A new address per call, so the per-address limit of 5 requests does not answer instead.
    body: () => ({ email: `nobody-${randomUUID().slice(0, 8)}@example.test` }),
    expect: { ...all(202), anonymous: 202 },
  },
  'POST /api/auth/password-reset/complete': {
    path: none,
    body: () => ({ token: 'x'.repeat(43), password: 'a long new password here' }),
    // An unknown token is refused as a rule, not as malformed input.
    expect: { ...all(422), anonymous: 422 },
  },
  // Payment service events: public, signed by the payment service; this test app has no
  // payment set-up, so every call is refused as unavailable (the signature is tested with the
  // fake payment server in fees-payments.test.ts).
  'POST /api/payments/webhook': {
    path: none,
    body: () => ({ id: 'evt_unsigned', type: 'checkout.session.completed' }),
    expect: { ...all(503), anonymous: 503 },
  },
  // Works on site (by application id) and the crew's site pack.
  'GET /api/site-works/live': { path: none, query: period(), expect: office(200, 200) },
  'GET /api/site-works/:id': {
    path: (fx) => ({ id: fx.grantedId }),
    expect: parties(200, 404),
  },
  'GET /api/site-works/:id/pack': {
    path: (fx) => ({ id: fx.grantedId }),
    expect: parties(200, 404),
  },
  'PUT /api/site-works/:id/checklist': {
    path: (fx) => ({ id: fx.grantedId }),
    body: () => ({}),
    // The body is checked first: a malformed body tells nothing about the application.
    expect: { applicant: 400, otherApplicant: 400 },
  },
  'POST /api/site-works/:id/planned-start': {
    path: (fx) => ({ id: fx.grantedId }),
    body: () => ({}),
    // The body is checked first: a malformed body tells nothing about the application.
    expect: { applicant: 400, otherApplicant: 400 },
  },
  'POST /api/site-works/:id/start': {
    path: (fx) => ({ id: fx.grantedId }),
    body: () => ({ at: 'yesterday' }),
    // The body is checked first: a malformed body tells nothing about the application.
    expect: { applicant: 400, otherApplicant: 400 },
  },
  'POST /api/site-works/:id/finish': {
    path: (fx) => ({ id: fx.grantedId }),
    body: () => ({ at: 'yesterday' }),
    // The body is checked first: a malformed body tells nothing about the application.
    expect: { applicant: 400, otherApplicant: 400 },
  },
  'POST /api/site-works/:id/photos': {
    path: (fx) => ({ id: fx.grantedId }),
    body: () => ({}),
    expect: { applicant: 400, otherApplicant: 404 },
  },
  'GET /api/site-works/:id/photos/:photoId/file': {
    path: (fx) => ({ id: fx.grantedId, photoId: 999_999_999 }),
    expect: parties(404, 404),
  },
  // Requests to change a granted permit.
  'GET /api/change-requests': {
    path: none,
    expect: { ...engineers(200, 200, 200), ...office(200) },
  },
  'GET /api/change-requests/for-application/:id': {
    path: (fx) => ({ id: fx.grantedId }),
    expect: parties(200, 404),
  },
  'POST /api/change-requests/for-application/:id': {
    path: (fx) => ({ id: fx.grantedId }),
    body: () => ({}),
    // The body is checked first: a malformed body tells nothing about the application.
    expect: { applicant: 400, otherApplicant: 400 },
  },
  'GET /api/change-requests/:id': {
    path: () => ({ id: 999_999_999 }),
    expect: parties(404, 404),
  },
  'POST /api/change-requests/:id/review': {
    path: () => ({ id: 999_999_999 }),
    body: () => ({}),
    expect: engineers(400, 400),
  },
  'POST /api/change-requests/:id/decision': {
    path: () => ({ id: 999_999_999 }),
    body: () => ({}),
    expect: office(400),
  },
  'POST /api/change-requests/:id/withdraw': {
    path: () => ({ id: 999_999_999 }),
    body: () => ({}),
    expect: { applicant: 404, otherApplicant: 404 },
  },
  // Emergency works.
  'GET /api/emergency-works': { path: none, expect: parties(200, 200) },
  'POST /api/emergency-works': {
    path: none,
    body: () => ({}),
    expect: { applicant: 400, otherApplicant: 400 },
  },
  'POST /api/emergency-works/:id/follow-up': {
    path: () => ({ id: 999_999_999 }),
    body: () => ({}),
    expect: { applicant: 400, otherApplicant: 400 },
  },
  // Fees, payments and receipts.
  'GET /api/fee-schedules': { path: none, expect: office(200) },
  'POST /api/fee-schedules': { path: none, body: () => ({}), expect: office(400) },
  'GET /api/applications/:id/fees': {
    path: (fx) => ({ id: fx.submittedId }),
    expect: { applicant: 200, otherApplicant: 404, officer: 200, otherOfficer: 200, admin: 200 },
  },
  'PUT /api/applications/:id/fees/terms': {
    path: (fx) => ({ id: fx.submittedId }),
    body: () => ({}),
    expect: office(400),
  },
  'POST /api/fees/:id/checkout': {
    path: () => ({ id: 999_999_999 }),
    body: () => ({}),
    expect: { applicant: 404, otherApplicant: 404 },
  },
  'POST /api/fees/:id/confirm': {
    path: () => ({ id: 999_999_999 }),
    body: () => ({}),
    expect: { applicant: 404, otherApplicant: 404 },
  },
  'POST /api/fees/:id/refund': {
    path: () => ({ id: 999_999_999 }),
    body: () => ({}),
    expect: office(404),
  },
  'POST /api/fees/:id/record-payment': {
    path: () => ({ id: 999_999_999 }),
    body: () => ({}),
    expect: office(400),
  },
  'POST /api/fees/:id/record-refund': {
    path: () => ({ id: 999_999_999 }),
    body: () => ({}),
    expect: office(400),
  },
  'GET /api/receipts/:id/document': {
    path: () => ({ id: 999_999_999 }),
    expect: { applicant: 404, otherApplicant: 404, officer: 404, otherOfficer: 404, admin: 404 },
  },
  'GET /api/health': { path: none, expect: { ...all(200), anonymous: 200 } },
  'POST /api/auth/sign-in': {
    path: none,
    body: () => ({ email: 'nobody@example.test', password: 'not the password' }),
    expect: all(401),
  },
  'GET /api/auth/me': { path: none, expect: all(200) },
  'GET /api/home': { path: none, expect: all(200) },
  'GET /api/admin/organisations': { path: none, expect: { admin: 200 } },
  'POST /api/admin/organisations': { path: none, body: () => ({}), expect: { admin: 400 } },
  'GET /api/admin/users': { path: none, expect: { admin: 200 } },
  'POST /api/admin/users': { path: none, body: () => ({}), expect: { admin: 400 } },
  'PATCH /api/admin/users/:id': {
    path: (fx) => ({ id: fx.targetUserId }),
    body: () => ({ name: 'Renamed Tester' }),
    expect: { admin: 200 },
  },
  'GET /api/admin/audit': { path: none, expect: { admin: 200 } },
  'GET /api/admin/mail': { path: none, expect: { admin: 404 } },
  'GET /api/applications/:id/attachments': {
    path: (fx) => ({ id: fx.submittedId }),
    expect: parties(200, 404),
    check: (actor, body, fx) => expect(ids(body)).toEqual([fx.attachmentId]),
  },
  'POST /api/applications/:id/attachments': {
    path: (fx) => ({ id: fx.draftId }),
    body: () => ({}),
    expect: { applicant: 400, otherApplicant: 404 },
  },
  'GET /api/applications/:id/attachments/:attachmentId/file': {
    path: (fx) => ({ id: fx.submittedId, attachmentId: fx.attachmentId }),
    expect: parties(200, 404),
  },
  'GET /api/applications': {
    path: none,
    expect: readers(200, 200),
    check: notListing((fx) => fx.submittedId, ['otherApplicant']),
  },
  'POST /api/applications': {
    path: none,
    body: () => ({}),
    expect: { applicant: 400, otherApplicant: 400 },
  },
  'GET /api/applications/:id': {
    path: (fx) => ({ id: fx.submittedId }),
    expect: readers(200, 404),
  },
  'GET /api/applications/:id/screening': {
    path: (fx) => ({ id: fx.submittedId }),
    expect: readers(200, 404),
  },
  'PUT /api/applications/:id': {
    path: (fx) => ({ id: fx.draftId }),
    body: (fx) => ({ ...fx.fullDraft('Draft pit, revised'), version: 0 }),
    expect: { applicant: 200, otherApplicant: 404 },
  },
  'POST /api/applications/:id/submit': {
    path: (fx) => ({ id: fx.spareDraftId }),
    body: () => ({ version: 999 }),
    expect: { applicant: 409, otherApplicant: 404 },
  },
  'GET /api/applications/:id/reviews': {
    path: (fx) => ({ id: fx.submittedId }),
    expect: readers(200, 404),
  },
  'POST /api/applications/:id/reviews/:reviewId/answer': {
    path: (fx) => ({ id: fx.submittedId, reviewId: fx.reviewId }),
    body: () => ({ body: 'The pit is hand dug near the main.' }),
    expect: { applicant: 422, otherApplicant: 404 },
  },
  'GET /api/applications/:id/permits': {
    path: (fx) => ({ id: fx.grantedId }),
    expect: parties(200, 404),
    check: (actor, body, fx) =>
      expect((body as { permits: { id: number }[] }).permits.map((p) => p.id)).toEqual([
        fx.permitId,
      ]),
  },
  'GET /api/applications/:id/history': {
    path: (fx) => ({ id: fx.submittedId }),
    expect: parties(200, 404),
  },
  'GET /api/reviews': {
    path: none,
    query: 'state=all&pageSize=500',
    expect: engineers(200, 200),
    check: notListing((fx) => fx.reviewId, ['otherEngineer']),
  },
  'GET /api/reviews/:id': { path: (fx) => ({ id: fx.reviewId }), expect: engineers(200, 404) },
  'POST /api/reviews/:id/decision': {
    path: (fx) => ({ id: fx.reviewId }),
    body: () => ({ decision: 'accepted', version: 999 }),
    expect: engineers(409, 404),
  },
  'POST /api/reviews/:id/segments/:assessmentId/rerun': {
    path: (fx) => ({ id: fx.reviewId, assessmentId: fx.assessmentId }),
    body: () => ({}),
    expect: engineers(400, 400),
  },
  'GET /api/condition-templates': {
    path: none,
    expect: engineers(200, 200),
    check: notListing((fx) => fx.templateId, ['otherEngineer']),
  },
  'POST /api/condition-templates': { path: none, body: () => ({}), expect: engineers(400, 400) },
  'GET /api/condition-templates/:id': {
    path: (fx) => ({ id: fx.templateId }),
    expect: engineers(200, 404),
  },
  'PUT /api/condition-templates/:id': {
    path: (fx) => ({ id: fx.templateId }),
    body: (fx) => ({
      code: fx.templateCode,
      title: 'Keep plant clear of the main',
      text: 'Keep plant well clear of the main.',
      version: 999,
    }),
    expect: engineers(409, 404),
  },
  'GET /api/permit-office/queue': {
    path: none,
    query: 'status=all&pageSize=500',
    expect: office(200, 200),
  },
  'GET /api/permit-office/applications/:id': {
    path: (fx) => ({ id: fx.submittedId }),
    expect: office(200, 200),
  },
  'GET /api/permit-office/applications/:id/decision-draft': {
    path: (fx) => ({ id: fx.submittedId }),
    expect: office(200, 200),
  },
  'POST /api/permit-office/applications/:id/grant': {
    path: (fx) => ({ id: fx.submittedId }),
    // The water owner has not decided yet: the grant is refused as a domain rule.
    body: () => ({ version: 999 }),
    expect: office(422),
  },
  'POST /api/permit-office/applications/:id/refuse': {
    path: (fx) => ({ id: fx.submittedId }),
    body: () => ({ version: 999, reasons: 'The pit is too close.' }),
    expect: office(409),
  },
  'GET /api/permits/:id': { path: (fx) => ({ id: fx.permitId }), expect: parties(200, 404) },
  'GET /api/permits/:id/document': {
    path: (fx) => ({ id: fx.permitId }),
    expect: parties(200, 404),
  },
  'POST /api/permits/:id/extend': {
    path: (fx) => ({ id: fx.permitId }),
    body: () => ({}),
    expect: office(400),
  },
  'POST /api/permits/:id/vary': {
    path: (fx) => ({ id: fx.permitId }),
    body: () => ({}),
    expect: office(400),
  },
  'POST /api/permits/:id/revoke': {
    path: (fx) => ({ id: fx.permitId }),
    body: () => ({}),
    expect: office(400),
  },
  'GET /api/coordination/works': { path: none, query: period(), expect: office(200, 200) },
  'GET /api/coordination/clashes': { path: none, query: period(), expect: office(200, 200) },
  'GET /api/coordination/timeline': { path: none, query: period(), expect: office(200, 200) },
  'GET /api/verify/:code': {
    path: (fx) => ({ code: fx.verificationCode }),
    expect: { ...all(200), anonymous: 200 },
  },
  'POST /api/verify/:code/document': {
    path: (fx) => ({ code: fx.verificationCode }),
    body: () => ({}),
    expect: { ...all(400), anonymous: 400 },
  },
  'GET /api/streets': { path: none, expect: all(200) },
  'GET /api/map/settings': { path: none, expect: all(200) },
  'GET /api/network/outline': {
    path: none,
    query: 'bbox=9.85,52.55,10.05,52.65',
    expect: all(200),
  },
  'GET /api/network/segments': {
    path: none,
    query: 'pageSize=500&sort=ownerRef',
    expect: engineers(200, 200, 200),
    check: notListing((fx) => fx.segmentId, ['otherEngineer']),
  },
  'GET /api/network/map-lines': {
    path: none,
    query: 'zoom=18&bbox=9.85,52.55,10.05,52.65',
    expect: engineers(200, 200, 200),
  },
  'GET /api/network/segments/:id': {
    path: (fx) => ({ id: fx.segmentId }),
    expect: engineers(200, 404, 200),
  },
  'PATCH /api/network/segments/:id': {
    path: (fx) => ({ id: fx.segmentId }),
    body: () => ({ version: 999, coverStart_m: 1.25 }),
    expect: engineers(409, 404),
  },
  'GET /api/network/export': { path: none, expect: engineers(200, 200, 200) },
  'GET /api/network/mapping': { path: none, expect: engineers(200, 200) },
  // Each owner saves its own mapping (every field has a default).
  'PUT /api/network/mapping': { path: none, body: () => ({}), expect: engineers(200, 200) },
  'POST /api/network/imports': { path: none, body: () => ({}), expect: engineers(400, 400) },
  'GET /api/network/imports': {
    path: none,
    query: 'pageSize=100',
    expect: engineers(200, 200, 200),
    check: notListing((fx) => fx.importId, ['otherEngineer']),
  },
  'GET /api/network/imports/:id': {
    path: (fx) => ({ id: fx.importId }),
    expect: engineers(200, 404, 200),
  },
  'GET /api/network/imports/:id/preview': {
    path: (fx) => ({ id: fx.importId }),
    expect: engineers(200, 404),
  },
  'POST /api/network/imports/:id/validate': {
    path: (fx) => ({ id: fx.importId }),
    body: () => ({}),
    expect: engineers(409, 404),
  },
  'GET /api/network/imports/:id/report': {
    path: (fx) => ({ id: fx.importId }),
    expect: engineers(200, 404, 200),
  },
  'POST /api/network/imports/:id/commit': {
    path: (fx) => ({ id: fx.importId }),
    // Already committed: a domain rule for the owner, not found for anyone else.
    body: () => ({ skipInvalid: false }),
    expect: engineers(422, 404),
  },
  // State-changing calls of the table's own rows: run after every other entry.
  'DELETE /api/condition-templates/:id': {
    path: (fx) => ({ id: fx.templateId }),
    expect: engineers(204, 404),
  },
  'DELETE /api/applications/:id/attachments/:attachmentId': {
    path: (fx) => ({ id: fx.draftId, attachmentId: fx.draftAttachmentId }),
    expect: { applicant: 204, otherApplicant: 404 },
  },
  'POST /api/applications/:id/withdraw': {
    path: (fx) => ({ id: fx.spareDraftId }),
    body: () => ({ reason: 'Plans changed.' }),
    expect: { applicant: 200, otherApplicant: 404 },
  },
  'POST /api/auth/sign-out': {
    path: none,
    body: () => ({}),
    expect: { ...all(204), anonymous: 204 },
  },
}

/** What each actor must get: the table's entry, else 401 for anonymous and 403 for the rest. */
function expectedStatus(route: ApiRoute, entry: Entry, actor: Actor): number {
  const given = entry.expect[actor]
  if (given !== undefined) return given
  return actor === 'anonymous' ? 401 : 403
}

let app: TestApp
let fx: Fx
let routes: ApiRoute[]
beforeAll(async () => {
  app = await startTestApp()
  const probe = createApp(app.config, app.sequelize)
  routes = apiRoutes(probe.app)
  probe.close()
  fx = await buildSecurityFixtures(app)
}, 180_000)
afterAll(async () => {
  await app?.close()
})

describe('the access matrix', () => {
  it('has one entry for every API route the router holds, and none for a route that is gone', () => {
    const keys = routes.map((r) => r.key)
    expect(keys.length).toBeGreaterThan(60)
    expect(new Set(keys).size).toBe(keys.length)
    expect(
      keys.filter((k) => !(k in MATRIX)),
      'routes without an entry',
    ).toEqual([])
    expect(
      Object.keys(MATRIX).filter((k) => !keys.includes(k)),
      'entries without a route',
    ).toEqual([])
  })

  it('agrees with the access each route declares with allow(...)', () => {
    for (const route of routes) {
      const entry = MATRIX[route.key]
      if (!entry) continue
      expect(route.access, route.key).toBeDefined()
      for (const actor of ACTORS) {
        const role = ACTOR_ROLE[actor]
        const status = expectedStatus(route, entry, actor)
        const access = route.access!
        if (access === 'public') continue
        if (role === null) expect(status, `${route.key} as ${actor}`).toBe(401)
        else if (access !== 'signed-in' && !access.includes(role))
          expect(status, `${route.key} as ${actor}`).toBe(403)
        else expect([401, 403], `${route.key} as ${actor}`).not.toContain(status)
      }
    }
  })

  // Entries run in the table's order, so the state-changing ones at its end run last.
  for (const [key, entry] of Object.entries(MATRIX)) {
    it(`${key}: each caller gets the expected status`, async () => {
      const route = routes.find((r) => r.key === key)
      expect(route, `${key} is not a route`).toBeDefined()
      const url = fillPath(route!.path, entry.path(fx)) + (entry.query ? `?${entry.query}` : '')
      // Callers outside the route's party first, the allowed own-organisation caller last.
      const order = [...ACTORS].sort(
        (a, b) =>
          Number(expectedStatus(route!, entry, a) < 300) -
          Number(expectedStatus(route!, entry, b) < 300),
      )
      const got: Record<string, number> = {}
      const want: Record<string, number> = {}
      for (const actor of order) {
        const agent = fx.agents[actor]
        const method = route!.method.toLowerCase() as 'get' | 'post' | 'put' | 'patch' | 'delete'
        const req = agent[method](url)
        const res = entry.body ? await req.send(entry.body(fx) as object) : await req
        got[actor] = res.status
        want[actor] = expectedStatus(route!, entry, actor)
        if (res.status >= 400) {
          expect(res.body.error, `${key} as ${actor}`).toMatchObject({
            code: expect.any(String),
            message: expect.any(String),
            requestId: expect.any(String),
          })
        }
        if (res.status === 200 && entry.check) entry.check(actor, res.body, fx)
      }
      expect(got, `got ${JSON.stringify(got)}`).toEqual(want)
    })
  }
})
