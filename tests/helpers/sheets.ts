// Calc sheets for end-to-end tests: a sheet of a test's own in the demo project, and opening it.
import { expect } from 'vitest'
import type { Browser, Page } from 'playwright-core'
import { newPage, signInAs } from './browser'
import { signedIn } from './client'

export async function demoProjectId() {
  const client = await signedIn('engineer')
  const projects = (await client.get('/api/projects')).body as Array<{ id: number, jobNumber: string }>
  return projects.find(p => p.jobNumber === '2417')!.id
}

/** A new slab-strip sheet with the template's starter inputs (PS-2's), so tests never share a draft. */
export async function ownSheet(reference: string) {
  const client = await signedIn('engineer')
  const templates = (await client.get('/api/templates')).body as Array<{ id: number, slug: string }>
  const created = await client.post(`/api/projects/${await demoProjectId()}/sheets`, { reference: `${reference}-${Date.now().toString(36)}`, title: 'Test slab strip', templateId: templates.find(t => t.slug === 'pt-slab-strip')!.id })
  expect(created.status).toBe(201)
  return (created.body as { id: number }).id
}

/** Opens the editor and waits for the report and the check summary. */
export async function openSheet(page: Page, id: number) {
  await page.goto(`/sheets/${id}`)
  await page.waitForSelector('[data-test=report] h1, [data-test=report] h2')
  await page.waitForSelector('[data-test=check-summary]')
}

/** A new browser page, signed in as the demo engineer, on the editor of sheet `id`. */
export async function editorAsEngineer(browser: Browser, id: number) {
  const page = await newPage(browser)
  await signInAs(page, 'engineer')
  await openSheet(page, id)
  return page
}

/** Too few tendons (a slab strip's spacing of 1.5 m): the stress checks fail. */
export async function spaceTendonsWide(page: Page) {
  const spacing = page.locator('[data-path="tendon.spacing"] input')
  await spacing.fill('1500')
  await spacing.blur()
  await expect.poll(() => page.locator('[data-test=check-state]').innerText(), { timeout: 10_000 }).toMatch(/checks fail/)
  return spacing
}
