import { afterEach, describe, expect, it, vi } from 'vitest'
import { ApiError } from '../../../src/api/api-error.ts'
import { http, onUnauthenticated, request, toApiError } from '../../../src/api/http.ts'

function jsonResponse(status: number, body: unknown): Response {
  return new Response(JSON.stringify(body), {
    status,
    headers: { 'Content-Type': 'application/json' },
  })
}

afterEach(() => {
  vi.unstubAllGlobals()
  onUnauthenticated(null)
})

describe('http', () => {
  it('when the server answers with an error envelope, then it throws an ApiError carrying it', async () => {
    const fetchMock = vi.fn().mockResolvedValue(
      jsonResponse(400, {
        error: {
          code: 'VALIDATION_FAILED',
          message: 'Some fields need attention',
          fields: [{ field: 'email', message: 'Enter a valid e-mail address' }],
          requestId: 'req-7',
        },
      }),
    )
    vi.stubGlobal('fetch', fetchMock)

    const error = await http
      .post('/auth/sign-in', { email: 'x', password: 'y' })
      .catch((e: unknown) => e)

    expect(error).toBeInstanceOf(ApiError)
    expect(error).toMatchObject({
      status: 400,
      code: 'VALIDATION_FAILED',
      message: 'Some fields need attention',
      fields: [{ field: 'email', message: 'Enter a valid e-mail address' }],
      requestId: 'req-7',
    })
  })

  it('when a write is sent, then it carries the client header, JSON body and same-origin credentials', async () => {
    const fetchMock = vi.fn().mockResolvedValue(new Response(null, { status: 204 }))
    vi.stubGlobal('fetch', fetchMock)

    const result = await http.post('/auth/sign-out', { reason: 'done' })

    expect(result).toBeUndefined()
    const [url, init] = fetchMock.mock.calls[0] as [string, RequestInit]
    expect(url).toBe('/api/auth/sign-out')
    expect(init.method).toBe('POST')
    expect(init.credentials).toBe('same-origin')
    expect(init.headers).toMatchObject({
      'X-Trenchward-Client': '1',
      'Content-Type': 'application/json',
    })
    expect(init.body).toBe('{"reason":"done"}')
  })

  it('when a read is sent, then it has no client header and puts the query in the URL', async () => {
    const fetchMock = vi.fn().mockResolvedValue(jsonResponse(200, { items: [], total: 0 }))
    vi.stubGlobal('fetch', fetchMock)

    const body = await http.get('/admin/audit', { page: 2, pageSize: 50, empty: undefined })

    expect(body).toEqual({ items: [], total: 0 })
    const [url, init] = fetchMock.mock.calls[0] as [string, RequestInit]
    expect(url).toBe('/api/admin/audit?page=2&pageSize=50')
    expect(init.headers).not.toHaveProperty('X-Trenchward-Client')
  })

  it('when the network fails, then it throws an ApiError with code NETWORK and status 0', async () => {
    vi.stubGlobal('fetch', vi.fn().mockRejectedValue(new TypeError('Failed to fetch')))

    const error = await request('GET', '/home').catch((e: unknown) => e)

    expect(error).toBeInstanceOf(ApiError)
    expect(error).toMatchObject({ status: 0, code: 'NETWORK' })
  })

  it('when the body is not an envelope, then the code follows the status', () => {
    expect(toApiError(429, '<html>slow down</html>', 'Too Many Requests')).toMatchObject({
      status: 429,
      code: 'RATE_LIMITED',
      message: 'Too Many Requests',
      fields: [],
    })
    expect(toApiError(502, undefined)).toMatchObject({ code: 'INTERNAL' })
  })

  it('when a page call answers 401, then the unauthenticated listener hears it; sign-in probes do not', async () => {
    const listener = vi.fn()
    onUnauthenticated(listener)
    const unauthenticated = { error: { code: 'UNAUTHENTICATED', message: 'Sign in first' } }
    vi.stubGlobal(
      'fetch',
      vi.fn().mockImplementation(() => Promise.resolve(jsonResponse(401, unauthenticated))),
    )

    await http.get('/home').catch(() => undefined)
    await http.get('/auth/me').catch(() => undefined)
    await http.post('/auth/sign-in', {}).catch(() => undefined)

    expect(listener).toHaveBeenCalledTimes(1)
    expect(listener).toHaveBeenCalledWith('/home')
  })
})
