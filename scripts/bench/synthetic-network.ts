/**
 * Synthetic city network for the scale benchmarks: a street grid (100 m blocks, intersections
 * jittered so no street is dead straight) with the pipes following the streets at their usual
 * offsets from the centreline: a water main, a sewer and a gas main under every street and a
 * district-heating pair under every third one, larger mains under every fifth street. Each
 * block-long pipe is two segments with a slight bend. Design data are the demo networks'
 * pipe types (medium, material, diameter, soil), with cover and year laid varied, validated with
 * the same shared schema the import uses, and every row gets its baseline check.
 *
 * The city grows ring by ring around one centre block, so the first 10,000 segments of the
 * 1,000,000-segment city are the 10,000-segment city: the screening site at the centre sees the
 * same pipes at every size and only the table grows.
 *
 * As a script it loads the first N segments (default 10,000) straight into MariaDB in batches
 * (multi-row INSERT with ST_GeomFromText in the projected CRS, through the import's own
 * segment writer) into a bench database; run again with a larger N to
 * grow the same city. The default database is `trenchward_bench_city_<N>`
 * (one per size, so the screening benchmark can compare sizes in one run).
 * Usage: node --import tsx scripts/bench/synthetic-network.ts [N] [database]
 */
import { createWriteStream } from 'node:fs'
import { once } from 'node:events'
import { pathToFileURL } from 'node:url'
import { QueryTypes } from 'sequelize'
import type { Sequelize } from 'sequelize'
import { parsePipeSegmentData } from '../../shared/schemas/pipe-segment.ts'
import { crsTransform } from '../../shared/geo/crs.ts'
import type { PipeMedium, PipeSegmentData } from '../../shared/types/network.ts'
import { computeBaseline } from '../../server/services/pipe-baseline.ts'
import { SEGMENT_BATCH_SIZE, upsertSegments } from '../../server/services/segment-writer.ts'

/** Centre of the synthetic city (lon, lat): the invented town of Wendmoor. */
export const CITY_CENTRE_LONLAT: [number, number] = [9.95, 52.6]
export const BLOCK_M = 100
/** The bench database holding the first n segments of the city. */
export const scaleDb = (n: number): string => `trenchward_bench_city_${n}`

/** The owner of each medium in the bench city (invented names). */
export const CITY_OWNERS: Readonly<Record<string, string>> = {
  water: 'Synthetic city water',
  sewer: 'Synthetic city drainage',
  gas: 'Synthetic city gas',
  district_heating: 'Synthetic city heat',
}

type Template = Omit<
  PipeSegmentData,
  'ownerRef' | 'coverStart_m' | 'coverEnd_m' | 'yearLaid' | 'positionalAccuracy_m'
> & { positionalAccuracy_m: number }

const soil = (
  kMu: number,
  gamma: number,
  phi: number,
  e: number,
  bedding: number,
  traffic: number,
) => ({
  installation: 'trench' as const,
  wallFrictionKMu: kMu,
  backfillUnitWeight_kN_per_m3: gamma,
  frictionAngle_deg: phi,
  sidefillModulus_MPa: e,
  beddingAngle_deg: bedding,
  groundwaterAboveCrown_m: 0,
  designTrafficPressure_kPa: traffic,
})

// The pipe types of demo/networks/*.geojson (their design data), per medium: [side street, main].
const TYPES: Record<PipeMedium, [Partial<Template>[], Partial<Template>[]]> = {
  water: [
    [
      {
        material: 'PE100',
        outerDiameter_m: 0.125,
        wallThickness_m: 0.0114,
        internalPressure_kPa: 700,
        trenchWidth_m: 0.63,
        positionalQuality: 'surveyed',
        positionalAccuracy_m: 0.1,
        ...soil(0.13, 20, 27.5, 3, 120, 8),
      },
      {
        material: 'PE100',
        outerDiameter_m: 0.16,
        wallThickness_m: 0.0145,
        internalPressure_kPa: 700,
        trenchWidth_m: 0.72,
        positionalQuality: 'surveyed',
        positionalAccuracy_m: 0.1,
        ...soil(0.15, 19.5, 30, 5, 90, 15),
      },
      {
        material: 'PVC-U',
        outerDiameter_m: 0.11,
        wallThickness_m: 0.0027,
        internalPressure_kPa: 600,
        trenchWidth_m: 0.68,
        positionalQuality: 'digitised',
        positionalAccuracy_m: 1,
        ...soil(0.15, 19.5, 30, 5, 120, 8),
      },
    ],
    [
      {
        material: 'ductile-iron',
        outerDiameter_m: 0.326,
        wallThickness_m: 0.0072,
        internalPressure_kPa: 800,
        trenchWidth_m: 0.88,
        positionalQuality: 'digitised',
        positionalAccuracy_m: 0.5,
        ...soil(0.15, 19.5, 30, 5, 120, 25),
      },
      {
        material: 'ductile-iron',
        outerDiameter_m: 0.222,
        wallThickness_m: 0.0064,
        internalPressure_kPa: 800,
        trenchWidth_m: 0.74,
        positionalQuality: 'digitised',
        positionalAccuracy_m: 0.5,
        ...soil(0.15, 19.5, 30, 5, 90, 25),
      },
      {
        material: 'PE100',
        outerDiameter_m: 0.2,
        wallThickness_m: 0.0182,
        internalPressure_kPa: 700,
        trenchWidth_m: 0.66,
        positionalQuality: 'surveyed',
        positionalAccuracy_m: 0.1,
        ...soil(0.165, 19, 32, 6.9, 120, 8),
      },
    ],
  ],
  sewer: [
    [
      {
        material: 'vitrified-clay',
        outerDiameter_m: 0.36,
        wallThickness_m: 0.03,
        crushingStrength_kN_per_m: 48,
        beddingFactor: 1.5,
        internalPressure_kPa: 0,
        trenchWidth_m: 1.16,
        positionalQuality: 'estimated',
        positionalAccuracy_m: 1,
        ...soil(0.15, 19.5, 30, 5, 90, 25),
      },
    ],
    [
      {
        material: 'concrete',
        outerDiameter_m: 0.72,
        wallThickness_m: 0.06,
        crushingStrength_kN_per_m: 81,
        beddingFactor: 1.9,
        internalPressure_kPa: 0,
        trenchWidth_m: 1.41,
        positionalQuality: 'estimated',
        positionalAccuracy_m: 1,
        ...soil(0.165, 19, 32, 6.9, 90, 25),
      },
    ],
  ],
  gas: [
    [
      {
        material: 'PE100',
        outerDiameter_m: 0.125,
        wallThickness_m: 0.0114,
        internalPressure_kPa: 400,
        trenchWidth_m: 0.49,
        positionalQuality: 'surveyed',
        positionalAccuracy_m: 0.1,
        ...soil(0.13, 20, 27.5, 3, 90, 25),
      },
      {
        material: 'PE100',
        outerDiameter_m: 0.063,
        wallThickness_m: 0.0057,
        internalPressure_kPa: 400,
        trenchWidth_m: 0.47,
        positionalQuality: 'surveyed',
        positionalAccuracy_m: 0.1,
        ...soil(0.13, 20, 27.5, 3, 90, 8),
      },
    ],
    [
      {
        material: 'steel',
        outerDiameter_m: 0.2191,
        wallThickness_m: 0.0059,
        internalPressure_kPa: 400,
        trenchWidth_m: 0.69,
        positionalQuality: 'digitised',
        positionalAccuracy_m: 0.5,
        ...soil(0.13, 20, 27.5, 3, 90, 25),
      },
      {
        material: 'PE100',
        outerDiameter_m: 0.18,
        wallThickness_m: 0.0164,
        internalPressure_kPa: 400,
        trenchWidth_m: 0.56,
        positionalQuality: 'surveyed',
        positionalAccuracy_m: 0.1,
        ...soil(0.13, 20, 27.5, 3, 90, 25),
      },
    ],
  ],
  district_heating: [
    [
      {
        material: 'steel',
        outerDiameter_m: 0.1683,
        wallThickness_m: 0.0045,
        internalPressure_kPa: 1600,
        trenchWidth_m: 1.2,
        positionalQuality: 'surveyed',
        positionalAccuracy_m: 0.1,
        ...soil(0.15, 19.5, 30, 5, 90, 25),
      },
    ],
    [
      {
        material: 'steel',
        outerDiameter_m: 0.2191,
        wallThickness_m: 0.0059,
        internalPressure_kPa: 1600,
        trenchWidth_m: 1.4,
        positionalQuality: 'surveyed',
        positionalAccuracy_m: 0.1,
        ...soil(0.15, 19.5, 30, 5, 90, 25),
      },
    ],
  ],
  other: [[], []],
}

/** Offset of each medium from the street centreline, m (left of the direction of travel). */
const OFFSET_M: Record<string, number[]> = {
  water: [2.2],
  sewer: [0],
  gas: [-2.4],
  district_heating: [3.6, 4.2],
}
/** Base cover of each medium, m (varied per segment). */
const COVER_M: Record<string, number> = { water: 1.3, sewer: 2.4, gas: 0.9, district_heating: 0.8 }

/** A deterministic hash of integers to [0, 1). */
function hash01(...n: number[]): number {
  let h = 0x811c9dc5
  for (const v of n) {
    h ^= v & 0xffffffff
    h = Math.imul(h, 0x01000193)
    h ^= h >>> 13
    h = Math.imul(h, 0x5bd1e995)
    h ^= h >>> 15
  }
  return (h >>> 0) / 4294967296
}

/** One generated segment: design data (schema-checked) and its vertices in the projected CRS. */
export interface SyntheticSegment {
  medium: PipeMedium
  data: PipeSegmentData
  grid: [number, number][]
  length_m: number
}

/** Cells of the grid ring by ring around (0, 0): ring 0 is one cell, ring k has 8k. */
function* cellsByRing(): Generator<[number, number]> {
  yield [0, 0]
  for (let k = 1; ; k++) {
    for (let i = -k; i < k; i++) yield [i, -k]
    for (let j = -k; j < k; j++) yield [k, j]
    for (let i = k; i > -k; i--) yield [i, k]
    for (let j = k; j > -k; j--) yield [-k, j]
  }
}

/** Street intersection (i, j) in the projected CRS, jittered up to 12 m. */
function node(x0: number, y0: number, i: number, j: number): [number, number] {
  return [
    x0 + i * BLOCK_M + (hash01(i, j, 1) - 0.5) * 24,
    y0 + j * BLOCK_M + (hash01(i, j, 2) - 0.5) * 24,
  ]
}

const round = (v: number, d: number) => Number(v.toFixed(d))

/**
 * The city's segments in their fixed order (ring by ring from the centre), endlessly.
 *
 * @param epsg - projected CRS of the vertices
 */
export function* syntheticSegments(epsg: number): Generator<SyntheticSegment> {
  const [x0, y0] = crsTransform(epsg).toGrid(CITY_CENTRE_LONLAT)
  for (const [i, j] of cellsByRing()) {
    // Each cell owns the street east and the street north of its south-west intersection.
    for (const dir of ['e', 'n'] as const) {
      const a = node(x0, y0, i, j)
      const b = dir === 'e' ? node(x0, y0, i + 1, j) : node(x0, y0, i, j + 1)
      const street = dir === 'e' ? j : i
      const main = ((street % 5) + 5) % 5 === 0
      const heat = ((street % 3) + 3) % 3 === 0
      const len = Math.hypot(b[0] - a[0], b[1] - a[1])
      const [ux, uy] = [(b[0] - a[0]) / len, (b[1] - a[1]) / len]
      const [nx, ny] = [-uy, ux]
      for (const medium of ['water', 'sewer', 'gas', 'district_heating'] as const) {
        if (medium === 'district_heating' && !heat) continue
        const types = TYPES[medium][main ? 1 : 0]
        for (const [k, off] of OFFSET_M[medium]!.entries()) {
          const type = types[Math.floor(hash01(street, medium.length, 7) * types.length)]!
          // Two segments per block: from a point 3 m into the block (clear of the crossing
          // pipes) to a slightly bent middle, and on to 3 m before the next crossing.
          const bend = (hash01(i, j, medium.length, k) - 0.5) * 1.6
          const at = (s: number, side: number): [number, number] => [
            round(a[0] + ux * s + nx * side, 3),
            round(a[1] + uy * s + ny * side, 3),
          ]
          const mid = len / 2
          const parts: [number, number][][] = [
            [at(3, off), at(mid * 0.55, off + bend * 0.5), at(mid, off + bend)],
            [at(mid, off + bend), at(mid + (len - mid) * 0.45, off + bend * 0.5), at(len - 3, off)],
          ]
          for (const [p, grid] of parts.entries()) {
            const h = hash01(i, j, p, medium.length, k, dir === 'e' ? 1 : 2)
            const cover = COVER_M[medium]! + h * 0.8
            const raw = {
              ...type,
              ownerRef: `${medium.slice(0, 2).toUpperCase()}-${i}_${j}-${dir}${k}-${p}`,
              medium,
              coverStart_m: round(cover, 2),
              coverEnd_m: round(cover + (hash01(i, j, p, 9) - 0.5) * 0.3, 2),
              yearLaid: 1950 + Math.floor(h * 72),
            }
            const parsed = parsePipeSegmentData(raw)
            if (!parsed.ok)
              throw new Error(`synthetic ${raw.ownerRef}: ${JSON.stringify(parsed.issues)}`)
            let length_m = 0
            for (let q = 1; q < grid.length; q++)
              length_m += Math.hypot(grid[q]![0] - grid[q - 1]![0], grid[q]![1] - grid[q - 1]![1])
            yield { medium, data: parsed.data, grid, length_m }
          }
        }
      }
    }
  }
}

/** The WGS84 bbox (minLon,minLat,maxLon,maxLat) that holds the first n segments, with margin. */
export function syntheticBbox(n: number): [number, number, number, number] {
  // About 14 segments per cell; rings of side 2k+1 cells.
  const k = Math.ceil(Math.sqrt(n / 12) / 2) + 2
  const t = crsTransform(25832)
  const [x0, y0] = t.toGrid(CITY_CENTRE_LONLAT)
  const [minLon, minLat] = t.toLonLat([x0 - k * BLOCK_M, y0 - k * BLOCK_M])
  const [maxLon, maxLat] = t.toLonLat([x0 + (k + 1) * BLOCK_M, y0 + (k + 1) * BLOCK_M])
  return [minLon - 0.01, minLat - 0.01, maxLon + 0.01, maxLat + 0.01]
}

/**
 * The first n segments as a GeoJSON FeatureCollection file (WGS84), as an owner would upload
 * it: for the import benchmark through the real import path. Only the given medium's owner's
 * segments are written when `medium` is set.
 */
export async function writeSyntheticGeoJson(
  path: string,
  n: number,
  epsg: number,
  medium?: PipeMedium,
): Promise<void> {
  const t = crsTransform(epsg)
  const out = createWriteStream(path)
  const write = async (s: string) => {
    if (!out.write(s)) await once(out, 'drain')
  }
  await write('{"type":"FeatureCollection","features":[\n')
  let i = 0
  for (const s of syntheticSegments(epsg)) {
    if (medium && s.medium !== medium) continue
    const coordinates = s.grid.map((p) => t.toLonLat(p).map((v) => round(v, 8)))
    await write(
      (i ? ',\n' : '') +
        JSON.stringify({
          type: 'Feature',
          properties: s.data,
          geometry: { type: 'LineString', coordinates },
        }),
    )
    if (++i >= n) break
  }
  await write('\n]}\n')
  out.end()
  await once(out, 'finish')
}

/** The bench city's owner organisations by medium, created when missing. */
export async function cityOwners(sequelize: Sequelize): Promise<Map<string, number>> {
  const ids = new Map<string, number>()
  for (const [medium, name] of Object.entries(CITY_OWNERS)) {
    let [row] = await sequelize.query<{ id: number }>(
      'SELECT id FROM organisations WHERE name = ?',
      { replacements: [name], type: QueryTypes.SELECT },
    )
    if (!row) {
      await sequelize.query(
        `INSERT INTO organisations (name, kind, medium, created_at, updated_at)
         VALUES (?, 'network_owner', ?, NOW(3), NOW(3))`,
        { replacements: [name, medium] },
      )
      ;[row] = await sequelize.query<{ id: number }>(
        'SELECT id FROM organisations WHERE name = ?',
        { replacements: [name], type: QueryTypes.SELECT },
      )
    }
    ids.set(medium, Number(row!.id))
  }
  return ids
}

/** Segments of the bench city already stored. */
export async function storedCitySegments(sequelize: Sequelize): Promise<number> {
  const owners = await cityOwners(sequelize)
  const [row] = await sequelize.query<{ n: number }>(
    'SELECT COUNT(*) AS n FROM pipe_segments WHERE owner_organisation_id IN (?)',
    { replacements: [[...owners.values()]], type: QueryTypes.SELECT },
  )
  return Number(row!.n)
}

/**
 * Grow the stored city to n segments: the generated segments after those already stored, with
 * baselines, in transactions of a few thousand rows (one multi-row upsert per owner and
 * SEGMENT_BATCH_SIZE rows). Idempotent: a run that stopped half-way resumes.
 *
 * @returns rows written and seconds taken
 */
export async function loadSyntheticCity(
  sequelize: Sequelize,
  epsg: number,
  n: number,
  onProgress?: (stored: number) => void,
): Promise<{ written: number; seconds: number }> {
  const owners = await cityOwners(sequelize)
  const have = await storedCitySegments(sequelize)
  const t0 = process.hrtime.bigint()
  const TX_ROWS = SEGMENT_BATCH_SIZE * 8
  let index = 0
  let written = 0
  let pending: SyntheticSegment[] = []
  const flush = async () => {
    const byOwner = new Map<number, SyntheticSegment[]>()
    for (const s of pending) {
      const id = owners.get(s.medium)!
      if (!byOwner.has(id)) byOwner.set(id, [])
      byOwner.get(id)!.push(s)
    }
    await sequelize.transaction(async (transaction) => {
      for (const [ownerId, list] of byOwner) {
        for (let k = 0; k < list.length; k += SEGMENT_BATCH_SIZE) {
          const rows = list.slice(k, k + SEGMENT_BATCH_SIZE).map((s) => ({
            data: s.data,
            grid: s.grid,
            length_m: s.length_m,
            baseline: computeBaseline(s.data),
          }))
          await upsertSegments(sequelize, ownerId, rows, { transaction, epsg, importId: null })
        }
      }
    })
    written += pending.length
    pending = []
    onProgress?.(have + written)
  }
  if (have < n) {
    for (const s of syntheticSegments(epsg)) {
      if (index++ < have) continue
      pending.push(s)
      if (pending.length >= TX_ROWS) await flush()
      if (have + written + pending.length >= n) break
    }
    if (pending.length) await flush()
  }
  return { written, seconds: Number(process.hrtime.bigint() - t0) / 1e9 }
}

if (import.meta.url === pathToFileURL(process.argv[1] ?? '').href) {
  const { parseConfig, setConfig } = await import('../../server/config.ts')
  const { createMigrator } = await import('../../server/db/migrate.ts')
  const { createSequelize } = await import('../../server/db/sequelize.ts')
  const { ensureDatabase, testEnv } = await import('../../tests/helpers/local-env.ts')
  const n = Number(process.argv[2] ?? 10_000) || 10_000
  const db = process.argv[3] ?? scaleDb(n)
  ensureDatabase(db)
  const cfg = parseConfig(testEnv(db, { NODE_ENV: 'development' }))
  setConfig(cfg)
  const sequelize = createSequelize(cfg)
  try {
    await createMigrator(sequelize, cfg.PROJECTED_EPSG).up()
    let last = 0
    const r = await loadSyntheticCity(sequelize, cfg.PROJECTED_EPSG, n, (stored) => {
      if (stored - last >= 50_000) {
        last = stored
        console.log(`  ${stored.toLocaleString('en')} segments stored`)
      }
    })
    console.log(
      `${db}: ${(await storedCitySegments(sequelize)).toLocaleString('en')} segments; wrote ${r.written.toLocaleString('en')} in ${r.seconds.toFixed(1)} s`,
    )
  } finally {
    await sequelize.close()
  }
}
