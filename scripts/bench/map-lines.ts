/**
 * Network map benchmark: times the query behind GET /api/network/map-lines (mapLinesInBox: the
 * spatial-index selection, the transform to lon/lat and the JSON text) for a town-sized and a
 * street-sized view around the largest owner's network in a database, and, for comparison, the
 * whole-network GeoJSON export the map used to download. It reports; it does not gate.
 *
 * Usage: node --import tsx scripts/bench/map-lines.ts [database] [runs]
 *   database: default trenchward_test (whatever the tests left); `trenchward_bench` after
 *   `node --import tsx scripts/bench/import-network.ts 100000` holds a 100,000-segment owner.
 */
import { Writable } from 'node:stream'
import { gzipSync } from 'node:zlib'
import { QueryTypes } from 'sequelize'
import { parseConfig, setConfig } from '../../server/config.ts'
import { createSequelize } from '../../server/db/sequelize.ts'
import { exportSegments } from '../../server/services/network-export.ts'
import { mapLinesInBox } from '../../server/services/network-map-lines.ts'
import { crsTransform } from '../../shared/geo/crs.ts'
import { ensureDatabase, testEnv } from '../../tests/helpers/local-env.ts'

const DB = process.argv[2] ?? 'trenchward_test'
const RUNS = Number(process.argv[3] ?? 20)
const WARM_UP = 3

ensureDatabase(DB)
const cfg = parseConfig(testEnv(DB))
setConfig(cfg)
const sequelize = createSequelize(cfg)
const epsg = cfg.PROJECTED_EPSG
const t = crsTransform(epsg)

const ms = (t0: bigint) => Number(process.hrtime.bigint() - t0) / 1e6
const median = (xs: number[]) => [...xs].sort((a, b) => a - b)[Math.floor(xs.length / 2)]!
const p90 = (xs: number[]) => [...xs].sort((a, b) => a - b)[Math.floor(xs.length * 0.9)]!
const kB = (bytes: number) => `${(bytes / 1024).toFixed(1)} kB`

try {
  const [owner] = await sequelize.query<{ id: number; n: number }>(
    `SELECT owner_organisation_id AS id, COUNT(*) AS n FROM pipe_segments
      GROUP BY owner_organisation_id ORDER BY n DESC LIMIT 1`,
    { type: QueryTypes.SELECT },
  )
  if (!owner) throw new Error(`no segments in ${DB}`)
  const [total] = await sequelize.query<{ n: number }>('SELECT COUNT(*) AS n FROM pipe_segments', {
    type: QueryTypes.SELECT,
  })
  // The middle of the owner's network: the median of its start points.
  const starts = await sequelize.query<{ x: number; y: number }>(
    `SELECT ST_X(ST_StartPoint(geom)) AS x, ST_Y(ST_StartPoint(geom)) AS y
       FROM pipe_segments WHERE owner_organisation_id = ?`,
    { replacements: [owner.id], type: QueryTypes.SELECT },
  )
  const centre = [median(starts.map((s) => s.x)), median(starts.map((s) => s.y))]
  console.log(
    `database ${DB}: ${Number(total!.n).toLocaleString('en')} segments; owner ${owner.id} has ` +
      `${Number(owner.n).toLocaleString('en')}; limit ${cfg.MAP_LINES_MAX_FEATURES.toLocaleString('en')}; ` +
      `median of ${RUNS} runs after ${WARM_UP} warm-up`,
  )

  const view = (size_m: number) => {
    const sw = t.toLonLat([centre[0]! - size_m / 2, centre[1]! - size_m / 2])
    const ne = t.toLonLat([centre[0]! + size_m / 2, centre[1]! + size_m / 2])
    return [sw[0], sw[1], ne[0], ne[1]] as [number, number, number, number]
  }
  const cases = [
    { label: 'town 3 km x 3 km, zoom 13 (end points)', size_m: 3000, zoom: 13 },
    { label: 'town 3 km x 3 km, zoom 14 (full lines)', size_m: 3000, zoom: 14 },
    { label: 'street 200 m x 200 m, zoom 17', size_m: 200, zoom: 17 },
  ]
  const table: Record<string, string | number | boolean>[] = []
  for (const c of cases) {
    const request = { bbox: view(c.size_m), zoom: c.zoom, ownerOrganisationId: owner.id }
    const times: number[] = []
    let text = ''
    let features = 0
    let truncated = false
    for (let i = 0; i < WARM_UP + RUNS; i++) {
      const t0 = process.hrtime.bigint()
      const body = await mapLinesInBox(sequelize, epsg, request, cfg.MAP_LINES_MAX_FEATURES)
      text = JSON.stringify(body)
      if (i >= WARM_UP) times.push(ms(t0))
      features = body.features.length
      truncated = body.truncated
    }
    table.push({
      view: c.label,
      features,
      truncated,
      'median ms': Number(median(times).toFixed(1)),
      'p90 ms': Number(p90(times).toFixed(1)),
      JSON: kB(Buffer.byteLength(text)),
      gzip: kB(gzipSync(text).length),
    })
  }
  // Before: the map downloaded the owner's whole export once.
  {
    const times: number[] = []
    let bytes = 0
    const exportRuns = Math.min(RUNS, 5)
    for (let i = 0; i < 1 + exportRuns; i++) {
      bytes = 0
      const sink = new Writable({
        write(chunk: Buffer, _enc, done) {
          bytes += chunk.length
          done()
        },
      })
      const t0 = process.hrtime.bigint()
      await exportSegments(sequelize, epsg, { ownerOrganisationId: owner.id }, sink)
      if (i >= 1) times.push(ms(t0))
    }
    table.push({
      view: `before: whole export (${exportRuns} runs)`,
      features: Number(owner.n),
      truncated: false,
      'median ms': Number(median(times).toFixed(1)),
      'p90 ms': Number(p90(times).toFixed(1)),
      JSON: kB(bytes),
      gzip: '-',
    })
  }
  console.table(table)
} finally {
  await sequelize.close()
}
