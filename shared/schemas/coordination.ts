import { z } from 'zod'

const isoDate = z
  .string()
  .regex(/^\d{4}-\d{2}-\d{2}$/, 'Use a calendar date YYYY-MM-DD')
  .refine((s) => !Number.isNaN(Date.parse(`${s}T00:00:00Z`)), 'Not a calendar date')

/** The longest period one coordination query may cover, days (keeps the answers small). */
export const COORDINATION_MAX_SPAN_DAYS = 731

/** `?from=YYYY-MM-DD&to=YYYY-MM-DD`: both days inclusive, `to` not before `from`. */
export const coordinationPeriodSchema = z
  .object({ from: isoDate, to: isoDate })
  .refine((q) => q.to >= q.from, { path: ['to'], message: 'Must not be before from' })
  .refine(
    (q) =>
      (Date.parse(`${q.to}T00:00:00Z`) - Date.parse(`${q.from}T00:00:00Z`)) / 86_400_000 <=
      COORDINATION_MAX_SPAN_DAYS,
    { path: ['to'], message: `At most ${COORDINATION_MAX_SPAN_DAYS} days after from` },
  )
export type CoordinationPeriod = z.infer<typeof coordinationPeriodSchema>

/** `bbox=minLon,minLat,maxLon,maxLat` in WGS84 degrees (RFC 7946 order). */
export const bboxSchema = z.string().transform((s, ctx) => {
  const v = s.split(',').map((x) => Number(x.trim()))
  if (v.length !== 4 || !v.every((n) => Number.isFinite(n))) {
    ctx.addIssue({ code: 'custom', message: 'Four numbers: minLon,minLat,maxLon,maxLat' })
    return z.NEVER
  }
  const [w, s2, e, n] = v as [number, number, number, number]
  if (!(w < e && s2 < n && w >= -180 && e <= 180 && s2 >= -90 && n <= 90)) {
    ctx.addIssue({
      code: 'custom',
      message: 'Minimum before maximum, longitudes within ±180 and latitudes within ±90',
    })
    return z.NEVER
  }
  return [w, s2, e, n] as [number, number, number, number]
})

/** Query of GET /api/coordination/works. */
export const coordinationWorksQuerySchema = z
  .object({ from: isoDate, to: isoDate, bbox: bboxSchema.optional() })
  .refine((q) => q.to >= q.from, { path: ['to'], message: 'Must not be before from' })
export type CoordinationWorksQuery = z.infer<typeof coordinationWorksQuerySchema>
