import { defineStore } from 'pinia'
import { ref } from 'vue'
import type { HistoryEntryDto } from '../../shared/types/history.ts'
import type { ApplicantReviewDto } from '../../shared/types/reviews.ts'
import { fetchApplicationHistory } from '../api/history.ts'
import { fetchApplicationPermits, type ApplicationPermits } from '../api/permits.ts'
import { answerReview, fetchApplicantReviews } from '../api/reviews.ts'

/** Owners' answers, permits and history of one application, for the application page. */
export const useApplicationReviewsStore = defineStore('application-reviews', () => {
  const applicationId = ref<number | null>(null)
  const reviews = ref<ApplicantReviewDto[]>([])
  const permits = ref<ApplicationPermits>({ permits: [], refusal: null })
  const history = ref<HistoryEntryDto[]>([])
  const answering = ref(false)

  async function load(id: number): Promise<void> {
    if (applicationId.value !== id) {
      reviews.value = []
      permits.value = { permits: [], refusal: null }
      history.value = []
    }
    applicationId.value = id
    const [r, p, h] = await Promise.all([
      fetchApplicantReviews(id),
      fetchApplicationPermits(id),
      fetchApplicationHistory(id),
    ])
    reviews.value = r
    permits.value = p
    history.value = h
  }

  async function answer(reviewId: number, body: string, attachmentIds: number[]): Promise<void> {
    const id = applicationId.value
    if (id === null) return
    answering.value = true
    try {
      reviews.value = await answerReview(id, reviewId, { body, attachmentIds })
      history.value = await fetchApplicationHistory(id)
    } finally {
      answering.value = false
    }
  }

  return { applicationId, reviews, permits, history, answering, load, answer }
})
