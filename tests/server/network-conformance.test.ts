import { readFileSync, readdirSync } from 'node:fs'
import { join } from 'node:path'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { QueryTypes } from 'sequelize'
import { ROOT } from '../helpers/local-env.ts'
import { signedInAgent, startTestApp } from '../helpers/test-app.ts'
import type { TestApp } from '../helpers/test-app.ts'
import { pe100Properties, uploadAndValidate, waitForImport } from '../helpers/network-fixtures.ts'

// Source: GeoJSON conformance corpus of mapbox/geojsonhint (ISC), copied unchanged into
// tests/fixtures/geojson-conformance (see SOURCE.md there). Every bad/ file must be refused with
// a 4xx naming the problem and nothing stored; every good/ file must import or be refused only
// for a reason of ours.
const CORPUS = join(ROOT, 'tests', 'fixtures', 'geojson-conformance')

// For each bad/ file, a reason our import must name (a substring of a file or feature issue).
// Files that geojsonhint flags only as style (winding order, precision, single-member
// GeometryCollection) are not structural errors for us (RFC 7946 §3.1.6 says parsers must not
// reject on winding); they are refused because an import file must be a FeatureCollection.
const BAD_REASONS: Record<string, string> = {
  'bad-duplicate-properties.geojson': 'The member "type" appears more than once',
  'bad-featurelist.geojson': 'A linear ring must be an array of positions',
  'bad-json.geojson': "The file is not valid JSON: expected ','",
  'bad-object-type.geojson': '"type" must be a string, got an object',
  'bad-polygon-interiorring-rhr.geojson': 'this file is a single Polygon',
  'bad-polygonloop.geojson': 'A position must be an array of 2 or 3 numbers, got a number',
  'bad-properties-as-array.geojson': '"properties" must be an object or null, got an array',
  'badcoord.geojson': 'A coordinate must be a number, got the text "f"',
  'badcoordtype.geojson': 'A position must be an array of 2 or 3 numbers, got a number',
  'badfeature.geojson': 'A feature must be an object, got null',
  'badfeatureid.geojson': 'A feature id must be a string or a number, got an object',
  'bbox-4or6elements.geojson': 'bbox must have 4 or 6 numbers, got 3',
  'bbox-contains-string.geojson': 'bbox values must be numbers, got the text "4"',
  'bbox-string.geojson': 'bbox must be an array of numbers, got the text "string"',
  'different-first-last.geojson': 'A linear ring must be closed',
  'different-first-size.geojson': 'A linear ring must be closed',
  'excessive_precision_truncated.geojson': 'this file is a single LineString',
  'expected_object.geojson': '"properties" must be an object or null, got a number',
  'false.geojson': 'A geometry must be an object, got a boolean',
  'feature_changed_semantics.geojson':
    'The file\'s type must be "FeatureCollection" (case-sensitive), got "Feature"',
  'featurecollection-obj.geojson': '"features" must be an array, got an object',
  'featurecollection-type-case.geojson': 'got "featurecollection"',
  'featurecollection.geojson': 'A FeatureCollection needs a "features" array',
  'featurecollection_changed_semantics.geojson':
    'A FeatureCollection must not have a "coordinates" member (RFC 7946 §7.1)',
  'geometry_changed_semantics.geojson': 'got "Point"',
  'geometrycollection_nested.geojson': 'this file is a single GeometryCollection',
  'geometrycollection_single.geojson': 'this file is a single GeometryCollection',
  'multiple_problems.geojson': 'A feature id must be a string or a number, got an object',
  'multipoint-multidimension.geojson': 'A coordinate must be a number, got an array',
  'multipoint-nondimension.geojson': 'A position must be an array of 2 or 3 numbers, got a number',
  'nofeaturetype.geojson': 'A feature\'s type must be "Feature", got the text "Featre"',
  'notype.geojson': 'A geometry needs a "type" member',
  'point-labeled-as-a-multipolygon.geojson':
    'Polygon coordinates (an array of linear rings) must be an array, got a number',
  'point-string.geojson': 'A coordinate must be a number, got the text "foo"',
  'point-toofew.geojson':
    'A position must have 2 or 3 numbers (longitude, latitude, optional height), got 1',
  'point-toomany.geojson':
    'A position must have 2 or 3 numbers (longitude, latitude, optional height), got 4',
  'point.geojson': 'A Point needs a "coordinates" member',
  'polygon_winding_order.geojson': 'this file is a single Polygon',
  'rootstring.geojson': 'A GeoJSON file must hold one object, but it holds null',
  'short-line.geojson': 'A LineString needs at least 2 positions, got 1',
  'short-linearring.geojson': 'A linear ring needs at least 4 positions, got 3',
  'short-multilinestring.geojson': 'A LineString needs at least 2 positions, got 1',
  'stringcoord.geojson': 'A coordinate must be a number, got the text "39.36827914916011"',
  'unknowntype.geojson': 'Unknown GeoJSON type "FooBar"',
}

// Our own reasons for refusing valid GeoJSON: only FeatureCollections of LineStrings with design
// data inside the service area are pipes (so missing design data count too). Coordinates outside
// -180..180 / -90..90 (issue82) are refused because the import expects WGS84 degrees.
const OUR_REASONS =
  /must be a FeatureCollection of LineString features|must be a LineString|outside the service area|needs a geometry|^Required|is outside -1?[89]0\.\.1?[89]0|more problems of this kind/

let app: TestApp
beforeAll(async () => {
  app = await startTestApp()
})
afterAll(async () => {
  await app.close()
})

async function allMessages(
  agent: Awaited<ReturnType<typeof signedInAgent>>['agent'],
  job: Record<string, unknown>,
) {
  const report = await agent.get(`/api/network/imports/${job.id}/report?pageSize=500`)
  return [
    ...(job.fileIssues as { message: string }[]),
    ...(report.body.items as { message: string }[]),
  ].map((i) => i.message)
}

const countOf = async (organisationId: number) =>
  (
    await app.sequelize.query<{ n: number }>(
      'SELECT COUNT(*) AS n FROM pipe_segments WHERE owner_organisation_id = ?',
      {
        replacements: [organisationId],
        type: QueryTypes.SELECT,
      },
    )
  )[0]!.n

describe('GeoJSON conformance corpus: bad/', () => {
  const files = readdirSync(join(CORPUS, 'bad')).sort()
  it('has a stated reason for every file', () => {
    expect(files).toEqual(Object.keys(BAD_REASONS).sort())
  })
  for (const file of files) {
    it(`when ${file} is imported, then it is refused naming "${BAD_REASONS[file]}" and nothing is stored`, async () => {
      const { agent, organisation } = await signedInAgent(app, 'asset_engineer')
      const job = await uploadAndValidate(agent, readFileSync(join(CORPUS, 'bad', file)), file)
      expect(['rejected', 'validated']).toContain(job.status)
      if (job.status === 'validated') expect(job.featuresValid).toBe(0)
      expect((await allMessages(agent, job)).some((m) => m.includes(BAD_REASONS[file]!))).toBe(true)
      const commit = await agent
        .post(`/api/network/imports/${job.id}/commit`)
        .send({ skipInvalid: true })
      expect(commit.status).toBe(422)
      expect(commit.body.error.code).toBe('DOMAIN_RULE')
      expect(await countOf(organisation.id)).toBe(0)
    })
  }
})

describe('GeoJSON conformance corpus: good/', () => {
  for (const file of readdirSync(join(CORPUS, 'good')).sort()) {
    it(`when ${file} is imported as it is, then it is refused only for our own reasons, never a 5xx`, async () => {
      const { agent } = await signedInAgent(app, 'asset_engineer')
      const job = await uploadAndValidate(agent, readFileSync(join(CORPUS, 'good', file)), file)
      expect(['rejected', 'validated']).toContain(job.status)
      const messages = await allMessages(agent, job)
      expect(messages.length).toBeGreaterThan(0)
      for (const m of messages) expect(m).toMatch(OUR_REASONS)
    })
  }

  // The same files with their LineStrings moved into the service area and given design data:
  // those features import, the points and polygons are refused as not being pipes.
  for (const file of [
    'good-featurecollection.geojson',
    'good-featurecollection-extensions.geojson',
  ]) {
    it(`when the LineStrings of ${file} carry design data inside the service area, then they import`, async () => {
      const { agent, organisation } = await signedInAgent(app, 'asset_engineer')
      const doc = JSON.parse(readFileSync(join(CORPUS, 'good', file), 'utf8')) as {
        features: { geometry: { type: string; coordinates: number[][] }; properties: unknown }[]
      }
      doc.features.forEach((f, i) => {
        if (f.geometry.type !== 'LineString') return
        const [lon0, lat0] = f.geometry.coordinates[0]!
        f.geometry.coordinates = f.geometry.coordinates.map(([lon, lat]) => [
          9.95 + (lon! - lon0!) * 0.001,
          52.6 + (lat! - lat0!) * 0.001,
        ])
        f.properties = { ...(f.properties as object), ...pe100Properties(`corpus-${i}`) }
      })
      const job = await uploadAndValidate(agent, JSON.stringify(doc), file)
      expect(job).toMatchObject({ status: 'validated', featuresValid: 1, featuresInvalid: 2 })
      for (const m of await allMessages(agent, job)) expect(m).toMatch(OUR_REASONS)
      const commit = await agent
        .post(`/api/network/imports/${job.id}/commit`)
        .send({ skipInvalid: true })
      expect(commit.status).toBe(202)
      expect(await waitForImport(agent, job.id as number)).toMatchObject({
        status: 'committed',
        segmentsInserted: 1,
      })
      expect(await countOf(organisation.id)).toBe(1)
    })
  }
})
