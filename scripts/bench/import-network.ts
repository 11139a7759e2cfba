/**
 * Import benchmark: writes the first N segments of the synthetic city (synthetic-network.ts:
 * street-following pipes of every medium; default 10,000 and 100,000) as GeoJSON under
 * .data/bench/, then runs the real validate and commit passes (the same service
 * functions the API starts) against a scratch database `trenchward_bench`, and prints wall
 * times, rates and peak memory. It reports; it does not gate.
 * Floor in the same run: the import's streaming reader over the same file, nothing checked.
 * Targets for 100,000 segments: under 60 s and under 500 MB.
 * Usage: node --import tsx scripts/bench/import-network.ts [N ...] [--floor-only]
 */
import { createReadStream, existsSync } from 'node:fs'
import { createServer } from 'node:http'
import type { AddressInfo } from 'node:net'
import bcrypt from 'bcrypt'
import request from 'supertest'
import { createApp } from '../../server/app.ts'
import { mkdir, stat } from 'node:fs/promises'
import { join } from 'node:path'
import { QueryTypes } from 'sequelize'
import { parseConfig, setConfig } from '../../server/config.ts'
import { createMigrator } from '../../server/db/migrate.ts'
import { createSequelize } from '../../server/db/sequelize.ts'
import { NetworkImport, Organisation, User, initModels } from '../../server/models/index.ts'
import { getImportMapping } from '../../server/services/import-mappings.ts'
import { runCommit, runValidation } from '../../server/services/import/import-jobs.ts'
import { geoJsonReader } from '../../server/services/import/geojson-reader.ts'
import { ROOT, ensureDatabase, testEnv } from '../../tests/helpers/local-env.ts'
import { syntheticBbox, writeSyntheticGeoJson } from './synthetic-network.ts'

const counts = process.argv
  .slice(2)
  .filter((a) => !a.startsWith('--'))
  .map(Number)
  .filter((n) => n > 0)
const sizes = counts.length ? counts : [10_000, 100_000]
const DB = 'trenchward_bench'
const outDir = join(ROOT, '.data', 'bench')

ensureDatabase(DB)
const cfg = parseConfig(
  testEnv(DB, {
    NODE_ENV: 'development',
    SERVICE_AREA_BBOX: syntheticBbox(Math.max(...sizes)).join(','),
  }),
)
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
    // The file is the same every time (deterministic); --floor-only reuses it.
    if (!process.argv.includes('--floor-only') || !existsSync(path))
      await writeSyntheticGeoJson(path, n, cfg.PROJECTED_EPSG)
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
    // Floor: the import's own streaming reader over the file, nothing checked or written.
    {
      peakRss = 0
      t0 = process.hrtime.bigint()
      let k = 0
      for await (const _f of geoJsonReader(path).features()) k++
      const readS = secs(t0)
      console.log(
        `floor: read ${k.toLocaleString('en')} features with the import's reader: ${readS.toFixed(2)} s, peak RSS ${(peakRss / 1e6).toFixed(0)} MB`,
      )
    }
    if (process.argv.includes('--floor-only')) continue
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
