import { z } from 'zod'
import { PIPE_MEDIA } from '../types/network.ts'
import { pagingQuerySchema } from './paging.ts'
import { PIPE_MATERIALS } from './pipe-segment.ts'

/** Sortable columns of the segment table. */
export const SEGMENT_SORT_FIELDS = [
  'ownerRef',
  'medium',
  'material',
  'outerDiameter_m',
  'yearLaid',
  'length_m',
  'baselineUtilisation',
  'updatedAt',
] as const

const booleanText = z
  .enum(['true', 'false'], { error: 'Use true or false' })
  .transform((v) => v === 'true')

/** `GET /api/network/segments` query: paging, filters, sort. `ownerId` is for admins only. */
export const segmentListQuerySchema = pagingQuerySchema.extend({
  medium: z.enum(PIPE_MEDIA).optional(),
  material: z.enum(PIPE_MATERIALS as [string, ...string[]]).optional(),
  overCapacity: booleanText.optional(),
  q: z.string().trim().min(1).max(64).optional(),
  sort: z.enum(SEGMENT_SORT_FIELDS).default('ownerRef'),
  order: z.enum(['asc', 'desc']).default('asc'),
  ownerId: z.coerce.number().int().positive().optional(),
})
export type SegmentListQuery = z.infer<typeof segmentListQuerySchema>

/** `GET /api/network/export` query. */
export const segmentExportQuerySchema = z.object({
  medium: z.enum(PIPE_MEDIA).optional(),
  ownerId: z.coerce.number().int().positive().optional(),
})

/** `bbox=minLon,minLat,maxLon,maxLat` in WGS84 degrees. */
export const bboxParamSchema = z
  .string({ error: 'Required: minLon,minLat,maxLon,maxLat' })
  .transform((v, ctx) => {
    const n = v.split(',').map((p) => (p.trim() === '' ? NaN : Number(p)))
    const [minLon, minLat, maxLon, maxLat] = n as [number, number, number, number]
    const problem =
      n.length !== 4 || !n.every(Number.isFinite)
        ? 'Four numbers: minLon,minLat,maxLon,maxLat'
        : minLon < -180 || maxLon > 180 || minLat < -90 || maxLat > 90
          ? 'Longitudes within -180..180, latitudes within -90..90'
          : minLon >= maxLon || minLat >= maxLat
            ? 'The minimum must be below the maximum'
            : null
    if (problem) {
      ctx.addIssue({ code: 'custom', message: problem })
      return z.NEVER
    }
    return [minLon, minLat, maxLon, maxLat] as [number, number, number, number]
  })

/** `GET /api/network/outline` query. */
export const outlineQuerySchema = z.object({ bbox: bboxParamSchema })

/**
 * `GET /api/network/map-lines` query: the outline's bbox plus the map's zoom level (lines are
 * cut to their end points below MAP_LINES_DETAIL_ZOOM). `ownerId` is for admins only.
 */
export const mapLinesQuerySchema = outlineQuerySchema.extend({
  zoom: z.coerce.number({ error: 'Expected a number' }).min(0).max(30),
  ownerId: z.coerce.number().int().positive().optional(),
})
export type MapLinesQuery = z.infer<typeof mapLinesQuerySchema>

/** `POST /api/network/imports/:id/commit` body: the skip-invalid choice must be explicit. */
export const importCommitSchema = z
  .object({
    skipInvalid: z.boolean({
      error: 'Required: true to import only the valid features, false otherwise',
    }),
  })
  .strict()

/** `:id` of a segment or import. */
export const idParamSchema = z.object({
  id: z.coerce.number({ error: 'Expected a number' }).int().positive(),
})
