import { defineStore } from 'pinia'
import { ref } from 'vue'
import { fetchOutline, type LonLatBox } from '../api/outline.ts'
import type { OutlineFeature } from '../../shared/types/network.ts'

/**
 * The public pipe outline around what the applicant is looking at, for the live preview.
 * A newer box cancels the request for an older one.
 */
export const useOutlineStore = defineStore('outline', () => {
  const features = ref<OutlineFeature[]>([])
  const truncated = ref(false)
  const loading = ref(false)
  const error = ref<unknown>(null)
  let controller: AbortController | null = null

  async function loadBox(bbox: LonLatBox): Promise<void> {
    controller?.abort()
    const mine = new AbortController()
    controller = mine
    loading.value = true
    try {
      const result = await fetchOutline(bbox, mine.signal)
      features.value = result.features
      truncated.value = result.truncated
      error.value = null
    } catch (err) {
      if (err instanceof DOMException && err.name === 'AbortError') return
      error.value = err
      throw err
    } finally {
      if (controller === mine) loading.value = false
    }
  }

  return { features, truncated, loading, error, loadBox }
})
