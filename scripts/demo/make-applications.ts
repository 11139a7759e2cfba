/**
 * Writes demo/applications.json: the invented applications of the Wendmoor demo, placed beside
 * the demo pipes (demo/networks/*.geojson) so the screening finds them. Each application says
 * who applies, its dates as days from the day the demo is loaded, its activities as GeoJSON
 * (WGS84), and what happens to it when the demo is loaded (`story`).
 * Usage: node --import tsx scripts/demo/make-applications.ts
 */
import { readFileSync, writeFileSync } from 'node:fs'
import { dirname, join } from 'node:path'
import { fileURLToPath } from 'node:url'
import { crsTransform } from '../../shared/geo/crs.ts'

const demoDir = join(dirname(fileURLToPath(import.meta.url)), '..', '..', 'demo')
const t = crsTransform(25832)

interface PipeFeature {
  properties: { ownerRef: string; street: string; medium: string }
  geometry: { coordinates: [number, number][] }
}

function pipes(file: string): PipeFeature[] {
  const fc = JSON.parse(readFileSync(join(demoDir, 'networks', file), 'utf8')) as {
    features: PipeFeature[]
  }
  return fc.features
}

/**
 * A local frame on the first straight piece of a pipe: `at(s, o)` is the point `s` metres
 * along the pipe from the piece's middle and `o` metres to its left (negative: right).
 */
function frameOn(p: PipeFeature) {
  const [a, b] = [t.toGrid(p.geometry.coordinates[0]!), t.toGrid(p.geometry.coordinates[1]!)]
  const len = Math.hypot(b[0] - a[0], b[1] - a[1])
  const d = [(b[0] - a[0]) / len, (b[1] - a[1]) / len] as const
  const n = [-d[1], d[0]] as const
  const mid = [(a[0] + b[0]) / 2, (a[1] + b[1]) / 2] as const
  const round = (v: number) => Math.round(v * 1e7) / 1e7
  const at = (s: number, o: number): [number, number] => {
    const ll = t.toLonLat([mid[0] + d[0] * s + n[0] * o, mid[1] + d[1] * s + n[1] * o])
    return [round(ll[0]), round(ll[1])]
  }
  /** A rectangle from s0 to s1 along the pipe and from o0 to o1 across it, closed. */
  const rect = (s0: number, s1: number, o0: number, o1: number) => ({
    type: 'Polygon' as const,
    coordinates: [[at(s0, o0), at(s1, o0), at(s1, o1), at(s0, o1), at(s0, o0)]],
  })
  return { at, rect, ref: p.properties.ownerRef, street: p.properties.street }
}

function pipeOn(list: PipeFeature[], street: string, index = 0): PipeFeature {
  const hit = list.filter((p) => p.properties.street === street)[index]
  if (!hit) throw new Error(`no demo pipe on ${street}`)
  return hit
}

const water = pipes('wendmoor-water.geojson')
const gas = pipes('brackenfold-gas.geojson')

const kilnWater = frameOn(pipeOn(water, 'Kiln Street', 3))
const westgate = frameOn(pipeOn(gas, 'Westgate', 0))
const bridgeWater = frameOn(pipeOn(water, 'Bridge Street', 2))
const churchGas = frameOn(pipeOn(gas, 'Church Street', 2))
const ferrierWater = frameOn(pipeOn(water, 'Ferrier Way', 1))

const applications = [
  {
    key: 'kiln-street-connection',
    applicant: 'owen.maddox@halden-pryce.example',
    title: 'New water service connection, 14 Kiln Street',
    siteAddress: '14 Kiln Street, Wendmoor',
    contactName: 'Owen Maddox',
    contactPhone: '+44 1632 960 418',
    startsInDays: 12,
    days: 4,
    description:
      'Service trench from the property boundary to the main, 6 m long, in a trench box; ' +
      'the last metre towards the main is dug by hand.',
    activities: [
      {
        kind: 'excavation',
        label: 'Service trench',
        geometry: kilnWater.rect(-3, 3, 1.4, 2.2),
        depth_m: 1.4,
        support: 'trench-box',
        digging: 'mechanical',
      },
    ],
    story: 'granted',
  },
  {
    key: 'market-place-crane',
    applicant: 'sana.mirfield@skelbrook-cranes.example',
    title: 'Roof plant lift at the Old Maltings, Westgate',
    siteAddress: 'The Old Maltings, Westgate, Wendmoor',
    contactName: 'Sana Mirfield',
    contactPhone: '+44 1632 960 772',
    startsInDays: 20,
    days: 2,
    description:
      'A 130 t mobile crane on four outriggers lifts two air-handling units onto the roof. ' +
      'Outriggers on 1.2 m square timber mats.',
    activities: [
      {
        kind: 'crane',
        label: '130 t mobile crane',
        setup: 'outriggers',
        geometry: {
          type: 'MultiPoint',
          coordinates: [
            westgate.at(-3, 1.2),
            westgate.at(3, 1.2),
            westgate.at(3, 7.2),
            westgate.at(-3, 7.2),
          ],
        },
        legLoad_kN: 850,
        matLength_m: 1.2,
        matWidth_m: 1.2,
        matRotation_deg: 0,
      },
    ],
    story: 'question',
  },
  {
    key: 'westgate-setts-store',
    applicant: 'owen.maddox@halden-pryce.example',
    title: 'Sub-base stockpile for the Westgate resurfacing',
    siteAddress: 'Westgate, verge opposite the Old Maltings, Wendmoor',
    contactName: 'Owen Maddox',
    contactPhone: '+44 1632 960 418',
    startsInDays: 18,
    days: 6,
    description:
      'Crushed stone for the new sub-base, tipped on the verge while the carriageway is ' +
      'relaid, up to 3.0 m high, in the same weeks as other works in Westgate.',
    activities: [
      {
        kind: 'fill',
        label: 'Sub-base stockpile',
        geometry: westgate.rect(3.5, 10, 1, 7),
        height_m: 3.0,
        unitWeight_kN_per_m3: 19,
        duration_days: 6,
      },
    ],
    story: 'submitted',
  },
  {
    key: 'bridge-street-repair',
    applicant: 'owen.maddox@halden-pryce.example',
    title: 'Culvert headwall repair, Bridge Street',
    siteAddress: 'Bridge Street at the mill race, Wendmoor',
    contactName: 'Owen Maddox',
    contactPhone: '+44 1632 960 418',
    startsInDays: 30,
    days: 10,
    description:
      'A deep open excavation beside the culvert to rebuild its headwall; the sides are ' +
      'sloped back, with no support.',
    activities: [
      {
        kind: 'excavation',
        label: 'Headwall excavation',
        geometry: bridgeWater.rect(-4, 4, 0.8, 4),
        depth_m: 3.2,
        support: 'none',
        digging: 'mechanical',
      },
    ],
    story: 'objected',
  },
  {
    key: 'church-street-pad',
    applicant: 'sana.mirfield@skelbrook-cranes.example',
    title: 'Bell frame lift at St Oswin’s, Church Street',
    siteAddress: 'St Oswin’s churchyard gate, Church Street, Wendmoor',
    contactName: 'Sana Mirfield',
    contactPhone: '+44 1632 960 772',
    startsInDays: 40,
    days: 1,
    description: 'A tracked mini crane on one steel pad lifts the new bell frame.',
    activities: [
      {
        kind: 'crane',
        label: 'Mini crane pad',
        setup: 'single-pad',
        geometry: { type: 'Point', coordinates: churchGas.at(0, 4) },
        legLoad_kN: 90,
        matLength_m: 2,
        matWidth_m: 2,
        matRotation_deg: 0,
      },
    ],
    story: 'waiting',
  },
  {
    key: 'ferrier-way-stockpile',
    applicant: 'owen.maddox@halden-pryce.example',
    title: 'Topsoil stockpile for the Ferrier Way estate',
    siteAddress: 'Verge at the end of Ferrier Way, Wendmoor',
    contactName: 'Owen Maddox',
    contactPhone: '+44 1632 960 418',
    startsInDays: 25,
    days: 60,
    description: 'Topsoil from the estate stored for reuse, at most 2.5 m high.',
    activities: [
      {
        kind: 'fill',
        label: 'Topsoil stockpile',
        geometry: ferrierWater.rect(-6, 6, 2, 10),
        height_m: 2.5,
        unitWeight_kN_per_m3: 17,
        duration_days: 60,
      },
    ],
    story: 'draft',
  },
]

const file = join(demoDir, 'applications.json')
writeFileSync(file, JSON.stringify({ applications }, null, 2) + '\n')
console.error(`[make-applications] ${file}: ${applications.length} applications`)
