import { describe, it, expect } from 'vitest'
import fc from 'fast-check'
import {
  DEFAULT_INFLUENCE_ENVELOPE,
  influenceDistance_m,
  polygonStress_kPa,
  rectangleStress_kPa,
  type Activity,
} from '../../../shared/statics/index.ts'

const pad = (load_kN: number, size_m: number): Activity => ({
  id: 'pad',
  kind: 'pad',
  load_kN,
  footprint: { xMin_m: 0, xMax_m: size_m, yMin_m: -size_m / 2, yMax_m: size_m / 2 },
})

describe('influenceDistance_m', () => {
  it('is never below the minimum passed in', () => {
    expect(influenceDistance_m(pad(1, 0.5), 10)).toBe(10)
    expect(influenceDistance_m(pad(300, 1), 0)).toBeGreaterThan(0)
  })

  it('bounds the stress: beyond it a pad adds less than the threshold at every plausible crown depth (property)', () => {
    fc.assert(
      fc.property(
        fc.double({ min: 10, max: 3000, noNaN: true }),
        fc.double({ min: 0.3, max: 4, noNaN: true }),
        (load, size) => {
          const activity = pad(load, size)
          const distance = influenceDistance_m(activity, 0)
          const footprint = { xMin_m: 0, xMax_m: size, yMin_m: -size / 2, yMax_m: size / 2 }
          for (let depth = 0.3; depth <= 6; depth += 0.1) {
            const stress = rectangleStress_kPa(load / (size * size), footprint, -distance, 0, depth)
            if (stress > DEFAULT_INFLUENCE_ENVELOPE.stressThreshold_kPa) return false
          }
          return true
        },
      ),
      { numRuns: 50 },
    )
  })

  it('bounds the stress of a large fill of any shape, checked on an L-shaped polygon', () => {
    const fill: Activity = {
      id: 'fill',
      kind: 'fill',
      height_m: 3,
      unitWeight_kN_per_m3: 20,
      footprint: {
        polygon_m: [
          [0, 0],
          [20, 0],
          [20, 5],
          [5, 5],
          [5, 30],
          [0, 30],
        ],
      },
    }
    const distance = influenceDistance_m(fill, 0)
    for (let depth = 0.3; depth <= 6; depth += 0.25) {
      for (const y of [0, 2.5, 15, 30]) {
        const stress = polygonStress_kPa(
          60,
          (fill.footprint as { polygon_m: Array<[number, number]> }).polygon_m,
          -distance,
          y,
          depth,
        )
        expect(stress).toBeLessThanOrEqual(1)
      }
    }
  })

  it('grows with the load (more load never shortens it)', () => {
    expect(influenceDistance_m(pad(600, 1), 0)).toBeGreaterThan(influenceDistance_m(pad(300, 1), 0))
  })

  it('covers every excavation rule reach for the given pipe data', () => {
    const dig: Activity = {
      id: 'd',
      kind: 'excavation',
      depth_m: 4,
      support: 'none',
      footprint: { xMin_m: 0, xMax_m: 2, yMin_m: 0, yMax_m: 2 },
    }
    const distance = influenceDistance_m(dig, 0, {
      minCover_m: 1.5,
      maxCover_m: 1.5,
      outerDiameter_m: 0.4,
      trenchWidth_m: 0.9,
      frictionAngle_deg: 30,
    })
    // Wall-friction reach max(1.5, 4)·tan 30° = 2.309 m from the wall at 0.45 m from the axis.
    expect(distance).toBeGreaterThanOrEqual(4 * Math.tan(Math.PI / 6) + 0.45 - 1e-9)
  })

  it('rejects a negative minimum naming minimum_m', () => {
    expect(() => influenceDistance_m(pad(300, 1), -1)).toThrow(/minimum_m/)
  })
})
