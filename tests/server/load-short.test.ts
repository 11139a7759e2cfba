import { afterAll, beforeAll, describe, expect, it, inject } from 'vitest'
import { parseConfig, setConfig } from '../../server/config.ts'
import { createSequelize } from '../../server/db/sequelize.ts'
import { initModels } from '../../server/models/index.ts'
import { startAppProcess } from '../helpers/app-process.ts'
import type { AppProcess } from '../helpers/app-process.ts'
import { buildScenario, runLoad } from '../helpers/load-scenario.ts'
import { freePort } from '../helpers/throwaway-mariadb.ts'

// The short form of scripts/bench/load.ts: it asserts correctness only (no timing).
let app: AppProcess
const env = inject('testEnv')
const sequelize = createSequelize(parseConfig(env))

beforeAll(async () => {
  setConfig(parseConfig(env))
  initModels(sequelize)
  app = await startAppProcess({
    ...env,
    PORT: String(await freePort()),
    SMTP_PORT: String(await freePort()),
  })
}, 120_000)
afterAll(async () => {
  await app?.stop()
  await sequelize.close()
})

describe('20 simulated users for 5 s against a real app process', () => {
  it('gives no errors, no deadlocks and loses no decision', async () => {
    const scenario = await buildScenario(app.baseUrl, sequelize, {
      applications: 6,
      engineers: 3,
      officers: 2,
      applicants: 2,
    })
    const report = await runLoad(app.baseUrl, sequelize, scenario, { users: 20, duration_s: 5 })
    console.info('short load run:', JSON.stringify(report))
    expect(report.errorSamples).toEqual([])
    expect(report.errors).toBe(0)
    expect(report.deadlocks).toBe(0)
    expect(report.lostUpdates).toBe(0)
    expect(report.decisionsAccepted).toBeGreaterThan(0)
    expect(report.byKind['office-queue'] ?? 0).toBeGreaterThan(0)
    expect(report.byKind['applicant-read'] ?? 0).toBeGreaterThan(0)
  }, 120_000)
})
