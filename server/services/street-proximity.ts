import { QueryTypes } from 'sequelize'
import type { Sequelize } from 'sequelize'
import {
  polylineToPolygonDistance,
  polylineToPolylineDistance,
} from '../../shared/geo/planar-distance.ts'
import type { ActivityInput } from '../../shared/schemas/application.ts'
import { BUFFER_MARGIN_M } from './spatial-query.ts'

type XY = [number, number]

/** One activity next to one street. */
export interface ActivityNearStreet {
  activityId: number
  applicationId: number
  kind: ActivityInput['kind']
  street: string
  /** Exact plan distance between the activity's geometry and the street's centre line, m. */
  distance_m: number
}

function parseJson<T>(v: unknown): T {
  return (typeof v === 'string' ? JSON.parse(v) : v) as T
}

function distanceToStreet(
  g: { type: string; coordinates: unknown },
  street: readonly XY[],
): number {
  if (g.type === 'Polygon') return polylineToPolygonDistance(street, g.coordinates as XY[][])
  if (g.type === 'Point') return polylineToPolylineDistance(street, [g.coordinates as XY])
  return Math.min(...(g.coordinates as XY[]).map((p) => polylineToPolylineDistance(street, [p])))
}

/**
 * Every (activity, street) pair of the given applications within `distance_m`, in the projected
 * CRS. Candidates come from the streets' spatial index (ST_Intersects with a buffer, as in
 * spatial-query.ts); the exact distance is computed in TypeScript, because MariaDB's
 * ST_Distance is unreliable for some line/polygon pairs.
 */
export async function activitiesNearStreets(
  sequelize: Sequelize,
  applicationIds: readonly number[],
  distance_m: number,
  kinds?: readonly ActivityInput['kind'][],
): Promise<ActivityNearStreet[]> {
  if (!applicationIds.length) return []
  const rows = await sequelize.query<{
    activity_id: number
    application_id: number
    kind: ActivityInput['kind']
    name: string
    ag: unknown
    sg: unknown
  }>(
    `SELECT a.id AS activity_id, a.application_id, a.kind, s.name,
            ST_AsGeoJSON(a.geom) AS ag, ST_AsGeoJSON(s.geom) AS sg
       FROM activities a
       JOIN streets s ON ST_Intersects(s.geom, ST_Buffer(a.geom, ?))
      WHERE a.application_id IN (?)${kinds ? ' AND a.kind IN (?)' : ''}`,
    {
      replacements: [
        distance_m * 1.01 + BUFFER_MARGIN_M,
        [...applicationIds],
        ...(kinds ? [[...kinds]] : []),
      ],
      type: QueryTypes.SELECT,
    },
  )
  const out: ActivityNearStreet[] = []
  for (const r of rows) {
    const d = distanceToStreet(
      parseJson<{ type: string; coordinates: unknown }>(r.ag),
      parseJson<{ coordinates: XY[] }>(r.sg).coordinates,
    )
    if (d <= distance_m) {
      out.push({
        activityId: Number(r.activity_id),
        applicationId: Number(r.application_id),
        kind: r.kind,
        street: r.name,
        distance_m: d,
      })
    }
  }
  return out
}
