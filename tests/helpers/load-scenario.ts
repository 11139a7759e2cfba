import bcrypt from 'bcrypt'
import request from 'supertest'
import { QueryTypes } from 'sequelize'
import type { Sequelize } from 'sequelize'
import { addDays, format } from 'date-fns'
import { crsTransform } from '../../shared/geo/crs.ts'
import { Organisation, User } from '../../server/models/index.ts'
import type { Role } from '../../shared/types/roles.ts'
import {
  featureCollection,
  freeScreeningSpot,
  importFile,
  lineFeature,
  pe100Properties,
} from './network-fixtures.ts'

/**
 * A mixed-load run against a real app process: owners' engineers decide reviews with the
 * version they loaded (optimistic locking: a stale version gets 409, which is the expected
 * answer, not an error), permit officers read their queue and applications, applicants read
 * their applications and the owners' answers. Afterwards the database is counted: every
 * decision that got a 2xx must be stored exactly once.
 */

const PASSWORD = 'load run password for invented users'
/** A parsed JSON answer; the run reads only a few known fields of it. */
// eslint-disable-next-line @typescript-eslint/no-explicit-any -- JSON of many shapes
type Json = any

const HEADERS = { 'X-Trenchward-Client': '1', 'Content-Type': 'application/json' }
const day = (n: number) => format(addDays(new Date(), n), 'yyyy-MM-dd')

export interface Account {
  role: Role
  email: string
  cookie: string
}

export interface Scenario {
  engineers: Account[]
  officers: Account[]
  applicants: Account[]
  applicationIds: number[]
  reviewIds: number[]
  /** Review version when the run starts. */
  startVersion: Map<number, number>
  /** review_decisions rows per review when the run starts. */
  startDecisions: Map<number, number>
}

async function signIn(baseUrl: string, email: string): Promise<string> {
  const res = await fetch(`${baseUrl}/api/auth/sign-in`, {
    method: 'POST',
    headers: HEADERS,
    body: JSON.stringify({ email, password: PASSWORD }),
  })
  if (res.status !== 200) throw new Error(`sign-in ${email}: ${res.status} ${await res.text()}`)
  return /tw\.sid=[^;]+/.exec(res.headers.get('set-cookie') ?? '')![0]
}

async function call(
  baseUrl: string,
  cookie: string,
  method: 'GET' | 'POST',
  path: string,
  body?: unknown,
): Promise<{ status: number; body: Json }> {
  const res = await fetch(`${baseUrl}${path}`, {
    method,
    headers: { ...HEADERS, cookie },
    body: body === undefined ? undefined : JSON.stringify(body),
  })
  const text = await res.text()
  return { status: res.status, body: text ? JSON.parse(text) : null }
}

/**
 * Invented organisations and people, one water main at a free spot, and `applications`
 * submitted applications with a deep pit beside it (each opens one review for the owner).
 */
export async function buildScenario(
  baseUrl: string,
  sequelize: Sequelize,
  opts: { applications: number; engineers: number; officers: number; applicants: number },
): Promise<Scenario> {
  const stamp = Date.now().toString(36)
  const hash = await bcrypt.hash(PASSWORD, 12)
  const water = await Organisation.create({
    name: `Load Water ${stamp}`,
    kind: 'network_owner',
    medium: 'water',
  })
  const builders = await Organisation.create({
    name: `Load Builders ${stamp}`,
    kind: 'contractor',
    medium: null,
  })
  const office = await Organisation.create({
    name: `Load Street Office ${stamp}`,
    kind: 'street_authority',
    medium: null,
  })
  const make = async (role: Role, org: Organisation, n: number): Promise<Account[]> => {
    const out: Account[] = []
    for (let i = 0; i < n; i++) {
      const email = `load-${role}-${i}-${stamp}@example.test`
      await User.create({
        email,
        name: `Load ${role} ${i}`,
        role,
        organisationId: org.id,
        passwordHash: hash,
        lockedUntil: null,
        lastSignInAt: null,
      })
      out.push({ role, email, cookie: await signIn(baseUrl, email) })
    }
    return out
  }
  const engineers = await make('asset_engineer', water, opts.engineers)
  const officers = await make('permit_officer', office, opts.officers)
  const applicants = await make('applicant', builders, opts.applicants)

  const t = crsTransform(25832)
  const origin = t.toGrid(await freeScreeningSpot(sequelize)) as [number, number]
  const at = (dx: number, dy: number) => t.toLonLat([origin[0] + dx, origin[1] + dy])
  const engineerAgent = request.agent(baseUrl).set('X-Trenchward-Client', '1')
  engineerAgent.set('Cookie', engineers[0]!.cookie)
  const job = await importFile(
    engineerAgent,
    featureCollection([lineFeature(pe100Properties(`LOAD-${stamp}`), [at(0, 0), at(60, 0)])]),
  )
  if (job.status !== 'committed') throw new Error(`network import: ${JSON.stringify(job)}`)

  const applicationIds: number[] = []
  for (let i = 0; i < opts.applications; i++) {
    const who = applicants[i % applicants.length]!
    const x = (i % 10) * 5
    const draft = await call(baseUrl, who.cookie, 'POST', '/api/applications', {
      title: `Load run works ${i}`,
      siteAddress: `${i + 1} Wendmoor Ring`,
      contactName: 'Lena Load',
      contactPhone: '+49 170 5550100',
      startsOn: day(7),
      endsOn: day(20),
      description: 'House connection pit beside the water main.',
      activities: [
        {
          kind: 'excavation',
          label: 'Connection pit',
          geometry: {
            type: 'Polygon',
            coordinates: [[at(x, 1.5), at(x + 3, 1.5), at(x + 3, 4), at(x, 4), at(x, 1.5)]],
          },
          depth_m: 2.5,
          support: 'none',
          digging: 'mechanical',
        },
      ],
    })
    if (draft.status !== 201)
      throw new Error(`draft: ${draft.status} ${JSON.stringify(draft.body)}`)
    const sub = await call(
      baseUrl,
      who.cookie,
      'POST',
      `/api/applications/${draft.body.id}/submit`,
      {
        version: 0,
      },
    )
    if (sub.status !== 200) throw new Error(`submit: ${sub.status} ${JSON.stringify(sub.body)}`)
    applicationIds.push(draft.body.id as number)
  }
  const rows = await sequelize.query<{ id: number; version: number }>(
    `SELECT id, version FROM owner_reviews WHERE owner_organisation_id = ? AND application_id IN (?)`,
    { replacements: [water.id, applicationIds], type: QueryTypes.SELECT },
  )
  if (rows.length !== applicationIds.length)
    throw new Error(`expected ${applicationIds.length} reviews, found ${rows.length}`)
  const reviewIds = rows.map((r) => Number(r.id))
  return {
    engineers,
    officers,
    applicants,
    applicationIds,
    reviewIds,
    startVersion: new Map(rows.map((r) => [Number(r.id), Number(r.version)])),
    startDecisions: await decisionCounts(sequelize, reviewIds),
  }
}

async function decisionCounts(sequelize: Sequelize, reviewIds: number[]) {
  const rows = await sequelize.query<{ review_id: number; n: number }>(
    'SELECT review_id, COUNT(*) AS n FROM review_decisions WHERE review_id IN (?) GROUP BY review_id',
    { replacements: [reviewIds], type: QueryTypes.SELECT },
  )
  const m = new Map(reviewIds.map((id) => [id, 0]))
  for (const r of rows) m.set(Number(r.review_id), Number(r.n))
  return m
}

export interface LoadReport {
  users: number
  duration_s: number
  requests: number
  requestsPerSecond: number
  p50_ms: number
  p99_ms: number
  max_ms: number
  /** Answers that are neither 2xx nor an expected 409 on a stale decision, plus network errors. */
  errors: number
  errorSamples: string[]
  decisionsAccepted: number
  /** Decisions refused with 409 because another engineer decided first (optimistic lock). */
  decisionConflicts: number
  /** InnoDB deadlocks during the run (server status counter). */
  deadlocks: number
  /** 2xx decisions not stored exactly once (the lost-update check). */
  lostUpdates: number
  byKind: Record<string, number>
}

const percentile = (sorted: number[], p: number) =>
  sorted.length ? sorted[Math.min(sorted.length - 1, Math.floor((p / 100) * sorted.length))]! : 0

async function deadlockCount(sequelize: Sequelize): Promise<number> {
  const rows = await sequelize.query<{ Value: string }>(
    "SHOW GLOBAL STATUS LIKE 'Innodb_deadlocks'",
    { type: QueryTypes.SELECT },
  )
  return Number(rows[0]?.Value ?? 0)
}

const DECISIONS = [
  { decision: 'accepted', reasons: 'Pit stays outside the protection strip.' },
  { decision: 'objected', reasons: 'Hand digging only within 1 m of the main.' },
  { decision: 'information_requested', question: 'Which trench support will you use?' },
] as const

/**
 * `users` simulated users for `duration_s`: 40 % engineers deciding, 30 % officers reading,
 * 30 % applicants reading, each pausing 50-250 ms between actions like a quick person.
 */
export async function runLoad(
  baseUrl: string,
  sequelize: Sequelize,
  s: Scenario,
  opts: { users: number; duration_s: number },
): Promise<LoadReport> {
  const latencies: number[] = []
  const errorSamples: string[] = []
  const byKind: Record<string, number> = {}
  let errors = 0
  let conflicts = 0
  const accepted = new Map<number, number[]>() // review id -> versions it accepted
  const deadlocksBefore = await deadlockCount(sequelize)
  const pick = <T>(a: readonly T[]) => a[Math.floor(Math.random() * a.length)]!
  const end = Date.now() + opts.duration_s * 1000

  const timed = async (
    kind: string,
    cookie: string,
    method: 'GET' | 'POST',
    path: string,
    body?: unknown,
  ) => {
    const t0 = performance.now()
    try {
      const r = await call(baseUrl, cookie, method, path, body)
      latencies.push(performance.now() - t0)
      byKind[kind] = (byKind[kind] ?? 0) + 1
      return r
    } catch (err) {
      latencies.push(performance.now() - t0)
      errors++
      if (errorSamples.length < 10) errorSamples.push(`${kind}: ${(err as Error).message}`)
      return null
    }
  }
  const bad = (kind: string, r: { status: number; body: Json } | null) => {
    if (!r) return
    errors++
    if (errorSamples.length < 10)
      errorSamples.push(`${kind}: ${r.status} ${JSON.stringify(r.body).slice(0, 200)}`)
  }

  const engineerTurn = async (a: Account) => {
    const id = pick(s.reviewIds)
    const read = await timed('review-read', a.cookie, 'GET', `/api/reviews/${id}`)
    if (read?.status !== 200) return bad('review-read', read)
    const version = read.body.review.version as number
    const d = pick(DECISIONS)
    const res = await timed('decision', a.cookie, 'POST', `/api/reviews/${id}/decision`, {
      ...d,
      version,
    })
    if (!res) return
    if (res.status === 200) {
      const list = accepted.get(id) ?? []
      list.push(version)
      accepted.set(id, list)
    } else if (res.status === 409) conflicts++
    else bad('decision', res)
  }
  const officerTurn = async (a: Account) => {
    const r =
      Math.random() < 0.5
        ? await timed('office-queue', a.cookie, 'GET', '/api/permit-office/queue')
        : await timed(
            'office-application',
            a.cookie,
            'GET',
            `/api/permit-office/applications/${pick(s.applicationIds)}`,
          )
    if (r && r.status !== 200) bad('officer', r)
  }
  const applicantTurn = async (a: Account) => {
    const id = pick(s.applicationIds)
    const paths = [
      '/api/applications',
      `/api/applications/${id}`,
      `/api/applications/${id}/reviews`,
    ]
    const r = await timed('applicant-read', a.cookie, 'GET', pick(paths))
    if (r && r.status !== 200) bad('applicant', r)
  }

  const started = Date.now()
  await Promise.all(
    Array.from({ length: opts.users }, async (_, i) => {
      const share = i % 10
      const [turn, accounts] =
        share < 4
          ? [engineerTurn, s.engineers]
          : share < 7
            ? [officerTurn, s.officers]
            : [applicantTurn, s.applicants]
      const me = accounts[i % accounts.length]!
      await new Promise((r) => setTimeout(r, Math.random() * 250))
      while (Date.now() < end) {
        await turn(me)
        await new Promise((r) => setTimeout(r, 50 + Math.random() * 200))
      }
    }),
  )
  const elapsed_s = (Date.now() - started) / 1000
  const deadlocks = (await deadlockCount(sequelize)) - deadlocksBefore

  // The count: stored decisions and versions against the 2xx answers.
  let lostUpdates = 0
  let decisionsAccepted = 0
  const nowCounts = await decisionCounts(sequelize, s.reviewIds)
  const versions = await sequelize.query<{ id: number; version: number }>(
    'SELECT id, version FROM owner_reviews WHERE id IN (?)',
    { replacements: [s.reviewIds], type: QueryTypes.SELECT },
  )
  for (const v of versions) {
    const id = Number(v.id)
    const got = accepted.get(id) ?? []
    decisionsAccepted += got.length
    const stored = nowCounts.get(id)! - s.startDecisions.get(id)!
    const bumped = Number(v.version) - s.startVersion.get(id)!
    // Each accepted decision used a distinct version; together they are the stored ones.
    const distinct = new Set(got).size
    lostUpdates +=
      Math.abs(stored - got.length) + Math.abs(bumped - got.length) + (got.length - distinct)
  }
  const sorted = [...latencies].sort((a, b) => a - b)
  return {
    users: opts.users,
    duration_s: Math.round(elapsed_s * 10) / 10,
    requests: latencies.length,
    requestsPerSecond: Math.round(latencies.length / elapsed_s),
    p50_ms: Math.round(percentile(sorted, 50)),
    p99_ms: Math.round(percentile(sorted, 99)),
    max_ms: Math.round(sorted.at(-1) ?? 0),
    errors,
    errorSamples,
    decisionsAccepted,
    decisionConflicts: conflicts,
    deadlocks,
    lostUpdates,
    byKind,
  }
}
