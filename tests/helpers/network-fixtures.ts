import { QueryTypes } from 'sequelize'
import type { Sequelize } from 'sequelize'
import { crsTransform } from '../../shared/geo/crs.ts'
import type request from 'supertest'

/** Design data of a plausible PE100 water main (engine field names; covers at both ends). */
export function pe100Properties(
  ownerRef: string,
  overrides: Record<string, unknown> = {},
): Record<string, unknown> {
  return {
    ownerRef,
    medium: 'water',
    material: 'PE100',
    outerDiameter_m: 0.2,
    wallThickness_m: 0.0182,
    internalPressure_kPa: 600,
    coverStart_m: 1.2,
    coverEnd_m: 1.4,
    installation: 'trench',
    trenchWidth_m: 0.7,
    wallFrictionKMu: 0.165,
    backfillUnitWeight_kN_per_m3: 19,
    frictionAngle_deg: 30,
    sidefillModulus_MPa: 5,
    beddingAngle_deg: 90,
    groundwaterAboveCrown_m: 0,
    designTrafficPressure_kPa: 10,
    yearLaid: 1998,
    positionalAccuracy_m: 0.3,
    positionalQuality: 'surveyed',
    ...overrides,
  }
}

/** A random spot in the default service area (9.85..10.05 E, 52.55..52.65 N), away from its edges. */
export function randomSpot(): [number, number] {
  return [9.87 + Math.random() * 0.16, 52.56 + Math.random() * 0.08]
}

/**
 * A spot for a test network that no other pipe comes near: screening searches every owner's
 * pipes, and the test database keeps the rows of earlier tests and runs, so a test that
 * asserts which owners are affected must build where nothing is. Tries random spots in the
 * service area until no stored segment lies within `clear_m` of the network's extent
 * (bounding-box test on the spatial index). Test files of one project run one after another, so no two tests race here.
 */
export async function freeScreeningSpot(
  sequelize: Sequelize,
  clear_m = 500,
): Promise<[number, number]> {
  const t = crsTransform(25832)
  for (let attempt = 0; attempt < 200; attempt++) {
    const spot: [number, number] = [9.87 + Math.random() * 0.16, 52.56 + Math.random() * 0.08]
    // Test networks run up to 60 m east and 210 m north of their origin.
    const [x0, y0] = t.toGrid(spot)
    const [x1, y1, x2, y2] = [x0 - clear_m, y0 - clear_m, x0 + 60 + clear_m, y0 + 210 + clear_m]
    const box = `POLYGON((${x1} ${y1}, ${x2} ${y1}, ${x2} ${y2}, ${x1} ${y2}, ${x1} ${y1}))`
    const rows = await sequelize.query<{ n: number }>(
      'SELECT COUNT(*) AS n FROM pipe_segments WHERE MBRIntersects(geom, ST_GeomFromText(?, 25832))',
      { replacements: [box], type: QueryTypes.SELECT },
    )
    if (Number(rows[0]?.n ?? 0) === 0) return spot
  }
  throw new Error('no free spot for a test network in the service area')
}

/** A short (about 34 m) east-west line starting at `origin`, shifted north by `i` × 5 m. */
export function lineNear(
  i: number,
  origin: readonly [number, number] = [9.95, 52.6],
  lengthDeg = 0.0005,
): [number, number][] {
  const [lon, lat0] = origin
  const lat = lat0 + i * 0.000045
  return [
    [lon, lat],
    [lon + lengthDeg / 2, lat + 0.00001],
    [lon + lengthDeg, lat],
  ]
}

export function lineFeature(
  properties: Record<string, unknown>,
  coordinates: number[][],
): Record<string, unknown> {
  return { type: 'Feature', properties, geometry: { type: 'LineString', coordinates } }
}

export function featureCollection(features: unknown[]): string {
  return JSON.stringify({ type: 'FeatureCollection', features })
}

type Agent = ReturnType<typeof request.agent>

/** Upload a file's text as a multipart import; returns the response. */
export function uploadImport(
  agent: Agent,
  content: string | Buffer,
  filename = 'network.geojson',
  format?: string,
) {
  const req = agent.post('/api/network/imports')
  if (format) req.field('format', format)
  return req.attach('file', Buffer.isBuffer(content) ? content : Buffer.from(content), filename)
}

/** Poll the import until it leaves the running states; returns its last body. */
export async function waitForImport(
  agent: Agent,
  id: number,
  timeoutMs = 60_000,
): Promise<Record<string, unknown>> {
  const start = Date.now()
  for (;;) {
    const res = await agent.get(`/api/network/imports/${id}`)
    if (res.status !== 200)
      throw new Error(`GET import ${id}: ${res.status} ${JSON.stringify(res.body)}`)
    if (res.body.status !== 'validating' && res.body.status !== 'committing') return res.body
    if (Date.now() - start > timeoutMs) throw new Error(`import ${id} still ${res.body.status}`)
    await new Promise((r) => setTimeout(r, 50))
  }
}

/** Upload and validate; returns the validated (or rejected) job. */
export async function uploadAndValidate(
  agent: Agent,
  content: string | Buffer,
  filename = 'network.geojson',
  format?: string,
) {
  const up = await uploadImport(agent, content, filename, format)
  if (up.status !== 201) throw new Error(`upload: ${up.status} ${JSON.stringify(up.body)}`)
  const v = await agent.post(`/api/network/imports/${up.body.id}/validate`).send({})
  if (v.status !== 202) throw new Error(`validate: ${v.status} ${JSON.stringify(v.body)}`)
  return waitForImport(agent, up.body.id)
}

/** Upload, validate and commit; returns the final job. */
export async function importFile(
  agent: Agent,
  content: string | Buffer,
  opts: { filename?: string; format?: string; skipInvalid?: boolean } = {},
) {
  const job = await uploadAndValidate(agent, content, opts.filename, opts.format)
  if (job.status !== 'validated') throw new Error(`not validated: ${JSON.stringify(job)}`)
  const c = await agent
    .post(`/api/network/imports/${job.id}/commit`)
    .send({ skipInvalid: opts.skipInvalid ?? false })
  if (c.status !== 202) throw new Error(`commit: ${c.status} ${JSON.stringify(c.body)}`)
  return waitForImport(agent, job.id as number)
}
