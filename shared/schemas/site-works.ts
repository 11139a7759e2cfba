import { z } from 'zod'
import { activityInputSchema } from './application.ts'
import { pointSchema, simplePolygonSchema } from './geojson-input.ts'
import { REQUIRED_PHOTO_KINDS, SITE_PHOTO_KINDS } from '../types/site-works.ts'

/** Payloads of the works on site, permit change requests and emergency works. */

const isoTime = z.iso.datetime({ offset: true, message: 'Use a time like 2027-03-15T07:30:00Z' })
const isoDate = z.string().regex(/^\d{4}-\d{2}-\d{2}$/, 'Use a date like 2027-03-15')
const note = z.string().trim().max(2000).optional()

export const plannedStartSchema = z.object({ plannedStartAt: isoTime, note })
export type PlannedStartInput = z.infer<typeof plannedStartSchema>

/** Started or finished; without `at` the server's time is used. */
export const siteEventSchema = z.object({ at: isoTime.optional(), note })
export type SiteEventInput = z.infer<typeof siteEventSchema>

export const sitePhotoKindSchema = z.enum(SITE_PHOTO_KINDS, {
  message: 'Choose what the photo shows',
})
export const requiredPhotoKindsSchema = z.array(z.enum(REQUIRED_PHOTO_KINDS)).max(2)

export const siteChecklistSchema = z.object({
  /** Condition key -> ticked; keys not sent keep their tick. */
  ticks: z.record(z.string().min(1).max(80), z.boolean()),
})
export type SiteChecklistInput = z.infer<typeof siteChecklistSchema>

export const changeRequestSchema = z
  .object({
    validTo: isoDate.optional(),
    activities: z
      .array(activityInputSchema)
      .min(1, 'Keep at least one activity')
      .max(20)
      .optional(),
    reason: z.string().trim().min(3, 'Say why the change is needed').max(2000),
  })
  .superRefine((v, ctx) => {
    if (!v.validTo && !v.activities) {
      ctx.addIssue({
        code: 'custom',
        path: ['validTo'],
        message: 'Give a new last day or changed activities',
      })
    }
  })
export type ChangeRequestInput = z.infer<typeof changeRequestSchema>

export const changeReviewDecisionSchema = z
  .object({
    decision: z.enum(['accepted', 'accepted_with_conditions', 'objected']),
    reasons: z.string().trim().max(5000).optional(),
    conditions: z
      .array(
        z.object({
          code: z.string().trim().min(1).max(64),
          text: z.string().trim().min(3, 'Write the condition').max(2000),
        }),
      )
      .max(50)
      .default([]),
  })
  .superRefine((v, ctx) => {
    if (v.decision === 'accepted_with_conditions' && v.conditions.length === 0) {
      ctx.addIssue({ code: 'custom', path: ['conditions'], message: 'Add at least one condition' })
    }
    if (v.decision === 'objected' && !(v.reasons && v.reasons.length >= 3)) {
      ctx.addIssue({ code: 'custom', path: ['reasons'], message: 'Give your reasons' })
    }
  })
export type ChangeReviewDecisionInput = z.infer<typeof changeReviewDecisionSchema>

export const changeRequestDecisionSchema = z.object({
  version: z.number().int().min(0),
  decision: z.enum(['grant', 'decline']),
  note: z.string().trim().max(2000).optional(),
})
export type ChangeRequestDecisionInput = z.infer<typeof changeRequestDecisionSchema>

export const emergencyWorksSchema = z.object({
  siteAddress: z.string().trim().min(3, 'Enter where the works are').max(240),
  /** The spot (a point) or the area (a polygon) of the repair, WGS84. */
  location: z.union([pointSchema, simplePolygonSchema]),
  activityKind: z.enum(['excavation', 'crane', 'fill']),
  depth_m: z.number().gt(0).max(30).optional(),
  reason: z.string().trim().min(10, 'Say in a sentence what has happened').max(2000),
  contactName: z.string().trim().min(2).max(160),
  contactPhone: z
    .string()
    .trim()
    .regex(/^[+0-9 ()/-]{5,40}$/, 'Enter a phone number'),
  startedAt: isoTime.optional(),
})
export type EmergencyWorksInput = z.infer<typeof emergencyWorksSchema>

export const emergencyFollowUpSchema = z.object({
  applicationId: z.number().int().positive(),
})
export type EmergencyFollowUpInput = z.infer<typeof emergencyFollowUpSchema>
