import { describe, it, expect } from 'vitest'
import {
  spanglerBeddingConstant,
  US_BEDDING_FACTORS,
  verticalLoadMomentCoefficients,
} from '../../../shared/statics/index.ts'

// Moser & Folkman print K to 3 decimals: ±1 in the last printed digit (methods.md 0.1).
const TABLE_TOLERANCE = 0.001

describe('spanglerBeddingConstant', () => {
  // Moser & Folkman, Buried Pipe Design, 3rd ed., Table 3.3 p.87, after Spangler (1941) (methods.md 7.1, 7.3).
  const rows: Array<[number, number]> = [
    [0, 0.11],
    [30, 0.108],
    [45, 0.105],
    [60, 0.102],
    [90, 0.096],
    [120, 0.09],
    [180, 0.083],
  ]
  for (const [angle, k] of rows) {
    it(`gives K = ${k} at ${angle}° (Moser & Folkman, 3rd ed., Table 3.3 p.87)`, () => {
      expect(Math.abs(spanglerBeddingConstant(angle) - k)).toBeLessThanOrEqual(1e-12)
    })
  }
  it('interpolates linearly between rows: 75° → 0.099 ([C] from the table)', () => {
    expect(spanglerBeddingConstant(75)).toBeCloseTo(0.099, 12)
  })
  it('rejects an angle above 180° naming beddingAngle_deg', () => {
    expect(() => spanglerBeddingConstant(200)).toThrow(/beddingAngle_deg/)
  })
  it('agrees with the ring model of methods.md 6.2 at 0° and 180° within ±0.001 ([C] methods.md 7.1)', () => {
    // The ring model's K_x: 0.1100 (0°) and 0.0833 (180°), as listed in methods.md 7.1.
    expect(Math.abs(spanglerBeddingConstant(0) - 0.11)).toBeLessThanOrEqual(TABLE_TOLERANCE)
    expect(Math.abs(spanglerBeddingConstant(180) - 0.0833)).toBeLessThanOrEqual(TABLE_TOLERANCE)
    expect(verticalLoadMomentCoefficients(180).crown).toBeCloseTo(0.25, 12)
  })
})

describe('US bedding factors', () => {
  it('are B 1.9, C 1.5, D 1.1 (Moser & Folkman, 3rd ed., Ex. 3.1 p.82)', () => {
    expect(US_BEDDING_FACTORS).toEqual({ B: 1.9, C: 1.5, D: 1.1 })
  })
})
