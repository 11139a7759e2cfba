import type { ApplicationStatus } from './application.ts'
import type { ReviewState } from './reviews.ts'

/** Status kept on a permit issue; `expired` is also derived from valid_to when read. */
export const STORED_PERMIT_STATUSES = ['valid', 'revoked', 'expired', 'superseded'] as const
export type StoredPermitStatus = (typeof STORED_PERMIT_STATUSES)[number]
export type PermitStatus = StoredPermitStatus

export const PERMIT_CHANGE_KINDS = ['granted', 'extended', 'varied'] as const
export type PermitChangeKind = (typeof PERMIT_CHANGE_KINDS)[number]

/** A condition on the permit, with who set it. */
export interface PermitCondition {
  code: string
  text: string
  /** The owner whose review asked for it; null for the permit office's own. */
  ownerOrganisationId: number | null
  ownerName: string | null
}

export interface PermitDto {
  id: number
  number: string
  issue: number
  applicationId: number
  applicationReference: string
  status: PermitStatus
  changeKind: PermitChangeKind
  changeReason: string | null
  validFrom: string
  validTo: string
  conditions: PermitCondition[]
  /** Short code for the public check, grouped for reading (XXXX-XXXX-XX). */
  verificationCode: string
  verificationUrl: string
  pdfSha256: string | null
  documentUrl: string
  issuedBy: { id: number; name: string }
  issuedAt: string
  revokedAt: string | null
  revokedReason: string | null
}

/** One line of the permit office's queue. */
export interface OfficeQueueItem {
  applicationId: number
  reference: string
  title: string
  status: ApplicationStatus
  siteAddress: string | null
  startsOn: string | null
  endsOn: string | null
  submittedAt: string | null
  applicantOrganisation: { id: number; name: string }
  reviews: {
    id: number
    owner: { id: number; name: string }
    state: ReviewState
    dueOn: string | null
    paused: boolean
    dueInWorkingDays: number | null
    overdue: boolean
  }[]
  openReviewCount: number
  overdueReviewCount: number
  /** Earliest due date of an open review (null when none is open). */
  nextDueOn: string | null
  readyForDecision: boolean
}

/** The starting point of a grant: merged conditions and proposed validity. */
export interface DecisionDraftDto {
  applicationId: number
  version: number
  status: ApplicationStatus
  validFrom: string | null
  validTo: string | null
  conditions: PermitCondition[]
  objections: { owner: { id: number; name: string }; reasons: string | null }[]
  openReviews: number
}
