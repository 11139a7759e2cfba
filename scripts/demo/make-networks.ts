/**
 * Generates the invented pipe networks of the demo town from its streets (demo/streets.geojson):
 * a water network and a few sewers of Wendmoor Water, and a gas network of Brackenfold Gas
 * Networks, laid parallel to each street (water on one side, gas on the other, sewers on the
 * street axis), cut into segments of 50–110 m, with plausible design data per material and
 * street. Deterministic: a seeded pseudo-random generator, so the committed files only change
 * when this script does. Writes demo/networks/*.geojson.
 * Usage: node --import tsx scripts/demo/make-networks.ts
 */
import { readFileSync, writeFileSync } from 'node:fs'
import { dirname, join } from 'node:path'
import { fileURLToPath } from 'node:url'
import { crsTransform } from '../../shared/geo/crs.ts'

type XY = [number, number]
interface Street {
  properties: { name: string; category: 'main' | 'local' | 'lane' }
  geometry: { coordinates: number[][] }
}

const root = join(dirname(fileURLToPath(import.meta.url)), '..', '..')
const EPSG = 25832
const t = crsTransform(EPSG)

// mulberry32: small, seedable, good enough for invented data.
function rng(seed: number) {
  return () => {
    seed = (seed + 0x6d2b79f5) | 0
    let v = Math.imul(seed ^ (seed >>> 15), 1 | seed)
    v = (v + Math.imul(v ^ (v >>> 7), 61 | v)) ^ v
    return ((v ^ (v >>> 14)) >>> 0) / 4294967296
  }
}
const r = rng(52_600_995)
const pick = <T>(xs: readonly T[]): T => xs[Math.floor(r() * xs.length)]!
const between = (a: number, b: number, digits = 2) => Number((a + r() * (b - a)).toFixed(digits))

/** The polyline moved sideways by `offset_m` (left of the direction of travel is positive). */
function offsetLine(line: XY[], offset_m: number): XY[] {
  return line.map((p, i) => {
    const a = line[Math.max(0, i - 1)]!
    const b = line[Math.min(line.length - 1, i + 1)]!
    const dx = b[0] - a[0]
    const dy = b[1] - a[1]
    const len = Math.hypot(dx, dy) || 1
    return [p[0] - (dy / len) * offset_m, p[1] + (dx / len) * offset_m]
  })
}

/** Cut a polyline into pieces of roughly 50-110 m (segment ends at valves and fittings). */
function cut(line: XY[]): XY[][] {
  const pieces: XY[][] = []
  let current: XY[] = [line[0]!]
  let target = between(50, 110, 1)
  let run = 0
  for (let i = 1; i < line.length; i++) {
    let a = line[i - 1]!
    const b = line[i]!
    let left = Math.hypot(b[0] - a[0], b[1] - a[1])
    while (run + left > target && left > 0) {
      const f = (target - run) / left
      const p: XY = [a[0] + (b[0] - a[0]) * f, a[1] + (b[1] - a[1]) * f]
      current.push(p)
      pieces.push(current)
      current = [p]
      left -= target - run
      a = p
      run = 0
      target = between(50, 110, 1)
    }
    current.push(b)
    run += left
  }
  // A short tail joins the previous piece rather than standing alone.
  if (run < 15 && pieces.length) pieces[pieces.length - 1]!.push(...current.slice(1))
  else if (current.length > 1) pieces.push(current)
  return pieces
}

const soil = () =>
  pick([
    {
      wallFrictionKMu: 0.165,
      backfillUnitWeight_kN_per_m3: 19,
      frictionAngle_deg: 32,
      sidefillModulus_MPa: 6.9,
    },
    {
      wallFrictionKMu: 0.15,
      backfillUnitWeight_kN_per_m3: 19.5,
      frictionAngle_deg: 30,
      sidefillModulus_MPa: 5,
    },
    {
      wallFrictionKMu: 0.13,
      backfillUnitWeight_kN_per_m3: 20,
      frictionAngle_deg: 27.5,
      sidefillModulus_MPa: 3,
    },
  ])
const TRAFFIC_kPa = { main: 25, local: 15, lane: 8 } as const

function waterPipe(category: Street['properties']['category']) {
  if (category === 'main') {
    const dn = pick([
      { outerDiameter_m: 0.222, wallThickness_m: 0.0064 },
      { outerDiameter_m: 0.326, wallThickness_m: 0.0072 },
    ])
    return {
      material: 'ductile-iron',
      ...dn,
      internalPressure_kPa: 800,
      yearLaid: Math.floor(between(1962, 1992, 0)),
      quality: 'digitised' as const,
      accuracy: 0.5,
    }
  }
  if (category === 'local' || r() < 0.5) {
    const od = pick([0.125, 0.16, 0.2])
    return {
      material: 'PE100',
      outerDiameter_m: od,
      wallThickness_m: Number((od / 11).toFixed(4)),
      internalPressure_kPa: 700,
      yearLaid: Math.floor(between(1996, 2022, 0)),
      quality: 'surveyed' as const,
      accuracy: 0.1,
    }
  }
  return {
    material: 'PVC-U',
    outerDiameter_m: 0.11,
    wallThickness_m: 0.0053,
    internalPressure_kPa: 600,
    yearLaid: Math.floor(between(1972, 1994, 0)),
    quality: 'digitised' as const,
    accuracy: 1,
  }
}

function gasPipe(category: Street['properties']['category']) {
  if (category === 'main' && r() < 0.6) {
    return {
      material: 'steel',
      outerDiameter_m: 0.2191,
      wallThickness_m: 0.0059,
      internalPressure_kPa: 400,
      yearLaid: Math.floor(between(1958, 1978, 0)),
      quality: 'digitised' as const,
      accuracy: 0.5,
    }
  }
  const od = category === 'lane' ? 0.063 : pick([0.125, 0.18])
  return {
    material: 'PE100',
    outerDiameter_m: od,
    wallThickness_m: Number((od / 11).toFixed(4)),
    internalPressure_kPa: 400,
    yearLaid: Math.floor(between(1990, 2023, 0)),
    quality: 'surveyed' as const,
    accuracy: 0.1,
  }
}

function sewerPipe() {
  if (r() < 0.5) {
    // Concrete DN 600: three-edge-bearing strength of a 135 kN/m² class, 135 · 0.6 = 81 kN/m.
    return {
      material: 'concrete',
      outerDiameter_m: 0.72,
      wallThickness_m: 0.06,
      crushingStrength_kN_per_m: 81,
      beddingFactor: 1.9,
      yearLaid: Math.floor(between(1950, 1975, 0)),
    }
  }
  // Vitrified clay DN 300: a 160 kN/m² class, 160 · 0.3 = 48 kN/m.
  return {
    material: 'vitrified-clay',
    outerDiameter_m: 0.36,
    wallThickness_m: 0.03,
    crushingStrength_kN_per_m: 48,
    beddingFactor: 1.5,
    yearLaid: Math.floor(between(1925, 1965, 0)),
  }
}

const lonLat = (line: XY[]) => line.map((p) => t.toLonLat(p).map((v) => Number(v.toFixed(7))))

function feature(properties: Record<string, unknown>, line: XY[]) {
  return {
    type: 'Feature',
    properties,
    geometry: { type: 'LineString', coordinates: lonLat(line) },
  }
}

const streets = (
  JSON.parse(readFileSync(join(root, 'demo', 'streets.geojson'), 'utf8')) as { features: Street[] }
).features
const water: unknown[] = []
const gas: unknown[] = []
const sewer: unknown[] = []

for (const street of streets) {
  const axis = street.geometry.coordinates.map((c) => t.toGrid(c) as XY)
  const { category, name } = street.properties
  const groundwater = /mill|brook|bridge/i.test(name) ? between(0.2, 0.6) : 0
  for (const piece of cut(offsetLine(axis, 2.5))) {
    const p = waterPipe(category)
    // One legacy PVC-U main of too thin a class for its pressure (hoop stress 600 kPa · 0.11 m /
    // (2 · 0.0027 m) = 12.2 MPa over 10 MPa allowed): the demo's over-capacity example.
    const legacy =
      p.material === 'PVC-U' &&
      !water.some((f) => (f as { properties: { note?: string } }).properties.note)
    if (legacy) p.wallThickness_m = 0.0027
    const cover = between(1.2, 1.7)
    water.push(
      feature(
        {
          ownerRef: `WW-W-${String(water.length + 1).padStart(4, '0')}`,
          medium: 'water',
          material: p.material,
          outerDiameter_m: p.outerDiameter_m,
          wallThickness_m: p.wallThickness_m,
          internalPressure_kPa: p.internalPressure_kPa,
          coverStart_m: cover,
          coverEnd_m: Number(Math.max(0.9, cover + between(-0.25, 0.25)).toFixed(2)),
          installation: 'trench',
          trenchWidth_m: Number((p.outerDiameter_m + between(0.4, 0.6)).toFixed(2)),
          ...soil(),
          beddingAngle_deg: pick([90, 120]),
          groundwaterAboveCrown_m: groundwater,
          designTrafficPressure_kPa: TRAFFIC_kPa[category],
          yearLaid: p.yearLaid,
          positionalAccuracy_m: p.accuracy,
          positionalQuality: p.quality,
          street: name,
          ...(legacy ? { note: 'Legacy thin-wall class, run above its rating' } : {}),
        },
        piece,
      ),
    )
  }
  for (const piece of cut(offsetLine(axis, -2.0))) {
    const p = gasPipe(category)
    const cover = between(0.8, 1.1)
    gas.push(
      feature(
        {
          ownerRef: `BG-${String(gas.length + 1).padStart(4, '0')}`,
          medium: 'gas',
          material: p.material,
          outerDiameter_m: p.outerDiameter_m,
          wallThickness_m: p.wallThickness_m,
          internalPressure_kPa: p.internalPressure_kPa,
          coverStart_m: cover,
          coverEnd_m: Number(Math.max(0.7, cover + between(-0.15, 0.15)).toFixed(2)),
          installation: 'trench',
          trenchWidth_m: Number((p.outerDiameter_m + between(0.35, 0.5)).toFixed(2)),
          ...soil(),
          beddingAngle_deg: 90,
          groundwaterAboveCrown_m: 0,
          designTrafficPressure_kPa: TRAFFIC_kPa[category],
          yearLaid: p.yearLaid,
          positionalAccuracy_m: p.accuracy,
          positionalQuality: p.quality,
          street: name,
        },
        piece,
      ),
    )
  }
  if (category === 'main') {
    for (const piece of cut(axis)) {
      const p = sewerPipe()
      const cover = between(2.2, 3.4)
      sewer.push(
        feature(
          {
            ownerRef: `WW-S-${String(sewer.length + 1).padStart(4, '0')}`,
            medium: 'sewer',
            ...p,
            internalPressure_kPa: 0,
            coverStart_m: cover,
            coverEnd_m: Number((cover + between(0.1, 0.4)).toFixed(2)),
            installation: 'trench',
            trenchWidth_m: Number((p.outerDiameter_m + between(0.6, 0.8)).toFixed(2)),
            ...soil(),
            beddingAngle_deg: 90,
            groundwaterAboveCrown_m: groundwater,
            designTrafficPressure_kPa: TRAFFIC_kPa[category],
            positionalAccuracy_m: 1,
            positionalQuality: 'estimated',
            street: name,
          },
          piece,
        ),
      )
    }
  }
}

const write = (file: string, features: unknown[]) => {
  const text = `{"type":"FeatureCollection","features":[\n${features.map((f) => JSON.stringify(f)).join(',\n')}\n]}\n`
  writeFileSync(join(root, 'demo', 'networks', file), text)
  console.error(`[make-networks] ${file}: ${features.length} segments`)
}
write('wendmoor-water.geojson', water)
write('wendmoor-sewer.geojson', sewer)
write('brackenfold-gas.geojson', gas)
