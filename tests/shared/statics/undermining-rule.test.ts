import { describe, it, expect } from 'vitest'
import { pipeGeometry, underminingRule } from '../../../shared/statics/index.ts'

const EPSILON_m = 1e-3

describe('underminingRule', () => {
  // D 0.4 m, cover 1.6 m → bedding base (outside invert) at 2.0 m; φ' 30°.
  const pipe = pipeGeometry(0.4, 1.6, 'trench', 0.9, 30)
  const beside = (clear_m: number) => ({
    xMin_m: 0.2 + clear_m,
    xMax_m: 0.2 + clear_m + 3,
    yMin_m: -3,
    yMax_m: 3,
  })
  // Floor 2.0 m below the bedding base: the wedge reaches 2.0/tan 60° = 1.155 m ([C] methods.md 5 check 5.5).
  const reach = 2 / Math.tan(Math.PI / 3)

  it('flags the pipe just inside the wedge and not just outside it', () => {
    expect(underminingRule(beside(reach - EPSILON_m), 4, 'none', pipe).undermined).toBe(true)
    expect(underminingRule(beside(reach + EPSILON_m), 4, 'none', pipe).undermined).toBe(false)
    expect(underminingRule(beside(1), 4, 'none', pipe).wedgeReach_m).toBeCloseTo(1.155, 3)
  })

  it('never flags an excavation whose bottom is not below the bedding base', () => {
    expect(underminingRule(beside(0.05), 2.0, 'none', pipe).undermined).toBe(false)
  })

  it('is critical for unretained faces and not for sheet piling or bracing', () => {
    for (const support of ['none', 'sloped', 'trench-box'] as const) {
      expect(underminingRule(beside(0.5), 4, support, pipe).critical).toBe(true)
    }
    for (const support of ['sheet-piling', 'braced'] as const) {
      const result = underminingRule(beside(0.5), 4, support, pipe)
      expect(result.undermined).toBe(true)
      expect(result.critical).toBe(false)
    }
  })

  it('measures from the pipe wall, on either side', () => {
    const left = { xMin_m: -5, xMax_m: -0.2 - (reach - EPSILON_m), yMin_m: -3, yMax_m: 3 }
    expect(underminingRule(left, 4, 'none', pipe).undermined).toBe(true)
  })
})
