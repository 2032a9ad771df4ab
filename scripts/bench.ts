/**
 * `npm run bench`: Tendonbook's speed, each figure beside its reference measured in the same run
 * (the machines are shared and noisy: ratios in one run, several rounds, min and median) and beside
 * its target. Starts its own MariaDB, SMTP peer and server on its own ports and data folder
 * (TENDONBOOK_DATA_DIR .data-bench, TENDONBOOK_DB_PORT 3456, TENDONBOOK_MAIL_PORT 2576, PORT 3050
 * unless set), so it runs beside a demo or a test run. Never part of `npm test`: speed is measured,
 * not asserted.
 *
 *   npm run bench                 every figure, 5 rounds
 *   npm run bench -- --rounds 3   fewer rounds
 *   npm run bench -- --only engine,editor,issue,pdf,clients
 *   npm run bench -- --long       adds the 1,000-span member with its proposal (about 95 s of CPU)
 */
import { spawn, type ChildProcess } from 'node:child_process'
import { readFileSync, readdirSync } from 'node:fs'
import { join, resolve } from 'node:path'
import { chromium, type Browser } from 'playwright-core'
import { Agent, fetch as request } from 'undici'
import { DEMO_BB1, DEMO_PS2, designMember } from '../shared/engine/index'
import type { MemberInputDraft } from '../shared/engine/index'
import { compileSheet, renderSheet } from '../shared/sheet/runtime'

const root = resolve(import.meta.dirname, '..')
const argv = process.argv.slice(2)
const flag = (name: string) => argv.includes(`--${name}`)
const option = (name: string, fallback: string) => {
  const at = argv.indexOf(`--${name}`)
  return at >= 0 && argv[at + 1] ? argv[at + 1]! : fallback
}
const ROUNDS = Math.max(1, Number(option('rounds', '5')))
const ONLY = new Set(option('only', 'engine,editor,issue,pdf,clients').split(','))

process.env.TENDONBOOK_DATA_DIR ||= '.data-bench'
process.env.TENDONBOOK_DB_PORT ||= '3456'
process.env.TENDONBOOK_MAIL_PORT ||= '2576'
process.env.PORT ||= '3050'

// ---------------------------------------------------------------- figures

interface Stats { min: number, median: number, p95: number, max: number, n: number }
function stats(values: number[]): Stats {
  const s = [...values].sort((a, b) => a - b)
  const at = (q: number) => s[Math.min(s.length - 1, Math.ceil(q * s.length) - 1)]!
  return { min: s[0]!, median: s.length % 2 ? s[(s.length - 1) / 2]! : (s[s.length / 2 - 1]! + s[s.length / 2]!) / 2, p95: at(0.95), max: s.at(-1)!, n: s.length }
}
const ms = (v: number) => (v >= 100 ? v.toFixed(0) : v >= 10 ? v.toFixed(1) : v.toFixed(2))
const rows: string[][] = []
/** One line of the table: a figure, its reference, the ratio (pair by pair) and the target. */
function report(path: string, measured: number[], reference: number[] | null, target: string, note = '') {
  const m = stats(measured)
  const cells = [path, `${ms(m.min)} / ${ms(m.median)} ms`]
  if (reference) {
    const r = stats(reference)
    const ratios = stats(measured.map((v, i) => v / reference[i % reference.length]!))
    cells.push(`${ms(r.min)} / ${ms(r.median)} ms`, `${ratios.min.toFixed(2)}× / ${ratios.median.toFixed(2)}×`)
  }
  else cells.push('–', '–')
  cells.push(target, note)
  rows.push(cells)
  process.stdout.write(`  ${cells.join(' | ')}\n`)
}
function line(path: string, value: string, reference: string, ratio: string, target: string, note = '') {
  const cells = [path, value, reference, ratio, target, note]
  rows.push(cells)
  process.stdout.write(`  ${cells.join(' | ')}\n`)
}

/** CPU milliseconds of one call of f in this process. */
function cpuMs(f: () => unknown): number {
  const t = process.cpuUsage()
  f()
  const d = process.cpuUsage(t)
  return (d.user + d.system) / 1000
}

// ---------------------------------------------------------------- the engine

/** PS-2's strip over n equal 9.6 m spans; friction nearly nil so that a tendon of a thousand spans keeps its force (the work is the same). */
const strip = (n: number): MemberInputDraft => ({
  ...DEMO_PS2,
  losses: { mu: 0.001, wobble: 0 },
  geometry: { spans: Array.from({ length: n }, () => 9600) },
  profile: { ...DEMO_PS2.profile, lowPointAt: Array.from({ length: n }, () => 0.5) },
})

function benchEngine() {
  process.stdout.write('\nEngine (CPU time in this process)\n')
  for (const [name, demo] of [['PS-2', DEMO_PS2], ['BB-1', DEMO_BB1]] as const) {
    designMember(demo)
    const quick: number[] = []
    const full: number[] = []
    for (let i = 0; i < ROUNDS; i++) {
      quick.push(cpuMs(() => designMember(demo, { proposal: false })))
      full.push(cpuMs(() => designMember(demo)))
    }
    report(`${name} design without / with the proposal`, quick, full, 'for reference', 'ratio: share of the run that is not the proposal search')
  }
  const growth = (sizes: number[], proposal: boolean) => {
    const base: number[] = []
    for (const n of sizes) {
      const rounds = n >= 1000 ? 1 : n >= 100 ? Math.min(ROUNDS, 3) : ROUNDS
      const times: number[] = []
      if (n < 1000) designMember(strip(n), { proposal })
      for (let i = 0; i < rounds; i++) times.push(cpuMs(() => designMember(strip(n), { proposal })))
      if (!base.length) base.push(...times)
      report(`${n} spans ${proposal ? 'with' : 'without'} the proposal vs ${sizes[0]} spans`, times, base, `linear: ×${n / sizes[0]!}`, `heap ${(process.memoryUsage().heapUsed / 1e6).toFixed(0)} MB`)
    }
  }
  growth([10, 100, 1000], false)
  growth(flag('long') ? [10, 100, 1000] : [10, 100], true)
}

// ---------------------------------------------------------------- a private server

interface Server { base: string, pid: number, stop: () => Promise<void>, errors: () => string }

async function startServer(): Promise<Server> {
  const db = await import('./db.mjs')
  const { seed } = await import('./seed.mjs')
  const { buildIfNeeded } = await import('./build.mjs')
  const { startMailPeer } = await import('./mail-peer.mjs')
  const inst = await db.start()
  seed(inst)
  buildIfNeeded()
  const mail = await startMailPeer(inst)
  const port = Number(process.env.PORT)
  const server: ChildProcess = spawn(process.execPath, [join(root, '.output', 'server', 'index.mjs')], {
    cwd: root,
    env: { ...process.env, ...db.serverEnv(inst), ...mail.env, PORT: String(port), HOST: '127.0.0.1' },
    stdio: ['ignore', 'ignore', 'pipe'],
  })
  let errors = ''
  server.stderr?.on('data', (c: Buffer) => { errors += c.toString() })
  const base = `http://127.0.0.1:${port}`
  const until = Date.now() + 120_000
  for (;;) {
    if ((await fetch(`${base}/api/health`).catch(() => null))?.ok) break
    if (Date.now() > until || server.exitCode !== null) throw new Error(`the bench server did not start:\n${errors}`)
    await new Promise(r => setTimeout(r, 250))
  }
  return {
    base,
    pid: server.pid!,
    errors: () => errors,
    stop: async () => {
      server.kill('SIGTERM')
      await new Promise(r => server.once('exit', r))
      await mail.close()
      await db.stop()
    },
  }
}

const DEMO = {
  engineer: ['engineer@tendonbook.local', 'engineer-demo-2417'],
  checker: ['checker@tendonbook.local', 'checker-demo-2417'],
  records: ['records@tendonbook.local', 'records-demo-2417'],
} as const

/** A client that keeps its session cookie, like a browser. */
class Client {
  cookie = ''
  private readonly dispatcher: Agent | undefined
  /**
   * `from`: a loopback address of its own (127.0.0.2…), as separate people sign in from separate
   * machines; the sign-in limiter counts attempts per account and address before it checks a password.
   */
  constructor(readonly base: string, from?: string) {
    this.dispatcher = from ? new Agent({ localAddress: from }) : undefined
  }
  async call<T = unknown>(method: string, path: string, body?: unknown): Promise<{ status: number, body: T, ms: number }> {
    const t = performance.now()
    const res = await request(`${this.base}${path}`, {
      dispatcher: this.dispatcher,
      method,
      // as a browser on the app's own pages sends it: the server refuses a change without its origin
      headers: { 'content-type': 'application/json', origin: new URL(this.base).origin, ...(this.cookie ? { cookie: this.cookie } : {}) },
      body: body === undefined ? undefined : JSON.stringify(body),
    })
    const set = res.headers.getSetCookie()[0]
    if (set) this.cookie = set.split(';')[0]!
    const text = await res.text()
    const elapsed = performance.now() - t
    let parsed: unknown = text
    try {
      parsed = JSON.parse(text)
    }
    catch {}
    return { status: res.status, body: parsed as T, ms: elapsed }
  }

  async signIn(role: keyof typeof DEMO) {
    const [email, password] = DEMO[role]
    const res = await this.call('POST', '/api/auth/signin', { email, password })
    if (res.status !== 200) throw new Error(`sign-in as ${role} answered ${res.status}`)
    return res
  }
}

async function demoSheet(client: Client, reference: string): Promise<number> {
  const projects = (await client.call<Array<{ id: number, jobNumber: string }>>('GET', '/api/projects')).body
  const demo = projects.find(p => p.jobNumber === '2417')!
  const project = (await client.call<{ sheets: Array<{ id: number, reference: string }> }>('GET', `/api/projects/${demo.id}`)).body
  return project.sheets.find(s => s.reference === reference)!.id
}

const REASON = 'Issued by the benchmark: the failing checks are known.'

/** Issues the sheet's draft as it stands; the time of the request alone. */
async function issue(client: Client, sheetId: number): Promise<{ id: number, ms: number }> {
  const draft = (await client.call<{ draftVersion: number }>('GET', `/api/sheets/${sheetId}`)).body
  const res = await client.call<{ id: number }>('POST', `/api/sheets/${sheetId}/revisions`, { note: 'Benchmark issue', draftVersion: draft.draftVersion, failingChecksReason: REASON })
  if (res.status !== 201) throw new Error(`issue answered ${res.status}: ${JSON.stringify(res.body).slice(0, 300)}`)
  return { id: res.body.id, ms: res.ms }
}

// ---------------------------------------------------------------- issue and sealing

async function benchIssue(server: Server) {
  process.stdout.write('\nIssue a revision (PS-2, over loopback) vs a raw INSERT transaction of the same row\n')
  const db = await import('./db.mjs')
  const inst = db.instance(false)
  const engineer = new Client(server.base)
  await engineer.signIn('engineer')
  const sheetId = await demoSheet(engineer, 'PS-2')
  const sql = await db.rootConnection(inst, inst.database)
  await sql.query('CREATE TABLE IF NOT EXISTS bench_revisions LIKE revisions')
  await issue(engineer, sheetId)
  // the work an issue cannot skip besides the write: the server runs the engine (with the proposal)
  // and renders the frozen report itself, so the issued sheet is its own result, not the browser's
  const sheet = (await engineer.call<{ inputs: unknown, body: string | null, template: { body: string } }>('GET', `/api/sheets/${sheetId}`)).body
  const compiled = compileSheet(sheet.body ?? sheet.template.body)
  if (!compiled.ok) throw new Error(`the demo sheet's text does not load: ${compiled.errors.join('; ')}`)
  const freeze = () => {
    const t = performance.now()
    const design = designMember(sheet.inputs)
    renderSheet(compiled.template, design.input, design, 'frozen', {})
    return performance.now() - t
  }
  const issued: number[] = []
  const raw: number[] = []
  const floor: number[] = []
  let rowBytes = 0
  for (let i = 0; i < ROUNDS; i++) {
    const { id, ms: took } = await issue(engineer, sheetId)
    issued.push(took)
    const frozenMs = freeze()
    const [[row]] = await sql.query('SELECT * FROM revisions WHERE id = ?', [id]) as unknown as [[Record<string, unknown>]]
    const { id: _id, ...values } = row
    rowBytes = JSON.stringify(values).length
    const t = performance.now()
    await sql.beginTransaction()
    await sql.query('INSERT INTO bench_revisions SET ?', [Object.fromEntries(Object.entries(values).map(([k, v]) => [k, v !== null && typeof v === 'object' && !(v instanceof Date) && !Buffer.isBuffer(v) ? JSON.stringify(v) : v]))])
    await sql.commit()
    raw.push(performance.now() - t)
    floor.push(raw.at(-1)! + frozenMs)
  }
  await sql.query('DROP TABLE bench_revisions')
  await sql.end()
  report('issue a revision vs raw INSERT of its row', issued, raw, '≤ 3×', `row about ${(rowBytes / 1024).toFixed(0)} KB as JSON`)
  report('issue a revision vs its floor: raw INSERT + engine and frozen render', issued, floor, 'the measured floor', 'the rest: reads, hashes, history log, mail queue, HTTP')

  process.stdout.write('\nSealing (issue → approve → seal, PS-2)\n')
  const checker = new Client(server.base)
  await checker.signIn('checker')
  const records = new Client(server.base)
  await records.signIn('records')
  const sealed: number[] = []
  const approved: number[] = []
  const renders: number[] = []
  const numbering: string[] = []
  for (let i = 0; i < Math.min(ROUNDS, 3); i++) {
    const { id } = await issue(engineer, sheetId)
    const review = await checker.call('POST', `/api/revisions/${id}/reviews`, { decision: 'approve' })
    if (review.status !== 201) throw new Error(`approval answered ${review.status}: ${JSON.stringify(review.body).slice(0, 300)}`)
    // a seal comes some time after its approval, which has found the page numbers meanwhile
    for (let waited = 0; waited < 30_000; waited += 200) {
      const progress = await records.call<{ findingPages?: boolean }>('GET', `/api/revisions/${id}/seal-progress`)
      if (!progress.body.findingPages) break
      await new Promise(r => setTimeout(r, 200))
    }
    const seal = await records.call<{ renders?: number, numbering?: string }>('POST', `/api/revisions/${id}/seal`)
    if (seal.status !== 201) throw new Error(`sealing answered ${seal.status}: ${JSON.stringify(seal.body).slice(0, 300)}`)
    sealed.push(seal.ms)
    approved.push(id)
    renders.push(seal.body.renders ?? Number.NaN)
    numbering.push(seal.body.numbering ?? '?')
  }
  report('seal an approved revision', sealed, null, 'one render plus a verification', `Chromium renders per seal ${renders.join(', ')}; page numbers found ${numbering.join(', ')}`)
  return { records, approved }
}

// ---------------------------------------------------------------- PDFs

/** /proc figures of the server and everything it started (its Chromium). */
function memoryOf(pid: number): { server: number, serverPeak: number, children: number } {
  const kb = (file: string, field: string) => Number(new RegExp(`${field}:\\s+(\\d+)`).exec(readFileSync(file, 'utf8'))?.[1] ?? 0)
  const descendants = (p: number): number[] => {
    const kids: number[] = []
    for (const d of readdirSync('/proc')) {
      if (!/^\d+$/.test(d)) continue
      try {
        const ppid = Number(/PPid:\s+(\d+)/.exec(readFileSync(`/proc/${d}/status`, 'utf8'))?.[1])
        if (ppid === p) kids.push(Number(d), ...descendants(Number(d)))
      }
      catch {}
    }
    return kids
  }
  let children = 0
  for (const k of descendants(pid)) {
    try {
      children += kb(`/proc/${k}/status`, 'VmRSS')
    }
    catch {}
  }
  return { server: kb(`/proc/${pid}/status`, 'VmRSS') / 1024, serverPeak: kb(`/proc/${pid}/status`, 'VmHWM') / 1024, children: children / 1024 }
}

async function benchPdf(server: Server, browser: Browser, records: Client, revisionId: number) {
  process.stdout.write('\nPDF of a sealed revision (a reseal check renders it again as the seal did) vs Chromium\'s own page.pdf of the same print page\n')
  // Chromium's own: the same print page, scripts off, every font loaded, one page.pdf
  const context = await browser.newContext({ javaScriptEnabled: false })
  await context.addCookies([{ name: records.cookie.split('=')[0]!, value: records.cookie.slice(records.cookie.indexOf('=') + 1), url: server.base }])
  const page = await context.newPage()
  const own = async () => {
    const t = performance.now()
    const res = await page.goto(`${server.base}/revisions/${revisionId}/print`, { waitUntil: 'load' })
    if (!res?.ok()) throw new Error(`the print page answered ${res?.status()}`)
    await page.evaluate(async () => {
      await Promise.all([...(document.fonts as unknown as Iterable<FontFace>)].map(f => f.load().catch(() => null)))
      await document.fonts.ready
    })
    await page.pdf({ format: 'A4', printBackground: true, displayHeaderFooter: true, headerTemplate: '<span></span>', footerTemplate: '<span class="pageNumber"></span>', margin: { top: '18mm', bottom: '18mm', left: '15mm', right: '15mm' } })
    return performance.now() - t
  }
  const check = async () => {
    const res = await records.call<{ identical?: boolean, renders?: number }>('POST', `/api/revisions/${revisionId}/reseal-check`)
    return { ...res, renders: res.body?.renders }
  }
  await own()
  await check()
  const reference: number[] = []
  const single: number[] = []
  const renders: number[] = []
  let peak = { server: 0, serverPeak: 0, children: 0 }
  const sample = () => {
    const m = memoryOf(server.pid)
    peak = { server: Math.max(peak.server, m.server), serverPeak: Math.max(peak.serverPeak, m.serverPeak), children: Math.max(peak.children, m.children) }
  }
  const sampler = setInterval(sample, 100)
  for (let i = 0; i < ROUNDS; i++) {
    reference.push(await own())
    const r = await check()
    if (r.status !== 200) throw new Error(`reseal check answered ${r.status}: ${JSON.stringify(r.body).slice(0, 300)}`)
    single.push(r.ms)
    renders.push(r.renders ?? 0)
  }
  report('re-render of a sealed PDF vs one page.pdf', single, reference, '≤ 1.3×', `${stats(renders).median} Chromium render(s) per check (the sealed copy gives the page numbers), each with a pdf-lib rewrite`)

  const concurrent: number[] = []
  const statuses = new Map<number, number>()
  for (let round = 0; round < Math.min(ROUNDS, 3); round++) {
    const clients = await Promise.all(Array.from({ length: 10 }, async (_, i) => {
      const c = new Client(server.base, `127.0.1.${i + 2}`)
      await c.signIn('records')
      return c
    }))
    const results = await Promise.all(clients.map(c => c.call('POST', `/api/revisions/${revisionId}/reseal-check`)))
    for (const r of results) {
      statuses.set(r.status, (statuses.get(r.status) ?? 0) + 1)
      if (r.status === 200) concurrent.push(r.ms)
    }
  }
  clearInterval(sampler)
  sample()
  const s = stats(single)
  const all = [...statuses].map(([code, n]) => `${n}× ${code}`).join(', ')
  if (concurrent.length) {
    const c = stats(concurrent)
    line('10 concurrent re-renders: p95 vs one alone', `${ms(c.p95)} ms (median ${ms(c.median)})`, `${ms(s.median)} ms`, `${(c.p95 / s.median).toFixed(2)}×`, 'all succeed, p95 ≤ 4×', all)
  }
  else line('10 concurrent re-renders', 'none succeeded', `${ms(s.median)} ms`, '–', 'all succeed, p95 ≤ 4×', all)
  line('server memory under the PDF load', `${peak.serverPeak.toFixed(0)} MB peak (Node)`, `${peak.children.toFixed(0)} MB`, '–', 'bounded', 'reference column: its Chromium\'s resident memory at its peak sample')
  await context.close()
}

// ---------------------------------------------------------------- 50 clients

async function benchClients(server: Server) {
  process.stdout.write('\n50 concurrent clients on loopback (sign in, read a sheet, read the register)\n')
  const probe = new Client(server.base)
  await probe.signIn('records')
  const sheetId = await demoSheet(probe, 'PS-2')
  const one = async (i: number) => {
    const c = new Client(server.base, `127.0.2.${i + 2}`)
    const t = performance.now()
    // a connection the server drops counts as an error (0), like any answer of 400 or more
    const status = async (method: string, path: string, body?: unknown) => (await c.call(method, path, body).catch(() => ({ status: 0 }))).status
    const signin = await status('POST', '/api/auth/signin', { email: DEMO.records[0], password: DEMO.records[1] })
    const codes = signin === 200 ? [signin, await status('GET', `/api/sheets/${sheetId}`), await status('GET', '/api/archive')] : [signin]
    return { ms: performance.now() - t, codes }
  }
  const alone: number[] = []
  const crowd: number[] = []
  const errors = new Map<number, number>()
  for (let i = 0; i < ROUNDS; i++) {
    alone.push((await one(0)).ms)
    const before = server.errors().length
    const t = performance.now()
    const all = await Promise.all(Array.from({ length: 50 }, (_, i) => one(i)))
    crowd.push(performance.now() - t)
    for (const r of all) for (const code of r.codes) if (code >= 400 || code === 0) errors.set(code, (errors.get(code) ?? 0) + 1)
    const logged = server.errors().slice(before).trim()
    if (logged) process.stdout.write(`  the server logged: ${logged.split('\n').slice(0, 4).join(' / ').slice(0, 400)}\n`)
  }
  report('50 clients at once (all done) vs one client alone', crowd, alone, 'bounded (≤ 50× one alone), 0 errors', errors.size ? `errors: ${[...errors].map(([code, n]) => `${n}× ${code}`).join(', ')}` : '0 errors')
}

// ---------------------------------------------------------------- the editor

async function benchEditor(server: Server, browser: Browser) {
  process.stdout.write('\nThe editor (PS-2, in Chromium)\n')
  const context = await browser.newContext({ baseURL: server.base, viewport: { width: 1440, height: 900 } })
  // tsx keeps function names with a helper that the functions handed to the page must find there
  await context.addInitScript('window.__name = (f) => f')
  const page = await context.newPage()
  await page.goto('/signin')
  await page.waitForLoadState('networkidle')
  await page.fill('#email', DEMO.engineer[0])
  await page.fill('#password', DEMO.engineer[1])
  await page.click('button[type=submit]')
  await page.waitForURL(url => !url.pathname.startsWith('/signin'))
  const client = new Client(server.base)
  await client.signIn('engineer')
  const sheetId = await demoSheet(client, 'PS-2')
  await page.goto(`/sheets/${sheetId}`)
  await page.waitForSelector('[data-test=report] [data-part]')
  await page.waitForLoadState('networkidle')
  const workerFile = readdirSync(join(root, '.output', 'public', '_nuxt')).find(f => /^sheet-run-.*\.js$/.test(f))
  const sheet = (await client.call<{ inputs: unknown, body: string | null, template: { body: string } }>('GET', `/api/sheets/${sheetId}`)).body

  const span = page.locator('[data-path="geometry.spans"] input').nth(1)
  const spanId = await span.evaluate((el) => {
    el.id ||= 'bench-span'
    return el.id
  })
  await page.waitForTimeout(1000)

  // keystroke → report DOM: from the input event until the report's DOM has changed, every changed
  // part is in (the report patches a few parts per frame and says so with data-patching), and a frame is drawn
  const toDom = async (value: string) => page.evaluate(async ({ id, value }) => {
    const input = document.getElementById(id) as HTMLInputElement
    const reportEl = document.querySelector('[data-test=report]')!
    const changed = new Promise<void>((done, fail) => {
      let touched = false
      const seen = new MutationObserver((records) => {
        touched ||= records.some(r => r.type !== 'attributes')
        if (!touched || reportEl.hasAttribute('data-patching')) return
        seen.disconnect()
        done()
      })
      seen.observe(reportEl, { subtree: true, childList: true, characterData: true, attributes: true, attributeFilter: ['data-patching'] })
      setTimeout(() => fail(new Error(`the report did not change within 20 s of typing ${value}`)), 20_000)
    })
    const t = performance.now()
    input.value = value
    input.dispatchEvent(new Event('input', { bubbles: true }))
    await changed
    await new Promise(r => requestAnimationFrame(() => setTimeout(r, 0)))
    return performance.now() - t
  }, { id: spanId, value })

  // the reference in the same page: the engine and the bare renderer (markdown-it, KaTeX) in a worker of the same code, no DOM
  await page.evaluate(({ url }) => {
    (window as unknown as { benchWorker: Worker }).benchWorker = new Worker(url, { type: 'module' })
  }, { url: `/_nuxt/${workerFile}` })
  const bare = async (spanMm: number, seq: number) => page.evaluate(async ({ inputs, text, seq }) => {
    const worker = (window as unknown as { benchWorker: Worker }).benchWorker
    const t = performance.now()
    await new Promise((done) => {
      worker.onmessage = done
      worker.postMessage({ seq, key: String(seq), inputs, text, images: {}, proposal: false })
    })
    return performance.now() - t
  }, {
    inputs: { ...(sheet.inputs as Record<string, unknown>), geometry: { ...((sheet.inputs as { geometry: Record<string, unknown> }).geometry), spans: (sheet.inputs as { geometry: { spans: number[] } }).geometry.spans.map((s, i) => (i === 1 ? spanMm : s)) } },
    text: sheet.body ?? sheet.template.body,
    seq,
  })
  await bare(9700, 1)
  const dom: number[] = []
  const reference: number[] = []
  // values this run has not typed before (the saved draft may hold one from an earlier run)
  const offset = (Date.now() % 7) * 0.1
  for (let i = 0; i < ROUNDS; i++) {
    const value = (9.71 + i * 0.01 + offset).toFixed(2)
    reference.push(await bare(Math.round(Number(value) * 1000) + 50, i + 2))
    dom.push(await toDom(value))
    await page.waitForTimeout(900) // the run with the proposal lands and patches
  }
  report('keystroke → report DOM vs engine + bare render', dom, reference, '≤ 1.25×')

  const touched = await page.evaluate(async ({ id }) => {
    const reportEl = document.querySelector('[data-test=report]')!
    const parts = new Set<string>()
    let nodes = 0
    const seen = new MutationObserver((records) => {
      for (const r of records) {
        nodes += r.addedNodes.length + (r.type === 'characterData' ? 1 : 0)
        const part = (r.target instanceof Element ? r.target : r.target.parentElement)?.closest<HTMLElement>('[data-part]')
        if (part) parts.add(part.dataset.part!)
      }
    })
    seen.observe(reportEl, { subtree: true, childList: true, characterData: true, attributes: true })
    const input = document.getElementById(id) as HTMLInputElement
    input.value = (Number(input.value) + 0.05).toFixed(2)
    input.dispatchEvent(new Event('input', { bubbles: true }))
    await new Promise(r => setTimeout(r, 1500))
    seen.disconnect()
    return { total: reportEl.querySelectorAll('[data-part]').length, touched: parts.size, nodes, elements: reportEl.querySelectorAll('*').length }
  }, { id: spanId })
  line('parts of the report a span change touches', `${touched.touched} of ${touched.total}`, `${touched.nodes} nodes added or changed of ${touched.elements} elements`, '–', 'only the changed parts')

  // typed character painted: keydown → the next frame, against the same in a bare input of the same page
  await page.evaluate(() => {
    const bareInput = document.createElement('input')
    bareInput.id = 'bench-bare'
    bareInput.style.cssText = 'position:fixed;top:0;left:0;width:4rem;z-index:9999'
    document.body.append(bareInput)
    const frames: number[] = []
    ;(window as unknown as { keyFrames: number[] }).keyFrames = frames
    document.addEventListener('keydown', (event) => {
      const t = event.timeStamp
      requestAnimationFrame(() => setTimeout(() => frames.push(performance.now() - t), 0))
    }, true)
  })
  const typed = async (selector: string) => {
    await page.locator(selector).focus()
    await page.evaluate(() => { (window as unknown as { keyFrames: number[] }).keyFrames.length = 0 })
    for (let i = 0; i < Math.max(ROUNDS, 5); i++) {
      await page.keyboard.press('End')
      await page.keyboard.press('Backspace')
      await page.keyboard.type(String((i % 9) + 1))
      await page.waitForTimeout(700)
    }
    return page.evaluate(() => [...(window as unknown as { keyFrames: number[] }).keyFrames])
  }
  const painted = await typed(`#${spanId}`)
  const idle = await typed('#bench-bare')
  report('typed character painted (keydown → next frame) vs a bare input', painted, idle, 'next frame (≤ 16 ms over the bare input)', `worst ${ms(stats(painted).max)} ms`)
  await context.close()
}

// ---------------------------------------------------------------- main

async function main() {
  process.stdout.write(`Tendonbook bench: ${ROUNDS} rounds; figures as min / median; ratios pair by pair in this run\n`)
  if (ONLY.has('engine')) benchEngine()
  if (![...ONLY].some(p => p !== 'engine')) return summary()
  const server = await startServer()
  const browser = await chromium.launch({
    executablePath: '/usr/bin/chromium',
    args: ['--no-sandbox', '--disable-gpu', '--disable-dev-shm-usage', '--disable-background-networking', '--disable-component-update', '--disable-sync', '--no-first-run', '--disable-quic'],
  })
  try {
    if (ONLY.has('editor')) await benchEditor(server, browser)
    let sealed: Awaited<ReturnType<typeof benchIssue>> | null = null
    if (ONLY.has('issue') || ONLY.has('pdf')) sealed = await benchIssue(server)
    if (ONLY.has('pdf') && sealed?.approved.length) await benchPdf(server, browser, sealed.records, sealed.approved[0]!)
    if (ONLY.has('clients')) await benchClients(server)
  }
  finally {
    await browser.close()
    await server.stop()
  }
  summary()
}

function summary() {
  process.stdout.write('\n| path | measured (min / median) | reference (min / median) | ratio (min / median) | target | note |\n| --- | --- | --- | --- | --- | --- |\n')
  for (const r of rows) process.stdout.write(`| ${r.join(' | ')} |\n`)
}

main().catch((error) => {
  process.stderr.write(`[bench] ${error instanceof Error ? error.stack : String(error)}\n`)
  process.exit(1)
})
