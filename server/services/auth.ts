import bcrypt from 'bcrypt'
import { addMinutes, format } from 'date-fns'
import { ErrorCode } from '../../shared/errors.ts'
import { config } from '../config.ts'
import { AppError, unauthenticated } from '../errors.ts'
import { Organisation, User } from '../models/index.ts'
import { recordAudit } from './audit.ts'

// Compared against when the e-mail is unknown, so both failures take the same time.
const DUMMY_HASH = '$2b$12$CwTycUXWue0Thq9StjUM0uJ8.Ww0wQkF6Hn1s2bDcRcQ8mZsdFkUa'

export const WRONG_CREDENTIALS = 'E-mail or password is not right'

/**
 * Check an e-mail and password. Repeated failures lock the account for a while (counted in the
 * database, so every app process sees the same count); every attempt is audited.
 */
export async function verifyCredentials(
  email: string,
  password: string,
  ip: string | null,
): Promise<User> {
  const cfg = config()
  const user = await User.findOne({
    where: { email },
    include: [{ model: Organisation, as: 'organisation' }],
  })
  if (!user) {
    await bcrypt.compare(password, DUMMY_HASH)
    await recordAudit({
      actorUserId: null,
      action: 'sign-in-failed',
      entityType: 'user',
      details: { email, reason: 'unknown e-mail' },
      ip,
    })
    throw unauthenticated(WRONG_CREDENTIALS)
  }
  const now = new Date()
  if (user.lockedUntil && user.lockedUntil > now) {
    await recordAudit({
      actorUserId: null,
      action: 'sign-in-refused',
      entityType: 'user',
      entityId: user.id,
      details: { reason: 'locked' },
      ip,
    })
    throw new AppError(
      ErrorCode.RATE_LIMITED,
      429,
      `Too many failed sign-ins. Try again after ${format(user.lockedUntil, 'HH:mm')} or ask an administrator to reset your password.`,
    )
  }
  const ok = await bcrypt.compare(password, user.passwordHash)
  if (!ok || !user.active) {
    const failures = user.failedSignIns + 1
    const lock = failures >= cfg.SIGN_IN_MAX_FAILURES
    user.failedSignIns = lock ? 0 : failures
    if (lock) user.lockedUntil = addMinutes(now, cfg.SIGN_IN_LOCK_MIN)
    await user.save()
    await recordAudit({
      actorUserId: null,
      action: lock ? 'account-locked' : 'sign-in-failed',
      entityType: 'user',
      entityId: user.id,
      details: { reason: ok ? 'inactive' : 'wrong password', failures },
      ip,
    })
    throw unauthenticated(WRONG_CREDENTIALS)
  }
  user.failedSignIns = 0
  user.lockedUntil = null
  user.lastSignInAt = now
  await user.save()
  await recordAudit({
    actorUserId: user.id,
    action: 'signed-in',
    entityType: 'user',
    entityId: user.id,
    ip,
  })
  return user
}
