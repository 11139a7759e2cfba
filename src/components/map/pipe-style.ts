import type { FeatureLike } from 'ol/Feature'
import { Stroke, Style } from 'ol/style'
import type { StyleFunction } from 'ol/style/Style'
import {
  isPipeMedium,
  MEDIUM_COLOURS,
  MEDIUM_DASHES,
  type PipeMedium,
} from '../../utils/pipe-media.ts'

/** Pipes in the trade's marking colours, on a thin dark casing so yellow reads on a pale map. */
function stylesFor(medium: PipeMedium): Style[] {
  return [
    new Style({
      stroke: new Stroke({ color: 'rgba(27,36,40,0.55)', width: 5.5, lineCap: 'round' }),
      zIndex: 200,
    }),
    new Style({
      stroke: new Stroke({
        color: MEDIUM_COLOURS[medium],
        width: 3.5,
        lineCap: 'round',
        lineDash: MEDIUM_DASHES[medium],
      }),
      zIndex: 201,
    }),
  ]
}

const CACHE = new Map<PipeMedium, Style[]>()

export function createPipeStyle(fallback: PipeMedium = 'other'): StyleFunction {
  return (feature: FeatureLike) => {
    const raw = feature.get('medium') as unknown
    const medium = isPipeMedium(raw) ? raw : fallback
    let styles = CACHE.get(medium)
    if (!styles) {
      styles = stylesFor(medium)
      CACHE.set(medium, styles)
    }
    return styles
  }
}
