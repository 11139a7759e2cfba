import request from 'supertest'
import { expect } from 'vitest'
import { createTestOrganisation, createTestUser, signedInAgent, unique } from './test-app.ts'
import type { TestApp } from './test-app.ts'
import { buildTwoOwnerNetwork, day, worksNearBoth } from './review-fixtures.ts'

/** The smallest file that passes the PDF signature check (PDF 1.7 §7.5.2 header). */
export const TINY_PDF = Buffer.from(
  '%PDF-1.4\n1 0 obj\n<<>>\nendobj\ntrailer\n<<>>\n%%EOF\n',
  'latin1',
)

/** Who calls in the access tests: anonymous, each role, and users of other organisations. */
export const ACTORS = [
  'anonymous',
  'applicant',
  'otherApplicant',
  'engineer',
  'otherEngineer',
  'officer',
  'otherOfficer',
  'admin',
] as const
export type Actor = (typeof ACTORS)[number]

export const ACTOR_ROLE = {
  anonymous: null,
  applicant: 'applicant',
  otherApplicant: 'applicant',
  engineer: 'asset_engineer',
  otherEngineer: 'asset_engineer',
  officer: 'permit_officer',
  otherOfficer: 'permit_officer',
  admin: 'admin',
} as const

type Agent = ReturnType<TestApp['agent']>

/** A signed-in caller of the fixtures. */
export interface FixtureUser {
  agent: Agent
  email: string
  password: string
  organisationId: number
}

export interface SecurityFixtures {
  net: { w: FixtureUser; g: FixtureUser; wRef: string; gRef: string }
  agents: Record<Actor, Agent>
  users: Record<'applicant' | 'otherApplicant' | 'officer' | 'otherOfficer' | 'admin', FixtureUser>
  fullDraft(title: string): Record<string, unknown>
  submittedId: number
  attachmentId: number
  reviewId: number
  assessmentId: number
  draftId: number
  draftAttachmentId: number
  spareDraftId: number
  grantedId: number
  permitId: number
  verificationCode: string
  templateId: number
  templateCode: string
  importId: number
  segmentId: number
  segmentVersion: number
  targetUserId: number
}

/**
 * Real rows for the access and bad-input tests. The water owner (engineer) has a main; the
 * applicant's works lie beside it only, so the gas owner (otherEngineer) is not a party.
 * - `submittedId`: submitted, with an attachment, under review by the water owner (`reviewId`).
 * - `draftId`: a draft with an attachment (`draftAttachmentId`) for edits and deletes.
 * - `spareDraftId`: a draft for submit and withdraw.
 * - `permitId`: a granted permit on `grantedId` (water accepted), with `verificationCode`.
 * - `templateId`: a condition in the water owner's library; `importId`, `segmentId` of water.
 * - `assessmentId`: the water main's assessment in the review; `targetUserId` for admin edits.
 */
export async function buildSecurityFixtures(app: TestApp): Promise<SecurityFixtures> {
  const net = await buildTwoOwnerNetwork(app)
  const applicant = await signedInAgent(app, 'applicant')
  const otherApplicant = await signedInAgent(app, 'applicant')
  const officer = await signedInAgent(app, 'permit_officer')
  const otherOfficer = await signedInAgent(
    app,
    'permit_officer',
    await createTestOrganisation('street_authority', unique('Other Authority')),
  )
  const admin = await signedInAgent(app, 'admin')
  const anonymous = { agent: app.agent() }
  const agents: Record<Actor, Agent> = {
    anonymous: anonymous.agent,
    applicant: applicant.agent,
    otherApplicant: otherApplicant.agent,
    engineer: net.w.agent,
    otherEngineer: net.g.agent,
    officer: officer.agent,
    otherOfficer: otherOfficer.agent,
    admin: admin.agent,
  }
  const pit = worksNearBoth(net.origin)[0]!
  const fullDraft = (title: string) => ({
    title,
    siteAddress: '3 Quarry Row, Wendmoor',
    contactName: 'Pat Foreman',
    contactPhone: '+49 170 7654321',
    startsOn: day(7),
    endsOn: day(20),
    description: 'A pit beside the water main for a new service connection.',
    activities: [pit],
  })
  const draft = async (title: string) => {
    const res = await applicant.agent.post('/api/applications').send(fullDraft(title))
    expect(res.status).toBe(201)
    return res.body.id as number
  }
  const attach = async (id: number) => {
    const res = await applicant.agent
      .post(`/api/applications/${id}/attachments`)
      .field('kind', 'method_statement')
      .attach('file', TINY_PDF, { filename: 'method.pdf', contentType: 'application/pdf' })
    expect(res.status).toBe(201)
    return res.body.id as number
  }
  const submit = async (id: number) => {
    const res = await applicant.agent.post(`/api/applications/${id}/submit`).send({ version: 0 })
    expect(res.status).toBe(200)
  }
  const reviewOf = async (applicationId: number) => {
    const q = await net.w.agent.get('/api/reviews?state=all&pageSize=500')
    const item = q.body.items.find(
      (r: { applicationId: number }) => r.applicationId === applicationId,
    )
    expect(item).toBeDefined()
    return item.id as number
  }

  const submittedId = await draft('Service connection pit')
  const attachmentId = await attach(submittedId)
  await submit(submittedId)
  const reviewId = await reviewOf(submittedId)
  const review = await net.w.agent.get(`/api/reviews/${reviewId}`)
  expect(review.status).toBe(200)
  const assessmentId = findAssessmentId(review.body)

  const draftId = await draft('Draft pit')
  const draftAttachmentId = await attach(draftId)
  const spareDraftId = await draft('Spare draft pit')

  const grantedId = await draft('Granted pit')
  await submit(grantedId)
  const grantedReview = await reviewOf(grantedId)
  expect(
    (
      await net.w.agent
        .post(`/api/reviews/${grantedReview}/decision`)
        .send({ decision: 'accepted', version: 0 })
    ).status,
  ).toBe(200)
  const decisionDraft = await officer.agent.get(
    `/api/permit-office/applications/${grantedId}/decision-draft`,
  )
  const granted = await officer.agent
    .post(`/api/permit-office/applications/${grantedId}/grant`)
    .send({ version: decisionDraft.body.version })
  expect(granted.status).toBe(201)
  const permitId = granted.body.id as number
  const verificationCode = granted.body.verificationCode as string
  expect(typeof verificationCode).toBe('string')

  const tpl = await net.w.agent.post('/api/condition-templates').send({
    code: unique('keep-clear').toLowerCase(),
    title: 'Keep plant clear of the main',
    text: 'Keep plant at least {distance_m} m from the main.',
    parameters: [{ name: 'distance_m', label: 'Distance', unit: 'm', default: 2 }],
  })
  expect(tpl.status).toBe(201)
  const imports = await net.w.agent.get('/api/network/imports')
  const importId = imports.body.items[0].id as number
  const segments = await net.w.agent.get(`/api/network/segments?q=${net.wRef}`)
  const segment = segments.body.items.find((s: { ownerRef: string }) => s.ownerRef === net.wRef)
  expect(segment).toBeDefined()
  const target = await createTestUser('applicant')

  const slim = (u: {
    agent: Agent
    email: string
    password: string
    organisation: { id: number }
  }) => ({
    agent: u.agent,
    email: u.email,
    password: u.password,
    organisationId: u.organisation.id,
  })
  return {
    net: { w: slim(net.w), g: slim(net.g), wRef: net.wRef, gRef: net.gRef },
    agents,
    users: {
      applicant: slim(applicant),
      otherApplicant: slim(otherApplicant),
      officer: slim(officer),
      otherOfficer: slim(otherOfficer),
      admin: slim(admin),
    },
    fullDraft,
    submittedId,
    attachmentId,
    reviewId,
    assessmentId,
    draftId,
    draftAttachmentId,
    spareDraftId,
    grantedId,
    permitId,
    verificationCode,
    templateId: tpl.body.id as number,
    templateCode: tpl.body.code as string,
    importId,
    segmentId: segment.id as number,
    segmentVersion: segment.version as number,
    targetUserId: target.user.id,
  }
}

/** The first assessment id anywhere in a review detail (the water main's). */
function findAssessmentId(detail: unknown): number {
  const seen: unknown[] = [detail]
  while (seen.length) {
    const v = seen.pop()
    if (v && typeof v === 'object') {
      const o = v as Record<string, unknown>
      if (typeof o.assessmentId === 'number') return o.assessmentId
      seen.push(...Object.values(o))
    }
  }
  throw new Error('no assessment in the review detail')
}

/** A request without cookies but with the client header (anonymous caller). */
export const anonymousAgent = (app: TestApp) =>
  request.agent(app.baseUrl).set('X-Trenchward-Client', '1')
