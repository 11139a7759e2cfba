import { execFileSync } from 'node:child_process'
import { readdir, rm, writeFile } from 'node:fs/promises'
import { join } from 'node:path'
import { randomUUID } from 'node:crypto'
import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest'
import type { Browser, BrowserContext, Page } from 'playwright-core'
import { crsTransform } from '../../shared/geo/crs.ts'
import { featureCollection, lineFeature, pe100Properties } from '../helpers/network-fixtures.ts'
import {
  ARTIFACTS_DIR as ARTIFACTS,
  SCREENSHOT_DIR,
  launchBrowser,
  openPage,
  signIn as signInAs,
} from './browser.ts'
import { CLIENT, importNetwork as importNetworkAs, json } from './api-helpers.ts'

const baseUrl = inject('baseUrl').replace(/\/$/, '')
const users = inject('e2eUsers')
const byRole = (role: (typeof users)[number]['role']) => users.find((u) => u.role === role)!

const t = crsTransform(25832)
/** A spot of its own (away from the test streets), so no other test's pipes join in. */
const origin = t.toGrid([9.9 + Math.random() * 0.02, 52.57 + Math.random() * 0.01]) as [
  number,
  number,
]
const at = (dx: number, dy: number) => t.toLonLat([origin[0] + dx, origin[1] + dy])
const day = (offset: number) =>
  new Date(Date.now() + offset * 86_400_000).toISOString().slice(0, 10)

let browser: Browser
const contexts: BrowserContext[] = []

beforeAll(async () => {
  browser = await launchBrowser()
  for (const f of await readdir(SCREENSHOT_DIR)) {
    if (f.startsWith('permit-page-')) await rm(join(SCREENSHOT_DIR, f))
  }
})

afterAll(async () => {
  for (const c of contexts) await c.close()
  await browser?.close()
})

async function newPage(viewport = { width: 1440, height: 900 }): Promise<Page> {
  const { page, context } = await openPage(browser, viewport)
  contexts.push(context)
  return page
}

async function signIn(page: Page, role: (typeof users)[number]['role']): Promise<void> {
  await signInAs(page, baseUrl, byRole(role))
}

const importNetwork = (page: Page, text: string) => importNetworkAs(page, baseUrl, text)

const shot = (page: Page, name: string, fullPage = false) =>
  page.screenshot({ path: join(SCREENSHOT_DIR, `reviews-${name}.png`), fullPage })

async function settleMap(page: Page): Promise<void> {
  await page.locator('[data-testid="town-map"] canvas').first().waitFor({ timeout: 15_000 })
  await page.waitForLoadState('networkidle')
  await page.waitForTimeout(800)
}

describe('owner review and permit in a real browser', () => {
  it('engineer accepts with a library condition, officer grants, anyone verifies the PDF', async () => {
    const run = randomUUID().slice(0, 6)
    const pipeRef = `RP-${run}`
    const title = `Service trench ${run}`

    // 1) The engineer's network: one water main at a spot of our own.
    const engineer = await newPage()
    await signIn(engineer, 'asset_engineer')
    await importNetwork(
      engineer,
      featureCollection([lineFeature(pe100Properties(pipeRef), [at(0, 0), at(60, 0)])]),
    )

    // A library condition, made on the library page.
    const libraryTitle = `Hand digging beside the main ${run}`
    await engineer.goto(`${baseUrl}/condition-library`, { waitUntil: 'networkidle' })
    await engineer.locator('[data-testid="template-new"]').click()
    const dialog = engineer.locator('[data-testid="template-dialog"]')
    await dialog.waitFor()
    await dialog.locator('input[data-testid="template-code"]').fill(`hand-dig-${run}`)
    await dialog.locator('input[data-testid="template-title"]').fill(libraryTitle)
    await dialog
      .locator('textarea[data-testid="template-text"]')
      .fill('Dig by hand within {distance_m} m of the water main.')
    await dialog.getByText('Add from the text').click()
    await dialog.getByLabel('Label').fill('Hand-dig distance')
    await dialog.getByLabel('Default').fill('0.5')
    await shot(engineer, 'library-dialog')
    await dialog.locator('[data-testid="template-save"]').click()
    await dialog.waitFor({ state: 'hidden' })
    await engineer.locator('[data-testid="template-list"]').getByText(libraryTitle).waitFor()
    await shot(engineer, 'library')

    // 2) The applicant submits a deep pit 1.5 m beside the main.
    const applicant = await newPage()
    await signIn(applicant, 'applicant')
    const box = (x0: number, y0: number, x1: number, y1: number) => ({
      type: 'Polygon',
      coordinates: [[at(x0, y0), at(x1, y0), at(x1, y1), at(x0, y1), at(x0, y0)]],
    })
    const draft = await json<{ id: number }>(
      await applicant.request.post(`${baseUrl}/api/applications`, {
        headers: CLIENT,
        data: {
          title,
          siteAddress: 'Field Road 3, Wendmoor',
          contactName: 'Alex Applicant',
          contactPhone: '+49 5121 123456',
          startsOn: day(7),
          endsOn: day(20),
          description: 'A pit for a new service connection beside the water main.',
          activities: [
            {
              kind: 'excavation',
              label: 'Service pit',
              geometry: box(20, 1.5, 24, 4),
              depth_m: 2.5,
              support: 'none',
              digging: 'mechanical',
            },
          ],
        },
      }),
    )
    const submitted = await json<{ reference: string; status: string }>(
      await applicant.request.post(`${baseUrl}/api/applications/${draft.id}/submit`, {
        headers: CLIENT,
        data: { version: 0 },
      }),
    )

    expect(submitted.status).toBe('with_owners')

    // 3) The engineer: Reviews queue, then the review.
    await engineer.goto(`${baseUrl}/reviews`, { waitUntil: 'networkidle' })
    const row = engineer.locator('[data-testid="reviews-table"] tr', {
      hasText: submitted.reference,
    })
    await row.waitFor({ timeout: 15_000 })
    expect(await row.textContent()).toMatch(/due in \d+ working days? \(\w{3} \d+ \w{3}\)/)
    await shot(engineer, 'queue')
    await row.click()
    await engineer.waitForURL(/\/reviews\/\d+$/)
    await engineer.locator('[data-testid="segment-result"]').first().waitFor()
    expect(await engineer.locator('[data-testid="review-headline"]').textContent()).toContain(
      'one of your pipes',
    )
    await engineer.locator('[data-testid="segment-checks"]').first().waitFor()
    await settleMap(engineer)
    await shot(engineer, 'review')
    await shot(engineer, 'review-full', true)

    // Re-run with a corrected cover.
    await engineer.locator('[data-testid="open-rerun"]').first().click()
    const rerun = engineer.locator('[data-testid="rerun-dialog"]')
    await rerun.waitFor()
    await rerun.locator('input[data-testid="rerun-cover_m"]').fill('1.6')
    await shot(engineer, 'rerun-dialog')
    await rerun.locator('[data-testid="rerun-submit"]').click()
    await rerun.waitFor({ state: 'hidden' })
    await engineer.locator('[data-testid="rerun-result"]').first().waitFor()

    // A colleague decides meanwhile (same owner, through the API): the page's decision then
    // meets a stale version, says so plainly and offers a reload.
    const reviewId = Number(new URL(engineer.url()).pathname.split('/').pop())
    const loaded = await json<{ review: { version: number } }>(
      await engineer.request.get(`${baseUrl}/api/reviews/${reviewId}`),
    )
    await json(
      await engineer.request.post(`${baseUrl}/api/reviews/${reviewId}/decision`, {
        headers: CLIENT,
        data: {
          decision: 'information_requested',
          version: loaded.review.version,
          question: 'How deep is the pit below the crown of the main?',
        },
      }),
    )
    const panel = engineer.locator('[data-testid="decision-panel"]')
    await panel.getByText('Accept', { exact: true }).click()
    await panel.locator('[data-testid="decision-submit"]').click()
    const conflict = engineer.locator('[data-testid="review-conflict"]')
    await conflict.waitFor()
    await conflict.scrollIntoViewIfNeeded()
    await shot(engineer, 'conflict')
    await conflict.getByText('Reload the review').click()
    await conflict.waitFor({ state: 'hidden' })
    await engineer
      .locator('[data-testid="message-thread"]')
      .getByText('How deep is the pit')
      .waitFor()

    // The applicant answers the question on the application page; the clock runs on.
    await applicant.goto(`${baseUrl}/applications/${draft.id}`, { waitUntil: 'networkidle' })
    const reviews = applicant.locator('[data-testid="owner-reviews"]')
    await reviews.getByText('How deep is the pit below the crown of the main?').waitFor()
    await reviews
      .locator('textarea[data-testid="answer-body"]')
      .fill('About 1.1 m below the crown.')
    await reviews.locator('[data-testid="answer-send"]').click()
    await reviews.getByText('About 1.1 m below the crown.').waitFor()
    await reviews.getByText('Waiting for the owner').waitFor()
    await reviews.scrollIntoViewIfNeeded()
    await shot(applicant, 'applicant-answer')
    await engineer.reload({ waitUntil: 'networkidle' })
    await engineer.locator('[data-testid="message-thread"]').getByText('About 1.1 m').waitFor()

    // Decide: accept with the library condition (and the check's proposals, if any).
    await panel.getByText('Accept with conditions').click()
    await panel.locator('[data-testid="add-library"]').click()
    await engineer.locator('.q-menu .q-item', { hasText: libraryTitle }).click()
    await panel.getByText('Dig by hand within 0.5 m of the water main.').waitFor()
    await panel
      .locator('[data-testid="condition-draft"]')
      .last()
      .getByLabel('Hand-dig distance')
      .fill('0.8')
    await panel.getByText('Dig by hand within 0.8 m of the water main.').waitFor()
    await panel.scrollIntoViewIfNeeded()
    await shot(engineer, 'decision')
    await panel.locator('[data-testid="decision-submit"]').click()
    await engineer
      .locator('[data-testid="decision-history"]')
      .getByText('Accepted with conditions')
      .waitFor({ timeout: 15_000 })
    await engineer.locator('[data-testid="decision-history"]').scrollIntoViewIfNeeded()
    await shot(engineer, 'decided')

    // 4) The permit officer: queue, decision page, grant.
    const officer = await newPage()
    await signIn(officer, 'permit_officer')
    await officer.goto(`${baseUrl}/applications`, { waitUntil: 'networkidle' })
    await officer.locator('[data-testid="office-queue"]').waitFor()
    await shot(officer, 'office-queue')
    const officeRow = officer.locator('[data-testid="office-queue"] tr', {
      hasText: submitted.reference,
    })
    if (await officeRow.isVisible().catch(() => false)) await officeRow.click()
    else await officer.goto(`${baseUrl}/applications/${draft.id}/decision`)
    await officer.waitForURL(/\/applications\/\d+\/decision$/)
    const grant = officer.locator('[data-testid="grant-panel"]')
    await grant.waitFor()
    await grant.locator('[data-testid="permit-conditions"]').getByText('From').first().waitFor()
    expect(await grant.locator('textarea').first().inputValue()).toContain('0.8 m')
    await settleMap(officer)
    await shot(officer, 'office-decision')
    await grant.locator('[data-testid="grant-submit"]').click()
    const card = officer.locator('[data-testid="permit-card"]')
    await card.waitFor({ timeout: 30_000 })
    const number = (await card.locator('[data-testid="permit-number"]').textContent())?.trim() ?? ''
    expect(number).toMatch(/^TWP-\d{4}-\d{5}$/)
    const code = (await card.locator('[data-testid="permit-code"]').textContent())?.trim() ?? ''
    expect(code).toMatch(/^[2-9A-Z]{4}-[2-9A-Z]{4}-[2-9A-Z]{2}$/)
    await officer.evaluate('window.scrollTo(0, 0)')
    await shot(officer, 'office-granted')

    // 5) The PDF: download it, turn its pages into pictures.
    const permits = await json<{ permits: { id: number }[] }>(
      await officer.request.get(`${baseUrl}/api/applications/${draft.id}/permits`),
    )
    const pdf = await officer.request.get(
      `${baseUrl}/api/permits/${permits.permits[0]!.id}/document`,
    )
    if (pdf.status() !== 200) throw new Error(`permit PDF: ${pdf.status()} ${await pdf.text()}`)
    const bytes = await pdf.body()
    expect(bytes.subarray(0, 5).toString()).toBe('%PDF-')
    const pdfPath = join(ARTIFACTS, 'permit.pdf')
    await writeFile(pdfPath, bytes)
    execFileSync('pdftoppm', ['-png', '-r', '60', pdfPath, join(SCREENSHOT_DIR, 'permit-page')])

    // 6) The applicant sees the owner's answer, the permit and the history.
    await applicant.goto(`${baseUrl}/applications/${draft.id}`, { waitUntil: 'networkidle' })
    await applicant.locator('[data-testid="permit-card"]').waitFor()
    await applicant
      .locator('[data-testid="owner-reviews"]')
      .getByText('Accepted with conditions')
      .waitFor()
    await applicant.locator('[data-testid="history-timeline"]').waitFor()
    await settleMap(applicant)
    await shot(applicant, 'applicant', true)

    // 7) Signed out, on a phone: the public check, and the PDF compared.
    const visitor = await newPage({ width: 390, height: 844 })
    await visitor.goto(`${baseUrl}/verify/${code}`, { waitUntil: 'networkidle' })
    const result = visitor.locator('[data-testid="verification-result"]')
    await result.waitFor()
    expect(await result.getAttribute('data-state')).toBe('valid')
    expect(await result.textContent()).toContain(number)
    await visitor.locator('input[type="file"]').setInputFiles(pdfPath)
    await visitor.locator('[data-testid="verify-match"]').getByText('Matches').waitFor()
    await shot(visitor, 'verify', true)

    // A wrong code reads "unknown".
    await visitor.locator('input[data-testid="verify-code"]').fill('2222-2222-22')
    await visitor.locator('[data-testid="verify-submit"]').click()
    await visitor.locator('[data-testid="verification-result"][data-state="unknown"]').waitFor()
  }, 180_000)
})
