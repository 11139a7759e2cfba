import { request as httpRequest } from 'node:http'
import { readdir } from 'node:fs/promises'
import { join } from 'node:path'
import { QueryTypes } from 'sequelize'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { createApp } from '../../server/app.ts'
import { apiRoutes, fillPath } from '../helpers/api-routes.ts'
import type { ApiRoute } from '../helpers/api-routes.ts'
import { TINY_PDF } from '../helpers/security-fixtures.ts'
import { tableChecksums } from '../helpers/table-checksums.ts'
import { signedInAgent, startTestApp, unique } from '../helpers/test-app.ts'
import type { TestApp } from '../helpers/test-app.ts'

/**
 * The guards around the API: the CSRF header on every cookie-authenticated write, upload size
 * and type limits (told from the content), no path traversal into files, rate limits on
 * sign-in and uploads.
 */

let app: TestApp
let routes: ApiRoute[]
beforeAll(async () => {
  // Small upload limits so the tests can cross them; each client its own X-Forwarded-For.
  app = await startTestApp({
    ATTACHMENT_MAX_MB: '1',
    IMPORT_MAX_UPLOAD_MB: '1',
    VERIFY_MAX_UPLOAD_MB: '1',
    TRUST_PROXY: '1',
  })
  const probe = createApp(app.config, app.sequelize)
  routes = apiRoutes(probe.app)
  probe.close()
})
afterAll(async () => {
  await app.close()
})

let address = 0
/** A client address of its own (the app trusts one proxy hop in this file). */
const freshAddress = () => `10.9.${(++address >> 8) & 255}.${address & 255}`

type Agent = ReturnType<TestApp['agent']>

/** Upload one document to a draft, from an address of its own. */
function upload(
  agent: Agent,
  id: number,
  kind: string,
  content: Buffer,
  filename: string,
  contentType = 'application/pdf',
) {
  return agent
    .post(`/api/applications/${id}/attachments`)
    .set('X-Forwarded-For', freshAddress())
    .field('kind', kind)
    .attach('file', content, { filename, contentType })
}

async function draftOf(agent: Agent) {
  const res = await agent.post('/api/applications').send({ title: 'Hardening test' })
  expect(res.status).toBe(201)
  return res.body.id as number
}

/** A raw GET whose path is sent exactly as written (fetch and supertest normalise `..`). */
function rawGet(path: string, cookie = ''): Promise<{ status: number; body: string }> {
  const url = new URL(app.baseUrl)
  return new Promise((ok, fail) => {
    const req = httpRequest(
      { host: url.hostname, port: url.port, path, method: 'GET', headers: { cookie } },
      (res) => {
        let body = ''
        res.setEncoding('utf8')
        res.on('data', (c: string) => (body += c))
        res.on('end', () => ok({ status: res.statusCode ?? 0, body }))
      },
    )
    req.on('error', fail)
    req.end()
  })
}

describe('CSRF guard on cookie-authenticated writes', () => {
  it('when any write route is called with a valid session but without X-Trenchward-Client, then it responds 403 and nothing changes', async () => {
    const { agent } = await signedInAgent(app, 'admin')
    // The payment service's webhook takes no cookie and no session: its signature over the raw
    // body is its authentication (checked in fees-payments.test.ts), so the guard does not apply.
    const COOKIELESS = ['POST /api/payments/webhook']
    const writes = routes.filter((r) => r.method !== 'GET' && !COOKIELESS.includes(r.key))
    expect(writes.length).toBeGreaterThan(20)
    const before = await tableChecksums(app.sequelize)
    for (const route of writes) {
      const path = fillPath(
        route.path,
        Object.fromEntries([...route.path.matchAll(/:([A-Za-z]+)/g)].map((m) => [m[1]!, 1])),
      )
      for (const header of [undefined, '0']) {
        const method = route.method.toLowerCase() as 'post' | 'put' | 'patch' | 'delete'
        const req = agent[method](path).set('X-Forwarded-For', freshAddress())
        // supertest's agent carries the header by default; take it off or set it wrong.
        req.unset('X-Trenchward-Client')
        if (header) req.set('X-Trenchward-Client', header)
        const res = await req.type('form').send('title=Forged&version=0')
        expect(res.status, `${route.key} with header ${header}`).toBe(403)
        expect(res.body.error).toEqual({
          code: 'FORBIDDEN',
          message: 'Write requests must come from the Trenchward client',
          requestId: expect.any(String),
        })
      }
    }
    expect(await tableChecksums(app.sequelize)).toEqual(before)
    // Sign-out was refused as well: the session still works.
    expect((await agent.get('/api/auth/me')).status).toBe(200)
  })
})

describe('upload limits', () => {
  it('when an attachment is larger than ATTACHMENT_MAX_MB, then it responds 413 and leaves no row and no file', async () => {
    const { agent } = await signedInAgent(app, 'applicant')
    const id = await draftOf(agent)
    const dir = join(app.config.uploadDir, 'attachments')
    const filesBefore = await readdir(dir).catch(() => [])
    const big = Buffer.concat([TINY_PDF, Buffer.alloc(1.5 * 1024 * 1024, 0x20)])
    const res = await upload(agent, id, 'drawing', big, 'big.pdf', 'application/pdf')
    expect(res.status).toBe(413)
    expect(res.body.error).toMatchObject({
      code: 'PAYLOAD_TOO_LARGE',
      requestId: expect.any(String),
    })
    expect((await agent.get(`/api/applications/${id}/attachments`)).body.items).toEqual([])
    expect((await readdir(dir).catch(() => [])).sort()).toEqual(filesBefore.sort())
  })

  it('when a network file is larger than IMPORT_MAX_UPLOAD_MB, then it responds 413 and no import job exists', async () => {
    const { agent } = await signedInAgent(app, 'asset_engineer')
    const big = Buffer.from(
      JSON.stringify({
        type: 'FeatureCollection',
        features: [],
        pad: 'x'.repeat(1.5 * 1024 * 1024),
      }),
    )
    const res = await agent
      .post('/api/network/imports')
      .attach('file', big, { filename: 'network.geojson' })
    expect(res.status).toBe(413)
    expect(res.body.error.code).toBe('PAYLOAD_TOO_LARGE')
    expect((await agent.get('/api/network/imports')).body.items).toEqual([])
  })

  it('when a JSON body is larger than 1 MB, then it responds 413 in the envelope', async () => {
    const { agent } = await signedInAgent(app, 'applicant')
    const res = await agent.post('/api/applications').send({ title: 'x'.repeat(1.2 * 1024 * 1024) })
    expect(res.status).toBe(413)
    expect(res.body.error.code).toBe('PAYLOAD_TOO_LARGE')
  })

  it('when a JSON body has a charset or encoding the parser cannot read, then it responds 415 in the envelope', async () => {
    const { agent } = await signedInAgent(app, 'applicant')
    const charset = await agent
      .post('/api/applications')
      .set('Content-Type', 'application/json; charset=koi8-r')
      .send('{"title":"Works"}')
    expect(charset.status).toBe(415)
    expect(charset.body.error).toMatchObject({
      code: 'VALIDATION_FAILED',
      requestId: expect.any(String),
    })
    const encoding = await agent
      .post('/api/applications')
      .set('Content-Type', 'application/json')
      .set('Content-Encoding', 'x-unknown')
      .send('{"title":"Works"}')
    expect(encoding.status).toBe(415)
    expect(encoding.body.error.code).toBe('VALIDATION_FAILED')
  })

  it('when the content is HTML or SVG named and declared as an image, then it responds 400 on file', async () => {
    const { agent } = await signedInAgent(app, 'applicant')
    const id = await draftOf(agent)
    for (const [name, content] of [
      ['photo.png', '<html><script>alert(1)</script></html>'],
      ['plan.svg', '<svg xmlns="http://www.w3.org/2000/svg" onload="alert(1)"/>'],
      ['lift.pdf', ' %PDF-1.4 with a space in front'],
    ] as const) {
      const res = await upload(agent, id, 'photo', Buffer.from(content), name, 'image/png')
      expect(res.status, name).toBe(400)
      expect(res.body.error.fields).toEqual([
        { field: 'file', message: 'Only PDF, PNG, JPEG or WebP files can be attached' },
      ])
    }
  })

  it('when a PNG is sent as a PDF, then it is stored and served as a PNG, as a download, with nosniff', async () => {
    const { agent } = await signedInAgent(app, 'applicant')
    const id = await draftOf(agent)
    const png = Buffer.concat([
      Buffer.from([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a]),
      Buffer.alloc(32),
    ])
    const up = await upload(agent, id, 'photo', png, 'site.pdf', 'application/pdf')
    expect(up.status).toBe(201)
    const file = await agent
      .get(`/api/applications/${id}/attachments/${up.body.id}/file`)
      .buffer(true)
    expect(file.headers['content-type']).toBe('image/png')
    expect(file.headers['x-content-type-options']).toBe('nosniff')
    expect(file.headers['content-disposition']).toMatch(/^attachment;/)
  })
})

describe('no path traversal into files', () => {
  it('when the uploaded file name climbs out of its folder, then only its last part is kept and the file stays in the upload folder', async () => {
    const { agent } = await signedInAgent(app, 'applicant')
    const id = await draftOf(agent)
    const up = await upload(
      agent,
      id,
      'drawing',
      TINY_PDF,
      '../../../etc/passwd.pdf',
      'application/pdf',
    )
    expect(up.status).toBe(201)
    expect(up.body.filename).toBe('passwd.pdf')
    const rows = await app.sequelize.query<{ storageName: string }>(
      'SELECT storage_name AS storageName FROM application_attachments WHERE id = ?',
      { replacements: [up.body.id], type: QueryTypes.SELECT },
    )
    expect(rows[0]!.storageName).toMatch(/^[0-9a-f-]{36}\.upload$/)
    const file = await agent
      .get(`/api/applications/${id}/attachments/${up.body.id}/file`)
      .buffer(true)
    expect(file.headers['content-disposition']).toMatch(/^attachment; filename="?passwd\.pdf"?$/)
  })

  it('when a file name has umlauts, then it is kept as written (UTF-8), not garbled', async () => {
    const { agent } = await signedInAgent(app, 'applicant')
    const id = await draftOf(agent)
    const up = await upload(
      agent,
      id,
      'drawing',
      TINY_PDF,
      'Lagepläne Straße.pdf',
      'application/pdf',
    )
    expect(up.status).toBe(201)
    expect(up.body.filename).toBe('Lagepläne Straße.pdf')
  })

  it('when an id in a download address is a path, then it responds 400 or 404 and never a file', async () => {
    const { agent, email, password } = await signedInAgent(app, 'applicant')
    const id = await draftOf(agent)
    const signIn = await fetch(`${app.baseUrl}/api/auth/sign-in`, {
      method: 'POST',
      headers: { 'content-type': 'application/json', 'x-trenchward-client': '1' },
      body: JSON.stringify({ email, password }),
    })
    const cookie = signIn.headers
      .getSetCookie()
      .map((c) => c.split(';')[0])
      .join('; ')
    for (const path of [
      `/api/applications/${id}/attachments/..%2F..%2F..%2Fetc%2Fpasswd/file`,
      `/api/applications/${id}/attachments/%2e%2e/file`,
      `/api/applications/${id}/attachments/1%00/file`,
      `/api/applications/${id}/attachments/%zz/file`,
      '/api/permits/..%2F..%2Fpackage.json/document',
      '/api/permits/%2e%2e%2f%2e%2e%2fpackage.json/document',
    ]) {
      const res = await rawGet(path, cookie)
      expect([400, 404], path).toContain(res.status)
      expect(JSON.parse(res.body).error.code, path).toMatch(/VALIDATION_FAILED|NOT_FOUND/)
    }
  })

  it('when the client files are asked for with .. or encoded .., then nothing outside the build is served', async () => {
    for (const path of [
      '/../package.json',
      '/..%2f..%2fpackage.json',
      '/assets/..%2f..%2f..%2fpackage.json',
      '/%2e%2e/%2e%2e/etc/passwd',
      '/assets/%2e%2e%2f%2e%2e%2f%2e%2e%2f.data/local.env',
    ]) {
      const res = await rawGet(path)
      expect(res.body, path).not.toContain('"name": "trenchward"')
      expect(res.body, path).not.toContain('root:x:0:0')
      expect(res.body, path).not.toContain('SESSION_SECRET')
      expect(res.status, path).toBeLessThan(500)
    }
  })
})

describe('rate limits', () => {
  it('when one address fails to sign in 10 times, then the 11th attempt gets 429 and another address is still heard', async () => {
    const email = `${unique('nobody')}@example.test`
    const from = freshAddress()
    const attempt = (addr: string) =>
      app
        .agent()
        .post('/api/auth/sign-in')
        .set('X-Forwarded-For', addr)
        .send({ email, password: 'wrong password' })
    for (let i = 0; i < 10; i++) expect((await attempt(from)).status).toBe(401)
    const limited = await attempt(from)
    expect(limited.status).toBe(429)
    expect(limited.body.error).toEqual({
      code: 'RATE_LIMITED',
      message: 'Too many sign-in attempts. Wait a few minutes and try again.',
      requestId: expect.any(String),
    })
    expect(limited.headers['ratelimit-policy']).toBeDefined()
    expect((await attempt(freshAddress())).status).toBe(401)
  })

  it('when one address sends more than 60 uploads in 10 minutes, then it gets 429 and another address is still heard', async () => {
    const { agent } = await signedInAgent(app, 'applicant')
    const id = await draftOf(agent)
    const from = freshAddress()
    const upload = (addr: string) =>
      agent.post(`/api/applications/${id}/attachments`).set('X-Forwarded-For', addr).send({})
    for (let i = 0; i < 60; i++) expect((await upload(from)).status).toBe(400)
    const limited = await upload(from)
    expect(limited.status).toBe(429)
    expect(limited.body.error.code).toBe('RATE_LIMITED')
    expect((await upload(freshAddress())).status).toBe(400)
  })
})
