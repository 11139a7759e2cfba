import type { FeatureLike } from 'ol/Feature'
import { Circle, Fill, Stroke, Style, Text } from 'ol/style'
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

/**
 * Works the user picked out (a clash, an application): a solid, wider outline over a dark
 * halo and a stronger fill, labelled with the feature's `reference` (decluttered by the layer).
 */
export function createSelectedWorksStyle(): (feature: FeatureLike) => Style[] {
  const halo = new Style({
    stroke: new Stroke({ color: 'rgba(27, 36, 40, 0.85)', width: 7 }),
    image: new Circle({ radius: 10, fill: new Fill({ color: 'rgba(27, 36, 40, 0.85)' }) }),
    zIndex: 400,
  })
  const body = new Style({
    stroke: new Stroke({ color: WORKS_COLOUR, width: 4 }),
    fill: new Fill({ color: 'rgba(194, 24, 143, 0.38)' }),
    image: new Circle({
      radius: 7,
      fill: new Fill({ color: WORKS_COLOUR }),
      stroke: new Stroke({ color: '#fff', width: 2 }),
    }),
    zIndex: 401,
  })
  // Labels of neighbouring works alternate above and below their marks, so two works a few
  // metres apart both keep a readable label; the layer's declutter drops any further overlap.
  const label = (text: string, below: boolean) =>
    new Style({
      text: new Text({
        text,
        font: '700 12px Lato, sans-serif',
        fill: new Fill({ color: '#1b2428' }),
        stroke: new Stroke({ color: '#fff', width: 4 }),
        offsetY: below ? 20 : -18,
        overflow: true,
      }),
      zIndex: 402,
    })
  const labels = new Map<string, Style>()
  return (feature) => {
    const ref = feature.get('reference') as string | undefined
    if (!ref) return [halo, body]
    let l = labels.get(ref)
    if (!l) labels.set(ref, (l = label(ref, labels.size % 2 === 1)))
    return [halo, body, l]
  }
}

/** A neutral boundary, e.g. an application's site. */
export function createOutlineStyle(): Style {
  return new Style({
    stroke: new Stroke({ color: '#1b2428', width: 1.5, lineDash: [3, 4] }),
    fill: new Fill({ color: 'rgba(27, 36, 40, 0.04)' }),
    zIndex: 150,
  })
}

/** Colour of hand-dig zones: a dark orange no pipe medium uses. */
export const HAND_DIG_COLOUR = '#d35400'

/** A hand-dig zone: a solid dark-orange edge with a light orange fill. */
export function createZoneStyle(): Style {
  return new Style({
    stroke: new Stroke({ color: HAND_DIG_COLOUR, width: 1.5 }),
    fill: new Fill({ color: 'rgba(211, 84, 0, 0.22)' }),
    zIndex: 200,
  })
}

/** Colour of emergency works: a strong red. */
export const EMERGENCY_COLOUR = '#c62828'

/** Works on site now: the works colour, solid and heavier than planned works. */
export function createLiveStyle(): Style {
  const fill = new Fill({ color: 'rgba(194, 24, 143, 0.38)' })
  return new Style({
    stroke: new Stroke({ color: WORKS_COLOUR, width: 3.5 }),
    fill,
    image: new Circle({ radius: 8, fill, stroke: new Stroke({ color: WORKS_COLOUR, width: 3 }) }),
    zIndex: 320,
  })
}

/** Emergency works: red, solid, with a large dot for a point. */
export function createEmergencyStyle(): Style {
  const fill = new Fill({ color: 'rgba(198, 40, 40, 0.35)' })
  return new Style({
    stroke: new Stroke({ color: EMERGENCY_COLOUR, width: 3 }),
    fill,
    image: new Circle({
      radius: 9,
      fill,
      stroke: new Stroke({ color: EMERGENCY_COLOUR, width: 3 }),
    }),
    zIndex: 340,
  })
}
