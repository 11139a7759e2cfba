import type { CrsTransform } from '../../shared/geo/crs.ts'

type Position = readonly number[]

const xy = (t: CrsTransform, p: Position) =>
  t
    .toGrid(p)
    .map((v) => v.toFixed(3))
    .join(' ')

/**
 * Well-known text in the projected CRS for a GeoJSON geometry given in WGS84 — the form
 * `ST_GeomFromText(?, srid)` takes. Coordinates are rounded to the millimetre.
 */
export function geoJsonToGridWkt(
  t: CrsTransform,
  g:
    | { type: 'Point'; coordinates: Position }
    | { type: 'MultiPoint'; coordinates: Position[] }
    | { type: 'LineString'; coordinates: Position[] }
    | { type: 'Polygon'; coordinates: Position[][] },
): string {
  switch (g.type) {
    case 'Point':
      return `POINT(${xy(t, g.coordinates)})`
    case 'MultiPoint':
      // MariaDB 10.11 reads only the unparenthesised point list.
      return `MULTIPOINT(${g.coordinates.map((p) => xy(t, p)).join(', ')})`
    case 'LineString':
      return `LINESTRING(${g.coordinates.map((p) => xy(t, p)).join(', ')})`
    case 'Polygon':
      return `POLYGON(${g.coordinates.map((ring) => `(${ring.map((p) => xy(t, p)).join(', ')})`).join(', ')})`
  }
}
