import { QueryTypes } from 'sequelize'
import type { Sequelize } from 'sequelize'
import type { OutlineCollection, PipeMedium } from '../../shared/types/network.ts'
import { gridToLonLat } from './network-segments.ts'
import { organisationNames } from './organisation-names.ts'
import { gridBoxWkt } from './spatial-query.ts'

/**
 * The public screening outline in a map view: where pipes lie, whose they are and what they
 * carry, for any signed-in user. Deliberately no design data, no owner reference, no baseline:
 * only id, owner name and medium. At most `maxFeatures` (then `truncated`), so a zoomed-out map
 * cannot pull a whole network.
 *
 * The bbox is turned into a projected rectangle that encloses it (corners and edge midpoints),
 * and the spatial index is used through MBRIntersects passed as the predicate itself.
 */
export async function outlineInBox(
  sequelize: Sequelize,
  epsg: number,
  bbox: readonly [number, number, number, number],
  maxFeatures: number,
): Promise<OutlineCollection> {
  const box = gridBoxWkt(bbox, epsg)
  const rows = await sequelize.query<{
    id: number
    ownerId: number
    medium: PipeMedium
    g: unknown
  }>(
    `SELECT s.id, s.owner_organisation_id AS ownerId, s.medium, ST_AsGeoJSON(s.geom) AS g
       FROM pipe_segments s
      WHERE MBRIntersects(s.geom, ST_GeomFromText(?, ${Number(epsg)}))
      LIMIT ${Number(maxFeatures) + 1}`,
    { replacements: [box], type: QueryTypes.SELECT },
  )
  const truncated = rows.length > maxFeatures
  const names = await organisationNames(
    sequelize,
    rows.map((r) => r.ownerId),
  )
  return {
    type: 'FeatureCollection',
    truncated,
    features: rows.slice(0, maxFeatures).map((r) => {
      const g = (typeof r.g === 'string' ? JSON.parse(r.g) : r.g) as { coordinates: number[][] }
      return {
        type: 'Feature',
        id: Number(r.id),
        properties: { ownerName: names.get(r.ownerId) ?? '', medium: r.medium },
        geometry: gridToLonLat(g.coordinates, epsg),
      }
    }),
  }
}
