import { defineStore } from 'pinia'
import { computed, reactive, ref, watch } from 'vue'
import { ErrorCode } from '../../shared/errors.ts'
import type { ApplicationDto, ApplicationStatus } from '../../shared/types/application.ts'
import {
  createApplication,
  fetchApplication,
  saveApplication,
  submitApplication,
} from '../api/applications.ts'
import { isApiError } from '../api/api-error.ts'
import { newActivityDraft, type ActivityDraft } from '../utils/activity-draft.ts'
import {
  countFieldErrors,
  emptyFieldErrors,
  mapApplicationFieldIssues,
  type ApplicationFieldErrors,
} from '../utils/application-errors.ts'
import {
  activityDraftsFromDto,
  buildDraftPayload,
  checkForSubmit,
  emptyWorksFields,
  mergeFieldErrors,
  visibleErrors,
  worksFieldsFromDto,
  type WorksFields,
} from '../utils/application-form.ts'
import type { ActivityKind } from '../../shared/schemas/application.ts'

/**
 * The application being written. Saves as the applicant goes: the draft is created on the
 * first save, then every change is saved a moment after typing stops, with the version it
 * was based on; a save that finds a newer version stops and asks the applicant to reload.
 */
export type SaveState =
  | 'new' // nothing saved yet
  | 'unsaved' // changes waiting for the next save
  | 'saving'
  | 'saved'
  | 'blocked' // the form has a problem that stops the save (e.g. no title yet)
  | 'conflict' // someone saved a newer version
  | 'failed' // the save did not reach the server or was refused

export const AUTO_SAVE_DELAY_ms = 1500

export const useApplicationDraftStore = defineStore('application-draft', () => {
  const id = ref<number | null>(null)
  const version = ref(0)
  const reference = ref<string | null>(null)
  const status = ref<ApplicationStatus>('draft')
  const works = reactive<WorksFields>(emptyWorksFields())
  const activities = ref<ActivityDraft[]>([])
  const saveState = ref<SaveState>('new')
  const saveMessage = ref<string | null>(null)
  const savedAt = ref<Date | null>(null)
  const unsavedKeys = ref<string[]>([])
  const loading = ref(false)
  const submitting = ref(false)
  /** After a submit attempt every empty required field is marked too. */
  const showAllErrors = ref(false)
  const serverErrors = ref<ApplicationFieldErrors>(emptyFieldErrors())

  let timer: ReturnType<typeof setTimeout> | null = null
  let inFlight: Promise<boolean> | null = null
  let again = false
  let quiet = false

  const localErrors = computed(() =>
    visibleErrors(
      checkForSubmit(works, activities.value),
      works,
      activities.value,
      showAllErrors.value,
    ),
  )
  const errors = computed(() => mergeFieldErrors(localErrors.value, serverErrors.value))
  const errorCount = computed(() => countFieldErrors(errors.value))

  function replaceWith(dto: ApplicationDto | null): void {
    quiet = true
    cancelTimer()
    id.value = dto?.id ?? null
    version.value = dto?.version ?? 0
    reference.value = dto?.reference ?? null
    status.value = dto?.status ?? 'draft'
    Object.assign(works, dto ? worksFieldsFromDto(dto) : emptyWorksFields())
    activities.value = dto ? activityDraftsFromDto(dto) : []
    saveState.value = dto ? 'saved' : 'new'
    saveMessage.value = null
    savedAt.value = dto ? new Date(dto.updatedAt) : null
    unsavedKeys.value = []
    showAllErrors.value = false
    serverErrors.value = emptyFieldErrors()
    // Let the deep watchers see the new values before changes count again.
    void Promise.resolve().then(() => {
      quiet = false
    })
  }

  function startNew(): void {
    replaceWith(null)
  }

  async function load(applicationId: number): Promise<ApplicationDto> {
    loading.value = true
    try {
      const dto = await fetchApplication(applicationId)
      replaceWith(dto)
      return dto
    } finally {
      loading.value = false
    }
  }

  function cancelTimer(): void {
    if (timer) clearTimeout(timer)
    timer = null
  }

  function changed(): void {
    if (quiet) return
    serverErrors.value = emptyFieldErrors()
    if (saveState.value === 'conflict') return
    saveState.value = 'unsaved'
    cancelTimer()
    timer = setTimeout(() => void save(), AUTO_SAVE_DELAY_ms)
  }

  watch(works, changed, { deep: true })
  watch(activities, changed, { deep: true })

  /** Saves now (creating the draft on the first save). Resolves false when it could not. */
  async function save(): Promise<boolean> {
    cancelTimer()
    if (saveState.value === 'conflict') return false
    if (inFlight) {
      again = true
      return inFlight
    }
    inFlight = runSave().finally(() => {
      inFlight = null
    })
    const ok = await inFlight
    if (again) {
      again = false
      return save()
    }
    return ok
  }

  async function runSave(): Promise<boolean> {
    const build = buildDraftPayload(works, activities.value)
    if (!build.ok) {
      saveState.value = 'blocked'
      saveMessage.value =
        build.errors.form.title !== undefined
          ? 'Give the works a title (at least 3 characters) to save the draft.'
          : 'Correct the marked fields to save the draft.'
      serverErrors.value = build.errors
      return false
    }
    const { body, sentKeys } = build.payload
    saveState.value = 'saving'
    try {
      const dto =
        id.value === null
          ? await createApplication(body)
          : await saveApplication(id.value, { ...body, version: version.value })
      id.value = dto.id
      version.value = dto.version
      reference.value = dto.reference
      status.value = dto.status
      savedAt.value = new Date()
      unsavedKeys.value = build.payload.unsavedKeys
      if (saveState.value === 'saving') saveState.value = 'saved'
      saveMessage.value = null
      return true
    } catch (err) {
      if (isApiError(err) && err.code === ErrorCode.CONFLICT) {
        saveState.value = 'conflict'
        saveMessage.value =
          'Someone saved this application while you were editing it, so your latest changes were not saved.'
        return false
      }
      if (isApiError(err) && err.isValidation) {
        serverErrors.value = mapApplicationFieldIssues(err.fields, sentKeys)
      }
      saveState.value = 'failed'
      saveMessage.value = isApiError(err) ? err.message : 'The draft could not be saved.'
      throw err
    }
  }

  /**
   * Checks the whole form, saves it and submits it. Resolves with the submitted application,
   * or null when the form has problems (they are then shown at their fields).
   */
  async function submit(): Promise<ApplicationDto | null> {
    showAllErrors.value = true
    const problems = checkForSubmit(works, activities.value)
    if (countFieldErrors(problems) > 0) return null
    submitting.value = true
    try {
      if (saveState.value !== 'saved' || id.value === null) {
        const ok = await save()
        if (!ok || id.value === null) return null
      }
      const sentKeys = activities.value.map((a) => a.key)
      try {
        const dto = await submitApplication(id.value, version.value)
        status.value = dto.status
        version.value = dto.version
        return dto
      } catch (err) {
        if (isApiError(err) && err.isValidation && err.fields.length > 0) {
          serverErrors.value = mapApplicationFieldIssues(err.fields, sentKeys)
          return null
        }
        if (isApiError(err) && err.code === ErrorCode.CONFLICT) {
          saveState.value = 'conflict'
          saveMessage.value =
            'Someone saved this application meanwhile. Reload it before you submit.'
          return null
        }
        throw err
      }
    } finally {
      submitting.value = false
    }
  }

  function addActivity(kind: ActivityKind): ActivityDraft {
    const draft = newActivityDraft(kind)
    activities.value.push(draft)
    return draft
  }

  function removeActivity(key: string): void {
    activities.value = activities.value.filter((a) => a.key !== key)
  }

  /** Drops local changes and loads the newest saved version (after a conflict). */
  async function reload(): Promise<void> {
    if (id.value === null) return startNew()
    await load(id.value)
  }

  return {
    id,
    version,
    reference,
    status,
    works,
    activities,
    saveState,
    saveMessage,
    savedAt,
    unsavedKeys,
    loading,
    submitting,
    showAllErrors,
    errors,
    errorCount,
    startNew,
    load,
    save,
    submit,
    addActivity,
    removeActivity,
    reload,
  }
})
