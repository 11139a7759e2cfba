import { afterAll, beforeAll, describe, expect, it, inject } from 'vitest'
import { startAppProcessOnTestDb } from '../helpers/app-process.ts'
import { buildScenario, runLoad } from '../helpers/load-scenario.ts'

// The short form of scripts/bench/load.ts: it asserts correctness only (no timing).
let run: Awaited<ReturnType<typeof startAppProcessOnTestDb>>
beforeAll(async () => {
  run = await startAppProcessOnTestDb(inject('testEnv'))
}, 120_000)
afterAll(async () => {
  await run?.stop()
})

describe('20 simulated users for 5 s against a real app process', () => {
  it('gives no errors, no deadlocks and loses no decision', async () => {
    const scenario = await buildScenario(run.app.baseUrl, run.sequelize, {
      applications: 6,
      engineers: 3,
      officers: 2,
      applicants: 2,
    })
    const report = await runLoad(run.app.baseUrl, run.sequelize, scenario, {
      users: 20,
      duration_s: 5,
    })
    console.info('short load run:', JSON.stringify(report))
    expect(report.errorSamples).toEqual([])
    expect(report.errors).toBe(0)
    expect(report.deadlocks).toBe(0)
    expect(report.lostUpdates).toBe(0)
    expect(report.decisionsAccepted).toBeGreaterThan(0)
    const officerReads =
      (report.byKind['office-queue'] ?? 0) + (report.byKind['office-application'] ?? 0)
    expect(officerReads).toBeGreaterThan(0)
    expect(report.byKind['applicant-read'] ?? 0).toBeGreaterThan(0)
  }, 120_000)
})
