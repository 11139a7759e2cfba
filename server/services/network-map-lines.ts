import { QueryTypes } from 'sequelize'
import type { Sequelize } from 'sequelize'
import { crsTransform } from '../../shared/geo/crs.ts'
import { MAP_LINES_DETAIL_ZOOM } from '../../shared/types/network.ts'
import type { MapLineCollection, PipeMedium } from '../../shared/types/network.ts'
import { gridBoxWkt } from './spatial-query.ts'

/** Decimal places of the returned lon/lat: 6 is about 0.1 m, well inside a line's width. */
const LON_LAT_DECIMALS = 6

/** What to select: a view, its zoom level and whose segments (null: every owner's, admins). */
export interface MapLinesRequest {
  bbox: readonly [number, number, number, number]
  zoom: number
  ownerOrganisationId: number | null
}

/**
 * The SQL of the map-lines selection, exported so a test can EXPLAIN exactly this query.
 * `MBRIntersects(geom, box)` is the WHERE predicate itself, so MariaDB uses the spatial index
 * (a `= 1` comparison would skip it, stack-notes P5). One row more than `maxFeatures` is read
 * to tell whether the view was cut.
 *
 * FORCE INDEX: with the owner filter, MariaDB 10.11.19 may weigh the owner indexes against the
 * spatial one for a large view and then fails the statement (EXPLAIN included) with "ERROR 1207
 * Update locks cannot be acquired during a READ UNCOMMITTED transaction" (reproduced here for
 * an 800 m view; the same fault as in organisation-names.ts). Forcing the spatial index avoids
 * that plan, and it is the right one for a map view anyway.
 */
export function mapLinesQuery(
  epsg: number,
  request: MapLinesRequest,
  maxFeatures: number,
): { sql: string; replacements: unknown[] } {
  const endsOnly = request.zoom < MAP_LINES_DETAIL_ZOOM
  const geometry = endsOnly
    ? `ST_X(ST_StartPoint(s.geom)) AS x0, ST_Y(ST_StartPoint(s.geom)) AS y0,
       ST_X(ST_EndPoint(s.geom)) AS x1, ST_Y(ST_EndPoint(s.geom)) AS y1`
    : 'ST_AsGeoJSON(s.geom) AS g'
  const replacements: unknown[] = [gridBoxWkt(request.bbox, epsg)]
  let ownerClause = ''
  if (request.ownerOrganisationId !== null) {
    ownerClause = ' AND s.owner_organisation_id = ?'
    replacements.push(request.ownerOrganisationId)
  }
  const sql = `SELECT s.id, s.medium, s.baseline_utilisation AS u, s.baseline_over_capacity AS o,
       ${geometry}
       FROM pipe_segments s FORCE INDEX (pipe_segments_geom)
      WHERE MBRIntersects(s.geom, ST_GeomFromText(?, ${Number(epsg)}))${ownerClause}
      LIMIT ${Math.floor(Number(maxFeatures)) + 1}`
  return { sql, replacements }
}

interface MapLineRow {
  id: number
  medium: PipeMedium
  u: number | string | null
  o: number | boolean
  g?: unknown
  x0?: number
  y0?: number
  x1?: number
  y1?: number
}

/**
 * The owner's segments in a map view, compact (see MapLineFeature): id, medium, baseline
 * utilisation, over-capacity flag and the line in WGS84 rounded to 6 decimals. Below zoom
 * MAP_LINES_DETAIL_ZOOM each line is only its two end points. At most `maxFeatures` segments;
 * `truncated` says the view held more.
 *
 * The bbox is turned into a projected rectangle enclosing it, so a segment whose bounding box
 * touches the view is returned even when the line itself just misses it (harmless for a map).
 *
 * Data protection: callers pass the owner from segmentReadScope (network-access.ts); null
 * (every owner) is for admins only.
 *
 * @param bbox - minLon, minLat, maxLon, maxLat in WGS84 degrees (in `request`)
 * @param maxFeatures - limit, MAP_LINES_MAX_FEATURES
 */
export async function mapLinesInBox(
  sequelize: Sequelize,
  epsg: number,
  request: MapLinesRequest,
  maxFeatures: number,
): Promise<MapLineCollection> {
  const { sql, replacements } = mapLinesQuery(epsg, request, maxFeatures)
  const rows = await sequelize.query<MapLineRow>(sql, { replacements, type: QueryTypes.SELECT })
  const t = crsTransform(epsg)
  const scale = 10 ** LON_LAT_DECIMALS
  const round = (v: number) => Math.round(v * scale) / scale
  const lonLat = (x: number, y: number): [number, number] => {
    const [lon, lat] = t.toLonLat([x, y])
    return [round(lon), round(lat)]
  }
  const truncated = rows.length > maxFeatures
  return {
    type: 'FeatureCollection',
    truncated,
    features: rows.slice(0, maxFeatures).map((r) => {
      let coordinates: [number, number][]
      if (r.g === undefined) {
        coordinates = [lonLat(Number(r.x0), Number(r.y0)), lonLat(Number(r.x1), Number(r.y1))]
      } else {
        const g = (typeof r.g === 'string' ? JSON.parse(r.g) : r.g) as { coordinates: number[][] }
        coordinates = g.coordinates.map((c) => lonLat(c[0]!, c[1]!))
      }
      return {
        type: 'Feature',
        id: Number(r.id),
        properties: {
          m: r.medium,
          u: r.u === null ? null : Number(r.u),
          o: r.o === true || Number(r.o) === 1 ? 1 : 0,
        },
        geometry: { type: 'LineString', coordinates },
      }
    }),
  }
}
