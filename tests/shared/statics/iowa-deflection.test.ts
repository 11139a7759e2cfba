import { describe, it, expect } from 'vitest'
import { iowaDeflection_pct } from '../../../shared/statics/index.ts'
import { KPA_PER_MPA, psiToKPa } from '../../../shared/units.ts'

// methods.md 0.1: closed-form values to 1e-3 relative.
const RELATIVE_TOLERANCE = 1e-3
const relative = (actual: number, expected: number): number =>
  Math.abs(actual - expected) / Math.abs(expected)

/** The single-term Iowa formula through the split form: everything permanent, one stiffness. */
function deflection(
  pressure_kPa: number,
  stiffness_kPa: number,
  sidefill_MPa: number,
  lag: number,
  k = 0.1,
): number {
  return iowaDeflection_pct({
    beddingConstant: k,
    lagFactor: lag,
    permanentPressure_kPa: pressure_kPa,
    transientPressure_kPa: 0,
    longTermRingStiffness_kPa: stiffness_kPa,
    shortTermRingStiffness_kPa: stiffness_kPa,
    sidefillModulus_MPa: sidefill_MPa,
  })
}

describe('iowaDeflection_pct (modified Iowa formula)', () => {
  // PVC, PS = 46 psi (E·I/r³ = 0.149·PS), prism load P = 8.333 psi, K 0.1 (methods.md 7.1 checks 7.4–7.7).
  const stiffness = psiToKPa(0.149 * 46)
  const pressure = psiToKPa(8.333)
  const ePrime = (psi: number): number => psiToKPa(psi) / KPA_PER_MPA

  it("gives 1.228 % with D_L 1.0, E' 1000 psi ([C] methods.md 7.1 check 7.4)", () => {
    expect(relative(deflection(pressure, stiffness, ePrime(1000), 1), 1.228)).toBeLessThanOrEqual(
      RELATIVE_TOLERANCE,
    )
  })
  it('gives 1.842 % with D_L 1.5 ([C] methods.md 7.1 check 7.5)', () => {
    expect(relative(deflection(pressure, stiffness, ePrime(1000), 1.5), 1.842)).toBeLessThanOrEqual(
      RELATIVE_TOLERANCE,
    )
  })
  it("gives 12.16 % with the sidefill removed, E' = 0 ([C] methods.md 7.1 check 7.6)", () => {
    expect(relative(deflection(pressure, stiffness, 0, 1), 12.16)).toBeLessThanOrEqual(
      RELATIVE_TOLERANCE,
    )
  })
  it("gives 6.56 % with D_L 1.5, E' 200 psi ([C] methods.md 7.1 check 7.7)", () => {
    expect(relative(deflection(pressure, stiffness, ePrime(200), 1.5), 6.56)).toBeLessThanOrEqual(
      RELATIVE_TOLERANCE,
    )
  })
  it("gives 8.906 / 3.815 / 2.428 / 1.176 % for SN 8, P 57 kPa, E' 0 / 1.4 / 2.8 / 6.9 MPa ([C] methods.md 7.1 check 7.8)", () => {
    const expected: Array<[number, number]> = [
      [0, 8.906],
      [1.4, 3.815],
      [2.8, 2.428],
      [6.9, 1.176],
    ]
    for (const [sidefill, value] of expected) {
      expect(relative(deflection(57, 64, sidefill, 1), value)).toBeLessThanOrEqual(
        RELATIVE_TOLERANCE,
      )
    }
  })
  it("adds 2.286 % for the crane pad of check 4.29 (53.68 kPa short-term) on SN 8, E' 2.8 MPa ([C] methods.md 7.1 check 7.9)", () => {
    const increment = iowaDeflection_pct({
      beddingConstant: 0.1,
      lagFactor: 1.5,
      permanentPressure_kPa: 0,
      transientPressure_kPa: 53.68,
      longTermRingStiffness_kPa: 64,
      shortTermRingStiffness_kPa: 64,
      sidefillModulus_MPa: 2.8,
    })
    expect(relative(increment, 2.286)).toBeLessThanOrEqual(RELATIVE_TOLERANCE)
  })
  it('applies the lag factor to the permanent part only and the short-term stiffness to the transient part', () => {
    const base = {
      beddingConstant: 0.096,
      lagFactor: 1.5,
      permanentPressure_kPa: 30,
      transientPressure_kPa: 20,
      longTermRingStiffness_kPa: 40,
      shortTermRingStiffness_kPa: 200,
      sidefillModulus_MPa: 5,
    }
    const soil = 0.061 * 5000
    const expected = 100 * 0.096 * ((1.5 * 30) / (40 + soil) + 20 / (200 + soil))
    expect(iowaDeflection_pct(base)).toBeCloseTo(expected, 12)
  })
  it('rejects a negative pressure naming the field', () => {
    expect(() =>
      iowaDeflection_pct({
        beddingConstant: 0.1,
        lagFactor: 1,
        permanentPressure_kPa: -1,
        transientPressure_kPa: 0,
        longTermRingStiffness_kPa: 64,
        shortTermRingStiffness_kPa: 64,
        sidefillModulus_MPa: 1,
      }),
    ).toThrow(/permanentPressure_kPa/)
  })
})
