import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import type { Browser, Page } from 'playwright-core'
import { launch, newPage, screenshot, signInAs } from '../helpers/browser'
import { signedIn } from '../helpers/client'

let browser: Browser
beforeAll(async () => { browser = await launch() })
afterAll(async () => { await browser?.close() })

async function demoSheetId(reference: string) {
  const client = await signedIn('engineer')
  const projects = (await client.get('/api/projects')).body as Array<{ id: number, jobNumber: string }>
  const project = (await client.get(`/api/projects/${projects.find(p => p.jobNumber === '2417')!.id}`)).body as { sheets: Array<{ id: number, reference: string }> }
  return project.sheets.find(s => s.reference === reference)!.id
}

async function openSheet(page: Page, id: number) {
  await page.goto(`/sheets/${id}`)
  await page.waitForSelector('[data-test=report] h1, [data-test=report] h2')
  await page.waitForSelector('[data-test=check-summary]')
}

describe('the calc-sheet editor', () => {
  it('recalculates the report and the check summary at once when a span changes, and saves the draft', async () => {
    const id = await demoSheetId('PS-2')
    const page = await newPage(browser)
    await signInAs(page, 'engineer')
    await openSheet(page, id)
    await screenshot(page, 'sheet-ps2')
    const reportBefore = await page.locator('[data-test=report]').innerText()
    const worstBefore = await page.locator('[data-test=worst-utilisation]').innerText()

    const span2 = page.locator('[data-path="geometry.spans"] input').nth(1)
    await span2.fill('12.5')
    await expect.poll(() => page.locator('[data-test=worst-utilisation]').innerText()).not.toBe(worstBefore)
    const reportAfter = await page.locator('[data-test=report]').innerText()
    expect(reportAfter).not.toBe(reportBefore)
    expect(reportAfter).toContain('12.50')
    await span2.blur()
    await expect.poll(() => page.locator('[data-test=save-state]').innerText(), { timeout: 10_000 }).toMatch(/^Saved/)
    await screenshot(page, 'sheet-ps2-longer-span')

    // the saved draft is what the server now holds
    const client = await signedIn('engineer')
    const saved = (await client.get(`/api/sheets/${id}`)).body as { inputs: { geometry: { spans: number[] } } }
    expect(saved.inputs.geometry.spans[1]).toBe(12500)

    // an impossible value is named beside the field, and not saved
    await span2.fill('-3')
    await expect.poll(() => page.locator('[data-path="geometry.spans"]').innerText()).toMatch(/span/i)
    await expect.poll(() => page.locator('[data-test=save-state]').innerText()).toMatch(/Not saved/)
    await span2.fill('9.6')
    await span2.blur()
    await expect.poll(() => page.locator('[data-test=save-state]').innerText(), { timeout: 10_000 }).toMatch(/^Saved/)
  })

  it('applies the proposal as one undoable step that makes failing stress checks pass', async () => {
    const id = await demoSheetId('PS-2')
    const page = await newPage(browser)
    await signInAs(page, 'engineer')
    await openSheet(page, id)
    // too few tendons: the stress checks fail
    const spacing = page.locator('[data-path="tendon.spacing"] input')
    await spacing.fill('1500')
    await spacing.blur()
    await expect.poll(() => page.locator('[data-test=check-state]').innerText()).toMatch(/checks fail/)
    const failing = await page.locator('[data-test=check-state]').innerText()
    const propose = page.locator('[data-test=propose]')
    await expect.poll(() => propose.isEnabled(), { timeout: 10_000 }).toBe(true)
    await propose.click()
    await expect.poll(() => page.locator('[data-test=check-state]').innerText(), { timeout: 10_000 }).not.toBe(failing)
    expect(Number(await spacing.inputValue())).toBeLessThan(1500)
    await screenshot(page, 'sheet-ps2-proposal')
    await page.locator('[data-test=undo]').click()
    await expect.poll(() => spacing.inputValue()).toBe('1500')
    await expect.poll(() => page.locator('[data-test=check-state]').innerText()).toBe(failing)
    await page.locator('[data-test=undo]').click()
    await expect.poll(() => page.locator('[data-test=save-state]').innerText(), { timeout: 10_000 }).toMatch(/^Saved/)
  })

  it('refuses an inputs file with bad lines, naming each, and changes nothing', async () => {
    const id = await demoSheetId('PS-2')
    const page = await newPage(browser)
    await signInAs(page, 'engineer')
    await openSheet(page, id)
    const before = await page.locator('[data-test=report]').innerText()
    await page.locator('[data-test=import]').setInputFiles({ name: 'bad.csv', mimeType: 'text/csv', buffer: Buffer.from('field,value,unit\ngeometry.spans.0,eight,m\nnot.a.field,1,\n') })
    await expect.poll(() => page.locator('[data-test=import-problems]').innerText()).toContain('line 2: geometry.spans.0 must be a number')
    expect(await page.locator('[data-test=import-problems]').innerText()).toContain('line 3: not.a.field is not an input of this sheet')
    expect(await page.locator('[data-test=report]').innerText()).toBe(before)
  })
})
