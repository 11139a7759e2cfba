import type { FeatureLike } from 'ol/Feature'
import { Stroke, Style } from 'ol/style'
import type { FlatStyleLike } from 'ol/style/flat'
import type { StyleFunction } from 'ol/style/Style'
import {
  MEDIUM_COLOURS,
  MEDIUM_DASHES,
  PIPE_MEDIA,
  type PipeMedium,
} from '../../utils/pipe-media.ts'
import {
  UTILISATION_BAND_LOOKS,
  UTILISATION_BANDS,
  type UtilisationBand,
} from '../../utils/utilisation-bands.ts'

/**
 * How the network map draws segments, by medium (the trade's marking colours) or by baseline
 * utilisation band (our own key). Features carry two numbers set when they are read:
 * `mediumIndex` (position in PIPE_MEDIA) and `band` (position in UTILISATION_BANDS), because
 * the WebGL renderer matches numbers more cheaply than text.
 */
export type ColourBy = 'medium' | 'utilisation'

export const COLOUR_BY_CODE: Record<ColourBy, number> = { medium: 0, utilisation: 1 }

const CASING = 'rgba(27,36,40,0.5)' // canvas fallback only
const SELECTED_WIDTH_PX = 8
const MEDIUM_WIDTH_PX = 3.5
const DISTRICT_HEATING = PIPE_MEDIA.indexOf('district_heating')

/**
 * The value for a small whole-number property, as a chain of "below index + 0.5" tests rather
 * than exact matches: the GPU receives the number as a float, and equality on it proved
 * unreliable under software WebGL (part of a line fell through to the fallback).
 */
function matchBy(property: string, values: (string | number)[], fallback: string | number) {
  const args: unknown[] = []
  values.forEach((value, index) => args.push(['<', ['get', property], index + 0.5], value))
  return ['case', ...args, fallback]
}

const mediumColour = matchBy(
  'mediumIndex',
  PIPE_MEDIA.map((m) => MEDIUM_COLOURS[m]),
  MEDIUM_COLOURS.other,
)
const bandColour = matchBy(
  'band',
  UTILISATION_BANDS.map((b) => UTILISATION_BAND_LOOKS[b].colour),
  UTILISATION_BAND_LOOKS.none.colour,
)
const bandWidth = matchBy(
  'band',
  UTILISATION_BANDS.map((b) => UTILISATION_BAND_LOOKS[b].width_px),
  2,
)

const byUtilisation = ['==', ['var', 'colourBy'], COLOUR_BY_CODE.utilisation]
const isSelected = ['<', ['abs', ['-', ['get', 'segmentId'], ['var', 'selectedId']]], 0.5]
const lineWidth = ['case', isSelected, SELECTED_WIDTH_PX, byUtilisation, bandWidth, MEDIUM_WIDTH_PX]
const lineColour = ['case', byUtilisation, bandColour, mediumColour]
const dashed = [
  'all',
  ['!', byUtilisation],
  ['<', ['abs', ['-', ['get', 'mediumIndex'], DISTRICT_HEATING]], 0.5],
]

/** Style variables the WebGL layer starts with. */
export function networkStyleVariables(colourBy: ColourBy, selectedId: number | null) {
  return { colourBy: COLOUR_BY_CODE[colourBy], selectedId: selectedId ?? -1 }
}

/**
 * The WebGL layer's flat style: one stroke per line, no casing. A casing rule would double the
 * draw passes for 100,000 segments, and SwiftShader showed it bleeding over wide lines.
 */
export function networkWebGlStyle(): FlatStyleLike {
  return [
    {
      filter: ['!', dashed],
      style: { 'stroke-color': lineColour, 'stroke-width': lineWidth, 'stroke-line-cap': 'round' },
    },
    {
      filter: dashed,
      style: {
        'stroke-color': lineColour,
        'stroke-width': lineWidth,
        'stroke-line-dash': [10, 5],
      },
    },
  ] as FlatStyleLike
}

/** The same look on a canvas, for browsers without WebGL. */
export function networkCanvasStyle(
  state: () => { colourBy: ColourBy; selectedId: number | null },
): StyleFunction {
  const cache = new Map<string, Style[]>()
  return (feature: FeatureLike) => {
    const { colourBy, selectedId } = state()
    const medium = (PIPE_MEDIA[Number(feature.get('mediumIndex'))] ?? 'other') as PipeMedium
    const band = (UTILISATION_BANDS[Number(feature.get('band'))] ?? 'none') as UtilisationBand
    const selected = selectedId !== null && feature.get('segmentId') === selectedId
    const key = `${colourBy}|${colourBy === 'medium' ? medium : band}|${selected}`
    let styles = cache.get(key)
    if (!styles) {
      const look = UTILISATION_BAND_LOOKS[band]
      const width = selected
        ? SELECTED_WIDTH_PX
        : colourBy === 'utilisation'
          ? look.width_px
          : MEDIUM_WIDTH_PX
      const colour = colourBy === 'utilisation' ? look.colour : MEDIUM_COLOURS[medium]
      styles = [
        new Style({
          stroke: new Stroke({ color: selected ? '#1b2428' : CASING, width: width + 2 }),
          zIndex: 1,
        }),
        new Style({
          stroke: new Stroke({
            color: colour,
            width,
            lineCap: 'round',
            lineDash: colourBy === 'medium' ? MEDIUM_DASHES[medium] : undefined,
          }),
          zIndex: selected ? 3 : 2,
        }),
      ]
      cache.set(key, styles)
    }
    return styles
  }
}

/** True when the browser can give the map a WebGL context. */
export function webGlAvailable(): boolean {
  try {
    const canvas = document.createElement('canvas')
    return Boolean(canvas.getContext('webgl2') ?? canvas.getContext('webgl'))
  } catch {
    return false
  }
}
