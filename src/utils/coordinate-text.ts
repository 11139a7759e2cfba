import type { CrsTransform, LonLat } from '../../shared/geo/crs.ts'
import type { ActivityKind } from '../../shared/schemas/application.ts'
import type { ActivityGeometry, CraneSetup } from './activity-draft.ts'

/**
 * Typed coordinates for an activity: one position per line, in WGS84 lon/lat (degrees) or in
 * the projected grid (easting and northing in metres). Positions are separated from each other
 * by new lines or semicolons; the two numbers of a position by a comma, spaces or a tab.
 */
export type CoordinateSystem = 'lonlat' | 'grid'

export type ParsedPositions = { ok: true; positions: LonLat[] } | { ok: false; message: string }

const NUMBER = /^[-+]?\d+(\.\d+)?$/

export function parseCoordinateText(
  text: string,
  system: CoordinateSystem,
  t: CrsTransform,
): ParsedPositions {
  const lines = text
    .split(/[\n;]/)
    .map((line) => line.trim())
    .filter((line) => line !== '')
  if (lines.length === 0) return { ok: false, message: 'Type at least one position' }
  const positions: LonLat[] = []
  for (const [index, line] of lines.entries()) {
    const parts = line.split(/[\s,]+/).filter((p) => p !== '')
    if (parts.length !== 2 || !parts.every((p) => NUMBER.test(p))) {
      return { ok: false, message: `Line ${index + 1}: write two numbers, e.g. ${example(system)}` }
    }
    const a = Number(parts[0])
    const b = Number(parts[1])
    if (system === 'lonlat') {
      if (a < -180 || a > 180 || b < -90 || b > 90) {
        return { ok: false, message: `Line ${index + 1}: longitude first, then latitude` }
      }
      positions.push([a, b])
    } else {
      if (Math.abs(a) < 1000 || Math.abs(b) < 1000) {
        return {
          ok: false,
          message: `Line ${index + 1}: grid positions are in metres (easting northing)`,
        }
      }
      positions.push(t.toLonLat([a, b]))
    }
  }
  return { ok: true, positions }
}

function example(system: CoordinateSystem): string {
  return system === 'lonlat' ? '9.950120, 52.600340' : '564012.35 5828455.10'
}

/** Positions as text in the chosen system: degrees to 6 decimals, metres to 2 decimals. */
export function formatCoordinateText(
  positions: readonly LonLat[],
  system: CoordinateSystem,
  t: CrsTransform,
): string {
  return positions
    .map((p) => {
      if (system === 'lonlat') return `${p[0].toFixed(6)}, ${p[1].toFixed(6)}`
      const [x, y] = t.toGrid(p)
      return `${x.toFixed(2)} ${y.toFixed(2)}`
    })
    .join('\n')
}

/** The positions a geometry is made of (a polygon's ring without the closing repeat). */
export function positionsOf(geometry: ActivityGeometry | null): LonLat[] {
  if (!geometry) return []
  if (geometry.type === 'Point') return [[geometry.coordinates[0]!, geometry.coordinates[1]!]]
  if (geometry.type === 'MultiPoint') return geometry.coordinates.map((p) => [p[0]!, p[1]!])
  const ring = geometry.coordinates[0] ?? []
  const open = ring.slice(0, Math.max(0, ring.length - 1))
  return open.map((p) => [p[0]!, p[1]!])
}

/** The geometry an activity of this kind takes from typed positions (rings closed here). */
export function geometryFromPositions(
  kind: ActivityKind,
  setup: CraneSetup,
  positions: readonly LonLat[],
): ActivityGeometry | null {
  if (positions.length === 0) return null
  if (kind === 'crane') {
    if (setup === 'single-pad') return { type: 'Point', coordinates: [...positions[0]!] }
    return { type: 'MultiPoint', coordinates: positions.map((p) => [...p]) }
  }
  const ring = positions.map((p) => [...p])
  const first = ring[0]!
  const last = ring[ring.length - 1]!
  if (first[0] !== last[0] || first[1] !== last[1]) ring.push([...first])
  return { type: 'Polygon', coordinates: [ring] }
}
