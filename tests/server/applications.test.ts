import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { addDays, format } from 'date-fns'
import { signedInAgent, startTestApp } from '../helpers/test-app.ts'
import type { TestApp } from '../helpers/test-app.ts'

let app: TestApp
beforeAll(async () => {
  app = await startTestApp()
})
afterAll(async () => {
  await app.close()
})

const day = (offset: number) => format(addDays(new Date(), offset), 'yyyy-MM-dd')

// A 4 m x 2 m pit in the test area (about lon 9.95, lat 52.60).
const pit = {
  type: 'Polygon',
  coordinates: [
    [
      [9.95, 52.6],
      [9.95006, 52.6],
      [9.95006, 52.60002],
      [9.95, 52.60002],
      [9.95, 52.6],
    ],
  ],
}

const completeDraft = () => ({
  title: 'Service connection, No. 12',
  siteAddress: '12 Test Street',
  contactName: 'Sam Site',
  contactPhone: '+49 170 1234567',
  startsOn: day(10),
  endsOn: day(14),
  description: 'Open a pit to connect a new house to the water main.',
  activities: [
    {
      kind: 'excavation',
      label: 'Connection pit',
      geometry: pit,
      depth_m: 1.8,
      support: 'trench-box',
      digging: 'mechanical',
    },
  ],
})

describe('POST /api/applications', () => {
  it('when an applicant saves a draft, then it responds 201 with the draft and its activity', async () => {
    const { agent, organisation } = await signedInAgent(app, 'applicant')
    const res = await agent.post('/api/applications').send(completeDraft())
    expect(res.status).toBe(201)
    expect(res.body).toMatchObject({
      status: 'draft',
      version: 0,
      reference: `draft-${res.body.id}`,
      title: 'Service connection, No. 12',
      applicantOrganisation: { id: organisation.id, name: organisation.name },
      activities: [
        {
          id: expect.any(Number),
          kind: 'excavation',
          depth_m: 1.8,
          support: 'trench-box',
          geometry: pit,
        },
      ],
      submittedAt: null,
    })
  })

  it('when a draft has only a title, then it is saved', async () => {
    const { agent } = await signedInAgent(app, 'applicant')
    const res = await agent.post('/api/applications').send({ title: 'Crane lift at the depot' })
    expect(res.status).toBe(201)
    expect(res.body.activities).toEqual([])
  })

  it('when the excavation outline crosses itself, then it responds 400 naming the activity geometry', async () => {
    const { agent } = await signedInAgent(app, 'applicant')
    const bowtie = {
      type: 'Polygon',
      coordinates: [
        [
          [9.95, 52.6],
          [9.9501, 52.6001],
          [9.9501, 52.6],
          [9.95, 52.6001],
          [9.95, 52.6],
        ],
      ],
    }
    const body = {
      ...completeDraft(),
      activities: [{ ...completeDraft().activities[0], geometry: bowtie }],
    }
    const res = await agent.post('/api/applications').send(body)
    expect(res.status).toBe(400)
    expect(res.body.error.fields).toEqual([
      { field: 'activities.0.geometry.coordinates.0', message: 'The outline crosses itself' },
    ])
  })

  it('when the depth is negative, then it responds 400 naming depth_m', async () => {
    const { agent } = await signedInAgent(app, 'applicant')
    const body = {
      ...completeDraft(),
      activities: [{ ...completeDraft().activities[0], depth_m: -1 }],
    }
    const res = await agent.post('/api/applications').send(body)
    expect(res.status).toBe(400)
    expect(res.body.error.fields).toEqual([
      { field: 'activities.0.depth_m', message: 'Depth must be more than 0 m' },
    ])
  })

  it('when a network engineer tries, then it responds 403', async () => {
    const { agent } = await signedInAgent(app, 'asset_engineer')
    expect((await agent.post('/api/applications').send(completeDraft())).status).toBe(403)
  })
})

describe('PUT /api/applications/:id and optimistic locking', () => {
  it('when two saves start from the same version, then the second responds 409', async () => {
    const { agent } = await signedInAgent(app, 'applicant')
    const created = (await agent.post('/api/applications').send({ title: 'Trial holes' })).body
    const first = await agent
      .put(`/api/applications/${created.id}`)
      .send({ ...completeDraft(), version: 0 })
    expect(first.status).toBe(200)
    expect(first.body.version).toBe(1)
    const second = await agent
      .put(`/api/applications/${created.id}`)
      .send({ ...completeDraft(), title: 'Other', version: 0 })
    expect(second.status).toBe(409)
    expect(second.body.error.code).toBe('CONFLICT')
  })
})

describe('access to applications', () => {
  it('when another contractor asks for the draft, then it responds 404', async () => {
    const owner = await signedInAgent(app, 'applicant')
    const other = await signedInAgent(app, 'applicant')
    const created = (await owner.agent.post('/api/applications').send(completeDraft())).body
    expect((await other.agent.get(`/api/applications/${created.id}`)).status).toBe(404)
    const list = await other.agent.get('/api/applications')
    expect(list.body.items.map((i: { id: number }) => i.id)).not.toContain(created.id)
  })

  it('when a permit officer lists, then drafts are not shown but submitted ones are', async () => {
    const applicant = await signedInAgent(app, 'applicant')
    const officer = await signedInAgent(app, 'permit_officer')
    const draft = (await applicant.agent.post('/api/applications').send(completeDraft())).body
    const sub = (await applicant.agent.post('/api/applications').send(completeDraft())).body
    expect(
      (await applicant.agent.post(`/api/applications/${sub.id}/submit`).send({ version: 0 }))
        .status,
    ).toBe(200)
    expect((await officer.agent.get(`/api/applications/${draft.id}`)).status).toBe(404)
    const seen = await officer.agent.get(`/api/applications/${sub.id}`)
    expect(seen.status).toBe(200)
    // Submit opens the owner reviews at once (issue 6).
    expect(seen.body.status).toMatch(/^(with_owners|ready_for_decision)$/)
  })
})

describe('POST /api/applications/:id/submit and /withdraw', () => {
  it('when the draft is complete, then it is submitted with a reference', async () => {
    const { agent } = await signedInAgent(app, 'applicant')
    const created = (await agent.post('/api/applications').send(completeDraft())).body
    const res = await agent.post(`/api/applications/${created.id}/submit`).send({ version: 0 })
    expect(res.status).toBe(200)
    // Submit opens the owner reviews at once (issue 6).
    expect(res.body.status).toMatch(/^(with_owners|ready_for_decision)$/)
    expect(res.body.reference).toMatch(
      new RegExp(`^TW-\\d{4}-${String(created.id).padStart(5, '0')}$`),
    )
    expect(res.body.submittedAt).toEqual(expect.any(String))
    const again = await agent.post(`/api/applications/${created.id}/submit`).send({ version: 1 })
    expect(again.status).toBe(422)
  })

  it('when fields are missing, then submit responds 400 naming each and the draft stays a draft', async () => {
    const { agent } = await signedInAgent(app, 'applicant')
    const created = (await agent.post('/api/applications').send({ title: 'Half-finished' })).body
    const res = await agent.post(`/api/applications/${created.id}/submit`).send({ version: 0 })
    expect(res.status).toBe(400)
    expect(res.body.error.fields.map((f: { field: string }) => f.field).sort()).toEqual(
      ['activities', 'contactPhone', 'description', 'endsOn', 'siteAddress', 'startsOn'].sort(),
    )
    expect((await agent.get(`/api/applications/${created.id}`)).body.status).toBe('draft')
  })

  it('when the start date is in the past, then submit responds 400 on startsOn', async () => {
    const { agent } = await signedInAgent(app, 'applicant')
    const created = (
      await agent
        .post('/api/applications')
        .send({ ...completeDraft(), startsOn: day(-2), endsOn: day(3) })
    ).body
    const res = await agent.post(`/api/applications/${created.id}/submit`).send({ version: 0 })
    expect(res.status).toBe(400)
    expect(res.body.error.fields).toEqual([
      { field: 'startsOn', message: 'The start date is in the past' },
    ])
  })

  it('when the end is before the start, then submit responds 400 on endsOn', async () => {
    const { agent } = await signedInAgent(app, 'applicant')
    const created = (
      await agent
        .post('/api/applications')
        .send({ ...completeDraft(), startsOn: day(5), endsOn: day(3) })
    ).body
    const res = await agent.post(`/api/applications/${created.id}/submit`).send({ version: 0 })
    expect(res.status).toBe(400)
    expect(res.body.error.fields).toEqual([
      { field: 'endsOn', message: 'The end date is before the start date' },
    ])
  })

  it('when a submitted application is withdrawn, then its status is withdrawn and it cannot be withdrawn twice', async () => {
    const { agent } = await signedInAgent(app, 'applicant')
    const created = (await agent.post('/api/applications').send(completeDraft())).body
    await agent.post(`/api/applications/${created.id}/submit`).send({ version: 0 }).expect(200)
    const res = await agent
      .post(`/api/applications/${created.id}/withdraw`)
      .send({ reason: 'Client cancelled' })
    expect(res.status).toBe(200)
    expect(res.body.status).toBe('withdrawn')
    expect((await agent.post(`/api/applications/${created.id}/withdraw`).send({})).status).toBe(422)
  })
})
