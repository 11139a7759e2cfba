import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { createHash } from 'node:crypto'
import { signedInAgent, startTestApp } from '../helpers/test-app.ts'
import type { TestApp } from '../helpers/test-app.ts'

let app: TestApp
beforeAll(async () => {
  app = await startTestApp()
})
afterAll(async () => {
  await app.close()
})

// Smallest files that carry each format's signature (enough for content sniffing).
const PDF = Buffer.from('%PDF-1.4\n1 0 obj\n<<>>\nendobj\ntrailer\n<<>>\n%%EOF\n', 'latin1')
const PNG = Buffer.concat([
  Buffer.from([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a]),
  Buffer.alloc(32),
])
const EXE = Buffer.concat([Buffer.from('MZ'), Buffer.alloc(64)])

async function draftOf(agent: ReturnType<TestApp['agent']>) {
  const res = await agent.post('/api/applications').send({ title: 'Documents test' })
  expect(res.status).toBe(201)
  return res.body.id as number
}

describe('POST /api/applications/:id/attachments', () => {
  it('when a PDF method statement is uploaded, then it is stored with its SHA-256 and can be downloaded', async () => {
    const { agent } = await signedInAgent(app, 'applicant')
    const id = await draftOf(agent)
    const res = await agent
      .post(`/api/applications/${id}/attachments`)
      .field('kind', 'method_statement')
      .attach('file', PDF, { filename: 'method.pdf', contentType: 'application/pdf' })
    expect(res.status).toBe(201)
    expect(res.body).toMatchObject({
      applicationId: id,
      kind: 'method_statement',
      filename: 'method.pdf',
      contentType: 'application/pdf',
      size_bytes: PDF.length,
      sha256: createHash('sha256').update(PDF).digest('hex'),
    })
    const list = await agent.get(`/api/applications/${id}/attachments`)
    expect(list.body.items).toHaveLength(1)
    const file = await agent
      .get(`/api/applications/${id}/attachments/${res.body.id}/file`)
      .buffer(true)
    expect(file.status).toBe(200)
    expect(file.headers['content-type']).toBe('application/pdf')
    expect(file.headers['content-disposition']).toMatch(/^attachment; filename="?method\.pdf"?$/)
    expect(Buffer.compare(file.body as Buffer, PDF)).toBe(0)
  })

  it('when the content is not a PDF or image, then it responds 400 on file whatever the name says', async () => {
    const { agent } = await signedInAgent(app, 'applicant')
    const id = await draftOf(agent)
    const res = await agent
      .post(`/api/applications/${id}/attachments`)
      .field('kind', 'drawing')
      .attach('file', EXE, { filename: 'drawing.pdf', contentType: 'application/pdf' })
    expect(res.status).toBe(400)
    expect(res.body.error.fields).toEqual([
      { field: 'file', message: 'Only PDF, PNG, JPEG or WebP files can be attached' },
    ])
    expect((await agent.get(`/api/applications/${id}/attachments`)).body.items).toEqual([])
  })

  it('when the kind is missing, then it responds 400 on kind', async () => {
    const { agent } = await signedInAgent(app, 'applicant')
    const id = await draftOf(agent)
    const res = await agent
      .post(`/api/applications/${id}/attachments`)
      .attach('file', PNG, 'photo.png')
    expect(res.status).toBe(400)
    expect(res.body.error.fields).toEqual([
      { field: 'kind', message: 'Choose what the document is' },
    ])
  })

  it('when another contractor tries to read or add, then it responds 404', async () => {
    const owner = await signedInAgent(app, 'applicant')
    const other = await signedInAgent(app, 'applicant')
    const id = await draftOf(owner.agent)
    const up = await owner.agent
      .post(`/api/applications/${id}/attachments`)
      .field('kind', 'photo')
      .attach('file', PNG, 'site.png')
    expect(up.status).toBe(201)
    expect((await other.agent.get(`/api/applications/${id}/attachments`)).status).toBe(404)
    expect(
      (await other.agent.get(`/api/applications/${id}/attachments/${up.body.id}/file`)).status,
    ).toBe(404)
    const add = await other.agent
      .post(`/api/applications/${id}/attachments`)
      .field('kind', 'photo')
      .attach('file', PNG, 'x.png')
    expect(add.status).toBe(404)
  })

  it('when the attachment id belongs to another application, then it responds 404 (no reaching across)', async () => {
    const { agent } = await signedInAgent(app, 'applicant')
    const a = await draftOf(agent)
    const b = await draftOf(agent)
    const up = await agent
      .post(`/api/applications/${a}/attachments`)
      .field('kind', 'photo')
      .attach('file', PNG, 'a.png')
    expect((await agent.get(`/api/applications/${b}/attachments/${up.body.id}/file`)).status).toBe(
      404,
    )
    expect(
      (await agent.get(`/api/applications/${a}/attachments/..%2F..%2Flocal.env/file`)).status,
    ).toBe(400)
  })

  it('when a draft document is deleted, then it is gone; the request is not multipart, then 400', async () => {
    const { agent } = await signedInAgent(app, 'applicant')
    const id = await draftOf(agent)
    const up = await agent
      .post(`/api/applications/${id}/attachments`)
      .field('kind', 'photo')
      .attach('file', PNG, 'p.png')
    expect((await agent.delete(`/api/applications/${id}/attachments/${up.body.id}`)).status).toBe(
      204,
    )
    expect((await agent.get(`/api/applications/${id}/attachments`)).body.items).toEqual([])
    const notMultipart = await agent
      .post(`/api/applications/${id}/attachments`)
      .send({ kind: 'photo' })
    expect(notMultipart.status).toBe(400)
    expect(notMultipart.body.error.fields[0].field).toBe('file')
  })
})
