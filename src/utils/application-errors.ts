import type { FieldIssue } from '../../shared/errors.ts'
import { activityFieldOf } from './activity-draft.ts'
import type { FieldErrors } from './field-errors.ts'

/**
 * Splits field problems of an application (from the server's VALIDATION_FAILED `fields` or a
 * local zod check) into the form's own fields and each activity's fields.
 */
export interface ApplicationFieldErrors {
  /** Fields of the works, e.g. `startsOn`; `activities` for problems with the list itself. */
  form: FieldErrors
  /** Per activity key: its fields, e.g. `depth_m`, `geometry`. */
  activities: Record<string, FieldErrors>
}

export function emptyFieldErrors(): ApplicationFieldErrors {
  return { form: {}, activities: {} }
}

const ACTIVITY_PATH = /^activities\.(\d+)\.(.+)$/

/**
 * Maps dotted paths onto the form. `activities.<n>.<field>` goes to the activity that was sent
 * at index n: `sentKeys[n]` is the key of that activity in the form. The first message per field
 * wins. An index the form no longer has falls back to a message on the activity list.
 */
export function mapApplicationFieldIssues(
  issues: readonly FieldIssue[],
  sentKeys: readonly string[],
): ApplicationFieldErrors {
  const result = emptyFieldErrors()
  for (const issue of issues) {
    const match = ACTIVITY_PATH.exec(issue.field)
    if (match) {
      const key = sentKeys[Number(match[1])]
      if (key === undefined) {
        result.form.activities ??= `Activity ${Number(match[1]) + 1}: ${issue.message}`
        continue
      }
      const field = activityFieldOf(match[2] ?? '_')
      const own = (result.activities[key] ??= {})
      own[field] ??= issue.message
      continue
    }
    const field = issue.field.split('.')[0] || '_'
    result.form[field] ??= issue.message
  }
  return result
}

/** How many problems there are in all, for a short summary line. */
export function countFieldErrors(errors: ApplicationFieldErrors): number {
  return (
    Object.keys(errors.form).length +
    Object.values(errors.activities).reduce((n, e) => n + Object.keys(e).length, 0)
  )
}
