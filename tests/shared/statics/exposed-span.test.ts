import { describe, it, expect } from 'vitest'
import {
  allowableUnsupportedSpan_m,
  exposedPipeLineLoad_kN_per_m,
  exposedSpanStress_MPa,
  exposureOf,
  mergeExposures,
  pipeGeometry,
  simplySupportedMoment_kNm,
  tubeSectionModulus_m3,
} from '../../../shared/statics/index.ts'

describe('exposed span beam formulas', () => {
  it('gives M = 2.0 kN·m for w = 1.0 kN/m over L = 4 m, simply supported ([C] methods.md 10.3)', () => {
    expect(simplySupportedMoment_kNm(1, 4)).toBe(2)
  })
  it('computes self weight plus a full bore of water: steel D 0.5 m, t 0.01 m gives 2.9605 kN/m ([C] computed from the formula)', () => {
    // Wall π/4·(0.5² − 0.48²)·77 = 1.1853; water π/4·0.48²·9.81 = 1.7752.
    expect(exposedPipeLineLoad_kN_per_m(0.5, 0.01, 77)).toBeCloseTo(2.9605, 3)
  })
  it('has a section modulus within 2 % of the thin-wall value π·r²·t (common practice)', () => {
    const z = tubeSectionModulus_m3(0.5, 0.01)
    expect(Math.abs(z - Math.PI * 0.245 ** 2 * 0.01) / z).toBeLessThan(0.02)
  })
  it('gives a span whose stress is exactly the allowable stress (round trip)', () => {
    const z = tubeSectionModulus_m3(0.4, 0.024)
    const w = exposedPipeLineLoad_kN_per_m(0.4, 0.024, 9.4)
    const span = allowableUnsupportedSpan_m(8, z, w)
    expect(exposedSpanStress_MPa(w, span, z)).toBeCloseTo(8, 10)
  })
})

describe('exposure rule (project rule: exposed length along the pipe)', () => {
  const pipe = pipeGeometry(0.4, 1.5, 'trench', 0.9, 30)
  const dig = (depth_m: number, yMin_m: number, yMax_m: number, xMin_m = -1, xMax_m = 1) => ({
    id: 'x',
    kind: 'excavation' as const,
    depth_m,
    support: 'none' as const,
    footprint: { xMin_m, xMax_m, yMin_m, yMax_m },
  })
  it('does not expose the pipe when the bottom stays above the crown', () => {
    expect(exposureOf(dig(1.5, 0, 2), pipe)).toBeNull()
  })
  it('exposes the footprint length when the bottom is between crown and bedding base', () => {
    expect(exposureOf(dig(1.8, 0, 2), pipe)?.span_m).toBeCloseTo(2, 12)
  })
  it('adds the failure wedge beyond each face below the bedding base', () => {
    // 1.0 m below the invert (1.9 m), φ' 30°: 1.0/tan 60° = 0.5774 m at each end.
    expect(exposureOf(dig(2.9, 0, 2), pipe)?.span_m).toBeCloseTo(2 + 2 / Math.sqrt(3), 10)
  })
  it('ignores an excavation beside the pipe and merges overlapping exposures', () => {
    expect(exposureOf(dig(3, 0, 2, 0.21, 2), pipe)).toBeNull()
    const a = exposureOf({ ...dig(1.8, 0, 2), id: 'a' }, pipe)
    const b = exposureOf({ ...dig(1.8, 1.5, 4), id: 'b' }, pipe)
    const merged = mergeExposures([a!, b!])
    expect(merged).toHaveLength(1)
    expect(merged[0]?.span_m).toBeCloseTo(4, 12)
    expect(merged[0]?.activityIds).toEqual(['a', 'b'])
  })
})
