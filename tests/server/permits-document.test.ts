import { execFileSync } from 'node:child_process'
import { createHash } from 'node:crypto'
import { mkdtempSync, writeFileSync } from 'node:fs'
import { tmpdir } from 'node:os'
import { join } from 'node:path'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { STANDARD_CAUTION } from '../../shared/statics/index.ts'
import { Permit } from '../../server/models/index.ts'
import { signedInAgent, startTestApp } from '../helpers/test-app.ts'
import type { TestApp } from '../helpers/test-app.ts'
import {
  buildTwoOwnerNetwork,
  permitDirs,
  reviewIdFor,
  submitApplication,
  worksNearBoth,
} from '../helpers/review-fixtures.ts'

let app: TestApp
beforeAll(async () => {
  app = await startTestApp(permitDirs())
})
afterAll(async () => {
  await app.close()
})

const work = mkdtempSync(join(tmpdir(), 'tw-permit-test-'))
const toFile = (name: string, data: Buffer) => {
  const p = join(work, name)
  writeFileSync(p, data)
  return p
}
// poppler-utils (Debian): pdfsig validates signatures, pdftotext extracts the text.
const pdfsig = (file: string) => {
  try {
    return execFileSync('pdfsig', [file], { encoding: 'utf8' })
  } catch (err) {
    return String((err as { stdout?: string }).stdout ?? '')
  }
}
const pdftext = (file: string) =>
  execFileSync('pdftotext', ['-layout', file, '-'], { encoding: 'utf8' }).replace(/\s+/g, ' ')

const binary = (
  res: { on: (e: string, cb: (c?: Buffer) => void) => void },
  cb: (err: Error | null, body: Buffer) => void,
) => {
  const chunks: Buffer[] = []
  res.on('data', (c?: Buffer) => chunks.push(c!))
  res.on('end', () => cb(null, Buffer.concat(chunks)))
}

const WATER_CONDITION = 'Keep every outrigger mat at least 3.5 m clear of the water main.'

/** A granted permit: water accepts with a condition, gas accepts. */
async function grantedPermit() {
  const net = await buildTwoOwnerNetwork(app)
  const applicant = await signedInAgent(app, 'applicant')
  const officer = await signedInAgent(app, 'permit_officer')
  const id = await submitApplication(
    applicant.agent,
    worksNearBoth(net.origin),
    'Crane lift at the depot',
  )
  const wr = await reviewIdFor(net.w.agent, id)
  const gr = await reviewIdFor(net.g.agent, id)
  expect(
    (
      await net.w.agent.post(`/api/reviews/${wr}/decision`).send({
        decision: 'accepted_with_conditions',
        version: 0,
        conditions: [{ source: 'own', code: 'mat-offset', text: WATER_CONDITION }],
      })
    ).status,
  ).toBe(200)
  expect(
    (
      await net.g.agent
        .post(`/api/reviews/${gr}/decision`)
        .send({ decision: 'accepted', version: 0 })
    ).status,
  ).toBe(200)
  const draft = (await officer.agent.get(`/api/permit-office/applications/${id}/decision-draft`))
    .body
  const granted = await officer.agent
    .post(`/api/permit-office/applications/${id}/grant`)
    .send({ version: draft.version })
  expect(granted.status).toBe(201)
  return { net, applicant, officer, id, permit: granted.body }
}

describe('the permit PDF', () => {
  it('when granted, then the PDF holds the conditions and caution, pdfsig calls it valid, and a one-byte change is detected', async () => {
    const { applicant, net, permit } = await grantedPermit()
    const res = await applicant.agent.get(permit.documentUrl).buffer(true).parse(binary)
    expect(res.status).toBe(200)
    expect(res.headers['content-type']).toBe('application/pdf')
    const pdf = res.body as Buffer
    expect(createHash('sha256').update(pdf).digest('hex')).toBe(permit.pdfSha256)
    const file = toFile('permit.pdf', pdf)

    const text = pdftext(file)
    expect(text).toContain(permit.number)
    expect(text).toContain(WATER_CONDITION)
    expect(text).toContain(permit.verificationCode)
    expect(text).toContain(net.water.name)
    expect(text).toContain('Crane lift at the depot')
    expect(text).toContain('largest leg load 400 kN')
    expect(text).toContain(STANDARD_CAUTION.slice(0, 60))
    const sig = pdfsig(file)
    expect(sig).toMatch(/Signature is Valid/)
    expect(sig).toMatch(/Total document signed/)

    const tampered = Buffer.from(pdf)
    const at = tampered.indexOf('\nstream\n') + 12
    tampered[at] = tampered[at]! ^ 0x01
    const bad = toFile('tampered.pdf', tampered)
    expect(pdfsig(bad)).toMatch(/Digest Mismatch|Signature is Invalid/)

    // The owner's engineer (a party) may download it; a stranger may not.
    expect((await net.w.agent.get(permit.documentUrl)).status).toBe(200)
    const stranger = await signedInAgent(app, 'applicant')
    expect((await stranger.agent.get(permit.documentUrl)).status).toBe(404)
  })
})

describe('GET /api/verify/:code and POST /api/verify/:code/document', () => {
  it('when the code is valid, unknown, expired or revoked, then the public check says so, and the document check compares hashes', async () => {
    const { applicant, officer, permit } = await grantedPermit()
    const publicAgent = app.agent()
    const ok = await publicAgent.get(`/api/verify/${permit.verificationCode.toLowerCase()}`)
    expect(ok.status).toBe(200)
    expect(ok.body).toEqual({
      state: 'valid',
      permitNumber: permit.number,
      issue: 1,
      validFrom: permit.validFrom,
      validTo: permit.validTo,
      conditionCount: 1,
      applicantOrganisation: expect.any(String),
      site: '12 Example Lane, Testbury',
    })

    const unknown = await publicAgent.get('/api/verify/2222-2222-22')
    expect(unknown.status).toBe(200)
    expect(unknown.body).toEqual({
      state: 'unknown',
      permitNumber: null,
      issue: null,
      validFrom: null,
      validTo: null,
      conditionCount: null,
      applicantOrganisation: null,
      site: null,
    })

    const pdf = (await applicant.agent.get(permit.documentUrl).buffer(true).parse(binary))
      .body as Buffer
    const same = await publicAgent
      .post(`/api/verify/${permit.verificationCode}/document`)
      .attach('file', pdf, 'permit.pdf')
    expect(same.status).toBe(200)
    expect(same.body).toEqual({ state: 'valid', matches: true, uploadedSha256: permit.pdfSha256 })
    const changed = Buffer.from(pdf)
    changed[changed.length - 20] = changed[changed.length - 20]! ^ 0x01
    const diff = await publicAgent
      .post(`/api/verify/${permit.verificationCode}/document`)
      .attach('file', changed, 'permit.pdf')
    expect(diff.body.matches).toBe(false)
    const notPdf = await publicAgent
      .post(`/api/verify/${permit.verificationCode}/document`)
      .attach('file', Buffer.from('hello'), 'permit.pdf')
    expect(notPdf.status).toBe(400)
    expect(notPdf.body.error.fields).toEqual([{ field: 'file', message: 'This is not a PDF file' }])

    // Time passes beyond the last day: expired.
    const row = (await Permit.findByPk(permit.id))!
    const keep = { validFrom: row.validFrom, validTo: row.validTo }
    await row.update({ validFrom: '2020-01-01', validTo: '2020-01-31' })
    expect((await publicAgent.get(`/api/verify/${permit.verificationCode}`)).body.state).toBe(
      'expired',
    )
    await row.update(keep)

    // Revoked.
    const revoked = await officer.agent
      .post(`/api/permits/${permit.id}/revoke`)
      .send({ reason: 'Works started before the owner briefing.' })
    expect(revoked.status).toBe(200)
    expect(revoked.body).toMatchObject({
      status: 'revoked',
      revokedReason: 'Works started before the owner briefing.',
    })
    expect((await publicAgent.get(`/api/verify/${permit.verificationCode}`)).body.state).toBe(
      'revoked',
    )
    expect(
      (await applicant.agent.get(`/api/applications/${permit.applicationId}`)).body.status,
    ).toBe('revoked')
  })
})

describe('POST /api/permits/:id/extend and /vary', () => {
  it('when the officer extends and then varies, then each makes a new signed issue and the old code reads superseded', async () => {
    const { applicant, officer, permit } = await grantedPermit()
    const ext = await officer.agent
      .post(`/api/permits/${permit.id}/extend`)
      .send({ validTo: '2099-12-31', reason: 'Weather delays.' })
    expect(ext.status).toBe(201)
    expect(ext.body).toMatchObject({
      number: permit.number,
      issue: 2,
      changeKind: 'extended',
      validTo: '2099-12-31',
      status: 'valid',
    })
    expect(ext.body.verificationCode).not.toBe(permit.verificationCode)
    expect((await app.agent().get(`/api/verify/${permit.verificationCode}`)).body.state).toBe(
      'superseded',
    )

    const again = await officer.agent
      .post(`/api/permits/${permit.id}/extend`)
      .send({ validTo: '2099-12-31', reason: 'Twice.' })
    expect(again.status).toBe(422)
    const shorter = await officer.agent
      .post(`/api/permits/${ext.body.id}/extend`)
      .send({ validTo: '2020-01-01', reason: 'Wrong.' })
    expect(shorter.status).toBe(422)
    expect(shorter.body.error.fields[0].field).toBe('validTo')

    const vary = await officer.agent.post(`/api/permits/${ext.body.id}/vary`).send({
      reason: 'The owner relaxed the distance after a trial hole.',
      conditions: [
        {
          code: 'mat-offset',
          text: 'Keep every outrigger mat at least 2 m clear of the water main.',
        },
      ],
    })
    expect(vary.status).toBe(201)
    expect(vary.body).toMatchObject({
      issue: 3,
      changeKind: 'varied',
      conditions: [{ text: 'Keep every outrigger mat at least 2 m clear of the water main.' }],
    })
    const pdf = (await applicant.agent.get(vary.body.documentUrl).buffer(true).parse(binary))
      .body as Buffer
    const file = toFile('varied.pdf', pdf)
    expect(pdftext(file)).toContain('at least 2 m clear of the water main')
    expect(pdftext(file)).toContain('replaces issue 2')
    expect(pdfsig(file)).toMatch(/Signature is Valid/)

    const list = await applicant.agent.get(`/api/applications/${permit.applicationId}/permits`)
    expect(list.status).toBe(200)
    expect(
      list.body.permits.map((p: { issue: number; status: string }) => [p.issue, p.status]),
    ).toEqual([
      [1, 'superseded'],
      [2, 'superseded'],
      [3, 'valid'],
    ])
    // Only the permit office changes permits.
    expect(
      (
        await applicant.agent
          .post(`/api/permits/${vary.body.id}/revoke`)
          .send({ reason: 'Please.' })
      ).status,
    ).toBe(403)
  })

  it('when an owner objected, then the grant is refused with 422 and the officer refuses with reasons', async () => {
    const net = await buildTwoOwnerNetwork(app)
    const applicant = await signedInAgent(app, 'applicant')
    const officer = await signedInAgent(app, 'permit_officer')
    const id = await submitApplication(applicant.agent, worksNearBoth(net.origin))
    const wr = await reviewIdFor(net.w.agent, id)
    const gr = await reviewIdFor(net.g.agent, id)
    await net.w.agent.post(`/api/reviews/${wr}/decision`).send({ decision: 'accepted', version: 0 })
    await net.g.agent.post(`/api/reviews/${gr}/decision`).send({
      decision: 'objected',
      version: 0,
      reasons: 'The crane stands over the main; move it.',
    })
    const draft = (await officer.agent.get(`/api/permit-office/applications/${id}/decision-draft`))
      .body
    expect(draft.objections).toEqual([
      {
        owner: { id: net.gas.id, name: net.gas.name },
        reasons: 'The crane stands over the main; move it.',
      },
    ])
    const grant = await officer.agent
      .post(`/api/permit-office/applications/${id}/grant`)
      .send({ version: draft.version })
    expect(grant.status).toBe(422)
    const refuse = await officer.agent
      .post(`/api/permit-office/applications/${id}/refuse`)
      .send({ version: draft.version, reasons: 'The gas owner objects.' })
    expect(refuse.status).toBe(200)
    expect(refuse.body.status).toBe('refused')
    const permits = await applicant.agent.get(`/api/applications/${id}/permits`)
    expect(permits.body).toMatchObject({
      permits: [],
      refusal: { reasons: 'The gas owner objects.' },
    })
  })
})
