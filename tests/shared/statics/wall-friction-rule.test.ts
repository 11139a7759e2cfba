import { describe, it, expect } from 'vitest'
import {
  activeWedgeReach_m,
  pipeGeometry,
  wallFrictionRule,
} from '../../../shared/statics/index.ts'

// Project rule (shared/statics/README.md): friction is lost when the footprint is at or inside
// max(cover, depth)·tan(45° − φ'/2) of a trench wall line x = ±B/2.
const EPSILON_m = 1e-3

describe('wallFrictionRule', () => {
  const pipe = pipeGeometry(0.4, 1.8, 'trench', 1.0, 30)
  const box = (xMin_m: number, xMax_m: number) => ({ xMin_m, xMax_m, yMin_m: -2, yMax_m: 2 })

  it("uses the trench wall's own wedge for a shallow excavation: reach = cover·tan 30°", () => {
    const reach = 1.8 * Math.tan(Math.PI / 6)
    expect(wallFrictionRule(box(0.5 + reach - EPSILON_m, 4), 1.0, pipe).lost).toBe(true)
    expect(wallFrictionRule(box(0.5 + reach + EPSILON_m, 4), 1.0, pipe).lost).toBe(false)
    expect(wallFrictionRule(box(0.5 + reach, 4), 1.0, pipe).reach_m).toBeCloseTo(reach, 12)
  })

  it("uses the excavation face's wedge when the excavation is deeper than the cover", () => {
    const reach = activeWedgeReach_m(3.2, 30)
    expect(wallFrictionRule(box(0.5 + reach - EPSILON_m, 4), 3.2, pipe).lost).toBe(true)
    expect(wallFrictionRule(box(0.5 + reach + EPSILON_m, 4), 3.2, pipe).lost).toBe(false)
  })

  it('applies on the other side of the pipe and to a footprint that cuts the wall', () => {
    const reach = 1.8 * Math.tan(Math.PI / 6)
    expect(wallFrictionRule(box(-4, -0.5 - reach + EPSILON_m), 1.0, pipe).lost).toBe(true)
    expect(wallFrictionRule(box(-4, -0.5 - reach - EPSILON_m), 1.0, pipe).lost).toBe(false)
    const cut = wallFrictionRule(box(0.3, 2), 0.5, pipe)
    expect(cut.lost).toBe(true)
    expect(cut.distanceToWall_m).toBe(0)
  })

  it('never applies to an embankment (no trench walls)', () => {
    const embankment = pipeGeometry(0.4, 1.8, 'embankment', null, 30)
    expect(wallFrictionRule(box(0.3, 2), 3, embankment).lost).toBe(false)
  })

  it('rejects a zero depth naming depth_m', () => {
    expect(() => wallFrictionRule(box(1, 2), 0, pipe)).toThrow(/depth_m/)
  })
})
