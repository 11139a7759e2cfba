import { execFileSync } from 'node:child_process'
import { mkdtempSync, rmSync } from 'node:fs'
import { tmpdir } from 'node:os'
import { join } from 'node:path'
import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest'
import { QueryTypes } from 'sequelize'
import { parseConfig } from '../../server/config.ts'
import { createSequelize } from '../../server/db/sequelize.ts'
import { ROOT } from '../helpers/local-env.ts'

// `npm start` loads the demo into an empty database; this runs the same two steps into a
// scratch database of its own (created empty by scripts/test) and checks what a visitor finds.
const DB_NAME = 'trenchward_demo_check'
const dataDir = mkdtempSync(join(tmpdir(), 'trenchward-demo-'))
const env = {
  ...process.env,
  ...inject('testEnv'),
  DB_NAME,
  NODE_ENV: 'development',
  DATA_DIR: dataDir,
}
const cfg = parseConfig(env)
const sequelize = createSequelize(cfg)

function run(script: string, ...args: string[]): string {
  return execFileSync(
    process.execPath,
    ['--import', 'tsx', join(ROOT, 'scripts', script), ...args],
    {
      env,
      cwd: ROOT,
      encoding: 'utf8',
      stdio: ['ignore', 'pipe', 'pipe'],
    },
  )
}

const rows = <T extends object>(sql: string) => sequelize.query<T>(sql, { type: QueryTypes.SELECT })

beforeAll(() => {
  run('migrate.ts', 'up')
  run('seed-demo.ts')
}, 180_000)
afterAll(async () => {
  await sequelize.close()
  rmSync(dataDir, { recursive: true, force: true })
})

describe('the demo scenario', () => {
  it('has applications in every state a visitor should see, one of them granted with a signed permit', async () => {
    const byStatus = await rows<{ status: string; n: number }>(
      'SELECT status, COUNT(*) AS n FROM applications GROUP BY status ORDER BY status',
    )
    expect(Object.fromEntries(byStatus.map((r) => [r.status, Number(r.n)]))).toEqual({
      draft: 1,
      granted: 1,
      with_owners: 4,
    })
    const permits = await rows<{ pdf_sha256: string | null }>('SELECT pdf_sha256 FROM permits')
    expect(permits).toHaveLength(1)
    expect(permits[0]!.pdf_sha256).toMatch(/^[0-9a-f]{64}$/)
    const states = await rows<{ state: string }>(
      "SELECT DISTINCT state FROM owner_reviews WHERE state <> 'not_affected'",
    )
    expect(states.map((s) => s.state).sort()).toEqual([
      'accepted_with_conditions',
      'information_requested',
      'objected',
      'waiting',
    ])
  })

  it('has two works that are each clear alone on the Westgate sewer and over capacity together', async () => {
    const hits = await rows<{ title: string; verdict: string; combined_verdict: string }>(
      `SELECT a.title, x.verdict, x.combined_verdict FROM assessments x
         JOIN applications a ON a.id = x.application_id
         JOIN pipe_segments s ON s.id = x.pipe_segment_id
        WHERE s.owner_ref = 'WW-S-0001' ORDER BY a.id`,
    )
    expect(hits).toEqual([
      expect.objectContaining({ verdict: 'clear', combined_verdict: 'critical' }),
      expect.objectContaining({ verdict: 'clear', combined_verdict: 'critical' }),
    ])
  })

  it('is loaded once: a second start leaves the data as it is', async () => {
    const before = await rows<{ n: number }>('SELECT COUNT(*) AS n FROM applications')
    run('seed-demo.ts')
    expect(await rows<{ n: number }>('SELECT COUNT(*) AS n FROM applications')).toEqual(before)
  })
})
