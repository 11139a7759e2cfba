import { defineStore } from 'pinia'
import { ref } from 'vue'
import type { ReviewDecisionInput, SegmentRerunInput } from '../../shared/schemas/reviews.ts'
import type { ReviewDetailDto, ReviewSummaryDto } from '../../shared/types/reviews.ts'
import {
  decideReview,
  fetchReview,
  fetchReviews,
  rerunSegment,
  type ReviewQueueState,
} from '../api/reviews.ts'

/** The owner engineer's review queue and the one review being decided. */
export const useReviewsStore = defineStore('reviews', () => {
  const queue = ref<ReviewSummaryDto[]>([])
  const queueState = ref<ReviewQueueState>('open')
  const loadingQueue = ref(false)
  const detail = ref<ReviewDetailDto | null>(null)
  const loadingDetail = ref(false)
  const deciding = ref(false)
  const rerunning = ref(false)

  async function loadQueue(state: ReviewQueueState = queueState.value): Promise<void> {
    queueState.value = state
    loadingQueue.value = true
    try {
      queue.value = (await fetchReviews(state)).items
    } finally {
      loadingQueue.value = false
    }
  }

  async function loadDetail(id: number): Promise<void> {
    if (detail.value?.review.id !== id) detail.value = null
    loadingDetail.value = true
    try {
      detail.value = await fetchReview(id)
    } finally {
      loadingDetail.value = false
    }
  }

  /** Rethrows 409 CONFLICT so the page can offer a reload. */
  async function decide(decision: ReviewDecisionInput): Promise<void> {
    const current = detail.value
    if (!current) return
    deciding.value = true
    try {
      detail.value = await decideReview(current.review.id, decision)
    } finally {
      deciding.value = false
    }
  }

  async function rerun(assessmentId: number, input: SegmentRerunInput): Promise<void> {
    const current = detail.value
    if (!current) return
    rerunning.value = true
    try {
      const run = await rerunSegment(current.review.id, assessmentId, input)
      const segment = current.segments.find((s) => s.assessmentId === assessmentId)
      if (segment) segment.reruns = [run, ...segment.reruns.filter((r) => r.id !== run.id)]
    } finally {
      rerunning.value = false
    }
  }

  return {
    queue,
    queueState,
    loadingQueue,
    detail,
    loadingDetail,
    deciding,
    rerunning,
    loadQueue,
    loadDetail,
    decide,
    rerun,
  }
})
