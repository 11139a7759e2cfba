import { Circle, Fill, Stroke, Style } from 'ol/style'
import { WORKS_COLOUR } from '../../utils/pipe-media.ts'

/** Planned works: a dashed magenta outline with a light fill; points as ringed dots. */
export function createWorksStyle(): Style {
  const stroke = new Stroke({ color: WORKS_COLOUR, width: 2.5, lineDash: [8, 5] })
  const fill = new Fill({ color: 'rgba(194, 24, 143, 0.16)' })
  return new Style({
    stroke,
    fill,
    image: new Circle({ radius: 7, fill, stroke: new Stroke({ color: WORKS_COLOUR, width: 2.5 }) }),
    zIndex: 300,
  })
}

/** A neutral boundary, e.g. an application's site. */
export function createOutlineStyle(): Style {
  return new Style({
    stroke: new Stroke({ color: '#1b2428', width: 1.5, lineDash: [3, 4] }),
    fill: new Fill({ color: 'rgba(27, 36, 40, 0.04)' }),
    zIndex: 150,
  })
}
