import type {
  ReviewAnswerInput,
  ReviewDecisionInput,
  SegmentRerunInput,
} from '../../shared/schemas/reviews.ts'
import type {
  ApplicantReviewDto,
  ReviewDetailDto,
  ReviewSummaryDto,
  SegmentRerunDto,
} from '../../shared/types/reviews.ts'
import { http } from './http.ts'

export type ReviewQueueState = 'open' | 'answered' | 'all'

export interface ReviewQueuePage {
  items: ReviewSummaryDto[]
  total: number
}

/** The engineer's reviews, earliest due first. */
export function fetchReviews(state: ReviewQueueState, pageSize = 200): Promise<ReviewQueuePage> {
  return http.get<ReviewQueuePage>('/reviews', { state, page: 1, pageSize })
}

export function fetchReview(id: number): Promise<ReviewDetailDto> {
  return http.get<ReviewDetailDto>(`/reviews/${id}`)
}

/** 409 CONFLICT when another engineer decided since `version` was loaded. */
export function decideReview(id: number, decision: ReviewDecisionInput): Promise<ReviewDetailDto> {
  return http.post<ReviewDetailDto>(`/reviews/${id}/decision`, decision)
}

export function rerunSegment(
  reviewId: number,
  assessmentId: number,
  input: SegmentRerunInput,
): Promise<SegmentRerunDto> {
  return http.post<SegmentRerunDto>(`/reviews/${reviewId}/segments/${assessmentId}/rerun`, input)
}

/** Each owner's review of an application, as the applicant (or the officer) sees it. */
export function fetchApplicantReviews(applicationId: number): Promise<ApplicantReviewDto[]> {
  return http.get<ApplicantReviewDto[]>(`/applications/${applicationId}/reviews`)
}

export function answerReview(
  applicationId: number,
  reviewId: number,
  answer: ReviewAnswerInput,
): Promise<ApplicantReviewDto[]> {
  return http.post<ApplicantReviewDto[]>(
    `/applications/${applicationId}/reviews/${reviewId}/answer`,
    answer,
  )
}
