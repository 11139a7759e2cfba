import { join } from 'node:path'
import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest'
import type { Browser, Page } from 'playwright-core'
import { SCREENSHOT_DIR, launchBrowser, openPage } from './browser.ts'

/** What each role's home page shows that no other role's does. */
const ROLE_HOME = {
  applicant: { heading: 'Your works near buried pipes', navItem: 'New application' },
  asset_engineer: { heading: 'Requests that touch your network', navItem: 'Condition library' },
  permit_officer: { heading: 'Permits for the borough’s streets', navItem: 'Works map' },
  admin: { heading: 'Running Trenchward', navItem: 'Audit log' },
} as const

const baseUrl = inject('baseUrl').replace(/\/$/, '')
const users = inject('e2eUsers')
const screenshotNames = new Set<string>()

/** home-<role>.png, with a number added when two users share a role. */
function screenshotName(role: string): string {
  let name = `home-${role}.png`
  for (let n = 2; screenshotNames.has(name); n++) name = `home-${role}-${n}.png`
  screenshotNames.add(name)
  return name
}

let browser: Browser

beforeAll(async () => {
  browser = await launchBrowser()
})

afterAll(async () => {
  await browser?.close()
})

/** A new tab in a fresh context, so no session is left over from the previous test. */
async function newPage(): Promise<{ page: Page; close: () => Promise<void> }> {
  const { page, context } = await openPage(browser)
  return { page, close: () => context.close() }
}

describe('sign-in in a real browser', () => {
  it('shows the sign-in page with the product name and form', async () => {
    const { page, close } = await newPage()
    try {
      await page.goto(`${baseUrl}/sign-in`, { waitUntil: 'networkidle' })
      await expect(page.getByRole('heading', { name: 'Sign in' }).isVisible()).resolves.toBe(true)
      await expect(page.getByText('Trenchward').first().isVisible()).resolves.toBe(true)
      // Evaluated in the page; a string because this file is type-checked without DOM types.
      const latoLoaded = await page.evaluate(
        'document.fonts.ready.then(() => document.fonts.check("16px Lato"))',
      )
      expect(latoLoaded).toBe(true)
      await page.screenshot({ path: join(SCREENSHOT_DIR, 'sign-in.png') })
    } finally {
      await close()
    }
  })

  it('sends a signed-out visitor of a deep link to sign-in with ?next=', async () => {
    const { page, close } = await newPage()
    try {
      await page.goto(`${baseUrl}/admin/audit`, { waitUntil: 'networkidle' })
      await page.waitForURL(/\/sign-in\?next=/)
      expect(new URL(page.url()).searchParams.get('next')).toBe('/admin/audit')
    } finally {
      await close()
    }
  })

  for (const user of users) {
    it(`signs in as ${user.role} (${user.email}), sees that role's home page and signs out`, async () => {
      const expected = ROLE_HOME[user.role]
      const { page, close } = await newPage()
      try {
        await page.goto(`${baseUrl}/sign-in`, { waitUntil: 'networkidle' })
        await page.locator('input[data-testid="sign-in-email"]').fill(user.email)
        await page.locator('input[data-testid="sign-in-password"]').fill(user.password)
        await page.locator('[data-testid="sign-in-submit"]').click()

        await page.waitForURL((url) => url.pathname === '/')
        const heading = page.locator('[data-testid="page-title"]')
        await heading.waitFor()
        expect(await heading.textContent()).toBe(expected.heading)
        await page.getByRole('navigation', { name: 'Main' }).getByText(expected.navItem).waitFor()
        await expect(page.getByText(user.name).first().isVisible()).resolves.toBe(true)

        // The town map is its own chunk; wait until OpenLayers has drawn it.
        await page.locator('[data-testid="town-map"] canvas').first().waitFor({ timeout: 15_000 })
        await page.waitForLoadState('networkidle')
        await page.screenshot({ path: join(SCREENSHOT_DIR, screenshotName(user.role)) })

        await page.locator('[data-testid="user-menu"]').click()
        await page.locator('[data-testid="sign-out"]').click()
        await page.waitForURL(/\/sign-in/)
        const me = await page.evaluate(async () => (await fetch('/api/auth/me')).status)
        expect(me).toBe(401)
      } finally {
        await close()
      }
    })
  }
})
