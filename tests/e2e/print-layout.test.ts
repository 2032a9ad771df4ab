// The printed revision: the office's details set on the admin page and frozen by the approval, the
// body across the title block's frame with nothing past the A4 content box, a contents list whose
// page numbers are the pages the headings print on, and the same bytes on every render.
import zlib from 'node:zlib'
import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest'
import type { Browser, Page } from 'playwright-core'
import { DEMO_BB1, DEMO_PS2 } from '../../shared/engine/input/demo'
import { launch, newPage, screenshot, signInAs } from '../helpers/browser'
import { issue, makeSheet, pdfText, session } from '../integration/records-fixtures'

let browser: Browser
/** The machine may be busy: give the page time. */
const poll = <T>(read: () => T | Promise<T>) => expect.poll(read, { timeout: 30_000, interval: 250 })
beforeAll(async () => { browser = await launch() })
afterAll(async () => { await browser?.close() })

/** A4 less the PDF's side margins (server/utils/print-templates.ts PAGE_MARGIN_MM), in CSS px. */
const CONTENT_WIDTH_PX = Math.round((210 - 2 * 12) / 25.4 * 96)

/** A small PNG (a two-colour bar), made here so the test needs no file. */
function png(width: number, height: number): Buffer {
  const table = Array.from({ length: 256 }, (_, n) => {
    let c = n
    for (let k = 0; k < 8; k++) c = c & 1 ? 0xEDB88320 ^ (c >>> 1) : c >>> 1
    return c >>> 0
  })
  const crc = (buf: Buffer) => {
    let x = 0xFFFFFFFF
    for (const b of buf) x = table[(x ^ b) & 0xFF]! ^ (x >>> 8)
    return (x ^ 0xFFFFFFFF) >>> 0
  }
  const chunk = (type: string, data: Buffer) => {
    const typed = Buffer.concat([Buffer.from(type), data])
    const len = Buffer.alloc(4)
    len.writeUInt32BE(data.length)
    const sum = Buffer.alloc(4)
    sum.writeUInt32BE(crc(typed))
    return Buffer.concat([len, typed, sum])
  }
  const header = Buffer.alloc(13)
  header.writeUInt32BE(width, 0)
  header.writeUInt32BE(height, 4)
  header[8] = 8
  header[9] = 2
  const rows: number[] = []
  for (let y = 0; y < height; y++) {
    rows.push(0)
    for (let x = 0; x < width; x++) rows.push(...(x < height ? [0xB4, 0x39, 0x09] : [0x24, 0x5F, 0x61]))
  }
  return Buffer.concat([Buffer.from([0x89, 0x50, 0x4E, 0x47, 0x0D, 0x0A, 0x1A, 0x0A]), chunk('IHDR', header), chunk('IDAT', zlib.deflateSync(Buffer.from(rows))), chunk('IEND', Buffer.alloc(0))])
}

/** Every element of the print page whose box runs past the content box, or that scrolls (paper cannot). */
async function overflowing(page: Page) {
  return page.evaluate(() => {
    const frame = document.querySelector('.print-page')!.getBoundingClientRect()
    const clippedBy = (el: Element) => {
      for (let a = el.parentElement; a && a !== document.body; a = a.parentElement) {
        const o = getComputedStyle(a).overflowX
        if ((o === 'hidden' || o === 'clip') && a.getBoundingClientRect().right <= frame.right + 0.5) return true
      }
      return false
    }
    const out: string[] = []
    for (const el of document.querySelectorAll('.print-page *')) {
      const box = el.getBoundingClientRect()
      if (box.width === 0 || clippedBy(el)) continue
      const style = getComputedStyle(el)
      const scrolls = (style.overflowX === 'auto' || style.overflowX === 'scroll') && el.scrollWidth > el.clientWidth + 1
      if (box.right > frame.right + 0.5 || box.left < frame.left - 0.5 || scrolls) out.push(`${el.tagName.toLowerCase()}.${String((el as HTMLElement).className)} "${(el.textContent ?? '').slice(0, 60)}" right ${Math.round(box.right - frame.right)} px`)
    }
    return { out, frame: frame.width, document: document.documentElement.scrollWidth }
  })
}

describe('printing a revision', () => {
  it('fits the A4 content box, numbers its contents, prints the office in force at approval and reprints the same bytes', { timeout: 600_000 }, async () => {
    // the admin sets the office's name and logo on the office-details page
    const admin = await newPage(browser)
    await signInAs(admin, 'admin')
    await admin.goto('/admin/office')
    await admin.waitForLoadState('networkidle')
    await admin.fill('#office-name', 'Harrow & Vane Structural Engineers')
    await admin.setInputFiles('#office-logo', { name: 'logo.png', mimeType: 'image/png', buffer: png(120, 40) })
    await admin.click('[data-test=office-save]')
    await poll(() => admin.locator('[data-test=office-name]').textContent()).toContain('Harrow & Vane Structural Engineers')
    await poll(() => admin.locator('[data-test=office-logo]').evaluate(img => (img as HTMLImageElement).naturalWidth)).toBe(120)
    // a file that only claims to be a PNG is refused by its content, and nothing is saved
    await admin.setInputFiles('#office-logo', { name: 'logo.png', mimeType: 'image/png', buffer: Buffer.from('%PDF-1.4 not an image') })
    await admin.fill('#office-name', 'Not saved')
    await admin.click('[data-test=office-save]')
    await poll(() => admin.locator('[data-test=notices]').textContent()).toContain('upload a PNG or JPEG image')
    expect(await admin.locator('[data-test=office-name]').textContent()).toContain('Harrow & Vane')
    await screenshot(admin, 'office-details')

    // the two demo sheets, issued and approved
    const engineer = await session('engineer')
    const checker = await session('checker')
    const approved: number[] = []
    for (const [inputs, kind] of [[DEMO_PS2, 'slab'], [DEMO_BB1, 'band-beam']] as const) {
      const { sheetId } = await makeSheet(inputs, kind)
      const issued = await issue(engineer, sheetId, { note: '' })
      expect(issued.status).toBe(201)
      expect((await checker.json('POST', `/api/revisions/${issued.body.id}/reviews`, { decision: 'approve', comments: [] })).status).toBe(201)
      approved.push(issued.body.id)
    }

    // the print page as sealing prints it (no script, print media) at the A4 content width: no element's box runs past the content box
    const signedIn = await newPage(browser)
    await signInAs(signedIn, 'records')
    const printing = await browser.newContext({ baseURL: inject('baseUrl'), javaScriptEnabled: false, viewport: { width: CONTENT_WIDTH_PX, height: 1100 } })
    await printing.addCookies(await signedIn.context().cookies())
    const records = await printing.newPage()
    await records.emulateMedia({ media: 'print' })
    for (const id of approved) {
      await records.goto(`/revisions/${id}/print`)
      await records.waitForLoadState('networkidle')
      expect(await records.locator('[data-test=print-contents] li').count()).toBeGreaterThan(10)
      const found = await overflowing(records)
      expect(found.out).toEqual([])
      expect(found.document).toBeLessThanOrEqual(CONTENT_WIDTH_PX)
      await screenshot(records, `print-${id}`)
      // opened by a person before any seal: no page numbers yet (no '00' placeholders), and a note that says so
      expect(new Set(await records.locator('.print-contents-page').allInnerTexts())).toEqual(new Set(['']))
      expect(await records.locator('a.tb-xref[data-page]').count()).toBe(0)
      expect(await records.locator('.print-contents h2').evaluate(h => getComputedStyle(h, '::after').content)).toContain('Page numbers are set when the PDF is made')
    }

    // sealing prints twice and numbers the contents with the pages the headings print on
    const clerk = await session('records')
    const sealed = await clerk.json('POST', `/api/revisions/${approved[0]}/seal`)
    expect(sealed.status, JSON.stringify(sealed.body).slice(0, 300)).toBe(201)
    const detail = sealed.body as { sections: Array<{ id: string, title: string, level: number }> }
    const pdf = new Uint8Array(await (await clerk.fetch(`/api/revisions/${approved[0]}/pdf`)).arrayBuffer())
    const { pages, numPages } = await pdfText(pdf)
    expect(numPages).toBe(sealed.body.seal.pages)
    for (const page of pages) expect(page).toContain('Harrow & Vane Structural Engineers')
    const contents = pages[0]!.replace(/\s+/g, ' ')
    expect(contents).toContain('Contents')
    let checked = 0
    const printedPage = new Map<string, number>()
    for (const s of detail.sections.filter(x => x.level === 1)) {
      const listed = new RegExp(`${s.title.replace(/[.*+?^${}()|[\]\\]/g, '\\$&')} (\\d+)`).exec(contents)
      expect(listed, s.title).not.toBeNull()
      const page = Number(listed![1])
      printedPage.set(s.id, page)
      expect(page).toBeGreaterThan(1)
      expect(pages[page - 1]!.replace(/\s+/g, ' '), `${s.title} on page ${page}`).toContain(s.title)
      checked += 1
    }
    expect(checked).toBeGreaterThan(10)
    // the front page refers to sections by page too
    expect(pages.join(' ').replace(/\s+/g, ' ')).toMatch(/Load balancing ?, p\. \d+/)

    // the office renames itself: the sealed revision still re-renders to the same bytes, with the old name
    await admin.goto('/admin/office')
    await admin.waitForLoadState('networkidle')
    await admin.fill('#office-name', 'Vane Partners')
    await admin.setInputFiles('#office-logo', [])
    await admin.click('[data-test=office-save]')
    await poll(() => admin.locator('[data-test=office-name]').textContent()).toContain('Vane Partners')
    const recheck = await clerk.json('POST', `/api/revisions/${approved[0]}/reseal-check`)
    expect(recheck.status).toBe(200)
    expect(recheck.body.identical).toBe(true)
    const print = await clerk.fetch(`/revisions/${approved[0]}/print`)
    const printHtml = await print.text()
    expect(printHtml).toContain('Harrow &amp; Vane Structural Engineers')
    // the print view of a sealed revision lists the pages its sealed PDF printed
    const viewPages = new Map([...printHtml.matchAll(/<a href="#([^"]+)">[^<]*<\/a><span class="print-contents-leader"><\/span><span class="print-contents-page">(\d*)<\/span>/g)].map(m => [m[1]!, Number(m[2])]))
    for (const [id, page] of printedPage) expect(viewPages.get(id), id).toBe(page)
    expect(printHtml).not.toMatch(/<nav[^>]*print-contents-unnumbered/)
  })
})
