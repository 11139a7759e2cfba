import type { Page } from 'playwright-core'

/** Our CSRF header, for writes made through a page's request context. */
export const CLIENT = { 'X-Trenchward-Client': '1' }

/** The JSON body of an API response, or an error with its status and text. */
export async function json<T>(res: {
  ok(): boolean
  status(): number
  text(): Promise<string>
}): Promise<T> {
  const text = await res.text()
  if (!res.ok()) throw new Error(`${res.status()}: ${text}`)
  return JSON.parse(text) as T
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
