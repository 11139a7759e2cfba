import type { Role } from '../../shared/types/roles.ts'

/** What each route tells the guard, the navigation and the page title. */
declare module 'vue-router' {
  interface RouteMeta {
    /** Reachable without signing in. */
    public?: boolean
    /** Only these roles may open it; absent means every signed-in role. */
    roles?: readonly Role[]
    /** Page title and navigation label. */
    title?: string
    /** Icon (SVG path string from @quasar/extras) when the route appears in the navigation. */
    navIcon?: string
    /** For pages still being built: one sentence on what will be there. */
    summary?: string
  }
}

export {}
