/**
 * The statics engine works in a pipe-local plan frame: `y` along the pipe axis, `x` across it,
 * in metres. A stored pipe segment is a polyline in the projected CRS; each straight piece of
 * it gets its own frame: origin at the piece's start, `y` towards its end, `x` positive to the
 * left of the direction of travel (a right-handed frame seen from above).
 *
 * Source: plane rotation of coordinates (elementary analytic geometry).
 */
import type { XY } from './planar-distance.ts'
import {
  pointToSegmentDistance,
  segmentToSegmentDistance,
  pointInPolygon,
} from './planar-distance.ts'

/** One straight piece of a pipe polyline, with its frame. */
export interface PipePiece {
  /** Index of the piece within the polyline (0 = from the first vertex). */
  index: number
  start: readonly [number, number]
  end: readonly [number, number]
  length_m: number
  /** Unit vector along the piece. */
  ux: number
  uy: number
}

/** The straight pieces of a polyline; pieces shorter than 1 mm are skipped. */
export function pipePieces(line: readonly XY[]): PipePiece[] {
  const pieces: PipePiece[] = []
  for (let i = 0; i + 1 < line.length; i++) {
    const a = line[i]!
    const b = line[i + 1]!
    const dx = (b[0] as number) - (a[0] as number)
    const dy = (b[1] as number) - (a[1] as number)
    const length_m = Math.hypot(dx, dy)
    if (length_m < 1e-3) continue
    pieces.push({
      index: i,
      start: [a[0] as number, a[1] as number],
      end: [b[0] as number, b[1] as number],
      length_m,
      ux: dx / length_m,
      uy: dy / length_m,
    })
  }
  return pieces
}

/** A grid point in the piece's local frame: [x_m across (left positive), y_m along]. */
export function toPieceLocal(piece: PipePiece, p: XY): [number, number] {
  const rx = (p[0] as number) - piece.start[0]
  const ry = (p[1] as number) - piece.start[1]
  const y_m = rx * piece.ux + ry * piece.uy
  const x_m = -rx * piece.uy + ry * piece.ux
  return [x_m, y_m]
}

/** A local-frame point back in grid coordinates (inverse of toPieceLocal). */
export function fromPieceLocal(
  piece: PipePiece,
  local: readonly [number, number],
): [number, number] {
  const [x_m, y_m] = local
  return [
    piece.start[0] + y_m * piece.ux - x_m * piece.uy,
    piece.start[1] + y_m * piece.uy + x_m * piece.ux,
  ]
}

/** An open ring (no repeated closing point) in the piece's local frame. */
export function ringToPieceLocal(piece: PipePiece, ring: readonly XY[]): [number, number][] {
  const open =
    ring.length > 1 && samePoint(ring[0]!, ring[ring.length - 1]!) ? ring.slice(0, -1) : ring
  return open.map((p) => toPieceLocal(piece, p))
}

const samePoint = (a: XY, b: XY) => a[0] === b[0] && a[1] === b[1]

/**
 * Rectangle of a crane mat (or any pad) in grid coordinates, as an open ring: centred on
 * `centre`, `length_m` along a direction `rotation_deg` clockwise from grid north, `width_m`
 * across it.
 */
export function matRectangle(
  centre: XY,
  length_m: number,
  width_m: number,
  rotation_deg: number,
): [number, number][] {
  const a = (rotation_deg * Math.PI) / 180
  // Grid north is +y; clockwise rotation by a gives the direction (sin a, cos a).
  const lx = Math.sin(a)
  const ly = Math.cos(a)
  const wx = ly
  const wy = -lx
  const hl = length_m / 2
  const hw = width_m / 2
  const cx = centre[0] as number
  const cy = centre[1] as number
  return [
    [cx - hl * lx - hw * wx, cy - hl * ly - hw * wy],
    [cx + hl * lx - hw * wx, cy + hl * ly - hw * wy],
    [cx + hl * lx + hw * wx, cy + hl * ly + hw * wy],
    [cx - hl * lx + hw * wx, cy - hl * ly + hw * wy],
  ]
}

/** Shortest plan distance between a straight pipe piece and an open or closed ring (0 inside). */
export function pieceToRingDistance_m(piece: PipePiece, ring: readonly XY[]): number {
  if (pointInPolygon(piece.start, [ring]) || pointInPolygon(piece.end, [ring])) return 0
  let best = Infinity
  for (let i = 0; i < ring.length; i++) {
    const a = ring[i]!
    const b = ring[(i + 1) % ring.length]!
    best = Math.min(best, segmentToSegmentDistance(piece.start, piece.end, a, b))
    if (best === 0) return 0
  }
  return best
}

/** Shortest plan distance between a straight pipe piece and a point. */
export function pieceToPointDistance_m(piece: PipePiece, p: XY): number {
  return pointToSegmentDistance(p, piece.start, piece.end)
}
