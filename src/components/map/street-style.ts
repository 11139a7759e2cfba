import type { FeatureLike } from 'ol/Feature'
import { Fill, Stroke, Style, Text } from 'ol/style'
import type { StyleFunction } from 'ol/style/Style'

/**
 * Streets as a plain town plan: white carriageways with a soft casing, names along the line.
 * Widths follow the real carriageway width in metres once zoomed in, with a floor in pixels so
 * the plan stays readable when zoomed out.
 */
type Category = 'main' | 'local' | 'lane'

interface CategoryLook {
  width_m: number
  minWidth_px: number
  /** Labels show below this map resolution (map units per pixel). */
  labelBelowResolution: number
  fill: string
  casing: string
  zIndex: number
}

const LOOKS: Record<Category, CategoryLook> = {
  main: {
    width_m: 11,
    minWidth_px: 4.5,
    labelBelowResolution: 7,
    fill: '#fffdf8',
    casing: '#c9bfa9',
    zIndex: 3,
  },
  local: {
    width_m: 7.5,
    minWidth_px: 3,
    labelBelowResolution: 3.2,
    fill: '#ffffff',
    casing: '#d3ccbf',
    zIndex: 2,
  },
  lane: {
    width_m: 4.5,
    minWidth_px: 2,
    labelBelowResolution: 1.8,
    fill: '#ffffff',
    casing: '#dcd6ca',
    zIndex: 1,
  },
}

/**
 * The view is in Web Mercator, whose units are stretched by 1/cos(latitude); at Wendmoor's
 * latitude (about 52.6°) one map unit is about 0.61 m on the ground.
 */
const GROUND_M_PER_MAP_UNIT = Math.cos((52.6 * Math.PI) / 180)

function categoryOf(feature: FeatureLike): Category {
  const value = feature.get('category') as unknown
  return value === 'main' || value === 'lane' ? value : 'local'
}

export function createStreetStyle(): StyleFunction {
  return (feature, resolution) => {
    const look = LOOKS[categoryOf(feature)]
    const width = Math.max(look.minWidth_px, look.width_m / (resolution * GROUND_M_PER_MAP_UNIT))
    const styles = [
      new Style({
        stroke: new Stroke({ color: look.casing, width: width + 2.5, lineCap: 'round' }),
        zIndex: look.zIndex,
      }),
      new Style({
        stroke: new Stroke({ color: look.fill, width, lineCap: 'round' }),
        zIndex: look.zIndex + 10,
      }),
    ]
    const name = feature.get('name') as unknown
    if (typeof name === 'string' && resolution < look.labelBelowResolution) {
      styles.push(
        new Style({
          zIndex: 100 + look.zIndex,
          text: new Text({
            text: name,
            placement: 'line',
            font: `${categoryOf(feature) === 'main' ? 700 : 400} 12px Lato, sans-serif`,
            fill: new Fill({ color: '#39444a' }),
            stroke: new Stroke({ color: 'rgba(255,255,255,0.95)', width: 3.5 }),
            overflow: false,
            repeat: 600,
          }),
        }),
      )
    }
    return styles
  }
}
