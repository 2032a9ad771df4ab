import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import type { Browser } from 'playwright-core'
import { launch, newPage, screenshot, signInAs } from '../helpers/browser'
import { makeSheet, newPerson } from '../integration/records-fixtures'

let browser: Browser
beforeAll(async () => { browser = await launch() })
afterAll(async () => { await browser?.close() })

describe('project members in the browser', () => {
  it('lets the administrator put a person on a project, who then finds it listed with its check queue', async () => {
    const { projectId, jobNumber } = await makeSheet()
    const person = await newPerson('engineer', `Engineer ${Date.now().toString(36)}`)
    const admin = await newPage(browser)
    await signInAs(admin, 'admin')
    await admin.goto('/admin/projects')
    await admin.waitForLoadState('networkidle')
    const card = admin.locator(`[data-test=members-${jobNumber}]`)
    await card.locator(`#add-${projectId}`).selectOption(String(person.id))
    // the person's own role is proposed; on this job they check
    expect(await card.locator(`#add-role-${projectId}`).inputValue()).toBe('engineer')
    await card.locator(`#add-role-${projectId}`).selectOption('checker')
    await card.locator('button[type=submit]').click()
    await expect.poll(() => admin.locator('[data-test=notices]').textContent()).toContain('is checker on Alder Yard podium')
    await expect.poll(() => card.textContent()).toContain(person.email)
    await screenshot(admin, 'project-members')

    const page = await newPage(browser)
    await page.goto('/signin')
    await page.waitForLoadState('networkidle')
    await page.fill('#email', person.email)
    await page.fill('#password', 'a-long-enough-password')
    await page.click('button[type=submit]')
    await page.waitForURL(url => !url.pathname.startsWith('/signin'))
    await page.goto('/projects')
    await expect.poll(() => page.locator('[data-test=projects-table]').textContent()).toContain(jobNumber)
    await expect.poll(() => page.locator('header nav').textContent()).toContain('Check queue')
  })
})
