/**
 * Client settings. Only VITE_* variables reach the browser; this is the one place that reads
 * them.
 */
export const config = Object.freeze({
  /** Base path of the API; the server serves it on the same origin. */
  apiBase: (import.meta.env.VITE_API_BASE as string | undefined) ?? '/api',
  appName: 'Trenchward',
})
