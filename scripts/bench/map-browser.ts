/**
 * The network map in headless chromium (SwiftShader WebGL, tests/e2e/browser.ts): an engineer
 * of a 100,000-segment owner opens the network page; timed from navigation until the last
 * map-lines answer is in and two frames have been drawn. Floor in the same run: the same page
 * for an owner with one pipe. Runs twice: with the server's default per-view cap
 * (MAP_LINES_MAX_FEATURES; the map then asks the user to zoom in) and with the cap raised so
 * every segment is drawn. Uses the owners that scripts/bench/import-network.ts 100000 left in
 * `trenchward_bench`, and the built client (dist/client; built when missing).
 * Usage: node --import tsx scripts/bench/map-browser.ts [runs=3]
 */
import { existsSync } from 'node:fs'
import { spawnSync } from 'node:child_process'
import { join } from 'node:path'
import bcrypt from 'bcrypt'
import { QueryTypes } from 'sequelize'
import { parseConfig } from '../../server/config.ts'
import { createSequelize } from '../../server/db/sequelize.ts'
import { launchBrowser, openPage, signIn, SCREENSHOT_DIR } from '../../tests/e2e/browser.ts'
import { ROOT, ensureDatabase, testEnv } from '../../tests/helpers/local-env.ts'
import { freePort, startServerProcess } from '../../tests/helpers/server-process.ts'
import { BENCH_PASSWORD } from './bench-city.ts'
import { fmt, machineLoad, percentile, printTable } from './bench-util.ts'
import { syntheticBbox, syntheticSegments } from './synthetic-network.ts'
import { computeBaseline } from '../../server/services/pipe-baseline.ts'
import { upsertSegments } from '../../server/services/segment-writer.ts'

const RUNS = Number(process.argv[2] ?? 3) || 3
const DB = 'trenchward_bench'

ensureDatabase(DB)
if (!existsSync(join(ROOT, 'dist', 'client', 'index.html'))) {
  const r = spawnSync('npx', ['vite', 'build'], {
    cwd: ROOT,
    stdio: ['ignore', 'ignore', 'inherit'],
  })
  if (r.status !== 0) throw new Error('vite build failed')
}
const env = testEnv(DB, {
  NODE_ENV: 'development',
  LOG_LEVEL: 'silent',
  SERVICE_AREA_BBOX: syntheticBbox(1_000_000).join(','),
})
const sequelize = createSequelize(parseConfig(env))
const hash = await bcrypt.hash(BENCH_PASSWORD, 10)
// The largest owner's engineer, and an engineer of an owner with one pipe (scratch data).
const [largest] = await sequelize.query<{ owner: number; n: number; email: string }>(
  `SELECT s.owner_organisation_id AS owner, COUNT(*) AS n,
          (SELECT email FROM users u WHERE u.organisation_id = s.owner_organisation_id
             AND u.role = 'asset_engineer' ORDER BY u.id LIMIT 1) AS email
     FROM pipe_segments s GROUP BY s.owner_organisation_id ORDER BY n DESC, owner DESC LIMIT 1`,
  { type: QueryTypes.SELECT },
)
if (!largest || largest.n < 100_000)
  throw new Error('run scripts/bench/import-network.ts 100000 first (no 100,000-segment owner)')
const big = largest
await sequelize.query('UPDATE users SET password_hash = ? WHERE email = ?', {
  replacements: [hash, big.email],
})
const emptyEmail = 'bench-map-empty-owner@example.test'
await sequelize.query(
  `INSERT IGNORE INTO organisations (name, kind, medium, created_at, updated_at)
   VALUES ('Bench owner with one pipe', 'network_owner', 'water', NOW(3), NOW(3))`,
)
await sequelize.query(
  `INSERT INTO users (email, name, role, organisation_id, password_hash, active, failed_sign_ins, created_at, updated_at)
   SELECT ?, 'Bench empty engineer', 'asset_engineer', id, ?, TRUE, 0, NOW(3), NOW(3)
     FROM organisations WHERE name = 'Bench owner with one pipe' ORDER BY id LIMIT 1
   ON DUPLICATE KEY UPDATE password_hash = VALUES(password_hash), organisation_id = VALUES(organisation_id)`,
  { replacements: [emptyEmail, hash] },
)
// The floor owner holds one segment (an owner without any sees no map, only the import hint).
const [floorOwner] = await sequelize.query<{ id: number }>(
  `SELECT id FROM organisations WHERE name = 'Bench owner with one pipe' ORDER BY id LIMIT 1`,
  { type: QueryTypes.SELECT },
)
const first = syntheticSegments(parseConfig(env).PROJECTED_EPSG).next().value!
await sequelize.transaction((transaction) =>
  upsertSegments(
    sequelize,
    Number(floorOwner!.id),
    [
      {
        data: first.data,
        grid: first.grid,
        length_m: first.length_m,
        baseline: computeBaseline(first.data),
      },
    ],
    { transaction, epsg: parseConfig(env).PROJECTED_EPSG, importId: null },
  ),
)
await sequelize.close()

interface Shown {
  ms: number[]
  features: number
  truncated: boolean
}

async function measure(cap: string | null): Promise<{ floor: Shown; big: Shown }> {
  const server = await startServerProcess(
    cap ? { ...env, MAP_LINES_MAX_FEATURES: cap } : env,
    await freePort(),
  )
  const browser = await launchBrowser()
  try {
    const run = async (email: string, shot: string | null): Promise<Shown> => {
      const out: Shown = { ms: [], features: 0, truncated: false }
      for (let i = 0; i < RUNS; i++) {
        const { page, context } = await openPage(browser)
        await signIn(page, server.url, { email, password: BENCH_PASSWORD })
        let features = 0
        let truncated = false
        let pending = 0
        let lastDone = 0
        page.on('request', (r) => {
          if (r.url().includes('/api/network/map-lines')) pending++
        })
        const isLines = (url: string) => url.includes('/api/network/map-lines')
        page.on('requestfailed', (r) => {
          if (isLines(r.url())) pending--
        })
        page.on('requestfinished', (r) => {
          if (!isLines(r.url())) return
          void r
            .response()
            .then((res) => res?.json() as Promise<{ features: unknown[]; truncated: boolean }>)
            .then((b) => {
              features += b.features.length
              truncated ||= b.truncated
            })
            .catch(() => undefined)
            .finally(() => {
              pending--
              lastDone = Date.now()
            })
        })
        const t0 = Date.now()
        await page.goto(`${server.url}/network`)
        await page.locator('.ol-viewport').first().waitFor()
        // Settled: no map-lines request open for a second after at least one answered.
        for (;;) {
          await page.waitForTimeout(100)
          if (lastDone && pending === 0 && Date.now() - lastDone > 1000) break
          if (Date.now() - t0 > 120_000)
            throw new Error(`the map did not settle in 2 minutes (${pending} map-lines open)`)
        }
        // Until the last answer, plus the two frames that draw what it brought.
        const f0 = Date.now()
        await page.evaluate(
          'new Promise((ok) => requestAnimationFrame(() => requestAnimationFrame(ok)))',
        )
        out.ms.push(lastDone - t0 + (Date.now() - f0))
        out.features = features
        out.truncated = truncated
        if (shot && i === 0) await page.screenshot({ path: join(SCREENSHOT_DIR, shot) })
        await context.close()
      }
      return out
    }
    return {
      floor: await run(emptyEmail, null),
      big: await run(big.email, `bench-map-${cap ?? 'default'}.png`),
    }
  } finally {
    await browser.close()
    await server.stop()
  }
}

const rows: (string | number)[][] = []
for (const cap of [null, '200000']) {
  const r = await measure(cap)
  const f50 = percentile(r.floor.ms, 50)
  const label = cap ? 'cap raised to 200,000' : 'default cap'
  rows.push([
    `owner with one pipe (floor), ${label}`,
    fmt(f50, 0),
    fmt(Math.max(...r.floor.ms), 0),
    '1.0×',
    0,
    'no',
  ])
  rows.push([
    `${big.n.toLocaleString('en')}-segment owner, ${label}`,
    fmt(percentile(r.big.ms, 50), 0),
    fmt(Math.max(...r.big.ms), 0),
    `${(percentile(r.big.ms, 50) / f50).toFixed(1)}×`,
    r.big.features,
    r.big.truncated ? 'yes (zoom in)' : 'no',
  ])
}
printTable(
  `Network map in headless chromium (SwiftShader), ${RUNS} page loads each; ${machineLoad()}`,
  ['page', 'p50 ms', 'max ms', 'p50 / floor', 'lines drawn', 'cut short'],
  rows,
)
console.log(`screenshots: ${SCREENSHOT_DIR}/bench-map-*.png`)
