import { defineStore } from 'pinia'
import { ref } from 'vue'
import type {
  ExtendPermitInput,
  GrantPermitInput,
  RevokePermitInput,
  VaryPermitInput,
} from '../../shared/schemas/permits.ts'
import type { DecisionDraftDto, OfficeQueueItem } from '../../shared/types/permits.ts'
import {
  fetchDecisionDraft,
  fetchOfficeApplication,
  fetchOfficeQueue,
  grantPermit,
  refuseApplication,
  type OfficeApplicationDto,
  type OfficeQueueStatus,
} from '../api/permit-office.ts'
import { extendPermit, revokePermit, varyPermit } from '../api/permits.ts'

/** The permit officer's queue and the application being decided. */
export const usePermitOfficeStore = defineStore('permit-office', () => {
  const queue = ref<OfficeQueueItem[]>([])
  const queueStatus = ref<OfficeQueueStatus>('open')
  const loadingQueue = ref(false)
  const detail = ref<OfficeApplicationDto | null>(null)
  const draft = ref<DecisionDraftDto | null>(null)
  const loadingDetail = ref(false)
  const busy = ref(false)

  async function loadQueue(status: OfficeQueueStatus = queueStatus.value): Promise<void> {
    queueStatus.value = status
    loadingQueue.value = true
    try {
      queue.value = (await fetchOfficeQueue(status)).items
    } finally {
      loadingQueue.value = false
    }
  }

  async function loadDetail(id: number): Promise<void> {
    if (detail.value?.application.id !== id) {
      detail.value = null
      draft.value = null
    }
    loadingDetail.value = true
    try {
      const [d, dr] = await Promise.all([fetchOfficeApplication(id), fetchDecisionDraft(id)])
      detail.value = d
      draft.value = dr
    } finally {
      loadingDetail.value = false
    }
  }

  async function run(action: () => Promise<unknown>): Promise<void> {
    const id = detail.value?.application.id
    if (id === undefined) return
    busy.value = true
    try {
      await action()
      await loadDetail(id)
    } finally {
      busy.value = false
    }
  }

  const currentId = () => detail.value?.application.id ?? 0

  return {
    queue,
    queueStatus,
    loadingQueue,
    detail,
    draft,
    loadingDetail,
    busy,
    loadQueue,
    loadDetail,
    grant: (input: GrantPermitInput) => run(() => grantPermit(currentId(), input)),
    refuse: (reasons: string) =>
      run(() => refuseApplication(currentId(), { version: draft.value?.version ?? 0, reasons })),
    extend: (permitId: number, input: ExtendPermitInput) =>
      run(() => extendPermit(permitId, input)),
    vary: (permitId: number, input: VaryPermitInput) => run(() => varyPermit(permitId, input)),
    revoke: (permitId: number, input: RevokePermitInput) =>
      run(() => revokePermit(permitId, input)),
  }
})
