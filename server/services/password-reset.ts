import { createHash, randomBytes } from 'node:crypto'
import { addMinutes, subHours } from 'date-fns'
import { Op } from 'sequelize'
import { passwordProblem } from '../../shared/schemas/password-rules.ts'
import type { PasswordResetInput } from '../../shared/schemas/auth.ts'
import { endSessionsOfUser } from '../auth/user-sessions.ts'
import { config } from '../config.ts'
import { domainRule, validationFailed } from '../errors.ts'
import { enqueueMail } from '../mail/outbox.ts'
import { passwordResetMail } from '../mail/templates/password-reset.ts'
import { PasswordReset, User } from '../models/index.ts'
import { recordAudit } from './audit.ts'
import { hashPassword } from './users.ts'

/** Links mailed to one account per hour; further requests are answered alike but send nothing. */
export const RESET_MAILS_PER_HOUR = 3

/** The answer to every reset request, whether or not the address has an account. */
export const RESET_REQUEST_ANSWER =
  'If an account uses this address, a link to choose a new password is on its way. It works once, for a limited time.'

/** The Sequelize instance the models were registered on. */
const db = () => PasswordReset.sequelize!

const sha256 = (token: string) => createHash('sha256').update(token).digest('hex')

/**
 * "Forgot password": for an active account, store the SHA-256 of a fresh random token and put a
 * mail with the link in the outbox (one transaction). Unknown, inactive or over-limit addresses
 * get no mail; the caller answers every case the same. Every request is audited.
 */
export async function requestPasswordReset(email: string, ip: string | null): Promise<void> {
  const cfg = config()
  const user = await User.findOne({ where: { email } })
  if (!user || !user.active) {
    await recordAudit({
      actorUserId: null,
      action: 'password-reset-requested',
      entityType: 'user',
      entityId: user?.id ?? null,
      details: { email, sent: false, reason: user ? 'inactive' : 'unknown e-mail' },
      ip,
    })
    return
  }
  const now = new Date()
  const recent = await PasswordReset.count({
    where: { userId: user.id, createdAt: { [Op.gt]: subHours(now, 1) } },
  })
  if (recent >= RESET_MAILS_PER_HOUR) {
    await recordAudit({
      actorUserId: null,
      action: 'password-reset-requested',
      entityType: 'user',
      entityId: user.id,
      details: { sent: false, reason: 'too many requests' },
      ip,
    })
    return
  }
  const token = randomBytes(32).toString('base64url')
  await db().transaction(async (transaction) => {
    // A new link replaces the older ones still open.
    await PasswordReset.update(
      { usedAt: now },
      { where: { userId: user.id, usedAt: null }, transaction },
    )
    await PasswordReset.create(
      {
        userId: user.id,
        tokenSha256: sha256(token),
        expiresAt: addMinutes(now, cfg.PASSWORD_RESET_TTL_MIN),
        usedAt: null,
        requestedIp: ip,
      },
      { transaction },
    )
    const mail = passwordResetMail({
      publicUrl: cfg.publicUrl,
      name: user.name,
      token,
      validMinutes: cfg.PASSWORD_RESET_TTL_MIN,
    })
    await enqueueMail(
      { to: [user.email], ...mail, related: { type: 'user', id: user.id } },
      transaction,
    )
    await recordAudit(
      {
        actorUserId: null,
        action: 'password-reset-requested',
        entityType: 'user',
        entityId: user.id,
        details: { sent: true },
        ip,
      },
      transaction,
    )
  })
}

const linkUnusable = () =>
  domainRule(
    'This link has expired or has been used already. Ask for a new one on the sign-in page.',
    [{ field: 'token', message: 'Expired or used' }],
  )

/**
 * "Choose a new password": check the token (exists, unused, not expired), the password rules
 * (including "not the e-mail"), then in one transaction set the new hash, lift a lock, use up the
 * link and end every session of the account. The user signs in afresh.
 */
export async function completePasswordReset(
  input: PasswordResetInput,
  ip: string | null,
): Promise<void> {
  const digest = sha256(input.token)
  const pending = await PasswordReset.findOne({ where: { tokenSha256: digest } })
  if (!pending || pending.usedAt || pending.expiresAt <= new Date()) {
    await recordAudit({
      actorUserId: null,
      action: 'password-reset-refused',
      entityType: 'user',
      entityId: pending?.userId ?? null,
      details: { reason: !pending ? 'unknown link' : pending.usedAt ? 'used' : 'expired' },
      ip,
    })
    throw linkUnusable()
  }
  const user = await User.findByPk(pending.userId)
  if (!user || !user.active) throw linkUnusable()
  const problem = passwordProblem(input.password, user.email)
  if (problem) throw validationFailed([{ field: 'password', message: problem }])
  const passwordHash = await hashPassword(input.password)
  await db().transaction(async (transaction) => {
    // Single use even when two requests race: only one UPDATE finds the row unused.
    const [claimed] = await PasswordReset.update(
      { usedAt: new Date() },
      { where: { id: pending.id, usedAt: null }, transaction },
    )
    if (claimed !== 1) throw linkUnusable()
    await User.update(
      { passwordHash, failedSignIns: 0, lockedUntil: null },
      { where: { id: user.id }, transaction },
    )
    const ended = await endSessionsOfUser(db(), user.id, { transaction })
    await recordAudit(
      {
        actorUserId: user.id,
        action: 'password-reset',
        entityType: 'user',
        entityId: user.id,
        details: { sessionsEnded: ended },
        ip,
      },
      transaction,
    )
  })
}
