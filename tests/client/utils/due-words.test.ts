import { describe, expect, it } from 'vitest'
import { dueWords } from '../../../src/utils/due-words.ts'

const base = { dueOn: '2026-12-08', paused: false, overdue: false }

describe('dueWords', () => {
  it('counts working days and names the day', () => {
    expect(dueWords({ ...base, dueInWorkingDays: 3 })).toBe('due in 3 working days (Tue 8 Dec)')
    expect(dueWords({ ...base, dueInWorkingDays: 1 })).toBe('due in 1 working day (Tue 8 Dec)')
  })
  it('says today and overdue', () => {
    expect(dueWords({ ...base, dueInWorkingDays: 0 })).toBe('due today (Tue 8 Dec)')
    expect(dueWords({ ...base, dueInWorkingDays: -2, overdue: true })).toBe(
      'overdue by 2 working days (due Tue 8 Dec)',
    )
  })
  it('says when the clock is paused', () => {
    expect(
      dueWords({
        dueOn: null,
        paused: true,
        overdue: false,
        dueInWorkingDays: null,
        remainingWorkingDays: 4,
      }),
    ).toBe('paused: 4 working days left once answered')
  })
})
