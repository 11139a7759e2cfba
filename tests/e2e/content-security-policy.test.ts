import { join } from 'node:path'
import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest'
import type { Browser, Page } from 'playwright-core'
import { SCREENSHOT_DIR, launchBrowser, openPage, signIn } from './browser.ts'

/**
 * The built client under helmet's strict Content-Security-Policy: on every main page of each
 * role the browser reports no violation (neither as a `securitypolicyviolation` event nor as a
 * console message) and the page renders.
 */

const baseUrl = inject('baseUrl').replace(/\/$/, '')
const users = inject('e2eUsers')

const PAGES = {
  anonymous: ['/sign-in', '/verify'],
  applicant: ['/', '/my-applications', '/new-application'],
  asset_engineer: ['/', '/reviews', '/network', '/network/import', '/condition-library'],
  permit_officer: ['/', '/applications', '/works-map', '/fee-schedule'],
  admin: ['/', '/admin/users', '/admin/audit', '/admin/mail'],
} as const

// Runs in the page before any of its scripts; a string because this file has no DOM types.
const RECORD_VIOLATIONS = `
  window.__csp = [];
  document.addEventListener('securitypolicyviolation', (e) => {
    window.__csp.push(e.violatedDirective + ' ' + (e.blockedURI || 'inline') + ' ' + (e.sourceFile || ''));
  });
`

let browser: Browser
beforeAll(async () => {
  browser = await launchBrowser()
})
afterAll(async () => {
  await browser?.close()
})

async function visit(page: Page, path: string, consoleCsp: string[]) {
  const res = await page.goto(`${baseUrl}${path}`, { waitUntil: 'networkidle' })
  expect(res?.headers()['content-security-policy'], path).toContain("script-src 'self'")
  // The app has rendered; then let maps start their workers and draw.
  await page.waitForFunction('document.querySelector("#app")?.innerText.trim().length > 20')
  await page.waitForTimeout(500)
  const events = (await page.evaluate('window.__csp')) as string[]
  expect({ path, events, console: consoleCsp }).toEqual({ path, events: [], console: [] })
  const text = (await page.evaluate('document.body.innerText')) as string
  expect(text.trim().length, `${path} shows something`).toBeGreaterThan(20)
}

describe('the strict Content-Security-Policy with the built client', () => {
  for (const [who, paths] of Object.entries(PAGES)) {
    it(`reports no violation on the main pages of ${who === 'anonymous' ? 'a visitor' : `a ${who}`}`, async () => {
      const { page, context } = await openPage(browser)
      const consoleCsp: string[] = []
      page.on('console', (msg) => {
        if (/content security policy/i.test(msg.text())) consoleCsp.push(msg.text())
      })
      await context.addInitScript(RECORD_VIOLATIONS)
      try {
        if (who !== 'anonymous') {
          const user = users.find((u) => u.role === who)!
          await signIn(page, baseUrl, user)
        }
        for (const path of paths) await visit(page, path, consoleCsp)
        await page.screenshot({ path: join(SCREENSHOT_DIR, `csp-${who}.png`) })
      } finally {
        await context.close()
      }
    })
  }
})
