// The main paths with the keyboard alone: the engineer changes a span, takes the proposal and
// issues; the checker comments and approves. Only key presses drive the page; the test reads where
// the focus is and what the page says.
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import type { Browser, Page } from 'playwright-core'
import { launch, newPage, screenshot, signInAs } from '../helpers/browser'
import { openSheet } from '../helpers/sheets'
import { makeSheet } from '../integration/records-fixtures'

let browser: Browser
beforeAll(async () => { browser = await launch() })
afterAll(async () => { await browser?.close() })
/** The machine may be busy: give the page time. */
const poll = <T>(read: () => T | Promise<T>) => expect.poll(read, { timeout: 30_000, interval: 200 })

/** What has the focus, as a selector would name it. */
function focused(page: Page) {
  return page.evaluate(() => {
    const el = document.activeElement as HTMLElement | null
    return { test: el?.dataset.test ?? null, id: el?.id || null, path: el?.closest<HTMLElement>('[data-path]')?.dataset.path ?? null, tag: el?.tagName ?? null }
  })
}

/**
 * Presses Tab (or Shift+Tab) until the focused element matches `selector`; fails after `most`
 * presses. Returns how many it took.
 */
async function tabTo(page: Page, selector: string, most: number, back = false) {
  for (let n = 1; n <= most; n++) {
    await page.keyboard.press(back ? 'Shift+Tab' : 'Tab')
    if (await page.evaluate(s => document.activeElement?.matches(s) ?? false, selector)) return n
  }
  throw new Error(`${selector} was not reached in ${most} ${back ? 'Shift+Tab' : 'Tab'} presses; the focus is on ${JSON.stringify(await focused(page))}`)
}

/** Replaces the focused field's text by typing. */
async function typeOver(page: Page, text: string) {
  await page.keyboard.press('Control+A')
  await page.keyboard.type(text)
}

describe('the main paths with the keyboard alone', () => {
  it('the engineer changes a span, takes the proposal and issues; the checker comments and approves', { timeout: 600_000 }, async () => {
    const { sheetId } = await makeSheet()
    const engineer = await newPage(browser)
    await signInAs(engineer, 'engineer')
    await openSheet(engineer, sheetId)

    // the sheet's own jumps come after its main actions; "Inputs" goes to the form
    await tabTo(engineer, '[data-test=jump-sheet-inputs]', 40)
    await engineer.keyboard.press('Enter')
    expect((await focused(engineer)).id).toBe('sheet-inputs')
    await tabTo(engineer, '[data-test="geometry.spans.1"] input', 40)
    await typeOver(engineer, '10.2')
    await poll(() => engineer.locator('[data-test=report]').innerText()).toContain('10.20')

    // too few tendons, so the stress checks fail and the proposal has something to change
    await tabTo(engineer, '[data-path="tendon.spacing"] input', 250)
    await typeOver(engineer, '1500')
    await engineer.keyboard.press('Tab')
    await poll(() => engineer.locator('[data-test=check-state]').innerText()).toMatch(/checks fail/)
    await poll(() => engineer.locator('[data-test=propose]').isEnabled()).toBe(true)
    const failing = await engineer.locator('[data-test=check-state]').innerText()

    // back up to "Propose P and e": it shows what it will change, and the focus goes to it
    await tabTo(engineer, '[data-test=propose]', 400, true)
    await engineer.keyboard.press('Enter')
    await poll(async () => (await focused(engineer)).id).toBe('proposal-title')
    expect(await engineer.locator('[data-test=proposal-changes]').innerText()).toContain('Tendon spacing')
    await tabTo(engineer, '[data-test=proposal-apply]', 5)
    await engineer.keyboard.press('Enter')
    await poll(async () => (await focused(engineer)).test).toBe('notice')
    await poll(() => engineer.locator('[data-test=check-state]').innerText()).not.toBe(failing)
    await screenshot(engineer, 'keyboard-engineer-proposal')

    // "Revisions and issue" is a few presses from the result, not past the report's inline fields
    const presses = await tabTo(engineer, '[data-test=jump-sheet-revisions]', 15)
    expect(presses).toBeLessThanOrEqual(15)
    await engineer.keyboard.press('Enter')
    expect((await focused(engineer)).id).toBe('sheet-revisions')
    await tabTo(engineer, '#issue-note', 5)
    await engineer.keyboard.type('Issued with the keyboard alone')
    await tabTo(engineer, '[data-test=issue-revision]', 3)
    await engineer.keyboard.press('Enter')
    // failing checks (if any the proposal leaves) ask for the reason in a dialog that takes the focus
    await poll(async () => (await engineer.locator('[data-test=issue-ok]').count()) + (await engineer.locator('[data-test=issue-dialog]').count())).toBe(1)
    if (await engineer.locator('[data-test=issue-dialog]').count()) {
      expect((await focused(engineer)).id).toBe('issue-confirm-title')
      await tabTo(engineer, '#issue-reason', 5)
      await engineer.keyboard.type('Checked by hand: see the note')
      await tabTo(engineer, '[data-test=issue-confirm]', 3)
      await engineer.keyboard.press('Enter')
    }
    await poll(() => engineer.locator('[data-test=issue-ok]').innerText()).toContain('P01 issued for check')
    // the result has the focus and the live region says it
    expect(await engineer.evaluate(() => !!document.activeElement?.querySelector('[data-test=issue-ok]'))).toBe(true)
    await poll(() => engineer.locator('.nuxt-announcer').innerText()).toContain('P01 issued for check')
    const href = await engineer.locator('[data-test=revisions-table] tbody tr').first().locator('a').getAttribute('href')

    // the checker: from the page's top, the jump to the check panel, a comment, then approval
    const checker = await newPage(browser)
    await signInAs(checker, 'checker')
    await checker.goto(href!)
    await checker.waitForLoadState('networkidle')
    await checker.waitForSelector('[data-test=frozen-report]')
    await tabTo(checker, '[data-test=jump-review]', 40)
    await checker.keyboard.press('Enter')
    expect((await focused(checker)).id).toBe('review-panel')
    await tabTo(checker, '[data-test=comment-anchor-0]', 5)
    await tabTo(checker, '[data-test=comment-text-0]', 2)
    await checker.keyboard.type('Chair heights checked against the schedule.')
    await tabTo(checker, '[data-test=review-comment]', 4)
    await checker.keyboard.press('Enter')
    await poll(async () => (await focused(checker)).test).toBe('review-message')
    expect(await checker.locator('[data-test=review-message]').innerText()).toContain('Comment added')
    await poll(() => checker.locator('[data-test=review-history]').innerText()).toContain('Chair heights checked')
    await tabTo(checker, '[data-test=review-approve]', 6, true)
    await checker.keyboard.press('Enter')
    await poll(() => checker.locator('[data-test=revision-status]').getAttribute('data-status')).toBe('approved')
    await poll(async () => (await focused(checker)).test).toBe('review-message')
    await poll(() => checker.locator('.nuxt-announcer').innerText()).toContain('Approved')
    await screenshot(checker, 'keyboard-checker-approved')
  })
})
