import { spawnSync } from 'node:child_process'
import { readFileSync } from 'node:fs'
import { join, resolve } from 'node:path'

export const ROOT = resolve(import.meta.dirname, '..', '..')

/** Start the private MariaDB (no-op when it runs) and make sure the named databases exist. */
export function ensureDatabase(...names: string[]): void {
  const run = (args: string[]) => {
    const r = spawnSync(join(ROOT, 'scripts', 'db'), args, {
      stdio: ['ignore', 'ignore', 'inherit'],
    })
    if (r.status !== 0) throw new Error(`scripts/db ${args.join(' ')} failed`)
  }
  run(['start'])
  for (const n of names) run(['create', n])
}

/** The local secrets written by scripts/db (.data/local.env) as an environment record. */
export function readLocalEnv(): Record<string, string> {
  const text = readFileSync(join(ROOT, '.data', 'local.env'), 'utf8')
  const env: Record<string, string> = {}
  for (const line of text.split('\n')) {
    const m = /^([A-Z0-9_]+)=(.*)$/.exec(line.trim())
    if (m) env[m[1]!] = m[2]!
  }
  return env
}

/** Environment for an app instance on the given database, for tests. */
export function testEnv(
  dbName: string,
  extra: Record<string, string> = {},
): Record<string, string> {
  const local = readLocalEnv()
  return {
    NODE_ENV: 'test',
    DB_HOST: '127.0.0.1',
    DB_PORT: process.env.TRENCHWARD_DB_PORT ?? '3307',
    DB_NAME: dbName,
    DB_USER: local.DB_USER ?? 'trenchward',
    DB_PASSWORD: local.DB_PASSWORD ?? '',
    SESSION_SECRET: local.SESSION_SECRET ?? '',
    PROJECTED_EPSG: '25832',
    LOG_LEVEL: 'silent',
    ...extra,
  }
}
