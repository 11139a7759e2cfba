import { mkdtemp, rm, writeFile } from 'node:fs/promises'
import { tmpdir } from 'node:os'
import { join } from 'node:path'
import { randomUUID } from 'node:crypto'
import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest'
import type { Browser, Page } from 'playwright-core'
import {
  featureCollection,
  lineFeature,
  lineNear,
  pe100Properties,
} from '../helpers/network-fixtures.ts'
import { SCREENSHOT_DIR, launchBrowser, openPage, signIn } from './browser.ts'

const baseUrl = inject('baseUrl').replace(/\/$/, '')
const engineer = inject('e2eUsers').find((u) => u.role === 'asset_engineer')

let browser: Browser
let workDir: string
let page: Page

const PRESSURES_KPA = [600, 1000, 1300, 1700]

/** Four water mains a few metres apart, and one with a mistake so the report has a row. */
function networkFile(run: string): { text: string; refs: string[] } {
  const refs = [0, 1, 2, 3].map((i) => `E2E-${run}-${i + 1}`)
  const features = refs.map((ref, i) =>
    lineFeature(
      // Wall stress from pressure governs; these pressures give utilisations in four bands.
      pe100Properties(ref, { internalPressure_kPa: PRESSURES_KPA[i] }),
      lineNear(i * 3, [9.9495, 52.6]),
    ),
  )
  features.push(
    lineFeature(
      pe100Properties(`E2E-${run}-bad`, { outerDiameter_m: 'wide' }),
      lineNear(14, [9.9495, 52.6]),
    ),
  )
  return { text: featureCollection(features), refs }
}

beforeAll(async () => {
  workDir = await mkdtemp(join(tmpdir(), 'trenchward-e2e-network-'))
  browser = await launchBrowser()
  page = (await openPage(browser)).page
})

afterAll(async () => {
  await browser?.close()
  if (workDir) await rm(workDir, { recursive: true, force: true })
})

const shot = (name: string) =>
  page.screenshot({ path: join(SCREENSHOT_DIR, `network-${name}.png`) })

describe('network import in a real browser', () => {
  it('imports a GeoJSON file through mapping, check and commit, then shows the pipes', async () => {
    expect(engineer).toBeDefined()
    if (!engineer) return
    const run = randomUUID().slice(0, 6)
    const { text, refs } = networkFile(run)
    const file = join(workDir, `mains-${run}.geojson`)
    await writeFile(file, text)

    await signIn(page, baseUrl, engineer)

    await page.goto(`${baseUrl}/network/import`, { waitUntil: 'networkidle' })
    await page.locator('[data-testid="import-drop-zone"]').waitFor()
    await shot('import-choose')
    await page.locator('[data-testid="import-file-input"]').setInputFiles(file)

    // Mapping: every field of this file is named as ours, so it is matched already.
    await page
      .locator('[data-testid="mapping-form"]')
      .waitFor({ timeout: 15_000 })
      .catch(async (err: unknown) => {
        await shot('failure')
        throw err
      })
    expect(await page.locator('[data-testid="mapping-missing"]').count()).toBe(0)
    await shot('import-mapping')
    await page.locator('[data-testid="mapping-validate"]').click()

    // Report: four valid, one invalid with its field named.
    await page.locator('[data-testid="import-report"]').waitFor({ timeout: 30_000 })
    await page.locator('[data-testid="import-issues"]').getByText(`E2E-${run}-bad`).waitFor()
    const reportText = await page.locator('[data-testid="import-report"]').textContent()
    expect(reportText).toContain('Outer diameter')
    await page
      .locator('[data-testid="import-choice"]')
      .getByText('Import only the 4 valid features and leave out the 1 invalid one')
      .waitFor()
    await shot('import-report')
    await page.locator('[data-testid="import-commit"]').click()

    await page.locator('[data-testid="import-done"]').waitFor({ timeout: 30_000 })
    expect(await page.locator('[data-testid="import-done"]').textContent()).toContain(
      '4 new segments',
    )
    await shot('import-done')

    // The network: table rows and the map drawn.
    await page.locator('[data-testid="import-see-network"]').click()
    await page.waitForURL((url) => url.pathname === '/network')
    const table = page.locator('[data-testid="segment-table"]')
    for (const ref of refs) await table.getByText(ref).waitFor({ timeout: 15_000 })
    await page.locator('[data-testid="town-map"] canvas').first().waitFor({ timeout: 15_000 })
    await page.waitForLoadState('networkidle')
    await page.waitForTimeout(800)
    await shot('map-medium')

    // One main is over capacity with no works: the owner is told, and can list just that one.
    await page.locator('[data-testid="over-capacity-count"]').getByText('1 over capacity').waitFor()
    await page.locator('[data-testid="colour-by"]').getByText('Utilisation').click()
    await page.waitForTimeout(600)
    await page
      .locator('.network-layout__map')
      .screenshot({ path: join(SCREENSHOT_DIR, 'network-map-bands.png') })

    // Click a row: the side panel shows its data and verdict.
    await table.locator('tr', { hasText: refs[0]! }).locator('td').nth(2).click()
    const panel = page.locator('[data-testid="segment-panel"]')
    await panel.getByText(refs[0]!).waitFor()
    await panel.getByText('Without any works').waitFor()
    await page.evaluate('window.scrollTo(0, 0)')
    await page.waitForTimeout(600)
    await shot('map-utilisation')

    // The pipe page.
    await panel.locator('[data-testid="open-pipe"]').click()
    await page.waitForURL(/\/network\/pipes\/\d+$/)
    await page.locator('[data-testid="baseline-checks"]').waitFor()
    expect(await page.locator('[data-testid="page-title"]').textContent()).toBe(refs[0])
    expect(await page.locator('[data-field="wallThickness_m"]').textContent()).toContain('0.018 m')
    await page.locator('[data-testid="town-map"] canvas').first().waitFor({ timeout: 15_000 })
    await page.waitForLoadState('networkidle')
    await page.waitForTimeout(500)
    await shot('pipe')

    // Edit: a bad value is refused at its field, a good one saves a new version.
    await page.locator('[data-testid="edit-segment"]').click()
    const dialog = page.locator('[data-testid="segment-edit-dialog"]')
    await dialog.waitFor()
    await dialog.locator('input[data-testid="edit-yearLaid"]').fill('1700')
    await dialog.locator('[data-testid="edit-save"]').click()
    await dialog.getByText('Must be 1800 or later').waitFor()
    await page.waitForTimeout(400)
    await shot('pipe-edit')
    await dialog.locator('input[data-testid="edit-yearLaid"]').fill('2004')
    await dialog.locator('[data-testid="edit-save"]').click()
    await dialog.waitFor({ state: 'hidden' })
    await page.locator('[data-testid="segment-history"]').getByText('2').first().waitFor()
    expect(await page.locator('[data-field="yearLaid"]').textContent()).toContain('2004')
  })
})
