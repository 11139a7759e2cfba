import { expect } from 'vitest'
import { OutboxMail } from '../../server/models/index.ts'
import {
  buildTwoOwnerNetwork,
  day,
  reviewIdFor,
  submitApplication,
  worksNearBoth,
} from './review-fixtures.ts'
import { signedInAgent, unique } from './test-app.ts'
import type { TestApp } from './test-app.ts'

export const mailsTo = (email: string) =>
  OutboxMail.findAll({ where: { toAddress: email }, order: [['id', 'ASC']] })

/** A 1×1 PNG (the PNG signature, IHDR, IDAT and IEND chunks). */
export const TINY_PNG = Buffer.from(
  '89504e470d0a1a0a0000000d4948445200000001000000010806000000' +
    '1f15c4890000000d49444154789c6360000002000154a24f5d0000000049454e44ae426082',
  'hex',
)

/**
 * Two owners, works near both, the water owner accepts with a library condition that asks to
 * attend (`notice_h` hours) and for reinstatement photos, the gas owner accepts plainly, and
 * the officer grants valid from today for three weeks.
 */
export async function grantedWorks(app: TestApp, opts: { notice_h?: number | null } = {}) {
  const net = await buildTwoOwnerNetwork(app)
  const applicant = await signedInAgent(app, 'applicant')
  const officer = await signedInAgent(app, 'permit_officer')
  const applicationId = await submitApplication(
    applicant.agent,
    worksNearBoth(net.origin),
    'Site test',
  )
  const code = unique('attend').toLowerCase()
  const tpl = await net.w.agent.post('/api/condition-templates').send({
    code,
    title: 'Water network attends the works',
    text: 'The water network team attends the dig near the main; give notice.',
    attendanceNotice_h: opts.notice_h === undefined ? 24 : opts.notice_h,
    photoKinds: ['reinstatement'],
  })
  expect(tpl.status).toBe(201)
  const wReview = await reviewIdFor(net.w.agent, applicationId)
  expect(
    (
      await net.w.agent.post(`/api/reviews/${wReview}/decision`).send({
        decision: 'accepted_with_conditions',
        version: 0,
        conditions: [{ source: 'library', code, templateId: tpl.body.id }],
      })
    ).status,
  ).toBe(200)
  const gReview = await reviewIdFor(net.g.agent, applicationId)
  expect(
    (
      await net.g.agent
        .post(`/api/reviews/${gReview}/decision`)
        .send({ decision: 'accepted', version: 0 })
    ).status,
  ).toBe(200)
  const draft = await officer.agent.get(
    `/api/permit-office/applications/${applicationId}/decision-draft`,
  )
  const granted = await officer.agent
    .post(`/api/permit-office/applications/${applicationId}/grant`)
    .send({ version: draft.body.version, validFrom: day(0), validTo: day(21) })
  expect(granted.status).toBe(201)
  return { net, applicant, officer, applicationId, permit: granted.body, conditionCode: code }
}
