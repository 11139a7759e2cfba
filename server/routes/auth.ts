import { Router } from 'express'
import type { NextFunction, Request, Response } from 'express'
import passport from 'passport'
import {
  passwordResetRequestSchema,
  passwordResetSchema,
  signInSchema,
} from '../../shared/schemas/auth.ts'
import { allow } from '../middleware/access.ts'
import {
  passwordResetAddressLimiter,
  passwordResetCompleteLimiter,
  passwordResetRequestLimiter,
  signInLimiter,
} from '../middleware/rate-limits.ts'
import {
  RESET_REQUEST_ANSWER,
  completePasswordReset,
  requestPasswordReset,
} from '../services/password-reset.ts'
import { recordAudit } from '../services/audit.ts'
import { toUserDto } from '../services/users.ts'
import type { User } from '../models/user.ts'

export const authRouter = Router()

authRouter.post(
  '/sign-in',
  allow('public'),
  signInLimiter,
  (req: Request, res: Response, next: NextFunction) => {
    req.body = signInSchema.parse(req.body)
    passport.authenticate('local', (err: unknown, user: User | false) => {
      if (err) return next(err)
      if (!user) return next(new Error('passport returned no user'))
      // passport >= 0.6 regenerates the session id here (no session fixation).
      req.logIn(user, (loginErr) => {
        if (loginErr) return next(loginErr)
        res.json({ user: toUserDto(user) })
      })
    })(req, res, next)
  },
)

authRouter.post('/sign-out', allow('public'), (req, res, next) => {
  const userId = req.user?.id ?? null
  req.logOut((err) => {
    if (err) return next(err)
    req.session.destroy((destroyErr) => {
      if (destroyErr) return next(destroyErr)
      res.clearCookie('tw.sid')
      const done = () => res.status(204).end()
      if (userId === null) return done()
      recordAudit({
        actorUserId: userId,
        action: 'signed-out',
        entityType: 'user',
        entityId: userId,
        ip: req.ip ?? null,
      }).then(done, next)
    })
  })
})

authRouter.get('/me', allow('signed-in'), (req, res) => {
  res.json({ user: toUserDto(req.user as User) })
})

/** "Forgot password": always 202 with the same words, whether or not the address is known. */
authRouter.post(
  '/password-reset/request',
  allow('public'),
  passwordResetAddressLimiter,
  passwordResetRequestLimiter,
  async (req, res) => {
    const { email } = passwordResetRequestSchema.parse(req.body)
    await requestPasswordReset(email, req.ip ?? null)
    res.status(202).json({ message: RESET_REQUEST_ANSWER })
  },
)

/** "Choose a new password" with the token from the mailed link; ends the account's sessions. */
authRouter.post(
  '/password-reset/complete',
  allow('public'),
  passwordResetCompleteLimiter,
  async (req, res) => {
    const input = passwordResetSchema.parse(req.body)
    await completePasswordReset(input, req.ip ?? null)
    res.status(204).end()
  },
)
