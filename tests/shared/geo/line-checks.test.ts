import { describe, expect, it } from 'vitest'
import {
  findSelfIntersection,
  polylineLength,
  withoutRepeatedPositions,
} from '../../../shared/geo/line-checks.ts'

describe('polylineLength', () => {
  it('sums the straight pieces (3-4-5 triangles)', () => {
    expect(
      polylineLength([
        [0, 0],
        [3, 4],
        [6, 8],
      ]),
    ).toBeCloseTo(10, 12)
    expect(polylineLength([[1, 1]])).toBe(0)
  })
})

describe('withoutRepeatedPositions', () => {
  it('drops consecutive duplicates within the tolerance and keeps the rest', () => {
    expect(
      withoutRepeatedPositions(
        [
          [0, 0],
          [0, 0],
          [1, 0],
          [1.0005, 0],
          [2, 0],
        ],
        0.001,
      ),
    ).toEqual([
      [0, 0],
      [1, 0],
      [2, 0],
    ])
  })
})

describe('findSelfIntersection', () => {
  it('accepts a simple zig-zag', () => {
    expect(
      findSelfIntersection([
        [0, 0],
        [10, 0],
        [10, 10],
        [20, 10],
      ]),
    ).toBeNull()
  })
  it('finds a figure-of-eight crossing', () => {
    expect(
      findSelfIntersection([
        [0, 0],
        [10, 10],
        [10, 0],
        [0, 10],
      ]),
    ).toEqual({ pieceA: 0, pieceB: 2 })
  })
  it('finds a line that folds straight back on itself', () => {
    expect(
      findSelfIntersection([
        [0, 0],
        [10, 0],
        [5, 0],
      ]),
    ).toEqual({ pieceA: 0, pieceB: 1 })
  })
  it('finds a line whose end returns to its start', () => {
    expect(
      findSelfIntersection([
        [0, 0],
        [10, 0],
        [10, 10],
        [0, 0],
      ]),
    ).not.toBeNull()
  })
  it('finds a later piece touching an earlier vertex', () => {
    expect(
      findSelfIntersection([
        [0, 0],
        [10, 0],
        [10, 5],
        [5, 5],
        [5, 0],
      ]),
    ).toEqual({ pieceA: 0, pieceB: 3 })
  })
})
