import { describe, expect, it } from 'vitest'
import {
  describeUtilisation,
  UTILISATION_BANDS,
  utilisationBand,
  utilisationBandIndex,
} from '../../../src/utils/utilisation-bands.ts'

describe('utilisationBand', () => {
  it('puts values into the four bands, an edge belonging to the band above it', () => {
    expect(utilisationBand(0)).toBe('low')
    expect(utilisationBand(0.499)).toBe('low')
    expect(utilisationBand(0.5)).toBe('moderate')
    expect(utilisationBand(0.799)).toBe('moderate')
    expect(utilisationBand(0.8)).toBe('high')
    expect(utilisationBand(1.0)).toBe('high')
    expect(utilisationBand(1.0001)).toBe('over')
    expect(utilisationBand(3)).toBe('over')
  })

  it('when there is no result, then it says not assessed', () => {
    expect(utilisationBand(null)).toBe('none')
    expect(utilisationBand(undefined)).toBe('none')
    expect(utilisationBand(Number.NaN)).toBe('none')
    expect(utilisationBand(Number.POSITIVE_INFINITY)).toBe('none')
  })

  it('gives the index the WebGL style matches on', () => {
    expect(utilisationBandIndex(0.9)).toBe(UTILISATION_BANDS.indexOf('high'))
    expect(utilisationBandIndex(null)).toBe(UTILISATION_BANDS.indexOf('none'))
  })

  it('describes a value in words as well as the number', () => {
    expect(describeUtilisation(0.62)).toBe('0.62 (0.5 to 0.8, some reserve)')
    expect(describeUtilisation(1.2)).toBe('1.20 (Over 1.0, over capacity without works)')
    expect(describeUtilisation(null)).toBe('Not assessed')
  })
})
