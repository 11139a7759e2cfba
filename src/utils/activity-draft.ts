import type { MultiPoint, Point, Polygon } from 'geojson'
import {
  activityInputSchema,
  type ActivityInput,
  type ActivityKind,
  type CRANE_SETUPS,
  type DIGGING_METHODS,
  type EXCAVATION_SUPPORTS,
} from '../../shared/schemas/application.ts'
import type { ActivityDto } from '../../shared/types/application.ts'
import { fieldErrorsFromZod, type FieldErrors } from './field-errors.ts'

/**
 * One activity as the form holds it while the applicant is still drawing and typing: every
 * field may be empty. `toActivityInput` turns it into what the shared schema accepts.
 */
export type ExcavationSupport = (typeof EXCAVATION_SUPPORTS)[number]
export type DiggingMethod = (typeof DIGGING_METHODS)[number]
export type CraneSetup = (typeof CRANE_SETUPS)[number]
export type ActivityGeometry = Polygon | Point | MultiPoint

export interface ActivityDraft {
  /** Stable key in the form (not saved). */
  key: string
  kind: ActivityKind
  label: string
  geometry: ActivityGeometry | null
  // excavation
  depth_m: number | null
  support: ExcavationSupport
  digging: DiggingMethod
  // crane
  setup: CraneSetup
  legLoad_kN: number | null
  matLength_m: number | null
  matWidth_m: number | null
  matRotation_deg: number | null
  // fill or stockpile
  height_m: number | null
  unitWeight_kN_per_m3: number | null
  duration_days: number | null
}

export const ACTIVITY_KIND_LABELS: Record<ActivityKind, string> = {
  excavation: 'Excavation',
  crane: 'Crane set-up',
  fill: 'Fill or stockpile',
}

export const SUPPORT_LABELS: Record<ExcavationSupport, string> = {
  none: 'No support (vertical sides)',
  sloped: 'Sloped sides',
  'trench-box': 'Trench box',
  'sheet-piling': 'Sheet piling',
  braced: 'Braced (struts and walings)',
}

export const DIGGING_LABELS: Record<DiggingMethod, string> = {
  mechanical: 'Machine (excavator)',
  'hand-or-vacuum': 'By hand or vacuum',
}

export const CRANE_SETUP_LABELS: Record<CraneSetup, string> = {
  outriggers: 'On outriggers (one point per leg)',
  'single-pad': 'On a single pad',
}

let counter = 0
function nextKey(): string {
  counter += 1
  return `activity-${Date.now().toString(36)}-${counter}`
}

/** A fresh activity of the given kind with the usual defaults filled in. */
export function newActivityDraft(kind: ActivityKind): ActivityDraft {
  return {
    key: nextKey(),
    kind,
    label: '',
    geometry: null,
    depth_m: null,
    support: 'none',
    digging: 'mechanical',
    setup: 'outriggers',
    legLoad_kN: null,
    matLength_m: 1.5,
    matWidth_m: 1.5,
    matRotation_deg: 0,
    height_m: null,
    unitWeight_kN_per_m3: 18,
    duration_days: null,
  }
}

/** A saved activity back into the form. */
export function activityDraftFromDto(dto: ActivityDto | ActivityInput): ActivityDraft {
  const draft = newActivityDraft(dto.kind)
  draft.label = dto.label ?? ''
  draft.geometry = dto.geometry as ActivityGeometry
  if (dto.kind === 'excavation') {
    Object.assign(draft, { depth_m: dto.depth_m, support: dto.support, digging: dto.digging })
  } else if (dto.kind === 'crane') {
    Object.assign(draft, {
      setup: dto.setup,
      legLoad_kN: dto.legLoad_kN,
      matLength_m: dto.matLength_m,
      matWidth_m: dto.matWidth_m,
      matRotation_deg: dto.matRotation_deg,
    })
  } else {
    Object.assign(draft, {
      height_m: dto.height_m,
      unitWeight_kN_per_m3: dto.unitWeight_kN_per_m3,
      duration_days: dto.duration_days,
    })
  }
  return draft
}

const orUndefined = <T>(value: T | null | '') =>
  value === null || value === '' ? undefined : value

/** The candidate object the shared schema checks (empty fields left out, so zod names them). */
export function activityCandidate(draft: ActivityDraft): Record<string, unknown> {
  const base = {
    kind: draft.kind,
    label: orUndefined(draft.label.trim()),
    geometry: orUndefined(draft.geometry),
  }
  if (draft.kind === 'excavation') {
    return {
      ...base,
      depth_m: orUndefined(draft.depth_m),
      support: draft.support,
      digging: draft.digging,
    }
  }
  if (draft.kind === 'crane') {
    return {
      ...base,
      setup: draft.setup,
      legLoad_kN: orUndefined(draft.legLoad_kN),
      matLength_m: orUndefined(draft.matLength_m),
      matWidth_m: orUndefined(draft.matWidth_m),
      matRotation_deg: orUndefined(draft.matRotation_deg),
    }
  }
  return {
    ...base,
    height_m: orUndefined(draft.height_m),
    unitWeight_kN_per_m3: orUndefined(draft.unitWeight_kN_per_m3),
    duration_days: orUndefined(draft.duration_days),
  }
}

export type ActivityCheck = { ok: true; input: ActivityInput } | { ok: false; errors: FieldErrors }

/**
 * Checks one activity with the shared schema. Errors are keyed by the activity's own field
 * (`depth_m`, `geometry`, ...), deeper geometry paths folded onto `geometry`.
 */
export function toActivityInput(draft: ActivityDraft): ActivityCheck {
  const parsed = activityInputSchema.safeParse(activityCandidate(draft))
  if (parsed.success) return { ok: true, input: parsed.data }
  const errors: FieldErrors = {}
  for (const [path, message] of Object.entries(fieldErrorsFromZod(parsed.error))) {
    const field = activityFieldOf(path)
    if (!(field in errors)) errors[field] = message
  }
  return { ok: false, errors }
}

/** `geometry.coordinates.0` -> `geometry`; `depth_m` stays `depth_m`. */
export function activityFieldOf(path: string): string {
  const first = path.split('.')[0] ?? '_'
  return first === '' ? '_' : first
}
