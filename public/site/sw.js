/*
 * Trenchward site pack service worker (hand-written; scope /site/).
 *
 * It serves the site pack when the phone has no network:
 * - the app shell (index.html and the built scripts, styles and fonts the page hands over in
 *   a "keep-shell" message) from the cache, the network first for index.html;
 * - GET requests to /api/ made by a site pack page: the network first, and the last good
 *   answer from the cache when the network fails (the pack, the street map, who is signed in);
 * - never anything but GET; writes go to the network and fail plainly when offline.
 * A new version of this file drops the caches of the old one.
 */
const VERSION = 'site-pack-v1'
const SHELL = `${VERSION}-shell`
const DATA = `${VERSION}-data`

self.addEventListener('install', () => {
  self.skipWaiting()
})

self.addEventListener('activate', (event) => {
  event.waitUntil(
    (async () => {
      for (const name of await caches.keys()) {
        if (!name.startsWith(VERSION)) await caches.delete(name)
      }
      await self.clients.claim()
    })(),
  )
})

self.addEventListener('message', (event) => {
  const data = event.data || {}
  if (data.type !== 'keep-shell' || !Array.isArray(data.urls)) return
  const port = event.ports && event.ports[0]
  event.waitUntil(
    (async () => {
      let ok = true
      const shell = await caches.open(SHELL)
      const api = await caches.open(DATA)
      // The page asked these before this worker controlled it; fetch and keep them now.
      const urls = data.urls.concat(Array.isArray(data.api) ? data.api : [])
      for (const url of urls) {
        const u = new URL(url, self.location.origin)
        if (u.origin !== self.location.origin) continue
        const isApi = u.pathname.startsWith('/api/')
        try {
          const res = await fetch(u.href, { credentials: 'same-origin', cache: 'no-cache' })
          if (res.ok) {
            if (isApi) await api.put(u.pathname + u.search, res)
            else await shell.put(u.pathname, res)
          } else ok = false
        } catch {
          ok = false
        }
      }
      if (port) port.postMessage({ ok })
    })(),
  )
})

async function networkFirst(request, cacheName, key) {
  const cache = await caches.open(cacheName)
  try {
    const res = await fetch(request)
    if (res.ok) await cache.put(key, res.clone())
    return res
  } catch (err) {
    const hit = await cache.match(key)
    if (hit) return hit
    throw err
  }
}

async function cacheFirst(request) {
  const url = new URL(request.url)
  const hit = await caches.match(url.pathname, { cacheName: SHELL })
  if (hit) return hit
  const res = await fetch(request)
  if (res.ok) {
    const cache = await caches.open(SHELL)
    await cache.put(url.pathname, res.clone())
  }
  return res
}

self.addEventListener('fetch', (event) => {
  const request = event.request
  if (request.method !== 'GET') return
  const url = new URL(request.url)
  if (url.origin !== self.location.origin) return
  if (request.mode === 'navigate') {
    // Every site pack address is the same single-page app.
    event.respondWith(networkFirst(request, SHELL, '/index.html'))
    return
  }
  if (url.pathname.startsWith('/api/')) {
    event.respondWith(networkFirst(request, DATA, url.pathname + url.search))
    return
  }
  if (url.pathname.startsWith('/assets/')) {
    event.respondWith(cacheFirst(request))
  }
})
