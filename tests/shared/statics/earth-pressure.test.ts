import { describe, it, expect } from 'vitest'
import {
  activeWedgeAngle_deg,
  activeWedgeReach_m,
  atRestCoefficient,
  rankineActiveCoefficient,
  rankinePassiveCoefficient,
} from '../../../shared/statics/index.ts'

// methods.md 5: coefficients printed to 4 decimals (absolute 1e-4); distances to 1e-3 m.
const COEFFICIENT_TOLERANCE = 1e-4
const DISTANCE_TOLERANCE_m = 1e-3

describe('earth pressure coefficients (Rankine 1857; Jaky 1944)', () => {
  // [C] computed from the formulas, methods.md 5 checks 5.1–5.4.
  const rows: Array<[phi: number, k0: number, ka: number, kp: number, theta: number]> = [
    [20, 0.658, 0.4903, 2.0396, 55],
    [25, 0.5774, 0.4059, 2.4639, 57.5],
    [30, 0.5, 0.3333, 3, 60],
    [35, 0.4264, 0.271, 3.6902, 62.5],
  ]
  for (const [phi, k0, ka, kp, theta] of rows) {
    it(`gives K0 ${k0}, Ka ${ka}, Kp ${kp}, θ_a ${theta}° for φ' = ${phi}° ([C] methods.md 5)`, () => {
      expect(Math.abs(atRestCoefficient(phi) - k0)).toBeLessThanOrEqual(COEFFICIENT_TOLERANCE)
      expect(Math.abs(rankineActiveCoefficient(phi) - ka)).toBeLessThanOrEqual(
        COEFFICIENT_TOLERANCE,
      )
      expect(Math.abs(rankinePassiveCoefficient(phi) - kp)).toBeLessThanOrEqual(
        COEFFICIENT_TOLERANCE,
      )
      expect(activeWedgeAngle_deg(phi)).toBeCloseTo(theta, 12)
    })
  }
  it('rejects a friction angle outside [0, 60]° naming the parameter', () => {
    expect(() => rankineActiveCoefficient(75)).toThrow(/frictionAngle_deg/)
    expect(() => atRestCoefficient(Number.NaN)).toThrow(RangeError)
  })
})

describe('activeWedgeReach_m', () => {
  it("reaches 1.155 m for a floor 2.0 m below the invert, φ' = 30° ([C] methods.md 5 check 5.5)", () => {
    expect(Math.abs(activeWedgeReach_m(2, 30) - 1.155)).toBeLessThanOrEqual(DISTANCE_TOLERANCE_m)
  })
  it("reaches 1.274 m / 1.041 m for φ' = 25° / 35° ([C] methods.md 5 check 5.6)", () => {
    expect(Math.abs(activeWedgeReach_m(2, 25) - 1.274)).toBeLessThanOrEqual(DISTANCE_TOLERANCE_m)
    expect(Math.abs(activeWedgeReach_m(2, 35) - 1.041)).toBeLessThanOrEqual(DISTANCE_TOLERANCE_m)
  })
  it("reaches 2.000 m with a 45° line (φ' = 0) ([C] methods.md 5 check 5.7)", () => {
    expect(activeWedgeReach_m(2, 0)).toBeCloseTo(2, 12)
  })
  it('is zero for a zero height and rejects a negative one', () => {
    expect(activeWedgeReach_m(0, 30)).toBe(0)
    expect(() => activeWedgeReach_m(-1, 30)).toThrow(/height_m/)
  })
})
