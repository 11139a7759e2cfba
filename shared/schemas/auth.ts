import { z } from 'zod'
import { ORGANISATION_KINDS, ROLES } from '../types/roles.ts'
import { PASSWORD_MIN_LENGTH, passwordProblem } from './password-rules.ts'

export { PASSWORD_MIN_LENGTH }

export const signInSchema = z.object({
  email: z.string().trim().toLowerCase().email('Enter a valid e-mail address').max(254),
  password: z.string().min(1, 'Enter your password').max(200),
})
export type SignInInput = z.infer<typeof signInSchema>

/** The password rules of ./password-rules.ts that need no e-mail address. */
export const passwordSchema = z.string().superRefine((v, ctx) => {
  const problem = passwordProblem(v)
  if (problem) ctx.addIssue({ code: 'custom', message: problem })
})

/** The e-mail rule, for schemas that carry both fields. */
function passwordNotEmail(v: { email: string; password?: string }, ctx: z.RefinementCtx): void {
  if (v.password === undefined) return
  const problem = passwordProblem(v.password, v.email)
  if (problem && problem !== passwordProblem(v.password))
    ctx.addIssue({ code: 'custom', path: ['password'], message: problem })
}

export const createOrganisationSchema = z.object({
  name: z.string().trim().min(2, 'Enter the organisation name').max(160),
  kind: z.enum(ORGANISATION_KINDS),
  medium: z.enum(['water', 'sewer', 'gas', 'district_heating', 'other']).nullable().optional(),
})
export type CreateOrganisationInput = z.infer<typeof createOrganisationSchema>

export const createUserSchema = z
  .object({
    email: z.string().trim().toLowerCase().email('Enter a valid e-mail address').max(254),
    name: z.string().trim().min(2, 'Enter the full name').max(160),
    role: z.enum(ROLES),
    organisationId: z.number().int().positive(),
    password: passwordSchema,
  })
  .superRefine(passwordNotEmail)
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

/** "Forgot password": the address to send a one-time link to. */
export const passwordResetRequestSchema = z.object({
  email: z.string().trim().toLowerCase().email('Enter a valid e-mail address').max(254),
})
export type PasswordResetRequestInput = z.infer<typeof passwordResetRequestSchema>

/** "Choose a new password": the token from the link and the new password. */
export const passwordResetSchema = z.object({
  token: z
    .string()
    .regex(/^[A-Za-z0-9_-]{43}$/, 'This link is not complete; open it again from the e-mail'),
  password: passwordSchema,
})
export type PasswordResetInput = z.infer<typeof passwordResetSchema>
