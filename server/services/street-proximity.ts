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

/** Bounding box of a GeoJSON geometry's coordinates (any nesting), projected metres. */
function bboxOf(g: { coordinates: unknown }): [number, number, number, number] {
  const box: [number, number, number, number] = [Infinity, Infinity, -Infinity, -Infinity]
  const walk = (c: unknown): void => {
    if (Array.isArray(c) && typeof c[0] === 'number') {
      box[0] = Math.min(box[0], c[0] as number)
      box[1] = Math.min(box[1], c[1] as number)
      box[2] = Math.max(box[2], c[0] as number)
      box[3] = Math.max(box[3], c[1] as number)
    } else if (Array.isArray(c)) c.forEach(walk)
  }
  walk(g.coordinates)
  return box
}

/**
 * Every (activity, street) pair of the given applications within `distance_m`, in the projected
 * CRS. Candidates come from the streets' spatial index: one MBRIntersects query per application
 * with the box around its activities widened by the distance (a constant shape, so the index is
 * used; a join of activities to streets on ST_Intersects made MariaDB 10.11 check the range per
 * record and fail with "Update locks cannot be acquired during a READ UNCOMMITTED
 * transaction"). The exact distance is computed in TypeScript, because MariaDB's ST_Distance
 * is unreliable for some line/polygon pairs.
 */
export async function activitiesNearStreets(
  sequelize: Sequelize,
  applicationIds: readonly number[],
  distance_m: number,
  kinds?: readonly ActivityInput['kind'][],
): Promise<ActivityNearStreet[]> {
  if (!applicationIds.length) return []
  const activities = await sequelize.query<{
    activity_id: number
    application_id: number
    kind: ActivityInput['kind']
    ag: unknown
  }>(
    `SELECT a.id AS activity_id, a.application_id, a.kind, ST_AsGeoJSON(a.geom) AS ag
       FROM activities a
      WHERE a.application_id IN (?)${kinds ? ' AND a.kind IN (?)' : ''}
      ORDER BY a.application_id, a.id`,
    {
      replacements: [[...applicationIds], ...(kinds ? [[...kinds]] : [])],
      type: QueryTypes.SELECT,
    },
  )
  const byApplication = new Map<
    number,
    { id: number; kind: ActivityInput['kind']; g: { type: string; coordinates: unknown } }[]
  >()
  for (const r of activities) {
    const list = byApplication.get(Number(r.application_id)) ?? []
    list.push({
      id: Number(r.activity_id),
      kind: r.kind,
      g: parseJson<{ type: string; coordinates: unknown }>(r.ag),
    })
    byApplication.set(Number(r.application_id), list)
  }
  const reach = distance_m * 1.01 + BUFFER_MARGIN_M
  const out: ActivityNearStreet[] = []
  for (const [applicationId, list] of byApplication) {
    const boxes = list.map((a) => bboxOf(a.g))
    const x0 = Math.min(...boxes.map((b) => b[0])) - reach
    const y0 = Math.min(...boxes.map((b) => b[1])) - reach
    const x1 = Math.max(...boxes.map((b) => b[2])) + reach
    const y1 = Math.max(...boxes.map((b) => b[3])) + reach
    const streets = await sequelize.query<{ name: string; sg: unknown }>(
      `SELECT s.name, ST_AsGeoJSON(s.geom) AS sg FROM streets s
        WHERE MBRIntersects(s.geom, ST_GeomFromText(?))`,
      {
        replacements: [`POLYGON((${x0} ${y0},${x1} ${y0},${x1} ${y1},${x0} ${y1},${x0} ${y0}))`],
        type: QueryTypes.SELECT,
      },
    )
    for (const st of streets) {
      const line = parseJson<{ coordinates: XY[] }>(st.sg).coordinates
      for (const a of list) {
        const d = distanceToStreet(a.g, line)
        if (d <= distance_m) {
          out.push({
            activityId: a.id,
            applicationId,
            kind: a.kind,
            street: st.name,
            distance_m: d,
          })
        }
      }
    }
  }
  return out
}
