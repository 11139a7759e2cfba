import { bbox as turfBbox, bboxPolygon, booleanIntersects, lineString } from '@turf/turf'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { QueryTypes } from 'sequelize'
import { crsTransform } from '../../shared/geo/crs.ts'
import { mapLinesQuery } from '../../server/services/network-map-lines.ts'
import type { MapLineCollection, MapLineFeature } from '../../shared/types/network.ts'
import { signedInAgent, startTestApp } from '../helpers/test-app.ts'
import type { TestApp } from '../helpers/test-app.ts'
import {
  featureCollection,
  importFile,
  lineFeature,
  pe100Properties,
  randomSpot,
} from '../helpers/network-fixtures.ts'

// GET /api/network/map-lines: the owner's network map loads only the view, compactly. The
// selection is checked against a brute-force test written here on the stored lines in lon/lat:
// every line that crosses the view must come back, and nothing comes back whose extent lies
// clearly outside it (the server selects by the lines' bounding boxes against a projected
// rectangle enclosing the view, so a line a few metres outside may come too).
const EDGE_MARGIN_DEG = 0.0003 // about 20-30 m here
const MAX_FEATURES = 40 // small, so the truncated flag can be tested with a small network
const epsg = 25832

let app: TestApp
type Agent = Awaited<ReturnType<typeof signedInAgent>>['agent']
let owner: Agent
let otherOwner: Agent
let admin: Agent
let applicant: Agent
let permitOfficer: Agent
let ownerId = 0
let otherOwnerId = 0
let spot: [number, number] = [0, 0]
/** My stored lines in lon/lat, by id. */
const mine = new Map<number, [number, number][]>()
const theirs = new Set<number>()

// A seeded generator so a failure can be replayed (mulberry32).
function rng(seed: number) {
  return () => {
    seed = (seed + 0x6d2b79f5) | 0
    let t = Math.imul(seed ^ (seed >>> 15), 1 | seed)
    t = (t + Math.imul(t ^ (t >>> 7), 61 | t)) ^ t
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296
  }
}

/** `count` random lines of 2-4 vertices in a 500 m square around the spot. */
function network(prefix: string, count: number, seed: number): string {
  const t = crsTransform(epsg)
  const centre = t.toGrid(spot)
  const r = rng(seed)
  const features = Array.from({ length: count }, (_, i) => {
    let x = centre[0] - 250 + r() * 500
    let y = centre[1] - 250 + r() * 500
    const line: number[][] = [t.toLonLat([x, y])]
    for (let k = 0, n = 1 + Math.floor(r() * 3); k < n; k++) {
      x += 5 + r() * 25
      y += (r() - 0.5) * 40
      line.push(t.toLonLat([x, y]))
    }
    return lineFeature(pe100Properties(`${prefix}-${i}`), line)
  })
  return featureCollection(features)
}

async function storedLines(organisationId: number): Promise<Map<number, [number, number][]>> {
  const t = crsTransform(epsg)
  const rows = await app.sequelize.query<{
    id: number
    g: string | { coordinates: [number, number][] }
  }>('SELECT id, ST_AsGeoJSON(geom) AS g FROM pipe_segments WHERE owner_organisation_id = ?', {
    replacements: [organisationId],
    type: QueryTypes.SELECT,
  })
  return new Map(
    rows.map((s) => [
      Number(s.id),
      (typeof s.g === 'string' ? JSON.parse(s.g) : s.g).coordinates.map(
        (c: [number, number]) => t.toLonLat(c) as [number, number],
      ),
    ]),
  )
}

/** A view of the given size in metres, its south-west corner `dx`, `dy` metres from the spot. */
function view(dx: number, dy: number, width_m: number, height_m: number) {
  const t = crsTransform(epsg)
  const c = t.toGrid(spot)
  const sw = t.toLonLat([c[0] + dx, c[1] + dy])
  const ne = t.toLonLat([c[0] + dx + width_m, c[1] + dy + height_m])
  return [sw[0], sw[1], ne[0], ne[1]] as [number, number, number, number]
}

const get = (agent: Agent, bbox: readonly number[], zoom: number) =>
  agent.get(`/api/network/map-lines?bbox=${bbox.join(',')}&zoom=${zoom}`)

beforeAll(async () => {
  app = await startTestApp({ MAP_LINES_MAX_FEATURES: String(MAX_FEATURES) })
  const o = await signedInAgent(app, 'asset_engineer')
  owner = o.agent
  ownerId = o.organisation.id
  const other = await signedInAgent(app, 'asset_engineer')
  otherOwner = other.agent
  otherOwnerId = other.organisation.id
  admin = (await signedInAgent(app, 'admin')).agent
  applicant = (await signedInAgent(app, 'applicant')).agent
  permitOfficer = (await signedInAgent(app, 'permit_officer')).agent
  spot = randomSpot()
  expect(await importFile(owner, network('ML', 150, 4))).toMatchObject({
    status: 'committed',
    segmentsInserted: 150,
  })
  expect(await importFile(otherOwner, network('OTHER', 30, 5))).toMatchObject({
    status: 'committed',
  })
  for (const [id, line] of await storedLines(ownerId)) mine.set(id, line)
  for (const id of (await storedLines(otherOwnerId)).keys()) theirs.add(id)
}, 120_000)
afterAll(async () => {
  await app.close()
})

describe('GET /api/network/map-lines', () => {
  it('returns exactly my segments in the view (brute force), compact, for 12 random views', async () => {
    const r = rng(11)
    let inside = 0
    let outside = 0
    for (let k = 0; k < 12; k++) {
      const bbox = view(-250 + r() * 350, -250 + r() * 350, 60 + r() * 100, 60 + r() * 100)
      const res = await get(owner, bbox, 16)
      expect(res.status).toBe(200)
      const body = res.body as MapLineCollection
      expect(body.truncated).toBe(false)
      const ids = new Set(body.features.map((f) => f.id))
      const box = bboxPolygon(bbox)
      const near = bboxPolygon([
        bbox[0] - EDGE_MARGIN_DEG,
        bbox[1] - EDGE_MARGIN_DEG,
        bbox[2] + EDGE_MARGIN_DEG,
        bbox[3] + EDGE_MARGIN_DEG,
      ])
      for (const f of body.features) {
        expect(mine.has(f.id), `segment ${f.id} is not mine`).toBe(true)
        expect(theirs.has(f.id)).toBe(false)
      }
      for (const [id, line] of mine) {
        const crosses = booleanIntersects(lineString(line), box)
        const envelopeNear = booleanIntersects(bboxPolygon(turfBbox(lineString(line))), near)
        if (crosses) {
          inside++
          expect(ids.has(id), `segment ${id} crosses the view but was not returned`).toBe(true)
        } else if (!envelopeNear) {
          outside++
          expect(ids.has(id), `segment ${id} lies outside the view but was returned`).toBe(false)
        }
      }
    }
    expect(inside).toBeGreaterThan(30)
    expect(outside).toBeGreaterThan(500)
  })

  it('sends every vertex rounded to 6 decimals from zoom 14, and only the end points below', async () => {
    const bbox = view(-100, -100, 200, 200)
    const full = (await get(owner, bbox, 14)).body as MapLineCollection
    const ends = (await get(owner, bbox, 13.5)).body as MapLineCollection
    expect(full.features.length).toBeGreaterThan(5)
    expect(ends.features.map((f) => f.id).sort()).toEqual(full.features.map((f) => f.id).sort())
    const round = (c: [number, number]) => c.map((v) => Math.round(v * 1e6) / 1e6)
    let bent = 0
    for (const f of full.features) {
      const stored = mine.get(f.id)!
      expect(f.geometry.coordinates).toEqual(stored.map(round))
      for (const [lon, lat] of f.geometry.coordinates) {
        expect(Math.abs(lon * 1e6 - Math.round(lon * 1e6))).toBeLessThan(1e-6)
        expect(Math.abs(lat * 1e6 - Math.round(lat * 1e6))).toBeLessThan(1e-6)
      }
      const e = ends.features.find((x) => x.id === f.id) as MapLineFeature
      expect(e.geometry.coordinates).toEqual([round(stored[0]!), round(stored.at(-1)!)])
      expect(e.properties).toEqual(f.properties)
      if (stored.length > 2) bent++
    }
    expect(bent).toBeGreaterThan(0)
    const f = full.features[0]!
    expect(Object.keys(f).sort()).toEqual(['geometry', 'id', 'properties', 'type'])
    expect(f.properties).toEqual({ m: 'water', u: expect.any(Number), o: expect.any(Number) })
    expect([0, 1]).toContain(f.properties.o)
  })

  it('says truncated when the view holds more than MAP_LINES_MAX_FEATURES segments', async () => {
    const all = await get(owner, view(-400, -400, 800, 800), 12)
    expect(all.status).toBe(200)
    expect(all.body.truncated).toBe(true)
    expect(all.body.features).toHaveLength(MAX_FEATURES)
    const small = await get(owner, view(-20, -20, 40, 40), 18)
    expect(small.body.truncated).toBe(false)
    expect(small.body.features.length).toBeLessThan(MAX_FEATURES)
  })

  it("gives another owner's engineer only their own segments, an admin every owner's", async () => {
    const bbox = view(-100, -100, 200, 200)
    const res = await get(otherOwner, bbox, 16)
    expect(res.status).toBe(200)
    const ids = (res.body as MapLineCollection).features.map((f) => f.id)
    expect(ids.length).toBeGreaterThan(0)
    for (const id of ids) {
      expect(theirs.has(id)).toBe(true)
      expect(mine.has(id)).toBe(false)
    }
    const adminRes = await get(admin, bbox, 16)
    expect(adminRes.status).toBe(200)
    const adminIds = (adminRes.body as MapLineCollection).features.map((f) => f.id)
    expect(adminIds.some((id) => mine.has(id))).toBe(true)
    expect(adminIds.some((id) => theirs.has(id))).toBe(true)
    const oneOwner = await admin.get(
      `/api/network/map-lines?bbox=${bbox.join(',')}&zoom=16&ownerId=${ownerId}`,
    )
    for (const f of (oneOwner.body as MapLineCollection).features) expect(mine.has(f.id)).toBe(true)
  })

  it('refuses applicants and permit officers (403) and anonymous callers (401)', async () => {
    const bbox = view(-100, -100, 200, 200)
    expect((await get(applicant, bbox, 16)).status).toBe(403)
    expect((await get(permitOfficer, bbox, 16)).status).toBe(403)
    expect((await get(app.agent(), bbox, 16)).status).toBe(401)
  })

  it('responds 400 naming bbox for a malformed bbox, and naming zoom without a zoom', async () => {
    for (const bad of ['10,52,9,53', '1,2,3', 'a,b,c,d', '']) {
      const res = await owner.get(`/api/network/map-lines?bbox=${bad}&zoom=15`)
      expect(res.status, bad).toBe(400)
      expect(res.body.error.fields.map((f: { field: string }) => f.field)).toContain('bbox')
    }
    const noZoom = await owner.get(`/api/network/map-lines?bbox=${view(0, 0, 50, 50).join(',')}`)
    expect(noZoom.status).toBe(400)
    expect(noZoom.body.error.fields.map((f: { field: string }) => f.field)).toContain('zoom')
  })

  it('selects with the spatial index, for both the detailed and the end-point query', async () => {
    for (const zoom of [16, 12]) {
      const { sql, replacements } = mapLinesQuery(
        epsg,
        { bbox: view(-50, -50, 100, 100), zoom, ownerOrganisationId: ownerId },
        MAX_FEATURES,
      )
      const plan = await app.sequelize.query<{ key: string | null; type: string }>(
        `EXPLAIN ${sql}`,
        { replacements, type: QueryTypes.SELECT },
      )
      expect(plan[0]).toMatchObject({ key: 'pipe_segments_geom', type: 'range' })
    }
  })
})
