import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { QueryTypes } from 'sequelize'
import { signedInAgent, startTestApp } from '../helpers/test-app.ts'
import type { TestApp } from '../helpers/test-app.ts'
import {
  featureCollection,
  importFile,
  lineFeature,
  lineNear,
  pe100Properties,
  randomSpot,
  uploadAndValidate,
  waitForImport,
} from '../helpers/network-fixtures.ts'

let app: TestApp
beforeAll(async () => {
  app = await startTestApp()
})
afterAll(async () => {
  await app.close()
})

type Agent = Awaited<ReturnType<typeof signedInAgent>>['agent']

/** An owner with three segments: two PE100 water mains and one over-capacity one. */
async function ownerWithNetwork() {
  const owner = await signedInAgent(app, 'asset_engineer')
  const spot = randomSpot()
  await importFile(
    owner.agent,
    featureCollection([
      lineFeature(
        pe100Properties('main-b', {
          outerDiameter_m: 0.25,
          wallThickness_m: 0.0227,
          yearLaid: 2004,
        }),
        lineNear(0, spot),
      ),
      lineFeature(pe100Properties('main-a'), lineNear(1, spot)),
      // 1600 kPa in a PE100 SDR 11 pipe: Barlow hoop stress 1600·0.2/(2·0.0182) = 8.8 MPa > 8 MPa.
      lineFeature(pe100Properties('over-1', { internalPressure_kPa: 1600 }), lineNear(2, spot)),
    ]),
  )
  return { ...owner, spot }
}

async function idOf(agent: Agent, ref: string): Promise<number> {
  const res = await agent.get(`/api/network/segments?q=${ref}`)
  return res.body.items.find((i: { ownerRef: string }) => i.ownerRef === ref).id
}

describe('GET /api/network/segments', () => {
  it('when an engineer lists, then only their own segments come back, sorted and paged on the server', async () => {
    const { agent } = await ownerWithNetwork()
    await ownerWithNetwork() // another owner's segments must not show
    const res = await agent.get('/api/network/segments?sort=ownerRef&order=desc&pageSize=2')
    expect(res.status).toBe(200)
    expect(res.body).toEqual({
      total: 3,
      page: 1,
      pageSize: 2,
      items: [
        {
          id: expect.any(Number),
          ownerRef: 'over-1',
          medium: 'water',
          material: 'PE100',
          outerDiameter_m: 0.2,
          coverMin_m: 1.2,
          yearLaid: 1998,
          length_m: expect.closeTo(33.9, 0),
          baselineVerdict: 'critical',
          baselineGoverningCheck: 'hoop-stress',
          baselineUtilisation: expect.closeTo(1.0989, 3),
          baselineOverCapacity: true,
          version: 1,
          updatedAt: expect.any(String),
        },
        expect.objectContaining({
          ownerRef: 'main-b',
          outerDiameter_m: 0.25,
          baselineOverCapacity: false,
        }),
      ],
    })
  })

  it('when filtered by over-capacity, material and text, then the filters apply', async () => {
    const { agent } = await ownerWithNetwork()
    const over = await agent.get('/api/network/segments?overCapacity=true')
    expect(over.body.items.map((i: { ownerRef: string }) => i.ownerRef)).toEqual(['over-1'])
    const text = await agent.get('/api/network/segments?q=main&sort=yearLaid&order=desc')
    expect(text.body.items.map((i: { ownerRef: string }) => i.ownerRef)).toEqual([
      'main-b',
      'main-a',
    ])
    const none = await agent.get('/api/network/segments?material=concrete')
    expect(none.body).toMatchObject({ total: 0, items: [] })
  })

  it('when a filter is malformed, then it responds 400 naming it', async () => {
    const { agent } = await signedInAgent(app, 'asset_engineer')
    const res = await agent.get('/api/network/segments?overCapacity=maybe&sort=colour')
    expect(res.status).toBe(400)
    expect(res.body.error.fields.map((f: { field: string }) => f.field)).toEqual([
      'overCapacity',
      'sort',
    ])
  })
})

describe('GET /api/network/segments/:id', () => {
  it('when the owner asks, then it responds with the design data, geometry and baseline checks', async () => {
    const { agent, organisation, spot } = await ownerWithNetwork()
    const id = await idOf(agent, 'over-1')
    const res = await agent.get(`/api/network/segments/${id}`)
    expect(res.status).toBe(200)
    expect(res.body).toMatchObject({
      id,
      owner: { id: organisation.id, name: organisation.name },
      ...pe100Properties('over-1', { internalPressure_kPa: 1600 }),
      shortTermModulus_MPa: null,
      version: 1,
      baseline: {
        verdict: 'critical',
        governingCheck: 'hoop-stress',
        overCapacity: true,
        error: null,
      },
    })
    expect(res.body.geometry.coordinates[0][0]).toBeCloseTo(spot[0], 7)
    expect(res.body.baseline.checks.find((c: { id: string }) => c.id === 'hoop-stress')).toEqual({
      id: 'hoop-stress',
      method: expect.any(String),
      unit: 'MPa',
      demand: expect.closeTo((1600 * 0.2) / (2 * 0.0182) / 1000, 9),
      capacity: 8,
      utilisation: expect.closeTo((1600 * 0.2) / (2 * 0.0182) / 1000 / 8, 9),
    })
    expect(res.body.baseline.assumptions).toContain(
      'Cover: the engine used the smaller of the two recorded covers (1.20 m); the soil load alone is larger at the deeper end.',
    )
  })

  it('when the segment does not exist, then it responds 404', async () => {
    const { agent } = await signedInAgent(app, 'asset_engineer')
    const res = await agent.get('/api/network/segments/999999999')
    expect(res.status).toBe(404)
    expect(res.body).toEqual({
      error: {
        code: 'NOT_FOUND',
        message: 'No pipe segment with id 999999999',
        requestId: expect.any(String),
      },
    })
  })
})

describe('PATCH /api/network/segments/:id', () => {
  it('when the owner edits with the current version, then the data, version and baseline update and the change is audited', async () => {
    const { agent } = await ownerWithNetwork()
    const id = await idOf(agent, 'over-1')
    const res = await agent
      .patch(`/api/network/segments/${id}`)
      .send({ version: 1, internalPressure_kPa: 1000, yearLaid: null })
    expect(res.status).toBe(200)
    expect(res.body).toMatchObject({
      id,
      version: 2,
      internalPressure_kPa: 1000,
      yearLaid: null,
      baseline: { overCapacity: false, verdict: 'clear' },
    })
    const [audit] = await app.sequelize.query<{ details: string | Record<string, unknown> }>(
      "SELECT details FROM audit_events WHERE action = 'network.segment.updated' AND entity_id = ? ORDER BY id DESC LIMIT 1",
      { replacements: [String(id)], type: QueryTypes.SELECT },
    )
    const details = typeof audit!.details === 'string' ? JSON.parse(audit!.details) : audit!.details
    expect(details).toEqual({
      changes: {
        internalPressure_kPa: { from: 1600, to: 1000 },
        yearLaid: { from: 1998, to: null },
      },
      geometryChanged: false,
      version: 2,
    })
  })

  it('when the version is stale, then it responds 409 and changes nothing', async () => {
    const { agent } = await ownerWithNetwork()
    const id = await idOf(agent, 'main-a')
    expect(
      (await agent.patch(`/api/network/segments/${id}`).send({ version: 1, coverStart_m: 1.5 }))
        .status,
    ).toBe(200)
    const res = await agent
      .patch(`/api/network/segments/${id}`)
      .send({ version: 1, coverStart_m: 2.5 })
    expect(res.status).toBe(409)
    expect(res.body).toEqual({
      error: {
        code: 'CONFLICT',
        message:
          'The segment was changed by someone else (now version 2); reload it and apply your change again',
        fields: [{ field: 'version', message: 'is out of date' }],
        requestId: expect.any(String),
      },
    })
    expect((await agent.get(`/api/network/segments/${id}`)).body).toMatchObject({
      version: 2,
      coverStart_m: 1.5,
    })
  })

  it('when the edit breaks the same rules as an import, then it responds 400 naming the fields', async () => {
    const { agent } = await ownerWithNetwork()
    const id = await idOf(agent, 'main-a')
    const res = await agent
      .patch(`/api/network/segments/${id}`)
      .send({ version: 1, wallThickness_m: 0.002, trenchWidth_m: null })
    expect(res.status).toBe(400)
    expect(res.body.error).toEqual({
      code: 'VALIDATION_FAILED',
      message: 'Some fields need attention',
      fields: [
        { field: 'trenchWidth_m', message: 'Required for a trench installation' },
        {
          field: 'wallThickness_m',
          message: 'Diameter / wall ratio 100 is implausible for PE100 (expected 6 to 41)',
        },
      ],
      requestId: expect.any(String),
    })
    const geo = await agent.patch(`/api/network/segments/${id}`).send({
      version: 1,
      geometry: {
        type: 'LineString',
        coordinates: [
          [1, 1],
          [1.001, 1],
        ],
      },
    })
    expect(geo.status).toBe(400)
    expect(geo.body.error.fields[0]).toEqual({
      field: 'geometry.coordinates.0',
      message:
        'The position 1, 1 lies outside the service area (lon 9.85..10.05, lat 52.55..52.65); are longitude and latitude swapped?',
    })
    const typo = await agent.patch(`/api/network/segments/${id}`).send({ version: 1, cover_m: 2 })
    expect(typo.status).toBe(400)
    expect(typo.body.error.fields).toEqual([{ field: 'cover_m', message: 'Unknown field' }])
  })

  it('when the new geometry is valid, then the line and its length change', async () => {
    const { agent, spot } = await ownerWithNetwork()
    const id = await idOf(agent, 'main-a')
    const coordinates = [spot, [spot[0], spot[1] + 0.001]]
    const res = await agent
      .patch(`/api/network/segments/${id}`)
      .send({ version: 1, geometry: { type: 'LineString', coordinates } })
    expect(res.status).toBe(200)
    expect(res.body.length_m).toBeCloseTo(111.3, 0)
  })
})

describe('GET /api/network/export', () => {
  it('when the owner exports and imports the file again, then every segment comes back unchanged but one version up', async () => {
    const { agent, organisation } = await ownerWithNetwork()
    const before = (await agent.get('/api/network/segments?sort=ownerRef')).body.items
    const res = await agent
      .get('/api/network/export')
      .buffer(true)
      .parse((r, cb) => {
        let text = ''
        r.on('data', (c: Buffer) => (text += c.toString('utf8')))
        r.on('end', () => cb(null, text))
      })
    expect(res.status).toBe(200)
    expect(res.headers['content-type']).toBe('application/geo+json; charset=utf-8')
    const doc = JSON.parse(res.body as unknown as string)
    expect(doc.type).toBe('FeatureCollection')
    expect(doc.features).toHaveLength(3)
    expect(doc.features[0].properties).toMatchObject({
      ...pe100Properties('main-b', {
        outerDiameter_m: 0.25,
        wallThickness_m: 0.0227,
        yearLaid: 2004,
      }),
      segmentId: expect.any(Number),
    })

    const job = await uploadAndValidate(agent, res.body as unknown as string, 'export.geojson')
    expect(job).toMatchObject({ status: 'validated', featuresValid: 3, featuresInvalid: 0 })
    await agent.post(`/api/network/imports/${job.id}/commit`).send({ skipInvalid: false })
    expect(await waitForImport(agent, job.id as number)).toMatchObject({
      status: 'committed',
      segmentsInserted: 0,
      segmentsUpdated: 3,
    })
    const after = (await agent.get('/api/network/segments?sort=ownerRef')).body.items
    expect(after).toEqual(
      before.map((b: Record<string, unknown>) => ({
        ...b,
        version: 2,
        updatedAt: expect.any(String),
        length_m: expect.closeTo(b.length_m as number, 2),
      })),
    )
    const lines = await app.sequelize.query<{ n: number }>(
      'SELECT COUNT(*) AS n FROM pipe_segments WHERE owner_organisation_id = ?',
      {
        replacements: [organisation.id],
        type: QueryTypes.SELECT,
      },
    )
    expect(lines[0]!.n).toBe(3)
  })
})

describe('GET /api/network/outline', () => {
  it('when an applicant asks for a view, then it gets where pipes lie, whose and what medium, and no design data', async () => {
    const { organisation, spot } = await ownerWithNetwork()
    const { agent } = await signedInAgent(app, 'applicant')
    const bbox = [spot[0] - 0.0002, spot[1] - 0.0002, spot[0] + 0.0008, spot[1] + 0.0003].join(',')
    const res = await agent.get(`/api/network/outline?bbox=${bbox}`)
    expect(res.status).toBe(200)
    const ours = res.body.features.filter(
      (f: { properties: { ownerName: string } }) => f.properties.ownerName === organisation.name,
    )
    expect(ours).toHaveLength(3)
    for (const f of res.body.features) {
      expect(Object.keys(f).sort()).toEqual(['geometry', 'id', 'properties', 'type'])
      expect(Object.keys(f.properties).sort()).toEqual(['medium', 'ownerName'])
    }
    expect(ours[0]).toEqual({
      type: 'Feature',
      id: expect.any(Number),
      properties: { ownerName: organisation.name, medium: 'water' },
      geometry: { type: 'LineString', coordinates: expect.any(Array) },
    })
    expect(res.body.truncated).toBe(false)
  })

  it('when the bbox is malformed, then it responds 400 naming bbox', async () => {
    const { agent } = await signedInAgent(app, 'applicant')
    const res = await agent.get('/api/network/outline?bbox=10,52,9,53')
    expect(res.status).toBe(400)
    expect(res.body.error.fields).toEqual([
      { field: 'bbox', message: 'The minimum must be below the maximum' },
    ])
  })
})
