import { defineStore } from 'pinia'
import { ref } from 'vue'
import {
  fetchApplication,
  fetchApplications,
  type ApplicationListQuery,
} from '../api/applications.ts'
import type { ApplicationDto, ApplicationListItem } from '../../shared/types/application.ts'

/** "My applications": one page of the list (paged, filtered on the server) and their works. */
export const useApplicationsStore = defineStore('applications', () => {
  const items = ref<ApplicationListItem[]>([])
  const total = ref(0)
  const loading = ref(false)
  const query = ref<ApplicationListQuery>({ page: 1, pageSize: 10, status: null, q: '' })
  /** Full records of the listed applications, for the map of their activities. */
  const details = ref<ApplicationDto[]>([])
  let requestNo = 0

  async function loadPage(next: ApplicationListQuery): Promise<void> {
    const mine = ++requestNo
    loading.value = true
    try {
      const result = await fetchApplications(next)
      if (mine !== requestNo) return
      items.value = result.items
      total.value = result.total
      query.value = { ...next }
      // The list carries no geometry; the page's few records are fetched for the map.
      const full = await Promise.all(result.items.map((item) => fetchApplication(item.id)))
      if (mine === requestNo) details.value = full
    } finally {
      if (mine === requestNo) loading.value = false
    }
  }

  return { items, total, loading, query, details, loadPage }
})
