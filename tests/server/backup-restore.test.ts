import { spawnSync } from 'node:child_process'
import { createHash } from 'node:crypto'
import { mkdirSync, mkdtempSync, readFileSync, rmSync, writeFileSync, existsSync } from 'node:fs'
import { tmpdir } from 'node:os'
import { join } from 'node:path'
import { QueryTypes } from 'sequelize'
import { afterAll, beforeAll, describe, expect, it, inject } from 'vitest'
import { parseConfig } from '../../server/config.ts'
import { createMigrator } from '../../server/db/migrate.ts'
import { createSequelize } from '../../server/db/sequelize.ts'
import { ensureDatabase, ROOT } from '../helpers/local-env.ts'

const DB = 'trenchward_backup_trip'
const dir = mkdtempSync(join(tmpdir(), 'tw-backup-'))
const files = {
  UPLOAD_DIR: join(dir, 'uploads'),
  PERMIT_DIR: join(dir, 'permits'),
  KEY_DIR: join(dir, 'keys'),
}
const env: Record<string, string> = { ...inject('testEnv'), DB_NAME: DB }
let sequelize: ReturnType<typeof createSequelize>

const scriptEnv = () => ({
  PATH: process.env.PATH ?? '',
  HOME: process.env.HOME ?? '/root',
  TRENCHWARD_DB_PORT: env.DB_PORT!,
  DB_HOST: env.DB_HOST!,
  DB_PORT: env.DB_PORT!,
  DB_NAME: DB,
  DB_USER: env.DB_USER!,
  DB_PASSWORD: env.DB_PASSWORD!,
  ...files,
})
function run(script: string, ...args: string[]) {
  const r = spawnSync(join(ROOT, 'scripts', script), args, { env: scriptEnv(), encoding: 'utf8' })
  return { status: r.status, stdout: r.stdout.trim(), stderr: r.stderr }
}
const dbScript = (...args: string[]) => {
  const r = spawnSync(join(ROOT, 'scripts', 'db'), args, { env: scriptEnv(), encoding: 'utf8' })
  if (r.status !== 0) throw new Error(`scripts/db ${args.join(' ')}: ${r.stderr}`)
}

async function rowCounts(): Promise<Record<string, number>> {
  const tables = await sequelize.query<{ t: string }>(
    `SELECT table_name AS t FROM information_schema.tables
      WHERE table_schema = ? AND table_type = 'BASE TABLE' ORDER BY table_name`,
    { replacements: [DB], type: QueryTypes.SELECT },
  )
  const out: Record<string, number> = {}
  for (const { t } of tables) {
    const [row] = await sequelize.query<{ n: number }>(`SELECT COUNT(*) AS n FROM \`${t}\``, {
      type: QueryTypes.SELECT,
    })
    out[t] = Number(row!.n)
  }
  return out
}
const sha = (path: string) => createHash('sha256').update(readFileSync(path)).digest('hex')

beforeAll(async () => {
  dbScript('drop', DB)
  ensureDatabase(DB)
  const cfg = parseConfig(env)
  sequelize = createSequelize(cfg)
  await createMigrator(sequelize, cfg.PROJECTED_EPSG).up()
}, 120_000)
afterAll(async () => {
  await sequelize?.close()
  dbScript('drop', DB)
  rmSync(dir, { recursive: true, force: true })
})

describe('scripts/backup and scripts/restore', () => {
  it('round-trip the database, the uploads, the permits and the signing key', async () => {
    // Some of everything: organisations, a user, audit rows with JSON, a street with geometry.
    await sequelize.query(
      `INSERT INTO organisations (name, kind, medium, created_at, updated_at) VALUES
        ('Wendmoor Water Backup', 'network_owner', 'water', NOW(), NOW()),
        ('Kessler Civils Backup', 'contractor', NULL, NOW(), NOW())`,
    )
    await sequelize.query(
      `INSERT INTO audit_events (at, actor_user_id, action, entity_type, entity_id, details, ip)
        VALUES (NOW(3), NULL, 'backup-test', 'organisation', '1', '{"note":"Grüße, ø 200 mm"}', NULL)`,
    )
    await sequelize.query(
      `INSERT INTO streets (name, category, geom, created_at, updated_at) VALUES
        ('Backup Lane', 'local', ST_GeomFromText('LINESTRING(560000 5830000, 560050 5830010)', 25832), NOW(), NOW())`,
    )
    mkdirSync(join(files.UPLOAD_DIR, 'attachments'), { recursive: true })
    mkdirSync(files.PERMIT_DIR, { recursive: true })
    mkdirSync(files.KEY_DIR, { recursive: true })
    writeFileSync(join(files.UPLOAD_DIR, 'network.upload'), '{"type":"FeatureCollection"}')
    writeFileSync(join(files.UPLOAD_DIR, 'attachments', 'plan.pdf'), Buffer.alloc(4096, 7))
    writeFileSync(join(files.PERMIT_DIR, 'permit-1.pdf'), '%PDF-1.7 invented permit')
    writeFileSync(join(files.KEY_DIR, 'signing.p12'), Buffer.from('invented key material'))
    const counts = await rowCounts()
    expect(counts.organisations).toBe(2)
    const keyHash = sha(join(files.KEY_DIR, 'signing.p12'))
    const attachmentHash = sha(join(files.UPLOAD_DIR, 'attachments', 'plan.pdf'))

    const backup = run('backup', join(dir, 'out'))
    expect(backup.status, backup.stderr).toBe(0)
    const archive = backup.stdout.split('\n').at(-1)!
    expect(archive).toMatch(/trenchward-backup-trenchward_backup_trip-\d{8}T\d{6}Z\.tar\.gz$/)
    expect(existsSync(archive)).toBe(true)

    // Into a database that is not empty: refused, nothing touched.
    const refused = run('restore', archive)
    expect(refused.status).not.toBe(0)
    expect(refused.stderr).toMatch(/not empty/)

    // Things go wrong: rows changed and deleted, files changed, the key lost, then the database.
    await sequelize.query(`DELETE FROM audit_events WHERE action = 'backup-test'`)
    await sequelize.query(`UPDATE organisations SET name = 'changed' WHERE kind = 'contractor'`)
    writeFileSync(join(files.UPLOAD_DIR, 'attachments', 'plan.pdf'), 'overwritten')
    rmSync(files.KEY_DIR, { recursive: true })
    await sequelize.close()
    dbScript('drop', DB)
    dbScript('create', DB)

    const restored = run('restore', archive)
    expect(restored.status, restored.stderr).toBe(0)
    expect(restored.stderr).toMatch(/row counts match/)

    sequelize = createSequelize(parseConfig(env))
    expect(await rowCounts()).toEqual(counts)
    const orgs = await sequelize.query<{ name: string }>(
      'SELECT name FROM organisations ORDER BY name',
      { type: QueryTypes.SELECT },
    )
    expect(orgs.map((o) => o.name)).toEqual(['Kessler Civils Backup', 'Wendmoor Water Backup'])
    const [audit] = await sequelize.query<{ details: unknown }>(
      `SELECT details FROM audit_events WHERE action = 'backup-test'`,
      { type: QueryTypes.SELECT },
    )
    expect(JSON.stringify(audit!.details)).toContain('Grüße, ø 200 mm')
    const [street] = await sequelize.query<{ wkt: string; srid: number }>(
      `SELECT ST_AsText(geom) AS wkt, ST_SRID(geom) AS srid FROM streets WHERE name = 'Backup Lane'`,
      { type: QueryTypes.SELECT },
    )
    expect(street).toEqual({ wkt: 'LINESTRING(560000 5830000,560050 5830010)', srid: 25832 })
    expect(sha(join(files.KEY_DIR, 'signing.p12'))).toBe(keyHash)
    expect(sha(join(files.UPLOAD_DIR, 'attachments', 'plan.pdf'))).toBe(attachmentHash)
    // The migrations table came back too: the app sees an up-to-date schema.
    expect(await createMigrator(sequelize, 25832).pending()).toEqual([])
  }, 120_000)
})
