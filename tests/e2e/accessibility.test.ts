// WCAG 2.2 AA on every page, for every role: axe-core's WCAG 2.0/2.1/2.2 A and AA rules find
// nothing; every page has a skip link to its main content and a strong focus ring on its controls.
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import type { Browser } from 'playwright-core'
import { launch } from '../helpers/browser'
import { accessibilityViolations, approvedRevision, everyPage, type Fixture, RolePages, visit } from '../helpers/every-page'

let browser: Browser
let pages: RolePages
let fixture: Fixture
beforeAll(async () => {
  browser = await launch()
  pages = new RolePages(browser)
  fixture = await approvedRevision()
})
afterAll(async () => { await browser?.close() })

describe('accessibility of every page', () => {
  it('finds no WCAG 2.2 A or AA violation on any page, for any role', { timeout: 600_000 }, async () => {
    const found: string[] = []
    for (const v of everyPage(fixture)) {
      const page = await pages.get(v.role)
      await visit(page, v)
      found.push(...(await accessibilityViolations(page)).map(line => `${v.name} (${v.role}): ${line}`))
    }
    expect(found).toEqual([])
  })

  it('leads every page with a skip link to the main content, and rings the focused control strongly', { timeout: 300_000 }, async () => {
    for (const v of everyPage(fixture).filter(p => p.role !== 'visitor')) {
      const page = await pages.get(v.role)
      await visit(page, v)
      await page.locator('body').focus()
      await page.evaluate(() => (document.activeElement as HTMLElement | null)?.blur())
      await page.keyboard.press('Tab')
      const skip = await page.evaluate(() => ({ test: document.activeElement?.getAttribute('data-test'), href: document.activeElement?.getAttribute('href') }))
      expect(skip, v.name).toEqual({ test: 'skip-to-main', href: '#main' })
      await page.keyboard.press('Enter')
      expect(await page.evaluate(() => document.activeElement?.id), v.name).toBe('main')
      // the next control after the skip is inside the main content (where it has one: an empty check
      // queue has none, and Tab then goes on past it), with a 3 px ring of the action colour
      const mainHasControl = await page.evaluate(() => !!document.querySelector('main')?.querySelector('a[href], button:not([disabled]), input:not([disabled]):not([type=hidden]), select:not([disabled]), textarea:not([disabled]), [tabindex]:not([tabindex="-1"])'))
      await page.keyboard.press('Tab')
      const ring = await page.evaluate(() => {
        const el = document.activeElement as HTMLElement
        const style = getComputedStyle(el)
        return { inMain: !!el.closest('main'), width: style.outlineWidth, style: style.outlineStyle, colour: style.outlineColor }
      })
      expect(ring, v.name).toEqual({ inMain: mainHasControl, width: '3px', style: 'solid', colour: 'rgb(36, 95, 97)' })
    }
  })
})
