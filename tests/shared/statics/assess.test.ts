import { describe, it, expect } from 'vitest'
import fc from 'fast-check'
import {
  assessPipe,
  STANDARD_CAUTION,
  type Activity,
  type AssessmentResult,
  type PipeInput,
} from '../../../shared/statics/index.ts'

// Whole scenarios with the verdicts a screening engineer would expect, the output contract of
// issue 3, and property tests. Pipe data are invented but plausible.

const peMain: PipeInput = {
  material: 'PE100',
  outerDiameter_m: 0.4,
  wallThickness_m: 0.0364,
  internalPressure_kPa: 600,
  cover_m: 1.2,
  installation: 'trench',
  trenchWidth_m: 0.8,
  wallFrictionKMu: 0.165,
  backfillUnitWeight_kN_per_m3: 19,
  frictionAngle_deg: 30,
  sidefillModulus_MPa: 3,
  beddingAngle_deg: 90,
  groundwaterAboveCrown_m: 0,
  designTrafficPressure_kPa: 0,
}

const pvcSewer: PipeInput = {
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

const claySewer: PipeInput = {
  material: 'vitrified-clay',
  outerDiameter_m: 0.36,
  wallThickness_m: 0.03,
  crushingStrength_kN_per_m: 48,
  beddingFactor: 1.5,
  internalPressure_kPa: 0,
  cover_m: 2.0,
  installation: 'trench',
  trenchWidth_m: 0.8,
  wallFrictionKMu: 0.13,
  backfillUnitWeight_kN_per_m3: 20,
  frictionAngle_deg: 25,
  sidefillModulus_MPa: 2,
  beddingAngle_deg: 90,
  groundwaterAboveCrown_m: 0.5,
  designTrafficPressure_kPa: 5,
}

const concreteSewer: PipeInput = {
  material: 'concrete',
  outerDiameter_m: 0.75,
  wallThickness_m: 0.075,
  crushingStrength_kN_per_m: 90,
  beddingFactor: 1.9,
  internalPressure_kPa: 0,
  cover_m: 2.5,
  installation: 'trench',
  trenchWidth_m: 1.4,
  wallFrictionKMu: 0.13,
  backfillUnitWeight_kN_per_m3: 20,
  frictionAngle_deg: 30,
  sidefillModulus_MPa: 3,
  beddingAngle_deg: 120,
  groundwaterAboveCrown_m: 0,
  designTrafficPressure_kPa: 10,
}

const mat = (id: string, load_kN: number, x_m: number, y_m: number, size_m = 1.2): Activity => ({
  id,
  kind: 'pad',
  load_kN,
  footprint: {
    xMin_m: x_m,
    xMax_m: x_m + size_m,
    yMin_m: y_m - size_m / 2,
    yMax_m: y_m + size_m / 2,
  },
})

const crane: Activity[] = [
  mat('front-left', 300, 1.0, -3),
  mat('front-right', 250, 1.0, 3),
  mat('rear-left', 150, 7.0, -3),
  mat('rear-right', 150, 7.0, 3),
]

function check(result: AssessmentResult, id: string) {
  const found = result.checks.find((c) => c.id === id)
  if (!found) throw new Error(`no ${id} check`)
  return found
}

function allFinite(value: unknown): boolean {
  if (typeof value === 'number') return Number.isFinite(value)
  if (Array.isArray(value)) return value.every(allFinite)
  if (value !== null && typeof value === 'object') return Object.values(value).every(allFinite)
  return true
}

describe('assessPipe output contract (issue 3)', () => {
  const result = assessPipe({ pipe: peMain, activities: crane })

  it('has the contract fields with their exact names', () => {
    expect(Object.keys(result.effects)).toEqual(
      expect.arrayContaining([
        'siloFactor',
        'soilPressureAtCrown_kPa',
        'surchargeAtCrown_kPa',
        'sidefillModulus_MPa',
        'wallFrictionLost',
        'lateralSupportReduced',
        'undermined',
        'shallowCover',
      ]),
    )
    expect(Object.keys(result.effects.siloFactor)).toEqual(['baseline', 'withWorks'])
    for (const c of result.checks) {
      expect(Object.keys(c)).toEqual(
        expect.arrayContaining(['id', 'method', 'unit', 'baseline', 'withWorks']),
      )
      expect(Object.keys(c.withWorks)).toEqual(['demand', 'capacity', 'utilisation'])
    }
    expect(['clear', 'conditional', 'critical']).toContain(result.verdict)
    expect(Array.isArray(result.conditions)).toBe(true)
    expect(Array.isArray(result.assumptions)).toBe(true)
  })

  it('always puts the standard caution first', () => {
    expect(result.cautions[0]).toBe(STANDARD_CAUTION)
  })

  it('names the published method of each check', () => {
    expect(check(result, 'ring-deflection').method).toBe(
      'Modified Iowa formula (Spangler 1941; Watkins & Spangler 1958)',
    )
    expect(check(result, 'buckling').method).toMatch(/^AWWA M45 buckling/)
    expect(check(result, 'hoop-stress').method).toMatch(/^Barlow/)
  })

  it('lists the inputs and every default it applied', () => {
    const text = result.assumptions.join('\n')
    expect(text).toMatch(/outside diameter 0\.400 m/)
    expect(text).toMatch(/Default applied: long-term modulus 200 MPa/)
    expect(text).toMatch(/Default applied: deflection lag factor 1\.5/)
  })

  it('reports soil pressure = κ·γ·H (issue 3)', () => {
    expect(result.effects.soilPressureAtCrown_kPa.baseline).toBeCloseTo(
      result.effects.siloFactor.baseline * 19 * 1.2,
      10,
    )
  })

  it('marks exactly one governing check and gives a summary sentence', () => {
    expect(result.checks.filter((c) => c.governing)).toHaveLength(1)
    expect(result.governingCheckId).toBe(result.checks.find((c) => c.governing)?.id)
    expect(result.summary).toMatch(/within the limits/)
  })
})

describe('scenario: crane beside a PE water main', () => {
  it('is clear with the mats 1 m beside the pipe', () => {
    const result = assessPipe({ pipe: peMain, activities: crane })
    expect(result.verdict).toBe('clear')
    expect(result.effects.surchargeAtCrown_kPa).toBeGreaterThan(5)
    expect(result.effects.wallFrictionLost).toBe(false)
    expect(result.conditions).toEqual([])
    for (const c of result.checks) expect(c.withWorks.utilisation).toBeLessThanOrEqual(1)
    expect(check(result, 'ring-deflection').withWorks.demand).toBeGreaterThan(
      check(result, 'ring-deflection').baseline.demand,
    )
  })

  it('is critical with a heavy outrigger on a small mat over a shallow PVC sewer, and solves offset and mat size', () => {
    const activities = [mat('outrigger', 400, -0.3, 0, 0.6)]
    const result = assessPipe({ pipe: pvcSewer, activities })
    expect(result.verdict).toBe('critical')
    expect(result.effects.shallowCover).toBe(true)
    const offset = result.conditions.find((c) => c.code === 'min-offset')
    const size = result.conditions.find((c) => c.code === 'min-mat-size')
    expect(offset?.value_m).toBeGreaterThan(0)
    expect(size?.value_m).toBeGreaterThan(0.6)
    // The solved offset works; 0.15 m less does not.
    const at = (edge_m: number) => mat('outrigger', 400, edge_m, 0, 0.6)
    expect(assessPipe({ pipe: pvcSewer, activities: [at(offset!.value_m!)] }).verdict).not.toBe(
      'critical',
    )
    expect(assessPipe({ pipe: pvcSewer, activities: [at(offset!.value_m! - 0.15)] }).verdict).toBe(
      'critical',
    )
    // The solved mat works.
    const side = size!.value_m!
    const bigger: Activity = {
      id: 'outrigger',
      kind: 'pad',
      load_kN: 400,
      footprint: { xMin_m: -side / 2, xMax_m: side / 2, yMin_m: -side / 2, yMax_m: side / 2 },
    }
    expect(assessPipe({ pipe: pvcSewer, activities: [bigger] }).verdict).not.toBe('critical')
    expect(result.cautions.join(' ')).toMatch(/shallow cover/)
  })
})

describe('scenario: stockpile over a clay sewer', () => {
  const stockpile = (height_m: number): Activity => ({
    id: 'stockpile',
    kind: 'fill',
    height_m,
    unitWeight_kN_per_m3: 18,
    footprint: { xMin_m: -3, xMax_m: 3, yMin_m: -5, yMax_m: 5 },
  })

  it('is clear for a 2 m heap and critical for a 5 m heap, with a no-stockpile distance', () => {
    expect(assessPipe({ pipe: claySewer, activities: [stockpile(2)] }).verdict).toBe('clear')
    const result = assessPipe({ pipe: claySewer, activities: [stockpile(5)] })
    expect(result.verdict).toBe('critical')
    expect(check(result, 'crushing').method).toMatch(/three-edge-bearing/)
    expect(check(result, 'ring-bending').withWorks.utilisation).toBeGreaterThan(1)
    const condition = result.conditions.find((c) => c.code === 'no-stockpile-within')
    expect(condition?.value_m).toBeGreaterThan(0)
    expect(result.cautions.join(' ')).toMatch(/along its length/)
  })

  it('treats the fill as long-term and says so', () => {
    const result = assessPipe({ pipe: claySewer, activities: [stockpile(2)] })
    expect(result.assumptions.join('\n')).toMatch(
      /stockpile: 36\.0 kPa over 60\.00 m² \(long-term\)/,
    )
  })
})

describe('scenario: deep excavation beside a concrete sewer', () => {
  const basement = (support: 'none' | 'sheet-piling', clear_m = 1): Activity => ({
    id: 'basement',
    kind: 'excavation',
    depth_m: 5.5,
    support,
    footprint: { xMin_m: 0.375 + clear_m, xMax_m: 12, yMin_m: -8, yMax_m: 8 },
  })

  it('is critical when the unsupported face leaves the pipe undermined', () => {
    const result = assessPipe({ pipe: concreteSewer, activities: [basement('none')] })
    expect(result.verdict).toBe('critical')
    expect(result.effects.undermined).toBe(true)
    expect(result.effects.wallFrictionLost).toBe(true)
    expect(result.effects.siloFactor.withWorks).toBe(1)
    expect(result.effects.lateralSupportReduced).toBe(true)
    expect(result.summary).toMatch(/undermined/)
    // Solved: the face moved to the edge of the failure wedge, (5.5 − 3.25)/tan 60° = 1.30 m from the wall.
    const offset = result.conditions.find((c) => c.code === 'min-offset')
    expect(offset?.value_m).toBeCloseTo(1.7, 10)
  })

  it('is conditional with sheet piling: the support must be designed for the pipe and kept until backfilled', () => {
    const result = assessPipe({ pipe: concreteSewer, activities: [basement('sheet-piling')] })
    expect(result.verdict).toBe('conditional')
    expect(result.effects.undermined).toBe(true)
    const codes = result.conditions.map((c) => c.code)
    expect(codes).toContain('support-designed-for-pipe')
    expect(codes).toContain('keep-sheeting-until-backfilled')
    expect(codes).toContain('trial-holes')
  })

  it('is clear 6 m away', () => {
    expect(assessPipe({ pipe: concreteSewer, activities: [basement('none', 6)] }).verdict).toBe(
      'clear',
    )
  })

  it('uses the Marston load on the rigid pipe and explains it', () => {
    const result = assessPipe({ pipe: concreteSewer, activities: [] })
    // Embankment cap: F_e·γ·H·D = 1.15·20·2.5·0.75 = 43.125 kN/m, plus traffic 10·0.75.
    expect(check(result, 'crushing').baseline.demand).toBeCloseTo(43.125 + 7.5, 9)
    expect(check(result, 'crushing').baseline.capacity).toBeCloseTo((90 * 1.9) / 1.5, 9)
    expect(result.assumptions.join('\n')).toMatch(/Ring-bending check not made/)
  })
})

describe('scenario: trench crossing a PE main', () => {
  const crossing: Activity = {
    id: 'cable-trench',
    kind: 'excavation',
    depth_m: 1.8,
    support: 'trench-box',
    footprint: { xMin_m: -4, xMax_m: 4, yMin_m: 0, yMax_m: 1.2 },
  }

  it('exposes the pipe, checks the span and proposes supports, bedding and hand digging', () => {
    const result = assessPipe({ pipe: peMain, activities: [crossing] })
    expect(result.verdict).toBe('conditional')
    // 1.2 m of footprint plus the wedge beyond each face: (1.8 − 1.6)/tan 60° at each end.
    expect(result.effects.exposedSpan_m).toBeCloseTo(1.2 + (2 * 0.2) / Math.sqrt(3), 9)
    const span = check(result, 'exposed-span')
    expect(span.baseline.demand).toBe(0)
    expect(span.withWorks.demand).toBeCloseTo(result.effects.exposedSpan_m, 12)
    const codes = result.conditions.map((c) => c.code)
    expect(codes).toEqual(
      expect.arrayContaining([
        'support-exposed-pipe',
        'restore-bedding',
        'hand-dig-zone',
        'trial-holes',
      ]),
    )
    expect(result.effects.wallFrictionLost).toBe(true)
    expect(result.assumptions.join('\n')).toMatch(
      /Trench-wall friction no longer counted: cable-trench cuts into the original trench wall/,
    )
  })

  it('is critical when a long crossing pit exceeds the allowable span', () => {
    const long: Activity = {
      ...crossing,
      footprint: { xMin_m: -4, xMax_m: 4, yMin_m: 0, yMax_m: 12 },
    }
    const result = assessPipe({ pipe: peMain, activities: [long] })
    expect(result.verdict).toBe('critical')
    expect(check(result, 'exposed-span').withWorks.utilisation).toBeGreaterThan(1)
    const support = result.conditions.find((c) => c.code === 'support-exposed-pipe')
    expect(support?.value_m).toBeLessThan(result.effects.exposedSpan_m)
  })
})

describe('engine properties (fast-check)', () => {
  const padAt = (load_kN: number, x_m: number, y_m: number, size_m: number): Activity => ({
    id: 'pad',
    kind: 'pad',
    load_kN,
    footprint: { xMin_m: x_m, xMax_m: x_m + size_m, yMin_m: y_m, yMax_m: y_m + size_m },
  })

  it('more load never lowers a utilisation', () => {
    fc.assert(
      fc.property(
        fc.double({ min: 1, max: 800, noNaN: true }),
        fc.double({ min: 1.01, max: 4, noNaN: true }),
        fc.double({ min: -6, max: 6, noNaN: true }),
        fc.double({ min: 0.3, max: 3, noNaN: true }),
        fc.constantFrom(peMain, claySewer, concreteSewer, pvcSewer),
        (load, factor, x, size, pipe) => {
          const options = { solveConditions: false }
          const low = assessPipe({ pipe, activities: [padAt(load, x, -size / 2, size)] }, options)
          const high = assessPipe(
            { pipe, activities: [padAt(load * factor, x, -size / 2, size)] },
            options,
          )
          return low.checks.every(
            (c, i) =>
              (high.checks[i]?.withWorks.utilisation ?? -1) >=
              c.withWorks.utilisation * (1 - 1e-12),
          )
        },
      ),
      { numRuns: 200 },
    )
  })

  it('more offset never raises the surcharge', () => {
    fc.assert(
      fc.property(
        fc.double({ min: 1, max: 800, noNaN: true }),
        fc.double({ min: 0, max: 10, noNaN: true }),
        fc.double({ min: 0.01, max: 5, noNaN: true }),
        fc.double({ min: 0.3, max: 3, noNaN: true }),
        (load, x, extra, size) => {
          const options = { solveConditions: false }
          const near = assessPipe({ pipe: peMain, activities: [padAt(load, x, 0, size)] }, options)
          const far = assessPipe(
            { pipe: peMain, activities: [padAt(load, x + extra, 0, size)] },
            options,
          )
          return far.effects.surchargeAtCrown_kPa <= near.effects.surchargeAtCrown_kPa * (1 + 1e-9)
        },
      ),
      { numRuns: 200 },
    )
  })

  it('a load far away adds almost nothing (limit case)', () => {
    const result = assessPipe({ pipe: peMain, activities: [padAt(500, 500, 0, 1)] })
    expect(result.effects.surchargeAtCrown_kPa).toBeLessThan(1e-6)
    expect(result.verdict).toBe('clear')
  })

  it('outputs are always finite, whatever the (valid) input', () => {
    const activity = fc.oneof(
      fc.record({
        kind: fc.constant('pad' as const),
        load_kN: fc.double({ min: 1, max: 5000, noNaN: true }),
      }),
      fc.record({
        kind: fc.constant('area' as const),
        pressure_kPa: fc.double({ min: 1, max: 300, noNaN: true }),
      }),
      fc.record({
        kind: fc.constant('fill' as const),
        height_m: fc.double({ min: 0.1, max: 8, noNaN: true }),
        unitWeight_kN_per_m3: fc.double({ min: 15, max: 22, noNaN: true }),
      }),
      fc.record({
        kind: fc.constant('excavation' as const),
        depth_m: fc.double({ min: 0.2, max: 8, noNaN: true }),
        support: fc.constantFrom(
          'none' as const,
          'sloped' as const,
          'trench-box' as const,
          'sheet-piling' as const,
          'braced' as const,
        ),
      }),
    )
    const placed = fc.tuple(
      activity,
      fc.double({ min: -8, max: 8, noNaN: true }),
      fc.double({ min: -8, max: 8, noNaN: true }),
      fc.double({ min: 0.3, max: 6, noNaN: true }),
      fc.double({ min: 0.3, max: 6, noNaN: true }),
    )
    fc.assert(
      fc.property(
        fc.constantFrom(peMain, claySewer, concreteSewer, pvcSewer),
        fc.double({ min: 0.3, max: 6, noNaN: true }),
        fc.double({ min: 0, max: 20, noNaN: true }),
        fc.array(placed, { minLength: 0, maxLength: 4 }),
        (pipe, cover, sidefill, items) => {
          const activities = items.map(
            ([a, x, y, w, l], i) =>
              ({
                ...a,
                id: `a${i}`,
                footprint: { xMin_m: x, xMax_m: x + w, yMin_m: y, yMax_m: y + l },
              }) as Activity,
          )
          const groundwater = Math.min(pipe.groundwaterAboveCrown_m, cover)
          const result = assessPipe({
            pipe: {
              ...pipe,
              cover_m: cover,
              sidefillModulus_MPa: sidefill,
              groundwaterAboveCrown_m: groundwater,
            },
            activities,
          })
          return (
            allFinite(result) &&
            result.cautions[0] === STANDARD_CAUTION &&
            !JSON.stringify(result).includes('null')
          )
        },
      ),
      { numRuns: 150 },
    )
  })
})

describe('input errors', () => {
  it('names the pipe field in the RangeError', () => {
    expect(() => assessPipe({ pipe: { ...peMain, cover_m: -1 }, activities: [] })).toThrow(
      /pipe\.cover_m/,
    )
    expect(() =>
      assessPipe({ pipe: { ...peMain, sidefillModulus_MPa: Number.NaN }, activities: [] }),
    ).toThrow(/pipe\.sidefillModulus_MPa/)
    expect(() =>
      assessPipe({ pipe: { ...claySewer, crushingStrength_kN_per_m: undefined }, activities: [] }),
    ).toThrow(/pipe\.crushingStrength_kN_per_m/)
    expect(() => assessPipe({ pipe: { ...peMain, material: 'GRP' }, activities: [] })).toThrow(
      /pipe\.shortTermModulus_MPa/,
    )
  })

  it('names the activity field in the RangeError', () => {
    expect(() =>
      assessPipe({ pipe: peMain, activities: [mat('a', Number.POSITIVE_INFINITY, 1, 0)] }),
    ).toThrow(/activities\[0\]\.load_kN/)
    expect(() =>
      assessPipe({ pipe: peMain, activities: [mat('a', 10, 1, 0), mat('a', 10, 3, 0)] }),
    ).toThrow(/activities\[1\]\.id/)
    const bad: Activity = {
      id: 'b',
      kind: 'excavation',
      depth_m: 2,
      support: 'none',
      footprint: { xMin_m: 2, xMax_m: 1, yMin_m: 0, yMax_m: 1 },
    }
    expect(() => assessPipe({ pipe: peMain, activities: [bad] })).toThrow(
      /activities\[0\]\.footprint\.xMax_m/,
    )
  })
})
