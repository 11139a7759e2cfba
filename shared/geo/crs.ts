import proj4 from 'proj4'

/**
 * Projected metric coordinate reference systems Trenchward can store geometry in. Distances and
 * the statics engine's pipe-local frames are computed in these, never in degrees.
 * Source: EPSG Geodetic Parameter Dataset (proj4 definitions as published with each code).
 */
export const PROJECTED_CRS_DEFINITIONS: Readonly<Record<number, string>> = {
  25832: '+proj=utm +zone=32 +ellps=GRS80 +towgs84=0,0,0,0,0,0,0 +units=m +no_defs +type=crs',
  25833: '+proj=utm +zone=33 +ellps=GRS80 +towgs84=0,0,0,0,0,0,0 +units=m +no_defs +type=crs',
  32632: '+proj=utm +zone=32 +datum=WGS84 +units=m +no_defs +type=crs',
  32633: '+proj=utm +zone=33 +datum=WGS84 +units=m +no_defs +type=crs',
  2157: '+proj=tmerc +lat_0=53.5 +lon_0=-8 +k=0.99982 +x_0=600000 +y_0=750000 +ellps=GRS80 +towgs84=0,0,0,0,0,0,0 +units=m +no_defs +type=crs',
  27700:
    '+proj=tmerc +lat_0=49 +lon_0=-2 +k=0.9996012717 +x_0=400000 +y_0=-100000 +ellps=airy +towgs84=446.448,-125.157,542.06,0.15,0.247,0.842,-20.489 +units=m +no_defs +type=crs',
}

export type LonLat = [lon: number, lat: number]
export type GridXY = [x_m: number, y_m: number]

export interface CrsTransform {
  epsg: number
  /** WGS84 lon/lat (RFC 7946 order) to projected metres. */
  toGrid(lonLat: readonly number[]): GridXY
  /** Projected metres to WGS84 lon/lat. */
  toLonLat(xy: readonly number[]): LonLat
}

const cache = new Map<number, CrsTransform>()

/** A cached pair of transforms between WGS84 and the given projected EPSG code. */
export function crsTransform(epsg: number): CrsTransform {
  const hit = cache.get(epsg)
  if (hit) return hit
  const def = PROJECTED_CRS_DEFINITIONS[epsg]
  if (!def) throw new RangeError(`epsg: ${epsg} is not a supported projected CRS`)
  const converter = proj4('EPSG:4326', def)
  const t: CrsTransform = {
    epsg,
    toGrid: (p) => converter.forward([p[0] as number, p[1] as number]) as GridXY,
    toLonLat: (p) => converter.inverse([p[0] as number, p[1] as number]) as LonLat,
  }
  cache.set(epsg, t)
  return t
}
