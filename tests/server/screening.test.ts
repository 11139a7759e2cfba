import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { addDays, format } from 'date-fns'
import { crsTransform } from '../../shared/geo/crs.ts'
import { pipePieces } from '../../shared/geo/pipe-local-frame.ts'
import { toGridActivities, toPieceActivities } from '../../shared/screening/engine-activities.ts'
import { activityInputSchema } from '../../shared/schemas/application.ts'
import { assessPipe, STANDARD_CAUTION } from '../../shared/statics/index.ts'
import { pipeEngineInput } from '../../server/services/pipe-engine-input.ts'
import type { PipeSegmentData } from '../../shared/types/network.ts'
import {
  featureCollection,
  freeScreeningSpot,
  importFile,
  lineFeature,
  pe100Properties,
} from '../helpers/network-fixtures.ts'
import { createTestOrganisation, signedInAgent, startTestApp, unique } from '../helpers/test-app.ts'
import type { TestApp } from '../helpers/test-app.ts'

let app: TestApp
beforeAll(async () => {
  app = await startTestApp()
})
afterAll(async () => {
  await app.close()
})

const t = crsTransform(25832)
const day = (offset: number) => format(addDays(new Date(), offset), 'yyyy-MM-dd')

/** A lon/lat point `dx_m` east and `dy_m` north of a grid origin. */
const at = (origin: [number, number], dx_m: number, dy_m: number) =>
  t.toLonLat([origin[0] + dx_m, origin[1] + dy_m])

/** A rectangle (lon/lat polygon) between grid offsets. */
const box = (origin: [number, number], x0: number, y0: number, x1: number, y1: number) => ({
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
 * A hand-built network of its own at a random spot of the service area: a water main running
 * east along y = 0 and a gas main along y = 200 m, each 60 m long, owned by new organisations.
 */
async function buildNetwork() {
  const origin = t.toGrid(await freeScreeningSpot(app.sequelize)) as [number, number]
  const water = await createTestOrganisation('network_owner', unique('Test Water'))
  const gas = await createTestOrganisation('network_owner', unique('Test Gas'))
  await gas.update({ medium: 'gas' })
  const waterProps = pe100Properties(unique('W'))
  const gasProps = pe100Properties(unique('G'), { medium: 'gas', internalPressure_kPa: 400 })
  const w = await signedInAgent(app, 'asset_engineer', water)
  const g = await signedInAgent(app, 'asset_engineer', gas)
  expect(
    (
      await importFile(
        w.agent,
        featureCollection([lineFeature(waterProps, [at(origin, 0, 0), at(origin, 60, 0)])]),
      )
    ).status,
  ).toBe('committed')
  expect(
    (
      await importFile(
        g.agent,
        featureCollection([lineFeature(gasProps, [at(origin, 0, 200), at(origin, 60, 200)])]),
      )
    ).status,
  ).toBe('committed')
  return { origin, water, gas, waterProps, gasProps }
}

/** What the engine says for these activities beside a straight east-running pipe at y0. */
function expectedVerdict(
  props: Record<string, unknown>,
  activities: unknown[],
  origin: [number, number],
  y0: number,
) {
  const parsed = activities.map((a) => activityInputSchema.parse(a))
  const [piece] = pipePieces([
    [origin[0], origin[1] + y0],
    [origin[0] + 60, origin[1] + y0],
  ])
  const pipe = pipeEngineInput({
    ...props,
    shortTermModulus_MPa: null,
    longTermModulus_MPa: null,
    allowableStress_MPa: null,
    crushingStrength_kN_per_m: null,
    beddingFactor: null,
    crushingSafetyFactor: null,
    deflectionLagFactor: null,
    deflectionLimit_pct: null,
  } as unknown as PipeSegmentData)
  return assessPipe({ pipe, activities: toPieceActivities(toGridActivities(parsed, t), piece!) })
    .verdict
}

async function submit(agent: ReturnType<TestApp['agent']>, activities: unknown[]) {
  const draft = await agent.post('/api/applications').send({
    title: 'Screening test',
    siteAddress: 'Test site',
    contactName: 'Sam Site',
    contactPhone: '+49 170 1234567',
    startsOn: day(7),
    endsOn: day(9),
    description: 'Works for the screening test.',
    activities,
  })
  expect(draft.status).toBe(201)
  const res = await agent.post(`/api/applications/${draft.body.id}/submit`).send({ version: 0 })
  expect(res.status).toBe(200)
  return draft.body.id as number
}

describe('screening on submit', () => {
  it('when a deep pit lies beside the water main and far from the gas main, then only water is affected', async () => {
    const net = await buildNetwork()
    const applicant = await signedInAgent(app, 'applicant')
    // 3 m deep unsupported pit 1.5 m north of the water main's axis.
    const pit = {
      kind: 'excavation',
      label: 'Deep pit',
      geometry: box(net.origin, 20, 1.5, 24, 4),
      depth_m: 3,
      support: 'none',
      digging: 'mechanical',
    }
    const id = await submit(applicant.agent, [pit])
    const res = await applicant.agent.get(`/api/applications/${id}/screening`)
    expect(res.status).toBe(200)
    const water = res.body.owners.find(
      (o: { organisation: { id: number } }) => o.organisation.id === net.water.id,
    )
    const gas = res.body.owners.find(
      (o: { organisation: { id: number } }) => o.organisation.id === net.gas.id,
    )
    expect(gas).toEqual({
      organisation: { id: net.gas.id, name: net.gas.name, medium: 'gas' },
      verdict: 'not-affected',
      affected: [],
    })
    expect(water.affected).toHaveLength(1)
    expect(water.affected[0].verdict).toBe(expectedVerdict(net.waterProps, [pit], net.origin, 0))
    expect(water.affected[0].distance_m).toBeCloseTo(1.5, 1)
    expect(res.body.caution).toBe(STANDARD_CAUTION)
    expect(res.body.influenceZones).toHaveLength(1)
  })

  it('when an excavation crosses the water main, then it is included and the exposed span is named', async () => {
    const net = await buildNetwork()
    const applicant = await signedInAgent(app, 'applicant')
    const trench = {
      kind: 'excavation',
      label: 'Crossing trench',
      geometry: box(net.origin, 30, -3, 31.2, 3),
      depth_m: 2,
      support: 'trench-box',
      digging: 'mechanical',
    }
    const id = await submit(applicant.agent, [trench])
    const res = await applicant.agent.get(`/api/applications/${id}/screening`)
    const water = res.body.owners.find(
      (o: { organisation: { id: number } }) => o.organisation.id === net.water.id,
    )
    expect(water.affected).toHaveLength(1)
    expect(water.affected[0].distance_m).toBe(0)
    expect(water.affected[0].verdict).toBe(expectedVerdict(net.waterProps, [trench], net.origin, 0))
    expect(water.affected[0].rulesApplied.join(' ')).toMatch(/exposes the pipe/)
  })

  it('when a crane stands beside the gas main, then the gas owner is affected and water is not', async () => {
    const net = await buildNetwork()
    const applicant = await signedInAgent(app, 'applicant')
    const crane = {
      kind: 'crane',
      label: 'Mobile crane',
      setup: 'outriggers',
      geometry: {
        type: 'MultiPoint',
        coordinates: [
          at(net.origin, 10, 202),
          at(net.origin, 16, 202),
          at(net.origin, 10, 208),
          at(net.origin, 16, 208),
        ],
      },
      legLoad_kN: 400,
      matLength_m: 1.5,
      matWidth_m: 1.5,
      matRotation_deg: 0,
    }
    const id = await submit(applicant.agent, [crane])
    const res = await applicant.agent.get(`/api/applications/${id}/screening`)
    const water = res.body.owners.find(
      (o: { organisation: { id: number } }) => o.organisation.id === net.water.id,
    )
    const gas = res.body.owners.find(
      (o: { organisation: { id: number } }) => o.organisation.id === net.gas.id,
    )
    expect(water.verdict).toBe('not-affected')
    expect(gas.affected).toHaveLength(1)
    expect(gas.affected[0].verdict).toBe(expectedVerdict(net.gasProps, [crane], net.origin, 200))
    // No design data leaves the server for the applicant.
    expect(JSON.stringify(gas)).not.toMatch(/outerDiameter|wallThickness|sidefillModulus|PE100/)
  })

  it('when another contractor asks for the screening, then it responds 404', async () => {
    const applicant = await signedInAgent(app, 'applicant')
    const other = await signedInAgent(app, 'applicant')
    const id = await submit(applicant.agent, [
      {
        kind: 'fill',
        label: 'Spoil heap',
        geometry: box(t.toGrid([9.99, 52.64]) as [number, number], 0, 0, 5, 5),
        height_m: 1.5,
        unitWeight_kN_per_m3: 18,
        duration_days: 10,
      },
    ])
    expect((await other.agent.get(`/api/applications/${id}/screening`)).status).toBe(404)
  })
})
