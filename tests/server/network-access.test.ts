import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { declaredAccess } from '../../server/middleware/access.ts'
import { networkRouter } from '../../server/routes/network.ts'
import type { Role } from '../../shared/types/roles.ts'
import { signedInAgent, startTestApp } from '../helpers/test-app.ts'
import type { TestApp } from '../helpers/test-app.ts'
import {
  featureCollection,
  importFile,
  lineFeature,
  lineNear,
  pe100Properties,
  randomSpot,
} from '../helpers/network-fixtures.ts'

// Data protection (issue 4): an owner's design data are for that owner's engineers (and admins
// to read). Everyone signed in sees the outline only. Other owners get 404 on details, so the
// existence of another owner's records does not leak.

let app: TestApp
type Agent = Awaited<ReturnType<typeof signedInAgent>>['agent']
type Who = 'owner' | 'otherOwner' | 'admin' | 'applicant' | 'permit_officer' | 'nobody'
const agents = {} as Record<Who, Agent>
let segmentId = 0
let importId = 0
let bbox = ''
let ownerName = ''

beforeAll(async () => {
  app = await startTestApp()
  const owner = await signedInAgent(app, 'asset_engineer')
  agents.owner = owner.agent
  ownerName = owner.organisation.name
  agents.otherOwner = (await signedInAgent(app, 'asset_engineer')).agent
  for (const role of ['admin', 'applicant', 'permit_officer'] as Role[])
    agents[role as Who] = (await signedInAgent(app, role)).agent
  agents.nobody = app.agent()
  const spot = randomSpot()
  bbox = [spot[0] - 0.001, spot[1] - 0.001, spot[0] + 0.001, spot[1] + 0.001].join(',')
  const job = await importFile(
    owner.agent,
    featureCollection([lineFeature(pe100Properties('ACCESS-1'), lineNear(0, spot))]),
  )
  importId = job.id as number
  segmentId = (await owner.agent.get('/api/network/segments')).body.items[0].id
})
afterAll(async () => {
  await app.close()
})

interface RouteCase {
  method: 'get' | 'post' | 'patch' | 'put'
  path: () => string
  body?: () => unknown
  expected: Record<Who, number>
}

const file = () => featureCollection([lineFeature(pe100Properties('UP-1'), lineNear(0))])
const MATRIX: RouteCase[] = [
  {
    method: 'get',
    path: () => `/api/network/outline?bbox=${bbox}`,
    expected: {
      owner: 200,
      otherOwner: 200,
      admin: 200,
      applicant: 200,
      permit_officer: 200,
      nobody: 401,
    },
  },
  {
    method: 'get',
    path: () => `/api/network/map-lines?zoom=16&bbox=${bbox}`,
    expected: {
      owner: 200,
      otherOwner: 200,
      admin: 200,
      applicant: 403,
      permit_officer: 403,
      nobody: 401,
    },
  },
  {
    method: 'get',
    path: () => '/api/network/segments',
    expected: {
      owner: 200,
      otherOwner: 200,
      admin: 200,
      applicant: 403,
      permit_officer: 403,
      nobody: 401,
    },
  },
  {
    method: 'get',
    path: () => `/api/network/segments/${segmentId}`,
    expected: {
      owner: 200,
      otherOwner: 404,
      admin: 200,
      applicant: 403,
      permit_officer: 403,
      nobody: 401,
    },
  },
  // A stale version: the owner passes the access rules and meets the optimistic lock (409).
  {
    method: 'patch',
    path: () => `/api/network/segments/${segmentId}`,
    body: () => ({ version: 999 }),
    expected: {
      owner: 409,
      otherOwner: 404,
      admin: 403,
      applicant: 403,
      permit_officer: 403,
      nobody: 401,
    },
  },
  {
    method: 'get',
    path: () => '/api/network/export',
    expected: {
      owner: 200,
      otherOwner: 200,
      admin: 200,
      applicant: 403,
      permit_officer: 403,
      nobody: 401,
    },
  },
  {
    method: 'get',
    path: () => '/api/network/mapping',
    expected: {
      owner: 200,
      otherOwner: 200,
      admin: 403,
      applicant: 403,
      permit_officer: 403,
      nobody: 401,
    },
  },
  {
    method: 'put',
    path: () => '/api/network/mapping',
    body: () => ({}),
    expected: {
      owner: 200,
      otherOwner: 200,
      admin: 403,
      applicant: 403,
      permit_officer: 403,
      nobody: 401,
    },
  },
  {
    method: 'get',
    path: () => '/api/network/imports',
    expected: {
      owner: 200,
      otherOwner: 200,
      admin: 200,
      applicant: 403,
      permit_officer: 403,
      nobody: 401,
    },
  },
  {
    method: 'get',
    path: () => `/api/network/imports/${importId}`,
    expected: {
      owner: 200,
      otherOwner: 404,
      admin: 200,
      applicant: 403,
      permit_officer: 403,
      nobody: 401,
    },
  },
  {
    method: 'get',
    path: () => `/api/network/imports/${importId}/preview`,
    expected: {
      owner: 200,
      otherOwner: 404,
      admin: 403,
      applicant: 403,
      permit_officer: 403,
      nobody: 401,
    },
  },
  {
    method: 'get',
    path: () => `/api/network/imports/${importId}/report`,
    expected: {
      owner: 200,
      otherOwner: 404,
      admin: 200,
      applicant: 403,
      permit_officer: 403,
      nobody: 401,
    },
  },
  // The job is committed: the owner passes access and meets the state rule (409 / 422).
  {
    method: 'post',
    path: () => `/api/network/imports/${importId}/validate`,
    body: () => ({}),
    expected: {
      owner: 409,
      otherOwner: 404,
      admin: 403,
      applicant: 403,
      permit_officer: 403,
      nobody: 401,
    },
  },
  {
    method: 'post',
    path: () => `/api/network/imports/${importId}/commit`,
    body: () => ({ skipInvalid: true }),
    expected: {
      owner: 422,
      otherOwner: 404,
      admin: 403,
      applicant: 403,
      permit_officer: 403,
      nobody: 401,
    },
  },
]

describe('network routes: who may call what', () => {
  for (const route of MATRIX) {
    for (const who of Object.keys(route.expected) as Who[]) {
      it(`when ${who} calls ${route.method.toUpperCase()} ${route
        .path()
        .replace(/\d{2,}/g, ':id')
        .replace(/bbox=[^&]*/, 'bbox=...')}, then it responds ${route.expected[who]}`, async () => {
        const req = agents[who][route.method](route.path())
        const res = route.body ? await req.send(route.body() as object) : await req
        expect(res.status).toBe(route.expected[who])
      })
    }
  }

  for (const who of [
    'owner',
    'otherOwner',
    'admin',
    'applicant',
    'permit_officer',
    'nobody',
  ] as Who[]) {
    it(`when ${who} uploads an import, then it responds ${who === 'owner' || who === 'otherOwner' ? 201 : who === 'nobody' ? 401 : 403}`, async () => {
      const res = await agents[who]
        .post('/api/network/imports')
        .attach('file', Buffer.from(file()), 'n.geojson')
      expect(res.status).toBe(
        who === 'owner' || who === 'otherOwner' ? 201 : who === 'nobody' ? 401 : 403,
      )
    })
  }

  it("when another owner lists, exports or lists imports, then none of the first owner's records appear", async () => {
    const list = await agents.otherOwner.get('/api/network/segments')
    expect(list.body.items.map((i: { ownerRef: string }) => i.ownerRef)).not.toContain('ACCESS-1')
    const exp = await agents.otherOwner
      .get('/api/network/export')
      .buffer(true)
      .parse((r, cb) => {
        let t = ''
        r.on('data', (c: Buffer) => (t += c.toString()))
        r.on('end', () => cb(null, t))
      })
    expect(
      JSON.parse(exp.body as unknown as string).features.map(
        (f: { properties: { ownerRef: string } }) => f.properties.ownerRef,
      ),
    ).not.toContain('ACCESS-1')
    const jobs = await agents.otherOwner.get('/api/network/imports')
    expect(jobs.body.items.map((j: { id: number }) => j.id)).not.toContain(importId)
  })

  it('when an applicant or permit officer reads the outline, then the segment shows with owner and medium only', async () => {
    for (const who of ['applicant', 'permit_officer'] as Who[]) {
      const res = await agents[who].get(`/api/network/outline?bbox=${bbox}`)
      const f = res.body.features.find((x: { id: number }) => x.id === segmentId)
      expect(f).toEqual({
        type: 'Feature',
        id: segmentId,
        properties: { ownerName, medium: 'water' },
        geometry: { type: 'LineString', coordinates: expect.any(Array) },
      })
    }
  })

  it('declares its access on every route with allow(...) as the first handler', () => {
    const stack = (
      networkRouter(app.sequelize) as unknown as {
        stack: { route?: { path: string; stack: { handle: unknown }[] } }[]
      }
    ).stack
    const routes = stack.filter((l) => l.route)
    expect(routes.length).toBe(15)
    for (const l of routes)
      expect(declaredAccess(l.route!.stack[0]!.handle), l.route!.path).toBeDefined()
  })
})
