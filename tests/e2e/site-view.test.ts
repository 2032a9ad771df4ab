// The site's page of an approved revision: opened by the verification reference the sealed PDF
// prints at the foot of its pages, the chair heights first and large, readable on a phone without
// sideways scrolling; only for members of the project, only for an approved revision, and a
// superseded revision says so first.
import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest'
import type { Browser } from 'playwright-core'
import { DEMO_PS2 } from '../../shared/engine/input/demo'
import { launch, screenshot, signInAs } from '../helpers/browser'
import { accessibilityViolations, approvedRevision } from '../helpers/every-page'
import { issue, newPerson, session, setSheetInputs } from '../integration/records-fixtures'

let browser: Browser
beforeAll(async () => { browser = await launch() })
afterAll(async () => { await browser?.close() })

interface HeightRow { chair: number, x: number }

describe('the site view', () => {
  it('opens an approved revision by the reference its PDF prints, chair heights first, on a phone', { timeout: 300_000 }, async () => {
    const fixture = await approvedRevision()
    const engineer = await session('engineer')
    // the reference the print page (and so the sealed PDF's footer) carries
    const print = await engineer.json('GET', `/api/revisions/${fixture.revisionId}/print`)
    const reference = print.body.titleBlock.verificationRef as string
    expect(reference).toMatch(/^TB-[0-9A-F]{4}-[0-9A-F]{4}-[0-9A-F]{4}$/)

    const site = await engineer.json('GET', `/api/site/${reference}`)
    expect(site.status).toBe(200)
    expect(site.body.code).toBe('C01')
    const spans = site.body.heights.spans as Array<{ span: number, rows: HeightRow[] }>
    expect(spans).toHaveLength(DEMO_PS2.geometry.spans.length)

    // the reference typed as people do (lower case, spaces) finds it too; anything else is refused in words
    expect((await engineer.json('GET', `/api/site/${encodeURIComponent(reference.toLowerCase().replace(/-/g, ' '))}`)).status).toBe(200)
    const bad = await engineer.json('GET', '/api/site/not-a-reference')
    expect(bad.status).toBe(400)
    expect(bad.body.message).toContain('is not a verification reference')
    // someone outside the project finds nothing, as if there were no such revision
    const outsider = await newPerson('engineer', 'Other Office Engineer')
    const hidden = await outsider.session.json('GET', `/api/site/${reference}`)
    expect(hidden.status).toBe(404)
    expect(hidden.body.message).toBe(`No revision of your projects has the verification reference ${reference}`)

    const context = await browser.newContext({ baseURL: inject('baseUrl'), viewport: { width: 390, height: 844 } })
    const page = await context.newPage()
    await signInAs(page, 'engineer')
    // from the way in: type the reference printed on the PDF
    await page.goto('/site')
    await page.waitForLoadState('networkidle')
    await page.fill('[data-test=site-reference]', reference.toLowerCase())
    await page.click('[data-test=site-open]')
    await page.waitForURL(`**/site/${reference}`)
    await page.waitForSelector('[data-test=site-heights]')

    // span 1: the chair height is the first column, large, and the values are the revision's own
    const table = page.locator('[data-test=site-span-1]')
    expect((await table.locator('thead th').first().innerText()).toLowerCase()).toBe('chair height')
    const chairs = await table.locator('[data-test=site-chair]').allInnerTexts()
    expect(chairs.map(t => Number(t.replace(/\s*mm$/, '')))).toEqual(spans[0]!.rows.map(r => Math.round(r.chair)))
    const size = await table.locator('[data-test=site-chair]').first().evaluate(el => Number.parseFloat(getComputedStyle(el).fontSize))
    expect(size).toBeGreaterThanOrEqual(24)
    expect(await page.locator('[data-test=site-stressing-table] tbody tr').count()).toBe(site.body.stressing.tendons.length)
    expect(await page.locator('[data-test=site-view]').innerText()).toContain('competent engineer to verify')
    // a phone never scrolls sideways, and the page passes the accessibility rules
    expect(await page.evaluate(() => document.scrollingElement!.scrollWidth <= window.innerWidth)).toBe(true)
    expect(await accessibilityViolations(page)).toEqual([])
    await screenshot(page, 'site-view-390')
    // printed, the header and the buttons stay off the paper
    await page.emulateMedia({ media: 'print' })
    expect(await page.locator('header').first().isVisible()).toBe(false)
    expect(await page.locator('[data-test=site-print]').isVisible()).toBe(false)
    await page.emulateMedia({ media: 'screen' })

    // the revision page links to it
    await page.goto(`/revisions/${fixture.revisionId}`)
    await page.waitForLoadState('networkidle')
    expect(await page.locator('[data-test=site-link]').getAttribute('href')).toBe(`/site/${reference}`)

    // once a later revision is approved, the site view of this one says first that it is superseded
    await setSheetInputs(fixture.sheetId, { ...DEMO_PS2, section: { ...DEMO_PS2.section, h: 280 } })
    const p02 = await issue(engineer, fixture.sheetId, { note: 'Deeper slab' })
    expect(p02.status).toBe(201)
    expect((await (await session('checker')).json('POST', `/api/revisions/${p02.body.id}/reviews`, { decision: 'approve' })).status).toBe(201)
    await page.goto(`/site/${reference}`)
    await page.waitForLoadState('networkidle')
    expect(await page.locator('[data-test=site-superseded]').innerText()).toMatch(/Superseded: do not build from C01\.\s*C02 is the current revision/)
    await screenshot(page, 'site-view-superseded-390')
    await context.close()
  })

  it('refuses a revision that is not approved, in words', async () => {
    const fixture = await approvedRevision()
    const engineer = await session('engineer')
    await setSheetInputs(fixture.sheetId, { ...DEMO_PS2, section: { ...DEMO_PS2.section, h: 270 } })
    const p02 = await issue(engineer, fixture.sheetId, { note: 'For check' })
    const print = await engineer.json('GET', `/api/revisions/${p02.body.id}/print`)
    const res = await engineer.json('GET', `/api/site/${print.body.titleBlock.verificationRef}`)
    expect(res.status).toBe(409)
    expect(res.body.message).toMatch(/P02 is issued for check, not approved: only an approved revision goes to site/)
  })
})
