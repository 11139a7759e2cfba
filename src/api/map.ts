import type { FeatureCollection, LineString, MultiLineString } from 'geojson'
import { http } from './http.ts'

export type StreetCategory = 'main' | 'local' | 'lane'

export interface StreetProperties {
  name: string
  category: StreetCategory
}

/** The town's streets in WGS84 (RFC 7946). */
export type StreetCollection = FeatureCollection<LineString | MultiLineString, StreetProperties>

export interface MapSettings {
  center_lonlat: [number, number]
  zoom: number
  /** The metric CRS the server stores geometry in, e.g. 25832. */
  projectedEpsg: number
}

export function fetchStreets(): Promise<StreetCollection> {
  return http.get<StreetCollection>('/streets')
}

export function fetchMapSettings(): Promise<MapSettings> {
  return http.get<MapSettings>('/map/settings')
}
