// Every page of the product as each role reaches it, on records of a test's own: a project with a
// calc sheet, its P01 issued and approved (so the revision, the queue, the archive and the site
// view all have something to show). Used by the accessibility and layout tests.
import { readFileSync } from 'node:fs'
import { createRequire } from 'node:module'
import { expect } from 'vitest'
import type { Browser, Page } from 'playwright-core'
import { newPage, signInAs } from './browser'
import type { DEMO } from './client'
import { issue, makeSheet, session } from '../integration/records-fixtures'

export type Role = keyof typeof DEMO | 'visitor'
export interface PageVisit { role: Role, path: string, name: string, ready?: string }

export interface Fixture { projectId: number, sheetId: number, revisionId: number }

/** A project and sheet of the test's own, with P01 issued by the engineer and approved by the checker. */
export async function approvedRevision(): Promise<Fixture> {
  const { projectId, sheetId } = await makeSheet()
  const engineer = await session('engineer')
  const issued = await issue(engineer, sheetId, { note: 'For the page checks' })
  expect(issued.status).toBe(201)
  const checker = await session('checker')
  const approved = await checker.json('POST', `/api/revisions/${issued.body.id}/reviews`, { decision: 'approve' })
  expect(approved.status).toBe(201)
  return { projectId, sheetId, revisionId: issued.body.id as number }
}

/** The pages each role works on; `ready` is a selector that shows the page has its data. */
export function everyPage(f: Fixture): PageVisit[] {
  return [
    { role: 'visitor', path: '/signin', name: 'sign-in', ready: '#email' },
    { role: 'engineer', path: '/projects', name: 'projects', ready: 'main h1' },
    { role: 'engineer', path: `/projects/${f.projectId}`, name: 'project', ready: 'main h1' },
    { role: 'engineer', path: `/sheets/${f.sheetId}`, name: 'sheet editor', ready: '[data-test=check-summary]' },
    { role: 'engineer', path: `/revisions?sheet=${f.sheetId}`, name: 'revisions of a sheet', ready: '[data-test=revisions-table]' },
    { role: 'engineer', path: `/revisions/${f.revisionId}`, name: 'revision (author)', ready: '[data-test=frozen-report]' },
    { role: 'engineer', path: '/help/templates', name: 'template language', ready: '[data-test=template-doc]' },
    { role: 'engineer', path: '/mailbox', name: 'mailbox', ready: 'main h1' },
    { role: 'engineer', path: '/no-such-page', name: 'not found', ready: 'main h1' },
    { role: 'checker', path: '/checking', name: 'check queue', ready: '[data-test=check-queue]' },
    { role: 'checker', path: `/revisions/${f.revisionId}`, name: 'revision (checker)', ready: '[data-test=frozen-report]' },
    { role: 'checker', path: `/sheets/${f.sheetId}`, name: 'sheet (read only)', ready: '[data-test=check-summary]' },
    { role: 'records', path: '/archive', name: 'archive register', ready: 'main h1' },
    { role: 'records', path: '/verify', name: 'verify', ready: 'main h1' },
    { role: 'engineer', path: '/site', name: 'site schedules', ready: '[data-test=site-reference]' },
    { role: 'records', path: `/revisions/${f.revisionId}`, name: 'revision (records)', ready: '[data-test=frozen-report]' },
    { role: 'admin', path: '/admin/users', name: 'people', ready: '[data-test=users-table]' },
    { role: 'admin', path: '/admin/projects', name: 'project members', ready: 'main h1' },
    { role: 'admin', path: '/admin/templates', name: 'office templates', ready: 'main h1' },
    { role: 'admin', path: '/admin/office', name: 'office details', ready: 'main h1' },
  ]
}

/** One signed-in page per role, reused across that role's visits. */
export class RolePages {
  private pages = new Map<Role, Promise<Page>>()
  constructor(private browser: Browser) {}

  get(role: Role): Promise<Page> {
    let page = this.pages.get(role)
    if (!page) {
      page = (async () => {
        const p = await newPage(this.browser)
        if (role !== 'visitor') await signInAs(p, role)
        return p
      })()
      this.pages.set(role, page)
    }
    return page
  }
}

/** Opens a page and waits until its data is on screen and the network is quiet. */
export async function visit(page: Page, v: PageVisit) {
  await page.goto(v.path)
  await page.waitForLoadState('networkidle')
  if (v.ready) await page.waitForSelector(v.ready, { timeout: 30_000 })
}

const AXE_SOURCE = readFileSync(createRequire(import.meta.url).resolve('axe-core/axe.min.js'), 'utf8')
/** The WCAG 2.0, 2.1 and 2.2 rules at levels A and AA. */
export const WCAG_AA_TAGS = ['wcag2a', 'wcag2aa', 'wcag21a', 'wcag21aa', 'wcag22a', 'wcag22aa']

/** Runs axe-core in the page (its source injected, nothing fetched) and lists each violation by rule and element. */
export async function accessibilityViolations(page: Page): Promise<string[]> {
  await page.evaluate(AXE_SOURCE)
  const result = await page.evaluate(tags => (window as unknown as { axe: { run: (ctx: Document, o: object) => Promise<{ violations: Array<{ id: string, help: string, nodes: Array<{ target: string[], failureSummary?: string }> }> }> } }).axe.run(document, { runOnly: { type: 'tag', values: tags } }), WCAG_AA_TAGS)
  return result.violations.flatMap(v => v.nodes.map(n => `${v.id} (${v.help}) at ${n.target.join(' ')}: ${(n.failureSummary ?? '').replace(/\s+/g, ' ')}`))
}
