import { describe, expect, it } from 'vitest'
import fc from 'fast-check'
import {
  fromPieceLocal,
  matRectangle,
  pieceToRingDistance_m,
  pipePieces,
  ringToPieceLocal,
  toPieceLocal,
} from '../../../shared/geo/pipe-local-frame.ts'

// Plain plane geometry: every expected value below follows from the definitions by hand
// (common practice for coordinate rotations; no published table needed).
const TOLERANCE_M = 1e-9 // rounding only

describe('pipePieces', () => {
  it('splits a polyline into straight pieces with unit directions and lengths', () => {
    const pieces = pipePieces([
      [0, 0],
      [3, 4],
      [3, 4.0000001],
      [3, 10],
    ])
    expect(pieces.map((p) => p.index)).toEqual([0, 2])
    expect(pieces[0]!.length_m).toBeCloseTo(5, 12)
    expect(pieces[0]!.ux).toBeCloseTo(0.6, 12)
    expect(pieces[0]!.uy).toBeCloseTo(0.8, 12)
  })
})

describe('toPieceLocal', () => {
  const [east] = pipePieces([
    [100, 200],
    [110, 200],
  ])

  it('puts y along the pipe and x positive to the left', () => {
    expect(toPieceLocal(east!, [105, 203])).toEqual([3, 5])
    expect(toPieceLocal(east!, [95, 198])).toEqual([-2, -5])
  })

  it('round-trips through fromPieceLocal for any piece and point', () => {
    fc.assert(
      fc.property(
        fc.tuple(
          fc.double({ min: -1e4, max: 1e4, noNaN: true }),
          fc.double({ min: -1e4, max: 1e4, noNaN: true }),
        ),
        fc.double({ min: 0, max: 2 * Math.PI, noNaN: true }),
        fc.tuple(
          fc.double({ min: -500, max: 500, noNaN: true }),
          fc.double({ min: -500, max: 500, noNaN: true }),
        ),
        (start, angle, local) => {
          const [piece] = pipePieces([
            start,
            [start[0] + 50 * Math.cos(angle), start[1] + 50 * Math.sin(angle)],
          ])
          const back = toPieceLocal(piece!, fromPieceLocal(piece!, local))
          expect(Math.abs(back[0] - local[0])).toBeLessThan(1e-6)
          expect(Math.abs(back[1] - local[1])).toBeLessThan(1e-6)
        },
      ),
    )
  })

  it('keeps distances (a rotation plus a shift)', () => {
    const [diag] = pipePieces([
      [0, 0],
      [1, 1],
    ])
    const a = toPieceLocal(diag!, [2, 0])
    const b = toPieceLocal(diag!, [0, 2])
    expect(Math.abs(Math.hypot(a[0] - b[0], a[1] - b[1]) - Math.hypot(2, 2))).toBeLessThan(
      TOLERANCE_M,
    )
    // (2, 0) lies to the right of a pipe running north-east, (0, 2) to its left.
    expect(a[0]).toBeLessThan(0)
    expect(b[0]).toBeGreaterThan(0)
  })
})

describe('ringToPieceLocal and matRectangle', () => {
  it('drops the closing point and maps each corner', () => {
    const [north] = pipePieces([
      [0, 0],
      [0, 10],
    ])
    const local = ringToPieceLocal(north!, [
      [1, 1],
      [2, 1],
      [2, 2],
      [1, 1],
    ])
    // Heading north, east is on the right (negative x); y is the northing.
    expect(local).toEqual([
      [-1, 1],
      [-2, 1],
      [-2, 2],
    ])
  })

  it('builds a mat of the given size, with its long side turned clockwise from north', () => {
    const mat = matRectangle([10, 10], 4, 2, 90)
    const xs = mat.map((p) => p[0])
    const ys = mat.map((p) => p[1])
    expect(Math.max(...xs) - Math.min(...xs)).toBeCloseTo(4, 9)
    expect(Math.max(...ys) - Math.min(...ys)).toBeCloseTo(2, 9)
  })
})

describe('pieceToRingDistance_m', () => {
  const [piece] = pipePieces([
    [0, 0],
    [10, 0],
  ])
  it('is the gap between the pipe and the nearest edge', () => {
    expect(
      pieceToRingDistance_m(piece!, [
        [2, 3],
        [4, 3],
        [4, 5],
        [2, 5],
      ]),
    ).toBeCloseTo(3, 12)
  })
  it('is zero when the outline crosses the pipe', () => {
    expect(
      pieceToRingDistance_m(piece!, [
        [2, -1],
        [4, -1],
        [4, 1],
        [2, 1],
      ]),
    ).toBe(0)
  })
})
