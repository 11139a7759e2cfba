/**
 * Error codes and the one error envelope every API error uses. Server and client both import
 * these, so a code is spelled once.
 */
export const ErrorCode = {
  VALIDATION_FAILED: 'VALIDATION_FAILED',
  UNAUTHENTICATED: 'UNAUTHENTICATED',
  FORBIDDEN: 'FORBIDDEN',
  NOT_FOUND: 'NOT_FOUND',
  CONFLICT: 'CONFLICT',
  DOMAIN_RULE: 'DOMAIN_RULE',
  RATE_LIMITED: 'RATE_LIMITED',
  PAYLOAD_TOO_LARGE: 'PAYLOAD_TOO_LARGE',
  SERVICE_UNAVAILABLE: 'SERVICE_UNAVAILABLE',
  INTERNAL: 'INTERNAL',
  NETWORK: 'NETWORK',
} as const

export type ErrorCode = (typeof ErrorCode)[keyof typeof ErrorCode]

/** One problem with one input field; `field` is a dotted path such as `pipe.cover_m`. */
export interface FieldIssue {
  field: string
  message: string
}

/** The body of every non-2xx API response. */
export interface ErrorEnvelope {
  error: {
    code: ErrorCode
    message: string
    fields?: FieldIssue[]
    requestId?: string
  }
}
