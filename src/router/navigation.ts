import type { RouteRecordRaw } from 'vue-router'
import type { Role } from '../../shared/types/roles.ts'
import { routes } from './routes.ts'

export interface NavItem {
  name: string
  label: string
  icon: string
}

/** May this role open a route with these meta roles? */
export function roleMayOpen(role: Role, roles: readonly Role[] | undefined): boolean {
  return !roles || roles.includes(role)
}

function flatten(records: RouteRecordRaw[]): RouteRecordRaw[] {
  return records.flatMap((record) => [record, ...flatten(record.children ?? [])])
}

/** The navigation entries for one role, taken from the routes so the two never disagree. */
export function navigationFor(role: Role): NavItem[] {
  return flatten(routes).flatMap((record) => {
    const meta = record.meta
    if (!meta?.navIcon || typeof record.name !== 'string') return []
    if (!roleMayOpen(role, meta.roles)) return []
    return [{ name: record.name, label: meta.title ?? record.name, icon: meta.navIcon }]
  })
}
