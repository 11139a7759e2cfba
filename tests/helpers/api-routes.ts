import type express from 'express'
import { declaredAccess } from '../../server/middleware/access.ts'
import type { Access } from '../../server/middleware/access.ts'

/** One API route as the router holds it: method, full path, the access `allow(...)` declares. */
export interface ApiRoute {
  method: 'GET' | 'POST' | 'PUT' | 'PATCH' | 'DELETE'
  /** The full path with Express parameters, e.g. `/api/applications/:id/submit`. */
  path: string
  access: Access | undefined
  /** `METHOD path`, the key of the tables in the access and bad-input tests. */
  key: string
}

interface RouterLayer {
  /** router 2.x keeps the path a layer was created with (mount path or route path). */
  rawPath?: unknown
  handle?: { stack?: RouterLayer[] }
  route?: { path: unknown; methods: Record<string, boolean>; stack: { handle: unknown }[] }
}

function joinPath(prefix: string, part: unknown): string {
  // A regular-expression path is kept as its source: under /api it has no table entry and fails.
  if (typeof part !== 'string') return `${prefix}${String(part)}`
  if (part === '/' || part === '') return prefix || '/'
  return `${prefix}${part}`.replace(/\/+$/, '') || '/'
}

function walk(stack: RouterLayer[], prefix: string, out: ApiRoute[]): void {
  for (const layer of stack) {
    if (layer.route) {
      const path = joinPath(prefix, layer.route.path)
      for (const [m, on] of Object.entries(layer.route.methods)) {
        if (!on || m === '_all') continue
        const method = m.toUpperCase() as ApiRoute['method']
        out.push({
          method,
          path,
          access: declaredAccess(layer.route.stack[0]?.handle),
          key: `${method} ${path}`,
        })
      }
    } else if (Array.isArray(layer.handle?.stack)) {
      // A mounted router: its mount path is the layer's own path.
      walk(
        layer.handle.stack,
        layer.rawPath === undefined ? prefix : joinPath(prefix, layer.rawPath),
        out,
      )
    }
  }
}

/**
 * Every route under /api of the real application, read from Express's own router (the app's
 * router and each router mounted in it, recursively), so a route added anywhere shows up here.
 */
export function apiRoutes(app: express.Express): ApiRoute[] {
  const out: ApiRoute[] = []
  walk((app as unknown as { router: { stack: RouterLayer[] } }).router.stack, '', out)
  return out.filter((r) => r.path.startsWith('/api/'))
}

/** A path with its parameters filled in: `fill('/api/x/:id', { id: 5 })`. */
export function fillPath(path: string, params: Record<string, string | number>): string {
  return path.replace(/:([A-Za-z]+)/g, (_m, name: string) => {
    const v = params[name]
    if (v === undefined) throw new Error(`no value for :${name} in ${path}`)
    return encodeURIComponent(String(v))
  })
}
