import type { ActivityInput } from '../schemas/application.ts'
import type { PermitCondition } from './permits.ts'

/** What the crew records about the works on a granted permit; plain words of our own. */
export const SITE_EVENT_KINDS = ['planned_start', 'started', 'finished'] as const
export type SiteEventKind = (typeof SITE_EVENT_KINDS)[number]

/** Where granted works stand on site, told from the site events. */
export const SITE_STATES = ['not_started', 'on_site', 'finished'] as const
export type SiteState = (typeof SITE_STATES)[number]

export const SITE_STATE_LABELS: Record<SiteState, string> = {
  not_started: 'Granted, not started',
  on_site: 'On site',
  finished: 'Works finished',
}

/** Photos the crew takes on site. */
export const SITE_PHOTO_KINDS = ['reinstatement', 'trial_holes', 'other'] as const
export type SitePhotoKind = (typeof SITE_PHOTO_KINDS)[number]
/** The kinds a condition may demand. */
export const REQUIRED_PHOTO_KINDS = ['reinstatement', 'trial_holes'] as const
export type RequiredPhotoKind = (typeof REQUIRED_PHOTO_KINDS)[number]

export const SITE_PHOTO_LABELS: Record<SitePhotoKind, string> = {
  reinstatement: 'Reinstatement',
  trial_holes: 'Trial holes',
  other: 'Other',
}

export interface SiteEventDto {
  id: number
  kind: SiteEventKind
  /** Planned or actual time, ISO. */
  at: string
  note: string | null
  recordedBy: { id: number; name: string }
  recordedAt: string
}

export interface SitePhotoDto {
  id: number
  kind: SitePhotoKind
  caption: string | null
  filename: string
  contentType: string
  size_bytes: number
  sha256: string
  url: string
  uploadedAt: string
}

/** An owner whose conditions ask to attend, with the notice they want. */
export interface AttendingOwner {
  owner: { id: number; name: string }
  notice_h: number
  /** The condition codes that ask for it. */
  conditionCodes: string[]
}

/** What the conditions of the current permit ask of the site. */
export interface SiteRequirements {
  attendance: AttendingOwner[]
  /** Largest notice any attending owner wants, hours (0 when none attends). */
  notice_h: number
  photoKinds: RequiredPhotoKind[]
}

export interface SiteWorksDto {
  applicationId: number
  reference: string
  permitId: number
  permitNumber: string
  validFrom: string
  validTo: string
  state: SiteState
  plannedStartAt: string | null
  startedAt: string | null
  finishedAt: string | null
  events: SiteEventDto[]
  photos: SitePhotoDto[]
  requirements: SiteRequirements
  /** Photo kinds still missing before the works can be recorded finished. */
  missingPhotoKinds: RequiredPhotoKind[]
}

/** One condition on the crew's checklist. */
export interface SitePackCondition extends PermitCondition {
  /** Stable key of the condition within this permit issue: "<position>:<code>". */
  key: string
}

export interface SitePackTick {
  ticked: boolean
  at: string
  by: string
}

export interface SitePackContact {
  owner: { id: number; name: string }
  medium: string | null
  people: { name: string; email: string }[]
  attends: boolean
  notice_h: number | null
}

/** Everything the site pack shows, in one response the service worker can keep. */
export interface SitePackDto {
  applicationId: number
  reference: string
  title: string
  siteAddress: string | null
  contactName: string | null
  contactPhone: string | null
  permit: {
    id: number
    number: string
    issue: number
    status: string
    validFrom: string
    validTo: string
    verificationCode: string
    verificationUrl: string
    /** The QR code of the verification link, as SVG markup. */
    qrSvg: string
  }
  site: { state: SiteState; startedAt: string | null; finishedAt: string | null }
  conditions: SitePackCondition[]
  ticks: Record<string, SitePackTick>
  contacts: SitePackContact[]
  /** The works, the pipes to protect and the hand-dig zones, GeoJSON in WGS84. */
  map: {
    works: GeoJsonCollection
    pipes: GeoJsonCollection
    handDigZones: GeoJsonCollection
    /** Width of the hand-dig zone either side of a pipe, m (project rule, see README). */
    handDigWidth_m: number
  }
  caution: string
  /** When the server put this together, ISO. */
  generatedAt: string
}

export interface GeoJsonCollection {
  type: 'FeatureCollection'
  features: {
    type: 'Feature'
    id?: string | number
    properties: Record<string, unknown>
    geometry: { type: string; coordinates: unknown }
  }[]
}

/** Change request states; plain words of our own. */
export const CHANGE_REQUEST_STATES = [
  'with_owners',
  'ready_for_decision',
  'granted',
  'declined',
  'withdrawn',
] as const
export type ChangeRequestState = (typeof CHANGE_REQUEST_STATES)[number]

export const CHANGE_REVIEW_STATES = [
  'waiting',
  'accepted',
  'accepted_with_conditions',
  'objected',
] as const
export type ChangeReviewState = (typeof CHANGE_REVIEW_STATES)[number]

/** What the engine found for one owner before and after the change. */
export interface ChangeOwnerScreening {
  owner: { id: number; name: string }
  /** Segments reached and worst verdict with the permit's works. */
  before: { segments: number; worst: string | null; maxUtilisation: number }
  after: { segments: number; worst: string | null; maxUtilisation: number }
  touched: boolean
  /** Why it counts as touched (or not), in plain words. */
  why: string
}

export interface ChangeReviewDto {
  id: number
  owner: { id: number; name: string }
  state: ChangeReviewState
  dueOn: string
  reasons: string | null
  conditions: { code: string; text: string }[]
  decidedAt: string | null
}

export interface ChangeRequestDto {
  id: number
  applicationId: number
  reference: string
  permitId: number
  permitNumber: string
  status: ChangeRequestState
  currentValidTo: string
  validTo: string | null
  activities: ActivityInput[] | null
  reason: string
  screening: ChangeOwnerScreening[]
  reviews: ChangeReviewDto[]
  createdAt: string
  decidedAt: string | null
  decisionNote: string | null
  resultPermitId: number | null
  version: number
}

export interface EmergencyWorksDto {
  id: number
  reference: string
  applicantOrganisation: { id: number; name: string }
  siteAddress: string
  activityKind: ActivityInput['kind']
  depth_m: number | null
  reason: string
  contactName: string
  contactPhone: string
  location: { type: string; coordinates: unknown }
  startedAt: string
  followUpDueAt: string
  followUpApplicationId: number | null
  /** The full application has not followed and the deadline has passed. */
  overdue: boolean
  alertedOwners: { id: number; name: string; segments: number; nearest_m: number }[]
  finishedAt: string | null
}
