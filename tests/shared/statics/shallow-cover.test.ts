import { describe, it, expect } from 'vitest'
import { isShallowCover } from '../../../shared/statics/index.ts'

describe('isShallowCover (issue 3: below 2 outside diameters or below 1 m)', () => {
  it('flags cover below 1 m', () => {
    expect(isShallowCover(0.99, 0.2)).toBe(true)
    expect(isShallowCover(1.0, 0.2)).toBe(false)
  })
  it('flags cover below two diameters', () => {
    expect(isShallowCover(1.59, 0.8)).toBe(true)
    expect(isShallowCover(1.6, 0.8)).toBe(false)
  })
  it('rejects a zero cover naming cover_m', () => {
    expect(() => isShallowCover(0, 0.2)).toThrow(/cover_m/)
  })
})
