import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { crsTransform } from '../../shared/geo/crs.ts'
import { insertStreets } from '../../server/services/streets.ts'
import { freeScreeningSpot } from '../helpers/network-fixtures.ts'
import { at, box, day } from '../helpers/review-fixtures.ts'
import { signedInAgent, startTestApp, unique } from '../helpers/test-app.ts'
import type { TestApp } from '../helpers/test-app.ts'

let app: TestApp
beforeAll(async () => {
  app = await startTestApp()
})
afterAll(async () => {
  await app.close()
})

const t = crsTransform(25832)
type Agent = ReturnType<TestApp['agent']>

const pit = (origin: [number, number], x0: number, label: string) => ({
  kind: 'excavation',
  label,
  geometry: box(origin, x0, 101, x0 + 2, 103),
  depth_m: 1.2,
  support: 'trench-box',
  digging: 'mechanical',
})

async function submitWorks(
  agent: Agent,
  activities: unknown[],
  startsOn: string,
  endsOn: string,
  title: string,
) {
  const draft = await agent.post('/api/applications').send({
    title,
    siteAddress: 'Test site',
    contactName: 'Sam Site',
    contactPhone: '+49 170 1234567',
    startsOn,
    endsOn,
    description: 'Works for the coordination API tests.',
    activities,
  })
  expect(draft.status).toBe(201)
  const res = await agent.post(`/api/applications/${draft.body.id}/submit`).send({ version: 0 })
  expect(res.status).toBe(200)
  return { id: draft.body.id as number, reference: res.body.reference as string }
}

describe('GET /api/coordination/*', () => {
  it('when an applicant or an asset engineer asks, then it responds 403 FORBIDDEN; signed out 401', async () => {
    const applicant = await signedInAgent(app, 'applicant')
    const engineer = await signedInAgent(app, 'asset_engineer')
    for (const path of ['works', 'clashes', 'timeline']) {
      const url = `/api/coordination/${path}?from=${day(0)}&to=${day(10)}`
      for (const who of [applicant.agent, engineer.agent]) {
        const res = await who.get(url)
        expect(res.status).toBe(403)
        expect(res.body).toEqual({
          error: { code: 'FORBIDDEN', message: expect.any(String), requestId: expect.any(String) },
        })
      }
      expect((await app.agent().get(url)).status).toBe(401)
    }
  })

  it('when the period is malformed or runs backwards, or the bbox is not four numbers, then it responds 400 naming the field', async () => {
    const officer = await signedInAgent(app, 'permit_officer')
    const bad = await officer.agent.get('/api/coordination/clashes?from=2026-13-01&to=2026-12-31')
    expect(bad.status).toBe(400)
    expect(bad.body.error.code).toBe('VALIDATION_FAILED')
    expect(bad.body.error.fields.map((f: { field: string }) => f.field)).toContain('from')
    const back = await officer.agent.get(`/api/coordination/timeline?from=${day(5)}&to=${day(1)}`)
    expect(back.status).toBe(400)
    expect(back.body.error.fields).toEqual([{ field: 'to', message: 'Must not be before from' }])
    const bbox = await officer.agent.get(
      `/api/coordination/works?from=${day(0)}&to=${day(5)}&bbox=1,2,3`,
    )
    expect(bbox.status).toBe(400)
    expect(bbox.body.error.fields.map((f: { field: string }) => f.field)).toEqual(['bbox'])
  })

  it('when two excavations lie in the same street at the same time, then the works map, the clash list and the timeline show them', async () => {
    const origin = t.toGrid(await freeScreeningSpot(app.sequelize)) as [number, number]
    const street = unique('Quarry Lane')
    await insertStreets(app.sequelize, 25832, [
      {
        name: street,
        category: 'residential',
        coordinates: [at(origin, -20, 100), at(origin, 80, 100)],
      },
    ])
    const first = await signedInAgent(app, 'applicant')
    const second = await signedInAgent(app, 'applicant')
    const officer = await signedInAgent(app, 'permit_officer')
    const a = await submitWorks(first.agent, [pit(origin, 10, 'Pit A')], day(7), day(12), 'Dig A')
    const b = await submitWorks(second.agent, [pit(origin, 40, 'Pit B')], day(11), day(15), 'Dig B')

    // Works map: both activities, in WGS84, with their application's details.
    const [w, s] = at(origin, -5, 95)
    const [e, n] = at(origin, 60, 110)
    const works = await officer.agent.get(
      `/api/coordination/works?from=${day(0)}&to=${day(30)}&bbox=${w},${s},${e},${n}`,
    )
    expect(works.status).toBe(200)
    expect(works.body.type).toBe('FeatureCollection')
    const mine = works.body.features.filter((f: { properties: { applicationId: number } }) =>
      [a.id, b.id].includes(f.properties.applicationId),
    )
    expect(mine.map((f: { properties: unknown }) => f.properties)).toEqual([
      {
        applicationId: a.id,
        reference: a.reference,
        title: 'Dig A',
        status: expect.any(String),
        startsOn: day(7),
        endsOn: day(12),
        activityId: expect.any(Number),
        kind: 'excavation',
        label: 'Pit A',
      },
      {
        applicationId: b.id,
        reference: b.reference,
        title: 'Dig B',
        status: expect.any(String),
        startsOn: day(11),
        endsOn: day(15),
        activityId: expect.any(Number),
        kind: 'excavation',
        label: 'Pit B',
      },
    ])
    expect(mine[0].geometry.type).toBe('Polygon')
    expect(mine[0].geometry.coordinates[0][0][0]).toBeCloseTo(at(origin, 10, 101)[0]!, 6)
    // A period before the works starts shows none of them.
    const early = await officer.agent.get(`/api/coordination/works?from=${day(0)}&to=${day(6)}`)
    expect(
      early.body.features.filter((f: { properties: { applicationId: number } }) =>
        [a.id, b.id].includes(f.properties.applicationId),
      ),
    ).toEqual([])

    // Clash list: one same-street clash over the shared days.
    const clashes = await officer.agent.get(
      `/api/coordination/clashes?from=${day(0)}&to=${day(30)}`,
    )
    expect(clashes.status).toBe(200)
    expect(clashes.body.items.filter((c: { street?: string }) => c.street === street)).toEqual([
      {
        kind: 'same-street',
        from: day(11),
        to: day(12),
        applications: [
          expect.objectContaining({ applicationId: a.id, reference: a.reference }),
          expect.objectContaining({ applicationId: b.id, reference: b.reference }),
        ],
        street,
        reason: expect.stringContaining(`${a.reference} and ${b.reference} both dig in ${street}`),
      },
    ])
    expect(clashes.body.rules).toHaveLength(3)

    // Timeline: both under their street, by start date.
    const timeline = await officer.agent.get(
      `/api/coordination/timeline?from=${day(0)}&to=${day(30)}`,
    )
    expect(timeline.status).toBe(200)
    const group = timeline.body.groups.find((g: { street: string | null }) => g.street === street)
    expect(
      group.applications
        .filter((x: { applicationId: number }) => [a.id, b.id].includes(x.applicationId))
        .map((x: { applicationId: number; distanceToStreet_m: number }) => [
          x.applicationId,
          Math.round(x.distanceToStreet_m * 10) / 10,
        ]),
    ).toEqual([
      [a.id, 1],
      [b.id, 1],
    ])
  })
})
