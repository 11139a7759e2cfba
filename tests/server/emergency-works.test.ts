import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { EmergencyWorks } from '../../server/models/index.ts'
import {
  at,
  box,
  buildTwoOwnerNetwork,
  permitDirs,
  submitApplication,
  worksNearBoth,
} from '../helpers/review-fixtures.ts'
import { grantedWorks, mailsTo } from '../helpers/site-fixtures.ts'
import { signedInAgent, startTestApp } from '../helpers/test-app.ts'
import type { TestApp } from '../helpers/test-app.ts'

let app: TestApp
beforeAll(async () => {
  app = await startTestApp({ ...permitDirs(), EMERGENCY_FOLLOW_UP_H: '6' })
})
afterAll(async () => {
  await app.close()
})

describe('POST /api/emergency-works', () => {
  it('when a burst is dug out beside the water main, then only the water owner is alerted at once and the follow-up falls due after the configured hours', async () => {
    const net = await buildTwoOwnerNetwork(app)
    const applicant = await signedInAgent(app, 'applicant')
    const officer = await signedInAgent(app, 'permit_officer')
    const gasBefore = (await mailsTo(net.g.email)).length
    const startedAt = new Date(Date.now() - 30 * 60_000)
    const res = await applicant.agent.post('/api/emergency-works').send({
      siteAddress: '3 Mill Lane, Wendmoor',
      location: box(net.origin, 28, 1, 31, 3),
      activityKind: 'excavation',
      depth_m: 1.5,
      reason: 'Service pipe burst under the footway; water on the road.',
      contactName: 'Pat Night',
      contactPhone: '+49 170 5550101',
      startedAt: startedAt.toISOString(),
    })
    expect(res.status).toBe(201)
    expect(res.body).toMatchObject({
      reference: expect.stringMatching(/^EW-\d{4}-\d{5}$/),
      overdue: false,
      followUpApplicationId: null,
      alertedOwners: [{ id: net.water.id, name: net.water.name, segments: 1 }],
    })
    expect(new Date(res.body.followUpDueAt).getTime() - startedAt.getTime()).toBe(6 * 3_600_000)
    const alert = (await mailsTo(net.w.email)).at(-1)!
    expect(alert.subject).toMatch(/^URGENT: emergency works near your pipes at 3 Mill Lane/)
    expect(alert.textBody).toContain('Pat Night, +49 170 5550101')
    expect(await mailsTo(net.g.email)).toHaveLength(gasBefore)

    // The officer sees it; once the deadline has passed it is overdue and counted at home.
    const listed = await officer.agent.get('/api/emergency-works')
    expect(listed.body.items.find((w: { id: number }) => w.id === res.body.id)).toMatchObject({
      overdue: false,
    })
    await EmergencyWorks.update(
      { followUpDueAt: new Date(Date.now() - 60_000) },
      { where: { id: res.body.id } },
    )
    const late = await officer.agent.get('/api/emergency-works')
    expect(late.body.items[0]).toMatchObject({ overdue: true })
    expect(late.body.items.find((w: { id: number }) => w.id === res.body.id)).toMatchObject({
      overdue: true,
    })
    const home = await officer.agent.get('/api/home')
    const item = (home.body.items ?? home.body).find(
      (i: { key: string }) => i.key === 'emergency-overdue',
    )
    expect(item.count).toBeGreaterThanOrEqual(1)
    const map = await officer.agent.get('/api/site-works/live')
    expect(
      map.body.features.find(
        (f: { properties: { emergencyWorksId?: number } }) =>
          f.properties.emergencyWorksId === res.body.id,
      ).properties,
    ).toMatchObject({ state: 'emergency', overdue: true })

    // The full application follows: linked, no longer overdue.
    const followId = await submitApplication(
      applicant.agent,
      [worksNearBoth(net.origin)[0]],
      'Burst repair',
    )
    const linked = await applicant.agent
      .post(`/api/emergency-works/${res.body.id}/follow-up`)
      .send({ applicationId: followId })
    expect(linked.status).toBe(200)
    expect(linked.body).toMatchObject({ followUpApplicationId: followId, overdue: false })
  })

  it('when the form is incomplete, then it names each field; an engineer cannot report', async () => {
    const applicant = await signedInAgent(app, 'applicant')
    const res = await applicant.agent.post('/api/emergency-works').send({
      siteAddress: 'x',
      location: { type: 'Point', coordinates: at([0, 0], 0, 0) },
      activityKind: 'excavation',
      reason: 'Gas smell',
      contactName: 'P',
      contactPhone: 'call me',
    })
    expect(res.status).toBe(400)
    expect(res.body.error.fields.map((f: { field: string }) => f.field).sort()).toEqual([
      'contactName',
      'contactPhone',
      'reason',
      'siteAddress',
    ])
    const owner = await signedInAgent(app, 'asset_engineer')
    expect((await owner.agent.post('/api/emergency-works').send({})).status).toBe(403)
  })
})

describe('GET /api/site-works/live', () => {
  it('when works have started on one permit and not on another, then the map tells on site from granted, not started', async () => {
    const a = await grantedWorks(app, { notice_h: null })
    const b = await grantedWorks(app, { notice_h: null })
    expect(
      (await a.applicant.agent.post(`/api/site-works/${a.applicationId}/start`).send({})).status,
    ).toBe(201)
    const map = await a.officer.agent.get('/api/site-works/live')
    expect(map.status).toBe(200)
    const stateOf = (id: number) =>
      map.body.features.find(
        (f: { properties: { applicationId?: number } }) => f.properties.applicationId === id,
      ).properties
    expect(stateOf(a.applicationId)).toMatchObject({ state: 'on_site', stateLabel: 'On site' })
    expect(stateOf(b.applicationId)).toMatchObject({
      state: 'not_started',
      stateLabel: 'Granted, not started',
    })
    expect((await a.applicant.agent.get('/api/site-works/live')).status).toBe(403)
  })
})
