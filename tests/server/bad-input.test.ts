import fc from 'fast-check'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import type { z } from 'zod'
import { createApp } from '../../server/app.ts'
import {
  createOrganisationSchema,
  createUserSchema,
  updateUserSchema,
} from '../../shared/schemas/auth.ts'
import {
  applicationDraftSchema,
  applicationUpdateSchema,
} from '../../shared/schemas/application.ts'
import {
  conditionTemplateInputSchema,
  conditionTemplateUpdateSchema,
} from '../../shared/schemas/condition-templates.ts'
import { importMappingSchema } from '../../shared/schemas/import-mapping.ts'
import {
  extendPermitSchema,
  grantPermitSchema,
  refuseApplicationSchema,
  revokePermitSchema,
  varyPermitSchema,
} from '../../shared/schemas/permits.ts'
import { pipeSegmentEditSchema } from '../../shared/schemas/pipe-segment.ts'
import {
  reviewAnswerSchema,
  reviewDecisionSchema,
  segmentRerunSchema,
} from '../../shared/schemas/reviews.ts'
import { importCommitSchema } from '../../shared/schemas/network-query.ts'
import { z as zod } from 'zod'
import { passwordResetRequestSchema, passwordResetSchema } from '../../shared/schemas/auth.ts'
import {
  feeScheduleInputSchema,
  offlineMovementInputSchema,
  paymentTermsInputSchema,
} from '../../shared/schemas/fees.ts'
import {
  changeRequestDecisionSchema,
  changeRequestSchema,
  changeReviewDecisionSchema,
  emergencyFollowUpSchema,
  emergencyWorksSchema,
  plannedStartSchema,
  siteChecklistSchema,
  siteEventSchema,
} from '../../shared/schemas/site-works.ts'
import { apiRoutes, fillPath } from '../helpers/api-routes.ts'
import type { ApiRoute } from '../helpers/api-routes.ts'
import {
  anyBody,
  badValue,
  brokenJson,
  brokenMultipart,
  fieldsBody,
  multipartBody,
  mutated,
  notADocument,
} from '../helpers/bad-input.ts'
import type { MultipartBody } from '../helpers/bad-input.ts'
import { TINY_PDF, buildSecurityFixtures } from '../helpers/security-fixtures.ts'
import type { SecurityFixtures } from '../helpers/security-fixtures.ts'
import { tableChecksums } from '../helpers/table-checksums.ts'
import { startTestApp } from '../helpers/test-app.ts'
import type { TestApp } from '../helpers/test-app.ts'

/**
 * Property-based bad input: every write route of the router gets at least BODIES generated
 * bodies from a caller allowed to call it. Each answer must be a 4xx in our error envelope,
 * never a 5xx, and no table may change (CHECKSUM TABLE before and after each route). Bodies
 * that the route's own shared schema accepts are not counted as bad (the route could rightly
 * take them); bodies that are valid in shape but wrong in substance (a stale version, an
 * unknown id) are listed per route and must fail too.
 */

const BODIES = 1000
const PARALLEL = 8
const SEED = 20261203

type Fx = SecurityFixtures
type Caller = 'anonymous' | 'applicant' | 'engineer' | 'officer' | 'admin'
type Sent =
  | { kind: 'json'; body: unknown }
  | { kind: 'raw'; text: string; type: string }
  | { kind: 'multipart'; body: MultipartBody }
  | { kind: 'params'; params: Record<string, string> }

interface Fuzz {
  caller: Caller
  params: (fx: Fx) => Record<string, string | number>
  /** The route's own schema: generated bodies it accepts are skipped, not sent. */
  schema?: z.ZodType
  /** A valid body to mutate field by field. */
  base?: (fx: Fx) => unknown
  /** Field names for bodies built from them. */
  fields?: readonly string[]
  /** Bodies valid in shape that must still be refused (stale version, unknown id...). */
  wrongInSubstance?: (fx: Fx) => unknown[]
  /** Multipart routes: the generator of parts. */
  multipart?: fc.Arbitrary<MultipartBody>
  /** Routes that read no body: fuzz these path parameters instead. */
  fuzzParams?: (fx: Fx) => { name: string; keep: Record<string, string | number>; not: number }
  /** The status a request with any body gets when the route reads no body. */
  anyBodyStatus?: number
  /** Tables a refused request may still change (the audit of failed sign-ins). */
  mayChange?: string[]
}

const validDraft = (fx: Fx) => fx.fullDraft('Fuzz pit')
const hugeId = fc.constantFrom(2 ** 31, 2 ** 53 - 1, 99999999, 2147483647)

/** The top-level field names of an object schema (refined ones keep theirs under `.shape` too). */
const keysOf = (schema: z.ZodType): string[] => {
  const shape = (schema as unknown as { shape?: Record<string, unknown> }).shape
  return shape ? Object.keys(shape) : []
}
/** An entry for a JSON route checked by its shared schema; `id` fills every path parameter. */
const bySchema = (
  caller: Caller,
  schema: z.ZodType,
  params: (fx: Fx) => Record<string, string | number> = () => ({}),
): Fuzz => ({ caller, params, schema, fields: keysOf(schema) })
const NO_ROW = 999_999_999

const FUZZ: Record<string, Fuzz> = {
  // Password reset, payments, fees, works on site, change requests and emergencies.
  'POST /api/auth/password-reset/request': bySchema('anonymous', passwordResetRequestSchema),
  'POST /api/auth/password-reset/complete': bySchema('anonymous', passwordResetSchema),
  'POST /api/payments/webhook': { caller: 'anonymous', params: () => ({}) },
  'POST /api/fee-schedules': bySchema('officer', feeScheduleInputSchema),
  'PUT /api/applications/:id/fees/terms': bySchema('officer', paymentTermsInputSchema, (fx) => ({
    id: fx.submittedId,
  })),
  'POST /api/fees/:id/checkout': { caller: 'applicant', params: () => ({ id: NO_ROW }) },
  'POST /api/fees/:id/confirm': { caller: 'applicant', params: () => ({ id: NO_ROW }) },
  'POST /api/fees/:id/refund': { caller: 'officer', params: () => ({ id: NO_ROW }) },
  'POST /api/fees/:id/record-payment': bySchema('officer', offlineMovementInputSchema, () => ({
    id: NO_ROW,
  })),
  'POST /api/fees/:id/record-refund': bySchema('officer', offlineMovementInputSchema, () => ({
    id: NO_ROW,
  })),
  'PUT /api/site-works/:id/checklist': bySchema('applicant', siteChecklistSchema, (fx) => ({
    id: fx.submittedId,
  })),
  'POST /api/site-works/:id/planned-start': bySchema('applicant', plannedStartSchema, (fx) => ({
    id: fx.submittedId,
  })),
  'POST /api/site-works/:id/start': bySchema('applicant', siteEventSchema, (fx) => ({
    id: fx.submittedId,
  })),
  'POST /api/site-works/:id/finish': bySchema('applicant', siteEventSchema, (fx) => ({
    id: fx.submittedId,
  })),
  'POST /api/site-works/:id/photos': {
    caller: 'applicant',
    params: (fx) => ({ id: fx.submittedId }),
    multipart: multipartBody({ fieldNames: ['kind'], bytes: notADocument }),
  },
  'POST /api/change-requests/for-application/:id': bySchema(
    'applicant',
    changeRequestSchema,
    (fx) => ({ id: fx.submittedId }),
  ),
  'POST /api/change-requests/:id/review': bySchema('engineer', changeReviewDecisionSchema, () => ({
    id: NO_ROW,
  })),
  'POST /api/change-requests/:id/decision': bySchema(
    'officer',
    changeRequestDecisionSchema,
    () => ({ id: NO_ROW }),
  ),
  'POST /api/change-requests/:id/withdraw': { caller: 'applicant', params: () => ({ id: NO_ROW }) },
  'POST /api/emergency-works': bySchema('applicant', emergencyWorksSchema),
  'POST /api/emergency-works/:id/follow-up': bySchema('applicant', emergencyFollowUpSchema, () => ({
    id: NO_ROW,
  })),
  'POST /api/auth/sign-in': {
    caller: 'anonymous',
    params: () => ({}),
    base: () => ({ email: 'nobody@example.test', password: 'not the password' }),
    fields: ['email', 'password'],
    wrongInSubstance: () => [
      { email: 'nobody@example.test', password: 'x' },
      { email: 'NOBODY@EXAMPLE.TEST ', password: 'x'.repeat(200) },
    ],
    mayChange: ['audit_events'],
  },
  'POST /api/auth/sign-out': { caller: 'anonymous', params: () => ({}), anyBodyStatus: 204 },
  'POST /api/admin/organisations': {
    caller: 'admin',
    params: () => ({}),
    schema: createOrganisationSchema,
    base: () => ({ name: 'Fuzz Civil Works', kind: 'contractor', medium: null }),
    fields: ['name', 'kind', 'medium'],
  },
  'POST /api/admin/users': {
    caller: 'admin',
    params: () => ({}),
    schema: createUserSchema,
    base: (fx) => ({
      email: 'fuzz.user@example.test',
      name: 'Fuzz User',
      role: 'applicant',
      organisationId: fx.users.applicant.organisationId,
      password: 'a long enough password',
    }),
    fields: ['email', 'name', 'role', 'organisationId', 'password'],
    wrongInSubstance: (fx) => [
      ...[2 ** 31, 2 ** 53 - 1, 99999999].map((organisationId) => ({
        email: 'fuzz.user@example.test',
        name: 'Fuzz User',
        role: 'applicant',
        organisationId,
        password: 'a long enough password',
      })),
      {
        email: fx.users.applicant.email,
        name: 'Taken Address',
        role: 'applicant',
        organisationId: fx.users.applicant.organisationId,
        password: 'a long enough password',
      },
    ],
  },
  'PATCH /api/admin/users/:id': {
    caller: 'admin',
    params: (fx) => ({ id: fx.targetUserId }),
    schema: updateUserSchema,
    base: () => ({
      name: 'Renamed',
      role: 'applicant',
      active: true,
      password: 'long enough pw 1',
    }),
    fields: ['name', 'role', 'active', 'password'],
  },
  'POST /api/applications/:id/attachments': {
    caller: 'applicant',
    params: (fx) => ({ id: fx.draftId }),
    multipart: fc.oneof(
      multipartBody({
        fieldNames: ['kind'],
        fieldValues: fc.constantFrom('method_statement', 'drawing', 'lift_plan', 'photo'),
        bytes: notADocument,
      }),
      multipartBody({ fieldNames: ['kind'], bytes: fc.constant(new Uint8Array(TINY_PDF)) }).filter(
        (b) => !b.fields.some(([k, v]) => k === 'kind' && /^[a-z_]+$/.test(v)),
      ),
    ),
  },
  'DELETE /api/applications/:id/attachments/:attachmentId': {
    caller: 'applicant',
    params: (fx) => ({ id: fx.draftId, attachmentId: fx.draftAttachmentId }),
    fuzzParams: (fx) => ({
      name: 'attachmentId',
      keep: { id: fx.draftId },
      not: fx.draftAttachmentId,
    }),
  },
  'POST /api/applications': {
    caller: 'applicant',
    params: () => ({}),
    schema: applicationDraftSchema,
    base: validDraft,
    fields: Object.keys(applicationDraftSchema.shape),
  },
  'PUT /api/applications/:id': {
    caller: 'applicant',
    params: (fx) => ({ id: fx.draftId }),
    schema: applicationUpdateSchema,
    base: (fx) => ({ ...validDraft(fx), version: 0 }),
    fields: Object.keys(applicationUpdateSchema.shape),
    wrongInSubstance: (fx) => [{ ...validDraft(fx), version: 999 }],
  },
  'POST /api/applications/:id/submit': {
    caller: 'applicant',
    params: (fx) => ({ id: fx.spareDraftId }),
    schema: zod.object({ version: zod.number().int().min(0) }),
    base: () => ({ version: 0 }),
    fields: ['version'],
    wrongInSubstance: () => [{ version: 999 }, { version: 2 ** 53 - 1 }],
  },
  'POST /api/applications/:id/withdraw': {
    caller: 'applicant',
    params: (fx) => ({ id: fx.spareDraftId }),
    schema: zod.object({ reason: zod.string().trim().max(1000).optional() }),
    base: () => ({ reason: 'Plans changed.' }),
    fields: ['reason'],
  },
  'POST /api/applications/:id/reviews/:reviewId/answer': {
    caller: 'applicant',
    params: (fx) => ({ id: fx.submittedId, reviewId: fx.reviewId }),
    schema: reviewAnswerSchema,
    base: () => ({ body: 'It is dug by hand.' }),
    fields: ['body'],
    // No question is open.
    wrongInSubstance: () => [{ body: 'An answer nobody asked for.' }],
  },
  'POST /api/reviews/:id/decision': {
    caller: 'engineer',
    params: (fx) => ({ id: fx.reviewId }),
    schema: reviewDecisionSchema,
    base: (fx) => ({
      decision: 'accepted_with_conditions',
      version: 0,
      reasons: 'Acceptable with care.',
      conditions: [
        { source: 'library', code: 'keep-clear', templateId: fx.templateId },
        { source: 'own', code: 'hand-dig', text: 'Dig by hand within 1 m.', parameters: { a: 1 } },
      ],
    }),
    fields: ['decision', 'version', 'reasons', 'conditions', 'question'],
    wrongInSubstance: () => [
      { decision: 'accepted', version: 999 },
      { decision: 'objected', version: 2 ** 53 - 1, reasons: 'Too close.' },
    ],
  },
  'POST /api/reviews/:id/segments/:assessmentId/rerun': {
    caller: 'engineer',
    params: (fx) => ({ id: fx.reviewId, assessmentId: fx.assessmentId }),
    schema: segmentRerunSchema,
    fields: ['pipe', 'note'],
  },
  'POST /api/condition-templates': {
    caller: 'engineer',
    params: () => ({}),
    schema: conditionTemplateInputSchema,
    base: () => ({
      code: 'fuzz-rule',
      title: 'Fuzz rule',
      text: 'Keep {distance_m} m clear.',
      parameters: [{ name: 'distance_m', label: 'Distance', unit: 'm', default: 2, min: 0 }],
    }),
    fields: ['code', 'title', 'text', 'parameters', 'active'],
  },
  'PUT /api/condition-templates/:id': {
    caller: 'engineer',
    params: (fx) => ({ id: fx.templateId }),
    schema: conditionTemplateUpdateSchema,
    base: (fx) => ({
      code: fx.templateCode,
      title: 'Fuzz rule',
      text: 'Keep {distance_m} m clear.',
      parameters: [{ name: 'distance_m', label: 'Distance', unit: 'm', default: 2 }],
      version: 0,
    }),
    fields: ['code', 'title', 'text', 'parameters', 'active', 'version'],
    wrongInSubstance: (fx) => [
      { code: fx.templateCode, title: 'Stale', text: 'Keep clear.', version: 999 },
    ],
  },
  'DELETE /api/condition-templates/:id': {
    caller: 'engineer',
    params: (fx) => ({ id: fx.templateId }),
    fuzzParams: (fx) => ({ name: 'id', keep: {}, not: fx.templateId }),
  },
  'POST /api/permit-office/applications/:id/grant': {
    caller: 'officer',
    params: (fx) => ({ id: fx.submittedId }),
    schema: grantPermitSchema,
    base: () => ({
      version: 1,
      validFrom: '2027-03-01',
      validTo: '2027-03-31',
      conditions: [{ code: 'c1', text: 'Keep clear.', ownerOrganisationId: 1 }],
      note: 'Fuzz',
    }),
    fields: ['version', 'validFrom', 'validTo', 'conditions', 'note'],
    // The owner has not decided yet.
    wrongInSubstance: () => [{ version: 1 }, { version: 999 }],
  },
  'POST /api/permit-office/applications/:id/refuse': {
    caller: 'officer',
    params: (fx) => ({ id: fx.submittedId }),
    schema: refuseApplicationSchema,
    base: () => ({ version: 1, reasons: 'Too close to the main.' }),
    fields: ['version', 'reasons'],
    wrongInSubstance: () => [{ version: 999, reasons: 'Stale version.' }],
  },
  'POST /api/permits/:id/extend': {
    caller: 'officer',
    params: (fx) => ({ id: fx.permitId }),
    schema: extendPermitSchema,
    base: () => ({ validTo: '2027-12-31', reason: 'Weather.' }),
    fields: ['validTo', 'reason'],
    // An end before the permit starts is no extension.
    wrongInSubstance: () => [{ validTo: '2000-01-01', reason: 'Into the past.' }],
  },
  'POST /api/permits/:id/vary': {
    caller: 'officer',
    params: (fx) => ({ id: fx.permitId }),
    schema: varyPermitSchema,
    base: () => ({ conditions: [{ code: 'c1', text: 'Keep clear.' }], reason: 'New rule.' }),
    fields: ['conditions', 'reason'],
  },
  'POST /api/permits/:id/revoke': {
    caller: 'officer',
    params: (fx) => ({ id: fx.permitId }),
    schema: revokePermitSchema,
    base: () => ({ reason: 'Unsafe.' }),
    fields: ['reason'],
  },
  'POST /api/verify/:code/document': {
    caller: 'anonymous',
    params: (fx) => ({ code: fx.verificationCode }),
    multipart: multipartBody({ fieldNames: ['file'], bytes: notADocument }),
  },
  'PATCH /api/network/segments/:id': {
    caller: 'engineer',
    params: (fx) => ({ id: fx.segmentId }),
    schema: pipeSegmentEditSchema,
    base: (fx) => ({
      version: fx.segmentVersion,
      coverStart_m: 1.3,
      material: 'PE100',
      geometry: {
        type: 'LineString',
        coordinates: [
          [9.95, 52.6],
          [9.951, 52.6],
        ],
      },
    }),
    fields: ['version', 'coverStart_m', 'coverEnd_m', 'material', 'geometry', 'outerDiameter_m'],
    wrongInSubstance: () => [{ version: 999, coverStart_m: 1.3 }],
  },
  'PUT /api/network/mapping': {
    caller: 'engineer',
    params: () => ({}),
    schema: importMappingSchema,
    base: () => ({
      fields: { coverStart_m: 'COVER' },
      diameterUnit: 'mm',
      pressureUnit: 'bar',
      materialValues: { PE: 'PE100' },
      mediumValues: { TW: 'water' },
      defaultMedium: 'water',
      csv: { delimiter: ';', wktColumn: 'WKT', decimalComma: true },
    }),
    fields: ['fields', 'diameterUnit', 'pressureUnit', 'materialValues', 'csv', 'defaultMedium'],
  },
  'POST /api/network/imports': {
    caller: 'engineer',
    params: () => ({}),
    multipart: multipartBody({
      fieldNames: ['format'],
      fieldValues: fc.oneof(
        fc.constantFrom('shp', 'kml', 'GEOJSONX', ' '),
        fc.string({ maxLength: 10 }),
      ),
      bytes: fc.uint8Array({ maxLength: 2000 }),
      filenames: fc.constantFrom('net.shp', 'net', '../../net.kml', 'net.geojson.exe', ''),
    }).filter((b) =>
      b.fields.every(
        ([k, v]) => k !== 'format' || !['geojson', 'csv', ''].includes(v.trim().toLowerCase()),
      ),
    ),
  },
  'POST /api/network/imports/:id/validate': {
    caller: 'engineer',
    params: (fx) => ({ id: fx.importId }),
    // Already committed: whatever the body, the validation is refused.
    fields: ['skipInvalid', 'format'],
  },
  'POST /api/network/imports/:id/commit': {
    caller: 'engineer',
    params: (fx) => ({ id: fx.importId }),
    schema: importCommitSchema,
    base: () => ({ skipInvalid: true }),
    fields: ['skipInvalid'],
    wrongInSubstance: () => [{ skipInvalid: true }, { skipInvalid: false }],
  },
}

/** `count` bodies for a route, skipping those its schema accepts. */
function bodiesFor(fuzz: Fuzz, fx: Fx, count: number, seed: number): Sent[] {
  if (fuzz.fuzzParams) {
    const p = fuzz.fuzzParams(fx)
    const arb = fc
      .oneof(
        fc.string({ maxLength: 20 }),
        fc.constantFrom('0', '-1', '1.5', 'NaN', '1e309', '9007199254740993', '..', '%2e%2e', ' '),
        fc.integer({ min: 1, max: 2 ** 31 }).map(String),
        hugeId.map(String),
      )
      .filter((s) => s.length > 0 && Number(s.trim()) !== p.not)
    return fc
      .sample(arb, { numRuns: count, seed })
      .map((v) => ({ kind: 'params', params: { ...p.keep, [p.name]: v } }) as Sent)
  }
  const base = fuzz.base?.(fx)
  const jsonArb = fc.oneof(
    { weight: 2, arbitrary: anyBody },
    { weight: base === undefined ? 0 : 5, arbitrary: base === undefined ? anyBody : mutated(base) },
    { weight: fuzz.fields ? 3 : 0, arbitrary: fuzz.fields ? fieldsBody(fuzz.fields) : anyBody },
    badValue,
  )
  const accepted = (b: unknown) => fuzz.schema !== undefined && fuzz.schema.safeParse(b).success
  const out: Sent[] = (fuzz.wrongInSubstance?.(fx) ?? []).map((body) => ({ kind: 'json', body }))
  const raw = fc.sample(brokenJson, { numRuns: Math.ceil(count / 20), seed })
  out.push(...raw.map((text) => ({ kind: 'raw', text, type: 'application/json' }) as Sent))
  if (fuzz.multipart) {
    const mp = fc.sample(fuzz.multipart, { numRuns: Math.ceil(count * 0.6), seed })
    out.push(...mp.map((body) => ({ kind: 'multipart', body }) as Sent))
    const broken = fc.sample(brokenMultipart, { numRuns: Math.ceil(count / 10), seed })
    out.push(
      ...broken.map(
        (text) => ({ kind: 'raw', text, type: 'multipart/form-data; boundary=b' }) as Sent,
      ),
    )
  }
  let s = seed
  while (out.length < count) {
    for (const body of fc.sample(jsonArb, { numRuns: 200, seed: s++ })) {
      if (out.length >= count) break
      if (JSON.stringify(body) === undefined || accepted(body)) continue
      out.push({ kind: 'json', body })
    }
  }
  return out
}

let app: TestApp
let fx: Fx
let routes: ApiRoute[]
let cookies: Record<Caller, string>

async function signInCookie(email: string, password: string): Promise<string> {
  const res = await fetch(`${app.baseUrl}/api/auth/sign-in`, {
    method: 'POST',
    headers: { 'content-type': 'application/json', 'x-trenchward-client': '1' },
    body: JSON.stringify({ email, password }),
  })
  expect(res.status).toBe(200)
  return res.headers
    .getSetCookie()
    .map((c) => c.split(';')[0])
    .join('; ')
}

let clientAddress = 0
/** Each request from its own address, so the per-address rate limits do not answer instead. */
const nextAddress = () => {
  clientAddress++
  return `10.${(clientAddress >> 16) & 255}.${(clientAddress >> 8) & 255}.${clientAddress & 255}`
}

async function send(route: ApiRoute, fuzz: Fuzz, sent: Sent) {
  const params = sent.kind === 'params' ? sent.params : fuzz.params(fx)
  const url =
    app.baseUrl +
    (sent.kind === 'params'
      ? route.path.replace(/:([A-Za-z]+)/g, (_m, n: string) => String(params[n]))
      : fillPath(route.path, params))
  const headers: Record<string, string> = {
    'x-trenchward-client': '1',
    'x-forwarded-for': nextAddress(),
  }
  if (cookies[fuzz.caller]) headers.cookie = cookies[fuzz.caller]
  let body: string | FormData | undefined
  if (sent.kind === 'json') {
    headers['content-type'] = 'application/json'
    body = JSON.stringify(sent.body)
  } else if (sent.kind === 'raw') {
    headers['content-type'] = sent.type
    body = sent.text
  } else if (sent.kind === 'multipart') {
    const form = new FormData()
    for (const [k, v] of sent.body.fields) form.append(k, v)
    const f = sent.body.file
    if (f) form.append(f.field, new Blob([f.bytes], { type: f.type }), f.filename)
    body = form
  }
  const res = await fetch(url, { method: route.method, headers, body })
  const text = await res.text()
  let json: unknown = undefined
  try {
    json = JSON.parse(text)
  } catch {
    // not JSON: the check below reports it
  }
  return { status: res.status, json, text }
}

/** Run `items` through `fn` with at most `n` at a time. */
async function pool<T, R>(items: T[], n: number, fn: (t: T) => Promise<R>): Promise<R[]> {
  const out: R[] = new Array(items.length)
  let next = 0
  await Promise.all(
    Array.from({ length: n }, async () => {
      while (next < items.length) {
        const i = next++
        out[i] = await fn(items[i]!)
      }
    }),
  )
  return out
}

const describeSent = (s: Sent) => JSON.stringify(s).slice(0, 400)

beforeAll(async () => {
  // Behind a proxy each client has its own address (X-Forwarded-For), as in production.
  // Payment keys with no payment service behind them: webhooks are checked by signature (and
  // refused), and no generated body may reach the service.
  app = await startTestApp({
    TRUST_PROXY: '1',
    STRIPE_SECRET_KEY: 'sk_test_fuzz_only',
    STRIPE_WEBHOOK_SECRET: 'whsec_fuzz_only',
    STRIPE_API_HOST: '127.0.0.1',
    STRIPE_API_PORT: '9',
    STRIPE_API_PROTOCOL: 'http',
  })
  const probe = createApp(app.config, app.sequelize)
  routes = apiRoutes(probe.app)
  probe.close()
  fx = await buildSecurityFixtures(app)
  const w = fx.net.w
  cookies = {
    anonymous: '',
    applicant: await signInCookie(fx.users.applicant.email, fx.users.applicant.password),
    engineer: await signInCookie(w.email, w.password),
    officer: await signInCookie(fx.users.officer.email, fx.users.officer.password),
    admin: await signInCookie(fx.users.admin.email, fx.users.admin.password),
  }
}, 180_000)
afterAll(async () => {
  await app?.close()
}, 120_000)

const totals = { routes: 0, bodies: 0 }

describe('bad input on every write route', () => {
  it('has a fuzz entry for every write route of the router', () => {
    const writes = routes.filter((r) => r.method !== 'GET').map((r) => r.key)
    expect(writes.length).toBeGreaterThan(20)
    expect(
      writes.filter((k) => !(k in FUZZ)),
      'write routes without an entry',
    ).toEqual([])
    expect(
      Object.keys(FUZZ).filter((k) => !writes.includes(k)),
      'entries without a route',
    ).toEqual([])
  })

  for (const [key, fuzz] of Object.entries(FUZZ)) {
    it(`${key}: ${BODIES} generated bodies get a 4xx in the envelope, and nothing changes`, async () => {
      const route = routes.find((r) => r.key === key)!
      expect(route).toBeDefined()
      const sent = bodiesFor(fuzz, fx, BODIES, SEED + key.length)
      expect(sent.length).toBeGreaterThanOrEqual(BODIES)
      const before = await tableChecksums(app.sequelize)
      const results = await pool(sent, PARALLEL, (s) => send(route, fuzz, s))
      const after = await tableChecksums(app.sequelize)
      const bad: string[] = []
      results.forEach((r, i) => {
        const okStatus = fuzz.anyBodyStatus
          ? r.status === fuzz.anyBodyStatus || (r.status >= 400 && r.status < 500)
          : r.status >= 400 && r.status < 500
        const envelope = r.json as { error?: Record<string, unknown> } | undefined
        const okEnvelope =
          r.status < 400 ||
          (typeof envelope?.error?.code === 'string' &&
            typeof envelope.error.message === 'string' &&
            typeof envelope.error.requestId === 'string')
        if (!okStatus || !okEnvelope)
          bad.push(`${r.status} ${r.text.slice(0, 200)} <- ${describeSent(sent[i]!)}`)
      })
      expect(bad.slice(0, 5), `${bad.length} of ${sent.length} answers were wrong`).toEqual([])
      const changed = Object.keys(before).filter(
        (t) => before[t] !== after[t] && !(fuzz.mayChange ?? []).includes(t),
      )
      expect(changed, 'tables changed by refused requests').toEqual([])
      totals.routes++
      totals.bodies += sent.length
    }, 600_000)
  }

  it('covered every write route', () => {
    expect(totals.routes).toBe(Object.keys(FUZZ).length)
    console.info(`bad input: ${totals.bodies} bodies on ${totals.routes} write routes`)
  })
})
