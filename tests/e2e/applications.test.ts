import { join } from 'node:path'
import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest'
import type { Browser } from 'playwright-core'
import { SCREENSHOT_DIR, isoInDays, launchBrowser, openPage, signIn } from './browser.ts'

const baseUrl = inject('baseUrl').replace(/\/$/, '')
const applicant = inject('e2eUsers').find((u) => u.role === 'applicant')!

let browser: Browser

beforeAll(async () => {
  browser = await launchBrowser()
})

afterAll(async () => {
  await browser?.close()
})

describe('applications in a real browser', () => {
  it('creates an application, draws an excavation on the map, submits it and sees the check', async () => {
    const { page, context } = await openPage(browser)
    try {
      await signIn(page, baseUrl, applicant)
      await page.goto(`${baseUrl}/new-application`, { waitUntil: 'networkidle' })
      const canvas = page.locator('[data-testid="town-map"] canvas').first()
      await canvas.waitFor({ timeout: 15_000 })

      // 1) The works
      await page
        .locator('input[data-testid="field-title"]')
        .fill('New water connection at Test Street')
      await page.locator('input[data-testid="field-siteAddress"]').fill('Test Street 12, Wendmoor')
      await page.locator('input[data-testid="field-startsOn"]').fill(isoInDays(10))
      await page.locator('input[data-testid="field-endsOn"]').fill(isoInDays(14))
      await page.locator('input[data-testid="field-contactName"]').fill('Alex Applicant')
      await page.locator('input[data-testid="field-contactPhone"]').fill('+49 5121 123456')
      await page
        .locator('textarea[data-testid="field-description"]')
        .fill('Dig a pit for a new house connection and backfill the same day.')
      // The first save creates the draft and gives the page the draft's own address.
      await page.waitForURL(/\/applications\/\d+\/edit$/, { timeout: 15_000 })

      // 2) An excavation drawn by clicking its corners on the map canvas
      await page.locator('[data-testid="to-activities"]').click()
      await page.locator('[data-testid="add-excavation"]').click()
      await page.locator('[data-testid="draw-hint"]').waitFor()
      const box = await canvas.boundingBox()
      if (!box) throw new Error('map canvas has no size')
      const cx = box.x + box.width / 2
      const cy = box.y + box.height / 2
      const corners: [number, number][] = [
        [cx - 40, cy - 25],
        [cx + 40, cy - 25],
        [cx + 40, cy + 25],
      ]
      for (const [x, y] of corners) {
        await page.mouse.click(x, y)
        await page.waitForTimeout(350)
      }
      await page.mouse.dblclick(cx - 40, cy + 25)
      const where = page.locator('[data-testid="activity-0"] [data-testid="activity-where"]')
      await expect
        .poll(async () => where.textContent(), { timeout: 10_000 })
        .toMatch(/4 corners · [\d.]+ m²/)

      await page.locator('input[data-testid="field-depth_m"]').fill('1.6')
      await page.locator('[data-testid="field-support"]').click()
      await page.locator('.q-menu .q-item', { hasText: 'Trench box' }).click()
      await page
        .locator('[data-testid="reach-list"]')
        .getByText(/Looks [\d.]+ m around it/)
        .waitFor()
      await expect
        .poll(async () => page.locator('[data-testid="save-status"]').textContent(), {
          timeout: 10_000,
        })
        .toMatch(/Saved/)
      await page.screenshot({ path: join(SCREENSHOT_DIR, 'applications-form-drawn.png') })

      // 3) Check and submit
      await page.locator('[data-testid="to-review"]').click()
      // Attach a method statement (a tiny PDF made here) before submitting.
      await page
        .locator(
          'input[type=file][data-testid="attachment-file"], [data-testid="attachment-file"] input[type=file]',
        )
        .first()
        .setInputFiles({
          name: 'method-statement.pdf',
          mimeType: 'application/pdf',
          buffer: Buffer.from('%PDF-1.4\n%%EOF\n', 'latin1'),
        })
      await page.locator('[data-testid="attachment-add"]').click()
      await page
        .locator('.attachments .q-item', { hasText: 'method-statement.pdf' })
        .waitFor({ timeout: 10_000 })
      await page.screenshot({ path: join(SCREENSHOT_DIR, 'applications-form-review.png') })
      await page.locator('[data-testid="submit-application"]').click()
      await page.waitForURL(/\/applications\/\d+$/, { timeout: 20_000 })

      const result = page.locator('[data-testid="screening-result"]')
      await result.waitFor()
      await page.locator('[data-testid="screening-headline"]').waitFor({ timeout: 15_000 })
      // Other browser tests may have imported pipes near the test streets, so either answer is
      // right; when pipes are reached, each affected owner shows its pipes with a verdict.
      const headline =
        (await page.locator('[data-testid="screening-headline"]').textContent()) ?? ''
      expect(headline).toMatch(/No pipe owner is affected|\d+ pipes? of \d+ owners? within reach/)
      if (!headline.includes('No pipe owner')) {
        await result.locator('[data-testid^="affected-pipe-"] [data-verdict]').first().waitFor()
      }
      expect(await page.locator('[data-testid="application-status"]').textContent()).not.toContain(
        'Draft',
      )
      await expect(result.getByRole('note').isVisible()).resolves.toBe(true)
      await page.waitForLoadState('networkidle')
      // Let the map finish fitting the view to the works and their reach.
      await page.waitForTimeout(1000)
      await page.screenshot({ path: join(SCREENSHOT_DIR, 'applications-result.png') })
      await page.emulateMedia({ media: 'print' })
      await page.screenshot({
        path: join(SCREENSHOT_DIR, 'applications-print.png'),
        fullPage: true,
      })
      await page.emulateMedia({ media: 'screen' })

      // My applications lists it with its status in words.
      await page.goto(`${baseUrl}/my-applications`, { waitUntil: 'networkidle' })
      await page
        .locator('[data-testid="applications-table"]')
        .getByText('New water connection at Test Street')
        .first()
        .waitFor()
      await page.screenshot({ path: join(SCREENSHOT_DIR, 'applications-list.png') })
    } finally {
      await context.close()
    }
  })
})
