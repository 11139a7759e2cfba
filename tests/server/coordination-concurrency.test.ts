import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { addDays, parseISO } from 'date-fns'
import { AuditEvent, Permit } from '../../server/models/index.ts'
import { expirePermit } from '../../server/services/permit-expiry.ts'
import {
  LEG_LOAD_KN,
  acceptAndGrant,
  craneOver,
  draftWorks,
  submitDraft,
  submitWorks,
  waterAssessment,
} from '../helpers/coordination-fixtures.ts'
import { buildTwoOwnerNetwork, day, permitDirs } from '../helpers/review-fixtures.ts'
import { signedInAgent, startTestApp } from '../helpers/test-app.ts'
import type { TestApp } from '../helpers/test-app.ts'

// Issue 7: combined screening must not depend on who commits first, and expired works drop out.
// The crane loads are those of coordination-screening.test.ts, where the engine itself shows
// each crane clear alone and the two together critical.

let app: TestApp
beforeAll(async () => {
  app = await startTestApp({ ...permitDirs(), LOG_LEVEL: 'error' })
})
afterAll(async () => {
  await app.close()
})

describe('combined screening under concurrent submissions', () => {
  it('when two applications beside one pipe are submitted at the same moment, then each assessment combines the other', async () => {
    for (let round = 0; round < 3; round++) {
      const net = await buildTwoOwnerNetwork(app)
      const first = await signedInAgent(app, 'applicant')
      const second = await signedInAgent(app, 'applicant')
      const aId = await draftWorks(
        first.agent,
        [craneOver(net.origin, 20, LEG_LOAD_KN)],
        day(7),
        day(12),
        'Parallel crane A',
      )
      const bId = await draftWorks(
        second.agent,
        [craneOver(net.origin, 21.6, LEG_LOAD_KN)],
        day(10),
        day(14),
        'Parallel crane B',
      )
      const [a, b] = await Promise.all([
        submitDraft(first.agent, aId),
        submitDraft(second.agent, bId),
      ])
      const aRow = await waterAssessment(a.id, net.water.id)
      const bRow = await waterAssessment(b.id, net.water.id)
      expect(aRow.combinedVerdict).toBe('critical')
      expect(aRow.combined!.worst).toMatchObject({
        from: day(10),
        to: day(12),
        applicationIds: [b.id],
      })
      expect(bRow.combinedVerdict).toBe('critical')
      expect(bRow.combined!.worst).toMatchObject({
        from: day(10),
        to: day(12),
        applicationIds: [a.id],
      })
    }
  })
})

describe('nightly expiry of permits', () => {
  it('when a granted permit expires, then its works drop out of the combined results of the others', async () => {
    const net = await buildTwoOwnerNetwork(app)
    const first = await signedInAgent(app, 'applicant')
    const second = await signedInAgent(app, 'applicant')
    const officer = await signedInAgent(app, 'permit_officer')
    const a = await submitWorks(
      first.agent,
      [craneOver(net.origin, 20, LEG_LOAD_KN)],
      day(7),
      day(12),
      'Expiring crane A',
    )
    const permitId = await acceptAndGrant(net.w.agent, officer.agent, a.id)
    const b = await submitWorks(
      second.agent,
      [craneOver(net.origin, 21.6, LEG_LOAD_KN)],
      day(10),
      day(14),
      'Later crane B',
    )
    expect((await waterAssessment(b.id, net.water.id)).combined!.worst).toMatchObject({
      from: day(10),
      to: day(12),
      applicationIds: [a.id],
    })

    // The night after A's last day (day 12): A's permit expires; B runs on alone.
    const night = parseISO(`${day(13)}T02:00:00`)
    // Not yet due the night before.
    const before = addDays(night, -1)
    expect(await expirePermit(app.sequelize, permitId, before)).toBe(false)
    expect((await waterAssessment(b.id, net.water.id)).combinedVerdict).toBe('critical')

    expect(await expirePermit(app.sequelize, permitId, night)).toBe(true)
    expect((await Permit.findByPk(permitId))!.status).toBe('expired')
    expect(await waterAssessment(b.id, net.water.id)).toEqual({
      verdict: 'clear',
      combinedVerdict: null,
      combined: null,
    })
    const audit = await AuditEvent.findOne({
      where: { action: 'permit-expired', entityType: 'permit', entityId: String(permitId) },
    })
    expect(audit).not.toBeNull()
    // A second run does nothing.
    expect(await expirePermit(app.sequelize, permitId, night)).toBe(false)
  })
})
