// The checker's review in the browser: the diff a checker reads, the tallies in the queue and the
// revision list, the summary the frozen report opens with, its front page of results, and the
// comments carried forward to the next revision with their state and the return e-mail.
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import type { Browser } from 'playwright-core'
import { DEMO_PS2 } from '../../shared/engine/input/demo'
import { join } from 'node:path'
import { launch, newPage, SCREENSHOTS, signInAs } from '../helpers/browser'
import { DEMO } from '../helpers/client'
import { issue, makeSheet, session, setSheetInputs, waitForMail } from '../integration/records-fixtures'

let browser: Browser
/** The machine may be busy: give the page time. */
const poll = <T>(read: () => T | Promise<T>) => expect.poll(read, { timeout: 30_000, interval: 250 })
beforeAll(async () => { browser = await launch() })
afterAll(async () => { await browser?.close() })

/** Text with the narrow and thin spaces between numbers and units made plain. */
const plain = (text: string | null) => (text ?? '').replace(/[\u202f\u2009\u00a0]/g, ' ').replace(/\s+/g, ' ')

describe('the checker reviews a revision against the one before', () => {
  it('reads the diff by label and section, sees the tallies and the front page, and carries comments forward', { timeout: 600_000 }, async () => {
    const { sheetId } = await makeSheet()
    const engineer = await session('engineer')
    const p01 = await issue(engineer, sheetId, { note: 'First issue' })
    expect(p01.status).toBe(201)

    // the queue shows pass/fail counts and the governing utilisation
    const checker = await newPage(browser)
    await signInAs(checker, 'checker')
    await checker.goto('/checking')
    await checker.waitForLoadState('networkidle')
    const row = checker.locator('[data-test=check-queue] tbody tr', { hasText: 'P01' }).filter({ has: checker.locator(`a[href="/revisions/${p01.body.id}"]`) })
    await poll(() => row.locator('[data-test=check-tally]').textContent()).toMatch(/pass.*max \d\.\d\d/)

    // the frozen report opens with the summary of checks, then its own front page of results
    await checker.goto(`/revisions/${p01.body.id}`)
    await checker.waitForLoadState('networkidle')
    const summary = checker.locator('[data-test=check-summary]')
    await poll(() => summary.textContent()).toContain('Stresses at transfer')
    const summaryBox = (await summary.boundingBox())!
    const reportBox = (await checker.locator('[data-test=frozen-report]').boundingBox())!
    expect(summaryBox.y).toBeLessThan(reportBox.y)
    const front = checker.locator('[data-test=frozen-report] [data-overview]')
    expect(plain(await front.textContent())).toContain('Solid slab strip, 260 mm deep, 4 spans 7.80 / 9.60 / 9.60 / 7.80 m, C32/40')
    const targets = await front.locator('a.tb-xref').evaluateAll(links => links.map(a => a.getAttribute('href')!.slice(1)))
    expect(targets.length).toBeGreaterThan(8)
    for (const id of targets) expect(await checker.locator(`[data-test=frozen-report] [id="${id}"]`).count(), id).toBe(1)

    // return P01 with a comment on the load balancing section
    const anchor = await checker.locator('[data-test=comment-anchor-0] option', { hasText: 'Load balancing' }).first().getAttribute('value')
    await checker.selectOption('[data-test=comment-anchor-0]', anchor!)
    await checker.fill('[data-test=comment-text-0]', 'Justify the share of the self-weight balanced.\nQuote the clause.')
    await checker.click('[data-test=review-return]')
    await poll(() => checker.locator('[data-test=revision-status]').getAttribute('data-status')).toBe('returned')

    // the return e-mail names the section in words, quotes the comment and carries the caution
    const mail = await waitForMail(m => m.to.includes(DEMO.engineer.email) && m.raw.includes(`/revisions/${p01.body.id}`) && m.raw.includes('returned'))
    const body = mail.raw.replace(/=\r?\n/g, '')
    expect(body).toContain('On "Load balancing":')
    expect(body).toContain('> Justify the share of the self-weight balanced.')
    expect(body).toContain('> Quote the clause.')
    expect(body).not.toContain(`[${anchor}]`)
    expect(body).toContain('competent engineer to verify')

    // P02: the depth changes; the support eccentricities change too, but the profile is not custom, so they change nothing
    const supportEcc = DEMO_PS2.geometry.spans.map(() => 40).concat([40])
    await setSheetInputs(sheetId, { ...DEMO_PS2, section: { ...DEMO_PS2.section, h: 280 }, profile: { ...DEMO_PS2.profile, mode: 'deepest', supportEcc } })
    const p02 = await issue(engineer, sheetId, { note: 'Depth 280 mm after comments' })
    expect(p02.status).toBe(201)
    await checker.goto(`/revisions/${p02.body.id}`)
    await checker.waitForLoadState('networkidle')

    const inputs = checker.locator('[data-test=diff-inputs]')
    await poll(async () => plain(await inputs.textContent())).toContain('Overall depth')
    expect(plain(await inputs.textContent())).toMatch(/Overall depth\s*section\s*260 mm\s*280 mm/)
    expect(await inputs.textContent()).not.toContain('section.h')
    expect(await inputs.textContent()).not.toContain('Eccentricity at each support')
    expect(await inputs.locator('tbody tr').count()).toBe(1)

    // results by section of the report, governing values with units; the raw list stays folded
    const sections = checker.locator('[data-test=diff-sections] > div')
    expect(await sections.count()).toBeGreaterThan(2)
    const loads = checker.locator('[data-test=diff-sections] > div', { hasText: 'Loads' }).first()
    expect(plain(await loads.locator('[data-test=diff-governing]').textContent())).toMatch(/Self-weight\s*6\.50 kN\/m\s*7\.00 kN\/m\s*\+7\.7 %/)
    await checker.locator('[data-test=revision-diff]').screenshot({ path: join(SCREENSHOTS, 'review-diff.png'), timeout: 60_000 })
    const all = checker.locator('[data-test=diff-all]')
    expect(await all.getAttribute('open')).toBeNull()
    expect(await checker.locator('[data-test=diff-results]').isVisible()).toBe(false)
    await all.locator('summary').click()
    await poll(() => checker.locator('[data-test=diff-results]').isVisible()).toBe(true)
    expect(await checker.locator('[data-test=diff-results] tbody tr').count()).toBeGreaterThan(await checker.locator('[data-test=diff-governing] tbody tr').count())

    // P01's comment is carried forward, open; the checker closes it (a new state row, the thread reads closed)
    const thread = checker.locator('[data-test=comment-thread]', { hasText: 'Justify the share' })
    await poll(() => thread.getAttribute('data-state')).toBe('open')
    expect(await thread.textContent()).toContain('§ Load balancing')
    expect(await thread.textContent()).toContain('No reply from the engineer yet')
    await thread.locator('[data-test=close-comment]').click()
    await poll(() => thread.getAttribute('data-state')).toBe('closed')
    expect(await thread.textContent()).toContain('Closed by')
    await checker.locator('[data-test=comment-threads]').screenshot({ path: join(SCREENSHOTS, 'review-comments.png'), timeout: 60_000 })

    // closing it again is a conflict with history, said in words; the engineer may not close comments
    const again = await (await session('checker')).json('POST', `/api/reviews/${(await engineer.json('GET', `/api/revisions/${p02.body.id}`)).body.threads[0].reviewId}/comment-state`, { index: 0, state: 'closed' })
    expect(again.status).toBe(409)
    expect(again.body.message).toContain('already closed')
    const byEngineer = await engineer.json('POST', `/api/reviews/1/comment-state`, { index: 0, state: 'open' })
    expect(byEngineer.status).toBe(403)

    // the sheet's revision list carries the tallies too
    await checker.goto(`/revisions?sheet=${sheetId}`)
    await checker.waitForLoadState('networkidle')
    await poll(() => checker.locator('[data-test=revisions-table] [data-test=check-tally]').count()).toBe(2)
  })
})
