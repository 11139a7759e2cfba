import type { OrganisationKind, Role } from '../../shared/types/roles.ts'

/**
 * Which kinds of organisation each role belongs to, so the admin forms offer only sensible
 * pairs. Administrators may sit in any organisation.
 */
export const ORGANISATION_KINDS_FOR_ROLE: Record<Role, readonly OrganisationKind[] | null> = {
  applicant: ['contractor'],
  asset_engineer: ['network_owner'],
  permit_officer: ['street_authority'],
  admin: null,
}

export function organisationFitsRole(kind: OrganisationKind, role: Role): boolean {
  const kinds = ORGANISATION_KINDS_FOR_ROLE[role]
  return kinds === null || kinds.includes(kind)
}
