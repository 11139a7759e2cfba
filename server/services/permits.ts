import type { Sequelize, Transaction } from 'sequelize'
import type {
  ExtendPermitInput,
  RevokePermitInput,
  VaryPermitInput,
} from '../../shared/schemas/permits.ts'
import type { PermitCondition, PermitDto } from '../../shared/types/permits.ts'
import { config } from '../config.ts'
import { domainRule, forbidden, notFound } from '../errors.ts'
import { enqueueMail } from '../mail/outbox.ts'
import { permitRevokedMail } from '../mail/templates/permit-revoked.ts'
import { Application, AuditEvent, Organisation, Permit, User } from '../models/index.ts'
import { chargeChangeFee } from './fee-charges.ts'
import { applicationForParty } from './application-parties.ts'
import { recordAudit } from './audit.ts'
import { userEmail } from './mail-recipients.ts'
import {
  effectivePermitStatus,
  issuePermitDocument,
  newVerificationCode,
  toPermitDto,
} from './permit-issue.ts'
import { isoToday } from './review-clock.ts'
import { parseJson } from './review-dto.ts'
import { lockApplication } from './review-progress.ts'
import { rescreenCombined } from './combined-screening.ts'
import { screeningTransaction } from './segment-locks.ts'

const withIssuer = { include: [{ model: User, as: 'issuedBy', attributes: ['id', 'name'] }] }
const issuerOf = (p: Permit) => (p as Permit & { issuedBy?: User }).issuedBy ?? null

async function loadForParty(
  user: User,
  id: number,
): Promise<{ permit: Permit; application: Application }> {
  const permit = await Permit.findByPk(id, withIssuer)
  const application = permit ? await applicationForParty(user, permit.applicationId) : null
  if (!permit || !application) throw notFound('permit', id)
  return { permit, application }
}

/** One permit issue, for the parties of its application. */
export async function getPermit(user: User, id: number): Promise<PermitDto> {
  const { permit, application } = await loadForParty(user, id)
  return toPermitDto(permit, application, issuerOf(permit))
}

/** The stored signed PDF of a permit issue (path and file name), for the parties. */
export async function permitDocument(
  user: User,
  id: number,
): Promise<{ path: string; filename: string }> {
  const { permit } = await loadForParty(user, id)
  if (!permit.pdfPath) throw notFound('permit document', id)
  return { path: permit.pdfPath, filename: `${permit.number}-issue-${permit.issue}.pdf` }
}

/** Every issue of an application's permit (oldest first) and the refusal, if it was refused. */
export async function listApplicationPermits(
  user: User,
  applicationId: number,
): Promise<{
  permits: PermitDto[]
  refusal: { reasons: string; at: string; by: string | null } | null
}> {
  const application = await applicationForParty(user, applicationId)
  if (!application) throw notFound('application', applicationId)
  const permits = await Permit.findAll({
    where: { applicationId },
    ...withIssuer,
    order: [['issue', 'ASC']],
  })
  let refusal = null
  if (application.status === 'refused') {
    const e = await AuditEvent.findOne({
      where: {
        entityType: 'application',
        entityId: String(applicationId),
        action: 'application-refused',
      },
      include: [{ model: User, as: 'actor', attributes: ['name'] }],
      order: [['id', 'DESC']],
    })
    if (e) {
      refusal = {
        reasons: String((parseJson<Record<string, unknown>>(e.details) ?? {}).reasons ?? ''),
        at: e.at.toISOString(),
        by: e.actor?.name ?? null,
      }
    }
  }
  return { permits: permits.map((p) => toPermitDto(p, application, issuerOf(p))), refusal }
}

function officer(user: User): void {
  if (user.role !== 'permit_officer' && user.role !== 'admin') throw forbidden()
}

/** The current issue of a permit, locked with its application for a change. */
async function lockCurrent(id: number, transaction: Transaction) {
  const first = await Permit.findByPk(id, { transaction })
  if (!first) throw notFound('permit', id)
  const application = await lockApplication(first.applicationId, transaction)
  const permit = await Permit.findByPk(id, { transaction, lock: transaction.LOCK.UPDATE })
  if (!application || !permit) throw notFound('permit', id)
  if (permit.status === 'superseded') {
    throw domainRule('This issue has been replaced by a later one; change the current issue')
  }
  if (permit.status === 'revoked') throw domainRule('This permit has been revoked')
  return { permit, application }
}

/** Write the next issue of a permit (extension or variation) with its new signed PDF. */
async function reissue(
  sequelize: Sequelize,
  user: User,
  id: number,
  change: {
    kind: 'extended' | 'varied'
    reason: string
    validTo?: string
    conditions?: PermitCondition[]
  },
  now: Date,
): Promise<PermitDto> {
  const newId = await screeningTransaction(sequelize, async (transaction) => {
    const { permit, application } = await lockCurrent(id, transaction)
    const validTo = change.validTo ?? permit.validTo
    if (change.kind === 'extended') {
      if (validTo <= permit.validTo) {
        throw domainRule('An extension must end later than the permit does now', [
          { field: 'validTo', message: `Must be after ${permit.validTo}` },
        ])
      }
      if (validTo < isoToday(now)) {
        throw domainRule('The extension would already have ended', [
          { field: 'validTo', message: 'Must be today or later' },
        ])
      }
    }
    const next = await Permit.create(
      {
        number: permit.number,
        issue: permit.issue + 1,
        applicationId: permit.applicationId,
        status: 'valid',
        changeKind: change.kind,
        changeReason: change.reason,
        validFrom: permit.validFrom,
        validTo,
        conditions: change.conditions ?? parseJson<PermitCondition[]>(permit.conditions),
        verificationCode: await newVerificationCode(transaction),
        pdfPath: null,
        pdfSha256: null,
        issuedByUserId: user.id,
        issuedAt: now,
        supersedesPermitId: permit.id,
        supersededAt: null,
        revokedAt: null,
        revokedByUserId: null,
        revokedReason: null,
      },
      { transaction },
    )
    await permit.update({ status: 'superseded', supersededAt: now }, { transaction })
    // The schedule in force today prices the change (date-effective, like the application fee).
    const fee = await chargeChangeFee(
      application,
      next.id,
      change.kind === 'extended' ? 'extension' : 'variation',
      transaction,
      now,
    )
    await issuePermitDocument(sequelize, next, application, transaction)
    if (application.status === 'expired') {
      application.status = 'granted'
      application.version = application.version + 1
      await application.save({ transaction })
    }
    // A new issue may change the days the works count; re-screen who shares its pipes.
    await rescreenCombined(sequelize, application.id, transaction, now)
    await recordAudit(
      {
        actorUserId: user.id,
        action: change.kind === 'extended' ? 'permit-extended' : 'permit-varied',
        entityType: 'permit',
        entityId: next.id,
        details: {
          applicationId: permit.applicationId,
          number: permit.number,
          issue: next.issue,
          supersedesPermitId: permit.id,
          reason: change.reason,
          validTo,
          conditionCount: parseJson<unknown[]>(next.conditions).length,
          pdfSha256: next.pdfSha256,
          fee_cents: fee?.amountCents ?? null,
        },
      },
      transaction,
    )
    return next.id
  })
  const p = await Permit.findByPk(newId, withIssuer)
  const a = await Application.findByPk(p!.applicationId)
  return toPermitDto(p!, a!, issuerOf(p!))
}

/** Extend a permit to a later last day: a new issue with a new signed PDF supersedes it. */
export function extendPermit(
  sequelize: Sequelize,
  user: User,
  id: number,
  input: ExtendPermitInput,
  now = new Date(),
) {
  officer(user)
  return reissue(
    sequelize,
    user,
    id,
    { kind: 'extended', reason: input.reason, validTo: input.validTo },
    now,
  )
}

/** Change a permit's conditions: a new issue with a new signed PDF supersedes it. */
export async function varyPermit(
  sequelize: Sequelize,
  user: User,
  id: number,
  input: VaryPermitInput,
  now = new Date(),
) {
  officer(user)
  const names = new Map<number, string>()
  for (const oid of new Set(
    input.conditions.map((c) => c.ownerOrganisationId).filter((x): x is number => x != null),
  )) {
    const o = await Organisation.findByPk(oid, { attributes: ['name'] })
    if (o) names.set(oid, o.name)
  }
  const conditions: PermitCondition[] = input.conditions.map((c) => ({
    code: c.code,
    text: c.text,
    ownerOrganisationId: c.ownerOrganisationId ?? null,
    ownerName: c.ownerOrganisationId != null ? (names.get(c.ownerOrganisationId) ?? null) : null,
  }))
  return reissue(sequelize, user, id, { kind: 'varied', reason: input.reason, conditions }, now)
}

/**
 * Revoke a permit: the current issue is marked revoked (its document does not change; the
 * public check reports it revoked), the application becomes revoked and the applicant is mailed.
 */
export async function revokePermit(
  sequelize: Sequelize,
  user: User,
  id: number,
  input: RevokePermitInput,
  now = new Date(),
): Promise<PermitDto> {
  officer(user)
  const cfg = config()
  await screeningTransaction(sequelize, async (transaction) => {
    const { permit, application } = await lockCurrent(id, transaction)
    const before = effectivePermitStatus(permit, isoToday(now))
    await permit.update(
      { status: 'revoked', revokedAt: now, revokedByUserId: user.id, revokedReason: input.reason },
      { transaction },
    )
    application.status = 'revoked'
    application.version = application.version + 1
    await application.save({ transaction })
    await rescreenCombined(sequelize, application.id, transaction, now)
    await recordAudit(
      {
        actorUserId: user.id,
        action: 'permit-revoked',
        entityType: 'permit',
        entityId: permit.id,
        details: {
          applicationId: application.id,
          number: permit.number,
          issue: permit.issue,
          reason: input.reason,
          statusBefore: before,
        },
      },
      transaction,
    )
    const mail = permitRevokedMail({
      publicUrl: cfg.publicUrl,
      applicationId: application.id,
      reference: application.reference ?? `#${application.id}`,
      permitNumber: permit.number,
      reason: input.reason,
    })
    for (const to of await userEmail(application.createdByUserId, transaction)) {
      await enqueueMail(
        { to: [to], ...mail, related: { type: 'permit', id: permit.id } },
        transaction,
      )
    }
  })
  const p = await Permit.findByPk(id, withIssuer)
  const a = await Application.findByPk(p!.applicationId)
  return toPermitDto(p!, a!, issuerOf(p!))
}
