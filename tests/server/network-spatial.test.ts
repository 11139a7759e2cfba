import { booleanIntersects, lineString, polygon } from '@turf/turf'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { QueryTypes } from 'sequelize'
import { crsTransform } from '../../shared/geo/crs.ts'
import { findSegmentsNear } from '../../server/services/spatial-query.ts'
import type { GridShape } from '../../server/services/spatial-query.ts'
import { signedInAgent, startTestApp } from '../helpers/test-app.ts'
import type { TestApp } from '../helpers/test-app.ts'
import {
  featureCollection,
  importFile,
  lineFeature,
  pe100Properties,
  randomSpot,
} from '../helpers/network-fixtures.ts'

// findSegmentsNear is checked against a brute-force distance written here, independently of
// shared/geo/planar-distance.ts: turf's planar booleanIntersects for contact (turf's boolean
// predicates work on the plain coordinates, here metres), else the smallest of all
// vertex-to-edge distances both ways, by the textbook projection formula. Cases within 1 mm of
// the threshold are left out: the stored coordinates are rounded to the millimetre.
const UNDECIDABLE_BAND_M = 0.001
const DISTANCE_TOLERANCE_M = 1e-6

let app: TestApp
let ownerId = 0
let rows: { id: number; line: [number, number][] }[] = []
let centre: [number, number] = [0, 0]
const epsg = 25832

// A seeded generator so a failure can be replayed (mulberry32).
function rng(seed: number) {
  return () => {
    seed = (seed + 0x6d2b79f5) | 0
    let t = Math.imul(seed ^ (seed >>> 15), 1 | seed)
    t = (t + Math.imul(t ^ (t >>> 7), 61 | t)) ^ t
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296
  }
}

function pointToSegment(p: number[], a: number[], b: number[]): number {
  const [px, py] = p as [number, number]
  const [ax, ay] = a as [number, number]
  const [bx, by] = b as [number, number]
  const l2 = (bx - ax) ** 2 + (by - ay) ** 2
  const t =
    l2 === 0 ? 0 : Math.max(0, Math.min(1, ((px - ax) * (bx - ax) + (py - ay) * (by - ay)) / l2))
  return Math.hypot(px - (ax + t * (bx - ax)), py - (ay + t * (by - ay)))
}

function bruteDistance(line: [number, number][], ring: [number, number][]): number {
  if (booleanIntersects(lineString(line), polygon([ring]))) return 0
  let best = Infinity
  for (const p of line)
    for (let i = 1; i < ring.length; i++)
      best = Math.min(best, pointToSegment(p, ring[i - 1]!, ring[i]!))
  for (const p of ring)
    for (let i = 1; i < line.length; i++)
      best = Math.min(best, pointToSegment(p, line[i - 1]!, line[i]!))
  return best
}

beforeAll(async () => {
  app = await startTestApp()
  const owner = await signedInAgent(app, 'asset_engineer')
  ownerId = owner.organisation.id
  const t = crsTransform(epsg)
  const spot = randomSpot()
  centre = t.toGrid(spot) as [number, number]
  const r = rng(20261202)
  // 300 random segments of 2-4 vertices in a 600 m square around the spot.
  const features = Array.from({ length: 300 }, (_, i) => {
    let x = centre[0] - 300 + r() * 600
    let y = centre[1] - 300 + r() * 600
    const line: number[][] = [t.toLonLat([x, y])]
    const n = 1 + Math.floor(r() * 3)
    for (let k = 0; k < n; k++) {
      x += 5 + r() * 25
      y += (r() - 0.5) * 40
      line.push(t.toLonLat([x, y]))
    }
    return lineFeature(pe100Properties(`S-${i}`), line)
  })
  const job = await importFile(owner.agent, featureCollection(features))
  expect(job).toMatchObject({ status: 'committed', segmentsInserted: 300 })
  const stored = await app.sequelize.query<{
    id: number
    g: string | { coordinates: [number, number][] }
  }>('SELECT id, ST_AsGeoJSON(geom) AS g FROM pipe_segments WHERE owner_organisation_id = ?', {
    replacements: [ownerId],
    type: QueryTypes.SELECT,
  })
  rows = stored.map((s) => ({
    id: s.id,
    line: (typeof s.g === 'string' ? JSON.parse(s.g) : s.g).coordinates,
  }))
}, 120_000)
afterAll(async () => {
  await app.close()
})

describe('findSegmentsNear', () => {
  it('finds exactly the segments a brute-force distance puts within reach, for 25 random polygons and distances', async () => {
    const r = rng(7)
    let compared = 0
    for (let k = 0; k < 25; k++) {
      const cx = centre[0] - 200 + r() * 400
      const cy = centre[1] - 200 + r() * 400
      const radius = 10 + r() * 50
      const corners = 3 + Math.floor(r() * 5)
      const ring: [number, number][] = Array.from({ length: corners }, (_, i) => {
        const a = (2 * Math.PI * i) / corners
        return [
          cx + radius * Math.cos(a) * (0.6 + 0.4 * r()),
          cy + radius * Math.sin(a) * (0.6 + 0.4 * r()),
        ] as [number, number]
      })
      ring.push(ring[0]!)
      const d = r() * 40
      const shape: GridShape = { type: 'Polygon', rings: [ring] }
      const found = await findSegmentsNear(app.sequelize, epsg, shape, d, {
        ownerOrganisationId: ownerId,
      })
      const foundIds = new Set(found.map((f) => f.id))
      for (const row of rows) {
        const bd = bruteDistance(row.line, ring)
        if (Math.abs(bd - d) < UNDECIDABLE_BAND_M) continue
        compared++
        expect(
          foundIds.has(row.id),
          `segment ${row.id}: brute force ${bd.toFixed(3)} m, limit ${d.toFixed(3)} m`,
        ).toBe(bd <= d)
        const hit = found.find((f) => f.id === row.id)
        if (hit) expect(Math.abs(hit.distance_m - bd)).toBeLessThanOrEqual(DISTANCE_TOLERANCE_M)
      }
      expect(found.map((f) => f.distance_m)).toEqual(
        [...found.map((f) => f.distance_m)].sort((a, b) => a - b),
      )
    }
    expect(compared).toBeGreaterThan(7000)
  })

  it('uses the spatial index for its candidate query', async () => {
    const plan = await app.sequelize.query<{ key: string | null; type: string }>(
      `EXPLAIN SELECT s.id FROM pipe_segments s WHERE ST_Intersects(s.geom, ST_Buffer(ST_GeomFromText('POINT(${centre[0]} ${centre[1]})', ${epsg}), 30))`,
      { type: QueryTypes.SELECT },
    )
    expect(plan[0]).toMatchObject({ key: 'pipe_segments_geom', type: 'range' })
  })

  it('returns segments that a shape crosses at distance 0, and refuses a negative distance', async () => {
    const target = rows[0]!
    const [a, b] = target.line
    const mid: [number, number] = [(a![0] + b![0]) / 2, (a![1] + b![1]) / 2]
    const box: [number, number][] = [
      [mid[0] - 1, mid[1] - 1],
      [mid[0] + 1, mid[1] - 1],
      [mid[0] + 1, mid[1] + 1],
      [mid[0] - 1, mid[1] + 1],
      [mid[0] - 1, mid[1] - 1],
    ]
    const found = await findSegmentsNear(
      app.sequelize,
      epsg,
      { type: 'Polygon', rings: [box] },
      0,
      { ownerOrganisationId: ownerId },
    )
    expect(found.find((f) => f.id === target.id)).toMatchObject({ distance_m: 0, medium: 'water' })
    await expect(
      findSegmentsNear(app.sequelize, epsg, { type: 'Polygon', rings: [box] }, -1),
    ).rejects.toThrow('distance_m must be a finite number >= 0')
  })
})
