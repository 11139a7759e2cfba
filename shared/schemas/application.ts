import { z } from 'zod'
import { multiPointSchema, pointSchema, simplePolygonSchema } from './geojson-input.ts'

/**
 * What an applicant enters. A draft may be incomplete (everything but the title optional) and
 * is saved as the applicant goes; `submitApplicationSchema` is the complete form checked on
 * submit. Geometry is GeoJSON in WGS84.
 */

export const EXCAVATION_SUPPORTS = [
  'none',
  'sloped',
  'trench-box',
  'sheet-piling',
  'braced',
] as const
export const DIGGING_METHODS = ['mechanical', 'hand-or-vacuum'] as const
export const CRANE_SETUPS = ['outriggers', 'single-pad'] as const

const isoDate = z.string().regex(/^\d{4}-\d{2}-\d{2}$/, 'Use a date like 2027-03-15')
const label = z.string().trim().max(120).optional()

export const excavationActivitySchema = z.object({
  kind: z.literal('excavation'),
  label,
  geometry: simplePolygonSchema,
  depth_m: z
    .number()
    .gt(0, 'Depth must be more than 0 m')
    .max(30, 'Depths over 30 m need a special study'),
  support: z.enum(EXCAVATION_SUPPORTS),
  digging: z.enum(DIGGING_METHODS),
})

export const craneActivitySchema = z
  .object({
    kind: z.literal('crane'),
    label,
    setup: z.enum(CRANE_SETUPS),
    /** Outrigger positions (MultiPoint) or the single pad's centre (Point). */
    geometry: z.union([multiPointSchema, pointSchema]),
    /** Largest load on one outrigger (or the pad), from the lift plan. */
    legLoad_kN: z.number().gt(0).max(5000, 'Leg loads over 5,000 kN need a special study'),
    matLength_m: z.number().min(0.2).max(12),
    matWidth_m: z.number().min(0.2).max(12),
    /** Mat orientation: angle of its long side from grid north, clockwise. */
    matRotation_deg: z.number().min(0).max(180).default(0),
  })
  .superRefine((a, ctx) => {
    if (a.setup === 'single-pad' && a.geometry.type !== 'Point') {
      ctx.addIssue({ code: 'custom', path: ['geometry'], message: 'A single pad is one point' })
    }
    if (a.setup === 'outriggers' && a.geometry.type !== 'MultiPoint') {
      ctx.addIssue({ code: 'custom', path: ['geometry'], message: 'Place each outrigger' })
    }
  })

export const fillActivitySchema = z.object({
  kind: z.literal('fill'),
  label,
  geometry: simplePolygonSchema,
  height_m: z.number().gt(0).max(20),
  unitWeight_kN_per_m3: z.number().min(5).max(30).default(18),
  duration_days: z.number().int().min(1).max(3650),
})

export const activityInputSchema = z.discriminatedUnion('kind', [
  excavationActivitySchema,
  craneActivitySchema,
  fillActivitySchema,
])
export type ActivityInput = z.infer<typeof activityInputSchema>
export type ActivityKind = ActivityInput['kind']

const contact = {
  contactName: z.string().trim().min(2).max(160),
  contactPhone: z
    .string()
    .trim()
    .regex(/^[+0-9 ()/-]{5,40}$/, 'Enter a phone number'),
}

export const applicationDraftSchema = z.object({
  title: z.string().trim().min(3, 'Give the works a short title').max(160),
  siteAddress: z.string().trim().max(240).optional(),
  contactName: contact.contactName.optional(),
  contactPhone: contact.contactPhone.optional(),
  startsOn: isoDate.optional(),
  endsOn: isoDate.optional(),
  description: z.string().trim().max(4000).optional(),
  activities: z.array(activityInputSchema).max(20).default([]),
})
export type ApplicationDraftInput = z.infer<typeof applicationDraftSchema>

/** A draft save carries the version it was based on (optimistic locking). */
export const applicationUpdateSchema = applicationDraftSchema.extend({
  version: z.number().int().min(0),
})
export type ApplicationUpdateInput = z.infer<typeof applicationUpdateSchema>

export const submitApplicationSchema = z
  .object({
    title: applicationDraftSchema.shape.title,
    siteAddress: z.string().trim().min(3, 'Enter where the works are').max(240),
    ...contact,
    startsOn: isoDate,
    endsOn: isoDate,
    description: z.string().trim().min(10, 'Describe the works in a sentence or two').max(4000),
    activities: z.array(activityInputSchema).min(1, 'Add at least one activity').max(20),
  })
  .superRefine((a, ctx) => {
    if (a.endsOn < a.startsOn) {
      ctx.addIssue({
        code: 'custom',
        path: ['endsOn'],
        message: 'The end date is before the start date',
      })
    }
  })
