import type { RequestHandler } from 'express'
import { forbidden } from '../errors.ts'

/** The header every state-changing request from our client carries. */
export const CLIENT_HEADER = 'x-trenchward-client'

const SAFE_METHODS = new Set(['GET', 'HEAD', 'OPTIONS'])

/**
 * Cross-site request forgery guard for cookie-authenticated writes. A browser only sends a
 * custom header cross-origin after a CORS preflight, which this API never approves, so a write
 * carrying it came from our own pages. Session cookies are also SameSite=Lax.
 */
export const requireClientHeader: RequestHandler = (req, _res, next) => {
  if (SAFE_METHODS.has(req.method)) return next()
  if (req.get(CLIENT_HEADER) !== '1') {
    return next(forbidden('Write requests must come from the Trenchward client'))
  }
  next()
}
