/**
 * Checks a pipe segment's line must pass before it is stored: a real length and no crossing of
 * itself. Planar, in the units of the coordinates (metres in a projected CRS).
 */
import { orientation, segmentsIntersect } from './planar-distance.ts'
import type { XY } from './planar-distance.ts'

/** Length of a polyline, the sum of its straight pieces. */
export function polylineLength(line: readonly XY[]): number {
  let total = 0
  for (let i = 1; i < line.length; i++) {
    total += Math.hypot(
      (line[i]![0] as number) - (line[i - 1]![0] as number),
      (line[i]![1] as number) - (line[i - 1]![1] as number),
    )
  }
  return total
}

/** The polyline without consecutive repeated positions (closer than `tolerance`). */
export function withoutRepeatedPositions<T extends XY>(line: readonly T[], tolerance = 0): T[] {
  const out: T[] = []
  for (const p of line) {
    const last = out[out.length - 1]
    if (
      last &&
      Math.hypot((p[0] as number) - (last[0] as number), (p[1] as number) - (last[1] as number)) <=
        tolerance
    )
      continue
    out.push(p)
  }
  return out
}

/** Where a line meets itself: the indexes of the two pieces (piece i runs from vertex i to i+1). */
export interface SelfIntersection {
  pieceA: number
  pieceB: number
}

/**
 * The first place where the polyline crosses or touches itself, or null when it is simple.
 * Neighbouring pieces may share their common vertex but must not fold back onto each other; a
 * line whose end returns to its start counts as touching itself (a pipe segment is never a ring).
 * O(n²) in the vertex count, fine for pipe segments (tens to a few hundred vertices).
 */
export function findSelfIntersection(line: readonly XY[]): SelfIntersection | null {
  const n = line.length - 1
  for (let i = 0; i < n; i++) {
    for (let j = i + 1; j < n; j++) {
      const a1 = line[i]!
      const a2 = line[i + 1]!
      const b1 = line[j]!
      const b2 = line[j + 1]!
      if (j === i + 1) {
        // Shared vertex a2 = b1: a problem only if b turns straight back along a.
        if (orientation(a1, a2, b2) === 0) {
          const back =
            ((a2[0] as number) - (a1[0] as number)) * ((b2[0] as number) - (b1[0] as number)) +
              ((a2[1] as number) - (a1[1] as number)) * ((b2[1] as number) - (b1[1] as number)) <
            0
          if (back) return { pieceA: i, pieceB: j }
        }
        continue
      }
      if (segmentsIntersect(a1, a2, b1, b2)) return { pieceA: i, pieceB: j }
    }
  }
  if (n >= 2) {
    const first = line[0]!
    const last = line[n]!
    if (first[0] === last[0] && first[1] === last[1]) return { pieceA: 0, pieceB: n - 1 }
  }
  return null
}
