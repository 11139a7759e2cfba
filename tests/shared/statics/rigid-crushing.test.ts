import { describe, it, expect } from 'vitest'
import {
  crushingCapacity_kN_per_m,
  dLoad_kN_per_m_per_m,
  requiredThreeEdgeBearingStrength_kN_per_m,
} from '../../../shared/statics/index.ts'
import { ftToM, kNPerMToLbPerFt, lbPerFtToKNPerM } from '../../../shared/units.ts'

// Moser & Folkman print whole pounds per foot: ±1 lb/ft (methods.md 6.3 checks 6.6–6.8).
const PRINTED_TOLERANCE_LB_PER_FT = 1

describe('three-edge-bearing requirement (Moser & Folkman, Buried Pipe Design, 3rd ed., Ex. 3.1 p.82)', () => {
  const field = lbPerFtToKNPerM(2592)
  const insideDiameter = ftToM(1.25)
  const rows: Array<[bedding: number, teb: number, dLoad: number]> = [
    [1.9, 2046, 1637],
    [1.5, 2592, 2074],
    [1.1, 3535, 2828],
  ]
  for (const [bedding, teb, dLoad] of rows) {
    it(`needs TEB ${teb} lb/ft and D-load ${dLoad} lb/ft/ft with bedding factor ${bedding}, SF 1.5`, () => {
      const required = requiredThreeEdgeBearingStrength_kN_per_m(field, 1.5, bedding)
      expect(Math.abs(kNPerMToLbPerFt(required) - teb)).toBeLessThanOrEqual(
        PRINTED_TOLERANCE_LB_PER_FT,
      )
      // D-load in lb/ft per ft of inside diameter: convert the kN/m per m result back.
      const dLoadLbPerFtPerFt =
        kNPerMToLbPerFt(dLoad_kN_per_m_per_m(required, insideDiameter)) * ftToM(1)
      expect(Math.abs(dLoadLbPerFtPerFt - dLoad)).toBeLessThanOrEqual(PRINTED_TOLERANCE_LB_PER_FT)
    })
  }
})

describe('crushingCapacity_kN_per_m', () => {
  it('is TEB·BF/SF: 60 kN/m, BF 1.9, SF 1.5 gives 76 kN/m ([C] computed from the formula, MOSER Eq. 3.1/3.2)', () => {
    expect(crushingCapacity_kN_per_m(60, 1.9, 1.5)).toBeCloseTo(76, 12)
  })
  it('rejects a bedding factor below 1 naming beddingFactor', () => {
    expect(() => crushingCapacity_kN_per_m(60, 0.5, 1.5)).toThrow(/beddingFactor/)
  })
})
