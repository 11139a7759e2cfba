/**
 * From what an applicant draws (GeoJSON activities in WGS84) to what the statics engine takes
 * (activities with footprints in a pipe-local frame). Two steps, so the server can search the
 * database with the projected shapes before it builds a frame per pipe piece:
 *
 * 1. `toGridActivities`: each drawn activity becomes one or more engine activities with an open
 *    ring in the projected CRS. A crane on outriggers becomes one pad per outrigger, each
 *    carrying the full leg load on its mat (the lift plan's largest leg load on every leg is the
 *    conservative reading when the slew position is not fixed).
 * 2. `toPieceActivities`: the rings in the frame of one straight pipe piece.
 *
 * The client's live preview runs the same code against the public outline.
 */
import type { CrsTransform } from '../geo/crs.ts'
import type { PipePiece } from '../geo/pipe-local-frame.ts'
import { matRectangle, ringToPieceLocal } from '../geo/pipe-local-frame.ts'
import type { ActivityInput } from '../schemas/application.ts'
import { influenceDistance_m } from '../statics/index.ts'
import type { Activity, InfluenceEnvelope } from '../statics/index.ts'

/** An engine activity whose footprint is still an open ring in the projected CRS. */
export interface GridActivity {
  /**
   * Engine id, which the engine also uses in its wording: the plain-word name, made unique
   * within the application ("Connection pit", "Crane, outrigger 2", "Excavation 3 (2)").
   */
  id: string
  /** Index of the drawn activity it comes from. */
  sourceIndex: number
  /** Plain-word name for messages ("Connection pit", "Crane, outrigger 2"). */
  name: string
  ring_grid: [number, number][]
  /** The engine activity without its footprint. */
  engine: DistributiveOmit<Activity, 'footprint' | 'id'>
}

type DistributiveOmit<T, K extends keyof T> = T extends unknown ? Omit<T, K> : never

const KIND_NAMES: Record<ActivityInput['kind'], string> = {
  excavation: 'Excavation',
  crane: 'Crane',
  fill: 'Fill or stockpile',
}

function openRing(t: CrsTransform, ring: readonly (readonly number[])[]): [number, number][] {
  const grid = ring.map((p) => t.toGrid(p))
  const first = grid[0]!
  const last = grid[grid.length - 1]!
  return first[0] === last[0] && first[1] === last[1] ? grid.slice(0, -1) : grid
}

/** Every drawn activity as engine activities in the projected CRS. */
export function toGridActivities(
  inputs: readonly ActivityInput[],
  t: CrsTransform,
): GridActivity[] {
  const out: GridActivity[] = []
  const used = new Set<string>()
  const uniqueId = (name: string) => {
    let id = name
    for (let n = 2; used.has(id); n++) id = `${name} (${n})`
    used.add(id)
    return id
  }
  inputs.forEach((a, i) => {
    const name = a.label?.trim() || `${KIND_NAMES[a.kind]} ${i + 1}`
    switch (a.kind) {
      case 'excavation':
        out.push({
          id: uniqueId(name),
          sourceIndex: i,
          name,
          ring_grid: openRing(t, a.geometry.coordinates[0]!),
          engine: { kind: 'excavation', depth_m: a.depth_m, support: a.support },
        })
        break
      case 'fill':
        out.push({
          id: uniqueId(name),
          sourceIndex: i,
          name,
          ring_grid: openRing(t, a.geometry.coordinates[0]!),
          engine: {
            kind: 'fill',
            height_m: a.height_m,
            unitWeight_kN_per_m3: a.unitWeight_kN_per_m3,
            // A fill left for more than a week counts as permanent (creep of plastic pipes).
            loadDuration: a.duration_days > 7 ? 'long-term' : 'short-term',
          },
        })
        break
      case 'crane': {
        const points =
          a.geometry.type === 'Point' ? [a.geometry.coordinates] : a.geometry.coordinates
        points.forEach((p, k) => {
          const legName = points.length > 1 ? `${name}, outrigger ${k + 1}` : name
          out.push({
            id: uniqueId(legName),
            sourceIndex: i,
            name: legName,
            ring_grid: matRectangle(t.toGrid(p), a.matLength_m, a.matWidth_m, a.matRotation_deg),
            engine: { kind: 'pad', load_kN: a.legLoad_kN, loadDuration: 'short-term' },
          })
        })
        break
      }
    }
  })
  return out
}

/** The activities in the frame of one straight pipe piece, ready for `assessPipe`. */
export function toPieceActivities(grid: readonly GridActivity[], piece: PipePiece): Activity[] {
  return grid.map(
    (g) =>
      ({
        ...g.engine,
        id: g.id,
        footprint: { polygon_m: ringToPieceLocal(piece, g.ring_grid) },
      }) as Activity,
  )
}

/**
 * Influence distance of one activity (engine rule, see shared/statics/README.md), never below
 * `minimum_m`. The ring is moved next to the origin first so its area is exact in floating
 * point.
 */
export function gridActivityInfluence_m(
  g: GridActivity,
  minimum_m: number,
  envelope: Partial<InfluenceEnvelope> = {},
): number {
  const [cx, cy] = g.ring_grid[0]!
  const local = g.ring_grid.map(([x, y]) => [x - cx, y - cy] as [number, number])
  return influenceDistance_m(
    { ...g.engine, id: g.id, footprint: { polygon_m: local } } as Activity,
    minimum_m,
    envelope,
  )
}
