import type { Page } from 'playwright-core'

/**
 * Creating test data through the real API from a signed-in browser page (its session cookie),
 * shared by the e2e files that need pipes and applications before they open a screen.
 */

/** The CSRF guard header every non-GET request needs. */
export const CLIENT = { 'X-Trenchward-Client': '1' }

/** The body of a playwright API response as JSON; any non-2xx throws with the body. */
export async function json<T>(res: {
  ok(): boolean
  status(): number
  text(): Promise<string>
}): Promise<T> {
  const text = await res.text()
  if (!res.ok()) throw new Error(`${res.status()}: ${text}`)
  return JSON.parse(text) as T
}

/** Waits until the TownMap has drawn and the page's requests have settled. */
export async function settleMap(page: Page): Promise<void> {
  await page.locator('[data-testid="town-map"] canvas').first().waitFor({ timeout: 15_000 })
  await page.waitForLoadState('networkidle')
  await page.waitForTimeout(800)
}

/** Upload, validate and commit a GeoJSON network through the engineer's session. */
export async function importNetwork(page: Page, baseUrl: string, text: string): Promise<void> {
  const api = `${baseUrl}/api/network/imports`
  const job = await json<{ id: number }>(
    await page.request.post(api, {
      headers: CLIENT,
      multipart: {
        file: {
          name: 'mains.geojson',
          mimeType: 'application/geo+json',
          buffer: Buffer.from(text),
        },
      },
    }),
  )
  const waitFor = async (done: string) => {
    for (let i = 0; i < 300; i++) {
      const j = await json<{ status: string }>(await page.request.get(`${api}/${job.id}`))
      if (j.status === done) return
      if (j.status !== 'validating' && j.status !== 'committing' && j.status !== 'uploaded')
        throw new Error(`import ${job.id}: ${JSON.stringify(j)}`)
      await page.waitForTimeout(100)
    }
    throw new Error(`import ${job.id} never reached ${done}`)
  }
  await json(await page.request.post(`${api}/${job.id}/validate`, { headers: CLIENT, data: {} }))
  await waitFor('validated')
  await json(
    await page.request.post(`${api}/${job.id}/commit`, {
      headers: CLIENT,
      data: { skipInvalid: false },
    }),
  )
  await waitFor('committed')
}
