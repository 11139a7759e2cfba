import { defineStore } from 'pinia'
import { ref } from 'vue'
import { fetchAuditEvents, type AuditEventDto } from '../api/audit.ts'

/** One page of the audit trail at a time; the server pages it. */
export const useAuditStore = defineStore('audit', () => {
  const items = ref<AuditEventDto[]>([])
  const total = ref(0)
  const page = ref(1)
  const pageSize = ref(50)
  const loading = ref(false)

  async function loadPage(nextPage: number, nextPageSize: number): Promise<void> {
    loading.value = true
    try {
      const result = await fetchAuditEvents(nextPage, nextPageSize)
      items.value = result.items
      total.value = result.total
      page.value = nextPage
      pageSize.value = nextPageSize
    } finally {
      loading.value = false
    }
  }

  return { items, total, page, pageSize, loading, loadPage }
})
