import { spawn } from 'node:child_process'
import { createServer } from 'node:net'
import type { AddressInfo } from 'node:net'
import { join } from 'node:path'
import { ROOT } from './local-env.ts'

/** A free TCP port on loopback (bound and released; fine for tests and benchmarks). */
export async function freePort(): Promise<number> {
  const s = createServer()
  await new Promise<void>((ok) => s.listen(0, '127.0.0.1', () => ok()))
  const port = (s.address() as AddressInfo).port
  await new Promise<void>((ok) => s.close(() => ok()))
  return port
}

export interface ServerProcess {
  url: string
  pid: number
  /** SIGTERM, then wait for the exit. */
  stop(): Promise<void>
}

/**
 * The real app process (server/index.ts: migrations, listener, outbox worker, scheduler) as a
 * child on the given environment and port; resolves when /api/health answers.
 */
export async function startServerProcess(
  env: Record<string, string>,
  port: number,
): Promise<ServerProcess> {
  const child = spawn(process.execPath, ['--import', 'tsx', join(ROOT, 'server', 'index.ts')], {
    cwd: ROOT,
    env: { PATH: process.env.PATH ?? '', ...env, PORT: String(port), HOST: '127.0.0.1' },
    stdio: ['ignore', 'ignore', 'inherit'],
  })
  const exited = new Promise<void>((ok) => child.once('exit', () => ok()))
  const url = `http://127.0.0.1:${port}`
  let up = false
  for (let i = 0; i < 300 && !up; i++) {
    if (child.exitCode !== null) throw new Error(`server exited with ${child.exitCode}`)
    up = await fetch(`${url}/api/health`, { headers: { 'X-Trenchward-Client': '1' } })
      .then((r) => r.ok)
      .catch(() => false)
    if (!up) await new Promise((r) => setTimeout(r, 200))
  }
  if (!up) {
    child.kill('SIGTERM')
    throw new Error(`server on ${url} did not answer`)
  }
  return {
    url,
    pid: child.pid!,
    async stop() {
      if (child.exitCode === null && child.signalCode === null) child.kill('SIGTERM')
      await exited
    },
  }
}
