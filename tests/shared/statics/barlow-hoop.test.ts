import { describe, it, expect } from 'vitest'
import {
  barlowHoopStress_MPa,
  barlowLongitudinalStress_MPa,
  plasticsPressureRating_bar,
} from '../../../shared/statics/index.ts'

describe('Barlow thin-wall stresses', () => {
  it('gives σ_θ 25.0 MPa and σ_L 12.5 MPa for p 1 MPa, D 500 mm, t 10 mm ([C] textbook identity, methods.md 1 check 1.1)', () => {
    expect(barlowHoopStress_MPa(1000, 0.5, 0.01)).toBeCloseTo(25, 12)
    expect(barlowLongitudinalStress_MPa(1000, 0.5, 0.01)).toBeCloseTo(12.5, 12)
  })
  it('gives PN 16 bar for PE100 SDR 11 and PN 10 bar for SDR 17 at σ_s 8 MPa ([C] methods.md 1 checks 1.2, 1.3; PN16 catalogue value [M])', () => {
    expect(plasticsPressureRating_bar(8, 11)).toBeCloseTo(16, 12)
    expect(plasticsPressureRating_bar(8, 17)).toBeCloseTo(10, 12)
  })
  it('rejects a negative pressure naming internalPressure_kPa', () => {
    expect(() => barlowHoopStress_MPa(-1, 0.5, 0.01)).toThrow(/internalPressure_kPa/)
  })
})
