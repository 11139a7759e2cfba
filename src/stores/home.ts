import { defineStore } from 'pinia'
import { ref } from 'vue'
import { fetchHome, type AttentionItem } from '../api/home.ts'

/** The "what needs my attention today" counts for the signed-in user. */
export const useHomeStore = defineStore('home', () => {
  const items = ref<AttentionItem[]>([])
  const loading = ref(false)
  const loaded = ref(false)

  async function loadAttention(): Promise<void> {
    loading.value = true
    try {
      const home = await fetchHome()
      items.value = home.items
      loaded.value = true
    } finally {
      loading.value = false
    }
  }

  return { items, loading, loaded, loadAttention }
})
