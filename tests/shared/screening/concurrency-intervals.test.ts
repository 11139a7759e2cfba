import { describe, expect, it } from 'vitest'
import {
  concurrencyIntervals,
  rangesOverlap,
} from '../../../shared/screening/concurrency-intervals.ts'

const own = { from: '2026-12-08', to: '2026-12-20' }

describe('concurrencyIntervals', () => {
  it('when nothing else is going on, then the whole range is one interval with no other works', () => {
    expect(concurrencyIntervals(own, [])).toEqual([{ ...own, activeIds: [] }])
  })

  it('when another range lies wholly outside, then it is ignored', () => {
    expect(
      concurrencyIntervals(own, [
        { id: 1, from: '2026-12-01', to: '2026-12-07' },
        { id: 2, from: '2026-12-21', to: '2026-12-30' },
      ]),
    ).toEqual([{ ...own, activeIds: [] }])
  })

  it('when another range overlaps the start, then the range splits at the day after it ends', () => {
    expect(concurrencyIntervals(own, [{ id: 7, from: '2026-12-01', to: '2026-12-10' }])).toEqual([
      { from: '2026-12-08', to: '2026-12-10', activeIds: [7] },
      { from: '2026-12-11', to: '2026-12-20', activeIds: [] },
    ])
  })

  it('when another range only touches on the last day, then that single day is an interval', () => {
    expect(concurrencyIntervals(own, [{ id: 3, from: '2026-12-20', to: '2026-12-31' }])).toEqual([
      { from: '2026-12-08', to: '2026-12-19', activeIds: [] },
      { from: '2026-12-20', to: '2026-12-20', activeIds: [3] },
    ])
  })

  it('when two ranges meet end to start, then they give two intervals with no gap', () => {
    expect(
      concurrencyIntervals(own, [
        { id: 1, from: '2026-12-08', to: '2026-12-12' },
        { id: 2, from: '2026-12-13', to: '2026-12-20' },
      ]),
    ).toEqual([
      { from: '2026-12-08', to: '2026-12-12', activeIds: [1] },
      { from: '2026-12-13', to: '2026-12-20', activeIds: [2] },
    ])
  })

  it('when one range is nested in another, then the middle interval has both', () => {
    expect(
      concurrencyIntervals(own, [
        { id: 1, from: '2026-12-09', to: '2026-12-18' },
        { id: 2, from: '2026-12-12', to: '2026-12-14' },
      ]),
    ).toEqual([
      { from: '2026-12-08', to: '2026-12-08', activeIds: [] },
      { from: '2026-12-09', to: '2026-12-11', activeIds: [1] },
      { from: '2026-12-12', to: '2026-12-14', activeIds: [1, 2] },
      { from: '2026-12-15', to: '2026-12-18', activeIds: [1] },
      { from: '2026-12-19', to: '2026-12-20', activeIds: [] },
    ])
  })

  it('when another range is identical, then there is one interval with it', () => {
    expect(concurrencyIntervals(own, [{ id: 4, ...own }])).toEqual([{ ...own, activeIds: [4] }])
  })

  it('when two others start and end on the same days, then they share one interval', () => {
    expect(
      concurrencyIntervals(own, [
        { id: 9, from: '2026-12-10', to: '2026-12-11' },
        { id: 5, from: '2026-12-10', to: '2026-12-11' },
      ]),
    ).toEqual([
      { from: '2026-12-08', to: '2026-12-09', activeIds: [] },
      { from: '2026-12-10', to: '2026-12-11', activeIds: [5, 9] },
      { from: '2026-12-12', to: '2026-12-20', activeIds: [] },
    ])
  })

  it('when the range crosses a month and a year end, then the days are counted on the calendar', () => {
    expect(
      concurrencyIntervals({ from: '2026-12-30', to: '2027-01-02' }, [
        { id: 1, from: '2026-12-31', to: '2026-12-31' },
      ]),
    ).toEqual([
      { from: '2026-12-30', to: '2026-12-30', activeIds: [] },
      { from: '2026-12-31', to: '2026-12-31', activeIds: [1] },
      { from: '2027-01-01', to: '2027-01-02', activeIds: [] },
    ])
  })

  it('when many ranges overlap, then the intervals cover the range, never repeat a set next to each other, and list exactly the active works', () => {
    const others = Array.from({ length: 40 }, (_, i) => {
      const start = 1 + ((i * 7) % 25)
      const len = (i * 3) % 6
      const d = (n: number) => `2026-12-${String(Math.min(n, 31)).padStart(2, '0')}`
      return { id: i + 1, from: d(start), to: d(start + len) }
    })
    const out = concurrencyIntervals(own, others)
    expect(out[0]!.from).toBe(own.from)
    expect(out[out.length - 1]!.to).toBe(own.to)
    for (let k = 1; k < out.length; k++) {
      expect(out[k]!.activeIds).not.toEqual(out[k - 1]!.activeIds)
    }
    // Day by day, the interval's set equals the works active that day.
    for (const iv of out) {
      for (let d = Number(iv.from.slice(8)); d <= Number(iv.to.slice(8)); d++) {
        const day = `2026-12-${String(d).padStart(2, '0')}`
        const active = others
          .filter((o) => o.from <= day && day <= o.to)
          .map((o) => o.id)
          .sort((a, b) => a - b)
        expect(iv.activeIds).toEqual(active)
      }
    }
  })

  it('when a date is malformed or a range runs backwards, then it throws naming the field', () => {
    expect(() => concurrencyIntervals({ from: '2026-13-01', to: '2026-12-20' }, [])).toThrow(
      /own\.from/,
    )
    expect(() => concurrencyIntervals({ from: '2026-12-20', to: '2026-12-08' }, [])).toThrow(
      /own\.to/,
    )
    expect(() =>
      concurrencyIntervals(own, [{ id: 1, from: '2026-12-10', to: '2026-12-09' }]),
    ).toThrow(/others\[0\]\.to/)
  })
})

describe('rangesOverlap', () => {
  it('counts a shared single day as overlap and neighbouring days as none', () => {
    expect(rangesOverlap(own, { from: '2026-12-20', to: '2026-12-22' })).toBe(true)
    expect(rangesOverlap(own, { from: '2026-12-21', to: '2026-12-22' })).toBe(false)
  })
})
