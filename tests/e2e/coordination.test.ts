import { randomUUID } from 'node:crypto'
import { join } from 'node:path'
import { describe, expect, inject, it } from 'vitest'
import type { Page } from 'playwright-core'
import { crsTransform } from '../../shared/geo/crs.ts'
import { craneAt } from '../helpers/crane-fixtures.ts'
import { featureCollection, lineFeature, pe100Properties } from '../helpers/network-fixtures.ts'
import { CLIENT, importNetwork, json, settleMap } from './api-data.ts'
import { SCREENSHOT_DIR, isoInDays, signIn, useBrowserPages } from './browser.ts'

// Issue 7: the permit officer's works map with the clash list, the timeline and the day slider.

const baseUrl = inject('baseUrl').replace(/\/$/, '')
const users = inject('e2eUsers')
const byRole = (role: (typeof users)[number]['role']) => users.find((u) => u.role === role)!

const t = crsTransform(25832)
/**
 * A spot of its own south of the test streets (so the timeline names a street), random so
 * that earlier runs' pipes and works in the same database stay out of reach.
 */
const origin = t.toGrid([
  9.9483 + Math.random() * 0.0028,
  52.6 - 0.0002 - Math.random() * 0.0006,
]) as [number, number]
const at = (dx: number, dy: number) =>
  t.toLonLat([origin[0] + dx, origin[1] + dy]) as [number, number]

const { newPage } = useBrowserPages('coordination-')

const shot = (page: Page, name: string, fullPage = true) =>
  page.screenshot({ path: join(SCREENSHOT_DIR, `coordination-${name}.png`), fullPage })

async function submit(
  page: Page,
  title: string,
  activity: unknown,
  startsOn: string,
  endsOn: string,
): Promise<{ id: number; reference: string }> {
  const draft = await json<{ id: number }>(
    await page.request.post(`${baseUrl}/api/applications`, {
      headers: CLIENT,
      data: {
        title,
        siteAddress: 'Field Road 3, Wendmoor',
        contactName: 'Alex Applicant',
        contactPhone: '+49 5121 123456',
        startsOn,
        endsOn,
        description: 'A crane lift beside the water main.',
        activities: [activity],
      },
    }),
  )
  const done = await json<{ reference: string }>(
    await page.request.post(`${baseUrl}/api/applications/${draft.id}/submit`, {
      headers: CLIENT,
      data: { version: 0 },
    }),
  )
  return { id: draft.id, reference: done.reference }
}

describe('works map for the permit officer', () => {
  it('lists the clash of two cranes beside one main with its reason, picks it out, and follows the day slider', async () => {
    const run = randomUUID().slice(0, 6)

    // One water main, then two cranes 1.6 m apart above it: clear alone, critical together.
    const engineer = await newPage()
    await signIn(engineer, baseUrl, byRole('asset_engineer'))
    await importNetwork(
      engineer,
      baseUrl,
      featureCollection([lineFeature(pe100Properties(`CO-${run}`), [at(0, 0), at(60, 0)])]),
    )
    const applicant = await newPage()
    await signIn(applicant, baseUrl, byRole('applicant'))
    const a = await submit(
      applicant,
      `Roof truss lift ${run}`,
      craneAt(at(20, 0)),
      isoInDays(7),
      isoInDays(12),
    )
    const b = await submit(
      applicant,
      `Plant delivery ${run}`,
      craneAt(at(21.6, 0)),
      isoInDays(10),
      isoInDays(14),
    )

    // The officer opens the works map for the next four weeks.
    const officer = await newPage()
    await signIn(officer, baseUrl, byRole('permit_officer'))
    await officer.goto(`${baseUrl}/works-map?from=${isoInDays(0)}&to=${isoInDays(27)}`, {
      waitUntil: 'networkidle',
    })
    await settleMap(officer)
    const clash = officer
      .locator('[data-testid="clash-item"]', { hasText: a.reference })
      .filter({ hasText: b.reference })
    await clash.waitFor({ timeout: 15_000 })
    expect(await clash.getAttribute('data-clash-kind')).toBe('combined-load')
    const reason = await clash.locator('[data-testid="clash-reason"]').textContent()
    expect(reason).toMatch(/each clear alone, but together they make the result .+ critical/)
    expect(await officer.getByRole('note').first().textContent()).toContain('Screening check')
    // Both applications are on the timeline with a link to their decision page.
    for (const x of [a, b]) {
      const row = officer.locator(`[data-testid="timeline-row"][data-application-id="${x.id}"]`)
      await row.waitFor()
      expect(await row.locator('a').getAttribute('href')).toBe(`/applications/${x.id}/decision`)
    }
    await shot(officer, 'overview')

    // Picking the clash highlights both rows and puts its works on the map's picked layer.
    await clash.locator('button').first().click()
    await officer.waitForTimeout(600)
    for (const x of [a, b]) {
      expect(
        await officer
          .locator(`[data-testid="timeline-row"][data-application-id="${x.id}"]`)
          .getAttribute('class'),
      ).toContain('works-timeline__row--highlighted')
    }
    expect(await clash.getAttribute('class')).toContain('clash-list__item--selected')
    await shot(officer, 'clash-picked')

    // One day starts on the picked clash's first day (day 10); one step on is day 11.
    await officer.locator('[data-testid="works-mode"]').getByText('One day').click()
    const slider = officer.locator('[data-testid="works-day-slider"]')
    await slider.waitFor()
    const shownDay = () => officer.locator('[data-testid="works-day"]').getAttribute('data-day')
    expect(await shownDay()).toBe(isoInDays(10))
    await slider.focus()
    await officer.keyboard.press('ArrowRight')
    await officer.waitForTimeout(400)
    expect(await shownDay()).toBe(isoInDays(11))
    await clash.waitFor()
    expect(await clash.getAttribute('class')).toContain('clash-list__item--selected')
    await shot(officer, 'day-11')

    // Day 13: A has ended, so the clash is over; B alone is still on site.
    await officer.keyboard.press('ArrowRight')
    await officer.keyboard.press('ArrowRight')
    await officer.waitForTimeout(400)
    expect(await shownDay()).toBe(isoInDays(13))
    // The picked clash stays listed, marked as not on this day, until it is let go.
    expect(await clash.getAttribute('data-on-day')).toBe('false')
    expect(await clash.textContent()).toContain('Not on ')
    expect(
      await officer
        .locator(`[data-testid="timeline-row"][data-application-id="${a.id}"]`)
        .getAttribute('class'),
    ).toContain('works-timeline__row--off-day')
    expect(await officer.locator('[data-testid="works-summary"]').textContent()).toMatch(/^On /)
    await shot(officer, 'day-13')
    await clash.locator('button').first().click()
    await officer.waitForTimeout(300)
    expect(await clash.count()).toBe(0)

    // The reference leads to the decision page.
    await officer.locator(`[data-testid="timeline-row"][data-application-id="${b.id}"] a`).click()
    await officer.waitForURL(new RegExp(`/applications/${b.id}/decision$`))
  })

  it('fits a tablet without the side panel covering the map', async () => {
    const officer = await newPage({ width: 820, height: 1180 })
    await signIn(officer, baseUrl, byRole('permit_officer'))
    await officer.goto(`${baseUrl}/works-map`, { waitUntil: 'networkidle' })
    await settleMap(officer)
    const map = await officer.locator('[data-testid="town-map"]').boundingBox()
    const list = await officer.locator('#clashes-title').boundingBox()
    expect(map && list && list.y >= map.y + map.height).toBe(true)
    await shot(officer, 'tablet')
  })
})
