import { mkdtempSync } from 'node:fs'
import { tmpdir } from 'node:os'
import { join } from 'node:path'
import { addDays, format } from 'date-fns'
import { expect } from 'vitest'
import { crsTransform } from '../../shared/geo/crs.ts'
import {
  featureCollection,
  freeScreeningSpot,
  importFile,
  lineFeature,
  pe100Properties,
} from './network-fixtures.ts'
import { createTestOrganisation, signedInAgent, unique } from './test-app.ts'
import type { TestApp } from './test-app.ts'

const t = crsTransform(25832)

/** Folders for the signing key and the permit PDFs of one test file. */
export function permitDirs(): Record<string, string> {
  const dir = mkdtempSync(join(tmpdir(), 'tw-permits-'))
  return { KEY_DIR: join(dir, 'keys'), PERMIT_DIR: join(dir, 'permits') }
}

export const day = (offset: number) => format(addDays(new Date(), offset), 'yyyy-MM-dd')

/** A lon/lat point `dx_m` east and `dy_m` north of a grid origin. */
export const at = (origin: [number, number], dx_m: number, dy_m: number) =>
  t.toLonLat([origin[0] + dx_m, origin[1] + dy_m])

/** A rectangle (lon/lat polygon) between grid offsets. */
export const box = (origin: [number, number], x0: number, y0: number, x1: number, y1: number) => ({
  type: 'Polygon' as const,
  coordinates: [
    [
      at(origin, x0, y0),
      at(origin, x1, y0),
      at(origin, x1, y1),
      at(origin, x0, y1),
      at(origin, x0, y0),
    ],
  ],
})

/**
 * Two owners with a pipe each at a random spot: a water main along y = 0 and a gas main along
 * y = 200 m (60 m long), with one engineer each, as in the screening tests.
 */
export async function buildTwoOwnerNetwork(app: TestApp) {
  const origin = t.toGrid(await freeScreeningSpot(app.sequelize)) as [number, number]
  const water = await createTestOrganisation('network_owner', unique('Test Water'))
  const gas = await createTestOrganisation('network_owner', unique('Test Gas'))
  await gas.update({ medium: 'gas' })
  const w = await signedInAgent(app, 'asset_engineer', water)
  const g = await signedInAgent(app, 'asset_engineer', gas)
  const wRef = unique('W')
  const gRef = unique('G')
  expect(
    (
      await importFile(
        w.agent,
        featureCollection([
          lineFeature(pe100Properties(wRef), [at(origin, 0, 0), at(origin, 60, 0)]),
        ]),
      )
    ).status,
  ).toBe('committed')
  expect(
    (
      await importFile(
        g.agent,
        featureCollection([
          lineFeature(pe100Properties(gRef, { medium: 'gas', internalPressure_kPa: 400 }), [
            at(origin, 0, 200),
            at(origin, 60, 200),
          ]),
        ]),
      )
    ).status,
  ).toBe('committed')
  return { origin, water, gas, w, g, wRef, gRef }
}

/** A deep pit beside the water main and a crane beside the gas main. */
export function worksNearBoth(origin: [number, number]) {
  return [
    {
      kind: 'excavation',
      label: 'Deep pit',
      geometry: box(origin, 20, 1.5, 24, 4),
      depth_m: 3,
      support: 'none',
      digging: 'mechanical',
    },
    {
      kind: 'crane',
      label: 'Mobile crane',
      setup: 'outriggers',
      geometry: {
        type: 'MultiPoint',
        coordinates: [
          at(origin, 10, 202),
          at(origin, 16, 202),
          at(origin, 10, 208),
          at(origin, 16, 208),
        ],
      },
      legLoad_kN: 400,
      matLength_m: 1.5,
      matWidth_m: 1.5,
      matRotation_deg: 0,
    },
  ]
}

type Agent = ReturnType<TestApp['agent']>

/** Draft and submit; returns the application id. */
export async function submitApplication(
  agent: Agent,
  activities: unknown[],
  title = 'Review test',
) {
  const draft = await agent.post('/api/applications').send({
    title,
    siteAddress: '12 Example Lane, Testbury',
    contactName: 'Sam Site',
    contactPhone: '+49 170 1234567',
    startsOn: day(7),
    endsOn: day(20),
    description: 'Works for the review tests.',
    activities,
  })
  expect(draft.status).toBe(201)
  const res = await agent.post(`/api/applications/${draft.body.id}/submit`).send({ version: 0 })
  expect(res.status).toBe(200)
  return draft.body.id as number
}

/** The id of an owner's review of an application, from the engineer's queue. */
export async function reviewIdFor(agent: Agent, applicationId: number): Promise<number> {
  const q = await agent.get('/api/reviews?state=all&pageSize=500')
  expect(q.status).toBe(200)
  const item = q.body.items.find(
    (r: { applicationId: number }) => r.applicationId === applicationId,
  )
  expect(item).toBeDefined()
  return item.id as number
}
