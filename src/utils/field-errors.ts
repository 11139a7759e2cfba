import type { z } from 'zod'
import type { FieldIssue } from '../../shared/errors.ts'

/** Field path to the first message for it, e.g. { email: 'Enter a valid e-mail address' }. */
export type FieldErrors = Record<string, string>

/** Collects the first issue per field from a failed zod parse. */
export function fieldErrorsFromZod(error: z.ZodError): FieldErrors {
  const result: FieldErrors = {}
  for (const issue of error.issues) {
    const key = issue.path.map(String).join('.') || '_'
    if (!(key in result)) result[key] = issue.message
  }
  return result
}

/** Collects the first issue per field from a VALIDATION_FAILED envelope. */
export function fieldErrorsFromIssues(issues: FieldIssue[]): FieldErrors {
  const result: FieldErrors = {}
  for (const issue of issues) {
    if (!(issue.field in result)) result[issue.field] = issue.message
  }
  return result
}
