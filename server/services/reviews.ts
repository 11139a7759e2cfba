import { Op, QueryTypes } from 'sequelize'
import type { Sequelize, Transaction, WhereOptions } from 'sequelize'
import type { ReviewDecisionInput } from '../../shared/schemas/reviews.ts'
import { crsTransform } from '../../shared/geo/crs.ts'
import { STANDARD_CAUTION } from '../../shared/statics/index.ts'
import type { AssessmentInput, AssessmentResult } from '../../shared/statics/types.ts'
import type {
  ActivityFeatureCollection,
  DecidedCondition,
  ProposedConditionDto,
  ReviewDetailDto,
  ReviewState,
  ReviewSummaryDto,
  SegmentRerunDto,
} from '../../shared/types/reviews.ts'
import { config } from '../config.ts'
import { conflict, domainRule, forbidden, notFound } from '../errors.ts'
import { enqueueMail } from '../mail/outbox.ts'
import { informationRequestedMail } from '../mail/templates/information-requested.ts'
import {
  Activity,
  Application,
  Assessment,
  Organisation,
  OwnerReview,
  PipeSegment,
  ReviewDecision,
  ReviewMessage,
  SegmentRerun,
  User,
} from '../models/index.ts'
import { toApplicationDto } from './applications.ts'
import { recordAudit } from './audit.ts'
import { listConditionTemplates, resolveDecidedConditions } from './condition-templates.ts'
import { userEmail } from './mail-recipients.ts'
import { isoToday, remainingWorkingDays } from './review-clock.ts'
import {
  parseJson,
  storedConditions,
  toDecisionDto,
  MESSAGE_INCLUDE,
  toMessageDto,
  toReviewSummary,
} from './review-dto.ts'
import {
  REVIEWABLE_STATUSES,
  lockApplication,
  refreshApplicationStatus,
} from './review-progress.ts'
import { ownerCombinedView } from './combined-statement-view.ts'

const QUEUE_STATES: Record<'open' | 'answered' | 'all', ReviewState[]> = {
  open: ['waiting', 'information_requested'],
  answered: ['accepted', 'accepted_with_conditions', 'objected'],
  all: ['waiting', 'information_requested', 'accepted', 'accepted_with_conditions', 'objected'],
}

function engineerOrg(user: User): number {
  if (user.role !== 'asset_engineer') throw forbidden()
  return user.organisationId
}

/**
 * The engineer's queue: the reviews of their own organisation, earliest due date first (paused
 * and undated ones last), each with "due in N working days" and an overdue flag. Not-affected
 * records are not listed, nor open reviews of applications that were withdrawn or decided.
 */
export async function listMyReviews(
  user: User,
  query: { state: 'open' | 'answered' | 'all'; page: number; pageSize: number },
  now = new Date(),
): Promise<{ items: ReviewSummaryDto[]; total: number }> {
  const ownerOrganisationId = engineerOrg(user)
  const cfg = config()
  const where: WhereOptions<OwnerReview> = {
    ownerOrganisationId,
    state: { [Op.in]: QUEUE_STATES[query.state] },
  }
  const { rows, count } = await OwnerReview.findAndCountAll({
    where,
    include: [
      {
        model: Application,
        as: 'application',
        required: true,
        // Open reviews of withdrawn or decided applications need no answer any more.
        ...(query.state === 'open' ? { where: { status: { [Op.in]: REVIEWABLE_STATUSES } } } : {}),
        include: [{ model: Organisation, as: 'applicantOrganisation', attributes: ['id', 'name'] }],
      },
      { model: Organisation, as: 'owner', attributes: ['id', 'name'] },
    ],
    order: [
      [OwnerReview.sequelize!.literal('paused_at IS NOT NULL'), 'ASC'],
      [OwnerReview.sequelize!.literal('due_on IS NULL'), 'ASC'],
      ['dueOn', 'ASC'],
      ['id', 'ASC'],
    ],
    limit: query.pageSize,
    offset: (query.page - 1) * query.pageSize,
  })
  const today = isoToday(now)
  return {
    total: count,
    items: rows.map((r) => {
      const a = (r as OwnerReview & { application: Application }).application
      return toReviewSummary(
        r,
        a,
        { id: r.owner!.id, name: r.owner!.name },
        today,
        cfg.publicHolidays,
      )
    }),
  }
}

/** Load a review of the engineer's organisation; another owner's answers 404 like a missing one. */
async function loadOwnReview(
  user: User,
  id: number,
  transaction?: Transaction,
): Promise<OwnerReview> {
  const ownerOrganisationId = engineerOrg(user)
  const r = await OwnerReview.findByPk(id, {
    include: [{ model: Organisation, as: 'owner', attributes: ['id', 'name'] }],
    transaction,
  })
  if (!r || r.ownerOrganisationId !== ownerOrganisationId || r.state === 'not_affected') {
    throw notFound('review', id)
  }
  return r
}

/** The works as GeoJSON features (the applicant's WGS84 geometry). */
export function activityFeatures(activities: readonly Activity[]): ActivityFeatureCollection {
  return {
    type: 'FeatureCollection',
    features: [...activities]
      .sort((a, b) => a.position - b.position)
      .map((a) => {
        const input = parseJson<{ geometry: unknown }>(a.input)
        return {
          type: 'Feature' as const,
          id: a.id,
          properties: { position: a.position, kind: a.kind, label: a.label },
          geometry: input.geometry,
        }
      }),
  }
}

/** Centre lines of segments in WGS84, by segment id. */
export async function segmentLines(
  sequelize: Sequelize,
  segmentIds: readonly number[],
): Promise<Map<number, [number, number][]>> {
  const out = new Map<number, [number, number][]>()
  if (!segmentIds.length) return out
  const t = crsTransform(config().PROJECTED_EPSG)
  const rows = await sequelize.query<{ id: number; g: unknown }>(
    'SELECT id, ST_AsGeoJSON(geom) AS g FROM pipe_segments WHERE id IN (?)',
    { replacements: [segmentIds], type: QueryTypes.SELECT },
  )
  for (const r of rows) {
    const coords = parseJson<{ coordinates: number[][] }>(r.g).coordinates
    out.set(
      Number(r.id),
      coords.map((c) => t.toLonLat(c)),
    )
  }
  return out
}

export function toRerunDto(x: SegmentRerun & { createdBy?: User }): SegmentRerunDto {
  return {
    id: x.id,
    assessmentId: x.assessmentId,
    verdict: x.verdict,
    note: x.note,
    engineInput: parseJson<AssessmentInput>(x.engineInput),
    result: parseJson<AssessmentResult>(x.result),
    createdBy: { id: x.createdByUserId, name: x.createdBy?.name ?? '' },
    createdAt: x.createdAt.toISOString(),
  }
}

/** The engine's proposals over the given assessments, one entry per distinct code and text. */
export function proposedConditions(assessments: readonly Assessment[]): ProposedConditionDto[] {
  const byKey = new Map<string, ProposedConditionDto>()
  for (const a of assessments) {
    for (const c of parseJson<AssessmentResult>(a.result).conditions) {
      const key = `${c.code}\u0000${c.text}`
      const prev = byKey.get(key)
      if (prev) prev.assessmentIds.push(a.id)
      else {
        byKey.set(key, {
          code: c.code,
          text: c.text,
          reason: c.reason,
          value_m: c.value_m ?? null,
          assessmentIds: [a.id],
        })
      }
    }
  }
  return [...byKey.values()]
}

/**
 * One review for the engineer: the application and its works, every affected segment of the
 * engineer's own organisation with the full engine result (inputs, effects, checks,
 * assumptions, conditions) and its re-runs, the engine's proposed conditions, the library, the
 * decision history and the question thread. Other owners' segments are left out.
 */
export async function getReviewDetail(
  sequelize: Sequelize,
  user: User,
  id: number,
  now = new Date(),
): Promise<ReviewDetailDto> {
  const r = await loadOwnReview(user, id)
  const cfg = config()
  const a = await Application.findByPk(r.applicationId, {
    include: [
      { model: Activity, as: 'activities' },
      { model: Organisation, as: 'applicantOrganisation', attributes: ['id', 'name'] },
      { model: User, as: 'createdBy', attributes: ['id', 'name'] },
    ],
  })
  if (!a) throw notFound('review', id)
  const assessments = await Assessment.findAll({
    where: { applicationId: a.id, ownerOrganisationId: r.ownerOrganisationId },
    order: [['id', 'ASC']],
  })
  const segIds = assessments.map((s) => s.pipeSegmentId)
  const [lines, segments, reruns, decisions, messages, library] = await Promise.all([
    segmentLines(sequelize, segIds),
    PipeSegment.findAll({
      where: { id: { [Op.in]: segIds.length ? segIds : [0] } },
      attributes: ['id', 'ownerRef'],
    }),
    SegmentRerun.findAll({
      where: { reviewId: r.id },
      include: [{ model: User, as: 'createdBy', attributes: ['id', 'name'] }],
      order: [['id', 'ASC']],
    }),
    ReviewDecision.findAll({
      where: { reviewId: r.id },
      include: [{ model: User, as: 'decidedBy', attributes: ['id', 'name'] }],
      order: [['id', 'ASC']],
    }),
    ReviewMessage.findAll({
      where: { reviewId: r.id },
      include: MESSAGE_INCLUDE,
      order: [['id', 'ASC']],
    }),
    listConditionTemplates(user),
  ])
  const refs = new Map(segments.map((s) => [Number(s.id), s.ownerRef]))
  return {
    review: toReviewSummary(
      r,
      a,
      { id: r.owner!.id, name: r.owner!.name },
      isoToday(now),
      cfg.publicHolidays,
    ),
    application: toApplicationDto(a),
    activities: activityFeatures(a.activities ?? []),
    segments: assessments.map((s) => ({
      assessmentId: s.id,
      segmentId: s.pipeSegmentId,
      ownerRef: refs.get(s.pipeSegmentId) ?? '',
      medium: s.medium,
      distance_m: s.distance_m,
      verdict: s.verdict,
      engineInput: parseJson<AssessmentInput>(s.engineInput),
      result: parseJson<AssessmentResult>(s.result),
      geometry: { type: 'LineString' as const, coordinates: lines.get(s.pipeSegmentId) ?? [] },
      reruns: reruns.filter((x) => x.assessmentId === s.id).map(toRerunDto),
      combined: ownerCombinedView(s),
    })),
    proposedConditions: proposedConditions(assessments),
    library,
    decisions: decisions.map(toDecisionDto),
    messages: messages.map(toMessageDto),
    current: { reasons: r.reasons, conditions: storedConditions(r.conditions) },
    caution: STANDARD_CAUTION,
  }
}

/**
 * Decide a review: accept, accept with conditions, ask the applicant a question (pauses the
 * clock) or object. A decision is final; a later one supersedes it and both stay in the
 * history. Optimistic lock: the write succeeds only with the review `version` the engineer
 * loaded, so of two engineers deciding at once exactly one wins and the other gets 409.
 * Decisions are possible while the application is with the owners or ready for decision.
 */
export async function decideReview(
  sequelize: Sequelize,
  user: User,
  id: number,
  input: ReviewDecisionInput,
  now = new Date(),
): Promise<ReviewDetailDto> {
  const cfg = config()
  const today = isoToday(now)
  await sequelize.transaction(async (transaction) => {
    const r = await loadOwnReview(user, id, transaction)
    const a = await lockApplication(r.applicationId, transaction)
    if (!a) throw notFound('review', id)
    if (!REVIEWABLE_STATUSES.includes(a.status)) {
      throw domainRule(`The application is ${a.status}; its reviews can no longer change`)
    }
    // Current values, read under the application lock (every review change takes it first).
    const current = await OwnerReview.findByPk(id, { transaction, lock: transaction.LOCK.UPDATE })
    if (!current || current.version !== input.version) {
      throw conflict(
        'Somebody decided this review after you opened it; reload to see their decision',
      )
    }
    let conditions: DecidedCondition[] | null = null
    let reasons: string | null = null
    if (input.decision === 'accepted_with_conditions') {
      conditions = await resolveDecidedConditions(
        r.ownerOrganisationId,
        input.conditions,
        transaction,
      )
      reasons = input.reasons ?? null
    } else if (input.decision === 'accepted') reasons = input.reasons ?? null
    else if (input.decision === 'objected') reasons = input.reasons
    else reasons = input.question

    const asking = input.decision === 'information_requested'
    const wasPaused = current.pausedAt !== null
    const clock = asking
      ? {
          pausedAt: wasPaused ? current.pausedAt : now,
          remainingWorkingDays: wasPaused
            ? current.remainingWorkingDays
            : current.dueOn
              ? remainingWorkingDays(today, current.dueOn, cfg.publicHolidays)
              : cfg.REVIEW_PERIOD_WORKING_DAYS,
          dueOn: current.dueOn,
        }
      : { pausedAt: null, remainingWorkingDays: null, dueOn: current.dueOn }
    const [changed] = await OwnerReview.update(
      {
        state: input.decision,
        version: input.version + 1,
        decidedByUserId: user.id,
        decidedAt: now,
        reasons,
        conditions,
        ...clock,
      },
      { where: { id, version: input.version }, transaction },
    )
    if (changed === 0) {
      throw conflict(
        'Somebody decided this review after you opened it; reload to see their decision',
      )
    }
    const previous = await ReviewDecision.findOne({
      where: { reviewId: id, supersededAt: null },
      order: [['id', 'DESC']],
      transaction,
    })
    if (previous) await previous.update({ supersededAt: now }, { transaction })
    const decision = await ReviewDecision.create(
      {
        reviewId: id,
        decision: input.decision,
        reasons,
        conditions,
        decidedByUserId: user.id,
        decidedAt: now,
        supersedesDecisionId: previous?.id ?? null,
        supersededAt: null,
      },
      { transaction },
    )
    if (asking) {
      await ReviewMessage.create(
        {
          reviewId: id,
          kind: 'question',
          body: input.question,
          authorUserId: user.id,
        },
        { transaction },
      )
      const mail = informationRequestedMail({
        publicUrl: cfg.publicUrl,
        applicationId: a.id,
        reference: a.reference ?? `#${a.id}`,
        ownerName: r.owner!.name,
        question: input.question,
      })
      for (const to of await userEmail(a.createdByUserId, transaction)) {
        await enqueueMail({ to: [to], ...mail, related: { type: 'owner_review', id } }, transaction)
      }
    }
    await recordAudit(
      {
        actorUserId: user.id,
        action: previous ? 'review-decision-superseded' : 'review-decided',
        entityType: 'owner_review',
        entityId: id,
        details: {
          applicationId: a.id,
          ownerOrganisationId: r.ownerOrganisationId,
          decision: input.decision,
          decisionId: decision.id,
          supersedesDecisionId: previous?.id ?? null,
          conditionCount: conditions?.length ?? 0,
          clockPaused: asking,
        },
      },
      transaction,
    )
    await refreshApplicationStatus(sequelize, a, user.id, transaction)
  })
  return getReviewDetail(sequelize, user, id, now)
}
