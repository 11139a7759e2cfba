import { describe, expect, it } from 'vitest'
import { DEFAULT_IMPORT_MAPPING } from '../../../shared/schemas/import-mapping.ts'
import type { ImportPreviewDto } from '../../../shared/types/network.ts'
import {
  mappingFromRows,
  mappingRows,
  missingRequiredFields,
  normaliseAttributeName,
  sampleValue,
  sourceForField,
  untranslatedValues,
} from '../../../src/utils/import-mapping-form.ts'

function preview(attributes: string[], fields: Record<string, string> = {}): ImportPreviewDto {
  return {
    importId: 1,
    format: 'geojson',
    sourceAttributes: attributes,
    sampleFeatures: [
      { REF: 'W-1', DN_MM: 200, Mat: 'PE' },
      { REF: 'W-2', Mat: 'GGG' },
    ],
    mapping: { ...DEFAULT_IMPORT_MAPPING, fields },
    targetFields: [
      { field: 'ownerRef', required: true, unit: null },
      { field: 'medium', required: true, unit: null },
      { field: 'outerDiameter_m', required: true, unit: 'm' },
      { field: 'yearLaid', required: false, unit: null },
    ],
    fileIssues: [],
  }
}

describe('sourceForField', () => {
  it('prefers the saved mapping, then the same name, then a similar name', () => {
    const attrs = ['REF', 'ownerRef', 'Outer_Diameter (m)']
    expect(
      sourceForField('ownerRef', attrs, { ...DEFAULT_IMPORT_MAPPING, fields: { ownerRef: 'REF' } }),
    ).toEqual({
      source: 'REF',
      origin: 'saved',
    })
    expect(sourceForField('ownerRef', attrs, DEFAULT_IMPORT_MAPPING)).toEqual({
      source: 'ownerRef',
      origin: 'same-name',
    })
    expect(sourceForField('outerDiameter_m', attrs, DEFAULT_IMPORT_MAPPING)).toEqual({
      source: 'Outer_Diameter (m)',
      origin: 'similar-name',
    })
    expect(sourceForField('yearLaid', attrs, DEFAULT_IMPORT_MAPPING)).toEqual({
      source: null,
      origin: 'none',
    })
  })

  it('when the saved attribute is not in this file, then it falls back to the names', () => {
    expect(
      sourceForField('ownerRef', ['ownerRef'], {
        ...DEFAULT_IMPORT_MAPPING,
        fields: { ownerRef: 'GONE' },
      }),
    ).toEqual({ source: 'ownerRef', origin: 'same-name' })
  })

  it('normalises names to letters and digits in lower case', () => {
    expect(normaliseAttributeName('Outer_Diameter (m)')).toBe('outerdiameterm')
  })
})

describe('mappingRows and mappingFromRows', () => {
  it('builds one row per target field with label and unit', () => {
    const rows = mappingRows(preview(['REF', 'outerDiameter_m'], { ownerRef: 'REF' }))
    expect(rows.map((r) => [r.field, r.source, r.required, r.unit])).toEqual([
      ['ownerRef', 'REF', true, null],
      ['medium', null, true, null],
      ['outerDiameter_m', 'outerDiameter_m', true, 'm'],
      ['yearLaid', null, false, null],
    ])
    expect(rows[2]?.label).toBe('Outer diameter')
  })

  it('saves only sources whose name differs from the field, keeping the other settings', () => {
    const rows = mappingRows(preview(['REF', 'outerDiameter_m', 'LAID']))
    const year = rows.find((r) => r.field === 'yearLaid')!
    year.source = 'LAID'
    const ref = rows.find((r) => r.field === 'ownerRef')!
    ref.source = 'REF'
    const mapping = mappingFromRows(rows, { ...DEFAULT_IMPORT_MAPPING, diameterUnit: 'mm' })
    expect(mapping.fields).toEqual({ ownerRef: 'REF', yearLaid: 'LAID' })
    expect(mapping.diameterUnit).toBe('mm')
  })

  it('lists required fields nothing fills; a default medium covers the medium', () => {
    const rows = mappingRows(preview(['ownerRef']))
    expect(missingRequiredFields(rows, { defaultMedium: null }).map((r) => r.field)).toEqual([
      'medium',
      'outerDiameter_m',
    ])
    expect(missingRequiredFields(rows, { defaultMedium: 'water' }).map((r) => r.field)).toEqual([
      'outerDiameter_m',
    ])
  })
})

describe('sample values', () => {
  const samples = preview([]).sampleFeatures
  it('shows the first non-empty value of an attribute', () => {
    expect(sampleValue(samples, 'DN_MM')).toBe('200')
    expect(sampleValue(samples, 'MISSING')).toBe('')
    expect(sampleValue(samples, null)).toBe('')
  })

  it('finds words that need translating, once each', () => {
    expect(untranslatedValues(samples, 'Mat', ['PE100'], {})).toEqual(['PE', 'GGG'])
    expect(untranslatedValues(samples, 'Mat', ['PE100'], { PE: 'PE100' })).toEqual(['GGG'])
  })
})
