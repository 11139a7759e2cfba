import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { ReviewMessage, ReviewMessageAttachment } from '../../server/models/index.ts'
import { signedInAgent, startTestApp } from '../helpers/test-app.ts'
import type { TestApp } from '../helpers/test-app.ts'
import {
  buildTwoOwnerNetwork,
  permitDirs,
  reviewIdFor,
  submitApplication,
  worksNearBoth,
} from '../helpers/review-fixtures.ts'

let app: TestApp
beforeAll(async () => {
  app = await startTestApp(permitDirs())
})
afterAll(async () => {
  await app.close()
})

// The smallest file that carries the PDF signature (enough for content sniffing).
const PDF = Buffer.from('%PDF-1.4\n1 0 obj\n<<>>\nendobj\ntrailer\n<<>>\n%%EOF\n', 'latin1')

/** Two owners affected; the gas owner asks a question; the applicant has one lift plan uploaded. */
async function questionAsked() {
  const net = await buildTwoOwnerNetwork(app)
  const applicant = await signedInAgent(app, 'applicant')
  const id = await submitApplication(applicant.agent, worksNearBoth(net.origin))
  const reviewId = await reviewIdFor(net.g.agent, id)
  const asked = await net.g.agent.post(`/api/reviews/${reviewId}/decision`).send({
    decision: 'information_requested',
    version: 0,
    question: 'Please send the lift plan for the crane.',
  })
  expect(asked.status).toBe(200)
  const up = await applicant.agent
    .post(`/api/applications/${id}/attachments`)
    .field('kind', 'lift_plan')
    .attach('file', PDF, { filename: 'lift-plan.pdf', contentType: 'application/pdf' })
  expect(up.status).toBe(201)
  return { net, applicant, id, reviewId, attachmentId: up.body.id as number }
}

describe('POST /api/applications/:id/reviews/:reviewId/answer with documents', () => {
  it('when the applicant answers with a document of the application, then the owner sees it with the answer and can download it', async () => {
    const { net, applicant, id, reviewId, attachmentId } = await questionAsked()
    const answered = await applicant.agent
      .post(`/api/applications/${id}/reviews/${reviewId}/answer`)
      .send({ body: 'The lift plan is attached.', attachmentIds: [attachmentId] })
    expect(answered.status).toBe(200)
    const mine = answered.body.find((r: { id: number }) => r.id === reviewId)
    expect(mine.messages.at(-1)).toMatchObject({
      kind: 'answer',
      attachments: [
        { id: attachmentId, applicationId: id, kind: 'lift_plan', filename: 'lift-plan.pdf' },
      ],
    })
    expect(mine.messages[0].attachments).toEqual([])

    const detail = await net.g.agent.get(`/api/reviews/${reviewId}`)
    expect(detail.status).toBe(200)
    expect(detail.body.messages.at(-1).attachments.map((a: { id: number }) => a.id)).toEqual([
      attachmentId,
    ])
    const file = await net.g.agent.get(`/api/applications/${id}/attachments/${attachmentId}/file`)
    expect(file.status).toBe(200)
    expect(file.headers['content-type']).toMatch(/application\/pdf/)
  })

  it('when a document of another application is named, then it answers 400 naming attachmentIds and nothing is written', async () => {
    const { applicant, id, reviewId } = await questionAsked()
    const otherDraft = await applicant.agent.post('/api/applications').send({ title: 'Other' })
    const foreign = await applicant.agent
      .post(`/api/applications/${otherDraft.body.id}/attachments`)
      .field('kind', 'drawing')
      .attach('file', PDF, { filename: 'other.pdf', contentType: 'application/pdf' })
    expect(foreign.status).toBe(201)
    const messagesBefore = await ReviewMessage.count({ where: { reviewId } })
    const linksBefore = await ReviewMessageAttachment.count()

    const res = await applicant.agent
      .post(`/api/applications/${id}/reviews/${reviewId}/answer`)
      .send({ body: 'Here it is.', attachmentIds: [foreign.body.id] })
    expect(res.status).toBe(400)
    expect(res.body.error.fields).toEqual([expect.objectContaining({ field: 'attachmentIds' })])
    expect(await ReviewMessage.count({ where: { reviewId } })).toBe(messagesBefore)
    expect(await ReviewMessageAttachment.count()).toBe(linksBefore)
    // The question is still open: the failed answer changed nothing.
    const seen = await applicant.agent.get(`/api/applications/${id}/reviews`)
    expect(seen.body.find((r: { id: number }) => r.id === reviewId).awaitingAnswer).toBe(true)
  })

  it('when the same document is named twice or ids are not numbers, then it answers 400 naming the field', async () => {
    const { applicant, id, reviewId, attachmentId } = await questionAsked()
    for (const attachmentIds of [[attachmentId, attachmentId], ['x'], [1.5], 'all']) {
      const res = await applicant.agent
        .post(`/api/applications/${id}/reviews/${reviewId}/answer`)
        .send({ body: 'Here it is.', attachmentIds })
      expect(res.status).toBe(400)
      expect(res.body.error.fields[0].field).toMatch(/^attachmentIds/)
    }
  })
})
