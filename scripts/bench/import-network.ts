/**
 * Import benchmark: generates a synthetic GeoJSON network of N segments (default 10,000 and
 * 100,000) under .data/bench/, then runs the real validate and commit passes (the same service
 * functions the API starts) against a scratch database `trenchward_bench`, and prints wall
 * times, rates and peak memory. It reports; it does not gate.
 * Usage: node --import tsx scripts/bench/import-network.ts [N ...]
 */
import { createReadStream, createWriteStream } from 'node:fs'
import { createServer } from 'node:http'
import type { AddressInfo } from 'node:net'
import bcrypt from 'bcrypt'
import request from 'supertest'
import { createApp } from '../../server/app.ts'
import { mkdir, stat } from 'node:fs/promises'
import { once } from 'node:events'
import { join } from 'node:path'
import { QueryTypes } from 'sequelize'
import { parseConfig, setConfig } from '../../server/config.ts'
import { createMigrator } from '../../server/db/migrate.ts'
import { createSequelize } from '../../server/db/sequelize.ts'
import { NetworkImport, Organisation, User, initModels } from '../../server/models/index.ts'
import { getImportMapping } from '../../server/services/import-mappings.ts'
import { runCommit, runValidation } from '../../server/services/import/import-jobs.ts'
import { crsTransform } from '../../shared/geo/crs.ts'
import { ROOT, ensureDatabase, testEnv } from '../../tests/helpers/local-env.ts'

const counts = process.argv
  .slice(2)
  .map(Number)
  .filter((n) => n > 0)
const sizes = counts.length ? counts : [10_000, 100_000]
const DB = 'trenchward_bench'
const outDir = join(ROOT, '.data', 'bench')

// Seeded so every run measures the same file (mulberry32).
function rng(seed: number) {
  return () => {
    seed = (seed + 0x6d2b79f5) | 0
    let t = Math.imul(seed ^ (seed >>> 15), 1 | seed)
    t = (t + Math.imul(t ^ (t >>> 7), 61 | t)) ^ t
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296
  }
}

const PIPES = [
  { material: 'PE100', outerDiameter_m: 0.16, wallThickness_m: 0.0146, internalPressure_kPa: 1000 },
  { material: 'PVC-U', outerDiameter_m: 0.2, wallThickness_m: 0.0119, internalPressure_kPa: 600 },
  {
    material: 'ductile-iron',
    outerDiameter_m: 0.222,
    wallThickness_m: 0.0064,
    internalPressure_kPa: 1000,
  },
  {
    material: 'steel',
    outerDiameter_m: 0.3239,
    wallThickness_m: 0.0071,
    internalPressure_kPa: 400,
  },
]

async function writeNetwork(path: string, n: number, epsg: number): Promise<void> {
  const t = crsTransform(epsg)
  const r = rng(n)
  const [x0, y0] = t.toGrid([9.87, 52.56])
  const out = createWriteStream(path)
  const write = async (s: string) => {
    if (!out.write(s)) await once(out, 'drain')
  }
  await write('{"type":"FeatureCollection","features":[\n')
  // 115 segments per 11.5 km row, rows 11 m apart: 100,000 segments fill about 11.6 km x 9.6 km
  // of the default service area (12.2 km x 11.1 km).
  const perRow = 115
  for (let i = 0; i < n; i++) {
    let x = x0 + (i % perRow) * 100 + r() * 40
    let y = y0 + Math.floor(i / perRow) * 11 + r() * 4
    const coords = [t.toLonLat([x, y])]
    for (let k = 0, m = 1 + Math.floor(r() * 3); k < m; k++) {
      x += 10 + r() * 20
      y += (r() - 0.5) * 8
      coords.push(t.toLonLat([x, y]))
    }
    const pipe = PIPES[i % PIPES.length]!
    const cover = 0.9 + r() * 1.2
    const properties = {
      ownerRef: `B-${i}`,
      medium: 'water',
      ...pipe,
      coverStart_m: Number(cover.toFixed(2)),
      coverEnd_m: Number((cover + (r() - 0.5) * 0.3).toFixed(2)),
      installation: 'trench',
      trenchWidth_m: 0.8,
      wallFrictionKMu: 0.165,
      backfillUnitWeight_kN_per_m3: 19,
      frictionAngle_deg: 30,
      sidefillModulus_MPa: 5,
      beddingAngle_deg: 90,
      groundwaterAboveCrown_m: 0,
      designTrafficPressure_kPa: 15,
      yearLaid: 1960 + Math.floor(r() * 60),
      positionalAccuracy_m: 0.5,
      positionalQuality: 'digitised',
    }
    const c = coords.map(([lon, lat]) => [Number(lon.toFixed(8)), Number(lat.toFixed(8))])
    await write(
      (i ? ',\n' : '') +
        JSON.stringify({
          type: 'Feature',
          properties,
          geometry: { type: 'LineString', coordinates: c },
        }),
    )
  }
  await write('\n]}\n')
  out.end()
  await once(out, 'finish')
}

ensureDatabase(DB)
const cfg = parseConfig(testEnv(DB, { NODE_ENV: 'development' }))
setConfig(cfg)
const sequelize = createSequelize(cfg)
await createMigrator(sequelize, cfg.PROJECTED_EPSG).up()
initModels(sequelize)
await mkdir(outDir, { recursive: true })

let peakRss = 0
const sampler = setInterval(() => (peakRss = Math.max(peakRss, process.memoryUsage().rss)), 50)
const secs = (t0: bigint) => Number(process.hrtime.bigint() - t0) / 1e9

try {
  for (const n of sizes) {
    const path = join(outDir, `network-${n}.geojson`)
    let t0 = process.hrtime.bigint()
    await writeNetwork(path, n, cfg.PROJECTED_EPSG)
    const genS = secs(t0)
    const size = (await stat(path)).size
    const org = await Organisation.create({
      name: `Bench owner ${n} ${Date.now()}`,
      kind: 'network_owner',
      medium: 'water',
    })
    const user = await User.create({
      email: `bench-${n}-${Date.now()}@example.test`,
      name: 'Bench',
      role: 'asset_engineer',
      organisationId: org.id,
      passwordHash: 'x',
      lockedUntil: null,
      lastSignInAt: null,
    })
    const timeImport = async (label: string) => {
      const job = await NetworkImport.create({
        ownerOrganisationId: org.id,
        createdByUserId: user.id,
        format: 'geojson',
        originalFilename: `network-${n}.geojson`,
        filePath: path,
        fileSha256: '0'.repeat(64),
        fileSizeBytes: size,
        status: 'validating',
        skipInvalid: null,
        mappingSnapshot: await getImportMapping(org.id),
        fileIssues: null,
        featureIssues: null,
        errorMessage: null,
        validatedAt: null,
        committedAt: null,
      })
      peakRss = 0
      t0 = process.hrtime.bigint()
      await runValidation(Number(job.id), cfg)
      const validateS = secs(t0)
      await job.reload()
      if (job.status !== 'validated' || job.featuresInvalid)
        throw new Error(`validation: ${job.status}, ${job.featuresInvalid} invalid`)
      await job.update({ status: 'committing', skipInvalid: false })
      t0 = process.hrtime.bigint()
      await runCommit(Number(job.id), user.id, cfg, sequelize)
      const commitS = secs(t0)
      await job.reload()
      console.log(
        `${label} ${n.toLocaleString('en')} segments (${(size / 1e6).toFixed(1)} MB): validate ${validateS.toFixed(2)} s (${Math.round(n / validateS).toLocaleString('en')}/s), ` +
          `commit ${commitS.toFixed(2)} s (${Math.round(n / commitS).toLocaleString('en')}/s; inserted ${job.segmentsInserted}, updated ${job.segmentsUpdated}), ` +
          `total ${(validateS + commitS).toFixed(2)} s, peak RSS ${(peakRss / 1e6).toFixed(0)} MB`,
      )
    }
    console.log(`generated ${path} in ${genS.toFixed(2)} s`)
    // The upload through the real HTTP route (multipart, streamed to disk, hashed).
    {
      const password = 'bench password long enough'
      await user.update({ passwordHash: await bcrypt.hash(password, 12) })
      const { app, close } = createApp(cfg, sequelize)
      const server = createServer(app)
      await new Promise<void>((ok) => server.listen(0, '127.0.0.1', () => ok()))
      const agent = request
        .agent(`http://127.0.0.1:${(server.address() as AddressInfo).port}`)
        .set('X-Trenchward-Client', '1')
      await agent.post('/api/auth/sign-in').send({ email: user.email, password })
      peakRss = 0
      t0 = process.hrtime.bigint()
      const res = await agent
        .post('/api/network/imports')
        .attach('file', createReadStream(path), `network-${n}.geojson`)
      const upS = secs(t0)
      console.log(
        `upload over HTTP: ${res.status}, ${upS.toFixed(2)} s (${(size / 1e6 / upS).toFixed(0)} MB/s), peak RSS ${(peakRss / 1e6).toFixed(0)} MB`,
      )
      close()
      await new Promise<void>((ok) => server.close(() => ok()))
    }
    await timeImport('first import ')
    await timeImport('re-import    ')
    const [{ n: stored }] = (await sequelize.query<{ n: number }>(
      'SELECT COUNT(*) AS n FROM pipe_segments WHERE owner_organisation_id = ?',
      { replacements: [org.id], type: QueryTypes.SELECT },
    )) as [{ n: number }]
    console.log(`stored rows for the owner: ${stored}`)
  }
} finally {
  clearInterval(sampler)
  await sequelize.close()
}
