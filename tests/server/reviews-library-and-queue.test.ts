import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { OwnerReview } from '../../server/models/index.ts'
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

const template = {
  code: 'hand-dig-zone',
  title: 'Hand digging near the main',
  text: 'Dig by hand or vacuum within {distance_m} m of the main; trial holes every {spacing_m} m.',
  parameters: [
    { name: 'distance_m', label: 'Distance', unit: 'm', default: 0.5, min: 0.3, max: 5 },
    { name: 'spacing_m', label: 'Trial hole spacing', unit: 'm', default: 10 },
  ],
}

describe('/api/condition-templates', () => {
  it('when an engineer keeps the library, then it lists, changes with a version check and retires conditions of their own owner only', async () => {
    const net = await buildTwoOwnerNetwork(app)
    const created = await net.w.agent.post('/api/condition-templates').send(template)
    expect(created.status).toBe(201)
    expect(created.body).toMatchObject({
      code: 'hand-dig-zone',
      active: true,
      version: 0,
      parameters: [{ name: 'distance_m', kind: 'number' }, { name: 'spacing_m' }],
    })
    const dup = await net.w.agent.post('/api/condition-templates').send(template)
    expect(dup.status).toBe(409)
    expect(dup.body.error.fields).toEqual([
      { field: 'code', message: 'Already used in your library' },
    ])
    const undefinedParam = await net.w.agent
      .post('/api/condition-templates')
      .send({ ...template, code: 'other', text: 'Keep {depth_m} m.' })
    expect(undefinedParam.status).toBe(400)
    expect(undefinedParam.body.error.fields.map((f: { field: string }) => f.field)).toEqual([
      'text',
      'parameters.0.name',
      'parameters.1.name',
    ])

    const updated = await net.w.agent
      .put(`/api/condition-templates/${created.body.id}`)
      .send({ ...template, title: 'Hand digging zone', version: 0 })
    expect(updated.status).toBe(200)
    expect(updated.body).toMatchObject({ title: 'Hand digging zone', version: 1 })
    const stale = await net.w.agent
      .put(`/api/condition-templates/${created.body.id}`)
      .send({ ...template, version: 0 })
    expect(stale.status).toBe(409)

    // The gas owner neither sees nor changes the water owner's library.
    expect((await net.g.agent.get(`/api/condition-templates/${created.body.id}`)).status).toBe(404)
    expect((await net.g.agent.get('/api/condition-templates')).body).toEqual([])
    const applicant = await signedInAgent(app, 'applicant')
    expect((await applicant.agent.get('/api/condition-templates')).status).toBe(403)

    expect((await net.w.agent.delete(`/api/condition-templates/${created.body.id}`)).status).toBe(
      204,
    )
    expect((await net.w.agent.get('/api/condition-templates')).body).toEqual([])
    expect(
      (await net.w.agent.get('/api/condition-templates?includeInactive=true')).body,
    ).toHaveLength(1)
  })
})

describe('queues', () => {
  it('when a review is past its due date, then the engineer and the officer see it overdue, and the officer reads every affected segment', async () => {
    const net = await buildTwoOwnerNetwork(app)
    const applicant = await signedInAgent(app, 'applicant')
    const officer = await signedInAgent(app, 'permit_officer')
    const id = await submitApplication(applicant.agent, worksNearBoth(net.origin))
    const reviewId = await reviewIdFor(net.w.agent, id)
    await OwnerReview.update({ dueOn: '2020-01-06' }, { where: { id: reviewId } })

    const mine = (await net.w.agent.get('/api/reviews')).body.items
    const item = mine.find((r: { id: number }) => r.id === reviewId)
    expect(item).toMatchObject({ overdue: true, dueOn: '2020-01-06' })
    expect(item.dueInWorkingDays).toBeLessThan(0)
    // Earliest due first: the overdue one leads the queue.
    expect(mine[0].dueOn <= item.dueOn).toBe(true)

    const oq = (await officer.agent.get('/api/permit-office/queue?pageSize=500')).body.items
    const line = oq.find((x: { applicationId: number }) => x.applicationId === id)
    expect(line).toMatchObject({
      readyForDecision: false,
      openReviewCount: 2,
      overdueReviewCount: 1,
      nextDueOn: '2020-01-06',
    })

    const view = await officer.agent.get(`/api/permit-office/applications/${id}`)
    expect(view.status).toBe(200)
    expect(view.body.segments.map((s: { owner: { id: number } }) => s.owner.id).sort()).toEqual(
      [net.water.id, net.gas.id].sort(),
    )
    expect(view.body.segments[0].result.checks.length).toBeGreaterThan(0)
    // Not for applicants or engineers.
    expect((await applicant.agent.get(`/api/permit-office/applications/${id}`)).status).toBe(403)
    expect((await net.w.agent.get('/api/permit-office/queue')).status).toBe(403)
  })

  it('when the applicant withdraws, then the open review leaves the engineer’s open queue', async () => {
    const net = await buildTwoOwnerNetwork(app)
    const applicant = await signedInAgent(app, 'applicant')
    const id = await submitApplication(applicant.agent, worksNearBoth(net.origin))
    const reviewId = await reviewIdFor(net.w.agent, id)
    expect(
      (
        await applicant.agent
          .post(`/api/applications/${id}/withdraw`)
          .send({ reason: 'Plans changed.' })
      ).status,
    ).toBe(200)
    const open = (await net.w.agent.get('/api/reviews')).body.items
    expect(open.some((r: { id: number }) => r.id === reviewId)).toBe(false)
    const decide = await net.w.agent
      .post(`/api/reviews/${reviewId}/decision`)
      .send({ decision: 'accepted', version: 0 })
    expect(decide.status).toBe(422)
  })
})
