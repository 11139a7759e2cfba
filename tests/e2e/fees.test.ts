import { join } from 'node:path'
import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest'
import type { Browser, BrowserContext, Page } from 'playwright-core'
import { crsTransform } from '../../shared/geo/crs.ts'
import { DURATION_CLASSES, FEE_ACTIVITY_KINDS } from '../../shared/types/fees.ts'
import { SCREENSHOT_DIR, isoInDays, launchBrowser, openPage, signIn } from './browser.ts'

const CLIENT = { 'X-Trenchward-Client': '1' }
const baseUrl = inject('baseUrl').replace(/\/$/, '')
const users = inject('e2eUsers')
const byRole = (role: (typeof users)[number]['role']) => users.find((u) => u.role === role)!

const t = crsTransform(25832)
/** A spot of its own away from the test streets and other tests' pipes. */
const origin = t.toGrid([9.93 + Math.random() * 0.02, 52.62 + Math.random() * 0.01]) as [
  number,
  number,
]
const at = (dx: number, dy: number) => t.toLonLat([origin[0] + dx, origin[1] + dy])

/** The whole suite shares two cores: give the pages time to load. */
const POLL = { timeout: 20_000, interval: 200 }

let browser: Browser
const contexts: BrowserContext[] = []
beforeAll(async () => {
  browser = await launchBrowser()
})
afterAll(async () => {
  for (const c of contexts) await c.close()
  await browser?.close()
})

async function newPage(): Promise<Page> {
  const { page, context } = await openPage(browser)
  contexts.push(context)
  return page
}
const shot = (page: Page, name: string, fullPage = false) =>
  page.screenshot({ path: join(SCREENSHOT_DIR, `fees-${name}.png`), fullPage })

// Our own test prices in currency units: short works 95 / 120 / 60, medium +85, long +245.
const PRICES: Record<string, number[]> = {
  minor: [95, 120, 60],
  standard: [180, 205, 145],
  major: [340, 365, 305],
}

describe('fees in the browser', () => {
  it('the officer adds a schedule version, the applicant sees the fee, pays on the payment page and gets a receipt', async () => {
    const officer = await newPage()
    await signIn(officer, baseUrl, byRole('permit_officer'))
    await officer.goto(`${baseUrl}/fee-schedule`, { waitUntil: 'networkidle' })
    await officer.locator('[data-testid="fee-new"]').click()
    const dialog = officer.locator('[data-testid="fee-schedule-dialog"]')
    await dialog.waitFor()
    for (const d of DURATION_CLASSES) {
      for (const [j, k] of FEE_ACTIVITY_KINDS.entries()) {
        await officer
          .locator(`input[data-testid="fee-price-${d}-${k}"]`)
          .fill(PRICES[d]![j]!.toFixed(2))
      }
    }
    await dialog.getByLabel('Extension of a permit').fill('45.00')
    await dialog.getByLabel('Variation of a permit').fill('65.00')
    await dialog.getByLabel('Refund once an owner answered').fill('40')
    // Invoice by default: other browser tests grant permits without paying.
    await dialog.getByText('Invoice (the permit does not wait for payment)').click()
    await dialog
      .getByLabel('Note (for example the committee decision)')
      .fill('Test schedule of the browser run')
    await shot(officer, 'schedule-dialog')
    await officer.locator('[data-testid="fee-save"]').click()
    await officer.locator('[data-testid="fee-in-force"]').waitFor()
    await expect
      .poll(() => officer.locator('[data-testid="fee-in-force"]').innerText(), POLL)
      .toContain('EUR 95.00')
    await shot(officer, 'schedule-page', true)

    // The applicant submits a one-day excavation (through the API, as the form has its own tests).
    const applicant = await newPage()
    await signIn(applicant, baseUrl, byRole('applicant'))
    const ring = [at(0, 0), at(3, 0), at(3, 2), at(0, 2), at(0, 0)]
    const draft = await applicant.request.post(`${baseUrl}/api/applications`, {
      headers: CLIENT,
      data: {
        title: 'Service connection, 4 Quarry Close',
        siteAddress: '4 Quarry Close, Testbury',
        contactName: 'Pat Payer',
        contactPhone: '+49 170 7654321',
        startsOn: isoInDays(8),
        endsOn: isoInDays(8),
        description: 'One pit for a new water service.',
        activities: [
          {
            kind: 'excavation',
            label: 'Service pit',
            geometry: { type: 'Polygon', coordinates: [ring] },
            depth_m: 1.3,
            support: 'none',
            digging: 'hand-or-vacuum',
          },
        ],
      },
    })
    expect(draft.status()).toBe(201)
    const id = ((await draft.json()) as { id: number }).id
    expect(
      (
        await applicant.request.post(`${baseUrl}/api/applications/${id}/submit`, {
          headers: CLIENT,
          data: { version: 0 },
        })
      ).status(),
    ).toBe(200)

    // The office wants this one paid before grant.
    await officer.goto(`${baseUrl}/applications/${id}/decision`, { waitUntil: 'networkidle' })
    await officer.locator('[data-testid="fees-panel"]').waitFor()
    await officer
      .locator('[data-testid="fee-terms"]')
      .getByText('Pay before the permit is granted')
      .click()
    await expect
      .poll(() => officer.locator('[data-testid="fees-panel"]').innerText(), POLL)
      .toContain('The permit office can grant the permit once this fee is paid')
    await shot(officer, 'decision-unpaid', true)

    await applicant.goto(`${baseUrl}/applications/${id}`, { waitUntil: 'networkidle' })
    const panel = applicant.locator('[data-testid="fees-panel"]')
    await panel.waitFor()
    await expect.poll(() => panel.innerText(), POLL).toContain('EUR 95.00')
    await panel.scrollIntoViewIfNeeded()
    await shot(applicant, 'pay-step')

    await applicant.locator('[data-testid="fee-pay"]').click()
    await applicant.waitForURL((u) => u.pathname.startsWith('/pay/'))
    await shot(applicant, 'payment-page')
    await applicant.getByRole('button', { name: 'Complete the payment' }).click()
    await applicant.waitForURL((u) => u.pathname === `/applications/${id}`)
    await applicant.locator('[data-testid="fee-return-paid"]').waitFor()
    await expect
      .poll(() => applicant.locator('[data-testid="fee-state"]').first().innerText(), POLL)
      .toBe('Paid')
    expect(await applicant.locator('[data-testid="fee-receipt"]').count()).toBe(1)
    await applicant.locator('[data-testid="fees-panel"]').scrollIntoViewIfNeeded()
    await shot(applicant, 'paid')

    await officer.reload({ waitUntil: 'networkidle' })
    await expect
      .poll(() => officer.locator('[data-testid="fees-panel"]').innerText(), POLL)
      .toContain('Paid')
    await shot(officer, 'decision-paid', true)
  })
})
