import { kinks, polygon as turfPolygon } from '@turf/turf'
import { z } from 'zod'

/**
 * GeoJSON geometry as users draw it (RFC 7946: WGS84, [lon, lat] order). Each schema rejects
 * what would break the checks later: open rings, too few points, self-intersecting outlines.
 */
export const MAX_POLYGON_VERTICES = 500

const lonLat = z
  .tuple([z.number().min(-180).max(180), z.number().min(-90).max(90)])
  .or(z.tuple([z.number().min(-180).max(180), z.number().min(-90).max(90), z.number()]))
  .transform((p) => [p[0], p[1]] as [number, number])

const samePoint = (a: readonly number[], b: readonly number[]) => a[0] === b[0] && a[1] === b[1]

export const pointSchema = z.object({
  type: z.literal('Point'),
  coordinates: lonLat,
})

export const multiPointSchema = z.object({
  type: z.literal('MultiPoint'),
  coordinates: z.array(lonLat).min(1).max(16),
})

/** A simple polygon: one closed outer ring of at least three distinct corners, no holes. */
export const simplePolygonSchema = z
  .object({
    type: z.literal('Polygon'),
    coordinates: z
      .array(
        z.array(lonLat).min(4, 'A polygon needs at least three corners').max(MAX_POLYGON_VERTICES),
      )
      .length(1, 'Draw one outline without holes'),
  })
  .superRefine((g, ctx) => {
    // zod runs this even when the shape checks above failed (they are not fatal), so a ring
    // that is missing or too short is left to the issues already raised.
    const ring = g.coordinates?.[0]
    if (!Array.isArray(ring) || ring.length < 4 || g.coordinates.length !== 1) return
    if (!samePoint(ring[0]!, ring[ring.length - 1]!)) {
      ctx.addIssue({
        code: 'custom',
        path: ['coordinates', 0],
        message: 'The outline must be closed (last point = first point)',
      })
      return
    }
    const distinct = new Set(ring.slice(0, -1).map((p) => `${p[0]},${p[1]}`))
    if (distinct.size < 3) {
      ctx.addIssue({
        code: 'custom',
        path: ['coordinates', 0],
        message: 'A polygon needs at least three distinct corners',
      })
      return
    }
    if (kinks(turfPolygon(g.coordinates)).features.length > 0) {
      ctx.addIssue({
        code: 'custom',
        path: ['coordinates', 0],
        message: 'The outline crosses itself',
      })
    }
  })

export type PointInput = z.infer<typeof pointSchema>
export type MultiPointInput = z.infer<typeof multiPointSchema>
export type SimplePolygonInput = z.infer<typeof simplePolygonSchema>
