import { spawn, spawnSync } from 'node:child_process'
import type { ChildProcess } from 'node:child_process'
import { mkdtempSync, rmSync } from 'node:fs'
import { createServer } from 'node:net'
import type { AddressInfo } from 'node:net'
import { tmpdir, userInfo } from 'node:os'
import { join } from 'node:path'

/** A free TCP port on loopback (asked from the kernel, then released). */
export async function freePort(): Promise<number> {
  const srv = createServer()
  await new Promise<void>((r) => srv.listen(0, '127.0.0.1', () => r()))
  const port = (srv.address() as AddressInfo).port
  await new Promise<void>((r) => srv.close(() => r()))
  return port
}

const sleep = (ms: number) => new Promise((r) => setTimeout(r, ms))

/**
 * A MariaDB server of its own for one fault test: a fresh data directory under the system temp
 * folder, its own port and socket, started the way scripts/db starts ours (no defaults files,
 * loopback only). The test may kill it and start it again on the same data; `destroy` stops it
 * and removes the folder.
 */
export class ThrowawayMariaDb {
  readonly dir = mkdtempSync(join(tmpdir(), 'tw-fault-db-'))
  readonly socket = join(this.dir, 'mariadb.sock')
  readonly user = 'trenchward'
  readonly password = `fault-${process.pid}-${Date.now()}`
  port = 0
  private proc: ChildProcess | undefined

  private get datadir(): string {
    return join(this.dir, 'data')
  }

  /** Initialise the data directory, start, create `database` and the app user. */
  async create(database: string): Promise<void> {
    this.port = await freePort()
    const init = spawnSync(
      'mariadb-install-db',
      [
        '--no-defaults',
        `--user=${userInfo().username}`,
        `--datadir=${this.datadir}`,
        '--auth-root-authentication-method=normal',
        '--skip-test-db',
        '--skip-name-resolve',
      ],
      { encoding: 'utf8' },
    )
    if (init.status !== 0) throw new Error(`mariadb-install-db failed: ${init.stderr}`)
    await this.start()
    this.rootSql(
      `CREATE DATABASE \`${database}\` CHARACTER SET utf8mb4 COLLATE utf8mb4_unicode_ci;
       CREATE USER '${this.user}'@'127.0.0.1' IDENTIFIED BY '${this.password}';
       GRANT ALL ON \`${database}\`.* TO '${this.user}'@'127.0.0.1';`,
    )
  }

  /** Start the server on the existing data and wait until it answers. */
  async start(): Promise<void> {
    this.proc = spawn(
      '/usr/sbin/mariadbd',
      [
        '--no-defaults',
        `--user=${userInfo().username}`,
        `--datadir=${this.datadir}`,
        `--socket=${this.socket}`,
        `--pid-file=${join(this.dir, 'mariadb.pid')}`,
        `--port=${this.port}`,
        '--bind-address=127.0.0.1',
        '--skip-name-resolve',
        '--character-set-server=utf8mb4',
        '--collation-server=utf8mb4_unicode_ci',
        `--log-error=${join(this.dir, 'mariadb.err')}`,
        '--innodb-buffer-pool-size=64M',
      ],
      { stdio: 'ignore' },
    )
    for (let i = 0; i < 300; i++) {
      if (this.alive()) return
      await sleep(100)
    }
    throw new Error(`the throwaway MariaDB did not start; see ${join(this.dir, 'mariadb.err')}`)
  }

  /** Kill the server hard (SIGKILL: no clean shutdown, as a crash or a pulled plug). */
  kill(): Promise<void> {
    return this.end('SIGKILL')
  }

  /** Clean shutdown (SIGTERM), waiting for the process to exit. */
  stop(): Promise<void> {
    return this.end('SIGTERM')
  }

  private async end(signal: NodeJS.Signals): Promise<void> {
    const p = this.proc
    if (!p || p.exitCode !== null) return
    const exited = new Promise((r) => p.once('exit', r))
    p.kill(signal)
    await exited
    this.proc = undefined
  }

  alive(): boolean {
    return (
      spawnSync('mariadb-admin', ['--no-defaults', `--socket=${this.socket}`, '-uroot', 'ping'], {
        stdio: 'ignore',
      }).status === 0
    )
  }

  /** Run SQL as root over the socket; returns the tab-separated output. */
  rootSql(sql: string): string {
    const r = spawnSync(
      'mariadb',
      ['--no-defaults', `--socket=${this.socket}`, '-uroot', '-N', '-B', '-e', sql],
      { encoding: 'utf8' },
    )
    if (r.status !== 0) throw new Error(`mariadb: ${r.stderr}`)
    return r.stdout
  }

  async destroy(): Promise<void> {
    await this.stop()
    rmSync(this.dir, { recursive: true, force: true })
  }
}
