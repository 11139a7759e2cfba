import type { CombinedStatement } from './coordination.ts'
import type { ApplicationDto, ApplicationStatus } from './application.ts'
import type { AttachmentKind } from './attachments.ts'
import type { ConditionTemplateDto } from './condition-templates.ts'
import type { AssessmentInput, AssessmentResult, Verdict } from '../statics/types.ts'

/**
 * Where one network owner's review of an application stands; plain words of our own.
 * `waiting` and `information_requested` are open; the others are answers.
 */
export const REVIEW_STATES = [
  'waiting',
  'accepted',
  'accepted_with_conditions',
  'information_requested',
  'objected',
  'not_affected',
] as const
export type ReviewState = (typeof REVIEW_STATES)[number]

/** States in which the owner still owes an answer. */
export const OPEN_REVIEW_STATES: readonly ReviewState[] = ['waiting', 'information_requested']

export const REVIEW_STATE_LABELS: Record<ReviewState, string> = {
  waiting: 'Waiting for the owner',
  accepted: 'Accepted',
  accepted_with_conditions: 'Accepted with conditions',
  information_requested: 'Question to the applicant',
  objected: 'Objected',
  not_affected: 'Not affected',
}

/** What an owner's engineer can decide. */
export const REVIEW_DECISION_KINDS = [
  'accepted',
  'accepted_with_conditions',
  'information_requested',
  'objected',
] as const
export type ReviewDecisionKind = (typeof REVIEW_DECISION_KINDS)[number]

/** Where a condition came from: the engine's proposal, the owner's library, or written anew. */
export const CONDITION_SOURCES = ['engine', 'library', 'own'] as const
export type ConditionSource = (typeof CONDITION_SOURCES)[number]

/** A condition as decided: the final text, and how it was made. */
export interface DecidedCondition {
  code: string
  text: string
  source: ConditionSource
  reason: string | null
  templateId: number | null
  /** Parameter values used to fill the library text, with units in their names. */
  parameters: Record<string, number | string> | null
}

/** The due-date view of a review, as of today. */
export interface ReviewClock {
  openedOn: string
  /** Null for not-affected records and while the clock is paused. */
  dueOn: string | null
  paused: boolean
  /** Working days left while paused. */
  remainingWorkingDays: number | null
  /** Working days from today to the due date (negative when overdue); null without a due date. */
  dueInWorkingDays: number | null
  overdue: boolean
}

export interface ReviewSummaryDto extends ReviewClock {
  id: number
  applicationId: number
  applicationReference: string
  applicationTitle: string
  applicationStatus: ApplicationStatus
  siteAddress: string | null
  startsOn: string | null
  endsOn: string | null
  applicantOrganisation: { id: number; name: string }
  owner: { id: number; name: string }
  state: ReviewState
  affectedSegmentCount: number
  worstVerdict: Verdict | null
  version: number
}

export interface ReviewDecisionDto {
  id: number
  decision: ReviewDecisionKind
  reasons: string | null
  conditions: DecidedCondition[]
  decidedBy: { id: number; name: string }
  decidedAt: string
  superseded: boolean
}

/** A document that went with an answer: enough to name it and fetch it by id. */
export interface MessageAttachmentDto {
  id: number
  applicationId: number
  kind: AttachmentKind
  filename: string
}

export interface ReviewMessageDto {
  id: number
  kind: 'question' | 'answer'
  body: string
  author: { id: number; name: string }
  /** The application's documents sent with this message (answers only). */
  attachments: MessageAttachmentDto[]
  createdAt: string
}

export interface SegmentRerunDto {
  id: number
  assessmentId: number
  verdict: Verdict
  note: string | null
  engineInput: AssessmentInput
  result: AssessmentResult
  createdBy: { id: number; name: string }
  createdAt: string
}

/** One affected segment of the owner's own network, with the full engine result. */
export interface ReviewSegmentDto {
  assessmentId: number
  segmentId: number
  ownerRef: string
  medium: string
  distance_m: number
  verdict: Verdict
  engineInput: AssessmentInput
  result: AssessmentResult
  geometry: { type: 'LineString'; coordinates: [number, number][] }
  reruns: SegmentRerunDto[]
  /**
   * Other live works on this segment at the same time: the plain statement and the engine input
   * and result of the worst combined period; null when none overlap in time and place.
   */
  combined: (CombinedStatement & { engineInput: AssessmentInput; result: AssessmentResult }) | null
}

/** A condition the engine proposed for one of the segments, ready to take over. */
export interface ProposedConditionDto {
  code: string
  text: string
  reason: string
  value_m: number | null
  assessmentIds: number[]
}

/** The works as GeoJSON (WGS84), one feature per activity. */
export interface ActivityFeatureCollection {
  type: 'FeatureCollection'
  features: {
    type: 'Feature'
    id: number
    properties: { position: number; kind: string; label: string | null }
    geometry: unknown
  }[]
}

/** Everything the owner's engineer needs to decide one review. */
export interface ReviewDetailDto {
  review: ReviewSummaryDto
  application: ApplicationDto
  activities: ActivityFeatureCollection
  segments: ReviewSegmentDto[]
  proposedConditions: ProposedConditionDto[]
  library: ConditionTemplateDto[]
  decisions: ReviewDecisionDto[]
  messages: ReviewMessageDto[]
  current: { reasons: string | null; conditions: DecidedCondition[] }
  caution: string
}

/** What the applicant sees of each owner's review. */
export interface ApplicantReviewDto {
  id: number
  owner: { id: number; name: string }
  state: ReviewState
  dueOn: string | null
  paused: boolean
  decidedAt: string | null
  reasons: string | null
  conditions: { code: string; text: string }[]
  messages: ReviewMessageDto[]
  /** True when the owner asked a question that is not answered yet. */
  awaitingAnswer: boolean
}
