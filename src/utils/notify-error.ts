import { Notify } from 'quasar'
import { ErrorCode } from '../../shared/errors.ts'
import { isApiError } from '../api/api-error.ts'

/** What we tell the user for each code when the server's own message is not the right one. */
const MESSAGES: Partial<Record<ErrorCode, string>> = {
  [ErrorCode.UNAUTHENTICATED]: 'Your session has ended. Sign in again to carry on.',
  [ErrorCode.FORBIDDEN]: 'Your role does not allow this.',
  [ErrorCode.RATE_LIMITED]:
    'Too many attempts in a short time. Wait a few minutes, then try again.',
  [ErrorCode.NETWORK]: 'Trenchward cannot be reached. Check your connection and try again.',
  [ErrorCode.SERVICE_UNAVAILABLE]: 'Trenchward is busy or being updated. Try again in a minute.',
  [ErrorCode.INTERNAL]: 'Something went wrong on our side. It has been logged.',
}

/** The sentence to show for any error a page could not handle itself. */
export function errorMessage(err: unknown): string {
  if (isApiError(err)) return MESSAGES[err.code] ?? err.message
  return MESSAGES[ErrorCode.INTERNAL] as string
}

/** Shows an unexpected error as a negative notification, with the request id for support. */
export function notifyError(err: unknown, context?: string): void {
  const message = errorMessage(err)
  const requestId = isApiError(err) ? err.requestId : undefined
  Notify.create({
    type: 'negative',
    message: context ? `${context}: ${message}` : message,
    caption: requestId ? `Reference ${requestId}` : undefined,
  })
  if (!isApiError(err)) console.error(err)
}
