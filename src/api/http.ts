import { ErrorCode, type ErrorEnvelope } from '../../shared/errors.ts'
import { config } from '../config.ts'
import { ApiError } from './api-error.ts'

/**
 * The one fetch wrapper. Every API module goes through it so that credentials, the CSRF
 * header and error mapping are the same everywhere.
 */

type Method = 'GET' | 'POST' | 'PATCH' | 'PUT' | 'DELETE'

export type QueryValue = string | number | boolean | null | undefined

export interface RequestOptions {
  body?: unknown
  query?: Record<string, QueryValue>
  signal?: AbortSignal
}

/** The server refuses writes without this header (our CSRF guard). */
export const CLIENT_HEADER = 'X-Trenchward-Client'

const ERROR_CODES = new Set<string>(Object.values(ErrorCode))

/** Codes for responses whose body is not our envelope (a proxy error page, for instance). */
function codeForStatus(status: number): ErrorCode {
  if (status === 400) return ErrorCode.VALIDATION_FAILED
  if (status === 401) return ErrorCode.UNAUTHENTICATED
  if (status === 403) return ErrorCode.FORBIDDEN
  if (status === 404) return ErrorCode.NOT_FOUND
  if (status === 409) return ErrorCode.CONFLICT
  if (status === 413) return ErrorCode.PAYLOAD_TOO_LARGE
  if (status === 422) return ErrorCode.DOMAIN_RULE
  if (status === 429) return ErrorCode.RATE_LIMITED
  if (status === 503) return ErrorCode.SERVICE_UNAVAILABLE
  return ErrorCode.INTERNAL
}

function isEnvelope(body: unknown): body is ErrorEnvelope {
  if (typeof body !== 'object' || body === null || !('error' in body)) return false
  const error = (body as { error: unknown }).error
  return (
    typeof error === 'object' &&
    error !== null &&
    typeof (error as { code?: unknown }).code === 'string' &&
    typeof (error as { message?: unknown }).message === 'string'
  )
}

/** Turns a non-2xx response body into an ApiError. */
export function toApiError(status: number, body: unknown, statusText = ''): ApiError {
  if (isEnvelope(body)) {
    const { code, message, fields, requestId } = body.error
    const knownCode = ERROR_CODES.has(code) ? code : codeForStatus(status)
    return new ApiError(status, knownCode, message, fields ?? [], requestId)
  }
  return new ApiError(status, codeForStatus(status), statusText || `Request failed (${status})`)
}

type UnauthenticatedListener = (path: string) => void
let unauthenticatedListener: UnauthenticatedListener | null = null

/**
 * Called when any request except the sign-in and who-am-I calls answers 401, i.e. the session
 * ended while the user was working. The session store uses it to send them to sign-in.
 */
export function onUnauthenticated(listener: UnauthenticatedListener | null): void {
  unauthenticatedListener = listener
}

const SESSION_PROBES = ['/auth/sign-in', '/auth/me']

function buildUrl(path: string, query?: Record<string, QueryValue>): string {
  const url = `${config.apiBase}${path}`
  if (!query) return url
  const params = new URLSearchParams()
  for (const [key, value] of Object.entries(query)) {
    if (value !== undefined && value !== null && value !== '') params.set(key, String(value))
  }
  const search = params.toString()
  return search ? `${url}?${search}` : url
}

async function readBody(response: Response): Promise<unknown> {
  if (response.status === 204) return undefined
  const text = await response.text()
  if (!text) return undefined
  const type = response.headers.get('content-type') ?? ''
  if (type.includes('json')) {
    try {
      return JSON.parse(text) as unknown
    } catch {
      return undefined
    }
  }
  return text
}

/** Sends one request to the API and resolves with the parsed body (undefined for 204). */
export async function request<T>(
  method: Method,
  path: string,
  options: RequestOptions = {},
): Promise<T> {
  const headers: Record<string, string> = { Accept: 'application/json' }
  if (method !== 'GET') headers[CLIENT_HEADER] = '1'
  if (options.body !== undefined) headers['Content-Type'] = 'application/json'

  let response: Response
  try {
    response = await fetch(buildUrl(path, options.query), {
      method,
      headers,
      credentials: 'same-origin',
      body: options.body === undefined ? undefined : JSON.stringify(options.body),
      signal: options.signal,
    })
  } catch (err) {
    if (err instanceof DOMException && err.name === 'AbortError') throw err
    throw new ApiError(0, ErrorCode.NETWORK, 'Trenchward cannot be reached. Check your connection.')
  }

  const body = await readBody(response)
  if (response.ok) return body as T

  const error = toApiError(response.status, body, response.statusText)
  if (error.status === 401 && !SESSION_PROBES.includes(path)) unauthenticatedListener?.(path)
  throw error
}

export const http = {
  get: <T>(path: string, query?: Record<string, QueryValue>, signal?: AbortSignal) =>
    request<T>('GET', path, { query, signal }),
  post: <T>(path: string, body?: unknown) => request<T>('POST', path, { body }),
  patch: <T>(path: string, body?: unknown) => request<T>('PATCH', path, { body }),
  put: <T>(path: string, body?: unknown) => request<T>('PUT', path, { body }),
  delete: <T>(path: string) => request<T>('DELETE', path),
}
