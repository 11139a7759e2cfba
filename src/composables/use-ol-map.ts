import { onBeforeUnmount, onMounted, shallowRef, type Ref } from 'vue'
import OlMap from 'ol/Map'
import View from 'ol/View'
import { defaults as defaultControls, ScaleLine } from 'ol/control'
import { defaults as defaultInteractions } from 'ol/interaction'
import { fromLonLat } from 'ol/proj'

export interface OlMapOptions {
  /** Where the view starts before anything is fitted, [lon, lat] in WGS84. */
  center_lonlat: [number, number]
  zoom: number
}

/**
 * Creates an OpenLayers map in the given element when it mounts, keeps its size in step with
 * the element and disposes of it on unmount. No base tiles: the page background shows through.
 */
export function useOlMap(target: Ref<HTMLElement | null>, options: OlMapOptions) {
  const map = shallowRef<OlMap | null>(null)
  let resizeObserver: ResizeObserver | null = null

  onMounted(() => {
    const element = target.value
    if (!element) return
    const instance = new OlMap({
      target: element,
      layers: [],
      controls: defaultControls({ attribution: false, rotate: false }).extend([
        new ScaleLine({ units: 'metric', minWidth: 80 }),
      ]),
      interactions: defaultInteractions({ altShiftDragRotate: false, pinchRotate: false }),
      view: new View({
        center: fromLonLat(options.center_lonlat),
        zoom: options.zoom,
        minZoom: 11,
        maxZoom: 21,
        enableRotation: false,
        constrainResolution: false,
      }),
    })
    map.value = instance
    if (typeof ResizeObserver !== 'undefined') {
      resizeObserver = new ResizeObserver(() => instance.updateSize())
      resizeObserver.observe(element)
    }
  })

  onBeforeUnmount(() => {
    resizeObserver?.disconnect()
    map.value?.setTarget(undefined)
    map.value?.dispose()
    map.value = null
  })

  return { map }
}
