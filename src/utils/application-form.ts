import { format } from 'date-fns'
import {
  applicationDraftSchema,
  submitApplicationSchema,
  type ActivityInput,
  type ApplicationDraftInput,
} from '../../shared/schemas/application.ts'
import type { ApplicationDto } from '../../shared/types/application.ts'
import {
  activityCandidate,
  activityDraftFromDto,
  toActivityInput,
  type ActivityDraft,
} from './activity-draft.ts'
import { mapApplicationFieldIssues, type ApplicationFieldErrors } from './application-errors.ts'

/** The works part of the form: every field a plain string while the applicant types. */
export interface WorksFields {
  title: string
  siteAddress: string
  contactName: string
  contactPhone: string
  startsOn: string
  endsOn: string
  description: string
}

export function emptyWorksFields(): WorksFields {
  return {
    title: '',
    siteAddress: '',
    contactName: '',
    contactPhone: '',
    startsOn: '',
    endsOn: '',
    description: '',
  }
}

export function worksFieldsFromDto(dto: ApplicationDto): WorksFields {
  return {
    title: dto.title,
    siteAddress: dto.siteAddress ?? '',
    contactName: dto.contactName ?? '',
    contactPhone: dto.contactPhone ?? '',
    startsOn: dto.startsOn ?? '',
    endsOn: dto.endsOn ?? '',
    description: dto.description ?? '',
  }
}

export function activityDraftsFromDto(dto: ApplicationDto): ActivityDraft[] {
  return dto.activities.map((a) => activityDraftFromDto(a))
}

const optional = (value: string) => (value.trim() === '' ? undefined : value.trim())

/** What a save sends and which form activity each sent activity is. */
export interface DraftPayload {
  body: ApplicationDraftInput
  /** `sentKeys[n]` is the form key of `body.activities[n]`. */
  sentKeys: string[]
  /** Activities left out of the save because they are not complete yet. */
  unsavedKeys: string[]
}

export type DraftBuild =
  { ok: true; payload: DraftPayload } | { ok: false; errors: ApplicationFieldErrors }

/**
 * The draft as the server stores it. A draft may be incomplete, but each activity it carries
 * must be whole: unfinished activities stay in the form and are saved once they are complete.
 */
export function buildDraftPayload(
  works: WorksFields,
  drafts: readonly ActivityDraft[],
): DraftBuild {
  const activities: ActivityInput[] = []
  const sentKeys: string[] = []
  const unsavedKeys: string[] = []
  for (const draft of drafts) {
    const check = toActivityInput(draft)
    if (check.ok) {
      activities.push(check.input)
      sentKeys.push(draft.key)
    } else unsavedKeys.push(draft.key)
  }
  const candidate = {
    title: works.title.trim(),
    siteAddress: optional(works.siteAddress),
    contactName: optional(works.contactName),
    contactPhone: optional(works.contactPhone),
    startsOn: optional(works.startsOn),
    endsOn: optional(works.endsOn),
    description: optional(works.description),
    activities,
  }
  const parsed = applicationDraftSchema.safeParse(candidate)
  if (!parsed.success) {
    return { ok: false, errors: mapApplicationFieldIssues(zodIssues(parsed.error), sentKeys) }
  }
  return { ok: true, payload: { body: parsed.data, sentKeys, unsavedKeys } }
}

function zodIssues(error: { issues: { path: PropertyKey[]; message: string }[] }) {
  return error.issues.map((issue) => ({
    field: issue.path.map(String).join('.') || '_',
    message: issue.message,
  }))
}

/** Today as the form's date strings, e.g. 2027-03-15. */
export function todayIso(now: Date = new Date()): string {
  return format(now, 'yyyy-MM-dd')
}

/**
 * Everything the submit needs, checked with the shared submit schema over every activity in
 * the form (complete or not), plus the date rules: the end after the start, nothing in the past.
 */
export function checkForSubmit(
  works: WorksFields,
  drafts: readonly ActivityDraft[],
  now: Date = new Date(),
): ApplicationFieldErrors {
  const candidate = {
    title: works.title.trim(),
    siteAddress: works.siteAddress.trim(),
    contactName: works.contactName.trim(),
    contactPhone: works.contactPhone.trim(),
    startsOn: works.startsOn,
    endsOn: works.endsOn,
    description: works.description.trim(),
    activities: drafts.map((d) => activityCandidate(d)),
  }
  const keys = drafts.map((d) => d.key)
  const parsed = submitApplicationSchema.safeParse(candidate)
  const errors = parsed.success
    ? mapApplicationFieldIssues([], keys)
    : mapApplicationFieldIssues(zodIssues(parsed.error), keys)
  const dateProblems = checkDates(works, now)
  for (const [field, message] of Object.entries(dateProblems)) errors.form[field] ??= message
  return errors
}

/** Date rules shown while typing: end not before start; on submit also start not in the past. */
export function checkDates(works: WorksFields, now: Date = new Date()): Record<string, string> {
  const problems: Record<string, string> = {}
  const iso = /^\d{4}-\d{2}-\d{2}$/
  if (iso.test(works.startsOn) && works.startsOn < todayIso(now)) {
    problems.startsOn = 'The start date is in the past'
  }
  if (iso.test(works.startsOn) && iso.test(works.endsOn) && works.endsOn < works.startsOn) {
    problems.endsOn = 'The end date is before the start date'
  }
  return problems
}

/**
 * The problems to show now. Until the applicant tries to submit, only fields they have filled
 * in are marked (a half-typed form is not a list of faults); after a submit attempt, all of them.
 */
export function visibleErrors(
  errors: ApplicationFieldErrors,
  works: WorksFields,
  drafts: readonly ActivityDraft[],
  showAll: boolean,
): ApplicationFieldErrors {
  if (showAll) return errors
  const form: Record<string, string> = {}
  for (const [field, message] of Object.entries(errors.form)) {
    const value = (works as unknown as Record<string, string | undefined>)[field]
    if (typeof value === 'string' && value.trim() !== '') form[field] = message
  }
  const activities: ApplicationFieldErrors['activities'] = {}
  for (const draft of drafts) {
    const own = errors.activities[draft.key]
    if (!own) continue
    const candidate = activityCandidate(draft)
    const shown: Record<string, string> = {}
    for (const [field, message] of Object.entries(own)) {
      if (candidate[field] !== undefined) shown[field] = message
    }
    if (Object.keys(shown).length > 0) activities[draft.key] = shown
  }
  return { form, activities }
}

/** Server errors over local ones, field by field. */
export function mergeFieldErrors(
  local: ApplicationFieldErrors,
  server: ApplicationFieldErrors,
): ApplicationFieldErrors {
  const activities: ApplicationFieldErrors['activities'] = { ...local.activities }
  for (const [key, own] of Object.entries(server.activities)) {
    activities[key] = { ...(activities[key] ?? {}), ...own }
  }
  return { form: { ...local.form, ...server.form }, activities }
}
