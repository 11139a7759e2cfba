/**
 * Load run: a real app process (server/index.ts) on the scratch database `trenchward_load`,
 * N simulated users (default 200) for S seconds (default 60) mixing engineers' decisions
 * (optimistic locking), officers' reads and applicants' reads; then the rows are counted to
 * prove no lost update. Prints requests/s, p50/p99, errors, 409 conflicts, InnoDB deadlocks and
 * lost updates. It reports; the short form in tests/server/load-short.test.ts gates correctness.
 * Usage: node --import tsx scripts/bench/load.ts [--users 200] [--seconds 60]
 * (TRENCHWARD_DB_PORT selects the private MariaDB, as for npm test.)
 */
import { parseConfig, setConfig } from '../../server/config.ts'
import { createSequelize } from '../../server/db/sequelize.ts'
import { initModels } from '../../server/models/index.ts'
import { ensureDatabase, testEnv } from '../../tests/helpers/local-env.ts'
import { freePort } from '../../tests/helpers/throwaway-mariadb.ts'
import { startAppProcess } from '../../tests/helpers/app-process.ts'
import { buildScenario, runLoad } from '../../tests/helpers/load-scenario.ts'

const arg = (name: string, fallback: number) => {
  const i = process.argv.indexOf(`--${name}`)
  const v = i >= 0 ? Number(process.argv[i + 1]) : fallback
  if (!Number.isFinite(v) || v <= 0) throw new Error(`--${name} must be a positive number`)
  return v
}
const users = arg('users', 200)
const seconds = arg('seconds', 60)

const DB = 'trenchward_load'
ensureDatabase(DB)
const env = testEnv(DB, {
  NODE_ENV: 'production',
  LOG_LEVEL: 'warn',
  DB_POOL_MAX: '20',
  PORT: String(await freePort()),
  SMTP_PORT: String(await freePort()),
})
const cfg = parseConfig(env)
setConfig(cfg)
const sequelize = createSequelize(cfg)
initModels(sequelize)
const app = await startAppProcess(env)
try {
  console.error(`app process ready at ${app.baseUrl}; building the scenario`)
  const scenario = await buildScenario(app.baseUrl, sequelize, {
    applications: 40,
    engineers: 8,
    officers: 4,
    applicants: 6,
  })
  console.error(`${users} users for ${seconds} s ...`)
  const report = await runLoad(app.baseUrl, sequelize, scenario, { users, duration_s: seconds })
  console.log(JSON.stringify(report, null, 2))
  console.log(
    `\n${report.users} users, ${report.duration_s} s: ${report.requests} requests, ` +
      `${report.requestsPerSecond} req/s, p50 ${report.p50_ms} ms, p99 ${report.p99_ms} ms, ` +
      `errors ${report.errors}, decisions accepted ${report.decisionsAccepted}, ` +
      `409 conflicts ${report.decisionConflicts}, deadlocks ${report.deadlocks}, ` +
      `lost updates ${report.lostUpdates}`,
  )
  process.exitCode = report.errors || report.lostUpdates || report.deadlocks ? 1 : 0
} finally {
  await app.stop()
  await sequelize.close()
}
