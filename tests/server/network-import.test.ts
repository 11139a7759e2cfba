import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { QueryTypes } from 'sequelize'
import { failInterruptedImports, runCommit } from '../../server/services/import/import-jobs.ts'
import { NetworkImport } from '../../server/models/index.ts'
import { signedInAgent, startTestApp, unique } from '../helpers/test-app.ts'
import type { TestApp } from '../helpers/test-app.ts'
import {
  featureCollection,
  importFile,
  lineFeature,
  lineNear,
  pe100Properties,
  randomSpot,
  uploadAndValidate,
  uploadImport,
  waitForImport,
} from '../helpers/network-fixtures.ts'

let app: TestApp
beforeAll(async () => {
  app = await startTestApp()
})
afterAll(async () => {
  await app.close()
})

async function segmentsOf(organisationId: number) {
  return app.sequelize.query<{
    owner_ref: string
    version: number
    outer_diameter_m: number
    srid: number
  }>(
    'SELECT owner_ref, version, outer_diameter_m, ST_SRID(geom) AS srid FROM pipe_segments WHERE owner_organisation_id = ? ORDER BY owner_ref',
    { replacements: [organisationId], type: QueryTypes.SELECT },
  )
}

const JOB = {
  id: expect.any(Number),
  ownerOrganisationId: expect.any(Number),
  format: 'geojson',
  originalFilename: 'network.geojson',
  fileSha256: expect.stringMatching(/^[0-9a-f]{64}$/),
  fileSizeBytes: expect.any(Number),
  createdBy: expect.any(Number),
  createdAt: expect.any(String),
  errorMessage: null,
  fileIssues: [],
}

describe('POST /api/network/imports', () => {
  it('when an engineer uploads a GeoJSON file, then it responds 201 with the new job', async () => {
    const { agent, organisation, user } = await signedInAgent(app, 'asset_engineer')
    const body = featureCollection([
      lineFeature(pe100Properties(unique('W')), lineNear(0, randomSpot())),
    ])
    const res = await uploadImport(agent, body)
    expect(res.status).toBe(201)
    expect(res.body).toEqual({
      ...JOB,
      ownerOrganisationId: organisation.id,
      createdBy: user.id,
      fileSizeBytes: Buffer.byteLength(body),
      status: 'uploaded',
      skipInvalid: null,
      featuresTotal: 0,
      featuresProcessed: 0,
      featuresValid: 0,
      featuresInvalid: 0,
      segmentsInserted: 0,
      segmentsUpdated: 0,
      validatedAt: null,
      committedAt: null,
    })
  })

  it('when the body is not multipart, then it responds 400 VALIDATION_FAILED naming the file field', async () => {
    const { agent } = await signedInAgent(app, 'asset_engineer')
    const res = await agent
      .post('/api/network/imports')
      .send({ type: 'FeatureCollection', features: [] })
    expect(res.status).toBe(400)
    expect(res.body).toEqual({
      error: {
        code: 'VALIDATION_FAILED',
        message: 'Some fields need attention',
        fields: [
          { field: 'file', message: 'Send the file as multipart/form-data in the field "file"' },
        ],
        requestId: expect.any(String),
      },
    })
  })

  it('when the format cannot be told from the name, then it responds 400 naming the format field', async () => {
    const { agent } = await signedInAgent(app, 'asset_engineer')
    const res = await uploadImport(agent, '{}', 'pipes.dat')
    expect(res.status).toBe(400)
    expect(res.body.error.fields).toEqual([
      {
        field: 'format',
        message:
          'Cannot tell the format from the name "pipes.dat"; send format=geojson or format=csv',
      },
    ])
  })
})

describe('POST /api/network/imports/:id/validate and GET .../report', () => {
  it('when every feature is valid, then the job is validated with exact counts and an empty report', async () => {
    const { agent } = await signedInAgent(app, 'asset_engineer')
    const spot = randomSpot()
    const feats = [0, 1, 2].map((i) => lineFeature(pe100Properties(unique('W')), lineNear(i, spot)))
    const job = await uploadAndValidate(agent, featureCollection(feats))
    expect(job).toEqual({
      ...JOB,
      ownerOrganisationId: expect.any(Number),
      fileSizeBytes: expect.any(Number),
      status: 'validated',
      skipInvalid: null,
      featuresTotal: 3,
      featuresProcessed: 3,
      featuresValid: 3,
      featuresInvalid: 0,
      segmentsInserted: 0,
      segmentsUpdated: 0,
      validatedAt: expect.any(String),
      committedAt: null,
    })
    const report = await agent.get(`/api/network/imports/${job.id}/report`)
    expect(report.status).toBe(200)
    expect(report.body).toEqual({
      importId: job.id,
      status: 'validated',
      featuresInvalid: 0,
      truncated: false,
      items: [],
      total: 0,
      page: 1,
      pageSize: 50,
    })
  })

  it('when features break the rules, then the report names each feature and field', async () => {
    const { agent } = await signedInAgent(app, 'asset_engineer')
    const s = randomSpot()
    const p = (ref: string, o: Record<string, unknown> = {}) => pe100Properties(ref, o)
    const features = [
      lineFeature(p('ok-1'), lineNear(0, s)),
      lineFeature(p('wrong-type', { outerDiameter_m: '0.2' }), lineNear(1, s)),
      lineFeature(
        p('implausible', { outerDiameter_m: 3.5, wallThickness_m: 0.2, trenchWidth_m: 4 }),
        lineNear(2, s),
      ),
      lineFeature(p('thin-wall', { wallThickness_m: 0.002 }), lineNear(3, s)),
      lineFeature(p('self-crossing'), [
        [s[0], s[1]],
        [s[0] + 0.0003, s[1] + 0.0003],
        [s[0] + 0.0003, s[1]],
        [s[0], s[1] + 0.0003],
      ]),
      lineFeature(p('zero-length'), [
        [s[0], s[1]],
        [s[0], s[1]],
      ]),
      lineFeature(p('outside'), [
        [52.6, 9.95],
        [52.601, 9.95],
      ]),
      { type: 'Feature', properties: p('no-geometry'), geometry: null },
      { type: 'Feature', properties: p('a-point'), geometry: { type: 'Point', coordinates: s } },
      lineFeature(p('ok-1'), lineNear(4, s)),
      lineFeature(p('missing', { coverEnd_m: undefined, installation: 'tunnel' }), lineNear(5, s)),
      lineFeature(
        p('grp', { material: 'GRP', outerDiameter_m: 0.6, wallThickness_m: 0.012 }),
        lineNear(6, s),
      ),
      lineFeature(p('no-trench-width', { trenchWidth_m: null }), lineNear(7, s)),
      {
        type: 'Feature',
        properties: p('bad-coords'),
        geometry: { type: 'LineString', coordinates: [s, [s[0], 'north']] },
      },
      lineFeature(p('unknown-medium', { medium: 'steam' }), lineNear(8, s)),
    ]
    const job = await uploadAndValidate(agent, featureCollection(features))
    expect(job).toMatchObject({
      status: 'validated',
      featuresTotal: 15,
      featuresValid: 1,
      featuresInvalid: 14,
    })
    const report = await agent.get(`/api/network/imports/${job.id}/report`)
    expect(report.status).toBe(200)
    expect(report.body.items).toEqual([
      {
        index: 1,
        ownerRef: 'wrong-type',
        field: 'outerDiameter_m',
        message: 'Expected a number, got the text "0.2"',
      },
      {
        index: 2,
        ownerRef: 'implausible',
        field: 'outerDiameter_m',
        message: 'Outer diameter 3.5 is implausible for PE100 (expected 0.016 to 2.5)',
      },
      {
        index: 3,
        ownerRef: 'thin-wall',
        field: 'wallThickness_m',
        message: 'Diameter / wall ratio 100 is implausible for PE100 (expected 6 to 41)',
      },
      {
        index: 4,
        ownerRef: 'self-crossing',
        field: 'geometry',
        message: 'The line crosses or touches itself (pieces 1 and 3)',
      },
      {
        index: 5,
        ownerRef: 'zero-length',
        field: 'geometry',
        message: 'The line has zero length (under 1 cm between its ends)',
      },
      {
        index: 6,
        ownerRef: 'outside',
        field: 'geometry.coordinates.0',
        message:
          'The position 52.6, 9.95 lies outside the service area (lon 9.85..10.05, lat 52.55..52.65); are longitude and latitude swapped?',
      },
      {
        index: 7,
        ownerRef: 'no-geometry',
        field: 'geometry',
        message: 'A pipe segment needs a geometry (a LineString)',
      },
      {
        index: 8,
        ownerRef: 'a-point',
        field: 'geometry.type',
        message:
          'A pipe segment must be a LineString, got a Point (points and areas are not pipes)',
      },
      {
        index: 9,
        ownerRef: 'ok-1',
        field: 'ownerRef',
        message: 'The owner reference "ok-1" is already used by feature 0 of this file',
      },
      { index: 10, ownerRef: 'missing', field: 'coverEnd_m', message: 'Required' },
      {
        index: 10,
        ownerRef: 'missing',
        field: 'installation',
        message: "Choose 'trench' or 'embankment'",
      },
      {
        index: 11,
        ownerRef: 'grp',
        field: 'shortTermModulus_MPa',
        message:
          'Required for GRP: laminate properties are product-specific, so there is no default',
      },
      {
        index: 11,
        ownerRef: 'grp',
        field: 'longTermModulus_MPa',
        message:
          'Required for GRP: laminate properties are product-specific, so there is no default',
      },
      {
        index: 11,
        ownerRef: 'grp',
        field: 'allowableStress_MPa',
        message:
          'Required for GRP: laminate properties are product-specific, so there is no default',
      },
      {
        index: 12,
        ownerRef: 'no-trench-width',
        field: 'trenchWidth_m',
        message: 'Required for a trench installation',
      },
      {
        index: 13,
        ownerRef: 'bad-coords',
        field: 'geometry.coordinates.1.1',
        message: 'A coordinate must be a number, got the text "north"',
      },
      {
        index: 14,
        ownerRef: 'unknown-medium',
        field: 'medium',
        message: 'Choose one of water, sewer, gas, district_heating, other',
      },
    ])
  })
})

describe('POST /api/network/imports/:id/commit', () => {
  it('when invalid features exist and skipInvalid is false, then it responds 422 and nothing lands', async () => {
    const { agent, organisation } = await signedInAgent(app, 'asset_engineer')
    const s = randomSpot()
    const job = await uploadAndValidate(
      agent,
      featureCollection([
        lineFeature(pe100Properties('good'), lineNear(0, s)),
        lineFeature(pe100Properties('bad', { material: 'tin' }), lineNear(1, s)),
      ]),
    )
    const res = await agent
      .post(`/api/network/imports/${job.id}/commit`)
      .send({ skipInvalid: false })
    expect(res.status).toBe(422)
    expect(res.body).toEqual({
      error: {
        code: 'DOMAIN_RULE',
        message:
          '1 features are invalid; fix them, or choose to skip them and import the 1 valid ones',
        fields: [
          { field: 'skipInvalid', message: 'must be true to import while invalid features exist' },
        ],
        requestId: expect.any(String),
      },
    })
    expect(await segmentsOf(organisation.id)).toEqual([])
  })

  it('when the skip-invalid choice is missing, then it responds 400 naming skipInvalid', async () => {
    const { agent } = await signedInAgent(app, 'asset_engineer')
    const job = await uploadAndValidate(
      agent,
      featureCollection([lineFeature(pe100Properties('x'), lineNear(0, randomSpot()))]),
    )
    const res = await agent.post(`/api/network/imports/${job.id}/commit`).send({})
    expect(res.status).toBe(400)
    expect(res.body.error.fields).toEqual([
      {
        field: 'skipInvalid',
        message: 'Required: true to import only the valid features, false otherwise',
      },
    ])
  })

  it('when skipInvalid is true, then only the valid features land, with SRID, baseline and an audit event', async () => {
    const { agent, organisation } = await signedInAgent(app, 'asset_engineer')
    const s = randomSpot()
    const job = await importFile(
      agent,
      featureCollection([
        lineFeature(pe100Properties('good'), lineNear(0, s)),
        lineFeature(pe100Properties('bad', { material: 'tin' }), lineNear(1, s)),
      ]),
      { skipInvalid: true },
    )
    expect(job).toMatchObject({
      status: 'committed',
      skipInvalid: true,
      featuresValid: 1,
      featuresInvalid: 1,
      segmentsInserted: 1,
      segmentsUpdated: 0,
    })
    expect(await segmentsOf(organisation.id)).toEqual([
      { owner_ref: 'good', version: 1, outer_diameter_m: 0.2, srid: 25832 },
    ])
    const [audit] = await app.sequelize.query<{
      action: string
      details: string | Record<string, unknown>
    }>(
      "SELECT action, details FROM audit_events WHERE entity_type = 'network_import' AND entity_id = ? AND action = 'network.import.committed'",
      { replacements: [String(job.id)], type: QueryTypes.SELECT },
    )
    const details = typeof audit!.details === 'string' ? JSON.parse(audit!.details) : audit!.details
    expect(details).toMatchObject({ inserted: 1, updated: 0, skippedInvalid: 1 })
  })

  it('when the same owner references are imported again, then the segments are updated and versioned, not duplicated', async () => {
    const { agent, organisation } = await signedInAgent(app, 'asset_engineer')
    const s = randomSpot()
    const first = await importFile(
      agent,
      featureCollection([
        lineFeature(pe100Properties('A'), lineNear(0, s)),
        lineFeature(pe100Properties('B'), lineNear(1, s)),
      ]),
    )
    expect(first).toMatchObject({ segmentsInserted: 2, segmentsUpdated: 0 })
    const again = await importFile(
      agent,
      featureCollection([
        lineFeature(
          pe100Properties('A', { outerDiameter_m: 0.25, wallThickness_m: 0.0227 }),
          lineNear(0, s),
        ),
        lineFeature(pe100Properties('C'), lineNear(2, s)),
      ]),
    )
    expect(again).toMatchObject({ status: 'committed', segmentsInserted: 1, segmentsUpdated: 1 })
    expect(await segmentsOf(organisation.id)).toEqual([
      { owner_ref: 'A', version: 2, outer_diameter_m: 0.25, srid: 25832 },
      { owner_ref: 'B', version: 1, outer_diameter_m: 0.2, srid: 25832 },
      { owner_ref: 'C', version: 1, outer_diameter_m: 0.2, srid: 25832 },
    ])
  })

  it('when a failure happens mid-commit, then the whole import rolls back and nothing of it remains', async () => {
    const { agent, organisation, user } = await signedInAgent(app, 'asset_engineer')
    const s = randomSpot()
    const feats = Array.from({ length: 1200 }, (_, i) =>
      lineFeature(
        pe100Properties(`R-${i}`),
        lineNear(i % 200, [s[0] + Math.floor(i / 200) * 0.001, s[1]]),
      ),
    )
    const job = await uploadAndValidate(agent, featureCollection(feats))
    expect(job).toMatchObject({ status: 'validated', featuresValid: 1200 })
    await NetworkImport.update(
      { status: 'committing', skipInvalid: false },
      { where: { id: job.id as number } },
    )
    let batches = 0
    await expect(
      runCommit(job.id as number, user.id, app.config, app.sequelize, {
        afterBatch: () => {
          if (++batches === 2) throw new Error('disk full (simulated)')
        },
      }),
    ).rejects.toThrow('disk full (simulated)')
    expect(batches).toBe(2)
    expect(await segmentsOf(organisation.id)).toEqual([])
    const after = await waitForImport(agent, job.id as number)
    expect(after).toMatchObject({
      status: 'failed',
      segmentsInserted: 0,
      errorMessage: 'Nothing was imported: disk full (simulated)',
    })
  })
})

describe('CSV import with a saved mapping', () => {
  it('when an owner maps its own column names and units, then the preview lists them and the import lands converted', async () => {
    const { agent, organisation } = await signedInAgent(app, 'asset_engineer')
    const [lon, lat] = randomSpot()
    const mapping = {
      fields: {
        ownerRef: 'ASSET_ID',
        material: 'MAT',
        outerDiameter_m: 'DN_OD',
        wallThickness_m: 'WALL',
        internalPressure_kPa: 'PN',
        coverStart_m: 'COVER_A',
        coverEnd_m: 'COVER_B',
      },
      diameterUnit: 'mm',
      wallThicknessUnit: 'mm',
      pressureUnit: 'bar',
      materialValues: { PE: 'PE100' },
      csv: { delimiter: ';', wktColumn: 'GEOM', decimalComma: true },
    }
    const put = await agent.put('/api/network/mapping').send(mapping)
    expect(put.status).toBe(200)
    expect(put.body).toEqual({ ...mapping, mediumValues: {}, defaultMedium: null })
    const rest =
      'installation;trenchWidth_m;wallFrictionKMu;backfillUnitWeight_kN_per_m3;frictionAngle_deg;sidefillModulus_MPa;beddingAngle_deg;groundwaterAboveCrown_m;designTrafficPressure_kPa'
    const restValues = 'trench;0,7;0,165;19;30;5;90;0;10'
    const csv = [
      `ASSET_ID;MAT;DN_OD;WALL;PN;COVER_A;COVER_B;${rest};GEOM`,
      `CSV-1;PE;200;18,2;6;1,2;1,4;${restValues};"LINESTRING (${lon} ${lat}, ${lon + 0.0005} ${lat})"`,
      `CSV-2;PE;abc;18,2;6;1,2;1,4;${restValues};"LINESTRING (${lon} ${lat + 0.0001}, ${lon + 0.0005} ${lat + 0.0001})"`,
    ].join('\n')
    const up = await uploadImport(agent, csv, 'pipes.csv')
    expect(up.status).toBe(201)
    const preview = await agent.get(`/api/network/imports/${up.body.id}/preview`)
    expect(preview.status).toBe(200)
    expect(preview.body.sourceAttributes).toEqual([
      'ASSET_ID',
      'MAT',
      'DN_OD',
      'WALL',
      'PN',
      'COVER_A',
      'COVER_B',
      ...rest.split(';'),
    ])
    expect(preview.body.mapping).toEqual(put.body)
    expect(preview.body.sampleFeatures[0]).toMatchObject({ ASSET_ID: 'CSV-1', DN_OD: '200' })
    expect(preview.body.targetFields).toContainEqual({
      field: 'outerDiameter_m',
      required: true,
      unit: 'm',
    })
    await agent.post(`/api/network/imports/${up.body.id}/validate`).send({})
    const job = await waitForImport(agent, up.body.id)
    expect(job).toMatchObject({
      format: 'csv',
      status: 'validated',
      featuresValid: 1,
      featuresInvalid: 1,
    })
    const report = await agent.get(`/api/network/imports/${up.body.id}/report`)
    expect(report.body.items).toEqual([
      {
        index: 1,
        ownerRef: 'CSV-2',
        field: 'outerDiameter_m',
        message: 'Expected a number (attribute "DN_OD"), got the text "abc"',
      },
    ])
    await agent.post(`/api/network/imports/${up.body.id}/commit`).send({ skipInvalid: true })
    expect(await waitForImport(agent, up.body.id)).toMatchObject({
      status: 'committed',
      segmentsInserted: 1,
    })
    const [row] = await app.sequelize.query<Record<string, number | string>>(
      'SELECT owner_ref, material, outer_diameter_m, wall_thickness_m, internal_pressure_kPa, trench_width_m FROM pipe_segments WHERE owner_organisation_id = ?',
      { replacements: [organisation.id], type: QueryTypes.SELECT },
    )
    expect(row).toEqual({
      owner_ref: 'CSV-1',
      material: 'PE100',
      outer_diameter_m: 0.2,
      wall_thickness_m: 0.0182,
      internal_pressure_kPa: 600,
      trench_width_m: 0.7,
    })
  })

  it('when the CSV has no geometry column, then validation rejects the file naming the column', async () => {
    const { agent } = await signedInAgent(app, 'asset_engineer')
    const job = await uploadAndValidate(agent, 'ownerRef,material\nA,PE100\n', 'pipes.csv')
    expect(job).toMatchObject({
      status: 'rejected',
      fileIssues: [
        {
          field: 'header',
          message:
            'No geometry column "wkt" (columns: ownerRef, material); set the WKT column in the mapping',
        },
      ],
    })
    const commit = await agent
      .post(`/api/network/imports/${job.id}/commit`)
      .send({ skipInvalid: true })
    expect(commit.status).toBe(422)
    expect(commit.body.error.message).toBe(
      'The file was rejected: No geometry column "wkt" (columns: ownerRef, material); set the WKT column in the mapping',
    )
  })
})

describe('start-up sweep of interrupted imports', () => {
  it('when a job was left committing by a stopped process, then start-up marks it failed; a fresh one is left alone', async () => {
    const { agent } = await signedInAgent(app, 'asset_engineer')
    const s = randomSpot()
    const old = await uploadAndValidate(
      agent,
      featureCollection([lineFeature(pe100Properties('I-1'), lineNear(0, s))]),
    )
    const fresh = await uploadAndValidate(
      agent,
      featureCollection([lineFeature(pe100Properties('I-2'), lineNear(1, s))]),
    )
    await app.sequelize.query(
      "UPDATE network_imports SET status = 'committing', updated_at = NOW() - INTERVAL 1 HOUR WHERE id = ?",
      { replacements: [old.id] },
    )
    await app.sequelize.query("UPDATE network_imports SET status = 'committing' WHERE id = ?", {
      replacements: [fresh.id],
    })
    expect(await failInterruptedImports()).toBeGreaterThanOrEqual(1)
    expect((await agent.get(`/api/network/imports/${old.id}`)).body).toMatchObject({
      status: 'failed',
      errorMessage:
        'Interrupted by a server restart; nothing was imported. Validate and commit again.',
    })
    expect((await agent.get(`/api/network/imports/${fresh.id}`)).body.status).toBe('committing')
    await app.sequelize.query("UPDATE network_imports SET status = 'failed' WHERE id = ?", {
      replacements: [fresh.id],
    })
  })
})
