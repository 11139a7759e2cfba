/**
 * Exact planar distances between points, segments, polylines and polygons, in the units of the
 * coordinates (metres in a projected CRS). Used instead of MariaDB's ST_Distance, which returns
 * wrong (too large) values for some line/polygon pairs (stack-notes P2).
 *
 * Source: standard computational geometry (orientation test and segment–segment distance as in
 * O'Rourke, Computational Geometry in C, 2nd ed., ch. 1 and 7; even–odd point-in-polygon rule).
 */

/** A planar position [x_m, y_m]; a third element (height) is ignored. */
export type XY = readonly number[]

const x = (p: XY) => p[0] as number
const y = (p: XY) => p[1] as number

/** Twice the signed area of the triangle a, b, c: > 0 counter-clockwise, < 0 clockwise. */
export function orientation(a: XY, b: XY, c: XY): number {
  return (x(b) - x(a)) * (y(c) - y(a)) - (y(b) - y(a)) * (x(c) - x(a))
}

function onSegment(a: XY, b: XY, p: XY): boolean {
  return (
    Math.min(x(a), x(b)) <= x(p) &&
    x(p) <= Math.max(x(a), x(b)) &&
    Math.min(y(a), y(b)) <= y(p) &&
    y(p) <= Math.max(y(a), y(b))
  )
}

/** True when the closed segments a1–a2 and b1–b2 share at least one point. */
export function segmentsIntersect(a1: XY, a2: XY, b1: XY, b2: XY): boolean {
  const d1 = orientation(b1, b2, a1)
  const d2 = orientation(b1, b2, a2)
  const d3 = orientation(a1, a2, b1)
  const d4 = orientation(a1, a2, b2)
  if (((d1 > 0 && d2 < 0) || (d1 < 0 && d2 > 0)) && ((d3 > 0 && d4 < 0) || (d3 < 0 && d4 > 0))) {
    return true
  }
  if (d1 === 0 && onSegment(b1, b2, a1)) return true
  if (d2 === 0 && onSegment(b1, b2, a2)) return true
  if (d3 === 0 && onSegment(a1, a2, b1)) return true
  if (d4 === 0 && onSegment(a1, a2, b2)) return true
  return false
}

/** Distance from point p to the closed segment a–b. */
export function pointToSegmentDistance(p: XY, a: XY, b: XY): number {
  const dx = x(b) - x(a)
  const dy = y(b) - y(a)
  const len2 = dx * dx + dy * dy
  let t = len2 === 0 ? 0 : ((x(p) - x(a)) * dx + (y(p) - y(a)) * dy) / len2
  t = Math.max(0, Math.min(1, t))
  return Math.hypot(x(p) - (x(a) + t * dx), y(p) - (y(a) + t * dy))
}

/** Distance between the closed segments a1–a2 and b1–b2 (0 when they touch or cross). */
export function segmentToSegmentDistance(a1: XY, a2: XY, b1: XY, b2: XY): number {
  if (segmentsIntersect(a1, a2, b1, b2)) return 0
  return Math.min(
    pointToSegmentDistance(a1, b1, b2),
    pointToSegmentDistance(a2, b1, b2),
    pointToSegmentDistance(b1, a1, a2),
    pointToSegmentDistance(b2, a1, a2),
  )
}

/**
 * True when p lies inside the polygon (outer ring first, then holes; even–odd rule). Points on
 * an edge may fall either way; callers that need "on the edge counts" also test the edge distance.
 */
export function pointInPolygon(p: XY, rings: readonly (readonly XY[])[]): boolean {
  let inside = false
  for (const ring of rings) {
    for (let i = 0, j = ring.length - 1; i < ring.length; j = i++) {
      const a = ring[i] as XY
      const b = ring[j] as XY
      if (
        y(a) > y(p) !== y(b) > y(p) &&
        x(p) < ((x(b) - x(a)) * (y(p) - y(a))) / (y(b) - y(a)) + x(a)
      ) {
        inside = !inside
      }
    }
  }
  return inside
}

/** Shortest distance between two polylines (each at least one position). */
export function polylineToPolylineDistance(a: readonly XY[], b: readonly XY[]): number {
  if (a.length === 1 && b.length === 1) return Math.hypot(x(a[0]!) - x(b[0]!), y(a[0]!) - y(b[0]!))
  if (a.length === 1) return pointToPolylineDistance(a[0]!, b)
  if (b.length === 1) return pointToPolylineDistance(b[0]!, a)
  let best = Infinity
  for (let i = 1; i < a.length; i++) {
    for (let j = 1; j < b.length; j++) {
      const d = segmentToSegmentDistance(a[i - 1]!, a[i]!, b[j - 1]!, b[j]!)
      if (d < best) best = d
      if (best === 0) return 0
    }
  }
  return best
}

/** Distance from a point to a polyline of at least one position. */
export function pointToPolylineDistance(p: XY, line: readonly XY[]): number {
  if (line.length === 1) return Math.hypot(x(p) - x(line[0]!), y(p) - y(line[0]!))
  let best = Infinity
  for (let i = 1; i < line.length; i++)
    best = Math.min(best, pointToSegmentDistance(p, line[i - 1]!, line[i]!))
  return best
}

/**
 * Distance from a polyline to a polygon area (outer ring plus holes): 0 when the line touches,
 * crosses or lies inside the area, else the shortest distance to the rings.
 */
export function polylineToPolygonDistance(
  line: readonly XY[],
  rings: readonly (readonly XY[])[],
): number {
  if (line.some((p) => pointInPolygon(p, rings))) return 0
  let best = Infinity
  for (const ring of rings) {
    best = Math.min(best, polylineToPolylineDistance(line, ring))
    if (best === 0) return 0
  }
  return best
}
