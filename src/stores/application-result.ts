import { defineStore } from 'pinia'
import { ref } from 'vue'
import { fetchApplication, fetchScreening, withdrawApplication } from '../api/applications.ts'
import type { ApplicationDto } from '../../shared/types/application.ts'
import type { ApplicationScreeningDto } from '../../shared/types/screening.ts'

/** One application as submitted, with the screening result per owner. */
export const useApplicationResultStore = defineStore('application-result', () => {
  const application = ref<ApplicationDto | null>(null)
  const screening = ref<ApplicationScreeningDto | null>(null)
  const loading = ref(false)
  const withdrawing = ref(false)

  async function load(id: number): Promise<void> {
    loading.value = true
    if (application.value?.id !== id) {
      application.value = null
      screening.value = null
    }
    try {
      const dto = await fetchApplication(id)
      application.value = dto
      screening.value = dto.status === 'draft' ? null : await fetchScreening(id)
    } finally {
      loading.value = false
    }
  }

  async function withdraw(reason: string): Promise<void> {
    const current = application.value
    if (!current) return
    withdrawing.value = true
    try {
      application.value = await withdrawApplication(current.id, reason.trim() || undefined)
    } finally {
      withdrawing.value = false
    }
  }

  return { application, screening, loading, withdrawing, load, withdraw }
})
