import { mkdtempSync, rmSync } from 'node:fs'
import { createServer, type Server } from 'node:http'
import { tmpdir } from 'node:os'
import { join } from 'node:path'
import { Piscina } from 'piscina'
import type { AddressInfo } from 'node:net'
import { PDFArray, PDFDict, PDFDocument, PDFHexString, PDFName, PDFString, type PDFObject } from 'pdf-lib'
import { afterAll, beforeAll, describe, expect, it, vi } from 'vitest'
import { sha256Hex } from '../../../server/utils/hashing'
import { footerTemplate, headerTemplate, type TitleBlock } from '../../../server/utils/print-templates'
import { buildRewriteWorker } from '../../../server/pdf-rewrite/build-worker'

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
    res.end(`<html><body><h1>PS-2 stresses</h1><p>sigma ok</p><table><tr><th>Check</th><th>Stage</th><th>Utilisation</th></tr><tr><td>Top fibre</td><td>transfer</td><td>0.36</td></tr><tr><th>Bottom fibre</th><td>service</td><td>0.81</td></tr></table><img src="${foreignOrigin}/tracker.png"><script>document.body.append('script ran')</script></body></html>`)
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

const nodeIds = (bytes: Uint8Array) => Buffer.from(bytes).toString('latin1').match(/\/ID \(node\d+\)/g) ?? []
const creationDate = async (bytes: Uint8Array) => (await PDFDocument.load(bytes, { updateMetadata: false })).getCreationDate()?.toISOString()

/** Structure-element ids as another render might number them: from another start, or in another order. */
const shifted = (offset: number) => (ids: string[]) => new Map(ids.map(id => [id, `node${String(Number(id.slice(4)) + offset).padStart(id.length - 4, '0')}`]))
const reversed = (ids: string[]) => new Map(ids.map((id, i) => [id, ids[ids.length - 1 - i]!]))

/** A copy of a rendered PDF as another render might have written it: other structure ids, dates and /ID. */
async function relabel(bytes: Uint8Array, change: { ids: (sorted: string[]) => Map<string, string>, date: Date, documentId: string }): Promise<Uint8Array> {
  const doc = await PDFDocument.load(bytes, { updateMetadata: false })
  const all = new Set<string>()
  const collect = (obj: PDFObject, depth: number) => {
    if (depth > 64) return
    if ((obj instanceof PDFString || obj instanceof PDFHexString) && /^node\d+$/.test(obj.decodeText())) all.add(obj.decodeText())
    else if (obj instanceof PDFDict) for (const [, value] of obj.entries()) collect(value, depth + 1)
    else if (obj instanceof PDFArray) for (let i = 0; i < obj.size(); i++) collect(obj.get(i), depth + 1)
  }
  const objects = doc.context.enumerateIndirectObjects().map(([, obj]) => obj)
  for (const obj of objects) collect(obj, 0)
  const map = change.ids([...all].sort())
  const visit = (obj: PDFObject, depth: number): PDFObject => {
    if (depth > 64) return obj
    if (obj instanceof PDFString || obj instanceof PDFHexString) {
      const next = map.get(obj.decodeText())
      return next === undefined ? obj : PDFString.of(next)
    }
    if (obj instanceof PDFDict) for (const [key, value] of obj.entries()) obj.set(key, visit(value, depth + 1))
    else if (obj instanceof PDFArray) for (let i = 0; i < obj.size(); i++) obj.set(i, visit(obj.get(i), depth + 1))
    return obj
  }
  for (const obj of objects) visit(obj, 0)
  doc.setCreationDate(change.date)
  doc.setModificationDate(change.date)
  const id = PDFHexString.of(change.documentId)
  doc.context.trailerInfo.ID = doc.context.obj([id, id])
  return doc.save({ useObjectStreams: false, addDefaultPage: false, updateFieldAppearances: false })
}

describe('PDF rendering (system Chromium)', { timeout: 60_000 }, () => {
  const job = () => ({ url: `${origin}/`, origin, cookies: [], headerTemplate: headerTemplate(block), footerTemplate: footerTemplate(block) })
  const meta = { title: 't', subject: 's', keywords: ['k'], date: new Date('2026-03-02T09:00:00Z'), documentId: 'ab'.repeat(16) }

  it.each([
    ['numbered from another start', shifted(4096)],
    ['numbered in another order', reversed],
  ])('turns two renders of one page into the same bytes whatever their dates, /ID and structure ids (%s)', async (_, ids) => {
    const a = await renderPdf(job())
    // Chromium does not promise how it numbers structure elements (ids are handed out lazily, some
    // while the page paints) nor what it writes as dates and /ID, so the second copy is made to
    // differ in all of them on purpose, instead of hoping that a second render does
    const b = await relabel(a, { ids, date: new Date('2031-07-09T17:45:00Z'), documentId: 'cd'.repeat(16) })
    expect(sha256Hex(a)).not.toBe(sha256Hex(b))
    expect(nodeIds(a).length).toBeGreaterThan(1)
    expect(nodeIds(b)).not.toEqual(nodeIds(a))
    expect(await creationDate(b)).not.toBe(await creationDate(a))
    const fixedA = await makeReproducible(a, meta)
    const fixedB = await makeReproducible(b, meta)
    expect(sha256Hex(fixedA.bytes)).toBe(sha256Hex(fixedB.bytes))
    expect(fixedA.pages).toBe(1)
    const doc = await PDFDocument.load(fixedA.bytes, { updateMetadata: false })
    expect(doc.getCreationDate()?.toISOString()).toBe('2026-03-02T09:00:00.000Z')
    expect(doc.getProducer()).toBe('Tendonbook')
    expect(nodeIds(fixedA.bytes)).toEqual([])
    // the id name tree still leads from each (renamed, sorted) id to the element that carries it
    const root = doc.context.lookup(doc.catalog.get(PDFName.of('StructTreeRoot'))) as PDFDict
    const names = (doc.context.lookup(root.get(PDFName.of('IDTree'))) as PDFDict).get(PDFName.of('Names')) as PDFArray
    const keys: string[] = []
    for (let i = 0; i < names.size(); i += 2) {
      const key = (names.get(i) as PDFString).decodeText()
      keys.push(key)
      expect(((doc.context.lookup(names.get(i + 1)) as PDFDict).get(PDFName.of('ID')) as PDFString).decodeText()).toBe(key)
    }
    expect(keys.length).toBe(nodeIds(a).length)
    expect(keys).toEqual([...keys].sort())
  })

  it('gives the same bytes for two fresh renders of one page, each made reproducible', async () => {
    const [a, b] = [await renderPdf(job()), await renderPdf(job())]
    const fixedA = await makeReproducible(a, meta)
    const fixedB = await makeReproducible(b, meta)
    expect(sha256Hex(fixedA.bytes)).toBe(sha256Hex(fixedB.bytes))
  })

  it('keeps a different page different once made reproducible', async () => {
    const a = await makeReproducible(await renderPdf(job()), meta)
    const other = await makeReproducible(await renderPdf({ ...job(), footerTemplate: footerTemplate({ ...block, contentHash: 'cd'.repeat(32) }) }), meta)
    expect(sha256Hex(other.bytes)).not.toBe(sha256Hex(a.bytes))
  })

  it('gives the same bytes and pages in the worker thread the built server runs it in as inline', async () => {
    const dir = mkdtempSync(join(tmpdir(), 'tb-pdf-worker-'))
    const filename = join(dir, 'worker.mjs')
    await buildRewriteWorker(filename)
    const pool = new Piscina({ filename, maxThreads: 1 })
    try {
      const raw = await renderPdf({ url: `${origin}/contents`, origin, cookies: [], headerTemplate: '<span></span>', footerTemplate: '<span></span>' })
      const inline = await makeReproducible(raw, meta)
      const threaded = await pool.run({ kind: 'reproducible', bytes: raw, meta }) as { bytes: Uint8Array, pages: number }
      expect(threaded.pages).toBe(3)
      expect(sha256Hex(threaded.bytes)).toBe(sha256Hex(inline.bytes))
      expect(new Map(await pool.run({ kind: 'destinations', bytes: raw }) as Array<[string, number]>)).toEqual(await namedDestinationPages(raw))
    }
    finally {
      await pool.destroy()
      rmSync(dir, { recursive: true, force: true })
    }
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
