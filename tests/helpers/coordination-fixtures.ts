import { expect } from 'vitest'
import type { StoredCombinedScreening } from '../../shared/types/coordination.ts'
import { Assessment } from '../../server/models/index.ts'
import { LEG_LOAD_KN, craneAt } from './crane-fixtures.ts'
import { at, reviewIdFor } from './review-fixtures.ts'
import type { TestApp } from './test-app.ts'

type Agent = ReturnType<TestApp['agent']>

/** A crane on one 1.5 m mat centred `dx_m` along the water main, right above it. */
export const craneOver = (origin: [number, number], dx_m: number, load_kN: number) =>
  craneAt(at(origin, dx_m, 0) as [number, number], load_kN)

export { LEG_LOAD_KN }

/** A complete draft with these activities and dates; returns its id. */
export async function draftWorks(
  agent: Agent,
  activities: unknown[],
  startsOn: string,
  endsOn: string,
  title: string,
): Promise<number> {
  const draft = await agent.post('/api/applications').send({
    title,
    siteAddress: '3 Mill Row, Testbury',
    contactName: 'Sam Site',
    contactPhone: '+49 170 1234567',
    startsOn,
    endsOn,
    description: 'Works for the coordination tests.',
    activities,
  })
  expect(draft.status).toBe(201)
  return draft.body.id as number
}

/** Submit a fresh draft (version 0); returns id and reference. */
export async function submitDraft(
  agent: Agent,
  id: number,
): Promise<{ id: number; reference: string }> {
  const res = await agent.post(`/api/applications/${id}/submit`).send({ version: 0 })
  expect(res.status).toBe(200)
  return { id, reference: res.body.reference as string }
}

export async function submitWorks(
  agent: Agent,
  activities: unknown[],
  startsOn: string,
  endsOn: string,
  title: string,
): Promise<{ id: number; reference: string }> {
  return submitDraft(agent, await draftWorks(agent, activities, startsOn, endsOn, title))
}

/** The water owner accepts and the permit office grants; returns the permit id. */
export async function acceptAndGrant(
  ownerAgent: Agent,
  officerAgent: Agent,
  applicationId: number,
): Promise<number> {
  const reviewId = await reviewIdFor(ownerAgent, applicationId)
  const v = (await ownerAgent.get(`/api/reviews/${reviewId}`)).body.review.version
  const decided = await ownerAgent
    .post(`/api/reviews/${reviewId}/decision`)
    .send({ decision: 'accepted', version: v })
  expect(decided.status).toBe(200)
  const draft = await officerAgent.get(
    `/api/permit-office/applications/${applicationId}/decision-draft`,
  )
  const granted = await officerAgent
    .post(`/api/permit-office/applications/${applicationId}/grant`)
    .send({ version: draft.body.version })
  expect(granted.status).toBe(201)
  return granted.body.id as number
}

/** The stored alone and combined result of an application on the water owner's main. */
export async function waterAssessment(applicationId: number, waterOwnerId: number) {
  const row = await Assessment.findOne({
    where: { applicationId, ownerOrganisationId: waterOwnerId },
  })
  expect(row).not.toBeNull()
  const combined = row!.combined
  return {
    verdict: row!.verdict,
    combinedVerdict: row!.combinedVerdict,
    combined: (typeof combined === 'string'
      ? JSON.parse(combined)
      : combined) as StoredCombinedScreening | null,
  }
}
