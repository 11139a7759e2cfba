import type { FeatureCollection, Geometry } from 'geojson'
import type { PipeMedium } from '../../utils/pipe-media.ts'

/**
 * What a page hands to TownMap to draw above the streets. Plain data (GeoJSON in WGS84), so
 * pages and stores never import the map library.
 */
export type MapLayerKind =
  'pipes' | 'works' | 'works-selected' | 'outline' | 'zone' | 'live' | 'emergency'

export interface MapLayerSpec {
  /** Unique per map; also reported back in feature clicks. */
  id: string
  /**
   * 'pipes': lines coloured by each feature's `medium` property (or `medium` below);
   * 'works': planned works in the works colour; 'works-selected': works picked out by the
   * user, drawn bolder and labelled with each feature's `reference`; 'outline': a neutral
   * boundary; 'zone': a hand-dig zone (band where no machine may dig); 'live': works on site
   * now; 'emergency': emergency works started before any permit.
   */
  kind: MapLayerKind
  /** Shown in the legend. */
  title: string
  data: FeatureCollection<Geometry | null>
  /** Fallback medium for pipe features without a `medium` property. */
  medium?: PipeMedium
  /** Defaults to true. */
  visible?: boolean
}

/** Emitted when the user clicks a feature of one of the extra layers. */
export interface MapFeatureClick {
  layerId: string
  featureId: string | number | undefined
  properties: Record<string, unknown>
}

/** One line of the map key. */
export interface LegendEntry {
  key: string
  label: string
  colour: string
  shape: 'line' | 'dashed-line' | 'area' | 'solid-area'
}
