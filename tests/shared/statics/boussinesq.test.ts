import { describe, it, expect } from 'vitest'
import fc from 'fast-check'
import { readFileSync } from 'node:fs'
import {
  boussinesqPointInfluenceFactor,
  boussinesqPointStress_kPa,
  circleCentreStress_kPa,
  newmarkCornerInfluenceFactor,
  polygonStress_kPa,
  rectangleStress_kPa,
  stripStress_kPa,
} from '../../../shared/statics/index.ts'

// methods.md 0.1 and the check tables of methods.md 4: influence factors are given to 5 decimals
// (absolute 1e-5); stresses from closed forms to 1e-3 relative.
const INFLUENCE_TOLERANCE = 1e-5
const FOUR_DECIMAL_TOLERANCE = 1e-4
const RELATIVE_TOLERANCE = 1e-3
// Issue 3: polygons must agree with the Newmark rectangle solution to 0.5 %.
const POLYGON_VS_RECTANGLE_TOLERANCE = 0.005

const relative = (actual: number, expected: number): number =>
  Math.abs(actual - expected) / Math.abs(expected)

describe('Boussinesq point load', () => {
  // [C] computed from the formula, methods.md 4.1 checks 4.1–4.4 (I_p at r/z = 0 is the classic 0.4775).
  const cases: Array<[number, number]> = [
    [0, 0.47746],
    [0.5, 0.27332],
    [1, 0.0844],
    [2, 0.00854],
  ]
  for (const [ratio, expected] of cases) {
    it(`gives I_p = ${expected} at r/z = ${ratio} ([C] methods.md 4.1)`, () => {
      expect(Math.abs(boussinesqPointInfluenceFactor(ratio) - expected)).toBeLessThanOrEqual(
        INFLUENCE_TOLERANCE,
      )
    })
  }
  it('gives 47.75 kPa under Q = 100 kN at z = 1 m ([C] methods.md 4.1 check 4.5)', () => {
    expect(relative(boussinesqPointStress_kPa(100, 0, 1), 47.75)).toBeLessThanOrEqual(
      RELATIVE_TOLERANCE,
    )
  })
  it('rejects a zero depth with a RangeError naming depth_m', () => {
    expect(() => boussinesqPointStress_kPa(100, 0, 0)).toThrow(/depth_m/)
  })
})

describe('Newmark corner influence factor', () => {
  // [C] computed from the formula, methods.md 4.2 checks 4.6–4.11 (4.6: chart value 0.1752 [M]).
  const cases: Array<[number, number, number]> = [
    [1, 1, 0.17522],
    [0.5, 0.5, 0.08403],
    [1, 2, 0.19994],
    [2, 2, 0.23247],
    [1, Infinity, 0.20458],
    [Infinity, Infinity, 0.25],
  ]
  for (const [m, n, expected] of cases) {
    it(`gives I(${m}, ${n}) = ${expected} ([C] methods.md 4.2)`, () => {
      expect(Math.abs(newmarkCornerInfluenceFactor(m, n) - expected)).toBeLessThanOrEqual(
        INFLUENCE_TOLERANCE,
      )
      expect(Math.abs(newmarkCornerInfluenceFactor(n, m) - expected)).toBeLessThanOrEqual(
        INFLUENCE_TOLERANCE,
      )
    })
  }
  it('handles the branch past V < m²n² (large m, n) continuously', () => {
    expect(newmarkCornerInfluenceFactor(10, 10)).toBeLessThan(0.25)
    expect(newmarkCornerInfluenceFactor(10, 10)).toBeGreaterThan(newmarkCornerInfluenceFactor(2, 2))
  })

  interface CsTable {
    cases: Array<{ id: string; dOver2H: number; mOver2H: number; cs: number; tolerance: number }>
  }
  const csTable = JSON.parse(
    readFileSync(
      new URL('../../fixtures/reference/pipe-load-coefficient-cs.json', import.meta.url),
      'utf8',
    ),
  ) as CsTable
  for (const row of csTable.cases) {
    it(`reproduces C_s = ${row.cs} (Moser & Folkman, Buried Pipe Design, 3rd ed., table p.36; methods.md ${row.id})`, () => {
      const cs = 4 * newmarkCornerInfluenceFactor(row.dOver2H, row.mOver2H)
      // Tolerance: ±1 in the last printed digit (±2 in the table's last column, 4.16).
      expect(Math.abs(cs - row.cs)).toBeLessThanOrEqual(row.tolerance + 1e-12)
    })
  }
})

describe('rectangleStress_kPa (Newmark with signed superposition)', () => {
  it('gives 53.68 kPa under a 300 kN outrigger on a 1 m mat at 1.5 m ([C] methods.md 4.6 check 4.29)', () => {
    const mat = { xMin_m: -0.5, xMax_m: 0.5, yMin_m: -0.5, yMax_m: 0.5 }
    expect(relative(rectangleStress_kPa(300, mat, 0, 0, 1.5), 53.68)).toBeLessThanOrEqual(
      RELATIVE_TOLERANCE,
    )
  })
  it('gives 11.96 kPa 1.5 m beside the mat centre (point outside the area) ([C] methods.md 4.6 check 4.30)', () => {
    const mat = { xMin_m: 1, xMax_m: 2, yMin_m: -0.5, yMax_m: 0.5 }
    expect(relative(rectangleStress_kPa(300, mat, 0, 0, 1.5), 11.96)).toBeLessThanOrEqual(
      RELATIVE_TOLERANCE,
    )
  })
  it('gives 67.14 / 225.89 kPa under an LM1 wheel 150 kN on 0.40 × 0.40 m at z 1.0 / 0.5 m ([C] methods.md 4.5 checks 4.24, 4.25)', () => {
    const patch = { xMin_m: -0.2, xMax_m: 0.2, yMin_m: -0.2, yMax_m: 0.2 }
    const q = 150 / 0.16
    expect(relative(rectangleStress_kPa(q, patch, 0, 0, 1), 67.14)).toBeLessThanOrEqual(
      RELATIVE_TOLERANCE,
    )
    expect(relative(rectangleStress_kPa(q, patch, 0, 0, 0.5), 225.89)).toBeLessThanOrEqual(
      RELATIVE_TOLERANCE,
    )
    // The point-load approximation of the same checks: 71.62 kPa at 1.0 m ([C] methods.md 4.24).
    expect(relative(boussinesqPointStress_kPa(150, 0, 1), 71.62)).toBeLessThanOrEqual(
      RELATIVE_TOLERANCE,
    )
  })
  it('gives 31.87 kPa under an HS20 wheel 71.2 kN on 0.508 × 0.254 m at 1 m ([C] methods.md 4.5 check 4.26)', () => {
    const patch = { xMin_m: -0.254, xMax_m: 0.254, yMin_m: -0.127, yMax_m: 0.127 }
    expect(
      relative(rectangleStress_kPa(71.2 / (0.508 * 0.254), patch, 0, 0, 1), 31.87),
    ).toBeLessThanOrEqual(RELATIVE_TOLERANCE)
  })
  it('tends to zero far from the load (limit case)', () => {
    const mat = { xMin_m: 1000, xMax_m: 1001, yMin_m: -0.5, yMax_m: 0.5 }
    expect(rectangleStress_kPa(300, mat, 0, 0, 1.5)).toBeLessThan(1e-9)
  })
  it('tends to q under a very large area (limit case, I(∞, ∞) = 0.25 per quadrant)', () => {
    const big = { xMin_m: -500, xMax_m: 500, yMin_m: -500, yMax_m: 500 }
    expect(rectangleStress_kPa(40, big, 0, 0, 2)).toBeCloseTo(40, 3)
  })
  it('never rises when the load moves away across the pipe (property)', () => {
    fc.assert(
      fc.property(
        fc.double({ min: 0, max: 20, noNaN: true }),
        fc.double({ min: 0.01, max: 5, noNaN: true }),
        fc.double({ min: 0.2, max: 4, noNaN: true }),
        fc.double({ min: 0.3, max: 6, noNaN: true }),
        (offset, extra, size, depth) => {
          const at = (x: number) => ({
            xMin_m: x,
            xMax_m: x + size,
            yMin_m: -size / 2,
            yMax_m: size / 2,
          })
          const near = rectangleStress_kPa(100, at(offset), 0, 0, depth)
          const far = rectangleStress_kPa(100, at(offset + extra), 0, 0, depth)
          return Number.isFinite(near) && far <= near * (1 + 1e-12)
        },
      ),
    )
  })
})

describe('polygonStress_kPa (exact integration over the polygon)', () => {
  it('agrees with Newmark rectangles to 0.5 % for any rectangle and point (property; issue 3)', () => {
    fc.assert(
      fc.property(
        fc.double({ min: -10, max: 10, noNaN: true }),
        fc.double({ min: -10, max: 10, noNaN: true }),
        fc.double({ min: 0.1, max: 8, noNaN: true }),
        fc.double({ min: 0.1, max: 8, noNaN: true }),
        fc.double({ min: 0.1, max: 8, noNaN: true }),
        fc.boolean(),
        (x0, y0, width, length, depth, clockwise) => {
          const rectangle = { xMin_m: x0, xMax_m: x0 + width, yMin_m: y0, yMax_m: y0 + length }
          const corners: Array<[number, number]> = [
            [x0, y0],
            [x0 + width, y0],
            [x0 + width, y0 + length],
            [x0, y0 + length],
          ]
          const polygon = clockwise ? [...corners].reverse() : corners
          const exact = rectangleStress_kPa(50, rectangle, 0, 0, depth)
          const value = polygonStress_kPa(50, polygon, 0, 0, depth)
          // Far from the load both are tiny; compare absolutely there (1e-9 kPa).
          return Math.abs(value - exact) <= Math.max(POLYGON_VS_RECTANGLE_TOLERANCE * exact, 1e-9)
        },
      ),
    )
  })
  it('handles a non-convex L-shape as the sum of its two rectangles', () => {
    const lShape: Array<[number, number]> = [
      [0, 0],
      [3, 0],
      [3, 1],
      [1, 1],
      [1, 4],
      [0, 4],
    ]
    for (const [x, y] of [
      [0.5, 0.5],
      [2, 2],
      [-1, 3],
      [1, 1],
    ] as Array<[number, number]>) {
      const parts =
        rectangleStress_kPa(20, { xMin_m: 0, xMax_m: 3, yMin_m: 0, yMax_m: 1 }, x, y, 1.2) +
        rectangleStress_kPa(20, { xMin_m: 0, xMax_m: 1, yMin_m: 1, yMax_m: 4 }, x, y, 1.2)
      expect(relative(polygonStress_kPa(20, lShape, x, y, 1.2), parts)).toBeLessThanOrEqual(1e-9)
    }
  })
  it('approaches the circular-area formula for a 720-gon: a/z = 1, 0.5, 2 give 0.6464, 0.2845, 0.9106 ([C] methods.md 4.2)', () => {
    for (const [radius, expected] of [
      [1, 0.6464],
      [0.5, 0.2845],
      [2, 0.9106],
    ] as Array<[number, number]>) {
      const polygon: Array<[number, number]> = []
      for (let i = 0; i < 720; i++) {
        polygon.push([
          radius * Math.cos((2 * Math.PI * i) / 720),
          radius * Math.sin((2 * Math.PI * i) / 720),
        ])
      }
      expect(Math.abs(circleCentreStress_kPa(1, radius, 1) - expected)).toBeLessThanOrEqual(
        FOUR_DECIMAL_TOLERANCE,
      )
      // An inscribed 720-gon has 0.001 % less area than the circle; 1e-4 absolute covers it.
      expect(Math.abs(polygonStress_kPa(1, polygon, 0, 0, 1) - expected)).toBeLessThanOrEqual(
        FOUR_DECIMAL_TOLERANCE,
      )
    }
  })
  it('gives 32.25 kPa under the centre of a 4 m wide, 36 kPa stockpile at 1.5 m ([C] methods.md 4.6 check 4.31)', () => {
    const strip: Array<[number, number]> = [
      [-2, -2000],
      [2, -2000],
      [2, 2000],
      [-2, 2000],
    ]
    expect(relative(polygonStress_kPa(36, strip, 0, 0, 1.5), 32.25)).toBeLessThanOrEqual(
      RELATIVE_TOLERANCE,
    )
  })
  it('is finite and non-negative for any point, inside, on the edge or outside (property)', () => {
    const triangle: Array<[number, number]> = [
      [0, 0],
      [4, 0],
      [1, 3],
    ]
    fc.assert(
      fc.property(
        fc.double({ min: -20, max: 20, noNaN: true }),
        fc.double({ min: -20, max: 20, noNaN: true }),
        fc.double({ min: 0.05, max: 30, noNaN: true }),
        (x, y, depth) => {
          const value = polygonStress_kPa(100, triangle, x, y, depth)
          return Number.isFinite(value) && value >= 0 && value <= 100 * (1 + 1e-9)
        },
      ),
    )
    // On a vertex and on an edge.
    expect(Number.isFinite(polygonStress_kPa(100, triangle, 0, 0, 1))).toBe(true)
    expect(polygonStress_kPa(100, triangle, 2, 0, 1)).toBeGreaterThan(0)
  })
  it('rejects fewer than three vertices', () => {
    expect(() =>
      polygonStress_kPa(
        1,
        [
          [0, 0],
          [1, 1],
        ],
        0,
        0,
        1,
      ),
    ).toThrow(/vertices_m/)
  })
})

describe('stripStress_kPa', () => {
  // [C] computed from the formula, methods.md 4.3 checks 4.17–4.19 (4.17: textbook table 0.550 [M]).
  it('gives 0.5498 / 0.8183 of q under the centre at B/z = 1 / 2, and 0.4092 under the edge at B/z = 1', () => {
    expect(Math.abs(stripStress_kPa(1, 1, 0, 1) - 0.5498)).toBeLessThanOrEqual(
      FOUR_DECIMAL_TOLERANCE,
    )
    expect(Math.abs(stripStress_kPa(1, 2, 0, 1) - 0.8183)).toBeLessThanOrEqual(
      FOUR_DECIMAL_TOLERANCE,
    )
    expect(Math.abs(stripStress_kPa(1, 1, 0.5, 1) - 0.4092)).toBeLessThanOrEqual(
      FOUR_DECIMAL_TOLERANCE,
    )
  })
  it('gives 32.25 kPa for the stockpile of check 4.31 ([C] methods.md 4.6)', () => {
    expect(relative(stripStress_kPa(36, 4, 0, 1.5), 32.25)).toBeLessThanOrEqual(RELATIVE_TOLERANCE)
  })
})
