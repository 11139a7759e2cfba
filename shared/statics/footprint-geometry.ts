/**
 * Plan geometry of activity footprints in the pipe-local frame (x across the pipe, y along it).
 * Every distance rule of the engine is measured to a line parallel to the pipe axis, so the
 * x-extent of a (connected) footprint gives those distances exactly.
 */
import type { Footprint, PolygonFootprint, RectangleFootprint } from './types.ts'

/** Axis-aligned bounds of a footprint, m. */
export interface Bounds {
  xMin_m: number
  xMax_m: number
  yMin_m: number
  yMax_m: number
}

/** Returns true when the footprint is given as a polygon. */
export function isPolygonFootprint(footprint: Footprint): footprint is PolygonFootprint {
  return 'polygon_m' in footprint
}

/** Returns the axis-aligned bounds of a footprint, m. */
export function footprintBounds(footprint: Footprint): Bounds {
  if (!isPolygonFootprint(footprint)) {
    const { xMin_m, xMax_m, yMin_m, yMax_m } = footprint
    return { xMin_m, xMax_m, yMin_m, yMax_m }
  }
  let xMin_m = Infinity
  let xMax_m = -Infinity
  let yMin_m = Infinity
  let yMax_m = -Infinity
  for (const [x, y] of footprint.polygon_m) {
    if (x < xMin_m) xMin_m = x
    if (x > xMax_m) xMax_m = x
    if (y < yMin_m) yMin_m = y
    if (y > yMax_m) yMax_m = y
  }
  return { xMin_m, xMax_m, yMin_m, yMax_m }
}

/** Returns the polygon's signed area in m² (positive when counter-clockwise). */
export function polygonSignedArea_m2(vertices_m: ReadonlyArray<readonly [number, number]>): number {
  let twice = 0
  for (let i = 0; i < vertices_m.length; i++) {
    const a = vertices_m[i] as readonly [number, number]
    const b = vertices_m[(i + 1) % vertices_m.length] as readonly [number, number]
    twice += a[0] * b[1] - a[1] * b[0]
  }
  return twice / 2
}

/** Returns the plan area of a footprint in m². */
export function footprintArea_m2(footprint: Footprint): number {
  if (!isPolygonFootprint(footprint)) {
    return (footprint.xMax_m - footprint.xMin_m) * (footprint.yMax_m - footprint.yMin_m)
  }
  return Math.abs(polygonSignedArea_m2(footprint.polygon_m))
}

/** Returns the area centroid [x_m, y_m] of a footprint. */
export function footprintCentroid_m(footprint: Footprint): [number, number] {
  if (!isPolygonFootprint(footprint)) {
    return [(footprint.xMin_m + footprint.xMax_m) / 2, (footprint.yMin_m + footprint.yMax_m) / 2]
  }
  const vertices = footprint.polygon_m
  let twiceArea = 0
  let cx = 0
  let cy = 0
  for (let i = 0; i < vertices.length; i++) {
    const a = vertices[i] as [number, number]
    const b = vertices[(i + 1) % vertices.length] as [number, number]
    const cross = a[0] * b[1] - a[1] * b[0]
    twiceArea += cross
    cx += (a[0] + b[0]) * cross
    cy += (a[1] + b[1]) * cross
  }
  if (twiceArea === 0) {
    const bounds = footprintBounds(footprint)
    return [(bounds.xMin_m + bounds.xMax_m) / 2, (bounds.yMin_m + bounds.yMax_m) / 2]
  }
  return [cx / (3 * twiceArea), cy / (3 * twiceArea)]
}

/** Returns a copy of the footprint moved by dx_m across the pipe. */
export function translateFootprintAcross(footprint: Footprint, dx_m: number): Footprint {
  if (!isPolygonFootprint(footprint)) {
    return { ...footprint, xMin_m: footprint.xMin_m + dx_m, xMax_m: footprint.xMax_m + dx_m }
  }
  return { polygon_m: footprint.polygon_m.map(([x, y]) => [x + dx_m, y] as [number, number]) }
}

/** Returns a copy of the footprint scaled by `factor` in both directions about its centroid. */
export function scaleFootprintAboutCentroid(footprint: Footprint, factor: number): Footprint {
  const [cx, cy] = footprintCentroid_m(footprint)
  if (!isPolygonFootprint(footprint)) {
    return {
      xMin_m: cx + (footprint.xMin_m - cx) * factor,
      xMax_m: cx + (footprint.xMax_m - cx) * factor,
      yMin_m: cy + (footprint.yMin_m - cy) * factor,
      yMax_m: cy + (footprint.yMax_m - cy) * factor,
    }
  }
  return {
    polygon_m: footprint.polygon_m.map(
      ([x, y]) => [cx + (x - cx) * factor, cy + (y - cy) * factor] as [number, number],
    ),
  }
}

/**
 * Returns the horizontal distance in m from the footprint to the band |x| ≤ halfWidth_m around
 * the pipe axis (0 when the footprint reaches into the band).
 */
export function distanceToAxisBand_m(bounds: Bounds, halfWidth_m: number): number {
  if (bounds.xMin_m > halfWidth_m) return bounds.xMin_m - halfWidth_m
  if (bounds.xMax_m < -halfWidth_m) return -halfWidth_m - bounds.xMax_m
  return 0
}

/** Returns the horizontal distance in m from the footprint to the line x = lineX_m (0 if it crosses). */
export function distanceToLine_m(bounds: Bounds, lineX_m: number): number {
  if (bounds.xMin_m > lineX_m) return bounds.xMin_m - lineX_m
  if (bounds.xMax_m < lineX_m) return lineX_m - bounds.xMax_m
  return 0
}

/**
 * Returns the side of the pipe axis the footprint lies on: +1 (x > 0), −1 (x < 0), or 0 when it
 * reaches across the axis.
 */
export function sideOfAxis(bounds: Bounds): -1 | 0 | 1 {
  if (bounds.xMin_m > 0) return 1
  if (bounds.xMax_m < 0) return -1
  return 0
}

/**
 * Returns the [yMin_m, yMax_m] extent of the part of the footprint inside the band
 * |x| ≤ halfWidth_m, or null when the footprint does not reach the band. For a non-convex
 * polygon this is the extent of the clipped outline (conservative for span lengths).
 */
export function yExtentWithinAxisBand_m(
  footprint: Footprint,
  halfWidth_m: number,
): [number, number] | null {
  if (!isPolygonFootprint(footprint)) {
    if (footprint.xMax_m < -halfWidth_m || footprint.xMin_m > halfWidth_m) return null
    return [footprint.yMin_m, footprint.yMax_m]
  }
  let points = footprint.polygon_m.map(([x, y]) => [x, y] as [number, number])
  points = clipAgainstVerticalLine(points, -halfWidth_m, true)
  points = clipAgainstVerticalLine(points, halfWidth_m, false)
  if (points.length === 0) return null
  let yMin = Infinity
  let yMax = -Infinity
  for (const [, y] of points) {
    if (y < yMin) yMin = y
    if (y > yMax) yMax = y
  }
  return [yMin, yMax]
}

/** One Sutherland–Hodgman step: keeps the part with x ≥ lineX (keepRight) or x ≤ lineX. */
function clipAgainstVerticalLine(
  points: Array<[number, number]>,
  lineX: number,
  keepRight: boolean,
): Array<[number, number]> {
  const inside = (p: [number, number]): boolean => (keepRight ? p[0] >= lineX : p[0] <= lineX)
  const out: Array<[number, number]> = []
  for (let i = 0; i < points.length; i++) {
    const current = points[i] as [number, number]
    const previous = points[(i + points.length - 1) % points.length] as [number, number]
    const currentIn = inside(current)
    const previousIn = inside(previous)
    if (currentIn !== previousIn) {
      const t = (lineX - previous[0]) / (current[0] - previous[0])
      out.push([lineX, previous[1] + t * (current[1] - previous[1])])
    }
    if (currentIn) out.push(current)
  }
  return out
}

/** Returns the footprint of a rectangle as a polygon (counter-clockwise). */
export function rectangleAsPolygon(rectangle: RectangleFootprint): Array<[number, number]> {
  return [
    [rectangle.xMin_m, rectangle.yMin_m],
    [rectangle.xMax_m, rectangle.yMin_m],
    [rectangle.xMax_m, rectangle.yMax_m],
    [rectangle.xMin_m, rectangle.yMax_m],
  ]
}

/**
 * Returns true when the polygon is simple: no two non-adjacent edges touch or cross and no edge
 * has zero length. O(n²), meant for input validation.
 */
export function isSimplePolygon(vertices_m: ReadonlyArray<readonly [number, number]>): boolean {
  const n = vertices_m.length
  if (n < 3) return false
  for (let i = 0; i < n; i++) {
    const a = vertices_m[i] as readonly [number, number]
    const b = vertices_m[(i + 1) % n] as readonly [number, number]
    if (a[0] === b[0] && a[1] === b[1]) return false
    for (let j = i + 1; j < n; j++) {
      if ((j + 1) % n === i || (i + 1) % n === j) continue
      const c = vertices_m[j] as readonly [number, number]
      const d = vertices_m[(j + 1) % n] as readonly [number, number]
      if (segmentsIntersect(a, b, c, d)) return false
    }
  }
  return true
}

function orientation(
  a: readonly [number, number],
  b: readonly [number, number],
  c: readonly [number, number],
): number {
  const value = (b[0] - a[0]) * (c[1] - a[1]) - (b[1] - a[1]) * (c[0] - a[0])
  return value > 0 ? 1 : value < 0 ? -1 : 0
}

function onSegment(
  a: readonly [number, number],
  b: readonly [number, number],
  p: readonly [number, number],
): boolean {
  return (
    Math.min(a[0], b[0]) <= p[0] &&
    p[0] <= Math.max(a[0], b[0]) &&
    Math.min(a[1], b[1]) <= p[1] &&
    p[1] <= Math.max(a[1], b[1])
  )
}

function segmentsIntersect(
  a: readonly [number, number],
  b: readonly [number, number],
  c: readonly [number, number],
  d: readonly [number, number],
): boolean {
  const o1 = orientation(a, b, c)
  const o2 = orientation(a, b, d)
  const o3 = orientation(c, d, a)
  const o4 = orientation(c, d, b)
  if (o1 !== o2 && o3 !== o4) return true
  if (o1 === 0 && onSegment(a, b, c)) return true
  if (o2 === 0 && onSegment(a, b, d)) return true
  if (o3 === 0 && onSegment(c, d, a)) return true
  if (o4 === 0 && onSegment(c, d, b)) return true
  return false
}
