import type { OrganisationKind, Role } from './roles.ts'

/** An organisation as the API returns it. */
export interface OrganisationDto {
  id: number
  name: string
  kind: OrganisationKind
  /** Medium of a network owner's pipes, e.g. 'water'; null for other kinds. */
  medium: string | null
  createdAt: string
}

/** A user as the API returns it; never carries the password hash. */
export interface UserDto {
  id: number
  email: string
  name: string
  role: Role
  active: boolean
  organisation: OrganisationDto
  lastSignInAt: string | null
  createdAt: string
}
