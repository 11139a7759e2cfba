import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { Op } from 'sequelize'
import { STANDARD_CAUTION } from '../../shared/statics/index.ts'
import { addWorkingDays } from '../../shared/time/working-days.ts'
import { OutboxMail, OwnerReview } from '../../server/models/index.ts'
import { createTestOrganisation, signedInAgent, startTestApp, unique } from '../helpers/test-app.ts'
import type { TestApp } from '../helpers/test-app.ts'
import {
  buildTwoOwnerNetwork,
  day,
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

const mailsTo = (email: string) =>
  OutboxMail.findAll({ where: { toAddress: email }, order: [['id', 'ASC']] })

describe('owner reviews from submit to grant', () => {
  it('when two owners are affected, one accepts with conditions and one asks a question first, then the officer grants', async () => {
    const net = await buildTwoOwnerNetwork(app)
    // A third owner whose pipes the works do not reach (this file must not rely on others' rows).
    const bystander = await createTestOrganisation('network_owner', unique('Test Sewer'))
    const applicant = await signedInAgent(app, 'applicant')
    const officer = await signedInAgent(app, 'permit_officer')
    const id = await submitApplication(applicant.agent, worksNearBoth(net.origin))

    // Submit opened one review per affected owner, not-affected records for the others.
    expect((await applicant.agent.get(`/api/applications/${id}`)).body.status).toBe('with_owners')
    const rows = await OwnerReview.findAll({ where: { applicationId: id } })
    const waiting = rows
      .filter((r) => r.state === 'waiting')
      .map((r) => r.ownerOrganisationId)
      .sort()
    expect(waiting).toEqual([net.water.id, net.gas.id].sort())
    expect(rows.find((r) => r.ownerOrganisationId === bystander.id)?.state).toBe('not_affected')
    expect(rows.filter((r) => r.state === 'not_affected').every((r) => r.dueOn === null)).toBe(true)

    // The engineers were mailed, with a link to their review.
    const wMail = await mailsTo(net.w.email)
    expect(wMail.at(-1)!.subject).toMatch(/^Please review TW-\d{4}-\d{5}/)
    expect(wMail.at(-1)!.textBody).toMatch(/\/reviews\/\d+/)

    // Queue: due in the configured working days.
    const queue = await net.w.agent.get('/api/reviews')
    expect(queue.status).toBe(200)
    const item = queue.body.items.find((r: { applicationId: number }) => r.applicationId === id)
    const today = day(0)
    expect(item).toMatchObject({
      state: 'waiting',
      owner: { id: net.water.id, name: net.water.name },
      openedOn: today,
      dueOn: addWorkingDays(today, 10, new Set()),
      dueInWorkingDays: 10,
      overdue: false,
      paused: false,
      version: 0,
      affectedSegmentCount: 1,
    })

    // Detail: my segment with the full engine result, nothing of the gas owner.
    const waterReviewId = item.id as number
    const detail = await net.w.agent.get(`/api/reviews/${waterReviewId}`)
    expect(detail.status).toBe(200)
    expect(detail.body.segments).toHaveLength(1)
    const seg = detail.body.segments[0]
    expect(seg.ownerRef).toBe(net.wRef)
    expect(seg.engineInput.pipe).toMatchObject({ material: 'PE100', outerDiameter_m: 0.2 })
    expect(seg.result).toEqual(
      expect.objectContaining({
        checks: expect.any(Array),
        effects: expect.any(Object),
        assumptions: expect.any(Array),
        conditions: expect.any(Array),
      }),
    )
    expect(detail.body.activities.features).toHaveLength(2)
    expect(detail.body.caution).toBe(STANDARD_CAUTION)
    expect(JSON.stringify(detail.body)).not.toContain(net.gRef)

    // The water engineer keeps a library condition and accepts with it (parameter edited),
    // plus a condition of their own.
    const tpl = await net.w.agent.post('/api/condition-templates').send({
      code: 'no-machine-digging',
      title: 'No machine digging near the main',
      text: 'No machine digging within {distance_m} m of the water main; dig by hand or vacuum there.',
      parameters: [
        {
          name: 'distance_m',
          label: 'Distance',
          unit: 'm',
          kind: 'number',
          default: 1,
          min: 0.3,
          max: 10,
        },
      ],
    })
    expect(tpl.status).toBe(201)
    const accepted = await net.w.agent.post(`/api/reviews/${waterReviewId}/decision`).send({
      decision: 'accepted_with_conditions',
      version: 0,
      reasons: 'Acceptable with protection of the main.',
      conditions: [
        {
          source: 'library',
          code: 'no-machine-digging',
          templateId: tpl.body.id,
          parameters: { distance_m: 2.5 },
        },
        {
          source: 'own',
          code: 'notify-before-backfill',
          text: 'Tell the water network team two working days before backfilling.',
        },
      ],
    })
    expect(accepted.status).toBe(200)
    expect(accepted.body.review).toMatchObject({ state: 'accepted_with_conditions', version: 1 })
    expect(accepted.body.current.conditions.map((c: { text: string }) => c.text)).toEqual([
      'No machine digging within 2.5 m of the water main; dig by hand or vacuum there.',
      'Tell the water network team two working days before backfilling.',
    ])

    // The gas engineer asks a question: the clock pauses, the applicant is mailed.
    const gasReviewId = await reviewIdFor(net.g.agent, id)
    const asked = await net.g.agent.post(`/api/reviews/${gasReviewId}/decision`).send({
      decision: 'information_requested',
      version: 0,
      question: 'Which crane model is it, and what are the outrigger mats made of?',
    })
    expect(asked.status).toBe(200)
    expect(asked.body.review).toMatchObject({
      state: 'information_requested',
      paused: true,
      dueOn: null,
      remainingWorkingDays: 10,
    })
    expect((await mailsTo(applicant.email)).at(-1)!.subject).toMatch(/has a question about/)

    // Not everyone has answered: the officer cannot grant yet.
    const early = await officer.agent
      .post(`/api/permit-office/applications/${id}/grant`)
      .send({ version: 1 })
    expect(early.status).toBe(422)
    expect(early.body.error.code).toBe('DOMAIN_RULE')

    // The applicant sees the question and the water decision, and answers.
    const seen = await applicant.agent.get(`/api/applications/${id}/reviews`)
    expect(seen.status).toBe(200)
    const gasSeen = seen.body.find((r: { owner: { id: number } }) => r.owner.id === net.gas.id)
    const waterSeen = seen.body.find((r: { owner: { id: number } }) => r.owner.id === net.water.id)
    expect(gasSeen).toMatchObject({
      state: 'information_requested',
      awaitingAnswer: true,
      paused: true,
    })
    expect(gasSeen.messages.map((m: { kind: string }) => m.kind)).toEqual(['question'])
    expect(waterSeen.conditions).toHaveLength(2)
    expect(JSON.stringify(seen.body)).not.toMatch(/outerDiameter|sidefillModulus/)
    const answered = await applicant.agent
      .post(`/api/applications/${id}/reviews/${gasReviewId}/answer`)
      .send({ body: 'A 60 t mobile crane on 1.5 m square timber mats.' })
    expect(answered.status).toBe(200)
    const gasAfter = answered.body.find((r: { id: number }) => r.id === gasReviewId)
    expect(gasAfter).toMatchObject({
      state: 'waiting',
      paused: false,
      awaitingAnswer: false,
      dueOn: addWorkingDays(today, 10, new Set()),
    })
    expect((await mailsTo(net.g.email)).at(-1)!.subject).toMatch(/answered your question/)

    // The gas engineer accepts; every review is answered now.
    const v = (await net.g.agent.get(`/api/reviews/${gasReviewId}`)).body.review.version
    const gasAccepts = await net.g.agent
      .post(`/api/reviews/${gasReviewId}/decision`)
      .send({ decision: 'accepted', version: v })
    expect(gasAccepts.status).toBe(200)
    expect(
      gasAccepts.body.decisions.map((d: { decision: string; superseded: boolean }) => [
        d.decision,
        d.superseded,
      ]),
    ).toEqual([
      ['information_requested', true],
      ['accepted', false],
    ])
    expect((await applicant.agent.get(`/api/applications/${id}`)).body.status).toBe(
      'ready_for_decision',
    )

    // The officer's queue shows it ready, with each owner's state.
    const oq = await officer.agent.get('/api/permit-office/queue?pageSize=500')
    expect(oq.status).toBe(200)
    const line = oq.body.items.find((x: { applicationId: number }) => x.applicationId === id)
    expect(line).toMatchObject({
      readyForDecision: true,
      openReviewCount: 0,
      overdueReviewCount: 0,
    })
    expect(line.reviews.map((r: { state: string }) => r.state).sort()).toEqual([
      'accepted',
      'accepted_with_conditions',
    ])

    // Merged conditions, then the grant with one extra condition of the office.
    const draft = await officer.agent.get(`/api/permit-office/applications/${id}/decision-draft`)
    expect(draft.status).toBe(200)
    expect(draft.body.conditions).toHaveLength(2)
    expect(draft.body.conditions[0]).toMatchObject({
      ownerOrganisationId: net.water.id,
      ownerName: net.water.name,
    })
    const granted = await officer.agent.post(`/api/permit-office/applications/${id}/grant`).send({
      version: draft.body.version,
      conditions: [
        ...draft.body.conditions,
        { code: 'display-permit', text: 'Display the permit number at the site entrance.' },
      ],
    })
    expect(granted.status).toBe(201)
    expect(granted.body).toMatchObject({
      number: expect.stringMatching(/^TWP-\d{4}-\d{5}$/),
      issue: 1,
      status: 'valid',
      validFrom: day(7),
      validTo: day(20),
      verificationCode: expect.stringMatching(/^[2-9A-Z]{4}-[2-9A-Z]{4}-[2-9A-Z]{2}$/),
      pdfSha256: expect.stringMatching(/^[0-9a-f]{64}$/),
    })
    expect(granted.body.conditions).toHaveLength(3)
    expect((await applicant.agent.get(`/api/applications/${id}`)).body.status).toBe('granted')

    // The applicant got the PDF by mail.
    const permitMail = (await mailsTo(applicant.email)).at(-1)!
    expect(permitMail.subject).toMatch(/has been granted/)
    expect(permitMail.attachments).toEqual([
      expect.objectContaining({ contentType: 'application/pdf' }),
    ])

    // Decisions are closed once granted.
    const late = await net.w.agent
      .post(`/api/reviews/${waterReviewId}/decision`)
      .send({ decision: 'objected', version: 1, reasons: 'Changed my mind.' })
    expect(late.status).toBe(422)

    // The history tells the story to the parties.
    const history = await applicant.agent.get(`/api/applications/${id}/history`)
    expect(history.status).toBe(200)
    const actions = history.body.map((e: { action: string }) => e.action)
    for (const a of [
      'application-submitted',
      'review-opened',
      'review-decided',
      'review-question-answered',
      'review-decision-superseded',
      'application-granted',
      'permit-issued',
    ]) {
      expect(actions).toContain(a)
    }
    const gasHistory = await net.g.agent.get(`/api/applications/${id}/history`)
    expect(gasHistory.status).toBe(200)
    expect(
      gasHistory.body.every(
        (e: { details: { ownerOrganisationId?: number } | null }) =>
          e.details?.ownerOrganisationId !== net.water.id,
      ),
    ).toBe(true)
  })
})

describe('POST /api/reviews/:id/decision', () => {
  it('when two engineers decide the same review at once, then exactly one wins and the other gets 409', async () => {
    const net = await buildTwoOwnerNetwork(app)
    const second = await signedInAgent(app, 'asset_engineer', net.water)
    const applicant = await signedInAgent(app, 'applicant')
    const id = await submitApplication(applicant.agent, worksNearBoth(net.origin))
    const reviewId = await reviewIdFor(net.w.agent, id)
    const [a, b] = await Promise.all([
      net.w.agent
        .post(`/api/reviews/${reviewId}/decision`)
        .send({ decision: 'accepted', version: 0 }),
      second.agent
        .post(`/api/reviews/${reviewId}/decision`)
        .send({ decision: 'objected', version: 0, reasons: 'The crane is too close.' }),
    ])
    expect([a.status, b.status].sort()).toEqual([200, 409])
    const loser = a.status === 409 ? a : b
    expect(loser.body.error.code).toBe('CONFLICT')
    const decisions = (await net.w.agent.get(`/api/reviews/${reviewId}`)).body.decisions
    expect(decisions).toHaveLength(1)
  })

  it('when a condition from the library misses a parameter value out of range, then it responds 400 naming the field', async () => {
    const net = await buildTwoOwnerNetwork(app)
    const applicant = await signedInAgent(app, 'applicant')
    const id = await submitApplication(applicant.agent, worksNearBoth(net.origin))
    const reviewId = await reviewIdFor(net.w.agent, id)
    const tpl = await net.w.agent.post('/api/condition-templates').send({
      code: 'mat-size',
      title: 'Mat size',
      text: 'Use outrigger mats of at least {mat_size_m} m square.',
      parameters: [
        { name: 'mat_size_m', label: 'Mat size', unit: 'm', default: 1.5, min: 0.5, max: 4 },
      ],
    })
    expect(tpl.status).toBe(201)
    const res = await net.w.agent.post(`/api/reviews/${reviewId}/decision`).send({
      decision: 'accepted_with_conditions',
      version: 0,
      conditions: [
        {
          source: 'library',
          code: 'mat-size',
          templateId: tpl.body.id,
          parameters: { mat_size_m: 9 },
        },
      ],
    })
    expect(res.status).toBe(400)
    expect(res.body.error).toMatchObject({
      code: 'VALIDATION_FAILED',
      fields: [{ field: 'conditions.0.parameters.mat_size_m', message: 'Must be at most 4 m' }],
    })
    const bad = await net.w.agent
      .post(`/api/reviews/${reviewId}/decision`)
      .send({ decision: 'objected', version: 0 })
    expect(bad.status).toBe(400)
    expect(bad.body.error.fields).toEqual([{ field: 'reasons', message: expect.any(String) }])
  })

  it('when another owner, the applicant or the officer tries, then they can neither see nor decide the review', async () => {
    const net = await buildTwoOwnerNetwork(app)
    const applicant = await signedInAgent(app, 'applicant')
    const officer = await signedInAgent(app, 'permit_officer')
    const id = await submitApplication(applicant.agent, worksNearBoth(net.origin))
    const reviewId = await reviewIdFor(net.w.agent, id)
    expect((await net.g.agent.get(`/api/reviews/${reviewId}`)).status).toBe(404)
    const other = await net.g.agent
      .post(`/api/reviews/${reviewId}/decision`)
      .send({ decision: 'accepted', version: 0 })
    expect(other.status).toBe(404)
    const byApplicant = await applicant.agent
      .post(`/api/reviews/${reviewId}/decision`)
      .send({ decision: 'accepted', version: 0 })
    expect(byApplicant.status).toBe(403)
    expect(byApplicant.body.error.code).toBe('FORBIDDEN')
    expect(
      (
        await officer.agent
          .post(`/api/reviews/${reviewId}/decision`)
          .send({ decision: 'accepted', version: 0 })
      ).status,
    ).toBe(403)
    expect((await app.agent().get(`/api/reviews/${reviewId}`)).status).toBe(401)
    // A stranger contractor cannot read the reviews or history of the application.
    const stranger = await signedInAgent(app, 'applicant')
    expect((await stranger.agent.get(`/api/applications/${id}/reviews`)).status).toBe(404)
    expect((await stranger.agent.get(`/api/applications/${id}/history`)).status).toBe(404)
    // Another owner cannot re-run my segment.
    const detail = (await net.w.agent.get(`/api/reviews/${reviewId}`)).body
    const rerun = await net.g.agent
      .post(`/api/reviews/${reviewId}/segments/${detail.segments[0].assessmentId}/rerun`)
      .send({ pipe: detail.segments[0].engineInput.pipe })
    expect(rerun.status).toBe(404)
  })

  it('when the engineer re-runs a segment with corrected data, then the re-run is stored beside the screening', async () => {
    const net = await buildTwoOwnerNetwork(app)
    const applicant = await signedInAgent(app, 'applicant')
    const id = await submitApplication(applicant.agent, worksNearBoth(net.origin))
    const reviewId = await reviewIdFor(net.w.agent, id)
    const before = (await net.w.agent.get(`/api/reviews/${reviewId}`)).body.segments[0]
    const corrected = { ...before.engineInput.pipe, cover_m: 2.2 }
    const res = await net.w.agent
      .post(`/api/reviews/${reviewId}/segments/${before.assessmentId}/rerun`)
      .send({ pipe: corrected, note: 'Cover measured in a trial hole.' })
    expect(res.status).toBe(201)
    expect(res.body).toMatchObject({
      assessmentId: before.assessmentId,
      note: 'Cover measured in a trial hole.',
      engineInput: { pipe: { cover_m: 2.2 } },
    })
    const after = (await net.w.agent.get(`/api/reviews/${reviewId}`)).body.segments[0]
    expect(after.result).toEqual(before.result)
    expect(after.reruns).toHaveLength(1)
    const bad = await net.w.agent
      .post(`/api/reviews/${reviewId}/segments/${before.assessmentId}/rerun`)
      .send({ pipe: { ...corrected, cover_m: -1 } })
    expect(bad.status).toBe(400)
    expect(bad.body.error.fields[0].field).toBe('pipe.cover_m')
  })
})

describe('submit without affected owners', () => {
  it('when no pipe is within reach, then the application is ready for decision at once', async () => {
    const applicant = await signedInAgent(app, 'applicant')
    const { box } = await import('../helpers/review-fixtures.ts')
    const { crsTransform } = await import('../../shared/geo/crs.ts')
    const far = crsTransform(25832).toGrid([10.04, 52.551]) as [number, number]
    const id = await submitApplication(applicant.agent, [
      {
        kind: 'fill',
        label: 'Topsoil heap',
        geometry: box(far, 0, 0, 4, 4),
        height_m: 1,
        unitWeight_kN_per_m3: 18,
        duration_days: 5,
      },
    ])
    const a = (await applicant.agent.get(`/api/applications/${id}`)).body
    const open = await OwnerReview.count({
      where: { applicationId: id, state: { [Op.ne]: 'not_affected' } },
    })
    expect(open).toBe(0)
    expect(a.status).toBe('ready_for_decision')
  })
})
