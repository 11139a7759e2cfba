import { spawn } from 'node:child_process'
import type { ChildProcess } from 'node:child_process'
import { join } from 'node:path'
import { parseConfig, setConfig } from '../../server/config.ts'
import { createSequelize } from '../../server/db/sequelize.ts'
import { initModels } from '../../server/models/index.ts'
import { ROOT } from './local-env.ts'
import { freePort } from './throwaway-mariadb.ts'

export interface AppProcess {
  baseUrl: string
  child: ChildProcess
  /** Everything the process wrote to stdout (its JSON log lines). */
  output(): string
  /** SIGTERM, then wait for the exit. */
  stop(): Promise<void>
}

/**
 * The real server (server/index.ts, with its migrations, outbox worker and scheduler) as a
 * separate process on `env.PORT`; resolves once /api/health answers 200.
 */
export async function startAppProcess(env: Record<string, string>): Promise<AppProcess> {
  const child = spawn(process.execPath, ['--import', 'tsx', join(ROOT, 'server', 'index.ts')], {
    cwd: ROOT,
    env: { PATH: process.env.PATH ?? '', ...env },
    stdio: ['ignore', 'pipe', 'pipe'],
  })
  let out = ''
  let err = ''
  child.stdout!.on('data', (d: Buffer) => (out += d.toString()))
  child.stderr!.on('data', (d: Buffer) => (err += d.toString()))
  const baseUrl = `http://127.0.0.1:${env.PORT}`
  const exited = new Promise<void>((r) => child.once('exit', () => r()))
  for (let i = 0; i < 600; i++) {
    if (child.exitCode !== null) throw new Error(`the app process exited: ${err}${out}`)
    const ok = await fetch(`${baseUrl}/api/health`)
      .then((r) => r.status === 200)
      .catch(() => false)
    if (ok)
      return {
        baseUrl,
        child,
        output: () => out,
        async stop() {
          if (child.exitCode === null) child.kill('SIGTERM')
          await exited
        },
      }
    await new Promise((r) => setTimeout(r, 100))
  }
  child.kill('SIGTERM')
  throw new Error(`the app process did not become ready: ${err}`)
}

/**
 * For server tests: the real server process on the test database (free ports for the app and
 * for an SMTP server nobody runs), plus a Sequelize of the test's own on the same database
 * with the models registered, for setting up rows and counting them.
 */
export async function startAppProcessOnTestDb(
  env: Record<string, string>,
  extra: Record<string, string> = {},
) {
  const cfg = parseConfig(env)
  setConfig(cfg)
  const sequelize = createSequelize(cfg)
  initModels(sequelize)
  const app = await startAppProcess({
    ...env,
    ...extra,
    PORT: String(await freePort()),
    SMTP_PORT: String(await freePort()),
  })
  return {
    app,
    sequelize,
    async stop() {
      await app.stop()
      await sequelize.close()
    },
  }
}
