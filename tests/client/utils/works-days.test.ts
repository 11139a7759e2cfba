import { describe, expect, it } from 'vitest'
import {
  activeOn,
  axisTicks,
  barPlacement,
  daysInPeriod,
  shiftDay,
} from '../../../src/utils/works-days.ts'

// Calendar-day arithmetic of the works map; both ends of every period count.

describe('works-days', () => {
  it('when a period runs from the 1st to the 10th, then it has 10 days, and shifting crosses month ends', () => {
    expect(daysInPeriod('2026-12-01', '2026-12-10')).toBe(10)
    expect(daysInPeriod('2026-12-05', '2026-12-05')).toBe(1)
    expect(shiftDay('2026-12-30', 3)).toBe('2027-01-02')
  })

  it('when works run from the 8th to the 10th, then they are on site on both end days only within', () => {
    const w = { startsOn: '2026-12-08', endsOn: '2026-12-10' }
    expect(
      ['2026-12-07', '2026-12-08', '2026-12-10', '2026-12-11'].map((d) => activeOn(w, d)),
    ).toEqual([false, true, true, false])
    expect(activeOn({ from: '2026-12-08', to: '2026-12-08' }, '2026-12-08')).toBe(true)
  })

  it('when a bar lies inside, across an edge or outside the period, then it is placed, clipped or left out', () => {
    const p = { from: '2026-12-01', to: '2026-12-10' }
    expect(barPlacement(p, '2026-12-03', '2026-12-04')).toEqual({
      left: 0.2,
      width: 0.2,
      clippedStart: false,
      clippedEnd: false,
    })
    expect(barPlacement(p, '2026-11-20', '2026-12-01')).toEqual({
      left: 0,
      width: 0.1,
      clippedStart: true,
      clippedEnd: false,
    })
    expect(barPlacement(p, '2026-12-10', '2027-01-05')).toMatchObject({
      left: 0.9,
      width: 0.1,
      clippedEnd: true,
    })
    expect(barPlacement(p, '2026-12-11', '2026-12-12')).toBeNull()
  })

  it('when the period is long, then the axis shows Mondays or month starts, never more than asked', () => {
    expect(axisTicks('2026-12-01', '2026-12-07')).toHaveLength(7)
    const weeks = axisTicks('2026-12-01', '2027-01-31')
    expect(weeks.every((d) => new Date(`${d}T12:00:00`).getDay() === 1)).toBe(true)
    expect(weeks.length).toBeLessThanOrEqual(14)
    const year = axisTicks('2026-01-01', '2026-12-31')
    expect(year.length).toBeLessThanOrEqual(14)
    expect(year.length).toBeGreaterThanOrEqual(2)
  })
})
