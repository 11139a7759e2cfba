import { describe, it, expect } from 'vitest'
import { assessPipe, type Activity, type PipeInput } from '../../../shared/statics/index.ts'

// Condition solving (project rule, shared/statics/README.md): numbers are solved only when the
// works fail, are rounded up to 0.1 m, and never place a load over the pipe.
const pipe: PipeInput = {
  material: 'PVC-U',
  outerDiameter_m: 0.2,
  wallThickness_m: 0.0077,
  internalPressure_kPa: 0,
  cover_m: 0.8,
  installation: 'trench',
  trenchWidth_m: 0.6,
  wallFrictionKMu: 0.15,
  backfillUnitWeight_kN_per_m3: 19,
  frictionAngle_deg: 30,
  sidefillModulus_MPa: 1.4,
  beddingAngle_deg: 60,
  groundwaterAboveCrown_m: 0,
  designTrafficPressure_kPa: 0,
}
const pad = (load_kN: number, xMin_m = -0.3): Activity => ({
  id: 'pad',
  kind: 'pad',
  load_kN,
  footprint: { xMin_m, xMax_m: xMin_m + 0.6, yMin_m: -0.3, yMax_m: 0.3 },
})

describe('solved conditions', () => {
  it('are not proposed when the works pass', () => {
    const result = assessPipe({ pipe, activities: [pad(20)] })
    expect(result.verdict).toBe('clear')
    expect(result.conditions).toEqual([])
  })

  it('can be switched off for fast previews', () => {
    const result = assessPipe({ pipe, activities: [pad(400)] }, { solveConditions: false })
    expect(result.verdict).toBe('critical')
    expect(result.conditions.some((c) => c.code === 'min-offset')).toBe(false)
  })

  it('round up to 0.1 m and never propose a place over the pipe', () => {
    const result = assessPipe({ pipe, activities: [pad(400)] })
    for (const condition of result.conditions) {
      if (condition.value_m === undefined) continue
      expect(condition.value_m).toBeGreaterThanOrEqual(0.1)
      expect(Math.abs(condition.value_m * 10 - Math.round(condition.value_m * 10))).toBeLessThan(
        1e-9,
      )
    }
    const offset = result.conditions.find((c) => c.code === 'min-offset')
    expect(offset?.value_m).toBeGreaterThanOrEqual(0.1)
  })

  it('blame the activity that causes the failure, leaving the harmless one alone', () => {
    const harmless: Activity = {
      id: 'far',
      kind: 'pad',
      load_kN: 50,
      footprint: { xMin_m: 6, xMax_m: 7, yMin_m: 0, yMax_m: 1 },
    }
    const result = assessPipe({ pipe, activities: [pad(400), harmless] })
    const ids = result.conditions.map((c) => c.activityId)
    expect(ids).toContain('pad')
    expect(ids).not.toContain('far')
  })

  it('do not try to move an excavation that crosses the pipe', () => {
    const crossing: Activity = {
      id: 'x',
      kind: 'excavation',
      depth_m: 1.5,
      support: 'none',
      footprint: { xMin_m: -3, xMax_m: 3, yMin_m: 0, yMax_m: 30 },
    }
    const result = assessPipe({ pipe, activities: [crossing] })
    expect(result.verdict).toBe('critical')
    expect(result.conditions.some((c) => c.code === 'min-offset')).toBe(false)
    expect(result.conditions.some((c) => c.code === 'support-exposed-pipe')).toBe(true)
  })
})
