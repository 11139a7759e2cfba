import { describe, expect, it } from 'vitest'
import { centsFromInput, inputFromCents } from '../../../src/utils/money-input.ts'

describe('centsFromInput', () => {
  it('reads whole and decimal amounts, with a point or a comma, as whole cents', () => {
    expect(centsFromInput('95')).toBe(9500)
    expect(centsFromInput('95.5')).toBe(9550)
    expect(centsFromInput(' 95,05 ')).toBe(9505)
    expect(centsFromInput('0.07')).toBe(7)
  })

  it('refuses anything that is not a plain amount', () => {
    for (const bad of ['', '-1', '1.234', '1e3', 'EUR 5', '12.'])
      expect(centsFromInput(bad)).toBeNull()
  })

  it('writes cents back with two decimals', () => {
    expect(inputFromCents(9505)).toBe('95.05')
  })
})
