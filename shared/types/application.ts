import type { ActivityInput } from '../schemas/application.ts'

/** Where an application stands; plain words of our own. */
export const APPLICATION_STATUSES = [
  'draft',
  'submitted',
  'with_owners',
  'ready_for_decision',
  'granted',
  'refused',
  'withdrawn',
  'expired',
  'revoked',
] as const
export type ApplicationStatus = (typeof APPLICATION_STATUSES)[number]

export const APPLICATION_STATUS_LABELS: Record<ApplicationStatus, string> = {
  draft: 'Draft',
  submitted: 'Submitted',
  with_owners: 'With owners',
  ready_for_decision: 'Ready for decision',
  granted: 'Granted',
  refused: 'Refused',
  withdrawn: 'Withdrawn',
  expired: 'Expired',
  revoked: 'Revoked',
}

/** Statuses in which an application's works count as planned or under way. */
export const LIVE_STATUSES: readonly ApplicationStatus[] = [
  'submitted',
  'with_owners',
  'ready_for_decision',
  'granted',
]

export type ActivityDto = ActivityInput & { id: number }

export interface ApplicationDto {
  id: number
  reference: string
  status: ApplicationStatus
  version: number
  title: string
  siteAddress: string | null
  contactName: string | null
  contactPhone: string | null
  startsOn: string | null
  endsOn: string | null
  description: string | null
  applicantOrganisation: { id: number; name: string }
  createdBy: { id: number; name: string }
  activities: ActivityDto[]
  submittedAt: string | null
  createdAt: string
  updatedAt: string
}

export interface ApplicationListItem {
  id: number
  reference: string
  status: ApplicationStatus
  title: string
  siteAddress: string | null
  startsOn: string | null
  endsOn: string | null
  activityCount: number
  applicantOrganisation: { id: number; name: string }
  updatedAt: string
}
