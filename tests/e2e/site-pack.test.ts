import { randomUUID } from 'node:crypto'
import { join } from 'node:path'
import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest'
import type { Browser, BrowserContext, Page } from 'playwright-core'
import { crsTransform } from '../../shared/geo/crs.ts'
import { featureCollection, lineFeature, pe100Properties } from '../helpers/network-fixtures.ts'
import {
  SCREENSHOT_DIR,
  isoInDays,
  launchBrowser,
  openPage,
  signIn as signInAs,
} from './browser.ts'
import { CLIENT, importNetwork, json } from './api-data.ts'

const PHONE = { width: 390, height: 844 }

const baseUrl = inject('baseUrl').replace(/\/$/, '')
const users = inject('e2eUsers')
const byRole = (role: (typeof users)[number]['role']) => users.find((u) => u.role === role)!

const t = crsTransform(25832)
/** A spot of its own, so no other test's pipes join in. */
const origin = t.toGrid([9.9 + Math.random() * 0.02, 52.57 + Math.random() * 0.01]) as [
  number,
  number,
]
const at = (dx: number, dy: number) => t.toLonLat([origin[0] + dx, origin[1] + dy])

/** A 1×1 PNG (signature, IHDR, IDAT, IEND). */
const TINY_PNG = Buffer.from(
  '89504e470d0a1a0a0000000d4948445200000001000000010806000000' +
    '1f15c4890000000d49444154789c6360000002000154a24f5d0000000049454e44ae426082',
  'hex',
)

let browser: Browser
const contexts: BrowserContext[] = []

beforeAll(async () => {
  browser = await launchBrowser()
})
afterAll(async () => {
  for (const c of contexts) await c.close()
  await browser?.close()
})

async function newPage(viewport = { width: 1440, height: 900 }) {
  const opened = await openPage(browser, viewport)
  contexts.push(opened.context)
  return opened
}

const shot = (page: Page, name: string, fullPage = false) =>
  page.screenshot({ path: join(SCREENSHOT_DIR, `site-pack-${name}.png`), fullPage })

/** Engineer's network, applicant's works, acceptance with an attendance condition, grant. */
async function grantedPermit(run: string): Promise<{ id: number; officer: Page }> {
  const { page: engineer } = await newPage()
  await signInAs(engineer, baseUrl, byRole('asset_engineer'))
  await importNetwork(
    engineer,
    baseUrl,
    featureCollection([lineFeature(pe100Properties(`SP-${run}`), [at(0, 0), at(60, 0)])]),
  )
  const tpl = await json<{ id: number; code: string }>(
    await engineer.request.post(`${baseUrl}/api/condition-templates`, {
      headers: CLIENT,
      data: {
        code: `attend-${run}`,
        title: 'We attend the dig',
        text: 'Wendmoor Water attends while you dig within 3 m of the main; give 24 hours notice.',
        attendanceNotice_h: 24,
        photoKinds: ['reinstatement'],
      },
    }),
  )

  const { page: applicant } = await newPage()
  await signInAs(applicant, baseUrl, byRole('applicant'))
  const box = (x0: number, y0: number, x1: number, y1: number) => ({
    type: 'Polygon',
    coordinates: [[at(x0, y0), at(x1, y0), at(x1, y1), at(x0, y1), at(x0, y0)]],
  })
  const draft = await json<{ id: number }>(
    await applicant.request.post(`${baseUrl}/api/applications`, {
      headers: CLIENT,
      data: {
        title: `Valve chamber ${run}`,
        siteAddress: '14 Kiln Street, Wendmoor',
        contactName: 'Robin Foreman',
        contactPhone: '+49 5121 778899',
        startsOn: isoInDays(7),
        endsOn: isoInDays(20),
        description: 'A pit for a new valve chamber beside the water main.',
        activities: [
          {
            kind: 'excavation',
            label: 'Valve chamber pit',
            geometry: box(20, 1.5, 24, 4),
            depth_m: 2,
            support: 'none',
            digging: 'mechanical',
          },
        ],
      },
    }),
  )
  await json(
    await applicant.request.post(`${baseUrl}/api/applications/${draft.id}/submit`, {
      headers: CLIENT,
      data: { version: 0 },
    }),
  )
  const queue = await json<{ items: { id: number; applicationId: number }[] }>(
    await engineer.request.get(`${baseUrl}/api/reviews?state=all&pageSize=500`),
  )
  const review = queue.items.find((r) => r.applicationId === draft.id)!
  await json(
    await engineer.request.post(`${baseUrl}/api/reviews/${review.id}/decision`, {
      headers: CLIENT,
      data: {
        decision: 'accepted_with_conditions',
        version: 0,
        conditions: [
          { source: 'library', code: tpl.code, templateId: tpl.id },
          {
            source: 'own',
            code: 'backfill-sand',
            text: 'Bed and surround the main in sand before backfilling.',
          },
        ],
      },
    }),
  )
  const { page: officer } = await newPage()
  await signInAs(officer, baseUrl, byRole('permit_officer'))
  const decision = await json<{ version: number }>(
    await officer.request.get(
      `${baseUrl}/api/permit-office/applications/${draft.id}/decision-draft`,
    ),
  )
  await json(
    await officer.request.post(`${baseUrl}/api/permit-office/applications/${draft.id}/grant`, {
      headers: CLIENT,
      data: {
        version: decision.version,
        validFrom: isoInDays(0),
        validTo: isoInDays(14),
        conditions: undefined,
      },
    }),
  )
  return { id: draft.id, officer }
}

describe('the site pack on a phone', () => {
  it('shows validity, checklist, map, contacts and code at 390×844, keeps working offline after a reload, and sends offline ticks later', async () => {
    const run = randomUUID().slice(0, 6)
    const { id: applicationId, officer } = await grantedPermit(run)

    const { page, context } = await newPage(PHONE)
    await signInAs(page, baseUrl, byRole('applicant'))
    await page.goto(`${baseUrl}/site/${applicationId}`, { waitUntil: 'networkidle' })
    const pack = page.locator('[data-testid="site-pack"]')
    await pack.locator('[data-testid="site-pack-validity"]').waitFor()
    expect(await pack.locator('[data-testid="site-pack-validity"]').textContent()).toMatch(
      /Valid — 14 days left/,
    )
    expect(await pack.locator('[data-testid="site-pack-state"]').textContent()).toContain(
      'Granted, not started',
    )
    // Phone layout: no desktop navigation drawer, nothing wider than the screen.
    expect(await page.locator('.q-drawer').count()).toBe(0)
    expect(await page.evaluate<number>('document.documentElement.scrollWidth')).toBeLessThanOrEqual(
      PHONE.width,
    )
    await page.locator('[data-testid="town-map"] canvas').first().waitFor({ timeout: 15_000 })
    await page.locator('[data-testid="site-pack-offline-ready"]').waitFor({ timeout: 20_000 })
    await page.waitForTimeout(800)
    await shot(page, 'online')
    await shot(page, 'online-full', true)

    // Tick the first condition online: stored on the server.
    const ticks = pack.locator('[data-testid^="tick-"]')
    expect(await ticks.count()).toBe(2)
    await ticks.nth(0).click()
    await pack.getByText(/ticked by/).waitFor()

    // Works started from the phone.
    await pack.locator('[data-testid="record-start"]').click()
    await pack.locator('[data-testid="site-pack-state"]').getByText('On site').waitFor()
    await pack.locator('[data-testid="photo-reinstatement"]').waitFor({ state: 'attached' })
    await shot(page, 'on-site')

    // The permit office sees the works on site on its map, apart from granted, not started.
    await officer.goto(`${baseUrl}/works-on-site`, { waitUntil: 'networkidle' })
    const line = officer.locator('[data-testid="permit-list"] a', {
      hasText: `Valve chamber ${run}`,
    })
    await line.getByText('On site').waitFor()
    await officer.locator('[data-testid="town-map"] canvas').first().waitFor()
    await officer.waitForTimeout(800)
    await officer.screenshot({ path: join(SCREENSHOT_DIR, 'site-pack-office-works-on-site.png') })

    // Offline: reload, the pack still shows from the phone's copy and says so.
    await context.setOffline(true)
    await page.reload({ waitUntil: 'domcontentloaded' })
    await pack.locator('[data-testid="site-pack-validity"]').waitFor({ timeout: 15_000 })
    expect(await page.locator('[data-testid="site-pack-sync"]').textContent()).toMatch(
      /Offline — showing the copy from/,
    )
    expect(await pack.locator('[data-testid="site-pack-checklist"]').textContent()).toContain(
      'Bed and surround the main in sand',
    )
    expect(await pack.locator('[data-testid="site-pack-verify"] svg').count()).toBe(1)
    await ticks.nth(1).click()
    await page
      .locator('[data-testid="site-pack-sync"]')
      .getByText('1 tick waiting to send')
      .waitFor()
    await page.waitForTimeout(500)
    await shot(page, 'offline')
    await shot(page, 'offline-full', true)

    // Back online: the waiting tick goes to the server.
    await context.setOffline(false)
    await page
      .locator('[data-testid="site-pack-sync"]')
      .getByText(/Last synced/)
      .waitFor({ timeout: 15_000 })
    await page
      .locator('[data-testid="site-pack-sync"]', { hasText: 'waiting to send' })
      .waitFor({ state: 'detached', timeout: 15_000 })
    const stored = await json<{ ticks: Record<string, { ticked: boolean }> }>(
      await page.request.get(`${baseUrl}/api/site-works/${applicationId}/pack`),
    )
    expect(Object.values(stored.ticks).filter((x) => x.ticked)).toHaveLength(2)

    // A reinstatement photo from the phone, then the finish.
    await pack.locator('[data-testid="photo-reinstatement"]').setInputFiles({
      name: 'IMG_0042.png',
      mimeType: 'image/png',
      buffer: TINY_PNG,
    })
    await pack.getByText('(1, required)').waitFor()
    await pack.locator('[data-testid="record-finish"]').click()
    await pack.locator('[data-testid="site-pack-state"]').getByText('Works finished').waitFor()
    await shot(page, 'finished')
  }, 240_000)
})
