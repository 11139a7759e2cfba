import { Op } from 'sequelize'
import type { Sequelize, Transaction } from 'sequelize'
import type {
  ChangeRequestDecisionInput,
  ChangeRequestInput,
  ChangeReviewDecisionInput,
} from '../../shared/schemas/site-works.ts'
import type { ActivityInput } from '../../shared/schemas/application.ts'
import type { PermitCondition } from '../../shared/types/permits.ts'
import type {
  ChangeOwnerScreening,
  ChangeRequestDto,
  ChangeReviewDto,
} from '../../shared/types/site-works.ts'
import { config } from '../config.ts'
import { conflict, domainRule, forbidden, notFound } from '../errors.ts'
import { enqueueMail } from '../mail/outbox.ts'
import { changeRequestDeclinedMail } from '../mail/templates/change-request-decided.ts'
import { changeReviewOpenedMail } from '../mail/templates/change-review-opened.ts'
import {
  Application,
  ChangeReview,
  Organisation,
  Permit,
  PermitChangeRequest,
} from '../models/index.ts'
import type { User } from '../models/index.ts'
import { applicationForParty } from './application-parties.ts'
import { writeActivities } from './applications.ts'
import { recordAudit } from './audit.ts'
import { compareChangedWorks } from './change-screening.ts'
import { organisationEmails, userEmail } from './mail-recipients.ts'
import { extendPermit, varyPermit } from './permits.ts'
import { isoToday, reviewDueOn } from './review-clock.ts'
import { parseJson } from './review-dto.ts'
import { screenApplication } from './screening.ts'
import { currentPermit } from './site-works.ts'

const OPEN = ['with_owners', 'ready_for_decision'] as const

async function toDto(r: PermitChangeRequest, transaction?: Transaction): Promise<ChangeRequestDto> {
  const a = await Application.findByPk(r.applicationId, {
    attributes: ['id', 'reference'],
    transaction,
  })
  const p = await Permit.findByPk(r.permitId, { attributes: ['number', 'validTo'], transaction })
  const reviews = await ChangeReview.findAll({
    where: { changeRequestId: r.id },
    include: [{ model: Organisation, as: 'owner', attributes: ['id', 'name'] }],
    order: [['id', 'ASC']],
    transaction,
  })
  return {
    id: r.id,
    applicationId: r.applicationId,
    reference: a?.reference ?? `#${r.applicationId}`,
    permitId: r.permitId,
    permitNumber: p?.number ?? '',
    status: r.status,
    currentValidTo: p?.validTo ?? '',
    validTo: r.validTo,
    activities: parseJson<ActivityInput[] | null>(r.activities),
    reason: r.reason,
    screening: parseJson<ChangeOwnerScreening[]>(r.screening),
    reviews: reviews.map((v): ChangeReviewDto => ({
      id: v.id,
      owner: {
        id: v.ownerOrganisationId,
        name: (v as ChangeReview & { owner?: Organisation }).owner?.name ?? '',
      },
      state: v.state,
      dueOn: v.dueOn,
      reasons: v.reasons,
      conditions: parseJson<{ code: string; text: string }[] | null>(v.conditions) ?? [],
      decidedAt: v.decidedAt ? v.decidedAt.toISOString() : null,
    })),
    createdAt: r.createdAt.toISOString(),
    decidedAt: r.decidedAt ? r.decidedAt.toISOString() : null,
    decisionNote: r.decisionNote,
    resultPermitId: r.resultPermitId,
    version: r.version,
  }
}

/**
 * The applicant asks to extend (a later last day) and/or vary (changed activities) a granted
 * permit. The changed works are screened with the engine and compared owner by owner
 * (compareChangedWorks); each touched owner gets a change review, due in
 * CHANGE_REVIEW_WORKING_DAYS, and a mail. With nobody touched it goes straight to the office.
 * One open request per permit at a time.
 */
export async function createChangeRequest(
  sequelize: Sequelize,
  user: User,
  applicationId: number,
  input: ChangeRequestInput,
  now = new Date(),
): Promise<ChangeRequestDto> {
  if (user.role !== 'applicant') throw forbidden()
  const cfg = config()
  const id = await sequelize.transaction(async (transaction) => {
    const a = await Application.findByPk(applicationId, {
      transaction,
      lock: transaction.LOCK.UPDATE,
    })
    if (!a || a.applicantOrganisationId !== user.organisationId)
      throw notFound('application', applicationId)
    if (a.status !== 'granted')
      throw domainRule(`Only a granted permit can be changed; this one is ${a.status}`)
    const permit = await currentPermit(a.id, transaction)
    if (!permit) throw domainRule('This application has no valid permit')
    if (input.validTo && input.validTo <= permit.validTo) {
      throw domainRule('A new last day must be later than the permit’s', [
        { field: 'validTo', message: `Must be after ${permit.validTo}` },
      ])
    }
    const open = await PermitChangeRequest.count({
      where: { applicationId: a.id, status: { [Op.in]: [...OPEN] } },
      transaction,
    })
    if (open) throw conflict('A change to this permit is already being decided')
    const screening = await compareChangedWorks(
      sequelize,
      a.id,
      input.activities ?? null,
      transaction,
    )
    const touched = screening.filter((s) => s.touched)
    const r = await PermitChangeRequest.create(
      {
        applicationId: a.id,
        permitId: permit.id,
        status: touched.length ? 'with_owners' : 'ready_for_decision',
        validTo: input.validTo ?? null,
        activities: input.activities ?? null,
        reason: input.reason,
        screening,
        createdByUserId: user.id,
        decidedByUserId: null,
        decidedAt: null,
        decisionNote: null,
        resultPermitId: null,
      },
      { transaction },
    )
    const dueOn = reviewDueOn(isoToday(now), cfg.CHANGE_REVIEW_WORKING_DAYS, cfg.publicHolidays)
    for (const s of touched) {
      const v = await ChangeReview.create(
        {
          changeRequestId: r.id,
          ownerOrganisationId: s.owner.id,
          state: 'waiting',
          dueOn,
          decidedByUserId: null,
          decidedAt: null,
          reasons: null,
          conditions: null,
        },
        { transaction },
      )
      const mail = changeReviewOpenedMail({
        publicUrl: cfg.publicUrl,
        changeRequestId: r.id,
        ownerName: s.owner.name,
        reference: a.reference ?? `#${a.id}`,
        permitNumber: permit.number,
        why: s.why,
        reason: input.reason,
        dueOn,
      })
      for (const to of await organisationEmails(s.owner.id, 'asset_engineer', transaction)) {
        await enqueueMail(
          { to: [to], ...mail, related: { type: 'change_review', id: v.id } },
          transaction,
        )
      }
    }
    await recordAudit(
      {
        actorUserId: user.id,
        action: 'permit-change-requested',
        entityType: 'application',
        entityId: a.id,
        details: {
          changeRequestId: r.id,
          permitId: permit.id,
          validTo: input.validTo ?? null,
          activitiesChanged: Boolean(input.activities),
          touchedOwners: touched.map((s) => s.owner.id),
        },
      },
      transaction,
    )
    return r.id
  })
  return toDto((await PermitChangeRequest.findByPk(id))!)
}

/** Who may read a change request: the parties of its application (engineers: touched owners too). */
async function loadReadable(user: User, id: number): Promise<PermitChangeRequest> {
  const r = await PermitChangeRequest.findByPk(id)
  if (!r) throw notFound('change request', id)
  if (await applicationForParty(user, r.applicationId)) return r
  if (
    user.role === 'asset_engineer' &&
    (await ChangeReview.count({
      where: { changeRequestId: id, ownerOrganisationId: user.organisationId },
    }))
  ) {
    return r
  }
  throw notFound('change request', id)
}

export async function getChangeRequest(user: User, id: number): Promise<ChangeRequestDto> {
  return toDto(await loadReadable(user, id))
}

/** The change requests of one application, newest first, for its parties. */
export async function listApplicationChangeRequests(
  user: User,
  applicationId: number,
): Promise<ChangeRequestDto[]> {
  if (!(await applicationForParty(user, applicationId)))
    throw notFound('application', applicationId)
  const rows = await PermitChangeRequest.findAll({
    where: { applicationId },
    order: [['id', 'DESC']],
  })
  return Promise.all(rows.map((r) => toDto(r)))
}

/**
 * The change requests the user should see in a list: engineers those with a review for their
 * organisation; the office every open one.
 */
export async function listChangeRequests(user: User): Promise<ChangeRequestDto[]> {
  if (user.role === 'asset_engineer') {
    const reviews = await ChangeReview.findAll({
      where: { ownerOrganisationId: user.organisationId },
      attributes: ['changeRequestId'],
    })
    const rows = await PermitChangeRequest.findAll({
      where: { id: { [Op.in]: [0, ...reviews.map((v) => v.changeRequestId)] } },
      order: [['id', 'DESC']],
      limit: 200,
    })
    return Promise.all(rows.map((r) => toDto(r)))
  }
  if (user.role === 'permit_officer' || user.role === 'admin') {
    const rows = await PermitChangeRequest.findAll({
      where: { status: { [Op.in]: [...OPEN] } },
      order: [['id', 'ASC']],
      limit: 500,
    })
    return Promise.all(rows.map((r) => toDto(r)))
  }
  throw forbidden()
}

/** A touched owner answers a change request; when every touched owner has, it goes to the office. */
export async function decideChangeReview(
  sequelize: Sequelize,
  user: User,
  id: number,
  input: ChangeReviewDecisionInput,
  now = new Date(),
): Promise<ChangeRequestDto> {
  if (user.role !== 'asset_engineer') throw forbidden()
  await sequelize.transaction(async (transaction) => {
    const r = await PermitChangeRequest.findByPk(id, { transaction, lock: transaction.LOCK.UPDATE })
    const v = r
      ? await ChangeReview.findOne({
          where: { changeRequestId: id, ownerOrganisationId: user.organisationId },
          transaction,
          lock: transaction.LOCK.UPDATE,
        })
      : null
    if (!r || !v) throw notFound('change request', id)
    if (r.status !== 'with_owners' || v.state !== 'waiting') {
      throw domainRule('This change request is no longer waiting for your answer')
    }
    await v.update(
      {
        state: input.decision,
        reasons: input.reasons || null,
        conditions: input.decision === 'accepted_with_conditions' ? input.conditions : [],
        decidedByUserId: user.id,
        decidedAt: now,
      },
      { transaction },
    )
    const waiting = await ChangeReview.count({
      where: { changeRequestId: id, state: 'waiting' },
      transaction,
    })
    if (!waiting)
      await r.update({ status: 'ready_for_decision', version: r.version + 1 }, { transaction })
    await recordAudit(
      {
        actorUserId: user.id,
        action: 'change-review-decided',
        entityType: 'permit_change_request',
        entityId: id,
        details: {
          changeReviewId: v.id,
          decision: input.decision,
          conditions: input.conditions.length,
        },
      },
      transaction,
    )
  })
  return getChangeRequest(user, id)
}

/**
 * The office grants or declines a change request once every touched owner has answered. A
 * grant goes through the permit's own extension and variation: changed activities are stored
 * and screened again, then a variation adds the touched owners' new conditions (with the
 * activities changed, even without new conditions); a later last day is an extension. Each
 * writes its own signed issue.
 */
export async function decideChangeRequest(
  sequelize: Sequelize,
  user: User,
  id: number,
  input: ChangeRequestDecisionInput,
  now = new Date(),
): Promise<ChangeRequestDto> {
  if (user.role !== 'permit_officer') throw forbidden()
  const r = await PermitChangeRequest.findByPk(id)
  if (!r) throw notFound('change request', id)
  if (r.version !== input.version)
    throw conflict('The change request changed since you opened it; reload')
  if (r.status !== 'ready_for_decision') {
    throw domainRule(
      r.status === 'with_owners'
        ? 'Some touched owners have not answered yet'
        : `This change request is already ${r.status}`,
    )
  }
  const a = (await Application.findByPk(r.applicationId))!
  const reason = `Change request ${r.id}: ${r.reason}`
  if (input.decision === 'decline') {
    await sequelize.transaction(async (transaction) => {
      await r.update(
        {
          status: 'declined',
          decidedByUserId: user.id,
          decidedAt: now,
          decisionNote: input.note || null,
          version: r.version + 1,
        },
        { transaction },
      )
      const p = await Permit.findByPk(r.permitId, { transaction })
      const mail = changeRequestDeclinedMail({
        publicUrl: config().publicUrl,
        applicationId: a.id,
        reference: a.reference ?? `#${a.id}`,
        permitNumber: p?.number ?? '',
        note: input.note || null,
      })
      for (const to of await userEmail(r.createdByUserId, transaction)) {
        await enqueueMail(
          { to: [to], ...mail, related: { type: 'permit_change_request', id: r.id } },
          transaction,
        )
      }
      await recordAudit(
        {
          actorUserId: user.id,
          action: 'permit-change-declined',
          entityType: 'permit_change_request',
          entityId: r.id,
          details: { applicationId: a.id, note: input.note ?? null },
        },
        transaction,
      )
    })
    return getChangeRequest(user, id)
  }

  const activities = parseJson<ActivityInput[] | null>(r.activities)
  const reviews = await ChangeReview.findAll({ where: { changeRequestId: r.id } })
  const extra: PermitCondition[] = []
  const ownerNames = new Map(
    (
      await Organisation.findAll({
        where: { id: { [Op.in]: [0, ...reviews.map((v) => v.ownerOrganisationId)] } },
        attributes: ['id', 'name'],
      })
    ).map((o) => [o.id, o.name]),
  )
  for (const v of reviews) {
    for (const c of parseJson<{ code: string; text: string }[] | null>(v.conditions) ?? []) {
      extra.push({
        code: c.code,
        text: c.text,
        ownerOrganisationId: v.ownerOrganisationId,
        ownerName: ownerNames.get(v.ownerOrganisationId) ?? null,
      })
    }
  }
  let resultId: number | null = null
  if (activities || extra.length) {
    if (activities) {
      await sequelize.transaction(async (transaction) => {
        await writeActivities(sequelize, a.id, activities, transaction)
        await screenApplication(sequelize, a.id, activities, transaction)
      })
    }
    const current = (await currentPermit(a.id))!
    const conditions = [...parseJson<PermitCondition[]>(current.conditions), ...extra]
    const varied = await varyPermit(
      sequelize,
      user,
      current.id,
      {
        reason,
        conditions: conditions.map((c) => ({
          code: c.code,
          text: c.text,
          ownerOrganisationId: c.ownerOrganisationId,
        })),
      },
      now,
    )
    resultId = varied.id
  }
  if (r.validTo) {
    const current = (await currentPermit(a.id))!
    if (current.validTo < r.validTo) {
      resultId = (
        await extendPermit(sequelize, user, current.id, { validTo: r.validTo, reason }, now)
      ).id
    }
  }
  await r.update({
    status: 'granted',
    decidedByUserId: user.id,
    decidedAt: now,
    decisionNote: input.note || null,
    resultPermitId: resultId,
    version: r.version + 1,
  })
  await recordAudit({
    actorUserId: user.id,
    action: 'permit-change-granted',
    entityType: 'permit_change_request',
    entityId: r.id,
    details: { applicationId: a.id, resultPermitId: resultId, conditionsAdded: extra.length },
  })
  return getChangeRequest(user, id)
}

/** The applicant withdraws an open change request. */
export async function withdrawChangeRequest(user: User, id: number): Promise<ChangeRequestDto> {
  const r = await loadReadable(user, id)
  const a = await Application.findByPk(r.applicationId)
  if (user.role !== 'applicant' || a?.applicantOrganisationId !== user.organisationId)
    throw forbidden()
  if (!OPEN.includes(r.status as (typeof OPEN)[number])) {
    throw domainRule(`This change request is already ${r.status}`)
  }
  await r.update({ status: 'withdrawn', version: r.version + 1 })
  await recordAudit({
    actorUserId: user.id,
    action: 'permit-change-withdrawn',
    entityType: 'permit_change_request',
    entityId: r.id,
    details: { applicationId: r.applicationId },
  })
  return getChangeRequest(user, id)
}
