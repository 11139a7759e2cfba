import { QueryTypes } from 'sequelize'
import type { Sequelize } from 'sequelize'
import { crsTransform } from '../../shared/geo/crs.ts'

export interface StreetFeature {
  type: 'Feature'
  id: number
  properties: { name: string; category: string }
  geometry: { type: 'LineString'; coordinates: [number, number][] }
}

export interface StreetCollection {
  type: 'FeatureCollection'
  features: StreetFeature[]
}

/** The street layer in WGS84 (RFC 7946), converted from the stored projected geometry. */
export async function listStreets(sequelize: Sequelize, epsg: number): Promise<StreetCollection> {
  const rows = await sequelize.query<{ id: number; name: string; category: string; g: string }>(
    'SELECT id, name, category, ST_AsGeoJSON(geom) AS g FROM streets ORDER BY name',
    { type: QueryTypes.SELECT },
  )
  const t = crsTransform(epsg)
  return {
    type: 'FeatureCollection',
    features: rows.map((r) => {
      const g = (typeof r.g === 'string' ? JSON.parse(r.g) : r.g) as { coordinates: number[][] }
      return {
        type: 'Feature',
        id: r.id,
        properties: { name: r.name, category: r.category },
        geometry: { type: 'LineString', coordinates: g.coordinates.map((c) => t.toLonLat(c)) },
      }
    }),
  }
}

/** Insert streets given in WGS84; returns how many were written. */
export async function insertStreets(
  sequelize: Sequelize,
  epsg: number,
  features: { name: string; category: string; coordinates: number[][] }[],
): Promise<number> {
  const t = crsTransform(epsg)
  for (const f of features) {
    const wkt = `LINESTRING(${f.coordinates
      .map((c) =>
        t
          .toGrid(c)
          .map((v) => v.toFixed(3))
          .join(' '),
      )
      .join(', ')})`
    await sequelize.query(
      'INSERT INTO streets (name, category, geom, created_at, updated_at) VALUES (?, ?, ST_GeomFromText(?, ?), NOW(), NOW())',
      { replacements: [f.name, f.category, wkt, epsg], type: QueryTypes.INSERT },
    )
  }
  return features.length
}
