import type { CrsTransform } from '../../shared/geo/crs.ts'
import type { ActivityGeometry } from './activity-draft.ts'
import { positionsOf } from './coordinate-text.ts'

/** Plan area of a ring in grid metres (shoelace formula), m². */
function ringArea_m2(ring: readonly (readonly number[])[]): number {
  let twice = 0
  for (let i = 0; i < ring.length; i++) {
    const a = ring[i]!
    const b = ring[(i + 1) % ring.length]!
    twice += a[0]! * b[1]! - b[0]! * a[1]!
  }
  return Math.abs(twice) / 2
}

/** One line on a drawn geometry, e.g. "5 corners · 24.36 m²" or "4 outriggers". */
export function describeGeometry(geometry: ActivityGeometry | null, t: CrsTransform): string {
  if (!geometry) return 'Not on the map yet'
  const positions = positionsOf(geometry)
  if (geometry.type === 'Point') return 'One pad placed'
  if (geometry.type === 'MultiPoint') {
    return `${positions.length} outrigger${positions.length === 1 ? '' : 's'} placed`
  }
  // Shift next to the first corner so the area is exact in floating point.
  const grid = positions.map((p) => t.toGrid(p))
  const [x0, y0] = grid[0] ?? [0, 0]
  const area = ringArea_m2(grid.map(([x, y]) => [x - x0, y - y0]))
  return `${positions.length} corners · ${area.toFixed(2)} m²`
}
