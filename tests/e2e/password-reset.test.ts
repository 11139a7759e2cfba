import { join } from 'node:path'
import { QueryTypes } from 'sequelize'
import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest'
import type { Browser } from 'playwright-core'
import { parseConfig } from '../../server/config.ts'
import { createSequelize } from '../../server/db/sequelize.ts'
import { testEnv } from '../helpers/local-env.ts'
import { SCREENSHOT_DIR, launchBrowser, openPage } from './browser.ts'

const baseUrl = inject('baseUrl').replace(/\/$/, '')
const admin = inject('e2eUsers').find((u) => u.role === 'admin')!
const sequelize = createSequelize(parseConfig(testEnv('trenchward_e2e')))
let browser: Browser

beforeAll(async () => {
  browser = await launchBrowser()
})
afterAll(async () => {
  await browser?.close()
  await sequelize.close()
})

const H = { 'X-Trenchward-Client': '1', 'Content-Type': 'application/json' }

/** A new applicant made through the admin API, so no shared e2e user changes password. */
async function newUser(): Promise<string> {
  const signIn = await fetch(`${baseUrl}/api/auth/sign-in`, {
    method: 'POST',
    headers: H,
    body: JSON.stringify({ email: admin.email, password: admin.password }),
  })
  const cookie = /tw\.sid=[^;]+/.exec(signIn.headers.get('set-cookie') ?? '')![0]
  const orgs = (await (
    await fetch(`${baseUrl}/api/admin/organisations`, { headers: { ...H, cookie } })
  ).json()) as { items: { id: number; kind: string }[] }
  const email = `reset-${Date.now()}@e2e.test`
  const res = await fetch(`${baseUrl}/api/admin/users`, {
    method: 'POST',
    headers: { ...H, cookie },
    body: JSON.stringify({
      email,
      name: 'Rita Reset',
      role: 'applicant',
      organisationId: orgs.items.find((o) => o.kind === 'contractor')!.id,
      password: 'first password of rita',
    }),
  })
  expect(res.status).toBe(201)
  return email
}

describe('forgot password in a real browser', () => {
  it('asks for a link on the sign-in page, sets a new password from it and signs in', async () => {
    const email = await newUser()
    const { page, context } = await openPage(browser)
    try {
      await page.goto(`${baseUrl}/sign-in`, { waitUntil: 'networkidle' })
      await page.locator('[data-testid="sign-in-forgot"]').click()
      await page.waitForURL((u) => u.pathname === '/forgot-password')
      await page.locator('input[data-testid="forgot-email"]').fill(email)
      await page.screenshot({ path: join(SCREENSHOT_DIR, 'forgot-password.png') })
      await page.locator('[data-testid="forgot-submit"]').click()
      await page.locator('[data-testid="forgot-answer"]').waitFor()
      await page.screenshot({ path: join(SCREENSHOT_DIR, 'forgot-password-sent.png') })

      const [mail] = await sequelize.query<{ text_body: string }>(
        'SELECT text_body FROM outbox_mails WHERE to_address = ? ORDER BY id DESC LIMIT 1',
        { replacements: [email], type: QueryTypes.SELECT },
      )
      const link = /http\S+\/reset-password#token=[A-Za-z0-9_-]{43}/.exec(mail!.text_body)![0]
      await page.goto(link.replace(/^http:\/\/[^/]+/, baseUrl), { waitUntil: 'networkidle' })
      // The token leaves the address bar at once.
      expect(new URL(page.url()).hash).toBe('')
      await page.locator('input[data-testid="reset-password"]').fill('password1234')
      await page.locator('input[data-testid="reset-repeat"]').fill('password1234')
      await page.locator('[data-testid="reset-submit"]').click()
      await page.getByText('This password is too common').waitFor()
      await page.waitForTimeout(500) // let the field message finish fading in
      await page.screenshot({ path: join(SCREENSHOT_DIR, 'reset-password-refused.png') })

      const fresh = 'lanterns along the towpath'
      await page.locator('input[data-testid="reset-password"]').fill(fresh)
      await page.locator('input[data-testid="reset-repeat"]').fill(fresh)
      await page.locator('[data-testid="reset-submit"]').click()
      await page.locator('[data-testid="reset-done"]').waitFor()
      await page.screenshot({ path: join(SCREENSHOT_DIR, 'reset-password-done.png') })

      await page.locator('[data-testid="reset-sign-in"]').click()
      await page.locator('input[data-testid="sign-in-email"]').fill(email)
      await page.locator('input[data-testid="sign-in-password"]').fill(fresh)
      await page.locator('[data-testid="sign-in-submit"]').click()
      await page.waitForURL((u) => u.pathname === '/')
    } finally {
      await context.close()
    }
  })
})
