import type { RequestHandler } from 'express'
import type { Role } from '../../shared/types/roles.ts'
import { forbidden, unauthenticated } from '../errors.ts'

/** Who may call a route: anyone, any signed-in user, or the listed roles. */
export type Access = 'public' | 'signed-in' | readonly Role[]

const ACCESS_KEY = Symbol.for('trenchward.access')

/**
 * The one access guard. Every API route names who may call it with `allow(...)`; the role is
 * checked on the server for each request, whatever the client shows. The declared access is
 * kept on the handler so the access-matrix test can list it.
 */
export function allow(access: Access): RequestHandler {
  const guard: RequestHandler = (req, _res, next) => {
    if (access === 'public') return next()
    if (!req.user) return next(unauthenticated())
    if (access === 'signed-in') return next()
    if (!access.includes(req.user.role)) return next(forbidden())
    next()
  }
  Object.defineProperty(guard, ACCESS_KEY, { value: access })
  return guard
}

/** The access a guard created by `allow` declares, or undefined for any other handler. */
export function declaredAccess(handler: unknown): Access | undefined {
  return (handler as Record<symbol, Access> | undefined)?.[ACCESS_KEY]
}
