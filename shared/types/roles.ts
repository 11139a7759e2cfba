/** The four roles a signed-in user can have; one role per user. */
export const ROLES = ['applicant', 'asset_engineer', 'permit_officer', 'admin'] as const
export type Role = (typeof ROLES)[number]

/** What kind of organisation a user works for. */
export const ORGANISATION_KINDS = [
  'contractor',
  'network_owner',
  'street_authority',
  'operator',
] as const
export type OrganisationKind = (typeof ORGANISATION_KINDS)[number]

/** Plain-word labels shown in the client. */
export const ROLE_LABELS: Record<Role, string> = {
  applicant: 'Applicant',
  asset_engineer: 'Network engineer',
  permit_officer: 'Permit officer',
  admin: 'Administrator',
}

export const ORGANISATION_KIND_LABELS: Record<OrganisationKind, string> = {
  contractor: 'Contractor',
  network_owner: 'Network owner',
  street_authority: 'Street authority',
  operator: 'Service operator',
}
