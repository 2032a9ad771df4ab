// PDF rendering with puppeteer-core and the system Chromium: one browser for the process (relaunched
// when it goes away), a fresh page per job, only our own origin reachable, a deadline per job.
import { availableParallelism } from 'node:os'
import puppeteer, { type Browser, type BrowserContext, type Page } from 'puppeteer-core'
import { PDFArray, PDFDict, PDFDocument, PDFHexString, PDFName, PDFRef, PDFString, type PDFObject } from 'pdf-lib'
import { PAGE_MARGIN_MM } from './print-templates'

const LAUNCH_ARGS = [
  '--no-sandbox', '--disable-gpu', '--disable-dev-shm-usage', '--disable-background-networking',
  '--disable-component-update', '--disable-sync', '--no-first-run', '--disable-quic',
]

let browser: Promise<Browser> | null = null

function useBrowser(): Promise<Browser> {
  if (!browser) {
    const launching = puppeteer.launch({ executablePath: useRuntimeConfig().chromiumPath || '/usr/bin/chromium', headless: true, args: LAUNCH_ARGS })
    browser = launching
    launching.then(b => b.on('disconnected', () => {
      if (browser === launching) browser = null
    })).catch(() => {
      if (browser === launching) browser = null
    })
  }
  return browser
}

/** Closes the shared browser (server shutdown, tests). */
export async function closeBrowser() {
  const current = browser
  browser = null
  idleTabs.length = 0
  if (current) await (await current.catch(() => null))?.close()
}

export class PdfRenderError extends Error {
  constructor(message: string) {
    super(message)
    this.name = 'PdfRenderError'
  }
}

export interface PdfJob {
  /** the page to print, on `origin` */
  url: string
  origin: string
  cookies: Array<{ name: string, value: string }>
  headerTemplate: string
  footerTemplate: string
  timeoutMs?: number
  /** receives the page's HTML as it stood when printing began (kept to explain a render that differs) */
  onHtml?: (html: string) => void
  /** nobody waits for it: it runs only when no one else's render waits (RenderGate.runInBackground) */
  background?: boolean
  /** called when the job gets its slot, before it renders; throwing there gives the slot back unrendered */
  onStart?: () => void
}

/** The origin Chromium reaches this server on: the loopback address it listens on. */
export function printOrigin() {
  return process.env.TENDONBOOK_PRINT_ORIGIN || `http://127.0.0.1:${process.env.PORT || process.env.NITRO_PORT || 3000}`
}

/** This server cannot take another render now; `retryAfterSeconds` is a fair wait before trying again. */
export class PdfBusyError extends PdfRenderError {
  constructor(readonly retryAfterSeconds: number) {
    super(`the PDF renderer of this server is busy with other documents: try again in ${retryAfterSeconds} s`)
    this.name = 'PdfBusyError'
  }
}

/**
 * At most `slots` jobs at once and `queue` more waiting in arrival order; beyond that a job is
 * refused at once (PdfBusyError) rather than left waiting behind work it cannot see the end of.
 * Work nobody waits for (`runInBackground`) gets a slot only when no job is waiting, so it never
 * delays a person's render by more than the one it is running.
 */
export class RenderGate {
  private running = 0
  private waiting: Array<() => void> = []
  private background: Array<() => void> = []
  constructor(readonly slots: number, readonly queue: number, readonly retryAfterSeconds = 10, readonly backgroundQueue = 16) {}

  async run<T>(job: () => Promise<T>): Promise<T> {
    if (this.running >= this.slots) {
      if (this.waiting.length >= this.queue) throw new PdfBusyError(this.retryAfterSeconds)
      await new Promise<void>(resolve => this.waiting.push(resolve))
    }
    else {
      this.running += 1
    }
    return this.holding(job)
  }

  /** Runs a job when a slot is free and no one waits for one; refused (PdfBusyError) when `backgroundQueue` such jobs already wait. */
  async runInBackground<T>(job: () => Promise<T>): Promise<T> {
    if (this.running >= this.slots || this.waiting.length) {
      if (this.background.length >= this.backgroundQueue) throw new PdfBusyError(this.retryAfterSeconds)
      await new Promise<void>(resolve => this.background.push(resolve))
    }
    else {
      this.running += 1
    }
    return this.holding(job)
  }

  private async holding<T>(job: () => Promise<T>): Promise<T> {
    try {
      return await job()
    }
    finally {
      // hand the slot straight to the next in line (people first), or give it back
      const next = this.waiting.shift() ?? this.background.shift()
      if (next) next()
      else this.running -= 1
    }
  }

  get load() {
    return { running: this.running, waiting: this.waiting.length, background: this.background.length }
  }
}

const positive = (raw: string | undefined, fallback: number) => (Number.isInteger(Number(raw)) && Number(raw) > 0 ? Number(raw) : fallback)

/** Per server: as many renders as cores (TENDONBOOK_PDF_RENDERS), a few more queued (TENDONBOOK_PDF_QUEUE). */
const gate = new RenderGate(positive(process.env.TENDONBOOK_PDF_RENDERS, availableParallelism()), positive(process.env.TENDONBOOK_PDF_QUEUE, 4))

/** @throws PdfBusyError when this server's renders and queue are full; PdfRenderError saying why (page status, deadline, browser failure). */
export function renderPdf(job: PdfJob): Promise<Uint8Array> {
  return job.background ? gate.runInBackground(() => renderNow(job)) : gate.run(() => renderNow(job))
}

/**
 * A print tab kept open between renders: its own browser context (so one job's session cookie is
 * never another's), scripts off, and every request outside `origin` refused. A tab that has printed
 * once keeps the print page's stylesheet and fonts decoded, which a fresh tab loads again each time
 * (about a second of each render); the next job's page replaces the document, so nothing but those
 * caches carries over.
 */
interface PrintTab {
  browser: Browser
  context: BrowserContext
  page: Page
  origin: string
}

const idleTabs: PrintTab[] = []

async function openTab(b: Browser, origin: string): Promise<PrintTab> {
  const context = await b.createBrowserContext()
  try {
    const page = await context.newPage()
    // the print page is static HTML and CSS: no script runs in it
    await page.setJavaScriptEnabled(false)
    await page.setRequestInterception(true)
    page.on('request', (request) => {
      let allowed = false
      try {
        allowed = new URL(request.url()).origin === origin
      }
      catch {}
      if (allowed) void request.continue()
      else void request.abort('blockedbyclient')
    })
    return { browser: b, context, page, origin }
  }
  catch (error) {
    await context.close().catch(() => {})
    throw error
  }
}

/** An idle tab of this browser for this origin, or a new one; tabs of a browser that went away are dropped. */
async function takeTab(b: Browser, origin: string): Promise<PrintTab> {
  while (idleTabs.length) {
    const tab = idleTabs.pop()!
    if (tab.browser === b && tab.origin === origin && b.connected && !tab.page.isClosed()) return tab
    await tab.context.close().catch(() => {})
  }
  return openTab(b, origin)
}

/** Whether a render started now would run at once rather than wait in the queue. */
export function pdfSlotFree() {
  return gate.load.running < gate.slots
}

async function renderNow(job: PdfJob): Promise<Uint8Array> {
  job.onStart?.()
  const timeoutMs = job.timeoutMs ?? 30_000
  const b = await useBrowser().catch((error: unknown) => {
    throw new PdfRenderError(`Chromium could not start: ${error instanceof Error ? error.message : String(error)}`)
  })
  const tab = await takeTab(b, job.origin)
  const { page, context } = tab
  let timer: NodeJS.Timeout | undefined
  const deadline = new Promise<never>((_, reject) => {
    timer = setTimeout(() => reject(new PdfRenderError(`rendering took longer than ${timeoutMs / 1000} s`)), timeoutMs)
  })
  let clean = false
  const work = (async () => {
    if (job.cookies.length) await context.setCookie(...job.cookies.map(c => ({ ...c, domain: new URL(job.origin).hostname, path: '/' })))
    // the load event: the page and its stylesheets and images are in (no script runs to fetch more,
    // and the fonts are loaded below), so there is nothing to gain from waiting for the network to
    // fall idle, which costs half a second per render
    const response = await page.goto(job.url, { waitUntil: 'load', timeout: timeoutMs })
    if (!response) throw new PdfRenderError('the print page gave no response')
    if (!response.ok()) throw new PdfRenderError(`the print page answered ${response.status()} ${response.statusText()}`)
    // load every declared face, not only those layout has asked for so far: under load a face can
    // still be on its way when printing starts, and the bytes would then differ between renders
    await page.evaluate(async () => {
      await Promise.all([...(document.fonts as unknown as Iterable<FontFace>)].map(face => face.load().catch(() => null)))
      await document.fonts.ready
    })
    if (job.onHtml) job.onHtml(await page.content())
    const pdf = await page.pdf({
      format: 'A4',
      printBackground: true,
      displayHeaderFooter: true,
      headerTemplate: job.headerTemplate,
      footerTemplate: job.footerTemplate,
      margin: { top: `${PAGE_MARGIN_MM.top}mm`, bottom: `${PAGE_MARGIN_MM.bottom}mm`, left: `${PAGE_MARGIN_MM.side}mm`, right: `${PAGE_MARGIN_MM.side}mm` },
      timeout: timeoutMs,
    })
    clean = true
    return new Uint8Array(pdf)
  })()
  work.catch(() => {}) // when the deadline has answered first, its failure has no one to tell
  try {
    return await Promise.race([work, deadline])
  }
  catch (error) {
    if (error instanceof PdfRenderError) throw error
    throw new PdfRenderError(error instanceof Error ? error.message : String(error))
  }
  finally {
    clearTimeout(timer)
    // a tab that printed goes back for the next job without this job's cookies; one that failed or
    // ran out of time is closed (its work may still be running)
    const kept = clean && !page.isClosed() && await context.cookies().then(async (left) => {
      if (left.length) await context.deleteCookie(...left)
      return true
    }, () => false)
    if (kept) idleTabs.push(tab)
    else await context.close().catch(() => {})
  }
}

/**
 * pdf-lib waits a macrotask (setTimeout 0, at least a millisecond in Node) after every 100 objects
 * it parses and every 50 it writes; a sealed sheet has thousands, so by default most of a rewrite
 * was spent waiting (load + save ~430 ms of an 1.1 MB demo sheet, ~130 ms at 500 per wait, same
 * bytes). 500 objects still hand the event loop back every 10–20 ms for other requests.
 */
const OBJECTS_PER_WAIT = 500

export interface FixedMetadata {
  title: string
  subject: string
  keywords: string[]
  /** creation and modification date written into the file */
  date: Date
  /** 32 hex digits for the trailer /ID */
  documentId: string
}

function textOf(obj: PDFObject | undefined): string | null {
  return obj instanceof PDFString || obj instanceof PDFHexString ? obj.decodeText() : null
}

/**
 * Chromium's tagged PDF names structure elements after DOM node ids ("node00000088"). Those ids are
 * handed out lazily, per renderer process, to whichever node is asked for one first — and some are
 * asked for while the page paints on screen, which depends on timing — so neither their numbers nor
 * their order can be trusted. Rename them s00000001… in the order the elements stand in the
 * structure tree (the document's own order), everywhere they occur (the elements' /ID, table cells'
 * /Headers), and rebuild the /IDTree name tree as one sorted leaf, dropping its old nodes.
 */
function normaliseStructureIds(doc: PDFDocument) {
  const ctx = doc.context
  const ID = PDFName.of('ID')
  const K = PDFName.of('K')
  const resolve = (obj: PDFObject | undefined) => (obj instanceof PDFRef ? ctx.lookup(obj) : obj)
  const root = resolve(doc.catalog.get(PDFName.of('StructTreeRoot')))
  if (!(root instanceof PDFDict)) return

  // structure order: depth-first through /K from the root, each element once
  const ordered: Array<{ name: string, ref: PDFRef | null }> = []
  const seen = new Set<PDFObject>()
  const walk = (obj: PDFObject | undefined, ref: PDFRef | null, depth: number) => {
    if (obj === undefined || depth > 256) return
    if (obj instanceof PDFRef) return walk(ctx.lookup(obj), obj, depth)
    if (obj instanceof PDFArray) {
      for (let i = 0; i < obj.size(); i++) walk(obj.get(i), null, depth + 1)
      return
    }
    if (!(obj instanceof PDFDict) || seen.has(obj)) return
    seen.add(obj)
    const name = textOf(obj.get(ID))
    if (name !== null) ordered.push({ name, ref })
    walk(obj.get(K), null, depth + 1)
  }
  walk(root.get(K), null, 0)
  // an element outside the tree (none expected) still gets a name that does not depend on the render
  const outside = new Set<string>()
  for (const [, obj] of ctx.enumerateIndirectObjects()) {
    const name = obj instanceof PDFDict && obj.get(PDFName.of('Type')) === PDFName.of('StructElem') ? textOf(obj.get(ID)) : null
    if (name !== null && !seen.has(obj)) outside.add(name)
  }
  if (!ordered.length && !outside.size) return

  const renamed = new Map<string, PDFString>()
  for (const name of [...ordered.map(o => o.name), ...[...outside].sort()]) {
    if (!renamed.has(name)) renamed.set(name, PDFString.of(`s${String(renamed.size + 1).padStart(8, '0')}`))
  }
  const visit = (obj: PDFObject, depth: number) => {
    if (depth > 64) return
    if (obj instanceof PDFDict) {
      for (const [key, value] of obj.entries()) {
        const next = renamed.get(textOf(value) ?? '')
        if (next) obj.set(key, next)
        else visit(value, depth + 1)
      }
    }
    else if (obj instanceof PDFArray) {
      for (let i = 0; i < obj.size(); i++) {
        const value = obj.get(i)
        const next = renamed.get(textOf(value) ?? '')
        if (next) obj.set(i, next)
        else visit(value, depth + 1)
      }
    }
  }
  const idTreeRef = root.get(PDFName.of('IDTree'))
  const treeNodes: PDFRef[] = []
  const collectTree = (obj: PDFObject | undefined, depth: number) => {
    if (!(obj instanceof PDFRef) || depth > 32) return
    treeNodes.push(obj)
    const node = ctx.lookup(obj)
    const kids = node instanceof PDFDict ? node.get(PDFName.of('Kids')) : undefined
    if (kids instanceof PDFArray) for (let i = 0; i < kids.size(); i++) collectTree(kids.get(i), depth + 1)
  }
  collectTree(idTreeRef, 0)
  for (const ref of treeNodes) ctx.delete(ref)
  for (const [, obj] of ctx.enumerateIndirectObjects()) visit(obj, 0)

  // the name tree again, as one leaf whose keys (s00000001…) are sorted because they follow the walk
  const names: PDFObject[] = []
  const listed = new Set<string>()
  for (const { name, ref } of ordered) {
    if (!ref || listed.has(name)) continue
    listed.add(name)
    names.push(renamed.get(name)!, ref)
  }
  if (names.length) root.set(PDFName.of('IDTree'), ctx.register(ctx.obj({ Names: names })))
  else root.delete(PDFName.of('IDTree'))
}

/**
 * Same revision, same bytes: Chromium's output differs between runs in its dates, its trailer /ID
 * and the ids of its structure elements, so the first two are set from the revision, the ids are
 * renumbered (pdf-lib, no object streams) and the rest is left alone.
 */
export async function makeReproducible(bytes: Uint8Array, meta: FixedMetadata): Promise<{ bytes: Uint8Array, pages: number }> {
  const doc = await PDFDocument.load(bytes, { updateMetadata: false, parseSpeed: OBJECTS_PER_WAIT })
  normaliseStructureIds(doc)
  doc.setTitle(meta.title)
  doc.setSubject(meta.subject)
  doc.setKeywords(meta.keywords)
  doc.setProducer('Tendonbook')
  doc.setCreator('Tendonbook')
  doc.setCreationDate(meta.date)
  doc.setModificationDate(meta.date)
  const id = PDFHexString.of(meta.documentId)
  doc.context.trailerInfo.ID = doc.context.obj([id, id])
  const out = await doc.save({ useObjectStreams: false, addDefaultPage: false, updateFieldAppearances: false, objectsPerTick: OBJECTS_PER_WAIT })
  return { bytes: out, pages: doc.getPageCount() }
}

/**
 * The page (from 1) of each named destination of a PDF — Chromium writes one for every element a
 * link of the document points to, such as the section headings the contents list links to. Reads
 * the catalogue's /Dests dictionary and the /Names /Dests name tree, whichever the file has.
 */
export async function namedDestinationPages(bytes: Uint8Array): Promise<Map<string, number>> {
  const doc = await PDFDocument.load(bytes, { updateMetadata: false, parseSpeed: OBJECTS_PER_WAIT })
  const ctx = doc.context
  const pageIndex = new Map(doc.getPages().map((p, i) => [p.ref.toString(), i + 1]))
  const out = new Map<string, number>()
  const record = (name: string, target: PDFObject | undefined) => {
    let dest = target ? ctx.lookup(target) : undefined
    if (dest instanceof PDFDict) dest = ctx.lookup(dest.get(PDFName.of('D')))
    if (!(dest instanceof PDFArray) || dest.size() === 0) return
    const page = pageIndex.get(dest.get(0).toString())
    if (page !== undefined && !out.has(name)) out.set(name, page)
  }
  const catalog = doc.catalog
  const dests = catalog.lookup(PDFName.of('Dests'))
  if (dests instanceof PDFDict) {
    for (const [key, value] of dests.entries()) record(key.decodeText(), value)
  }
  const walk = (node: PDFObject | undefined, depth: number) => {
    const dict = node ? ctx.lookup(node) : undefined
    if (!(dict instanceof PDFDict) || depth > 32) return
    const names = dict.lookup(PDFName.of('Names'))
    if (names instanceof PDFArray) {
      for (let i = 0; i + 1 < names.size(); i += 2) {
        const key = textOf(names.lookup(i))
        if (key !== null) record(key, names.get(i + 1))
      }
    }
    const kids = dict.lookup(PDFName.of('Kids'))
    if (kids instanceof PDFArray) for (let i = 0; i < kids.size(); i++) walk(kids.get(i), depth + 1)
  }
  const nameTree = catalog.lookup(PDFName.of('Names'))
  if (nameTree instanceof PDFDict) walk(nameTree.get(PDFName.of('Dests')), 0)
  return out
}
