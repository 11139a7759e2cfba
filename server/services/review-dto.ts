import type { Verdict } from '../../shared/statics/types.ts'
import type {
  DecidedCondition,
  ReviewDecisionDto,
  ReviewMessageDto,
  ReviewSummaryDto,
} from '../../shared/types/reviews.ts'
import type { Includeable } from 'sequelize'
import type {
  Application,
  Organisation,
  OwnerReview,
  ReviewDecision,
  ReviewMessage,
} from '../models/index.ts'
import { ApplicationAttachment, User } from '../models/index.ts'
import { reviewClock } from './review-clock.ts'

export function parseJson<T>(v: unknown): T {
  return (typeof v === 'string' ? JSON.parse(v) : v) as T
}

/** The conditions stored on a review or decision (JSON column), never null. */
export const storedConditions = (v: unknown): DecidedCondition[] =>
  v == null ? [] : parseJson<DecidedCondition[]>(v)

/** A review line with its clock as of `today`. */
export function toReviewSummary(
  r: OwnerReview,
  a: Application & { applicantOrganisation?: Organisation },
  owner: { id: number; name: string },
  today: string,
  holidays: ReadonlySet<string>,
): ReviewSummaryDto {
  return {
    id: r.id,
    applicationId: a.id,
    applicationReference: a.reference ?? `draft-${a.id}`,
    applicationTitle: a.title,
    applicationStatus: a.status,
    siteAddress: a.siteAddress,
    startsOn: a.startsOn,
    endsOn: a.endsOn,
    applicantOrganisation: {
      id: a.applicantOrganisationId,
      name: a.applicantOrganisation?.name ?? '',
    },
    owner,
    state: r.state,
    affectedSegmentCount: r.affectedSegmentCount,
    worstVerdict: (r.worstVerdict as Verdict | null) ?? null,
    version: r.version,
    ...reviewClock(r, today, holidays),
  }
}

export function toDecisionDto(d: ReviewDecision): ReviewDecisionDto {
  return {
    id: d.id,
    decision: d.decision,
    reasons: d.reasons,
    conditions: storedConditions(d.conditions),
    decidedBy: { id: d.decidedByUserId, name: d.decidedBy?.name ?? '' },
    decidedAt: d.decidedAt.toISOString(),
    superseded: d.supersededAt !== null,
  }
}

/** What a message is loaded with for `toMessageDto`: its author and its documents. */
export const MESSAGE_INCLUDE: Includeable[] = [
  { model: User, as: 'author', attributes: ['id', 'name'] },
  {
    model: ApplicationAttachment,
    as: 'attachments',
    attributes: ['id', 'applicationId', 'kind', 'originalFilename'],
    through: { attributes: [] },
  },
]

export function toMessageDto(m: ReviewMessage): ReviewMessageDto {
  return {
    id: m.id,
    kind: m.kind,
    body: m.body,
    author: { id: m.authorUserId, name: m.author?.name ?? '' },
    attachments: (m.attachments ?? [])
      .map((a) => ({
        id: a.id,
        applicationId: a.applicationId,
        kind: a.kind,
        filename: a.originalFilename,
      }))
      .sort((x, y) => x.id - y.id),
    createdAt: m.createdAt.toISOString(),
  }
}
