import { z } from 'zod'
import { DURATION_CLASSES, FEE_ACTIVITY_KINDS, PAYMENT_TERMS } from '../types/fees.ts'

/** Payloads about fees: a new fee schedule version and the payment terms of one application. */

const isoDate = z.string().regex(/^\d{4}-\d{2}-\d{2}$/, 'Use a date like 2027-03-15')
/** Whole cents, up to 10 million in the currency (a sanity bound, not a policy). */
const cents = z
  .number({ error: 'Give an amount in cents' })
  .int('Use whole cents')
  .min(0, 'Must not be negative')
  .max(1_000_000_000, 'That is more than 10 million')
const percent = z.number().min(0, 'At least 0 %').max(100, 'At most 100 %')

export const feeEntryInputSchema = z.object({
  durationClass: z.enum(DURATION_CLASSES),
  activityKind: z.enum(FEE_ACTIVITY_KINDS),
  amount_cents: cents,
})

export const feeScheduleInputSchema = z
  .object({
    effectiveFrom: isoDate,
    currency: z
      .string()
      .trim()
      .regex(/^[A-Za-z]{3}$/, 'Use a three-letter currency code such as EUR')
      .transform((c) => c.toUpperCase()),
    entries: z
      .array(feeEntryInputSchema)
      .min(1)
      .max(DURATION_CLASSES.length * FEE_ACTIVITY_KINDS.length),
    variationFee_cents: cents,
    extensionFee_cents: cents,
    refundBeforeReview_percent: percent,
    refundAfterReview_percent: percent,
    defaultPaymentTerms: z.enum(PAYMENT_TERMS),
    note: z.string().trim().max(2000).optional(),
  })
  .superRefine((v, ctx) => {
    for (const d of DURATION_CLASSES) {
      for (const k of FEE_ACTIVITY_KINDS) {
        const n = v.entries.filter((e) => e.durationClass === d && e.activityKind === k).length
        if (n !== 1) {
          ctx.addIssue({
            code: 'custom',
            path: ['entries'],
            message: n
              ? `Give ${k} in ${d} works only once`
              : `Give a price for ${k} in ${d} works`,
          })
        }
      }
    }
    if (v.refundAfterReview_percent > v.refundBeforeReview_percent) {
      ctx.addIssue({
        code: 'custom',
        path: ['refundAfterReview_percent'],
        message: 'Must not be more than the refund before review',
      })
    }
  })
export type FeeScheduleInput = z.infer<typeof feeScheduleInputSchema>

/** The permit office books a payment or refund made outside the payment service. */
export const offlineMovementInputSchema = z.object({
  reference: z.string().trim().min(3, 'Give the bank transfer or invoice reference').max(200),
})
export type OfflineMovementInput = z.infer<typeof offlineMovementInputSchema>

export const paymentTermsInputSchema = z.object({ paymentTerms: z.enum(PAYMENT_TERMS) })
export type PaymentTermsInput = z.infer<typeof paymentTermsInputSchema>
