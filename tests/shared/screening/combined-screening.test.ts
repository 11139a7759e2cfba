import { describe, expect, it } from 'vitest'
import { pipePieces } from '../../../shared/geo/pipe-local-frame.ts'
import {
  combinedActivityId,
  worstCombinedScreening,
} from '../../../shared/screening/combined-screening.ts'
import type { WorksOnSegment } from '../../../shared/screening/combined-screening.ts'
import { concurrencyIntervals } from '../../../shared/screening/concurrency-intervals.ts'
import type { GridActivity } from '../../../shared/screening/engine-activities.ts'
import { assessPipe } from '../../../shared/statics/index.ts'
import type { PipeInput } from '../../../shared/statics/types.ts'

// A PE100 water main (the server fixtures' pipe) along the grid x axis, 60 m long.
const pipe = {
  material: 'PE100',
  outerDiameter_m: 0.2,
  wallThickness_m: 0.0182,
  internalPressure_kPa: 600,
  cover_m: 1.2,
  installation: 'trench',
  trenchWidth_m: 0.7,
  wallFrictionKMu: 0.165,
  backfillUnitWeight_kN_per_m3: 19,
  frictionAngle_deg: 30,
  sidefillModulus_MPa: 5,
  beddingAngle_deg: 90,
  groundwaterAboveCrown_m: 0,
  designTrafficPressure_kPa: 10,
} as unknown as PipeInput
const pieces = pipePieces([
  [0, 0],
  [60, 0],
])

const pad = (cx: number, load_kN: number): GridActivity => ({
  id: 'a0',
  sourceIndex: 0,
  name: 'Crane',
  ring_grid: [
    [cx - 0.75, -0.75],
    [cx + 0.75, -0.75],
    [cx + 0.75, 0.75],
    [cx - 0.75, 0.75],
  ],
  engine: { kind: 'pad', load_kN, loadDuration: 'short-term' },
})
const works = (applicationId: number, g: GridActivity): WorksOnSegment => ({
  applicationId,
  activities: [g],
  influence_m: [10],
})

describe('worstCombinedScreening', () => {
  const own = works(1, pad(20, 1300))
  const other = works(2, pad(21.6, 1300))
  const far = works(3, pad(50, 100))

  it('when no other works overlap in time, then there is no combined result', () => {
    const intervals = concurrencyIntervals({ from: '2026-12-08', to: '2026-12-10' }, [])
    expect(worstCombinedScreening(pipe, pieces, own, [other], intervals)).toBeNull()
  })

  it('when works overlap on some days, then the worst interval is the one with them, and its input is what the engine ran', () => {
    const intervals = concurrencyIntervals({ from: '2026-12-08', to: '2026-12-20' }, [
      { id: 2, from: '2026-12-10', to: '2026-12-12' },
      { id: 3, from: '2026-12-15', to: '2026-12-25' },
    ])
    const out = worstCombinedScreening(pipe, pieces, own, [other, far], intervals)!
    const alone = assessPipe({ pipe, activities: [] })
    expect(alone.verdict).toBe('clear')
    expect(out.worst).toMatchObject({ from: '2026-12-10', to: '2026-12-12', applicationIds: [2] })
    expect(out.runs.map((r) => [r.from, r.to, r.applicationIds])).toEqual([
      ['2026-12-10', '2026-12-12', [2]],
      ['2026-12-15', '2026-12-20', [3]],
    ])
    expect(out.input.activities.map((a) => a.id)).toEqual(['a0', combinedActivityId(2, 'a0')])
    expect(assessPipe(out.input)).toEqual(out.result)
    // Both runs add load, so each is at least as bad as the own works alone.
    const ownAlone = assessPipe({
      pipe,
      activities: out.input.activities.filter((a) => a.id === 'a0'),
    })
    for (const run of out.runs) {
      expect(run.maxUtilisation).toBeGreaterThanOrEqual(
        Math.max(...ownAlone.checks.map((c) => c.withWorks.utilisation)) - 1e-12,
      )
    }
  })

  it('when an interval names an application whose works do not reach the segment, then it is skipped', () => {
    const intervals = concurrencyIntervals({ from: '2026-12-08', to: '2026-12-10' }, [
      { id: 9, from: '2026-12-08', to: '2026-12-10' },
    ])
    expect(worstCombinedScreening(pipe, pieces, own, [other], intervals)).toBeNull()
  })
})
