import { describe, expect, it } from 'vitest'
import { unitOfField } from '../../../src/utils/pipe-field-words.ts'

describe('unitOfField', () => {
  it('reads the unit from the field name', () => {
    expect(unitOfField('cover_m')).toBe('m')
    expect(unitOfField('crushingStrength_kN_per_m')).toBe('kN/m')
    expect(unitOfField('backfillUnitWeight_kN_per_m3')).toBe('kN/m³')
    expect(unitOfField('beddingFactor')).toBe('')
  })
})
