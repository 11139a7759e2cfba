import { mkdir, readdir, rm } from 'node:fs/promises'
import { join } from 'node:path'
import { chromium, type Browser, type BrowserContext, type Page } from 'playwright-core'
import { afterAll, beforeAll } from 'vitest'

/**
 * Debian's chromium, run headless as root inside a closed network: these flags stop it from
 * reaching for outside hosts (see the stack notes), and SwiftShader gives it WebGL for the maps.
 */
export const CHROMIUM_ARGS = [
  '--no-sandbox',
  '--headless=new',
  '--disable-gpu',
  '--enable-unsafe-swiftshader',
  '--use-angle=swiftshader',
  '--disable-quic',
  '--no-first-run',
  '--disable-background-networking',
  '--disable-component-update',
  '--disable-sync',
]

export const ARTIFACTS_DIR = join(process.cwd(), 'tests', 'artifacts')
export const SCREENSHOT_DIR = join(ARTIFACTS_DIR, 'screenshots')

export const DESKTOP_VIEWPORT = { width: 1440, height: 900 }

/** The browser every e2e file starts once; each test opens its own context from it. */
export async function launchBrowser(): Promise<Browser> {
  await mkdir(SCREENSHOT_DIR, { recursive: true })
  return chromium.launch({ executablePath: '/usr/bin/chromium', args: CHROMIUM_ARGS })
}

/** A fresh context (no cookies, no storage) and a page that reports its errors on stderr. */
export async function openPage(
  browser: Browser,
  viewport: { width: number; height: number } = DESKTOP_VIEWPORT,
): Promise<{ page: Page; context: BrowserContext }> {
  const context = await browser.newContext({ viewport, locale: 'en-GB' })
  const page = await context.newPage()
  page.on('pageerror', (err) => console.error('page error:', err.message))
  page.on('console', (msg) => {
    if (msg.type() === 'error') console.error('console error:', msg.text())
  })
  return { page, context }
}

/** Signs in through the real form and waits for the home page. */
export async function signIn(
  page: Page,
  baseUrl: string,
  user: { email: string; password: string },
): Promise<void> {
  await page.goto(`${baseUrl}/sign-in`, { waitUntil: 'networkidle' })
  await page.locator('input[data-testid="sign-in-email"]').fill(user.email)
  await page.locator('input[data-testid="sign-in-password"]').fill(user.password)
  await page.locator('[data-testid="sign-in-submit"]').click()
  await page.waitForURL((url) => url.pathname === '/')
}

/** A date some days from today as yyyy-mm-dd. */
export function isoInDays(days: number): string {
  return new Date(Date.now() + days * 86_400_000).toISOString().slice(0, 10)
}

/**
 * One browser for a test file: launched before its tests, with screenshots whose names start
 * with `screenshotPrefix` cleared first; every page from `newPage` gets its own context, and
 * all of them and the browser are closed after the file's tests.
 */
export function useBrowserPages(screenshotPrefix: string): {
  newPage: (viewport?: { width: number; height: number }) => Promise<Page>
} {
  let browser: Browser | undefined
  const contexts: BrowserContext[] = []
  beforeAll(async () => {
    browser = await launchBrowser()
    for (const f of await readdir(SCREENSHOT_DIR)) {
      if (f.startsWith(screenshotPrefix)) await rm(join(SCREENSHOT_DIR, f))
    }
  })
  afterAll(async () => {
    for (const c of contexts) await c.close()
    await browser?.close()
  })
  return {
    newPage: async (viewport = DESKTOP_VIEWPORT) => {
      const { page, context } = await openPage(browser!, viewport)
      contexts.push(context)
      return page
    },
  }
}
