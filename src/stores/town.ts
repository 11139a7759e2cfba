import { defineStore } from 'pinia'
import { ref } from 'vue'
import {
  fetchMapSettings,
  fetchStreets,
  type MapSettings,
  type StreetCollection,
} from '../api/map.ts'

/** The demo town's base data every map shows: streets and the initial view. Loaded once. */
export const useTownStore = defineStore('town', () => {
  const streets = ref<StreetCollection | null>(null)
  const settings = ref<MapSettings | null>(null)
  let pending: Promise<void> | null = null

  function loadTown(): Promise<void> {
    if (streets.value && settings.value) return Promise.resolve()
    pending ??= Promise.all([fetchStreets(), fetchMapSettings()])
      .then(([loadedStreets, loadedSettings]) => {
        streets.value = loadedStreets
        settings.value = loadedSettings
      })
      .finally(() => {
        pending = null
      })
    return pending
  }

  return { streets, settings, loadTown }
})
