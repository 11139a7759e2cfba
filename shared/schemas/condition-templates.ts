import { z } from 'zod'
import { REQUIRED_PHOTO_KINDS } from '../types/site-works.ts'

/**
 * An owner's library condition. The text names its parameters in braces, e.g.
 * "No machine digging within {distance_m} m of the pipe"; every placeholder must be defined and
 * every definition used.
 */

const parameterName = z
  .string()
  .regex(/^[a-z][a-zA-Z0-9_]{0,47}$/, 'Use letters, digits and _ (e.g. distance_m)')

export const conditionParameterSchema = z
  .object({
    name: parameterName,
    label: z.string().trim().min(1).max(120),
    unit: z.string().trim().max(16).default(''),
    kind: z.enum(['number', 'text']).default('number'),
    default: z.union([z.number(), z.string().max(200), z.null()]).default(null),
    min: z.number().optional(),
    max: z.number().optional(),
  })
  .superRefine((p, ctx) => {
    if (p.min !== undefined && p.max !== undefined && p.max < p.min) {
      ctx.addIssue({ code: 'custom', path: ['max'], message: 'Must not be less than min' })
    }
    if (p.kind === 'number' && typeof p.default === 'string') {
      ctx.addIssue({ code: 'custom', path: ['default'], message: 'Enter a number' })
    }
  })

const PLACEHOLDER = /\{([a-zA-Z0-9_]+)\}/g

/** The placeholder names a text uses, in order of first use. */
export function placeholdersOf(text: string): string[] {
  return [...new Set([...text.matchAll(PLACEHOLDER)].map((m) => m[1]!))]
}

const templateFields = {
  code: z
    .string()
    .trim()
    .regex(/^[a-z0-9][a-z0-9-]{0,63}$/, 'Use lower-case letters, digits and dashes'),
  title: z.string().trim().min(3).max(160),
  text: z.string().trim().min(3).max(2000),
  parameters: z.array(conditionParameterSchema).max(10).default([]),
  active: z.boolean().default(true),
  /** The owner attends the works and wants the planned start this many hours ahead. */
  attendanceNotice_h: z
    .number()
    .int('Whole hours')
    .min(1, 'At least 1 hour')
    .max(720, 'At most 720 hours (30 days)')
    .nullable()
    .default(null),
  /** Photos the crew must upload before the works can be recorded finished. */
  photoKinds: z.array(z.enum(REQUIRED_PHOTO_KINDS)).max(2).default([]),
}

function checkPlaceholders(
  t: { text: string; parameters: { name: string }[] },
  ctx: z.RefinementCtx,
): void {
  const used = placeholdersOf(t.text)
  const defined = t.parameters.map((p) => p.name)
  for (const name of used) {
    if (!defined.includes(name)) {
      ctx.addIssue({ code: 'custom', path: ['text'], message: `{${name}} has no parameter` })
    }
  }
  for (const [i, name] of defined.entries()) {
    if (!used.includes(name)) {
      ctx.addIssue({
        code: 'custom',
        path: ['parameters', i, 'name'],
        message: `{${name}} is not used in the text`,
      })
    }
    if (defined.indexOf(name) !== i) {
      ctx.addIssue({ code: 'custom', path: ['parameters', i, 'name'], message: 'Used twice' })
    }
  }
}

export const conditionTemplateInputSchema = z.object(templateFields).superRefine(checkPlaceholders)
export type ConditionTemplateInput = z.infer<typeof conditionTemplateInputSchema>

/** A change to a library condition; `version` is the one loaded (optimistic lock). */
export const conditionTemplateUpdateSchema = z
  .object({ ...templateFields, version: z.number().int().min(0) })
  .superRefine(checkPlaceholders)
export type ConditionTemplateUpdate = z.infer<typeof conditionTemplateUpdateSchema>
