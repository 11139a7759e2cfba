import { QueryTypes } from 'sequelize'
import type { Sequelize } from 'sequelize'
import { crsTransform } from '../../shared/geo/crs.ts'
import {
  polylineToPolygonDistance,
  polylineToPolylineDistance,
} from '../../shared/geo/planar-distance.ts'
import type { PipeMedium } from '../../shared/types/network.ts'
import { organisationNames } from './organisation-names.ts'

/** A shape in the projected CRS: a polygon (outer ring, then holes), a polyline or a point set. */
export type GridShape =
  | { type: 'Polygon'; rings: [number, number][][] }
  | { type: 'LineString'; coordinates: [number, number][] }
  | { type: 'Points'; coordinates: [number, number][] }

/** A segment near a shape, with its exact distance and projected line (for pipe-local frames). */
export interface SegmentNear {
  id: number
  ownerOrganisationId: number
  ownerName: string
  medium: PipeMedium
  /** Exact planar distance from the shape (0 when touching, crossing or inside), metres. */
  distance_m: number
  /** The segment's vertices in the projected CRS, metres. */
  grid: [number, number][]
}

/**
 * Extra width added to the database buffer, m (plus 1 % of the distance). ST_Buffer draws arcs
 * as chords, so its buffer can fall a few millimetres short of the true one; the wider buffer
 * only selects candidates, and the exact distance in TypeScript decides.
 */
export const BUFFER_MARGIN_M = 0.05

/**
 * A WGS84 bbox as a WKT rectangle in the projected CRS that encloses it: the bbox's corners and
 * edge midpoints are projected and their extremes taken (a projected bbox is not a rectangle).
 * For MBRIntersects selections on the spatial index.
 *
 * @param bbox - minLon, minLat, maxLon, maxLat in degrees
 */
export function gridBoxWkt(bbox: readonly [number, number, number, number], epsg: number): string {
  const [minLon, minLat, maxLon, maxLat] = bbox
  const t = crsTransform(epsg)
  const midLon = (minLon + maxLon) / 2
  const midLat = (minLat + maxLat) / 2
  const pts = [
    [minLon, minLat],
    [maxLon, minLat],
    [maxLon, maxLat],
    [minLon, maxLat],
    [midLon, minLat],
    [midLon, maxLat],
    [minLon, midLat],
    [maxLon, midLat],
  ].map((p) => t.toGrid(p))
  const xs = pts.map((p) => p[0])
  const ys = pts.map((p) => p[1])
  const [x0, x1, y0, y1] = [Math.min(...xs), Math.max(...xs), Math.min(...ys), Math.max(...ys)]
  return `POLYGON((${x0} ${y0},${x1} ${y0},${x1} ${y1},${x0} ${y1},${x0} ${y0}))`
}

function wktOf(shape: GridShape): string {
  const xy = (p: readonly number[]) => `${p[0]} ${p[1]}`
  switch (shape.type) {
    case 'Polygon':
      return `POLYGON(${shape.rings.map((r) => `(${r.map(xy).join(',')})`).join(',')})`
    case 'LineString':
      return `LINESTRING(${shape.coordinates.map(xy).join(',')})`
    case 'Points':
      // MariaDB 10.11 returns NULL for the parenthesised form MULTIPOINT((x y), ...).
      return `MULTIPOINT(${shape.coordinates.map(xy).join(',')})`
  }
}

function exactDistance(shape: GridShape, line: [number, number][]): number {
  if (shape.type === 'Polygon') return polylineToPolygonDistance(line, shape.rings)
  if (shape.type === 'LineString') return polylineToPolylineDistance(line, shape.coordinates)
  return Math.min(...shape.coordinates.map((p) => polylineToPolylineDistance(line, [p])))
}

/**
 * The candidate selection of findSegmentsNear as SQL and replacements (the scale benchmark
 * prints its EXPLAIN to show the spatial index is used).
 */
export function segmentsNearQuery(
  epsg: number,
  shape: GridShape,
  distance_m: number,
  opts: { ownerOrganisationId?: number } = {},
): { sql: string; replacements: unknown[] } {
  const buffer_m = distance_m * 1.01 + BUFFER_MARGIN_M
  const replacements: unknown[] = [wktOf(shape), buffer_m]
  let ownerClause = ''
  if (opts.ownerOrganisationId !== undefined) {
    ownerClause = ' AND s.owner_organisation_id = ?'
    replacements.push(opts.ownerOrganisationId)
  }
  return {
    sql: `SELECT s.id, s.owner_organisation_id AS ownerOrganisationId, s.medium, ST_AsGeoJSON(s.geom) AS g
       FROM pipe_segments s FORCE INDEX (pipe_segments_geom)
      WHERE ST_Intersects(s.geom, ST_Buffer(ST_GeomFromText(?, ${Number(epsg)}), ?))${ownerClause}`,
    replacements,
  }
}

/**
 * Every stored segment within `distance_m` of the shape (projected coordinates), nearest first.
 *
 * Candidates come from the spatial index with `ST_Intersects(geom, ST_Buffer(shape, d'))`
 * written as the WHERE predicate itself (a `fn(...) = 1` comparison would skip the index,
 * stack-notes P5); MariaDB's ST_Distance is not used because it is wrong for some line/polygon
 * pairs (P2). The exact distance is then computed in TypeScript (shared/geo/planar-distance.ts)
 * and decides. `ST_Buffer` returns SRID 0; the index is still used (stack-notes §3).
 *
 * Data protection: this returns no design data; callers that run the engine load the segment
 * rows themselves and must apply the access rules of network-access.ts to anything they show.
 *
 * The spatial index is forced: with an owner filter and a large shape MariaDB 10.11 otherwise
 * picks a plan that fails with error 1207 (update locks in READ UNCOMMITTED).
 *
 * @param shape - polygon rings, polyline or points in the projected CRS (metres)
 * @param distance_m - influence distance, metres, >= 0
 * @param opts - restrict to one owner
 */
export async function findSegmentsNear(
  sequelize: Sequelize,
  epsg: number,
  shape: GridShape,
  distance_m: number,
  opts: { ownerOrganisationId?: number } = {},
): Promise<SegmentNear[]> {
  if (!Number.isFinite(distance_m) || distance_m < 0)
    throw new RangeError(`distance_m must be a finite number >= 0 (got ${distance_m})`)
  const { sql, replacements } = segmentsNearQuery(epsg, shape, distance_m, opts)
  const rows = await sequelize.query<{
    id: number
    ownerOrganisationId: number
    medium: PipeMedium
    g: unknown
  }>(sql, { replacements, type: QueryTypes.SELECT })
  const names = await organisationNames(
    sequelize,
    rows.map((r) => r.ownerOrganisationId),
  )
  const out: SegmentNear[] = []
  for (const r of rows) {
    const g = (typeof r.g === 'string' ? JSON.parse(r.g) : r.g) as {
      coordinates: [number, number][]
    }
    const d = exactDistance(shape, g.coordinates)
    if (d <= distance_m) {
      out.push({
        id: Number(r.id),
        ownerOrganisationId: r.ownerOrganisationId,
        ownerName: names.get(r.ownerOrganisationId) ?? '',
        medium: r.medium,
        distance_m: d,
        grid: g.coordinates,
      })
    }
  }
  return out.sort((a, b) => a.distance_m - b.distance_m || a.id - b.id)
}
