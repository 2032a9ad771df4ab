// PDF rendering with puppeteer-core and the system Chromium: one browser for the process (relaunched
// when it goes away), a fresh page per job, only our own origin reachable, a deadline per job.
import { availableParallelism } from 'node:os'
import puppeteer, { type Browser, type BrowserContext, type Page } from 'puppeteer-core'
import { existsSync } from 'node:fs'
import { dirname, join } from 'node:path'
import { fileURLToPath } from 'node:url'
import { Piscina } from 'piscina'
import { PAGE_MARGIN_MM } from './print-templates'
import { destinationPages, reproducibleBytes, type FixedMetadata } from '../pdf-rewrite/rewrite'
import { PDF_REWRITE_WORKER, type RewriteTask } from '../pdf-rewrite/task'

export type { FixedMetadata }

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

// ---------------------------------------------------------------- the rewrite, off the request thread

/**
 * The rewrite runs in a pool of worker threads (piscina), one per render slot, so that parsing and
 * writing a PDF of thousands of objects (0.1–0.4 s each) never holds up the requests this server
 * answers meanwhile. The built server has the worker beside it (`pdf-rewrite-worker.mjs`, bundled
 * at build time, see nuxt.config.ts); without it (unit tests, the dev server) the same code runs
 * inline.
 */
let pool: Piscina | null | undefined

function workerFile(): string | null {
  let dir = dirname(fileURLToPath(import.meta.url))
  for (let up = 0; up < 4; up++) {
    const candidate = join(dir, PDF_REWRITE_WORKER)
    if (existsSync(candidate)) return candidate
    dir = dirname(dir)
  }
  return null
}

function rewritePool(): Piscina | null {
  if (pool === undefined) {
    const filename = process.env.TENDONBOOK_PDF_REWRITE_INLINE ? null : workerFile()
    // idle threads go after a minute, so a quiet server holds none
    pool = filename ? new Piscina({ filename, minThreads: 0, maxThreads: gate.slots, idleTimeout: 60_000 }) : null
  }
  return pool
}

/**
 * Same revision, same bytes: Chromium's output made reproducible (see `reproducibleBytes`), in a
 * worker thread when the built worker is there.
 */
export async function makeReproducible(bytes: Uint8Array, meta: FixedMetadata): Promise<{ bytes: Uint8Array, pages: number }> {
  const workers = rewritePool()
  if (!workers) return reproducibleBytes(bytes, meta)
  const task: RewriteTask = { kind: 'reproducible', bytes, meta }
  return workers.run(task) as Promise<{ bytes: Uint8Array, pages: number }>
}

/** The page (from 1) of each named destination of a PDF (see `destinationPages`), in a worker thread when there is one. */
export async function namedDestinationPages(bytes: Uint8Array): Promise<Map<string, number>> {
  const workers = rewritePool()
  if (!workers) return destinationPages(bytes)
  const task: RewriteTask = { kind: 'destinations', bytes }
  return new Map(await workers.run(task) as Array<[string, number]>)
}
