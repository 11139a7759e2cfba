import type { ErrorRequestHandler, RequestHandler } from 'express'
import { ZodError } from 'zod'
import { ErrorCode } from '../../shared/errors.ts'
import type { ErrorEnvelope } from '../../shared/errors.ts'
import { fieldIssuesFromZod } from '../../shared/schemas/field-issues.ts'
import { AppError } from '../errors.ts'
import { logger } from '../logger.ts'

function send(res: Parameters<RequestHandler>[1], status: number, body: ErrorEnvelope): void {
  if (res.headersSent) return
  res.status(status).json(body)
}

/** Unknown /api paths answer 404 in the envelope rather than falling through to the client. */
export const apiNotFound: RequestHandler = (req, res) => {
  send(res, 404, {
    error: {
      code: ErrorCode.NOT_FOUND,
      message: `No API route ${req.method} ${req.path}`,
      requestId: String(req.id),
    },
  })
}

const CONNECTION_ERRORS = new Set([
  'SequelizeConnectionError',
  'SequelizeConnectionRefusedError',
  'SequelizeConnectionAcquireTimeoutError',
  'SequelizeHostNotReachableError',
  'SequelizeConnectionTimedOutError',
])

// Driver codes of a connection that broke under a running query (server killed, restarted,
// network cut); Sequelize reports these as a SequelizeDatabaseError.
const BROKEN_CONNECTION_CODES = new Set([
  'ECONNRESET',
  'ECONNREFUSED',
  'EPIPE',
  'ETIMEDOUT',
  'ER_SOCKET_UNEXPECTED_CLOSE',
  'ER_CONNECTION_ALREADY_CLOSED',
  'ER_CMD_CONNECTION_CLOSED',
  'ER_GET_CONNECTION_TIMEOUT',
  'ER_CONNECTION_TIMEOUT',
  'ER_SERVER_SHUTDOWN',
  'ER_CONNECTION_KILLED',
  'ER_CLIENT_INTERACTION_TIMEOUT',
])

/** True for every way "the database is not reachable" reaches us, directly or wrapped. */
export function isDatabaseDown(err: unknown, depth = 0): boolean {
  if (!err || typeof err !== 'object' || depth > 3) return false
  const e = err as {
    name?: string
    code?: string
    original?: unknown
    parent?: unknown
    cause?: unknown
  }
  if (CONNECTION_ERRORS.has(e.name ?? '')) return true
  if (e.name === 'SequelizeDatabaseError' || e.name === 'SqlError' || depth > 0) {
    if (BROKEN_CONNECTION_CODES.has(e.code ?? '')) return true
  }
  return [e.original, e.parent, e.cause].some((inner) => isDatabaseDown(inner, depth + 1))
}

/**
 * The one place errors become HTTP responses. AppError: its status and code. zod: 400 with the
 * fields. Body-parser failures: 400 / 413. Database unreachable: 503. Anything else: logged with
 * the request id, 500 with a generic message (stack only in development). A malformed %-escape in
 * a path and the body parser's other client errors: 400 (415 / 4xx as the parser says).
 */
export const errorHandler: ErrorRequestHandler = (err, req, res, _next) => {
  const requestId = req.id === undefined ? undefined : String(req.id)
  if (err instanceof AppError) {
    send(res, err.status, {
      error: { code: err.code, message: err.message, fields: err.fields, requestId },
    })
    return
  }
  if (err instanceof ZodError) {
    send(res, 400, {
      error: {
        code: ErrorCode.VALIDATION_FAILED,
        message: 'Some fields need attention',
        fields: fieldIssuesFromZod(err),
        requestId,
      },
    })
    return
  }
  const type = (err as { type?: string })?.type
  if (type === 'entity.parse.failed') {
    send(res, 400, {
      error: {
        code: ErrorCode.VALIDATION_FAILED,
        message: 'The request body is not valid JSON',
        fields: [{ field: 'body', message: 'Not valid JSON' }],
        requestId,
      },
    })
    return
  }
  if (type === 'entity.too.large') {
    send(res, 413, {
      error: {
        code: ErrorCode.PAYLOAD_TOO_LARGE,
        message: 'The request body is too large',
        requestId,
      },
    })
    return
  }
  if (err instanceof URIError && (err as { status?: number }).status === 400) {
    // The router could not decode a %-escape in a path parameter (`/api/x/%zz`).
    send(res, 400, {
      error: {
        code: ErrorCode.VALIDATION_FAILED,
        message: 'The address contains a malformed %-escape',
        fields: [{ field: 'path', message: 'Malformed %-escape' }],
        requestId,
      },
    })
    return
  }
  const status = (err as { status?: unknown; expose?: unknown })?.status
  if (
    typeof status === 'number' &&
    status >= 400 &&
    status < 500 &&
    (err as { expose?: unknown }).expose === true
  ) {
    // Other client errors of the body parser (unsupported charset or encoding, aborted body).
    send(res, status, {
      error: {
        code: ErrorCode.VALIDATION_FAILED,
        message: 'The request body cannot be read',
        fields: [{ field: 'body', message: (err as Error).message }],
        requestId,
      },
    })
    return
  }
  if (isDatabaseDown(err)) {
    logger.warn({ requestId, err: (err as Error).message }, 'database unavailable')
    res.setHeader('Retry-After', '5')
    send(res, 503, {
      error: {
        code: ErrorCode.SERVICE_UNAVAILABLE,
        message: 'The database is not reachable at the moment; please try again shortly',
        requestId,
      },
    })
    return
  }
  logger.error({ requestId, err }, 'unhandled error')
  send(res, 500, {
    error: { code: ErrorCode.INTERNAL, message: 'Something went wrong on our side', requestId },
  })
}
