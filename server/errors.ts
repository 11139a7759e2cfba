import { ErrorCode } from '../shared/errors.ts'
import type { FieldIssue } from '../shared/errors.ts'

/** An error whose message is safe to show to the caller; the error handler turns it into the envelope. */
export class AppError extends Error {
  constructor(
    readonly code: ErrorCode,
    readonly status: number,
    message: string,
    readonly fields?: FieldIssue[],
  ) {
    super(message)
    this.name = 'AppError'
  }
}

export const notFound = (what: string, id?: string | number) =>
  new AppError(
    ErrorCode.NOT_FOUND,
    404,
    id === undefined ? `No such ${what}` : `No ${what} with id ${id}`,
  )

export const forbidden = (message = 'Your role does not allow this') =>
  new AppError(ErrorCode.FORBIDDEN, 403, message)

export const unauthenticated = (message = 'Please sign in') =>
  new AppError(ErrorCode.UNAUTHENTICATED, 401, message)

export const conflict = (message: string, fields?: FieldIssue[]) =>
  new AppError(ErrorCode.CONFLICT, 409, message, fields)

export const domainRule = (message: string, fields?: FieldIssue[]) =>
  new AppError(ErrorCode.DOMAIN_RULE, 422, message, fields)

export const validationFailed = (fields: FieldIssue[], message = 'Some fields need attention') =>
  new AppError(ErrorCode.VALIDATION_FAILED, 400, message, fields)
