/**
 * Re-screen benchmark (issue 7): 1,000 live applications in one town, then the time to grant
 * one of them, which re-screens the combined results of every live application sharing a pipe
 * segment with it. Runs against a scratch database `trenchward_bench_rescreen`; each run first
 * withdraws the live applications of earlier runs there (scratch data only) and reuses the bench
 * network. It reports; it does not gate.
 * Usage: node --import tsx scripts/bench/rescreen.ts [applications, default 1000]
 */
import { createWriteStream } from 'node:fs'
import { mkdir, mkdtemp, stat } from 'node:fs/promises'
import { once } from 'node:events'
import { tmpdir } from 'node:os'
import { join } from 'node:path'
import { addDays, format } from 'date-fns'
import { Op, QueryTypes } from 'sequelize'
import { parseConfig, setConfig } from '../../server/config.ts'
import { createMigrator } from '../../server/db/migrate.ts'
import { createSequelize } from '../../server/db/sequelize.ts'
import { geoJsonToGridWkt } from '../../server/geo/wkt.ts'
import {
  Application,
  Assessment,
  NetworkImport,
  Organisation,
  User,
  initModels,
} from '../../server/models/index.ts'
import { rescreenCombined } from '../../server/services/combined-screening.ts'
import { getImportMapping } from '../../server/services/import-mappings.ts'
import { runCommit, runValidation } from '../../server/services/import/import-jobs.ts'
import { grantPermit } from '../../server/services/permit-office.ts'
import { screenApplication } from '../../server/services/screening.ts'
import { crsTransform } from '../../shared/geo/crs.ts'
import type { ActivityInput } from '../../shared/schemas/application.ts'
import { activityInputSchema } from '../../shared/schemas/application.ts'
import { ROOT, ensureDatabase, testEnv } from '../../tests/helpers/local-env.ts'

const N = Number(process.argv[2] ?? 1000) || 1000
const DB = 'trenchward_bench_rescreen'
const OWNER = 'Bench town water'
// The town: 600 m x 600 m; east-west mains every 40 m, each cut into 50 m segments.
const TOWN_LONLAT: [number, number] = [9.95, 52.6]
const TOWN_M = 600
const ROW_SPACING_M = 40
const SEGMENT_M = 50

function rng(seed: number) {
  return () => {
    seed = (seed + 0x6d2b79f5) | 0
    let t = Math.imul(seed ^ (seed >>> 15), 1 | seed)
    t = (t + Math.imul(t ^ (t >>> 7), 61 | t)) ^ t
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296
  }
}

const secs = (t0: bigint) => Number(process.hrtime.bigint() - t0) / 1e9

ensureDatabase(DB)
const keys = await mkdtemp(join(tmpdir(), 'tw-bench-'))
const cfg = parseConfig(
  testEnv(DB, {
    NODE_ENV: 'development',
    KEY_DIR: join(keys, 'keys'),
    PERMIT_DIR: join(keys, 'permits'),
  }),
)
setConfig(cfg)
const sequelize = createSequelize(cfg)
await createMigrator(sequelize, cfg.PROJECTED_EPSG).up()
initModels(sequelize)
const t = crsTransform(cfg.PROJECTED_EPSG)
const [x0, y0] = t.toGrid(TOWN_LONLAT) as [number, number]

try {
  // Earlier runs' applications stop counting (scratch database only).
  await sequelize.query(
    `UPDATE applications SET status = 'withdrawn'
      WHERE title LIKE 'Bench rescreen %' AND status IN ('submitted','with_owners','ready_for_decision','granted')`,
  )

  // The network, imported once through the real import passes.
  let owner = await Organisation.findOne({ where: { name: OWNER } })
  let segments = 0
  if (!owner) {
    owner = await Organisation.create({ name: OWNER, kind: 'network_owner', medium: 'water' })
    const engineer = await User.create({
      email: `bench-rescreen-engineer@example.test`,
      name: 'Bench engineer',
      role: 'asset_engineer',
      organisationId: owner.id,
      passwordHash: 'x',
      lockedUntil: null,
      lastSignInAt: null,
    })
    const dir = join(ROOT, '.data', 'bench')
    await mkdir(dir, { recursive: true })
    const path = join(dir, 'rescreen-town.geojson')
    const out = createWriteStream(path)
    out.write('{"type":"FeatureCollection","features":[\n')
    let i = 0
    for (let y = 0; y <= TOWN_M; y += ROW_SPACING_M) {
      for (let x = 0; x < TOWN_M; x += SEGMENT_M) {
        const coords = [t.toLonLat([x0 + x, y0 + y]), t.toLonLat([x0 + x + SEGMENT_M, y0 + y])]
        out.write(
          (i ? ',\n' : '') +
            JSON.stringify({
              type: 'Feature',
              properties: {
                ownerRef: `T-${i}`,
                medium: 'water',
                material: 'PE100',
                outerDiameter_m: 0.2,
                wallThickness_m: 0.0182,
                internalPressure_kPa: 600,
                coverStart_m: 1.2,
                coverEnd_m: 1.3,
                installation: 'trench',
                trenchWidth_m: 0.7,
                wallFrictionKMu: 0.165,
                backfillUnitWeight_kN_per_m3: 19,
                frictionAngle_deg: 30,
                sidefillModulus_MPa: 5,
                beddingAngle_deg: 90,
                groundwaterAboveCrown_m: 0,
                designTrafficPressure_kPa: 10,
                yearLaid: 1990,
                positionalAccuracy_m: 0.3,
                positionalQuality: 'surveyed',
              },
              geometry: { type: 'LineString', coordinates: coords },
            }),
        )
        i++
      }
    }
    out.write('\n]}\n')
    out.end()
    await once(out, 'finish')
    const job = await NetworkImport.create({
      ownerOrganisationId: owner.id,
      createdByUserId: engineer.id,
      format: 'geojson',
      originalFilename: 'rescreen-town.geojson',
      filePath: path,
      fileSha256: '0'.repeat(64),
      fileSizeBytes: (await stat(path)).size,
      status: 'validating',
      skipInvalid: null,
      mappingSnapshot: await getImportMapping(owner.id),
      fileIssues: null,
      featureIssues: null,
      errorMessage: null,
      validatedAt: null,
      committedAt: null,
    })
    await runValidation(Number(job.id), cfg)
    await job.update({ status: 'committing', skipInvalid: false })
    await runCommit(Number(job.id), engineer.id, cfg, sequelize)
  }
  segments = await sequelize
    .query<{ n: number }>(
      'SELECT COUNT(*) AS n FROM pipe_segments WHERE owner_organisation_id = ?',
      {
        replacements: [owner.id],
        type: QueryTypes.SELECT,
      },
    )
    .then((r) => Number(r[0]!.n))

  const org = await Organisation.create({
    name: `Bench contractor ${Date.now()}`,
    kind: 'contractor',
    medium: null,
  })
  const stamp = Date.now()
  const applicant = await User.create({
    email: `bench-applicant-${stamp}@example.test`,
    name: 'Bench applicant',
    role: 'applicant',
    organisationId: org.id,
    passwordHash: 'x',
    lockedUntil: null,
    lastSignInAt: null,
  })
  const officer = await User.create({
    email: `bench-officer-${stamp}@example.test`,
    name: 'Bench officer',
    role: 'permit_officer',
    organisationId: org.id,
    passwordHash: 'x',
    lockedUntil: null,
    lastSignInAt: null,
  })

  // N applications: one or two activities each, anywhere in the town, 1-20 days in the next
  // half year. Stored and screened alone through the screening service.
  const r = rng(N)
  const today = new Date()
  const iso = (d: Date) => format(d, 'yyyy-MM-dd')
  const at = (dx: number, dy: number) => t.toLonLat([x0 + dx, y0 + dy])
  const box = (cx: number, cy: number, w: number, h: number) => ({
    type: 'Polygon' as const,
    coordinates: [[at(cx, cy), at(cx + w, cy), at(cx + w, cy + h), at(cx, cy + h), at(cx, cy)]],
  })
  const activity = (): ActivityInput => {
    const cx = r() * TOWN_M
    const cy = r() * TOWN_M
    const k = r()
    const raw =
      k < 0.4
        ? {
            kind: 'excavation',
            label: 'Pit',
            geometry: box(cx, cy, 2 + r() * 3, 1.5 + r() * 2),
            depth_m: 1 + r() * 2,
            support: 'trench-box',
            digging: 'mechanical',
          }
        : k < 0.75
          ? {
              kind: 'crane',
              label: 'Crane',
              setup: 'single-pad',
              geometry: { type: 'Point', coordinates: at(cx, cy) },
              legLoad_kN: 200 + r() * 800,
              matLength_m: 1.5,
              matWidth_m: 1.5,
              matRotation_deg: 0,
            }
          : {
              kind: 'fill',
              label: 'Stockpile',
              geometry: box(cx, cy, 4 + r() * 4, 4 + r() * 4),
              height_m: 0.5 + r() * 1.5,
              unitWeight_kN_per_m3: 18,
              duration_days: 5,
            }
    return activityInputSchema.parse(raw)
  }

  let t0 = process.hrtime.bigint()
  const ids: number[] = []
  for (let i = 0; i < N; i++) {
    const start = addDays(today, 7 + Math.floor(r() * 180))
    const end = addDays(start, Math.floor(r() * 20))
    const acts = r() < 0.3 ? [activity(), activity()] : [activity()]
    const id = await sequelize.transaction(async (transaction) => {
      const a = await Application.create(
        {
          reference: null,
          title: `Bench rescreen ${i}`,
          siteAddress: null,
          contactName: 'Bench',
          contactPhone: null,
          startsOn: iso(start),
          endsOn: iso(end),
          description: null,
          applicantOrganisationId: org.id,
          createdByUserId: applicant.id,
          submittedAt: today,
          status: i === 0 ? 'ready_for_decision' : 'submitted',
        },
        { transaction },
      )
      await a.update({ reference: `TW-BENCH-${a.id}` }, { transaction })
      for (const [position, x] of acts.entries()) {
        await sequelize.query(
          `INSERT INTO activities (application_id, position, kind, label, input, geom, created_at, updated_at)
           VALUES (?, ?, ?, ?, ?, ST_GeomFromText(?, ?), NOW(), NOW())`,
          {
            replacements: [
              a.id,
              position,
              x.kind,
              x.label ?? null,
              JSON.stringify(x),
              geoJsonToGridWkt(t, x.geometry),
              cfg.PROJECTED_EPSG,
            ],
            type: QueryTypes.INSERT,
            transaction,
          },
        )
      }
      await screenApplication(sequelize, a.id, acts, transaction)
      return a.id
    })
    ids.push(id)
  }
  const seedS = secs(t0)

  // The busiest application (most segments shared with others) is the one granted.
  const shared = await sequelize.query<{ application_id: number; n: number }>(
    `SELECT a.application_id, COUNT(*) AS n FROM assessments a
       JOIN assessments b ON b.pipe_segment_id = a.pipe_segment_id AND b.application_id <> a.application_id
      WHERE a.application_id IN (?) AND b.application_id IN (?)
      GROUP BY a.application_id ORDER BY n DESC LIMIT 1`,
    { replacements: [ids, ids], type: QueryTypes.SELECT },
  )
  const target = Number(shared[0]?.application_id ?? ids[0])
  await Application.update({ status: 'ready_for_decision' }, { where: { id: target } })
  const targetApp = (await Application.findByPk(target))!

  // Re-screen alone (rolled back), then the real grant with its PDF and re-screen.
  t0 = process.hrtime.bigint()
  let summary = { segments: 0, pairs: 0, worsened: [] as unknown[] }
  await sequelize
    .transaction(async (transaction) => {
      summary = await rescreenCombined(sequelize, target, transaction)
      throw new Error('rollback')
    })
    .catch((e: Error) => {
      if (e.message !== 'rollback') throw e
    })
  const rescreenS = secs(t0)
  t0 = process.hrtime.bigint()
  await grantPermit(sequelize, officer, target, { version: targetApp.version })
  const grantS = secs(t0)
  const combinedRows = await Assessment.count({
    where: { applicationId: { [Op.in]: ids }, combinedVerdict: { [Op.ne]: null } },
  })

  const rows: [string, string][] = [
    ['live applications in the town', N.toLocaleString('en')],
    ['pipe segments in the town', segments.toLocaleString('en')],
    ['seed (store + screen alone), s', seedS.toFixed(2)],
    ['granted application', `#${target}`],
    ['its segments', String(summary.segments)],
    ['(application, segment) pairs re-screened', String(summary.pairs)],
    ['re-screen alone, s', rescreenS.toFixed(3)],
    ['grant incl. permit PDF and re-screen, s', grantS.toFixed(3)],
    ['assessments with a combined result after the grant', String(combinedRows)],
  ]
  const w = Math.max(...rows.map((x) => x[0].length))
  console.log(`\nRe-screen after a grant (${new Date().toISOString()})`)
  for (const [k, v] of rows) console.log(`  ${k.padEnd(w)}  ${v}`)
} finally {
  await sequelize.close()
}
