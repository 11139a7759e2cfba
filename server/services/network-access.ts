import type { User } from '../models/user.ts'
import { forbidden } from '../errors.ts'

/**
 * Whose detailed pipe data a user may see. Design data are the owner's: its asset engineers
 * read and edit them; admins read every owner's; nobody else reads any (applicants and other
 * owners get the screening outline only).
 *
 * The permit office (issue 6) reads the segments affected by an application it handles, with
 * their engine results, through the applications' own routes: `mayReadAffectedSegments` below.
 * The /api/network routes never open an owner's network to permit officers.
 */
export type SegmentReadScope = { kind: 'owner'; organisationId: number } | { kind: 'all' }

/** The scope of segment data this user may read; throws 403 for roles with none. */
export function segmentReadScope(user: User): SegmentReadScope {
  if (user.role === 'admin') return { kind: 'all' }
  if (user.role === 'asset_engineer') return { kind: 'owner', organisationId: user.organisationId }
  throw forbidden()
}

/** The owner organisation whose network this user may change (import, edit, mapping). */
export function segmentWriteOwner(user: User): number {
  if (user.role !== 'asset_engineer') throw forbidden()
  return user.organisationId
}

/** True when the scope covers the owner. */
export function scopeCovers(scope: SegmentReadScope, ownerOrganisationId: number): boolean {
  return scope.kind === 'all' || scope.organisationId === ownerOrganisationId
}

/**
 * The permit office's grant (issue 6): a permit officer (and an admin) may read the affected
 * segments — with their engine results — of a submitted application they handle. Not of
 * drafts, and not the rest of any owner's network.
 */
export function mayReadAffectedSegments(user: User, applicationStatus: string): boolean {
  if (user.role === 'admin') return true
  return user.role === 'permit_officer' && applicationStatus !== 'draft'
}
