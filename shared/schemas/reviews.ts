import { z } from 'zod'
import { pipeInputSchema } from './assessment-input.ts'

/**
 * Payloads of the owner review: the engineer's decision, the applicant's answer to a question,
 * and a re-run of one segment with corrected pipe data.
 */

const conditionCode = z
  .string()
  .trim()
  .min(1, 'Give the condition a short code')
  .max(64, 'Use at most 64 characters')

/** One condition as the engineer sends it: from the library (templateId) or with its own text. */
export const decidedConditionInputSchema = z
  .object({
    source: z.enum(['engine', 'library', 'own']),
    code: conditionCode,
    templateId: z.number().int().positive().optional(),
    /** Required unless the condition comes from the library (the text is filled in then). */
    text: z.string().trim().min(3, 'Write the condition').max(2000).optional(),
    parameters: z.record(z.string().max(64), z.union([z.number(), z.string().max(200)])).optional(),
    reason: z.string().trim().max(1000).optional(),
  })
  .superRefine((c, ctx) => {
    if (c.source === 'library' && c.templateId === undefined) {
      ctx.addIssue({ code: 'custom', path: ['templateId'], message: 'Choose a library condition' })
    }
    if (c.source !== 'library' && c.text === undefined) {
      ctx.addIssue({ code: 'custom', path: ['text'], message: 'Write the condition' })
    }
  })
export type DecidedConditionInput = z.infer<typeof decidedConditionInputSchema>

const reasons = z.string().trim().min(3, 'Give your reasons').max(5000)

/** The engineer's decision on a review; `version` is the review version that was loaded. */
export const reviewDecisionSchema = z.discriminatedUnion('decision', [
  z.object({
    decision: z.literal('accepted'),
    version: z.number().int().min(0),
    reasons: z.string().trim().max(5000).optional(),
  }),
  z.object({
    decision: z.literal('accepted_with_conditions'),
    version: z.number().int().min(0),
    reasons: z.string().trim().max(5000).optional(),
    conditions: z
      .array(decidedConditionInputSchema)
      .min(1, 'Add at least one condition')
      .max(50, 'Use at most 50 conditions'),
  }),
  z.object({
    decision: z.literal('information_requested'),
    version: z.number().int().min(0),
    question: z.string().trim().min(3, 'Write your question').max(5000),
  }),
  z.object({
    decision: z.literal('objected'),
    version: z.number().int().min(0),
    reasons,
  }),
])
export type ReviewDecisionInput = z.infer<typeof reviewDecisionSchema>

/** How many documents one answer may carry. */
export const MAX_ANSWER_ATTACHMENTS = 10

/** The applicant's answer to an owner's question. */
export const reviewAnswerSchema = z.object({
  body: z.string().trim().min(1, 'Write your answer').max(5000),
  /** Documents already uploaded to the application that go with the answer. */
  attachmentIds: z
    .array(z.number().int().positive())
    .max(MAX_ANSWER_ATTACHMENTS, `At most ${MAX_ANSWER_ATTACHMENTS} documents per answer`)
    .refine((ids) => new Set(ids).size === ids.length, 'Each document once')
    .default([]),
})
export type ReviewAnswerInput = z.input<typeof reviewAnswerSchema>

/** Re-run one affected segment with corrected design data (the engine's pipe input). */
export const segmentRerunSchema = z.object({
  pipe: pipeInputSchema,
  note: z.string().trim().max(1000).optional(),
})
export type SegmentRerunInput = z.infer<typeof segmentRerunSchema>

/** `?state=open|answered|all` on the engineer's queue. */
export const reviewQueueQuerySchema = z.object({
  state: z.enum(['open', 'answered', 'all']).default('open'),
})
