import { ipKeyGenerator, rateLimit } from 'express-rate-limit'
import { ErrorCode } from '../../shared/errors.ts'

/**
 * Failed sign-ins per client address and e-mail: 10 in 15 minutes, successes not counted. The
 * per-account lock in the database (services/auth.ts) holds across processes; this limit also
 * stops one address from trying many accounts.
 */
export const signInLimiter = rateLimit({
  windowMs: 15 * 60_000,
  limit: 10,
  skipSuccessfulRequests: true,
  standardHeaders: 'draft-8',
  legacyHeaders: false,
  keyGenerator: (req) =>
    `${ipKeyGenerator(req.ip ?? '')}|${String((req.body as { email?: unknown })?.email ?? '').toLowerCase()}`,
  handler: (req, res) => {
    res.status(429).json({
      error: {
        code: ErrorCode.RATE_LIMITED,
        message: 'Too many sign-in attempts. Wait a few minutes and try again.',
        requestId: String(req.id),
      },
    })
  },
})

/**
 * The public permit check: 60 look-ups a minute per client address, enough for an inspector
 * scanning a site, too few to walk the code space.
 */
export const verifyLimiter = rateLimit({
  windowMs: 60_000,
  limit: 60,
  standardHeaders: 'draft-8',
  legacyHeaders: false,
  keyGenerator: (req) => ipKeyGenerator(req.ip ?? ''),
  handler: (req, res) => {
    res.status(429).json({
      error: {
        code: ErrorCode.RATE_LIMITED,
        message: 'Too many checks from your address. Wait a minute and try again.',
        requestId: String(req.id),
      },
    })
  },
})

/** Uploads per client address: 60 in 10 minutes, enough for a person, not for a flood. */
export const uploadLimiter = rateLimit({
  windowMs: 10 * 60_000,
  limit: 60,
  standardHeaders: 'draft-8',
  legacyHeaders: false,
  keyGenerator: (req) => ipKeyGenerator(req.ip ?? ''),
  handler: (req, res) => {
    res.status(429).json({
      error: {
        code: ErrorCode.RATE_LIMITED,
        message: 'Too many uploads in a short time. Wait a few minutes and try again.',
        requestId: String(req.id),
      },
    })
  },
})
