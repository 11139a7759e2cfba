import fc from 'fast-check'
import { describe, expect, it } from 'vitest'
import { enginePipeFieldsOf, parsePipeSegmentData } from '../../shared/schemas/pipe-segment.ts'
import { pipeEngineInput } from '../../server/services/pipe-engine-input.ts'
import { computeBaseline } from '../../server/services/pipe-baseline.ts'
import { pe100Properties } from '../helpers/network-fixtures.ts'

// No database: the mapping of a stored segment to the engine's pipe input.
describe('pipeEngineInput', () => {
  it('gives the engine the smaller cover and leaves empty optional fields out', () => {
    const parsed = parsePipeSegmentData(
      pe100Properties('X', { coverStart_m: 1.6, coverEnd_m: 1.1 }),
    )
    if (!parsed.ok) throw new Error(JSON.stringify(parsed.issues))
    const input = pipeEngineInput(parsed.data)
    expect(input.cover_m).toBe(1.1)
    expect('shortTermModulus_MPa' in input && input.shortTermModulus_MPa === undefined).toBe(true)
    expect(JSON.parse(JSON.stringify(input))).toEqual(enginePipeFieldsOf(parsed.data))
  })

  it('agrees with the validation-side mapping for any covers and optional values', () => {
    fc.assert(
      fc.property(
        fc.double({ min: 0.5, max: 4, noNaN: true }),
        fc.double({ min: 0.5, max: 4, noNaN: true }),
        fc.option(fc.double({ min: 600, max: 1600, noNaN: true }), { nil: null }),
        (a, b, e) => {
          const parsed = parsePipeSegmentData(
            pe100Properties('X', { coverStart_m: a, coverEnd_m: b, shortTermModulus_MPa: e }),
          )
          if (!parsed.ok) return true
          return (
            JSON.stringify(pipeEngineInput(parsed.data)) ===
            JSON.stringify(enginePipeFieldsOf(parsed.data))
          )
        },
      ),
    )
  })
})

describe('computeBaseline', () => {
  it('flags a pipe whose stored data exceed a capacity without any works', () => {
    // Barlow: 1600 kPa · 0.2 m / (2 · 0.0182 m) = 8.79 MPa against 8 MPa allowed for PE100.
    const parsed = parsePipeSegmentData(pe100Properties('X', { internalPressure_kPa: 1600 }))
    if (!parsed.ok) throw new Error('invalid')
    expect(computeBaseline(parsed.data)).toMatchObject({
      verdict: 'critical',
      governingCheck: 'hoop-stress',
      utilisation: expect.closeTo(8.791 / 8, 3),
      overCapacity: true,
      error: null,
    })
  })
})
