import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { crsTransform } from '../../shared/geo/crs.ts'
import { pipePieces } from '../../shared/geo/pipe-local-frame.ts'
import { activityInputSchema } from '../../shared/schemas/application.ts'
import { combinedActivityId } from '../../shared/screening/combined-screening.ts'
import { toGridActivities, toPieceActivities } from '../../shared/screening/engine-activities.ts'
import { assessPipe } from '../../shared/statics/index.ts'
import type { Verdict } from '../../shared/statics/types.ts'
import type { PipeSegmentData } from '../../shared/types/network.ts'
import { OutboxMail } from '../../server/models/index.ts'
import { pipeEngineInput } from '../../server/services/pipe-engine-input.ts'
import { pe100Properties } from '../helpers/network-fixtures.ts'
import {
  LEG_LOAD_KN,
  craneOver,
  submitWorks,
  waterAssessment,
} from '../helpers/coordination-fixtures.ts'
import { buildTwoOwnerNetwork, day, permitDirs, reviewIdFor } from '../helpers/review-fixtures.ts'
import { signedInAgent, startTestApp } from '../helpers/test-app.ts'
import type { TestApp } from '../helpers/test-app.ts'

// Issue 7: works that are each acceptable alone can together overload a pipe.

let app: TestApp
beforeAll(async () => {
  app = await startTestApp({ ...permitDirs(), LOG_LEVEL: 'error' })
})
afterAll(async () => {
  await app.close()
})

const t = crsTransform(25832)

/** The engine's verdict for the water main (PE100 fixture, along y = 0, 60 m) with these sets. */
function engineVerdict(origin: [number, number], sets: unknown[][]): Verdict {
  const [piece] = pipePieces([origin, [origin[0] + 60, origin[1]]])
  const pipe = pipeEngineInput({
    ...pe100Properties('X'),
    shortTermModulus_MPa: null,
    longTermModulus_MPa: null,
    allowableStress_MPa: null,
    crushingStrength_kN_per_m: null,
    beddingFactor: null,
    crushingSafetyFactor: null,
    deflectionLagFactor: null,
    deflectionLimit_pct: null,
  } as unknown as PipeSegmentData)
  const activities = sets.flatMap((set, k) =>
    toPieceActivities(
      toGridActivities(
        set.map((a) => activityInputSchema.parse(a)),
        t,
      ),
      piece!,
    ).map((a) => (k === 0 ? a : { ...a, id: combinedActivityId(k, a.id) })),
  )
  return assessPipe({ pipe, activities }).verdict
}

describe('combined screening of concurrent works', () => {
  it('when two cranes stand beside the same main with overlapping dates, then each is clear alone, critical together in the overlap only; moving the dates apart and withdrawing clear it again', async () => {
    const net = await buildTwoOwnerNetwork(app)
    const craneA = craneOver(net.origin, 20, LEG_LOAD_KN)
    const craneB = craneOver(net.origin, 21.6, LEG_LOAD_KN)
    // Preconditions from the engine itself, so the loads are not guessed.
    expect(engineVerdict(net.origin, [[craneA]])).toBe('clear')
    expect(engineVerdict(net.origin, [[craneB]])).toBe('clear')
    expect(engineVerdict(net.origin, [[craneB], [craneA]])).toBe('critical')

    const first = await signedInAgent(app, 'applicant')
    const second = await signedInAgent(app, 'applicant')
    const officer = await signedInAgent(app, 'permit_officer')

    // A alone: nothing else on this main, so no combined result.
    const a = await submitWorks(first.agent, [craneA], day(7), day(12), 'Crane lift A')
    expect(await waterAssessment(a.id, net.water.id)).toEqual({
      verdict: 'clear',
      combinedVerdict: null,
      combined: null,
    })

    // B overlaps A on days 10 to 12.
    const b = await submitWorks(second.agent, [craneB], day(10), day(14), 'Crane lift B')
    const bRow = await waterAssessment(b.id, net.water.id)
    expect(bRow.verdict).toBe('clear')
    expect(bRow.combinedVerdict).toBe('critical')
    expect(bRow.combined!.worst).toMatchObject({
      from: day(10),
      to: day(12),
      applicationIds: [a.id],
      verdict: 'critical',
    })
    // Only the overlap was run; days 13-14 are B alone.
    expect(bRow.combined!.runs.map((r) => [r.from, r.to, r.applicationIds])).toEqual([
      [day(10), day(12), [a.id]],
    ])
    // The stored engine input holds both cranes, A's under its marked id.
    expect(bRow.combined!.engineInput.activities.map((x) => x.id).sort()).toEqual(
      ['Mobile crane', combinedActivityId(a.id, 'Mobile crane')].sort(),
    )
    expect(assessPipe(bRow.combined!.engineInput).verdict).toBe('critical')

    // A was re-screened when B arrived, on the shared segment.
    const aRow = await waterAssessment(a.id, net.water.id)
    expect(aRow.verdict).toBe('clear')
    expect(aRow.combinedVerdict).toBe('critical')
    expect(aRow.combined!.worst).toMatchObject({
      from: day(10),
      to: day(12),
      applicationIds: [b.id],
    })

    // The applicant of B reads a plain statement that names A only by reference, dates and kind.
    const view = await second.agent.get(`/api/applications/${b.id}/screening`)
    expect(view.status).toBe(200)
    const water = view.body.owners.find(
      (o: { organisation: { id: number } }) => o.organisation.id === net.water.id,
    )
    expect(water.affected[0].verdict).toBe('clear')
    // What counts for the owner and the whole application is the worse of alone and together.
    expect(water.verdict).toBe('critical')
    expect(view.body.verdict).toBe('critical')
    expect(water.affected[0].combined).toEqual({
      verdictAlone: 'clear',
      verdictCombined: 'critical',
      from: day(10),
      to: day(12),
      withWorks: [
        {
          applicationId: a.id,
          reference: a.reference,
          from: day(7),
          to: day(12),
          activityKinds: ['crane'],
        },
      ],
      statement: expect.stringMatching(
        new RegExp(
          `^Together with ${a.reference} \\(crane, .+\\) the result for this water pipe becomes critical .+\\(alone it is clear\\)\\.$`,
        ),
      ),
    })
    expect(JSON.stringify(view.body)).not.toContain('Crane lift A')

    // The owner's review shows it too, with the engine record of the combined run.
    const reviewId = await reviewIdFor(net.w.agent, b.id)
    const review = await net.w.agent.get(`/api/reviews/${reviewId}`)
    expect(review.status).toBe(200)
    expect(review.body.segments[0].combined).toMatchObject({
      verdictCombined: 'critical',
      result: { verdict: 'critical' },
    })

    // The officer's clash list shows the pair once, with owner, medium, period and reason.
    const clashes = await officer.agent.get(
      `/api/coordination/clashes?from=${day(0)}&to=${day(30)}`,
    )
    expect(clashes.status).toBe(200)
    const mine = clashes.body.items.filter(
      (c: { kind: string; applications: { applicationId: number }[] }) =>
        c.kind === 'combined-load' && c.applications.some((x) => x.applicationId === a.id),
    )
    // The segment's line comes along for the works map: the 60 m main, in lon/lat.
    expect(mine[0].segment.geometry.coordinates).toHaveLength(2)
    expect(mine).toEqual([
      {
        kind: 'combined-load',
        from: day(10),
        to: day(12),
        applications: [
          {
            applicationId: a.id,
            reference: a.reference,
            title: 'Crane lift A',
            status: 'with_owners',
            startsOn: day(7),
            endsOn: day(12),
          },
          {
            applicationId: b.id,
            reference: b.reference,
            title: 'Crane lift B',
            status: 'with_owners',
            startsOn: day(10),
            endsOn: day(14),
          },
        ],
        segment: {
          id: expect.any(Number),
          owner: { id: net.water.id, name: net.water.name },
          medium: 'water',
          geometry: { type: 'LineString', coordinates: expect.any(Array) },
        },
        verdictAlone: 'clear',
        verdictCombined: 'critical',
        reason: expect.stringMatching(
          /each clear alone, but together they make the result .+ critical/,
        ),
      },
    ])

    // C: the same crane as B with dates moved apart from A: clear, nothing combined.
    const third = await signedInAgent(app, 'applicant')
    const c = await submitWorks(third.agent, [craneB], day(20), day(24), 'Crane lift C')
    expect(await waterAssessment(c.id, net.water.id)).toEqual({
      verdict: 'clear',
      combinedVerdict: null,
      combined: null,
    })

    // B withdraws: A's combined result returns to A alone.
    const w = await second.agent
      .post(`/api/applications/${b.id}/withdraw`)
      .send({ reason: 'Moved' })
    expect(w.status).toBe(200)
    expect(await waterAssessment(a.id, net.water.id)).toEqual({
      verdict: 'clear',
      combinedVerdict: null,
      combined: null,
    })
    const after = await officer.agent.get(`/api/coordination/clashes?from=${day(0)}&to=${day(30)}`)
    expect(
      after.body.items.filter((x: { applications: { applicationId: number }[] }) =>
        x.applications.some((y) => y.applicationId === a.id),
      ),
    ).toEqual([])
  })

  it('when new works make a granted permit critical, then the permit office and the owner are mailed, and a revocation re-screens the other', async () => {
    const net = await buildTwoOwnerNetwork(app)
    const first = await signedInAgent(app, 'applicant')
    const second = await signedInAgent(app, 'applicant')
    const officer = await signedInAgent(app, 'permit_officer')
    const a = await submitWorks(
      first.agent,
      [craneOver(net.origin, 20, LEG_LOAD_KN)],
      day(7),
      day(12),
      'Crane lift A',
    )
    // The water owner accepts; gas is not affected. The office grants.
    const reviewId = await reviewIdFor(net.w.agent, a.id)
    const v = (await net.w.agent.get(`/api/reviews/${reviewId}`)).body.review.version
    expect(
      (
        await net.w.agent
          .post(`/api/reviews/${reviewId}/decision`)
          .send({ decision: 'accepted', version: v })
      ).status,
    ).toBe(200)
    const draft = await officer.agent.get(`/api/permit-office/applications/${a.id}/decision-draft`)
    const granted = await officer.agent
      .post(`/api/permit-office/applications/${a.id}/grant`)
      .send({ version: draft.body.version })
    expect(granted.status).toBe(201)

    const b = await submitWorks(
      second.agent,
      [craneOver(net.origin, 21.6, LEG_LOAD_KN)],
      day(9),
      day(10),
      'Crane lift B',
    )
    const mails = await OutboxMail.findAll({
      where: { relatedType: 'application', relatedId: String(a.id) },
    })
    const worsened = mails.filter((m) => /make a pipe result worse/.test(m.subject))
    // One mail per person: the officers and the water owner's engineer, once each.
    const addresses = worsened.map((m) => m.toAddress)
    expect(addresses).toEqual(expect.arrayContaining([officer.email, net.w.email]))
    expect(new Set(addresses).size).toBe(addresses.length)
    expect(worsened[0]!.textBody).toContain(`Together with ${b.reference} (crane, `)
    expect(worsened[0]!.textBody).toMatch(/gives critical instead of clear/)
    expect((await waterAssessment(a.id, net.water.id)).combined!.worst).toMatchObject({
      from: day(9),
      to: day(10),
      applicationIds: [b.id],
    })

    // Revoking A re-screens B: nothing else is left on the main.
    const permitId = granted.body.id as number
    const revoked = await officer.agent
      .post(`/api/permits/${permitId}/revoke`)
      .send({ reason: 'Works moved to another site.' })
    expect(revoked.status).toBe(200)
    expect(await waterAssessment(b.id, net.water.id)).toEqual({
      verdict: 'clear',
      combinedVerdict: null,
      combined: null,
    })
  })
})
