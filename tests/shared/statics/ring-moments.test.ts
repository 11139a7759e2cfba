import { describe, it, expect } from 'vitest'
import {
  HORIZONTAL_PRESSURE_MOMENT_COEFFICIENTS,
  maxRingBendingStress_MPa,
  ringMoments_kNm_per_m,
  theoreticalBeddingFactor,
  twoLineLoadMomentCoefficients,
  verticalLoadMomentCoefficients,
} from '../../../shared/statics/index.ts'

// methods.md 6: two-load coefficients to 1e-5; 180° values to 1e-4; other bedding angles to 5e-4.
const TWO_LOAD_TOLERANCE = 1e-5
const EXACT_TOLERANCE = 1e-4
const BEDDING_TOLERANCE = 5e-4
// Theoretical bedding factors are printed to 2 decimals (±0.005).
const FACTOR_TOLERANCE = 0.005

describe('ring under two line loads (Roark, 7th ed., Table 9.2 [M], re-derived [C])', () => {
  it('gives +0.31831·P·r at the loads and −0.18169·P·r at the springline ([C] methods.md 6 check 6.1)', () => {
    const m = twoLineLoadMomentCoefficients()
    expect(Math.abs(m.loadPoint - 0.31831)).toBeLessThanOrEqual(TWO_LOAD_TOLERANCE)
    expect(Math.abs(m.springline + 0.18169)).toBeLessThanOrEqual(TWO_LOAD_TOLERANCE)
  })
})

describe('verticalLoadMomentCoefficients (thin ring, bedding angle 2α)', () => {
  it('gives crown = invert = +0.2500, springline −0.2500 for 180° ([C] methods.md 6 check 6.3)', () => {
    const m = verticalLoadMomentCoefficients(180)
    expect(Math.abs(m.crown - 0.25)).toBeLessThanOrEqual(EXACT_TOLERANCE)
    expect(Math.abs(m.springline + 0.25)).toBeLessThanOrEqual(EXACT_TOLERANCE)
    expect(Math.abs(m.invert - 0.25)).toBeLessThanOrEqual(EXACT_TOLERANCE)
  })
  // [C] methods.md 6.2 table and checks 6.4, 6.5 (A127 values as remembered [M]).
  const rows: Array<[angle: number, crown: number, springline: number, invert: number]> = [
    [20, 0.2978, -0.3051, 0.5053],
    [60, 0.2863, -0.2932, 0.377],
    [90, 0.2736, -0.2794, 0.314],
    [120, 0.2615, -0.2651, 0.2755],
  ]
  for (const [angle, crown, springline, invert] of rows) {
    it(`gives crown ${crown}, springline ${springline}, invert ${invert} for ${angle}° ([C] methods.md 6.2)`, () => {
      const m = verticalLoadMomentCoefficients(angle)
      expect(Math.abs(m.crown - crown)).toBeLessThanOrEqual(BEDDING_TOLERANCE)
      expect(Math.abs(m.springline - springline)).toBeLessThanOrEqual(BEDDING_TOLERANCE)
      expect(Math.abs(m.invert - invert)).toBeLessThanOrEqual(BEDDING_TOLERANCE)
    })
  }
  it('raises the invert moment by 37 % from 120° to 60° bedding ([C] methods.md 6, loss of haunch support)', () => {
    const ratio =
      verticalLoadMomentCoefficients(60).invert / verticalLoadMomentCoefficients(120).invert
    expect(ratio).toBeCloseTo(1.37, 2)
  })
  it('stays finite for a line support (0°)', () => {
    const m = verticalLoadMomentCoefficients(0)
    expect(Number.isFinite(m.invert)).toBe(true)
    expect(m.invert).toBeGreaterThan(verticalLoadMomentCoefficients(20).invert)
  })
})

describe('ringMoments_kNm_per_m with lateral pressure', () => {
  it('halves the 180° crown moment at K = 0.5: 0.1250 ([C] methods.md 6 check 6.9)', () => {
    const m = ringMoments_kNm_per_m(1, 0.5, 1, 180)
    expect(Math.abs(m.crown - 0.125)).toBeLessThanOrEqual(EXACT_TOLERANCE)
  })
  it('gives crown 0.1365, springline −0.1401, invert 0.1505 for 120° at K = 0.5 ([C] methods.md 6 check 6.10)', () => {
    const m = ringMoments_kNm_per_m(1, 0.5, 1, 120)
    expect(Math.abs(m.crown - 0.1365)).toBeLessThanOrEqual(BEDDING_TOLERANCE)
    expect(Math.abs(m.springline + 0.1401)).toBeLessThanOrEqual(BEDDING_TOLERANCE)
    expect(Math.abs(m.invert - 0.1505)).toBeLessThanOrEqual(BEDDING_TOLERANCE)
  })
  it('vanishes under isotropic pressure q_h = q_v with full (180°) support (limit case, methods.md 6.2)', () => {
    const m = ringMoments_kNm_per_m(80, 80, 0.4, 180)
    expect(Math.abs(m.crown)).toBeLessThan(1e-12)
    expect(Math.abs(m.springline)).toBeLessThan(1e-12)
    expect(Math.abs(m.invert)).toBeLessThan(1e-12)
    expect(HORIZONTAL_PRESSURE_MOMENT_COEFFICIENTS.crown).toBe(-0.25)
  })
  it('converts the largest moment to a wall stress 6·|M|/t²', () => {
    // 1 kN·m/m on a 0.1 m wall: 6·1/0.01 = 600 kPa = 0.6 MPa ([C] computed from the formula).
    expect(maxRingBendingStress_MPa({ crown: 1, springline: -0.5, invert: 0.2 }, 0.1)).toBeCloseTo(
      0.6,
      12,
    )
  })
})

describe('theoreticalBeddingFactor', () => {
  it('gives 1.69, 2.03, 2.31, 2.55 for 60°, 90°, 120°, 180° ([C] methods.md 6.3)', () => {
    expect(Math.abs(theoreticalBeddingFactor(60) - 1.69)).toBeLessThanOrEqual(FACTOR_TOLERANCE)
    expect(Math.abs(theoreticalBeddingFactor(90) - 2.03)).toBeLessThanOrEqual(FACTOR_TOLERANCE)
    expect(Math.abs(theoreticalBeddingFactor(120) - 2.31)).toBeLessThanOrEqual(FACTOR_TOLERANCE)
    expect(Math.abs(theoreticalBeddingFactor(180) - 2.55)).toBeLessThanOrEqual(FACTOR_TOLERANCE)
  })
})
