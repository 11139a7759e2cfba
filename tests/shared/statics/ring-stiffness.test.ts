import { describe, it, expect } from 'vitest'
import {
  meanRadius_m,
  pipeStiffnessFromSN_kPa,
  ringStiffness_kPa,
  ringStiffnessSN_kPa,
  wallSecondMoment_m4_per_m,
} from '../../../shared/statics/index.ts'
import { kPaToPsi } from '../../../shared/units.ts'

// methods.md 0.1: closed-form values to 1e-3 relative.
const RELATIVE_TOLERANCE = 1e-3
const relative = (actual: number, expected: number): number =>
  Math.abs(actual - expected) / Math.abs(expected)

describe('ring stiffness', () => {
  it('gives S_R = E/12·(s/r)³ = 15.03 N/mm² for concrete, s 80 mm, r_m 440 mm ([C] methods.md 3.1 check 3.2)', () => {
    // D = 2·r_m + s = 0.96 m, t = 0.08 m.
    expect(meanRadius_m(0.96, 0.08)).toBeCloseTo(0.44, 12)
    expect(relative(ringStiffness_kPa(30_000, 0.96, 0.08), 15_030)).toBeLessThanOrEqual(
      RELATIVE_TOLERANCE,
    )
  })
  it('relates SN and E·I/r³ by a factor 8 (S_R = 8·SN, [C] methods.md 7.3)', () => {
    expect(ringStiffnessSN_kPa(1000, 0.4, 0.024) * 8).toBeCloseTo(
      ringStiffness_kPa(1000, 0.4, 0.024),
      9,
    )
    expect(wallSecondMoment_m4_per_m(0.024)).toBeCloseTo(0.024 ** 3 / 12, 15)
  })
  it('gives PS 430.2 kPa = 62.39 psi for SN 8 kN/m² ([C] methods.md 7.3 check 7.1)', () => {
    expect(relative(pipeStiffnessFromSN_kPa(8), 430.2)).toBeLessThanOrEqual(RELATIVE_TOLERANCE)
    expect(relative(kPaToPsi(pipeStiffnessFromSN_kPa(8)), 62.39)).toBeLessThanOrEqual(
      RELATIVE_TOLERANCE,
    )
  })
  it('gives PS 215.1 / 107.5 / 860.3 kPa for SN 4 / 2 / 16 ([C] methods.md 7.3 check 7.2)', () => {
    expect(relative(pipeStiffnessFromSN_kPa(4), 215.1)).toBeLessThanOrEqual(RELATIVE_TOLERANCE)
    expect(relative(pipeStiffnessFromSN_kPa(2), 107.5)).toBeLessThanOrEqual(RELATIVE_TOLERANCE)
    expect(relative(pipeStiffnessFromSN_kPa(16), 860.3)).toBeLessThanOrEqual(RELATIVE_TOLERANCE)
  })
  it('rejects a wall as thick as the radius, naming wallThickness_m', () => {
    expect(() => ringStiffness_kPa(1000, 0.4, 0.2)).toThrow(/wallThickness_m/)
    expect(() => ringStiffness_kPa(0, 0.4, 0.02)).toThrow(/modulus_MPa/)
  })
})
