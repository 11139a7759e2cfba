/**
 * API throughput on loopback: the real server (server/index.ts as a child process, its own
 * database pool, scheduler and outbox worker) on the bench city, driven by autocannon with a
 * signed-in session cookie. Floors in the same run: the public health check (no session, one
 * `SELECT 1`) and the signed-in user's own record (session and user lookups). Endpoints: the applicant's application list and one
 * application's screening result. It reports; it does not gate.
 * Usage: node --import tsx scripts/bench/api-throughput.ts [segments=100000] [seconds=10] [connections=10]
 */
import autocannon from 'autocannon'
import { withdrawApplication } from '../../server/services/applications.ts'
import { freePort, startServerProcess } from '../../tests/helpers/server-process.ts'
import {
  BENCH_PASSWORD,
  benchUsers,
  cityEnv,
  openCity,
  submitCentreApplication,
} from './bench-city.ts'
import { machineLoad, printTable } from './bench-util.ts'

const N = Number(process.argv[2] ?? 100_000) || 100_000
const SECONDS = Number(process.argv[3] ?? 10) || 10
const CONNECTIONS = Number(process.argv[4] ?? 10) || 10

const { cfg, sequelize } = await openCity(N)
const { applicant } = await benchUsers(sequelize)
const { submit } = await submitCentreApplication(sequelize, cfg, applicant, 'Bench API result')
const app = await submit()
const port = await freePort()
const server = await startServerProcess(cityEnv(N, { LOG_LEVEL: 'silent' }), port)
try {
  const signIn = await fetch(`${server.url}/api/auth/sign-in`, {
    method: 'POST',
    headers: { 'Content-Type': 'application/json', 'X-Trenchward-Client': '1' },
    body: JSON.stringify({ email: applicant.email, password: BENCH_PASSWORD }),
  })
  if (!signIn.ok) throw new Error(`sign-in: ${signIn.status} ${await signIn.text()}`)
  const cookie = signIn.headers
    .getSetCookie()
    .map((c) => c.split(';')[0])
    .join('; ')

  const run = async (path: string, withCookie: boolean) => {
    const r = await autocannon({
      url: `${server.url}${path}`,
      connections: CONNECTIONS,
      duration: SECONDS,
      headers: {
        'X-Trenchward-Client': '1',
        'Accept-Encoding': 'gzip',
        ...(withCookie ? { Cookie: cookie } : {}),
      },
    })
    if (r.non2xx) throw new Error(`${path}: ${r.non2xx} responses were not 2xx`)
    return {
      rps: r.requests.average,
      p50: r.latency.p50,
      p99: r.latency.p99,
      bytes: r.throughput.average,
    }
  }
  const floor = await run('/api/health', false)
  const me = await run('/api/auth/me', true)
  const list = await run('/api/applications?page=1&pageSize=25', true)
  const result = await run(`/api/applications/${app.id}/screening`, true)
  printTable(
    `API on loopback, ${CONNECTIONS} connections × ${SECONDS} s each, ${N.toLocaleString('en')}-segment city; ${machineLoad()}`,
    ['endpoint', 'req/s', 'share of floor', 'p50 ms', 'p99 ms', 'p99 / floor p99'],
    [
      ['GET /api/health (floor)', floor, true] as const,
      ['GET /api/auth/me (signed-in floor)', me, false] as const,
      ['GET /api/applications (signed in)', list, false] as const,
      [`GET /api/applications/:id/screening`, result, false] as const,
    ].map(([name, r]) => [
      name,
      Math.round(r.rps),
      `${((r.rps / floor.rps) * 100).toFixed(0)}%`,
      r.p50,
      r.p99,
      `${(r.p99 / floor.p99).toFixed(1)}×`,
    ]),
  )
} finally {
  await server.stop()
  await withdrawApplication(sequelize, applicant, app.id, 'Benchmark run')
  await sequelize.close()
}
