/**
 * Pipe media and how maps draw them. The colours follow the uniform colour code the trade uses
 * to mark buried utilities on site (potable water blue, gas/oil/steam yellow, sewer and drain
 * green), so a reader knows a line at a glance. Planned works use magenta, which marks no
 * medium in that code. Kept free of map-library imports so any page may use it.
 */
export const PIPE_MEDIA = ['water', 'sewer', 'gas', 'district_heating', 'other'] as const
export type PipeMedium = (typeof PIPE_MEDIA)[number]

export const MEDIUM_LABELS: Record<PipeMedium, string> = {
  water: 'Water',
  sewer: 'Sewer and drain',
  gas: 'Gas',
  district_heating: 'District heating',
  other: 'Other',
}

/**
 * Line colours on a light map. The code's yellow is darkened slightly to stay readable on a
 * pale background; district heating carries steam/hot water and shares gas's yellow, drawn
 * dashed to tell them apart.
 */
export const MEDIUM_COLOURS: Record<PipeMedium, string> = {
  water: '#1f63c6',
  sewer: '#2f8a3a',
  gas: '#e3b100',
  district_heating: '#e3b100',
  other: '#7a7f83',
}

/** Dash pattern per medium in screen pixels; undefined draws a solid line. */
export const MEDIUM_DASHES: Record<PipeMedium, number[] | undefined> = {
  water: undefined,
  sewer: undefined,
  gas: undefined,
  district_heating: [10, 5],
  other: [4, 4],
}

/** Planned works (excavations, crane pads, stockpiles): a colour no medium uses. */
export const WORKS_COLOUR = '#c2188f'

export function isPipeMedium(value: unknown): value is PipeMedium {
  return typeof value === 'string' && (PIPE_MEDIA as readonly string[]).includes(value)
}
