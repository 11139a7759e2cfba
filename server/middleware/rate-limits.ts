import { ipKeyGenerator, rateLimit } from 'express-rate-limit'
import type { Request } from 'express'
import { ErrorCode } from '../../shared/errors.ts'

const byAddress = (req: Request) => ipKeyGenerator(req.ip ?? '')

/** A per-process limit that answers in our error envelope with a plain message. */
function limiter(opts: {
  window_ms: number
  limit: number
  message: string
  key?: (req: Request) => string
  skipSuccessfulRequests?: boolean
}) {
  return rateLimit({
    windowMs: opts.window_ms,
    limit: opts.limit,
    skipSuccessfulRequests: opts.skipSuccessfulRequests ?? false,
    standardHeaders: 'draft-8',
    legacyHeaders: false,
    keyGenerator: opts.key ?? byAddress,
    handler: (req, res) => {
      res.status(429).json({
        error: { code: ErrorCode.RATE_LIMITED, message: opts.message, requestId: String(req.id) },
      })
    },
  })
}

/**
 * Failed sign-ins per client address and e-mail: 10 in 15 minutes, successes not counted. The
 * per-account lock in the database (services/auth.ts) holds across processes; this limit also
 * stops one address from trying many accounts.
 */
export const signInLimiter = limiter({
  window_ms: 15 * 60_000,
  limit: 10,
  skipSuccessfulRequests: true,
  message: 'Too many sign-in attempts. Wait a few minutes and try again.',
  key: (req) =>
    `${byAddress(req)}|${String((req.body as { email?: unknown })?.email ?? '').toLowerCase()}`,
})

/**
 * The public permit check: 60 look-ups a minute per client address, enough for an inspector
 * scanning a site, too few to walk the code space.
 */
export const verifyLimiter = limiter({
  window_ms: 60_000,
  limit: 60,
  message: 'Too many checks from your address. Wait a minute and try again.',
})

/** Uploads per client address: 60 in 10 minutes, enough for a person, not for a flood. */
export const uploadLimiter = limiter({
  window_ms: 10 * 60_000,
  limit: 60,
  message: 'Too many uploads in a short time. Wait a few minutes and try again.',
})

/**
 * "Forgot password" requests: 5 per client address and e-mail in 15 minutes, 20 per address
 * (every request counts). The service also sends at most a few links per account and hour.
 */
export const passwordResetRequestLimiter = limiter({
  window_ms: 15 * 60_000,
  limit: 5,
  message: 'Too many requests for a new password. Wait a few minutes and try again.',
  key: (req) =>
    `${byAddress(req)}|${String((req.body as { email?: unknown })?.email ?? '').toLowerCase()}`,
})

export const passwordResetAddressLimiter = limiter({
  window_ms: 15 * 60_000,
  limit: 20,
  message: 'Too many requests for a new password. Wait a few minutes and try again.',
})

/** Attempts to use a reset link: 20 per client address in 15 minutes (tokens cannot be walked). */
export const passwordResetCompleteLimiter = limiter({
  window_ms: 15 * 60_000,
  limit: 20,
  message: 'Too many attempts. Wait a few minutes and ask for a new link.',
})
