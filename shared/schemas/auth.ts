import { z } from 'zod'
import { ORGANISATION_KINDS, ROLES } from '../types/roles.ts'

/** Password rule: long enough to resist guessing, no composition rules (NIST SP 800-63B). */
export const PASSWORD_MIN_LENGTH = 12

export const signInSchema = z.object({
  email: z.string().trim().toLowerCase().email('Enter a valid e-mail address').max(254),
  password: z.string().min(1, 'Enter your password').max(200),
})
export type SignInInput = z.infer<typeof signInSchema>

export const passwordSchema = z
  .string()
  .min(PASSWORD_MIN_LENGTH, `Use at least ${PASSWORD_MIN_LENGTH} characters`)
  .max(200, 'Use at most 200 characters')

export const createOrganisationSchema = z.object({
  name: z.string().trim().min(2, 'Enter the organisation name').max(160),
  kind: z.enum(ORGANISATION_KINDS),
  medium: z.enum(['water', 'sewer', 'gas', 'district_heating', 'other']).nullable().optional(),
})
export type CreateOrganisationInput = z.infer<typeof createOrganisationSchema>

export const createUserSchema = z.object({
  email: z.string().trim().toLowerCase().email('Enter a valid e-mail address').max(254),
  name: z.string().trim().min(2, 'Enter the full name').max(160),
  role: z.enum(ROLES),
  organisationId: z.number().int().positive(),
  password: passwordSchema,
})
export type CreateUserInput = z.infer<typeof createUserSchema>

export const updateUserSchema = z
  .object({
    name: z.string().trim().min(2).max(160),
    role: z.enum(ROLES),
    active: z.boolean(),
    password: passwordSchema,
  })
  .partial()
export type UpdateUserInput = z.infer<typeof updateUserSchema>
