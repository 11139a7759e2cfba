import { z } from 'zod'

/** Payloads of the permit office: grant, refuse, extend, vary, revoke. */

const isoDate = z.string().regex(/^\d{4}-\d{2}-\d{2}$/, 'Use a date like 2027-03-15')

export const permitConditionInputSchema = z.object({
  code: z.string().trim().min(1).max(64),
  text: z.string().trim().min(3, 'Write the condition').max(2000),
  /** The owner the condition comes from; omit for the permit office's own. */
  ownerOrganisationId: z.number().int().positive().nullable().optional(),
})
export type PermitConditionInput = z.infer<typeof permitConditionInputSchema>

const conditions = z.array(permitConditionInputSchema).max(100, 'Use at most 100 conditions')

function checkDates(v: { validFrom?: string; validTo?: string }, ctx: z.RefinementCtx): void {
  if (v.validFrom && v.validTo && v.validTo < v.validFrom) {
    ctx.addIssue({ code: 'custom', path: ['validTo'], message: 'Must not be before validFrom' })
  }
}

/**
 * Grant: `version` is the application version the officer loaded. Without `conditions` the
 * merged owner conditions are used as they are; without dates the application's dates.
 */
export const grantPermitSchema = z
  .object({
    version: z.number().int().min(0),
    validFrom: isoDate.optional(),
    validTo: isoDate.optional(),
    conditions: conditions.optional(),
    note: z.string().trim().max(2000).optional(),
  })
  .superRefine(checkDates)
export type GrantPermitInput = z.infer<typeof grantPermitSchema>

export const refuseApplicationSchema = z.object({
  version: z.number().int().min(0),
  reasons: z.string().trim().min(3, 'Give your reasons').max(5000),
})
export type RefuseApplicationInput = z.infer<typeof refuseApplicationSchema>

export const extendPermitSchema = z.object({
  validTo: isoDate,
  reason: z.string().trim().min(3, 'Give a reason').max(2000),
})
export type ExtendPermitInput = z.infer<typeof extendPermitSchema>

export const varyPermitSchema = z.object({
  conditions: conditions,
  reason: z.string().trim().min(3, 'Give a reason').max(2000),
})
export type VaryPermitInput = z.infer<typeof varyPermitSchema>

export const revokePermitSchema = z.object({
  reason: z.string().trim().min(3, 'Give a reason').max(2000),
})
export type RevokePermitInput = z.infer<typeof revokePermitSchema>
