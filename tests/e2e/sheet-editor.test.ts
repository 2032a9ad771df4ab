import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import type { Browser } from 'playwright-core'
import { launch, screenshot } from '../helpers/browser'
import { signedIn } from '../helpers/client'
import { demoProjectId, editorAsEngineer, ownSheet, spaceTendonsWide } from '../helpers/sheets'
import { DEMO_PS2 } from '../../shared/engine/input/demo'

let browser: Browser
beforeAll(async () => { browser = await launch() })
afterAll(async () => { await browser?.close() })

async function demoSheetId(reference: string) {
  const client = await signedIn('engineer')
  const project = (await client.get(`/api/projects/${await demoProjectId()}`)).body as { sheets: Array<{ id: number, reference: string }> }
  return project.sheets.find(s => s.reference === reference)!.id
}

describe('the calc-sheet editor', () => {
  it('recalculates the report and the check summary at once when a span changes, and saves the draft', async () => {
    const id = await demoSheetId('PS-2')
    const page = await editorAsEngineer(browser, id)
    await screenshot(page, 'sheet-ps2')
    const reportBefore = await page.locator('[data-test=report]').innerText()
    const worstBefore = await page.locator('[data-test=worst-utilisation]').innerText()

    const span2 = page.locator('[data-path="geometry.spans"] input').nth(1)
    await span2.fill('12.5')
    await expect.poll(() => page.locator('[data-test=worst-utilisation]').innerText(), { timeout: 10_000 }).not.toBe(worstBefore)
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

  it('patches the report part by part: a span change touches only the parts whose text changed, the others stay the same nodes', async () => {
    const id = await ownSheet('PARTS')
    const page = await editorAsEngineer(browser, id)
    await expect.poll(() => page.locator('[data-test=propose]').isEnabled(), { timeout: 10_000 }).toBe(true)
    // every part's element nodes and html before the change, kept in the page
    await page.evaluate(() => {
      const kept = new Map<string, { nodes: Element[], html: string }>()
      for (const el of document.querySelectorAll<HTMLElement>('[data-test=report] [data-part]')) kept.set(el.dataset.part!, { nodes: [...el.children], html: el.innerHTML })
      ;(window as unknown as { partsBefore: typeof kept }).partsBefore = kept
      // every part the page changes anything in from here on
      const touched = new Set<string>()
      ;(window as unknown as { partsTouched: typeof touched }).partsTouched = touched
      new MutationObserver((records) => {
        for (const r of records) {
          const part = (r.target instanceof Element ? r.target : r.target.parentElement)?.closest<HTMLElement>('[data-part]')
          if (part) touched.add(part.dataset.part!)
        }
      }).observe(document.querySelector('[data-test=report]')!, { subtree: true, childList: true, characterData: true, attributes: true })
    })
    const span2 = page.locator('[data-path="geometry.spans"] input').nth(1)
    await span2.fill('10.1')
    await expect.poll(() => page.locator('[data-test=report]').innerText(), { timeout: 10_000 }).toContain('10.10')
    // the run with the proposal follows and patches what it changes
    await expect.poll(() => page.locator('[data-test=propose]').isEnabled(), { timeout: 10_000 }).toBe(true)
    const parts = await page.evaluate(() => {
      const before = (window as unknown as { partsBefore: Map<string, { nodes: Element[], html: string }> }).partsBefore
      const touched = (window as unknown as { partsTouched: Set<string> }).partsTouched
      return [...document.querySelectorAll<HTMLElement>('[data-test=report] [data-part]')].map((el) => {
        const was = before.get(el.dataset.part!)
        const nodes = [...el.children]
        return {
          key: el.dataset.part!,
          htmlSame: was?.html === el.innerHTML,
          nodesSame: !!was && was.nodes.length === nodes.length && nodes.every((n, i) => n === was.nodes[i]),
          touched: touched.has(el.dataset.part!),
        }
      })
    })
    const unchanged = parts.filter(p => p.htmlSame)
    const changed = parts.filter(p => !p.htmlSame)
    expect(changed.length).toBeGreaterThan(0)
    expect(unchanged.length).toBeGreaterThan(0)
    // a part whose html did not change is not touched at all and keeps its very nodes; a changed one
    // is patched where it changed (its elements that did not change stay)
    expect(unchanged.filter(p => !p.nodesSame || p.touched).map(p => p.key)).toEqual([])
    expect(changed.filter(p => !p.touched).map(p => p.key)).toEqual([])
  })

  it('applies the proposal as one undoable step that makes failing stress checks pass', async () => {
    const id = await demoSheetId('PS-2')
    const page = await editorAsEngineer(browser, id)
    const spacing = await spaceTendonsWide(page)
    const failing = await page.locator('[data-test=check-state]').innerText()
    const propose = page.locator('[data-test=propose]')
    await expect.poll(() => propose.isEnabled(), { timeout: 10_000 }).toBe(true)
    await expect.poll(() => page.locator('[data-test=save-state]').innerText(), { timeout: 10_000 }).toMatch(/^Saved/)
    const client = await signedIn('engineer')
    const before = ((await client.get(`/api/sheets/${id}`)).body as { inputs: unknown }).inputs

    // the proposal first shows what it would change, by label from the value now to the value proposed
    await propose.click()
    const dialog = page.locator('[data-test=proposal-dialog]')
    await expect.poll(() => dialog.locator('tbody').innerText()).toContain('Tendon spacing')
    expect(await dialog.locator('tbody tr', { hasText: 'Tendon spacing' }).innerText()).toMatch(/1\D?500\Wmm\s+\S+/)
    expect(await page.evaluate(() => document.activeElement?.id)).toBe('proposal-title')
    // cancelling changes nothing and gives the focus back to the button
    await page.keyboard.press('Escape')
    await expect.poll(() => dialog.count()).toBe(0)
    expect(await page.evaluate(() => document.activeElement?.getAttribute('data-test'))).toBe('propose')
    expect(await spacing.inputValue()).toBe('1500')

    await propose.click()
    await dialog.locator('[data-test=proposal-apply]').click()
    await expect.poll(() => page.locator('[data-test=notice]').innerText()).toContain('Applied the proposed force')
    // the focus moves to the result, and the layout's live region says it
    expect(await page.evaluate(() => document.activeElement?.getAttribute('data-test'))).toBe('notice')
    await expect.poll(() => page.locator('.nuxt-announcer').innerText()).toContain('Applied the proposed force')
    await expect.poll(() => page.locator('[data-test=check-state]').innerText(), { timeout: 10_000 }).not.toBe(failing)
    expect(Number(await spacing.inputValue())).toBeLessThan(1500)
    await screenshot(page, 'sheet-ps2-proposal')
    await page.locator('[data-test=undo]').click()
    await expect.poll(() => spacing.inputValue()).toBe('1500')
    await expect.poll(() => page.locator('[data-test=check-state]').innerText(), { timeout: 10_000 }).toBe(failing)
    // the "Applied…" notice is about a step that was just undone: it goes
    await expect.poll(() => page.locator('[data-test=notice]').count()).toBe(0)
    // undo restores exactly the inputs before the proposal
    await expect.poll(() => page.locator('[data-test=save-state]').innerText(), { timeout: 10_000 }).toMatch(/^Saved/)
    expect(((await client.get(`/api/sheets/${id}`)).body as { inputs: unknown }).inputs).toEqual(before)
    await page.locator('[data-test=undo]').click()
    await expect.poll(() => page.locator('[data-test=save-state]').innerText(), { timeout: 10_000 }).toMatch(/^Saved/)
  })

  it('refuses an inputs file with bad lines, naming each, and changes nothing', async () => {
    const id = await demoSheetId('PS-2')
    const page = await editorAsEngineer(browser, id)
    const before = await page.locator('[data-test=report]').innerText()
    await page.locator('[data-test=import]').setInputFiles({ name: 'bad.csv', mimeType: 'text/csv', buffer: Buffer.from('field,value,unit\ngeometry.spans.0,eight,m\nnot.a.field,1,\n') })
    await expect.poll(() => page.locator('[data-test=import-problems]').innerText()).toContain('line 2: Span 1 must be a number')
    expect(await page.locator('[data-test=import-problems]').innerText()).toContain('line 3: "not.a.field" is not an input of this sheet')
    expect(await page.locator('[data-test=report]').innerText()).toBe(before)
  })

  it('judges a field by its current text: typing is not an error, a fixed value clears at once and the draft saves', async () => {
    const id = await ownSheet('VAL')
    const page = await editorAsEngineer(browser, id)
    const span2 = page.locator('[data-path="geometry.spans"] input').nth(1)
    const spansField = page.locator('[data-path="geometry.spans"]')
    const saveState = page.locator('[data-test=save-state]')

    await span2.fill('')
    await span2.pressSequentially('-')
    // a lone minus is a number on its way: no error, no red border
    expect(await spansField.locator('.field-error').count()).toBe(0)
    expect(await span2.getAttribute('class')).not.toContain('field-input-error')
    await span2.pressSequentially('8.4', { delay: 30 })
    // the real rule, by label, never "enter a number" and never a path
    await expect.poll(() => spansField.locator('.field-error').innerText()).toMatch(/^Span 2: .*(longer than zero|at least 1 m)/)
    await expect.poll(() => saveState.innerText()).toMatch(/^Not saved: Span 2/)
    expect(await page.locator('body').innerText()).not.toMatch(/geometry\.spans/)
    // the last report stays, marked stale and naming the field; the field keeps focus and text
    await expect.poll(() => page.locator('[data-test=stale]').innerText()).toContain('Span 2')
    expect(await page.locator('[data-test=report]').getAttribute('data-stale')).toBe('true')
    expect(await page.locator('[data-test=report]').innerText()).toContain('Scope')
    expect(await page.evaluate(() => (document.activeElement as HTMLInputElement).value)).toBe('-8.4')
    await screenshot(page, 'sheet-stale-report')

    // retyping a good value clears everything at once, and the draft saves
    await span2.fill('9.6')
    await expect.poll(() => spansField.locator('.field-error').count()).toBe(0)
    expect(await span2.getAttribute('class')).not.toContain('field-input-error')
    await expect.poll(() => page.locator('[data-test=stale]').count(), { timeout: 10_000 }).toBe(0)
    await expect.poll(() => saveState.innerText(), { timeout: 10_000 }).toMatch(/^Saved \d\d:\d\d$/)
    expect(await page.locator('[data-test=report]').getAttribute('data-stale')).toBeNull()

    // "abc" is not a number while it is there; leaving the field gives the good value back, with no error left
    await span2.fill('abc')
    await expect.poll(() => spansField.locator('.field-error').innerText()).toContain('“abc” is not a number')
    await span2.blur()
    await expect.poll(() => span2.inputValue()).toBe('9.6')
    expect(await spansField.locator('.field-error').count()).toBe(0)
    await expect.poll(() => page.locator('[data-test=notice]').innerText()).toContain('Span 2: “abc” is not a number; kept the value before')
    await expect.poll(() => saveState.innerText(), { timeout: 10_000 }).toMatch(/^Saved/)

    // and the sheet issues: nothing is left "Save the draft first"
    await page.locator('[data-test=issue-revision]').click()
    await expect.poll(() => page.locator('[data-test=issue-ok]').textContent(), { timeout: 20_000 }).toContain('P01 issued for check')
    const client = await signedIn('engineer')
    expect(((await client.get(`/api/sheets/${id}`)).body as { inputs: { geometry: { spans: number[] } } }).inputs.geometry.spans[1]).toBe(9600)
  })

  it('speaks in labels and words: drop-downs show words, headline governs by a check the design controls', async () => {
    const id = await ownSheet('WORDS')
    const page = await editorAsEngineer(browser, id)
    const kinds = await page.locator('#in-section-kind option').allInnerTexts()
    expect(kinds.map(t => t.trim())).toEqual(expect.arrayContaining(['Slab strip', 'T band beam']))
    const patterns = await page.locator('[data-test=report] select[data-key="loads.pattern"] option, #in-loads-pattern option').allInnerTexts()
    expect(patterns.map(t => t.trim())).toContain('Alternate and adjacent spans')
    expect(patterns.join(' ')).not.toContain('alternate-and-adjacent')

    // jacking at 100 % of σp,max reads 100 % by definition: it never heads the summary
    const governing = await page.locator('[data-test=governing]').innerText()
    expect(governing).not.toMatch(/jacking/i)
    await expect.poll(() => page.locator('[data-test=highest-utilisations] li').count(), { timeout: 10_000 }).toBe(3)
    const shown = (await page.locator('[data-test=highest-utilisations] li').allInnerTexts()).map(t => Number(/(\d+) %/.exec(t)![1]))
    expect([...shown].sort((a, b) => b - a)).toEqual(shown)
    await screenshot(page, 'sheet-headline')

    // dates as the office reads them: day first, 24-hour clock
    await expect.poll(() => page.locator('[data-test=save-state]').innerText()).toMatch(/^Saved( \d\d:\d\d)?$/)
  })

  it('exports the inputs in the units the engineer types and imports them back, old engine-unit files too', async () => {
    const id = await ownSheet('IO')
    const page = await editorAsEngineer(browser, id)
    const [json] = await Promise.all([page.waitForEvent('download'), page.getByRole('button', { name: 'Export JSON' }).click()])
    const doc = JSON.parse(await (await json.createReadStream()).toArray().then(chunks => Buffer.concat(chunks).toString('utf8')))
    expect(doc.format).toBe('tendonbook-inputs/2')
    expect(doc.inputs.geometry.spans).toMatchObject({ value: [7.8, 9.6, 9.6, 7.8], unit: 'm', label: 'Spans' })
    expect(doc.inputs.loads.superimposed).toMatchObject({ value: 2, unit: 'kN/m²' })
    expect(doc.inputs.section.h).toMatchObject({ value: 260, unit: 'mm' })
    const [csv] = await Promise.all([page.waitForEvent('download'), page.getByRole('button', { name: 'Export CSV' }).click()])
    const csvText = await (await csv.createReadStream()).toArray().then(chunks => Buffer.concat(chunks).toString('utf8'))
    expect(csvText).toContain('geometry.spans.1,9.6,m,Span 2')
    expect(csvText).toContain('loads.superimposed,2,kN/m²,Superimposed dead load')

    // the engineer edits the file in typed units and imports it
    doc.inputs.geometry.spans.value = [8, 9.6, 9.6, 8]
    await page.locator('[data-test=import]').setInputFiles({ name: 'edited.json', mimeType: 'application/json', buffer: Buffer.from(JSON.stringify(doc)) })
    await expect.poll(() => page.locator('[data-path="geometry.spans"] input').first().inputValue()).toBe('8')
    // a file of the first format, in engine units, still imports
    const old = { format: 'tendonbook-inputs/1', model: doc.model, units: 'N, mm, MPa (engine units)', inputs: { ...DEMO_PS2, geometry: { ...DEMO_PS2.geometry, spans: [7500, 9600, 9600, 7500] } } }
    await page.locator('[data-test=import]').setInputFiles({ name: 'old.json', mimeType: 'application/json', buffer: Buffer.from(JSON.stringify(old)) })
    await expect.poll(() => page.locator('[data-path="geometry.spans"] input').first().inputValue()).toBe('7.5')
    await expect.poll(() => page.locator('[data-test=save-state]').innerText(), { timeout: 10_000 }).toMatch(/^Saved/)
  })

  it('removes a span from a symmetric member in the middle, so it stays symmetric', async () => {
    const id = await ownSheet('SPANS')
    const page = await editorAsEngineer(browser, id)
    await page.getByRole('button', { name: 'Remove a span' }).click()
    const spans = page.locator('[data-path="geometry.spans"] input')
    await expect.poll(() => spans.count()).toBe(3)
    expect(await Promise.all([0, 1, 2].map(i => spans.nth(i).inputValue()))).toEqual(['7.8', '9.6', '7.8'])
    await expect.poll(() => page.locator('[data-test=save-state]').innerText(), { timeout: 10_000 }).toMatch(/^Saved/)
    const client = await signedIn('engineer')
    const saved = (await client.get(`/api/sheets/${id}`)).body as { inputs: { geometry: { spans: number[] }, profile: { lowPointAt?: number[] } } }
    expect(saved.inputs.geometry.spans).toEqual([7800, 9600, 7800])
    if (saved.inputs.profile.lowPointAt) expect(saved.inputs.profile.lowPointAt).toHaveLength(3)
  })
})
