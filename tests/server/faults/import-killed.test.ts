import { spawn } from 'node:child_process'
import { mkdtempSync, rmSync, writeFileSync } from 'node:fs'
import { tmpdir } from 'node:os'
import { join } from 'node:path'
import { QueryTypes } from 'sequelize'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { crsTransform } from '../../../shared/geo/crs.ts'
import { NetworkImport } from '../../../server/models/index.ts'
import {
  failInterruptedImports,
  runCommit,
  runValidation,
} from '../../../server/services/import/import-jobs.ts'
import { ROOT } from '../../helpers/local-env.ts'
import {
  featureCollection,
  lineFeature,
  pe100Properties,
  randomSpot,
} from '../../helpers/network-fixtures.ts'
import { createTestUser, startTestApp, unique } from '../../helpers/test-app.ts'
import type { TestApp } from '../../helpers/test-app.ts'

const FEATURES = 3000
const sleep = (ms: number) => new Promise((r) => setTimeout(r, ms))
const dir = mkdtempSync(join(tmpdir(), 'tw-fault-import-'))
let app: TestApp

beforeAll(async () => {
  app = await startTestApp({ UPLOAD_DIR: join(dir, 'uploads') })
})
afterAll(async () => {
  await app.close()
  rmSync(dir, { recursive: true, force: true })
})

/** FEATURES short water mains side by side, 2 m apart, all valid. */
function networkFile(prefix: string): string {
  const t = crsTransform(25832)
  const [x0, y0] = t.toGrid(randomSpot())
  const features = []
  for (let i = 0; i < FEATURES; i++) {
    const x = x0! + (i % 100) * 2
    const y = y0! + Math.floor(i / 100) * 12
    features.push(
      lineFeature(pe100Properties(`${prefix}-${i}`), [t.toLonLat([x, y]), t.toLonLat([x, y + 10])]),
    )
  }
  const path = join(dir, `${prefix}.geojson`)
  writeFileSync(path, featureCollection(features))
  return path
}

const segmentsOf = async (ownerId: number) => {
  const [row] = await app.sequelize.query<{ n: number }>(
    'SELECT COUNT(*) AS n FROM pipe_segments WHERE owner_organisation_id = ?',
    { replacements: [ownerId], type: QueryTypes.SELECT },
  )
  return Number(row!.n)
}

describe('when the server process is killed during a network import', () => {
  it('leaves no segment of it, marks the job failed, and a new commit imports it whole', async () => {
    const engineer = await createTestUser('asset_engineer')
    const ownerId = engineer.organisation.id
    const file = networkFile(unique('K'))
    const child = spawn(
      process.execPath,
      [
        '--import',
        'tsx',
        join(ROOT, 'tests', 'helpers', 'import-child.ts'),
        JSON.stringify(envOf(app)),
        String(engineer.user.id),
        file,
      ],
      { cwd: ROOT, stdio: ['ignore', 'ignore', 'pipe'] },
    )
    let stderr = ''
    child.stderr!.on('data', (d: Buffer) => (stderr += d.toString()))
    const exited = new Promise<NodeJS.Signals | number | null>((r) =>
      child.once('exit', (code, signal) => r(signal ?? code)),
    )

    // Wait until the commit pass has written at least two batches inside its transaction.
    let job: NetworkImport | null = null
    for (let i = 0; i < 600; i++) {
      job = await NetworkImport.findOne({
        where: { ownerOrganisationId: ownerId },
        order: [['id', 'DESC']],
      })
      if (
        job?.status === 'committing' &&
        job.featuresProcessed >= 1000 &&
        job.featuresProcessed < FEATURES
      )
        break
      if (child.exitCode !== null) throw new Error(`import ended before the kill: ${stderr}`)
      await sleep(50)
    }
    expect(job?.status).toBe('committing')
    expect(job!.featuresProcessed).toBeGreaterThanOrEqual(1000)
    expect(job!.featuresProcessed).toBeLessThan(FEATURES)
    child.kill('SIGKILL')
    expect(await exited).toBe('SIGKILL')

    // The transaction died with its connection: nothing of the file is in the network.
    await sleep(500)
    expect(await segmentsOf(ownerId)).toBe(0)
    // A running pass elsewhere (recent progress) is left alone by the start-up sweep ...
    expect(await failInterruptedImports()).toBe(0)
    await job!.reload()
    expect(job!.status).toBe('committing')
    // ... one silent for the stale time is marked failed, so it can be run again.
    expect(await failInterruptedImports(0)).toBeGreaterThanOrEqual(1)
    await job!.reload()
    expect(job!.status).toBe('failed')
    expect(job!.errorMessage).toMatch(/nothing was imported/)

    // Run again: validate and commit from the same stored upload.
    await NetworkImport.update({ status: 'validating' }, { where: { id: job!.id } })
    await runValidation(Number(job!.id), app.config)
    await job!.reload()
    expect(job!.status).toBe('validated')
    await NetworkImport.update({ status: 'committing' }, { where: { id: job!.id } })
    await runCommit(Number(job!.id), engineer.user.id, app.config, app.sequelize)
    await job!.reload()
    expect(job!.status).toBe('committed')
    expect(job!.segmentsInserted).toBe(FEATURES)
    expect(await segmentsOf(ownerId)).toBe(FEATURES)
  }, 180_000)
})

/** The raw environment of the test app (the child parses it again like a server would). */
function envOf(a: TestApp): Record<string, string> {
  const c = a.config
  return {
    NODE_ENV: 'test',
    DB_HOST: c.DB_HOST,
    DB_PORT: String(c.DB_PORT),
    DB_NAME: c.DB_NAME,
    DB_USER: c.DB_USER,
    DB_PASSWORD: c.DB_PASSWORD,
    SESSION_SECRET: c.SESSION_SECRET,
    PROJECTED_EPSG: String(c.PROJECTED_EPSG),
    UPLOAD_DIR: c.uploadDir,
    LOG_LEVEL: 'silent',
  }
}
