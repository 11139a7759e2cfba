import { describe, it, expect } from 'vitest'
import fc from 'fast-check'
import {
  siloFactor,
  soilPressureAtCrown_kPa,
  trenchActsAsEmbankment,
} from '../../../shared/statics/index.ts'
import { degToRad } from '../../../shared/units.ts'

// methods.md 0.1: coefficients from closed forms are checked to an absolute 5e-4 (4 printed decimals).
const COEFFICIENT_TOLERANCE = 5e-4

describe('siloFactor (Marston/Janssen silo reduction κ)', () => {
  // [C] computed from the formula: methods.md 2.2 check table, A127 κ with K1·tanδ = 0.5·tan(δ),
  // δ from the fill condition (A1: 2/3·φ', A2: 1/3·φ', A4: φ'); the δ rule itself is [M].
  const cases: Array<[phi_deg: number, deltaShare: number, hOverB: number, kappa: number]> = [
    [35, 2 / 3, 1, 0.8123],
    [35, 2 / 3, 2, 0.67],
    [35, 2 / 3, 3, 0.5609],
    [35, 2 / 3, 5, 0.41],
    [35, 1 / 3, 2, 0.8192],
    [35, 1, 2, 0.5381],
    [35, 1, 5, 0.277],
    [30, 2 / 3, 2, 0.7104],
    [20, 2 / 3, 3, 0.7157],
  ]
  for (const [phi, share, hOverB, expected] of cases) {
    it(`gives κ = ${expected} for φ' = ${phi}°, δ = ${share.toFixed(2)}·φ', h/b = ${hOverB} ([C] methods.md 2.2)`, () => {
      const kMu = 0.5 * Math.tan(degToRad(share * phi))
      expect(Math.abs(siloFactor(kMu, hOverB, 1) - expected)).toBeLessThanOrEqual(
        COEFFICIENT_TOLERANCE,
      )
    })
  }

  it("equals Marston C_d·B/H: Kμ' 0.165, H/B = 2 gives C_d 1.4641 ([C] methods.md 13 T2)", () => {
    expect(Math.abs(siloFactor(0.165, 2, 1) * 2 - 1.4641)).toBeLessThanOrEqual(
      COEFFICIENT_TOLERANCE,
    )
  })

  it('tends to 1 as H/B → 0 (limit of the closed form)', () => {
    expect(siloFactor(0.165, 1e-9, 1)).toBeCloseTo(1, 9)
    expect(siloFactor(0.165, 0.01, 1)).toBeGreaterThan(0.998)
    expect(siloFactor(0, 5, 1)).toBe(1)
  })

  it('is in (0, 1] and falls as the cover grows (property)', () => {
    fc.assert(
      fc.property(
        fc.double({ min: 0, max: 0.25, noNaN: true }),
        fc.double({ min: 0.1, max: 30, noNaN: true }),
        fc.double({ min: 0.2, max: 10, noNaN: true }),
        (kMu, cover, width) => {
          const k1 = siloFactor(kMu, cover, width)
          const k2 = siloFactor(kMu, cover * 1.5, width)
          return k1 > 0 && k1 <= 1 && k2 <= k1 + 1e-12
        },
      ),
    )
  })

  it('rejects bad input with a RangeError naming the parameter', () => {
    expect(() => siloFactor(-0.1, 1, 1)).toThrow(/wallFrictionKMu/)
    expect(() => siloFactor(0.1, Number.NaN, 1)).toThrow(RangeError)
    expect(() => siloFactor(0.1, 0, 1)).toThrow(/cover_m/)
    expect(() => siloFactor(0.1, 1, Infinity)).toThrow(/trenchWidth_m/)
  })
})

describe('soilPressureAtCrown_kPa', () => {
  it('is κ·γ·H: κ 1, γ 19 kN/m³, H 3 m gives 57 kPa ([C] methods.md 7.8 input)', () => {
    expect(soilPressureAtCrown_kPa(1, 19, 3)).toBeCloseTo(57, 10)
  })
  it('rejects a silo factor above 1', () => {
    expect(() => soilPressureAtCrown_kPa(1.2, 19, 3)).toThrow(/siloFactor/)
  })
})

describe('trenchActsAsEmbankment', () => {
  it('is true from 4 outside diameters (issue 3; A127 b ≥ 4·d_a [M], methods.md 2.3)', () => {
    expect(trenchActsAsEmbankment(1.6, 0.4)).toBe(true)
    expect(trenchActsAsEmbankment(1.59, 0.4)).toBe(false)
  })
})
