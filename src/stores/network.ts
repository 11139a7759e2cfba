import { defineStore } from 'pinia'
import { ref } from 'vue'
import * as networkApi from '../api/network.ts'
import type { SegmentListParams } from '../api/network.ts'
import type { PipeSegmentEdit } from '../../shared/schemas/pipe-segment.ts'
import type { PipeSegmentDto, PipeSegmentSummaryDto } from '../../shared/types/network.ts'

/**
 * The owner's pipe network: the table page, the segment count, the open segment. The map loads
 * its own lines per view (NetworkMap.vue); `mapVersion` tells it to reload after a change.
 */
export const useNetworkStore = defineStore('network', () => {
  const rows = ref<PipeSegmentSummaryDto[]>([])
  const total = ref(0)
  const query = ref<SegmentListParams>({
    page: 1,
    pageSize: 25,
    sort: 'ownerRef',
    order: 'asc',
    medium: null,
    material: null,
    overCapacity: null,
    q: null,
  })
  const tableLoading = ref(false)
  const overCapacityCount = ref<number | null>(null)

  /** How many segments the owner has; null until loaded. */
  const segmentCount = ref<number | null>(null)
  /** Raised after an edit or import, so a shown map reloads its lines. */
  const mapVersion = ref(0)

  const selected = ref<PipeSegmentDto | null>(null)
  const selectedLoading = ref(false)

  const current = ref<PipeSegmentDto | null>(null)
  const currentLoading = ref(false)

  let tableRequest = 0

  async function loadSegments(next: Partial<SegmentListParams> = {}): Promise<void> {
    query.value = { ...query.value, ...next }
    const mine = ++tableRequest
    tableLoading.value = true
    try {
      const page = await networkApi.fetchSegments(query.value)
      if (mine !== tableRequest) return
      rows.value = page.items
      total.value = page.total
    } finally {
      if (mine === tableRequest) tableLoading.value = false
    }
  }

  async function loadOverCapacityCount(): Promise<void> {
    overCapacityCount.value = await networkApi.fetchOverCapacityCount()
  }

  async function loadSegmentCount(): Promise<void> {
    segmentCount.value = await networkApi.fetchSegmentCount()
  }

  async function selectSegment(id: number | null): Promise<void> {
    if (id === null) {
      selected.value = null
      return
    }
    selectedLoading.value = true
    try {
      selected.value = await networkApi.fetchSegment(id)
    } finally {
      selectedLoading.value = false
    }
  }

  async function loadSegment(id: number): Promise<void> {
    if (current.value?.id !== id) current.value = null
    currentLoading.value = true
    try {
      current.value = await networkApi.fetchSegment(id)
    } finally {
      currentLoading.value = false
    }
  }

  /** Saves an edit; a stale version rejects with CONFLICT and changes nothing here. */
  async function saveSegment(id: number, edit: PipeSegmentEdit): Promise<PipeSegmentDto> {
    const saved = await networkApi.updateSegment(id, edit)
    current.value = saved
    if (selected.value?.id === id) selected.value = saved
    mapVersion.value++
    overCapacityCount.value = null
    return saved
  }

  /** After an import: everything shown of the network is out of date. */
  function markChanged(): void {
    mapVersion.value++
    segmentCount.value = null
    overCapacityCount.value = null
    selected.value = null
  }

  return {
    rows,
    total,
    query,
    tableLoading,
    overCapacityCount,
    segmentCount,
    mapVersion,
    selected,
    selectedLoading,
    current,
    currentLoading,
    loadSegments,
    loadOverCapacityCount,
    loadSegmentCount,
    selectSegment,
    loadSegment,
    saveSegment,
    markChanged,
  }
})
