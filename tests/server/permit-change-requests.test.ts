import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { at, day, permitDirs, worksNearBoth } from '../helpers/review-fixtures.ts'
import { grantedWorks, mailsTo } from '../helpers/site-fixtures.ts'
import { startTestApp } from '../helpers/test-app.ts'
import type { TestApp } from '../helpers/test-app.ts'

let app: TestApp
beforeAll(async () => {
  app = await startTestApp(permitDirs())
})
afterAll(async () => {
  await app.close()
})

describe('POST /api/change-requests/for-application/:id', () => {
  it('when the crane moves nearer the gas main, then only the gas owner gets a review, and the office grants a new issue with its condition', async () => {
    const w = await grantedWorks(app)
    const works = worksNearBoth(w.net.origin)
    // Same pit; the crane's outriggers 1 m nearer the gas main (y = 200 m) and a heavier lift.
    const crane = works[1] as { geometry: { coordinates: [number, number][] }; legLoad_kN: number }
    crane.geometry.coordinates = [
      at(w.net.origin, 10, 201),
      at(w.net.origin, 16, 201),
      at(w.net.origin, 10, 207),
      at(w.net.origin, 16, 207),
    ]
    crane.legLoad_kN = 500
    const waterMails = (await mailsTo(w.net.w.email)).length

    const created = await w.applicant.agent
      .post(`/api/change-requests/for-application/${w.applicationId}`)
      .send({ activities: works, reason: 'Larger crane needed for the valve chamber lid' })
    expect(created.status).toBe(201)
    expect(created.body.status).toBe('with_owners')
    const byOwner = new Map(
      created.body.screening.map((s: { owner: { id: number }; touched: boolean }) => [
        s.owner.id,
        s,
      ]),
    )
    expect(byOwner.get(w.net.gas.id)).toMatchObject({ touched: true })
    expect(byOwner.get(w.net.water.id)).toMatchObject({
      touched: false,
      why: expect.stringContaining('exactly the same result'),
    })
    expect(created.body.reviews).toEqual([
      expect.objectContaining({
        owner: { id: w.net.gas.id, name: w.net.gas.name },
        state: 'waiting',
      }),
    ])
    // The gas engineers are mailed; the water engineers are not.
    expect((await mailsTo(w.net.g.email)).at(-1)!.subject).toMatch(/touches your pipes/)
    expect(await mailsTo(w.net.w.email)).toHaveLength(waterMails)
    // Only one open request at a time; the water owner has nothing to answer.
    expect(
      (
        await w.applicant.agent
          .post(`/api/change-requests/for-application/${w.applicationId}`)
          .send({ validTo: day(40), reason: 'More time' })
      ).status,
    ).toBe(409)
    expect(
      (
        await w.net.w.agent
          .post(`/api/change-requests/${created.body.id}/review`)
          .send({ decision: 'accepted' })
      ).status,
    ).toBe(404)

    // The office cannot decide before the gas owner answers.
    const early = await w.officer.agent
      .post(`/api/change-requests/${created.body.id}/decision`)
      .send({ version: created.body.version, decision: 'grant' })
    expect(early.status).toBe(422)

    const answered = await w.net.g.agent
      .post(`/api/change-requests/${created.body.id}/review`)
      .send({
        decision: 'accepted_with_conditions',
        conditions: [
          { code: 'mats-on-plates', text: 'Outrigger mats on steel plates over the gas main.' },
        ],
      })
    expect(answered.status).toBe(200)
    expect(answered.body.status).toBe('ready_for_decision')
    const queue = await w.officer.agent.get('/api/change-requests')
    expect(queue.body.items.map((r: { id: number }) => r.id)).toContain(created.body.id)

    const granted = await w.officer.agent
      .post(`/api/change-requests/${created.body.id}/decision`)
      .send({ version: answered.body.version, decision: 'grant' })
    expect(granted.status).toBe(200)
    expect(granted.body.status).toBe('granted')
    const permit = await w.applicant.agent.get(`/api/permits/${granted.body.resultPermitId}`)
    expect(permit.body).toMatchObject({ issue: 2, changeKind: 'varied', status: 'valid' })
    expect(permit.body.conditions.at(-1)).toMatchObject({
      code: 'mats-on-plates',
      ownerOrganisationId: w.net.gas.id,
    })
    const app2 = await w.applicant.agent.get(`/api/applications/${w.applicationId}`)
    expect(app2.body.activities[1].legLoad_kN).toBe(500)
  })

  it('when only the last day moves, then no owner is asked and the office extends the permit', async () => {
    const w = await grantedWorks(app)
    const bad = await w.applicant.agent
      .post(`/api/change-requests/for-application/${w.applicationId}`)
      .send({ validTo: day(5), reason: 'Shorter' })
    expect(bad.status).toBe(422)
    expect(bad.body.error.fields[0].field).toBe('validTo')
    const none = await w.applicant.agent
      .post(`/api/change-requests/for-application/${w.applicationId}`)
      .send({ reason: 'Nothing' })
    expect(none.status).toBe(400)
    expect(none.body.error.fields[0].field).toBe('validTo')

    const created = await w.applicant.agent
      .post(`/api/change-requests/for-application/${w.applicationId}`)
      .send({ validTo: day(30), reason: 'Rock met at 1.2 m; breaking out takes longer' })
    expect(created.status).toBe(201)
    expect(created.body).toMatchObject({ status: 'ready_for_decision', reviews: [] })
    expect(created.body.screening.every((s: { touched: boolean }) => !s.touched)).toBe(true)
    const granted = await w.officer.agent
      .post(`/api/change-requests/${created.body.id}/decision`)
      .send({ version: created.body.version, decision: 'grant', note: 'Agreed' })
    expect(granted.status).toBe(200)
    const permit = await w.applicant.agent.get(`/api/permits/${granted.body.resultPermitId}`)
    expect(permit.body).toMatchObject({ issue: 2, changeKind: 'extended', validTo: day(30) })
  })
})
