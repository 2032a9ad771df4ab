import { createServer, type Server } from 'node:http'
import type { AddressInfo } from 'node:net'
import { PDFDocument } from 'pdf-lib'
import { afterAll, beforeAll, describe, expect, it, vi } from 'vitest'
import { sha256Hex } from '../../../server/utils/hashing'
import { footerTemplate, headerTemplate, type TitleBlock } from '../../../server/utils/print-templates'

// renderPdf reads the Chromium path from the Nitro runtime config
vi.stubGlobal('useRuntimeConfig', () => ({ chromiumPath: '/usr/bin/chromium' }))
const { closeBrowser, makeReproducible, namedDestinationPages, renderPdf, PdfRenderError } = await import('../../../server/utils/pdf')

let own: Server
let foreign: Server
let foreignHits = 0
let origin = ''
let foreignOrigin = ''

const listen = (s: Server) => new Promise<string>(r => s.listen(0, '127.0.0.1', () => r(`http://127.0.0.1:${(s.address() as AddressInfo).port}`)))

beforeAll(async () => {
  foreign = createServer((_, res) => { foreignHits += 1; res.end('') })
  foreignOrigin = await listen(foreign)
  own = createServer((req, res) => {
    if (req.url === '/missing') {
      res.statusCode = 404
      res.end('no')
      return
    }
    res.setHeader('content-type', 'text/html')
    if (req.url === '/contents') {
      res.end('<html><body><p><a href="#first">First</a> <a href="#third">Third</a></p><h1 id="first">First</h1><h1 id="second" style="break-before:page">Second</h1><h1 id="third" style="break-before:page">Third</h1></body></html>')
      return
    }
    res.end(`<html><body><h1>PS-2 stresses</h1><p>sigma ok</p><table><tr><th>Check</th><th>Utilisation</th></tr><tr><td>Top fibre</td><td>0.36</td></tr></table><img src="${foreignOrigin}/tracker.png"><script>document.body.append('script ran')</script></body></html>`)
  })
  origin = await listen(own)
})
afterAll(async () => {
  await closeBrowser()
  own.close()
  foreign.close()
})

const block: TitleBlock = {
  office: 'Harrow & Vane <Structures>', officeLogo: null, projectName: 'Alder Yard podium', jobNumber: '2417', client: '', site: '', sheetReference: 'PS-2', title: 'Podium slab strip <b>',
  partOfStructure: 'Level 1', revision: 'C01 (checked as P02)', status: 'A1 Approved', madeBy: 'P. N.', madeOn: '2026-03-01',
  checkedBy: 'T. O.', checkedOn: '2026-03-02', archiveRef: '2417-PS-2-C01', contentHash: 'ab'.repeat(32), verificationRef: 'TB-ABAB-ABAB-ABAB',
}

describe('PDF rendering (system Chromium)', { timeout: 60_000 }, () => {
  it('gives byte-identical files for the same page once dates and /ID are fixed', async () => {
    const job = { url: `${origin}/`, origin, cookies: [], headerTemplate: headerTemplate(block), footerTemplate: footerTemplate(block) }
    // two pages at once share a renderer process, whose DOM node counter tagged PDFs use for ids
    const [a, b] = await Promise.all([renderPdf(job), new Promise(r => setTimeout(r, 1100)).then(() => renderPdf(job))])
    expect(sha256Hex(a)).not.toBe(sha256Hex(b))
    const nodeIds = (bytes: Uint8Array) => Buffer.from(bytes).toString('latin1').match(/\/ID \(node\d+\)/g) ?? []
    expect(nodeIds(a).length).toBeGreaterThan(0)
    expect(nodeIds(a)).not.toEqual(nodeIds(b))
    const meta = { title: 't', subject: 's', keywords: ['k'], date: new Date('2026-03-02T09:00:00Z'), documentId: 'ab'.repeat(16) }
    const fixedA = await makeReproducible(a, meta)
    const fixedB = await makeReproducible(b, meta)
    expect(sha256Hex(fixedA.bytes)).toBe(sha256Hex(fixedB.bytes))
    expect(fixedA.pages).toBe(1)
    const doc = await PDFDocument.load(fixedA.bytes, { updateMetadata: false })
    expect(doc.getCreationDate()?.toISOString()).toBe('2026-03-02T09:00:00.000Z')
    expect(doc.getProducer()).toBe('Tendonbook')
  })

  it('runs no script and reaches no other origin', async () => {
    foreignHits = 0
    const bytes = await renderPdf({ url: `${origin}/`, origin, cookies: [], headerTemplate: '<span></span>', footerTemplate: '<span></span>' })
    const pdfjs = await import('pdfjs-dist/legacy/build/pdf.mjs')
    const doc = await pdfjs.getDocument({ data: new Uint8Array(bytes) }).promise
    const page = await doc.getPage(1)
    const text = (await page.getTextContent()).items.map(i => ('str' in i ? i.str : '')).join(' ')
    expect(text).toContain('PS-2 stresses')
    expect(text).not.toContain('script ran')
    expect(foreignHits).toBe(0)
  })

  it('says why when the page fails', async () => {
    await expect(renderPdf({ url: `${origin}/missing`, origin, cookies: [], headerTemplate: '', footerTemplate: '' })).rejects.toThrow(PdfRenderError)
    await expect(renderPdf({ url: `${origin}/missing`, origin, cookies: [], headerTemplate: '', footerTemplate: '' })).rejects.toThrow('404')
  })

  it('tells the page of every heading a link of the document points to', async () => {
    const bytes = await renderPdf({ url: `${origin}/contents`, origin, cookies: [], headerTemplate: '<span></span>', footerTemplate: '<span></span>' })
    const pages = await namedDestinationPages(bytes)
    expect(pages.get('first')).toBe(1)
    expect(pages.get('third')).toBe(3)
    // no link points to the second heading, so it has no destination
    expect(pages.has('second')).toBe(false)
  })

  it('puts the office in the title block, and a logo only as a PNG or JPEG data URL', () => {
    expect(headerTemplate(block)).toContain('Harrow &amp; Vane &lt;Structures&gt;')
    const png = 'data:image/png;base64,iVBORw0KGgo='
    expect(headerTemplate({ ...block, officeLogo: png })).toContain(`<img src="${png}"`)
    expect(headerTemplate({ ...block, officeLogo: 'data:image/svg+xml;base64,PHN2Zz4=' })).not.toContain('<img')
    expect(headerTemplate({ ...block, officeLogo: 'https://elsewhere.example/logo.png' })).not.toContain('<img')
  })

  it('escapes title block text', () => {
    expect(headerTemplate(block)).toContain('Podium slab strip &lt;b&gt;')
    expect(headerTemplate(block)).toContain('class="pageNumber"')
    expect(footerTemplate(block)).toContain(block.contentHash)
    expect(footerTemplate(block)).toContain('competent engineer')
  })
})
