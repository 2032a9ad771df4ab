/**
 * The engineer writes the sheet: a paragraph and a calculation of their own typed into the sheet's
 * text in the editor, seen rendered with its check in the summary, issued; the checker sees the
 * text's change word by word. In the real Chromium against the real server.
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import type { Browser } from 'playwright-core'
import { launch, newPage, screenshot, signInAs } from '../helpers/browser'
import { signedIn } from '../helpers/client'
import { editorAsEngineer, ownSheet } from '../helpers/sheets'

let browser: Browser
beforeAll(async () => { browser = await launch() })
afterAll(async () => { await browser?.close() })

describe('the sheet\'s own text', () => {
  it('a paragraph and a quantity typed into the text render, are issued, and reach the checker as a change', async () => {
    const id = await ownSheet('TXT')
    const engineer = await signedIn('engineer')
    const p01 = await engineer.issue(id, { note: 'Before the text was written' })
    expect(p01.status).toBe(201)

    const page = await editorAsEngineer(browser, id)
    await page.locator('[data-test=pane-text]').click()
    await page.waitForSelector('[data-test=text-editor] .cm-content')
    await page.locator('[data-test=text-editor] .cm-content').click()
    await page.keyboard.press('Control+End')
    await page.keyboard.type('\n\n# Façade by hand\n\nThe façade of the east edge is taken by hand.\n\n::: calc\nh_f = 3.6 m  # Façade height\ng_f = 0.75 kN/m^2  # Façade weight\nw_f = h_f * g_f  # Façade line load\ncheck w_f <= 7.5 kN/m  # Façade load within the load designed for\n', { delay: 2 })
    // the editor closes nothing by itself on a new line: end the block
    await page.keyboard.type(':::\n', { delay: 2 })
    await expect.poll(() => page.locator('[data-test=report] [data-name=w_f]').count(), { timeout: 10_000 }).toBe(1)
    // textContent: a part of the report off screen is not laid out (content-visibility), so innerText leaves it out
    expect(await page.locator('[data-test=report]').textContent()).toContain('The façade of the east edge is taken by hand.')
    expect(await page.locator('[data-test=report] [data-check="calc.1.1"]').count()).toBeGreaterThan(0)
    await expect.poll(() => page.locator('[data-test=save-state]').innerText(), { timeout: 10_000 }).toMatch(/^Saved/)
    await screenshot(page, 'sheet-own-text')

    const p02 = await engineer.issue(id, { note: 'The façade by hand' })
    expect(p02.status).toBe(201)
    const rev = p02.body as { id: number }
    const checker = await newPage(browser)
    await signInAs(checker, 'checker')
    await checker.goto(`/revisions/${rev.id}`)
    const text = checker.locator('[data-test=diff-text]')
    await expect.poll(() => text.innerText(), { timeout: 10_000 }).toContain('Façade by hand')
    expect(await text.locator('ins').first().innerText()).toContain('façade')
    await screenshot(checker, 'revision-text-diff')
  })
})
