import type { ZodError } from 'zod'
import type { FieldIssue } from '../errors.ts'

/**
 * Turn zod's issues into `{ field, message }` pairs with dotted field paths
 * (`activities.0.depth_m`); the root object is called `body`.
 */
export function fieldIssuesFromZod(error: ZodError, root = 'body'): FieldIssue[] {
  return error.issues.map((issue) => ({
    field: issue.path.length ? issue.path.map(String).join('.') : root,
    message: issue.message,
  }))
}
