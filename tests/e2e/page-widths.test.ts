// No page scrolls sideways on a phone, a tablet (portrait and landscape) or a desktop: wide tables,
// formulas and notes scroll or wrap inside their own box. Below the width where inputs and report
// fit side by side, the editor shows them as two panes to switch between, the check summary in view.
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import type { Browser } from 'playwright-core'
import { launch, SCREENSHOTS } from '../helpers/browser'
import { approvedRevision, everyPage, type Fixture, RolePages, visit } from '../helpers/every-page'
import { mkdirSync } from 'node:fs'
import { join } from 'node:path'

const WIDTHS = [390, 820, 1024, 1440]
/** Widths whose screenshots are kept to look at: phone, tablet, desktop. */
const SHOWN = new Set([390, 820, 1440])

let browser: Browser
let pages: RolePages
let fixture: Fixture
beforeAll(async () => {
  browser = await launch()
  pages = new RolePages(browser)
  fixture = await approvedRevision()
  mkdirSync(SCREENSHOTS, { recursive: true })
})
afterAll(async () => { await browser?.close() })

describe('pages at phone, tablet and desktop widths', () => {
  it('never scroll sideways', { timeout: 900_000 }, async () => {
    const wide: string[] = []
    for (const v of everyPage(fixture)) {
      const page = await pages.get(v.role)
      for (const width of WIDTHS) {
        await page.setViewportSize({ width, height: 900 })
        await visit(page, v)
        const [scrollWidth, innerWidth] = await page.evaluate(() => [document.scrollingElement!.scrollWidth, window.innerWidth])
        if (scrollWidth > innerWidth) wide.push(`${v.name} (${v.role}) at ${width} px: ${scrollWidth} px wide`)
        if (SHOWN.has(width)) await page.screenshot({ path: join(SCREENSHOTS, `width-${width}-${v.name.replace(/\W+/g, '-')}.png`) })
      }
    }
    expect(wide).toEqual([])
  })

  it('shows the editor side by side where it fits, else as two panes with the check summary in view', { timeout: 300_000 }, async () => {
    const page = await pages.get('engineer')
    const sheet = everyPage(fixture).find(v => v.name === 'sheet editor')!
    const inputs = page.locator('#sheet-inputs')
    const report = page.locator('#sheet-report')

    await page.setViewportSize({ width: 1440, height: 900 })
    await visit(page, sheet)
    const [left, right] = [(await inputs.boundingBox())!, (await report.boundingBox())!]
    expect(left.x + left.width).toBeLessThanOrEqual(right.x)
    expect(Math.abs(left.y - right.y)).toBeLessThan(5)

    for (const width of [820, 390]) {
      await page.setViewportSize({ width, height: 900 })
      await visit(page, sheet)
      expect(await inputs.isVisible()).toBe(true)
      expect(await report.isVisible()).toBe(false)
      await page.locator('[data-test=jump-sheet-report]').click()
      await expect.poll(() => report.isVisible()).toBe(true)
      expect(await inputs.isVisible()).toBe(false)
      // far down the report, the check summary is still on screen
      await page.mouse.wheel(0, 4000)
      await expect.poll(async () => {
        const box = await page.locator('[data-test=check-summary]').boundingBox()
        return box !== null && box.y >= 0 && box.y < 200
      }).toBe(true)
      await page.screenshot({ path: join(SCREENSHOTS, `editor-report-pane-${width}.png`) })
      await page.locator('[data-test=jump-sheet-inputs]').click()
      await expect.poll(() => inputs.isVisible()).toBe(true)
    }
  })
})
