/**
 * The site pack's service worker (public/site/sw.js, scope /site/): registered only when a
 * site pack is opened. Once it runs, the page hands it the files the page has loaded (the
 * app shell: index, scripts, styles, fonts) so that a reload without a network still starts.
 * The API answers the page read before the worker ran (who is signed in, the street map, the
 * pack) are handed over too. Resolves true when the worker has them all.
 */
export async function registerSitePackWorker(apiPaths: readonly string[]): Promise<boolean> {
  if (!('serviceWorker' in navigator)) return false
  try {
    await navigator.serviceWorker.register('/site/sw.js', { scope: '/site/' })
    const ready = await navigator.serviceWorker.ready
    const worker = ready.active
    if (!worker) return false
    const urls = [
      '/index.html',
      ...performance
        .getEntriesByType('resource')
        .map((e) => e.name)
        .filter((u) => {
          const url = new URL(u, location.href)
          return url.origin === location.origin && url.pathname.startsWith('/assets/')
        }),
    ]
    return await new Promise<boolean>((resolve) => {
      const channel = new MessageChannel()
      channel.port1.onmessage = (event: MessageEvent<{ ok: boolean }>) => resolve(event.data.ok)
      worker.postMessage({ type: 'keep-shell', urls: [...new Set(urls)], api: apiPaths }, [
        channel.port2,
      ])
      setTimeout(() => resolve(false), 15_000)
    })
  } catch {
    return false
  }
}
