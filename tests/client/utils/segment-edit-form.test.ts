import { describe, expect, it } from 'vitest'
import type { PipeSegmentData } from '../../../shared/types/network.ts'
import {
  buildSegmentEdit,
  formFromSegment,
  normaliseFormValue,
} from '../../../src/utils/segment-edit-form.ts'
import { formatFieldValue, unitOfField } from '../../../src/utils/segment-fields.ts'

const stored: PipeSegmentData = {
  ownerRef: 'W-100',
  medium: 'water',
  material: 'PE100',
  outerDiameter_m: 0.2,
  wallThickness_m: 0.0182,
  shortTermModulus_MPa: null,
  longTermModulus_MPa: null,
  allowableStress_MPa: null,
  crushingStrength_kN_per_m: null,
  beddingFactor: null,
  crushingSafetyFactor: null,
  internalPressure_kPa: 600,
  coverStart_m: 1.2,
  coverEnd_m: 1.4,
  installation: 'trench',
  trenchWidth_m: 0.7,
  wallFrictionKMu: 0.165,
  backfillUnitWeight_kN_per_m3: 19,
  frictionAngle_deg: 30,
  sidefillModulus_MPa: 5,
  beddingAngle_deg: 90,
  groundwaterAboveCrown_m: 0,
  designTrafficPressure_kPa: 10,
  deflectionLagFactor: null,
  deflectionLimit_pct: null,
  yearLaid: 1998,
  positionalAccuracy_m: 0.3,
  positionalQuality: 'surveyed',
}

describe('segment edit form', () => {
  it('reads decimal commas and empty inputs', () => {
    expect(normaliseFormValue('coverStart_m', '1,35')).toBe(1.35)
    expect(normaliseFormValue('coverStart_m', '')).toBeNull()
    expect(normaliseFormValue('ownerRef', ' W-1 ')).toBe('W-1')
  })

  it('sends only the changed fields with the version read', () => {
    const form = formFromSegment(stored)
    form.coverStart_m = '1.5'
    form.yearLaid = 2001
    const result = buildSegmentEdit(stored, form, 4)
    expect(result).toEqual({
      ok: true,
      edit: { coverStart_m: 1.5, yearLaid: 2001, version: 4 },
      changed: ['yearLaid', 'coverStart_m'],
    })
  })

  it('when a value breaks a rule, then the error sits at that field', () => {
    const form = formFromSegment(stored)
    form.outerDiameter_m = ''
    form.yearLaid = '1700'
    const result = buildSegmentEdit(stored, form, 1)
    expect(result.ok).toBe(false)
    if (result.ok) return
    expect(Object.keys(result.errors).sort()).toEqual(['outerDiameter_m', 'yearLaid'])
    expect(result.errors.yearLaid).toBe('Must be 1800 or later')
  })

  it('shows numbers with their unit and the agreed decimals', () => {
    expect(unitOfField('backfillUnitWeight_kN_per_m3')).toBe('kN/m³')
    expect(formatFieldValue('wallThickness_m', 0.0182)).toBe('0.018 m')
    expect(formatFieldValue('coverStart_m', 1.2)).toBe('1.20 m')
    expect(formatFieldValue('frictionAngle_deg', 30)).toBe('30°')
    expect(formatFieldValue('internalPressure_kPa', 600)).toBe('600 kPa')
    expect(formatFieldValue('medium', 'water')).toBe('Water')
    expect(formatFieldValue('shortTermModulus_MPa', null)).toBe('—')
  })
})
