import { describe, it, expect } from 'vitest'
import {
  activeWedgeReach_m,
  combinedLateralSupportFactor,
  LATERAL_SUPPORT_ZONE_PER_DIAMETER,
  lateralSupportRule,
  pipeGeometry,
} from '../../../shared/statics/index.ts'

const EPSILON_m = 1e-3

describe('lateralSupportRule (project rule)', () => {
  // D 0.4 m, cover 1.5 m → springline 1.7 m; trench 0.9 m → embedment 0.25 m each side.
  const pipe = pipeGeometry(0.4, 1.5, 'trench', 0.9, 30)
  const beside = (clear_m: number) => ({
    xMin_m: 0.2 + clear_m,
    xMax_m: 0.2 + clear_m + 2,
    yMin_m: -3,
    yMax_m: 3,
  })

  it('keeps full support when the excavation is not deeper than the springline', () => {
    expect(lateralSupportRule(beside(0.1), 1.7, 'none', pipe).factor).toBe(1)
  })

  it('removes the side when the face cuts into the pipe-zone fill, whatever the support', () => {
    const result = lateralSupportRule(beside(0.25 - EPSILON_m), 1.8, 'sheet-piling', pipe)
    expect(result.factor).toBe(0)
    expect(result.reason).toBe('embedment-cut')
  })

  it('removes the side when the springline is in the active wedge of an unretained face', () => {
    const wedge = activeWedgeReach_m(3.7 - 1.7, 30)
    expect(lateralSupportRule(beside(wedge - EPSILON_m), 3.7, 'none', pipe).factor).toBe(0)
    expect(lateralSupportRule(beside(wedge - EPSILON_m), 3.7, 'trench-box', pipe).factor).toBe(0)
    // Just outside the wedge: inside the zone max(2.304·D, wedge)? The wedge (1.155 m) governs
    // over 2.304·0.4 = 0.92 m, so just outside it the support is kept.
    expect(lateralSupportRule(beside(wedge + EPSILON_m), 3.7, 'none', pipe).factor).toBe(1)
  })

  it('halves the side for sheet piling inside the wedge', () => {
    const wedge = activeWedgeReach_m(2, 30)
    const result = lateralSupportRule(beside(wedge - EPSILON_m), 3.7, 'sheet-piling', pipe)
    expect(result.factor).toBe(0.5)
    expect(result.reason).toBe('in-support-zone')
  })

  it('halves the side inside the 2.304·D support zone beyond the wedge, and keeps it outside', () => {
    const zone = LATERAL_SUPPORT_ZONE_PER_DIAMETER * 0.4
    expect(LATERAL_SUPPORT_ZONE_PER_DIAMETER).toBeCloseTo(2.304, 12)
    // 2.0 m deep: wedge (0.3·tan 30° = 0.17 m) is smaller than the zone (0.92 m).
    expect(lateralSupportRule(beside(zone - EPSILON_m), 2.0, 'none', pipe).factor).toBe(0.5)
    expect(lateralSupportRule(beside(zone + EPSILON_m), 2.0, 'none', pipe).factor).toBe(1)
  })

  it('does not apply to an excavation that reaches across the pipe', () => {
    const across = { xMin_m: -1, xMax_m: 1, yMin_m: -1, yMax_m: 1 }
    expect(lateralSupportRule(across, 3, 'none', pipe).side).toBe(0)
    expect(lateralSupportRule(across, 3, 'none', pipe).factor).toBe(1)
  })

  it('combines sides: one side lost gives 0, both halved gives 0, one halved gives 0.5', () => {
    const r = (side: -1 | 1, factor: 0 | 0.5 | 1) =>
      ({
        side,
        factor,
        reason: 'in-support-zone',
        clearDistance_m: 0,
        wedgeReach_m: 0,
        zone_m: 0,
      }) as const
    expect(combinedLateralSupportFactor([r(1, 0.5)])).toBe(0.5)
    expect(combinedLateralSupportFactor([r(1, 0.5), r(-1, 0.5)])).toBe(0)
    expect(combinedLateralSupportFactor([r(1, 0.5), r(1, 0)])).toBe(0)
    expect(combinedLateralSupportFactor([])).toBe(1)
  })
})
