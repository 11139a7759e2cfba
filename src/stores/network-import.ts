import { defineStore } from 'pinia'
import { computed, ref } from 'vue'
import * as networkApi from '../api/network.ts'
import type { ImportMapping } from '../../shared/schemas/import-mapping.ts'
import type {
  ImportPreviewDto,
  ImportReportPage,
  NetworkImportDto,
} from '../../shared/types/network.ts'
import { useNetworkStore } from './network.ts'

/** Where the user is in an import. */
export type ImportStep = 'choose' | 'mapping' | 'report' | 'done'

const POLL_MS = 400
const RUNNING = new Set(['validating', 'committing'])

const wait = (ms: number) => new Promise((resolve) => setTimeout(resolve, ms))

/** One import at a time: upload, mapping, validation report, commit, result. */
export const useNetworkImportStore = defineStore('network-import', () => {
  const step = ref<ImportStep>('choose')
  const job = ref<NetworkImportDto | null>(null)
  const preview = ref<ImportPreviewDto | null>(null)
  const report = ref<ImportReportPage | null>(null)
  const uploadFraction = ref<number | null>(null)
  const busy = ref(false)
  let abortUpload: (() => void) | null = null
  let pollToken = 0

  const running = computed(() => job.value !== null && RUNNING.has(job.value.status))
  /** Features processed so far, 0 to 1, for the validate and commit progress bars. */
  const passFraction = computed(() => {
    const j = job.value
    if (!j) return 0
    if (!RUNNING.has(j.status)) return 1
    // While validating the total is not known yet; the last count (if any) stands in.
    const total = j.featuresTotal || 0
    return total > 0 ? Math.min(1, j.featuresProcessed / total) : 0
  })

  function reset(): void {
    abortUpload?.()
    abortUpload = null
    pollToken++
    step.value = 'choose'
    job.value = null
    preview.value = null
    report.value = null
    uploadFraction.value = null
    busy.value = false
  }

  async function upload(file: File): Promise<void> {
    reset()
    busy.value = true
    uploadFraction.value = 0
    const handle = networkApi.uploadImportFile(file, (f) => (uploadFraction.value = f))
    abortUpload = handle.abort
    try {
      job.value = await handle.promise
      preview.value = await networkApi.fetchImportPreview(job.value.id)
      step.value = 'mapping'
    } finally {
      abortUpload = null
      busy.value = false
      uploadFraction.value = null
    }
  }

  function cancelUpload(): void {
    abortUpload?.()
  }

  async function saveMapping(mapping: ImportMapping): Promise<ImportMapping> {
    const saved = await networkApi.saveImportMapping(mapping)
    if (preview.value) preview.value = { ...preview.value, mapping: saved }
    return saved
  }

  /** Polls the job until its pass has finished; stops when the user starts over. */
  async function followJob(id: number): Promise<void> {
    const mine = ++pollToken
    for (;;) {
      await wait(POLL_MS)
      if (mine !== pollToken) return
      const next = await networkApi.fetchImport(id)
      if (mine !== pollToken) return
      job.value = next
      if (!RUNNING.has(next.status)) return
    }
  }

  async function loadReport(page = 1, pageSize = 20): Promise<void> {
    if (!job.value) return
    report.value = await networkApi.fetchImportReport(job.value.id, page, pageSize)
  }

  /** Saves the mapping, then validates every feature with it and loads the report. */
  async function validate(mapping: ImportMapping): Promise<void> {
    if (!job.value) return
    busy.value = true
    try {
      await saveMapping(mapping)
      job.value = await networkApi.startImportValidation(job.value.id)
      step.value = 'report'
      report.value = null
      if (RUNNING.has(job.value.status)) await followJob(job.value.id)
      await loadReport()
    } finally {
      busy.value = false
    }
  }

  async function commit(skipInvalid: boolean): Promise<void> {
    if (!job.value) return
    busy.value = true
    try {
      job.value = await networkApi.startImportCommit(job.value.id, skipInvalid)
      if (RUNNING.has(job.value.status)) await followJob(job.value.id)
      if (job.value.status === 'committed') useNetworkStore().markChanged()
      step.value = 'done'
    } finally {
      busy.value = false
    }
  }

  /** Back to the mapping step of the same file, e.g. after a report full of unmapped fields. */
  async function backToMapping(): Promise<void> {
    if (!job.value) return
    preview.value = await networkApi.fetchImportPreview(job.value.id)
    report.value = null
    step.value = 'mapping'
  }

  return {
    step,
    job,
    preview,
    report,
    uploadFraction,
    busy,
    running,
    passFraction,
    reset,
    upload,
    cancelUpload,
    saveMapping,
    validate,
    loadReport,
    commit,
    backToMapping,
  }
})
