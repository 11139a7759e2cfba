import { buffer as turfBuffer, polygon as turfPolygon } from '@turf/turf'
import type { Polygon } from 'geojson'
import type { CrsTransform } from '../../shared/geo/crs.ts'
import { polylineToPolygonDistance } from '../../shared/geo/planar-distance.ts'
import type { ActivityInput } from '../../shared/schemas/application.ts'
import {
  gridActivityInfluence_m,
  toGridActivities,
} from '../../shared/screening/engine-activities.ts'
import type { OutlineFeature, PipeMedium } from '../../shared/types/network.ts'

/**
 * The live preview while an applicant draws: the same activity conversion and influence
 * distance the server's screening uses, run against the public outline (owner and medium only).
 * It tells which owners' pipes lie within reach; the verdicts come from the real screening.
 */

/** Never look less far than this around an activity, m (the server's default minimum). */
export const PREVIEW_MIN_DISTANCE_m = 5

export interface PreviewActivity {
  /** Form key of the activity. */
  key: string
  input: ActivityInput
}

/** Pipes of one owner and medium within reach of one activity. */
export interface ReachEntry {
  ownerName: string
  medium: PipeMedium
  pipeCount: number
  /** Plan distance from the works to the nearest of these pipes, m (0 when touching). */
  nearest_m: number
}

export interface ActivityReach {
  key: string
  /** Largest influence distance of the activity's parts (a crane's legs), m. */
  influence_m: number
  /** Footprint widened by the influence distance, one per part, WGS84. */
  zones: Polygon[]
  /** Crane mats as drawn on the ground, WGS84 (empty for other kinds). */
  mats: Polygon[]
  pipes: ReachEntry[]
  /** Outline ids of the pipes within reach. */
  pipeIds: number[]
  /** Set when the engine could not size this activity (e.g. a footprint too small). */
  problem: string | null
}

function closedLonLatRing(t: CrsTransform, ring: readonly [number, number][]): number[][] {
  const lonLat = ring.map((p) => t.toLonLat(p) as number[])
  return [...lonLat, lonLat[0]!]
}

/** Which outline pipes each activity reaches, with its influence zone and crane mats. */
export function previewReach(
  activities: readonly PreviewActivity[],
  outline: readonly OutlineFeature[],
  t: CrsTransform,
  minimum_m: number = PREVIEW_MIN_DISTANCE_m,
): ActivityReach[] {
  const grid = toGridActivities(
    activities.map((a) => a.input),
    t,
  )
  const pipes = outline.map((f) => ({
    feature: f,
    line: f.geometry.coordinates.map((p) => t.toGrid(p)),
  }))
  return activities.map((activity, index) => {
    const parts = grid.filter((g) => g.sourceIndex === index)
    const reach: ActivityReach = {
      key: activity.key,
      influence_m: 0,
      zones: [],
      mats: [],
      pipes: [],
      pipeIds: [],
      problem: null,
    }
    const entries = new Map<string, ReachEntry>()
    const ids = new Set<number>()
    for (const part of parts) {
      let distance_m: number
      try {
        distance_m = gridActivityInfluence_m(part, minimum_m)
      } catch (err) {
        reach.problem = err instanceof Error ? err.message : String(err)
        continue
      }
      reach.influence_m = Math.max(reach.influence_m, distance_m)
      const ring = closedLonLatRing(t, part.ring_grid)
      if (activity.input.kind === 'crane') reach.mats.push({ type: 'Polygon', coordinates: [ring] })
      const zone = turfBuffer(turfPolygon([ring]), distance_m, { units: 'meters', steps: 8 })
      if (zone && zone.geometry.type === 'Polygon') reach.zones.push(zone.geometry)
      for (const pipe of pipes) {
        const d = polylineToPolygonDistance(pipe.line, [part.ring_grid])
        if (d > distance_m) continue
        ids.add(pipe.feature.id)
        const { ownerName, medium } = pipe.feature.properties
        const k = `${ownerName}\u0000${medium}`
        const entry = entries.get(k)
        if (entry) entry.nearest_m = Math.min(entry.nearest_m, d)
        else entries.set(k, { ownerName, medium, pipeCount: 0, nearest_m: d })
      }
    }
    // Count each pipe once per activity, even when several crane legs reach it.
    for (const pipe of pipes) {
      if (!ids.has(pipe.feature.id)) continue
      const { ownerName, medium } = pipe.feature.properties
      entries.get(`${ownerName}\u0000${medium}`)!.pipeCount += 1
    }
    reach.pipes = [...entries.values()].sort(
      (a, b) => a.ownerName.localeCompare(b.ownerName) || a.medium.localeCompare(b.medium),
    )
    reach.pipeIds = [...ids].sort((a, b) => a - b)
    return reach
  })
}

/** Owners and media reached by any activity, each pipe counted once, for the summary line. */
export function mergeReach(
  reaches: readonly ActivityReach[],
  outline: readonly OutlineFeature[],
): ReachEntry[] {
  const ids = new Set(reaches.flatMap((r) => r.pipeIds))
  const nearest = new Map<string, number>()
  for (const reach of reaches) {
    for (const entry of reach.pipes) {
      const k = `${entry.ownerName}\u0000${entry.medium}`
      nearest.set(k, Math.min(nearest.get(k) ?? Infinity, entry.nearest_m))
    }
  }
  const merged = new Map<string, ReachEntry>()
  for (const feature of outline) {
    if (!ids.has(feature.id)) continue
    const { ownerName, medium } = feature.properties
    const k = `${ownerName}\u0000${medium}`
    const entry = merged.get(k) ?? {
      ownerName,
      medium,
      pipeCount: 0,
      nearest_m: nearest.get(k) ?? 0,
    }
    entry.pipeCount += 1
    merged.set(k, entry)
  }
  return [...merged.values()].sort(
    (a, b) => a.ownerName.localeCompare(b.ownerName) || a.medium.localeCompare(b.medium),
  )
}

/**
 * The box to ask the outline for: the map view, grown to take in every drawn position plus a
 * margin (0.002° is about 135 m north-south here, well beyond any influence distance), so pipes
 * just off screen still count.
 */
export function previewBox(
  view: readonly [number, number, number, number],
  positions: readonly (readonly number[])[],
  margin_deg = 0.002,
): [number, number, number, number] {
  let [minLon, minLat, maxLon, maxLat] = view
  for (const p of positions) {
    minLon = Math.min(minLon, p[0]! - margin_deg)
    maxLon = Math.max(maxLon, p[0]! + margin_deg)
    minLat = Math.min(minLat, p[1]! - margin_deg)
    maxLat = Math.max(maxLat, p[1]! + margin_deg)
  }
  // Rounded to 1e-6° (about 0.1 m): enough for a search box, and a short, stable URL.
  const clamp = (v: number, limit: number) =>
    Math.round(Math.max(-limit, Math.min(limit, v)) * 1e6) / 1e6
  return [clamp(minLon, 180), clamp(minLat, 90), clamp(maxLon, 180), clamp(maxLat, 90)]
}

/** One line of the preview list: an activity and its reach, or what it still needs. */
export interface ReachRow {
  key: string
  name: string
  /** Null while the activity is not complete enough to size. */
  reach: ActivityReach | null
  /** Why there is no reach yet, in words. */
  waitingFor: string | null
}
