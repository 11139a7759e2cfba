/**
 * Our own key for the baseline utilisation of a segment (demand / capacity of its governing
 * check with no works). Four bands with words, plus "not assessed", so the map reads without
 * colour too: over-capacity lines are also drawn wider. Kept free of map-library imports.
 */
export const UTILISATION_BANDS = ['low', 'moderate', 'high', 'over', 'none'] as const
export type UtilisationBand = (typeof UTILISATION_BANDS)[number]

export interface UtilisationBandLook {
  label: string
  /** One line on what the band means. */
  meaning: string
  colour: string
  /** Line width on the map in pixels. */
  width_px: number
}

export const UTILISATION_BAND_LOOKS: Record<UtilisationBand, UtilisationBandLook> = {
  low: { label: 'Under 0.5', meaning: 'Ample reserve', colour: '#5e9c76', width_px: 3 },
  moderate: { label: '0.5 to 0.8', meaning: 'Some reserve', colour: '#c9a227', width_px: 3 },
  high: { label: '0.8 to 1.0', meaning: 'Little reserve', colour: '#d2691e', width_px: 4 },
  over: {
    label: 'Over 1.0',
    meaning: 'Over capacity without works',
    colour: '#a3172b',
    width_px: 6,
  },
  none: { label: 'Not assessed', meaning: 'No baseline result', colour: '#8a8f93', width_px: 2 },
}

/** Lower edges of the bands; a value on an edge belongs to the band above it, except 1.0. */
export const MODERATE_FROM = 0.5
export const HIGH_FROM = 0.8
/** Over capacity means strictly above 1.0, as the server flags it. */
export const OVER_ABOVE = 1.0

/** The band of a utilisation; null or non-finite values are "not assessed". */
export function utilisationBand(utilisation: number | null | undefined): UtilisationBand {
  if (utilisation === null || utilisation === undefined || !Number.isFinite(utilisation))
    return 'none'
  if (utilisation > OVER_ABOVE) return 'over'
  if (utilisation >= HIGH_FROM) return 'high'
  if (utilisation >= MODERATE_FROM) return 'moderate'
  return 'low'
}

/** Position of each band in UTILISATION_BANDS, as the WebGL style matches on numbers. */
export function utilisationBandIndex(utilisation: number | null | undefined): number {
  return UTILISATION_BANDS.indexOf(utilisationBand(utilisation))
}

/** "0.62 (0.5 to 0.8, some reserve)" for a side panel; a dash when there is none. */
export function describeUtilisation(utilisation: number | null | undefined): string {
  const band = UTILISATION_BAND_LOOKS[utilisationBand(utilisation)]
  if (utilisation === null || utilisation === undefined || !Number.isFinite(utilisation)) {
    return band.label
  }
  return `${utilisation.toFixed(2)} (${band.label}, ${band.meaning.toLowerCase()})`
}
