import { describe, expect, it } from 'vitest'
import {
  addWorkingDays,
  isWorkingDay,
  workingDaysBetween,
} from '../../../shared/time/working-days.ts'

// Calendar facts (2026-12-04 is a Friday; 2026-12-25 a Friday). Holidays are configured per
// deployment; the ones here are examples.
const NONE = new Set<string>()
const XMAS = new Set(['2026-12-25', '2026-12-28'])

describe('addWorkingDays', () => {
  it('skips the weekend: Friday + 3 working days is Wednesday', () => {
    expect(addWorkingDays('2026-12-04', 3, NONE)).toBe('2026-12-09')
  })
  it('skips configured holidays as well', () => {
    // Thu 24 Dec + 2: Fri 25 (holiday), Sat, Sun, Mon 28 (holiday) do not count -> Tue 29, Wed 30.
    expect(addWorkingDays('2026-12-24', 2, XMAS)).toBe('2026-12-30')
  })
  it('with 0 days moves a weekend start to the next working day', () => {
    expect(addWorkingDays('2026-12-05', 0, NONE)).toBe('2026-12-07')
    expect(addWorkingDays('2026-12-07', 0, NONE)).toBe('2026-12-07')
  })
  it('rejects a negative or fractional period naming the parameter', () => {
    expect(() => addWorkingDays('2026-12-04', -1, NONE)).toThrow(/days/)
    expect(() => addWorkingDays('2026-12-04', 1.5, NONE)).toThrow(/days/)
    expect(() => addWorkingDays('not a date', 1, NONE)).toThrow(/start/)
  })
})

describe('workingDaysBetween', () => {
  it('counts forward and backward', () => {
    expect(workingDaysBetween('2026-12-04', '2026-12-09', NONE)).toBe(3)
    expect(workingDaysBetween('2026-12-09', '2026-12-04', NONE)).toBe(-3)
    expect(workingDaysBetween('2026-12-04', '2026-12-04', NONE)).toBe(0)
  })
  it('agrees with addWorkingDays', () => {
    for (let n = 0; n < 30; n++) {
      expect(workingDaysBetween('2026-12-01', addWorkingDays('2026-12-01', n, XMAS), XMAS)).toBe(n)
    }
  })
})

describe('isWorkingDay', () => {
  it('knows weekends and holidays', () => {
    expect(isWorkingDay('2026-12-05', NONE)).toBe(false)
    expect(isWorkingDay('2026-12-25', XMAS)).toBe(false)
    expect(isWorkingDay('2026-12-23', XMAS)).toBe(true)
  })
})
