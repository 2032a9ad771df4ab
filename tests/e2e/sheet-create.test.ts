import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import type { Browser } from 'playwright-core'
import { launch, newPage, screenshot, signInAs } from '../helpers/browser'
import { signedIn } from '../helpers/client'
import { demoProjectId } from '../helpers/sheets'

let browser: Browser
beforeAll(async () => { browser = await launch() })
afterAll(async () => { await browser?.close() })

describe('a new calc sheet', () => {
  it('starts from the template with the number and lengths of spans chosen', async () => {
    const page = await newPage(browser)
    await signInAs(page, 'engineer')
    await page.goto(`/projects/${await demoProjectId()}`)
    await page.waitForLoadState('networkidle')
    const reference = `N-${Date.now().toString(36)}`
    await page.fill('#sheet-reference', reference)
    await page.fill('#sheet-title', 'Two-span transfer slab')
    await page.fill('#sheet-span-count', '2')
    await expect.poll(() => page.locator('[data-test=new-spans] input[inputmode=decimal]').count()).toBe(2)
    await page.fill('#sheet-span-0', 'x')
    await page.click('[data-test=sheet-form] button[type=submit]')
    await expect.poll(() => page.locator('[data-test=sheet-form]').innerText()).toContain('Span 1: Enter the span length in metres')
    await page.fill('#sheet-span-0', '6')
    await page.fill('#sheet-span-1', '7.5')
    await screenshot(page, 'sheet-new-spans')
    await page.click('[data-test=sheet-form] button[type=submit]')
    await page.waitForURL(/\/sheets\/\d+$/)
    await page.waitForSelector('[data-test=check-summary]')
    const spans = page.locator('[data-path="geometry.spans"] input')
    await expect.poll(() => spans.count()).toBe(2)
    expect([await spans.nth(0).inputValue(), await spans.nth(1).inputValue()]).toEqual(['6', '7.5'])
  })

  it('starts from a copy of another sheet of the project', async () => {
    const client = await signedIn('engineer')
    const projectId = await demoProjectId()
    const project = (await client.get(`/api/projects/${projectId}`)).body as { sheets: Array<{ id: number, reference: string }> }
    const bb1 = project.sheets.find(s => s.reference === 'BB-1')!
    const source = (await client.get(`/api/sheets/${bb1.id}`)).body as { inputs: unknown, template: { id: number } }

    const page = await newPage(browser)
    await signInAs(page, 'engineer')
    await page.goto(`/projects/${projectId}`)
    await page.waitForLoadState('networkidle')
    await page.selectOption('#sheet-template', String(source.template.id))
    await page.fill('#sheet-reference', `C-${Date.now().toString(36)}`)
    await page.fill('#sheet-title', 'Band beam, grid 4')
    await page.check('[data-test=start-sheet]')
    await page.selectOption('#sheet-copy-from', String(bb1.id))
    await page.click('[data-test=sheet-form] button[type=submit]')
    await page.waitForURL(/\/sheets\/\d+$/)
    const newId = Number(/\/sheets\/(\d+)$/.exec(page.url())![1])
    const copy = (await client.get(`/api/sheets/${newId}`)).body as { inputs: unknown }
    expect(copy.inputs).toEqual(source.inputs)
  })
})
