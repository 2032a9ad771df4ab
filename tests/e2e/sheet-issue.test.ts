import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import type { Browser } from 'playwright-core'
import { launch, newPage, screenshot, signInAs } from '../helpers/browser'
import { signedIn } from '../helpers/client'
import { editorAsEngineer, openSheet, ownSheet, spaceTendonsWide } from '../helpers/sheets'

let browser: Browser
beforeAll(async () => { browser = await launch() })
afterAll(async () => { await browser?.close() })

describe('issuing from the editor', () => {
  it('asks for a reason before issuing with failing checks, freezes it and shows it to the checker', async () => {
    const id = await ownSheet('FAIL')
    const page = await editorAsEngineer(browser, id)
    await spaceTendonsWide(page)
    await expect.poll(() => page.locator('[data-test=save-state]').innerText(), { timeout: 10_000 }).toMatch(/^Saved/)

    await page.locator('[data-test=issue-revision]').click()
    await expect.poll(() => page.locator('[data-test=issue-failing-checks] li').count()).toBeGreaterThan(0)
    await page.locator('[data-test=issue-confirm]').click()
    await expect.poll(() => page.locator('[data-test=issue-reason-error]').innerText()).toContain('Give the reason')
    const client = await signedIn('engineer')
    expect(((await client.get(`/api/sheets/${id}/revisions`)).body as unknown[]).length).toBe(0)

    await page.fill('[data-test=issue-reason]', 'Issued for the checker to see the stress state before the tendon layout meeting.')
    await expect.poll(() => page.locator('[data-test=issue-reason-error]').count()).toBe(0)
    await screenshot(page, 'sheet-issue-failing-checks')
    await page.locator('[data-test=issue-confirm]').click()
    await expect.poll(() => page.locator('[data-test=issue-ok]').textContent(), { timeout: 20_000 }).toContain('P01 issued for check')
    // the revisions table shows the date as the office reads it
    expect((await page.locator('[data-test=revisions-table] tbody tr [data-test=revision-issued]').first().innerText()).trim()).toMatch(/^\d\d\/\d\d\/\d{4}, \d\d:\d\d$/)

    const revisionId = ((await client.get(`/api/sheets/${id}/revisions`)).body as Array<{ id: number }>)[0]!.id
    const checker = await newPage(browser)
    await signInAs(checker, 'checker')
    await checker.goto(`/revisions/${revisionId}`)
    await expect.poll(() => checker.locator('[data-test=failing-checks-reason]').innerText()).toContain('tendon layout meeting')
    await screenshot(checker, 'revision-failing-checks-reason')
  })

  it('shows the checker\'s returned comments in the editor, linked to their sections, and sends the replies with the next issue', async () => {
    const id = await ownSheet('RET')
    const engineer = await signedIn('engineer')
    const p01 = await engineer.issue(id, { note: 'First issue' })
    expect(p01.status).toBe(201)
    const rev = p01.body as { id: number, sections: Array<{ id: string, title: string }> }
    const section = rev.sections.find(s => /Loads/.test(s.title))!
    const checker = await signedIn('checker')
    const returned = await checker.post(`/api/revisions/${rev.id}/reviews`, { decision: 'return', comments: [{ anchor: section.id, text: 'State the partition allowance in the superimposed dead load.' }, { anchor: '', text: 'Add the fire resistance period to the scope.' }] })
    expect(returned.status).toBe(201)

    const page = await editorAsEngineer(browser, id)
    const banner = page.locator('[data-test=returned-comments]')
    await expect.poll(() => banner.innerText()).toContain('P01 was returned with 2 comments')
    expect(await banner.innerText()).toContain('State the partition allowance')
    await banner.locator('[data-test=comment-section]').first().click()
    // the link leads to that section of the live report
    await expect.poll(() => page.evaluate(id => { const el = document.getElementById(id); return el ? Math.abs(el.getBoundingClientRect().top) < 200 : false }, section.id), { timeout: 5000 }).toBe(true)
    await banner.locator('[data-test=comment-reply]').first().fill('Added 1.0 kN/m² for partitions to the superimposed dead load.')
    await screenshot(page, 'sheet-returned-comments')
    // a reload keeps the reply being written
    await openSheet(page, id)
    await expect.poll(() => page.locator('[data-test=comment-reply]').first().inputValue()).toContain('1.0 kN/m² for partitions')

    await page.locator('[data-test=issue-revision]').click()
    await expect.poll(() => page.locator('[data-test=issue-ok]').textContent(), { timeout: 20_000 }).toContain('P02 issued for check')
    await expect.poll(() => page.locator('[data-test=returned-comments]').count()).toBe(0)

    const p02 = ((await engineer.get(`/api/sheets/${id}/revisions`)).body as Array<{ id: number, code: string }>).find(r => r.code === 'P02')!
    const checkerPage = await newPage(browser)
    await signInAs(checkerPage, 'checker')
    await checkerPage.goto(`/revisions/${p02.id}`)
    // the reply is shown once, under the comment it answers (strict: exactly one thread has replies)
    const replies = checkerPage.locator('[data-test=comment-thread]').filter({ has: checkerPage.locator('[data-test=comment-replies]') })
    await expect.poll(() => replies.innerText()).toContain('Added 1.0 kN/m² for partitions')
    expect(await replies.innerText()).toContain('State the partition allowance')
    expect(await replies.innerText()).not.toContain('fire resistance')
    expect(await replies.getAttribute('data-state')).toBe('answered')
    expect(await checkerPage.locator('[data-test=comment-replies]').count()).toBe(1)
    await screenshot(checkerPage, 'revision-replies')
  })
})
