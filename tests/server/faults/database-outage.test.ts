import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { inject } from 'vitest'
import { QueryTypes } from 'sequelize'
import { parseConfig } from '../../../server/config.ts'
import { createMigrator } from '../../../server/db/migrate.ts'
import { createSequelize } from '../../../server/db/sequelize.ts'
import { signedInAgent, startTestApp, unique } from '../../helpers/test-app.ts'
import type { TestApp } from '../../helpers/test-app.ts'
import { ThrowawayMariaDb } from '../../helpers/throwaway-mariadb.ts'

const DB = 'trenchward_fault'
const db = new ThrowawayMariaDb()
let app: TestApp

beforeAll(async () => {
  await db.create(DB)
  const env = {
    DB_PORT: String(db.port),
    DB_NAME: DB,
    DB_USER: db.user,
    DB_PASSWORD: db.password,
    DB_POOL_MAX: '5',
  }
  const cfg = parseConfig({ ...inject('testEnv'), ...env })
  const migrating = createSequelize(cfg)
  await createMigrator(migrating, cfg.PROJECTED_EPSG).up()
  await migrating.close()
  app = await startTestApp(env)
}, 120_000)

afterAll(async () => {
  await app?.close()
  await db.destroy()
})

const sleep = (ms: number) => new Promise((r) => setTimeout(r, ms))

interface Attempt {
  name: string
  status: number
  code?: string
  ms: number
}

describe('when the database server dies and comes back', () => {
  it('answers 503 in the envelope meanwhile, reconnects, and loses no accepted write', async () => {
    const admin = await signedInAgent(app, 'admin')
    const attempts: Attempt[] = []
    let writing = true
    // One steady writer: a new organisation every 50 ms, each with a unique name.
    const writer = (async () => {
      while (writing) {
        const name = unique('Outage Test Org')
        const t0 = Date.now()
        const res = await admin.agent
          .post('/api/admin/organisations')
          .send({ name, kind: 'contractor' })
          .timeout(30_000)
        attempts.push({
          name,
          status: res.status,
          code: res.body?.error?.code,
          ms: Date.now() - t0,
        })
        await sleep(50)
      }
    })()

    await sleep(1500)
    const beforeKill = attempts.filter((a) => a.status === 201).length
    expect(beforeKill).toBeGreaterThan(5)

    await db.kill()
    const downAt = Date.now()
    // While it is down: the readiness check and reads answer 503 with the envelope, quickly.
    await sleep(500)
    for (const path of ['/api/health', '/api/admin/organisations']) {
      const t0 = Date.now()
      const res = await admin.agent.get(path).timeout(30_000)
      expect(res.status, path).toBe(503)
      expect(res.headers['retry-after']).toBe('5')
      expect(res.body).toEqual({
        error: {
          code: 'SERVICE_UNAVAILABLE',
          message: 'The database is not reachable at the moment; please try again shortly',
          requestId: expect.any(String),
        },
      })
      expect(Date.now() - t0).toBeLessThan(12_000)
    }
    await sleep(2000)

    await db.start()
    const upAt = Date.now()
    let ready = 0
    for (let i = 0; i < 60 && !ready; i++) {
      if ((await app.agent().get('/api/health').timeout(30_000)).status === 200) ready = Date.now()
      else await sleep(250)
    }
    expect(ready, 'the app reconnects within 15 s').toBeGreaterThan(0)
    // The session survived in the database: the same agent carries on.
    await sleep(1500)
    writing = false
    await writer

    const during = attempts.filter((a) => a.status !== 201)
    const accepted = attempts.filter((a) => a.status === 201)
    // Nothing but "created" or "unavailable"; never a 500, never a hang.
    expect(new Set(during.map((a) => `${a.status} ${a.code}`))).toEqual(
      new Set(['503 SERVICE_UNAVAILABLE']),
    )
    expect(Math.max(...attempts.map((a) => a.ms))).toBeLessThan(12_000)
    expect(accepted.length).toBeGreaterThan(beforeKill)
    expect(attempts.at(-1)!.status).toBe(201)

    const rows = await app.sequelize.query<{ name: string; n: number }>(
      `SELECT name, COUNT(*) AS n FROM organisations WHERE name LIKE 'Outage Test Org-%' GROUP BY name`,
      { type: QueryTypes.SELECT },
    )
    const stored = new Map(rows.map((r) => [r.name, Number(r.n)]))
    const lost = accepted.filter((a) => stored.get(a.name) !== 1)
    expect(lost).toEqual([])
    console.info(
      `database outage: ${accepted.length} writes accepted, ${during.length} answered 503, ` +
        `down ${upAt - downAt} ms, ready ${ready - upAt} ms after restart, 0 lost`,
    )
  }, 120_000)
})
