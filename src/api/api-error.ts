import { ErrorCode, type FieldIssue } from '../../shared/errors.ts'

/** A failed API call: the HTTP status plus the server's error envelope, or NETWORK (status 0). */
export class ApiError extends Error {
  override readonly name = 'ApiError'

  constructor(
    readonly status: number,
    readonly code: ErrorCode,
    message: string,
    readonly fields: FieldIssue[] = [],
    readonly requestId?: string,
  ) {
    super(message)
  }

  get isValidation(): boolean {
    return this.code === ErrorCode.VALIDATION_FAILED
  }
}

/** Narrowing helper for catch blocks. */
export function isApiError(err: unknown): err is ApiError {
  return err instanceof ApiError
}
