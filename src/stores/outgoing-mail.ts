import { defineStore } from 'pinia'
import { ref } from 'vue'
import { isApiError } from '../api/api-error.ts'
import { fetchOutgoingMail, type CaughtMailDto } from '../api/outgoing-mail.ts'

/** Mail caught by the development mail catcher, newest first. */
export const useOutgoingMailStore = defineStore('outgoing-mail', () => {
  const items = ref<CaughtMailDto[]>([])
  const loading = ref(false)
  /** False when the server has no mail catcher (production): it answers 404. */
  const available = ref(true)

  async function loadMail(): Promise<void> {
    loading.value = true
    try {
      const mail = await fetchOutgoingMail()
      items.value = [...mail].sort((a, b) => b.receivedAt.localeCompare(a.receivedAt))
      available.value = true
    } catch (err) {
      if (isApiError(err) && err.status === 404) {
        available.value = false
        items.value = []
        return
      }
      throw err
    } finally {
      loading.value = false
    }
  }

  return { items, loading, available, loadMail }
})
