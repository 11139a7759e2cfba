import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { noticeDueAt, sendAttendanceNoticesOnce } from '../../server/services/attendance-notices.ts'
import { permitDirs } from '../helpers/review-fixtures.ts'
import { grantedWorks, mailsTo, TINY_PNG } from '../helpers/site-fixtures.ts'
import { signedInAgent, startTestApp } from '../helpers/test-app.ts'
import type { TestApp } from '../helpers/test-app.ts'

let app: TestApp
beforeAll(async () => {
  app = await startTestApp(permitDirs())
})
afterAll(async () => {
  await app.close()
})

const hours = (h: number, from = new Date()) => new Date(from.getTime() + h * 3_600_000)

describe('works on site: planned start, start, finish', () => {
  it('when the water owner attends with 24 h notice, then a closer planned start is refused, the notice goes out 24 h ahead, and start and finish are mailed', async () => {
    const w = await grantedWorks(app, { notice_h: 24 })
    const base = `/api/site-works/${w.applicationId}`

    const before = await w.applicant.agent.get(base)
    expect(before.status).toBe(200)
    expect(before.body).toMatchObject({
      state: 'not_started',
      requirements: {
        notice_h: 24,
        photoKinds: ['reinstatement'],
        attendance: [{ owner: { id: w.net.water.id }, notice_h: 24 }],
      },
      missingPhotoKinds: ['reinstatement'],
    })

    // Too close: the owner asks for 24 hours.
    const tooSoon = await w.applicant.agent
      .post(`${base}/planned-start`)
      .send({ plannedStartAt: hours(3).toISOString() })
    expect(tooSoon.status).toBe(422)
    expect(tooSoon.body.error.fields[0].field).toBe('plannedStartAt')
    expect(tooSoon.body.error.message).toContain(w.net.water.name)

    const plannedAt = hours(30)
    plannedAt.setMilliseconds(0)
    const planned = await w.applicant.agent
      .post(`${base}/planned-start`)
      .send({ plannedStartAt: plannedAt.toISOString(), note: 'Gang of three, mini digger' })
    expect(planned.status).toBe(201)
    expect(planned.body.plannedStartAt).toBe(plannedAt.toISOString())

    // The scheduler: nothing yet 30 h ahead; due one interval before the 24 h mark; once only.
    const interval = app.config.REMINDER_INTERVAL_S
    const due = noticeDueAt(plannedAt, 24, interval)
    expect(plannedAt.getTime() - due.getTime()).toBe(24 * 3_600_000 + interval * 1000)
    const waterBefore = (await mailsTo(w.net.w.email)).length
    await sendAttendanceNoticesOnce(app.sequelize, app.config, new Date(due.getTime() - 1000))
    expect(await mailsTo(w.net.w.email)).toHaveLength(waterBefore)
    expect(await sendAttendanceNoticesOnce(app.sequelize, app.config, due)).toBeGreaterThanOrEqual(
      1,
    )
    const notice = (await mailsTo(w.net.w.email)).at(-1)!
    expect(notice.subject).toMatch(/^Works start planned/)
    expect(notice.subject).toContain(w.permit.number)
    expect(notice.textBody).toContain('24 hours ahead')
    expect(notice.textBody).toContain('Gang of three, mini digger')
    await sendAttendanceNoticesOnce(app.sequelize, app.config, hours(1, due))
    expect(await mailsTo(w.net.w.email)).toHaveLength(waterBefore + 1)
    // The gas owner does not attend and gets nothing.
    const gasBefore = (await mailsTo(w.net.g.email)).length

    // Started now: earlier than planned, so the notice did not reach the owner 24 h ahead.
    const started = await w.applicant.agent.post(`${base}/start`).send({ note: 'Fence up' })
    expect(started.status).toBe(201)
    expect(started.body.state).toBe('on_site')
    const startMail = (await mailsTo(w.net.w.email)).at(-1)!
    expect(startMail.subject).toBe(`Works started: ${w.permit.number} (${started.body.reference})`)
    expect(startMail.textBody).toContain('did not reach you 24 hours ahead')
    expect(startMail.textBody).toContain('Sam Site')
    expect(await mailsTo(w.net.g.email)).toHaveLength(gasBefore)
    expect((await w.applicant.agent.post(`${base}/start`).send({})).status).toBe(422)

    // Finish needs the reinstatement photo first.
    const early = await w.applicant.agent.post(`${base}/finish`).send({})
    expect(early.status).toBe(422)
    expect(early.body.error.fields).toEqual([
      { field: 'photos.reinstatement', message: expect.stringContaining('reinstatement') },
    ])
    const pdf = await w.applicant.agent
      .post(`${base}/photos`)
      .field('kind', 'reinstatement')
      .attach('file', Buffer.from('%PDF-1.7\n%fake\n'), 'photo.jpg')
    expect(pdf.status).toBe(400)
    expect(pdf.body.error.fields[0].field).toBe('file')
    const photo = await w.applicant.agent
      .post(`${base}/photos`)
      .field('kind', 'reinstatement')
      .field('caption', 'Footway relaid')
      .attach('file', TINY_PNG, 'IMG_0001.png')
    expect(photo.status).toBe(201)
    expect(photo.body).toMatchObject({ kind: 'reinstatement', contentType: 'image/png' })
    const file = await w.net.w.agent.get(photo.body.url)
    expect(file.status).toBe(200)
    expect(file.headers['content-type']).toBe('image/png')

    const finished = await w.applicant.agent.post(`${base}/finish`).send({ note: 'Site clear' })
    expect(finished.status).toBe(201)
    expect(finished.body).toMatchObject({ state: 'finished', missingPhotoKinds: [] })
    const finishMail = (await mailsTo(w.net.w.email)).at(-1)!
    expect(finishMail.subject).toBe(
      `Works finished: ${w.permit.number} (${finished.body.reference})`,
    )
    expect(finishMail.textBody).toContain('reinstatement 1')
    expect(finishMail.textBody).toContain('Site clear')
  })

  it('when the planned start lies within its notice plus one scheduler interval, then the next run sends the notice; only the applicant records works', async () => {
    const w = await grantedWorks(app, { notice_h: 2 })
    const base = `/api/site-works/${w.applicationId}`
    const plannedAt = hours(2 + app.config.REMINDER_INTERVAL_S / 3600 / 2)
    expect(
      (
        await w.applicant.agent
          .post(`${base}/planned-start`)
          .send({ plannedStartAt: plannedAt.toISOString() })
      ).status,
    ).toBe(201)
    // The scheduler runs now: half an interval past 2 h ahead is inside 2 h plus one interval.
    expect(
      await sendAttendanceNoticesOnce(app.sequelize, app.config, new Date()),
    ).toBeGreaterThanOrEqual(1)
    // Only the applicant records works, never an owner or the office.
    expect((await w.net.w.agent.post(`${base}/start`).send({})).status).toBe(403)
    expect((await w.officer.agent.post(`${base}/start`).send({})).status).toBe(403)
    const other = await signedInAgent(app, 'applicant')
    expect((await other.agent.get(base)).status).toBe(404)
  })

  it('when a start is sent in the future or outside the permit, then it is refused naming the field', async () => {
    const w = await grantedWorks(app, { notice_h: null })
    const base = `/api/site-works/${w.applicationId}`
    const future = await w.applicant.agent
      .post(`${base}/start`)
      .send({ at: hours(2).toISOString() })
    expect(future.status).toBe(400)
    expect(future.body.error.fields[0].field).toBe('at')
    const bad = await w.applicant.agent.post(`${base}/start`).send({ at: 'yesterday' })
    expect(bad.status).toBe(400)
    expect(bad.body.error.fields[0].field).toBe('at')
    const before = await w.applicant.agent
      .post(`${base}/start`)
      .send({ at: hours(-24 * 3).toISOString() })
    expect(before.status).toBe(422)
    expect(before.body.error.fields[0].field).toBe('at')
    // No attendance asked: a start is fine at once and nobody is mailed about it.
    const gasBefore = (await mailsTo(w.net.w.email)).length
    expect((await w.applicant.agent.post(`${base}/start`).send({})).status).toBe(201)
    expect(await mailsTo(w.net.w.email)).toHaveLength(gasBefore)
  })
})
