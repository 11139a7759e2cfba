import { mkdtemp, writeFile } from 'node:fs/promises'
import { tmpdir } from 'node:os'
import { join } from 'node:path'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { startTestApp } from '../helpers/test-app.ts'
import type { TestApp } from '../helpers/test-app.ts'

describe('response compression', () => {
  let app: TestApp
  beforeAll(async () => {
    const dir = await mkdtemp(join(tmpdir(), 'tw-compress-'))
    await writeFile(
      join(dir, 'index.html'),
      `<!doctype html><title>t</title>${'<p>x</p>'.repeat(400)}`,
    )
    await writeFile(join(dir, 'app.js'), `console.log(${JSON.stringify('a'.repeat(5000))})`)
    await writeFile(join(dir, 'site.css'), `body{margin:0}${'.a{color:red}'.repeat(300)}`)
    // A real PDF header and enough bytes to pass the size threshold.
    await writeFile(
      join(dir, 'permit.pdf'),
      Buffer.concat([Buffer.from('%PDF-1.7\n'), Buffer.alloc(8000, 32)]),
    )
    await writeFile(
      join(dir, 'plan.png'),
      Buffer.concat([Buffer.from([0x89, 0x50, 0x4e, 0x47]), Buffer.alloc(8000)]),
    )
    app = await startTestApp({ CLIENT_DIST_DIR: dir })
  })
  afterAll(() => app.close())

  it.each(['/app.js', '/site.css', '/'])(
    'when a browser asks for %s with gzip, then it is sent gzipped',
    async (path) => {
      const res = await app.agent().get(path).set('Accept-Encoding', 'gzip')
      expect(res.status).toBe(200)
      expect(res.headers['content-encoding']).toBe('gzip')
    },
  )

  it.each(['/permit.pdf', '/plan.png'])(
    'when a browser asks for the already-compressed %s, then it is sent as it is',
    async (path) => {
      const res = await app.agent().get(path).set('Accept-Encoding', 'gzip')
      expect(res.status).toBe(200)
      expect(res.headers['content-encoding']).toBeUndefined()
    },
  )
})
