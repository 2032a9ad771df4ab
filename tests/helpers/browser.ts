// The real Chromium from Debian, driven by playwright-core, for end-to-end tests.
import { mkdirSync } from 'node:fs'
import { join, resolve } from 'node:path'
import { chromium, type Browser, type Page } from 'playwright-core'
import { inject } from 'vitest'
import { DEMO } from './client'

export const SCREENSHOTS = resolve(import.meta.dirname, '..', 'e2e', '__screenshots__')

export async function launch(): Promise<Browser> {
  return chromium.launch({
    executablePath: '/usr/bin/chromium',
    headless: true,
    args: ['--no-sandbox', '--disable-gpu', '--disable-dev-shm-usage', '--disable-background-networking',
      '--disable-component-update', '--disable-sync', '--no-first-run', '--disable-quic'],
  })
}

export async function newPage(browser: Browser): Promise<Page> {
  const context = await browser.newContext({ baseURL: inject('baseUrl'), viewport: { width: 1440, height: 900 } })
  return context.newPage()
}

export async function signInAs(page: Page, role: keyof typeof DEMO) {
  await page.goto('/signin')
  await page.waitForLoadState('networkidle')
  await page.fill('#email', DEMO[role].email)
  await page.fill('#password', DEMO[role].password)
  await page.click('button[type=submit]')
  await page.waitForURL(url => !url.pathname.startsWith('/signin'))
}

export async function screenshot(page: Page, name: string) {
  mkdirSync(SCREENSHOTS, { recursive: true })
  const path = join(SCREENSHOTS, `${name}.png`)
  await page.screenshot({ path, fullPage: true })
  return path
}
