import { Op } from 'sequelize'
import type { Sequelize } from 'sequelize'
import type { GrantPermitInput, RefuseApplicationInput } from '../../shared/schemas/permits.ts'
import { STANDARD_CAUTION } from '../../shared/statics/index.ts'
import type { AssessmentInput, AssessmentResult } from '../../shared/statics/types.ts'
import type { ApplicationStatus } from '../../shared/types/application.ts'
import type {
  DecisionDraftDto,
  OfficeQueueItem,
  PermitCondition,
  PermitDto,
} from '../../shared/types/permits.ts'
import type { ApplicantReviewDto } from '../../shared/types/reviews.ts'
import { OPEN_REVIEW_STATES } from '../../shared/types/reviews.ts'
import type { ApplicationDto } from '../../shared/types/application.ts'
import { config } from '../config.ts'
import { conflict, domainRule, forbidden, notFound } from '../errors.ts'
import { enqueueMail } from '../mail/outbox.ts'
import { applicationRefusedMail } from '../mail/templates/application-refused.ts'
import {
  Activity,
  Application,
  Assessment,
  Organisation,
  OwnerReview,
  Permit,
  User,
} from '../models/index.ts'
import { assertFeeAllowsGrant, closeApplicationFees } from './fee-charges.ts'
import { listApplicationReviews } from './application-reviews.ts'
import { payRefunds } from './refunds.ts'
import { getApplication } from './applications.ts'
import { recordAudit } from './audit.ts'
import { userEmail } from './mail-recipients.ts'
import { mayReadAffectedSegments } from './network-access.ts'
import {
  issuePermitDocument,
  newVerificationCode,
  permitNumber,
  toPermitDto,
} from './permit-issue.ts'
import { isoToday, reviewClock } from './review-clock.ts'
import { parseJson, storedConditions } from './review-dto.ts'
import { activityFeatures, segmentLines } from './reviews.ts'
import { lockApplication } from './review-progress.ts'
import { rescreenCombined } from './combined-screening.ts'
import { screeningTransaction } from './segment-locks.ts'

const QUEUE_STATUSES: Record<'open' | 'decided' | 'all', ApplicationStatus[]> = {
  open: ['submitted', 'with_owners', 'ready_for_decision'],
  decided: ['granted', 'refused', 'revoked', 'expired'],
  all: [
    'submitted',
    'with_owners',
    'ready_for_decision',
    'granted',
    'refused',
    'revoked',
    'expired',
    'withdrawn',
  ],
}

function officer(user: User): void {
  if (user.role !== 'permit_officer' && user.role !== 'admin') throw forbidden()
}

/**
 * The permit office's queue: applications with each affected owner's review state, due date
 * and overdue flag. Ready-for-decision applications come first, then by the earliest open due
 * date, then by submission.
 */
export async function officeQueue(
  user: User,
  query: { status: 'open' | 'decided' | 'all'; page: number; pageSize: number },
  now = new Date(),
): Promise<{ items: OfficeQueueItem[]; total: number }> {
  officer(user)
  const cfg = config()
  const today = isoToday(now)
  const apps = await Application.findAll({
    where: { status: { [Op.in]: QUEUE_STATUSES[query.status] } },
    include: [{ model: Organisation, as: 'applicantOrganisation', attributes: ['id', 'name'] }],
    order: [
      ['submittedAt', 'ASC'],
      ['id', 'ASC'],
    ],
  })
  const reviews = apps.length
    ? await OwnerReview.findAll({
        where: {
          applicationId: { [Op.in]: apps.map((a) => a.id) },
          state: { [Op.ne]: 'not_affected' },
        },
        include: [{ model: Organisation, as: 'owner', attributes: ['id', 'name'] }],
        order: [['id', 'ASC']],
      })
    : []
  const items: OfficeQueueItem[] = apps.map((a) => {
    const mine = reviews
      .filter((r) => r.applicationId === a.id)
      .map((r) => {
        const c = reviewClock(r, today, cfg.publicHolidays)
        return {
          id: r.id,
          owner: { id: r.owner!.id, name: r.owner!.name },
          state: r.state,
          dueOn: c.dueOn,
          paused: c.paused,
          dueInWorkingDays: c.dueInWorkingDays,
          overdue: c.overdue,
        }
      })
    const open = mine.filter((r) => OPEN_REVIEW_STATES.includes(r.state))
    const dues = open
      .map((r) => r.dueOn)
      .filter((d): d is string => d !== null)
      .sort()
    return {
      applicationId: a.id,
      reference: a.reference ?? `#${a.id}`,
      title: a.title,
      status: a.status,
      siteAddress: a.siteAddress,
      startsOn: a.startsOn,
      endsOn: a.endsOn,
      submittedAt: a.submittedAt ? a.submittedAt.toISOString() : null,
      applicantOrganisation: {
        id: a.applicantOrganisationId,
        name: a.applicantOrganisation?.name ?? '',
      },
      reviews: mine,
      openReviewCount: open.length,
      overdueReviewCount: mine.filter((r) => r.overdue).length,
      nextDueOn: dues[0] ?? null,
      readyForDecision: a.status === 'ready_for_decision',
    }
  })
  items.sort(
    (p, q) =>
      Number(q.readyForDecision) - Number(p.readyForDecision) ||
      (p.nextDueOn ?? '9999').localeCompare(q.nextDueOn ?? '9999') ||
      (p.submittedAt ?? '').localeCompare(q.submittedAt ?? ''),
  )
  const start = (query.page - 1) * query.pageSize
  return { total: items.length, items: items.slice(start, start + query.pageSize) }
}

/** What the permit office sees of one application: reviews and every affected segment's result. */
export interface OfficeApplicationDto {
  application: ApplicationDto
  reviews: ApplicantReviewDto[]
  activities: ReturnType<typeof activityFeatures>
  segments: {
    assessmentId: number
    owner: { id: number; name: string }
    medium: string
    distance_m: number
    verdict: string
    engineInput: AssessmentInput
    result: AssessmentResult
    geometry: { type: 'LineString'; coordinates: [number, number][] }
  }[]
  permits: PermitDto[]
  caution: string
}

/**
 * One application for the permit office: the application, each owner's review, and the
 * affected segments of every owner with the full engine results (the office handles the
 * application, so it may read them; see network-access.ts).
 */
export async function officeApplication(
  sequelize: Sequelize,
  user: User,
  id: number,
): Promise<OfficeApplicationDto> {
  officer(user)
  const application = await getApplication(user, id)
  const a = await Application.findByPk(id, { include: [{ model: Activity, as: 'activities' }] })
  if (!a) throw notFound('application', id)
  const assessments = mayReadAffectedSegments(user, a.status)
    ? await Assessment.findAll({ where: { applicationId: id }, order: [['id', 'ASC']] })
    : []
  const owners = await Organisation.findAll({
    where: { id: [...new Set(assessments.map((s) => s.ownerOrganisationId))] },
    attributes: ['id', 'name'],
  })
  const names = new Map(owners.map((o) => [o.id, o.name]))
  const lines = await segmentLines(
    sequelize,
    assessments.map((s) => s.pipeSegmentId),
  )
  const permits = await Permit.findAll({
    where: { applicationId: id },
    include: [{ model: User, as: 'issuedBy', attributes: ['id', 'name'] }],
    order: [['issue', 'ASC']],
  })
  return {
    application,
    reviews: await listApplicationReviews(user, id),
    activities: activityFeatures(a.activities ?? []),
    segments: assessments.map((s) => ({
      assessmentId: s.id,
      owner: { id: s.ownerOrganisationId, name: names.get(s.ownerOrganisationId) ?? '' },
      medium: s.medium,
      distance_m: s.distance_m,
      verdict: s.verdict,
      engineInput: parseJson<AssessmentInput>(s.engineInput),
      result: parseJson<AssessmentResult>(s.result),
      geometry: { type: 'LineString' as const, coordinates: lines.get(s.pipeSegmentId) ?? [] },
    })),
    permits: permits.map((p) =>
      toPermitDto(p, a, (p as Permit & { issuedBy?: User }).issuedBy ?? null),
    ),
    caution: STANDARD_CAUTION,
  }
}

/** The owners' conditions merged into one list, in review order, duplicates of one owner dropped. */
async function mergedConditions(applicationId: number): Promise<{
  conditions: PermitCondition[]
  objections: DecisionDraftDto['objections']
  open: number
}> {
  const reviews = await OwnerReview.findAll({
    where: { applicationId, state: { [Op.ne]: 'not_affected' } },
    include: [{ model: Organisation, as: 'owner', attributes: ['id', 'name'] }],
    order: [['id', 'ASC']],
  })
  const conditions: PermitCondition[] = []
  for (const r of reviews) {
    if (r.state !== 'accepted_with_conditions') continue
    const seen = new Set<string>()
    for (const c of storedConditions(r.conditions)) {
      if (seen.has(c.text)) continue
      seen.add(c.text)
      conditions.push({
        code: c.code,
        text: c.text,
        ownerOrganisationId: r.ownerOrganisationId,
        ownerName: r.owner?.name ?? null,
      })
    }
  }
  return {
    conditions,
    objections: reviews
      .filter((r) => r.state === 'objected')
      .map((r) => ({
        owner: { id: r.ownerOrganisationId, name: r.owner?.name ?? '' },
        reasons: r.reasons,
      })),
    open: reviews.filter((r) => OPEN_REVIEW_STATES.includes(r.state)).length,
  }
}

/** The starting point of a grant: merged conditions, the application's dates, any objections. */
export async function decisionDraft(user: User, id: number): Promise<DecisionDraftDto> {
  officer(user)
  const application = await getApplication(user, id)
  const m = await mergedConditions(id)
  return {
    applicationId: id,
    version: application.version,
    status: application.status,
    validFrom: application.startsOn,
    validTo: application.endsOn,
    conditions: m.conditions,
    objections: m.objections,
    openReviews: m.open,
  }
}

/**
 * Grant the permit: only when every owner has answered (ready for decision) and none objects.
 * Conditions are the merged owner conditions unless the officer sends an edited list; validity
 * defaults to the application's dates. Issues permit issue 1 with its signed PDF, mails it to
 * the applicant and marks the application granted, all in one transaction.
 */
export async function grantPermit(
  sequelize: Sequelize,
  user: User,
  id: number,
  input: GrantPermitInput,
  now = new Date(),
): Promise<PermitDto> {
  officer(user)
  const today = isoToday(now)
  const permitId = await screeningTransaction(sequelize, async (transaction) => {
    const a = await lockApplication(id, transaction)
    if (!a || a.status === 'draft') throw notFound('application', id)
    if (a.status !== 'ready_for_decision') {
      throw domainRule(
        a.status === 'with_owners' || a.status === 'submitted'
          ? 'Some owners have not answered yet; the permit can be granted once every review is answered'
          : `The application is ${a.status}; it cannot be granted`,
      )
    }
    if (a.version !== input.version) {
      throw conflict('The application changed after you opened it; reload before granting')
    }
    await assertFeeAllowsGrant(a.id, transaction)
    const m = await mergedConditions(id)
    if (m.objections.length) {
      throw domainRule(
        `${m.objections.map((o) => o.owner.name).join(', ')} objected; refuse the application or ask the owner to reconsider`,
      )
    }
    const owners = new Map(m.conditions.map((c) => [c.ownerOrganisationId, c.ownerName]))
    const conditions: PermitCondition[] = input.conditions
      ? await Promise.all(
          input.conditions.map(async (c) => {
            const ownerId = c.ownerOrganisationId ?? null
            let ownerName = ownerId === null ? null : (owners.get(ownerId) ?? null)
            if (ownerId !== null && ownerName === null) {
              ownerName = (await Organisation.findByPk(ownerId, { transaction }))?.name ?? null
            }
            return { code: c.code, text: c.text, ownerOrganisationId: ownerId, ownerName }
          }),
        )
      : m.conditions
    const validFrom = input.validFrom ?? a.startsOn ?? today
    const validTo = input.validTo ?? a.endsOn ?? validFrom
    if (validTo < validFrom)
      throw domainRule('The permit would end before it starts', [
        { field: 'validTo', message: 'Must not be before validFrom' },
      ])
    if (validTo < today)
      throw domainRule('The permit would already have expired', [
        { field: 'validTo', message: 'Must be today or later' },
      ])
    const permit = await Permit.create(
      {
        number: permitNumber(a.id, now),
        issue: 1,
        applicationId: a.id,
        status: 'valid',
        changeKind: 'granted',
        changeReason: input.note ?? null,
        validFrom,
        validTo,
        conditions,
        verificationCode: await newVerificationCode(transaction),
        pdfPath: null,
        pdfSha256: null,
        issuedByUserId: user.id,
        issuedAt: now,
        supersedesPermitId: null,
        supersededAt: null,
        revokedAt: null,
        revokedByUserId: null,
        revokedReason: null,
      },
      { transaction },
    )
    await issuePermitDocument(sequelize, permit, a, transaction)
    a.status = 'granted'
    a.version = a.version + 1
    await a.save({ transaction })
    // Granted works now count over the permit's validity; re-screen who shares its pipes.
    await rescreenCombined(sequelize, a.id, transaction, now)
    await recordAudit(
      {
        actorUserId: user.id,
        action: 'application-granted',
        entityType: 'application',
        entityId: a.id,
        details: {
          permitId: permit.id,
          permitNumber: permit.number,
          validFrom,
          validTo,
          conditionCount: conditions.length,
        },
      },
      transaction,
    )
    await recordAudit(
      {
        actorUserId: user.id,
        action: 'permit-issued',
        entityType: 'permit',
        entityId: permit.id,
        details: {
          applicationId: a.id,
          number: permit.number,
          issue: 1,
          pdfSha256: permit.pdfSha256,
        },
      },
      transaction,
    )
    return permit.id
  })
  const p = await Permit.findByPk(permitId, {
    include: [{ model: User, as: 'issuedBy', attributes: ['id', 'name'] }],
  })
  const a = await Application.findByPk(id)
  return toPermitDto(p!, a!, (p as Permit & { issuedBy?: User }).issuedBy ?? null)
}

/** Refuse an application that has not been decided, with reasons; the applicant is mailed. */
export async function refuseApplication(
  sequelize: Sequelize,
  user: User,
  id: number,
  input: RefuseApplicationInput,
): Promise<ApplicationDto> {
  officer(user)
  const cfg = config()
  const refunds = await screeningTransaction(sequelize, async (transaction) => {
    const a = await lockApplication(id, transaction)
    if (!a || a.status === 'draft') throw notFound('application', id)
    if (!['submitted', 'with_owners', 'ready_for_decision'].includes(a.status)) {
      throw domainRule(`The application is ${a.status}; it cannot be refused`)
    }
    if (a.version !== input.version) {
      throw conflict('The application changed after you opened it; reload before refusing')
    }
    a.status = 'refused'
    a.version = a.version + 1
    await a.save({ transaction })
    await rescreenCombined(sequelize, a.id, transaction)
    await recordAudit(
      {
        actorUserId: user.id,
        action: 'application-refused',
        entityType: 'application',
        entityId: a.id,
        details: { reasons: input.reasons },
      },
      transaction,
    )
    const mail = applicationRefusedMail({
      publicUrl: cfg.publicUrl,
      applicationId: a.id,
      reference: a.reference ?? `#${a.id}`,
      reasons: input.reasons,
    })
    for (const to of await userEmail(a.createdByUserId, transaction)) {
      await enqueueMail(
        { to: [to], ...mail, related: { type: 'application', id: a.id } },
        transaction,
      )
    }
    return closeApplicationFees(a.id, transaction)
  })
  // Refunds go to the payment service only after the refusal is committed.
  await payRefunds(sequelize, refunds)
  return getApplication(user, id)
}
