import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import type { Browser } from 'playwright-core'
import { launch, newPage, screenshot, signInAs } from '../helpers/browser'

let browser: Browser
beforeAll(async () => { browser = await launch() })
afterAll(async () => { await browser?.close() })

describe('projects in the browser', () => {
  it('sends a visitor to the sign-in page and back after signing in', async () => {
    const page = await newPage(browser)
    await page.goto('/projects')
    await page.waitForURL(/\/signin/)
    await screenshot(page, 'signin')
    await signInAs(page, 'engineer')
    await expect.poll(() => page.locator('[data-test=current-user]').textContent()).toBe('Priya Natarajan')
  })

  it('lets the demo engineer create a project and see it listed', async () => {
    const page = await newPage(browser)
    await signInAs(page, 'engineer')
    await page.goto('/projects')
    const job = `E2E-${Date.now().toString(36)}`

    await page.click('[data-test=project-form] button[type=submit]')
    await expect.poll(() => page.locator('[data-test=error-jobNumber]').textContent()).toContain('Enter the job number')

    await page.fill('#project-jobNumber', job)
    await page.fill('#project-name', 'Riverside deck extension')
    await page.fill('#project-client', 'Example client')
    await page.click('[data-test=project-form] button[type=submit]')
    await page.waitForURL(/\/projects\/\d+$/)
    await expect.poll(() => page.locator('h1').textContent()).toContain('Riverside deck extension')

    await page.goto('/projects')
    await expect.poll(() => page.locator('[data-test=projects-table]').textContent()).toContain(job)
    await screenshot(page, 'projects-list')
  })

  it('shows our own 404 page for an unknown address', async () => {
    const page = await newPage(browser)
    await signInAs(page, 'engineer')
    const res = await page.goto('/no/such/page')
    expect(res?.status()).toBe(404)
    await expect.poll(() => page.locator('[data-test=error-title]').textContent()).toContain('No such page')
  })
})
