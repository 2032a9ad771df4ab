import { execFile } from 'node:child_process'
import { mkdtempSync, readFileSync, writeFileSync } from 'node:fs'
import { tmpdir } from 'node:os'
import { join, resolve } from 'node:path'
import { beforeAll, describe, expect, it } from 'vitest'
import { PDFDocument } from 'pdf-lib'
import { sha256Hex } from '../../server/utils/hashing'
import { DEMO_PS2 } from '../../shared/engine/input/demo'
import { entryLeafHash } from '../../shared/log/entry'
import { verifyInclusion } from '../../shared/log/merkle'
import { withDb } from '../helpers/db'
import { issue, makeSheet, newPerson, pdfText, session, setSheetInputs, type Session } from './records-fixtures'

let engineer: Session
let checker: Session
let records: Session
let sheet: Awaited<ReturnType<typeof makeSheet>>
let approved: { id: number, contentHash: string, code: string }
let sealedBytes: Uint8Array

beforeAll(async () => {
  ;[engineer, checker, records] = await Promise.all([session('engineer'), session('checker'), session('records')])
  sheet = await makeSheet()
  const rev = (await issue(engineer, sheet.sheetId, { note: 'for sealing' })).body
  approved = (await checker.json('POST', `/api/revisions/${rev.id}/reviews`, { decision: 'approve' })).body
})

/** Waits while the server finds the page numbers of a revision it has just approved. */
async function untilPagesFound(revisionId: number) {
  for (let waited = 0; waited < 60_000; waited += 200) {
    const progress = await records.json('GET', `/api/revisions/${revisionId}/seal-progress`)
    if (!progress.body.findingPages) return
    await new Promise(r => setTimeout(r, 200))
  }
  throw new Error(`the page numbers of revision ${revisionId} were still being found after a minute`)
}

async function download(s: Session, revisionId: number) {
  const res = await s.fetch(`/api/revisions/${revisionId}/pdf`)
  return { status: res.status, type: res.headers.get('content-type'), bytes: new Uint8Array(await res.arrayBuffer()) }
}

describe('sealing an approved revision', () => {
  it('refuses sealing to an engineer, and an unapproved revision to records', async () => {
    expect((await engineer.json('POST', `/api/revisions/${approved.id}/seal`)).status).toBe(403)
    const other = await makeSheet()
    const pending = (await issue(engineer, other.sheetId)).body
    const res = await records.json('POST', `/api/revisions/${pending.id}/seal`)
    expect(res.status).toBe(409)
    expect(res.body.message).toContain('only an approved')
  })

  it('renders, stores and records the PDF; its text carries the hash, the references, the results and the caution', async () => {
    // the approval has the page of every section found in the background, while nobody waits
    await untilPagesFound(approved.id)
    // while it seals, the page can ask where it stands: the steps in order, never back
    const idle = await records.json('GET', `/api/revisions/${approved.id}/seal-progress`)
    expect(idle.body).toEqual({ running: false })
    expect((await checker.json('GET', `/api/revisions/${approved.id}/seal-progress`)).status).toBe(403)
    const sealing = records.json('POST', `/api/revisions/${approved.id}/seal`)
    let done = false
    void sealing.finally(() => { done = true })
    const seen: Array<{ index: number, steps: number, label: string, plan: string[] }> = []
    while (!done) {
      const now = await records.json('GET', `/api/revisions/${approved.id}/seal-progress`)
      expect(now.status).toBe(200)
      if (now.body.running) seen.push(now.body)
      await new Promise(r => setTimeout(r, 100))
    }
    const res = await sealing
    expect(seen.length, 'progress was reported while sealing').toBeGreaterThan(0)
    expect(seen[0]!.plan).toHaveLength(4)
    expect(seen.every(p => (p.steps === 4 && p.plan.includes(p.label)) || p.label.includes('once more'))).toBe(true)
    expect(seen.map(p => p.index)).toEqual([...seen.map(p => p.index)].sort((x, y) => x - y))
    expect(new Set(seen.map(p => p.label)).size, 'more than one step was seen').toBeGreaterThan(1)
    expect((await records.json('GET', `/api/revisions/${approved.id}/seal-progress`)).body).toEqual({ running: false })
    expect(res.status, JSON.stringify(res.body)).toBe(201)
    expect(res.body.status.status).toBe('sealed')
    // so the seal is one render and its verification (a third only if the two differed)
    expect(res.body.numbering).toBe('at approval')
    expect([2, 3]).toContain(res.body.renders)
    const seal = res.body.seal
    expect(seal.archiveRef).toBe(`${sheet.jobNumber}-PS-2-C01`)
    const file = await download(records, approved.id)
    expect(file.status).toBe(200)
    expect(file.type).toBe('application/pdf')
    sealedBytes = file.bytes
    expect(sha256Hex(sealedBytes)).toBe(seal.pdfSha256)

    const { pages, numPages } = await pdfText(sealedBytes)
    expect(numPages).toBe(seal.pages)
    const all = pages.join('\n')
    const compact = all.replace(/\s+/g, '')
    expect(compact).toContain(approved.contentHash)
    expect(compact).toContain(seal.verificationRef)
    expect(compact).toContain(seal.archiveRef)
    expect(compact).toContain('competentengineer')
    // the title block is on every sheet, with its number
    pages.forEach((text, i) => {
      const page = text.replace(/\s+/g, '').toLowerCase()
      expect(page).toContain('alderyardpodium(recordstest)')
      expect(page).toContain(`sheet${i + 1}of${numPages}`)
      expect(page).toContain(approved.contentHash)
    })
    // the key results: the numbers in the frozen report's check tables are printed as they were frozen
    const detail = (await records.json('GET', `/api/revisions/${approved.id}`)).body
    const cells = [...(detail.reportHtml as string).matchAll(/<td[^>]*>([^<]*\d[^<]*)<\/td>/g)].map(m => m[1]!.replace(/&[a-z]+;|\s+/g, ''))
    expect(cells.length).toBeGreaterThan(3)
    for (const cell of cells.slice(0, 12)) expect(compact).toContain(cell)
    // headings without typeset symbols read back verbatim (math comes out of the PDF as italic code points)
    const plainTitles = (detail.sections as Array<{ title: string }>).map(s => s.title).filter(t => /^[\w ,.()/'-]+$/.test(t))
    expect(plainTitles.length).toBeGreaterThan(2)
    for (const title of plainTitles) expect(compact).toContain(title.replace(/\s+/g, ''))
    const doc = await PDFDocument.load(sealedBytes, { updateMetadata: false })
    // ISO 216 A4 is 210 × 297 mm = 595.28 × 841.89 pt; Chromium rounds the sheet to whole CSS pixels, within 1 pt
    const size = doc.getPage(0).getSize()
    expect(Math.abs(size.width - 595.28)).toBeLessThan(1)
    expect(Math.abs(size.height - 841.89)).toBeLessThan(1)
  })

  it('re-renders the sealed revision to the very same bytes, and answers a second seal with the first', async () => {
    const check = await records.json('POST', `/api/revisions/${approved.id}/reseal-check`)
    expect(check.status).toBe(200)
    expect(check.body).toMatchObject({ identical: true, sealedSha256: sha256Hex(sealedBytes) })
    // one render: the sealed copy's own page of every section is the page numbering it was printed with
    expect(check.body.renders).toBe(1)
    const [before] = await withDb(conn => conn.query('SELECT COUNT(*) AS n FROM seals WHERE revision_id = ?', [approved.id]))
    const again = await records.json('POST', `/api/revisions/${approved.id}/seal`)
    expect(again.status).toBe(200)
    expect(again.body.alreadySealed).toBe(true)
    expect(again.body.seal.pdfSha256).toBe(sha256Hex(sealedBytes))
    expect(again.body.message).toContain(`${sheet.jobNumber}-PS-2-C01 was already sealed by`)
    const [after] = await withDb(conn => conn.query('SELECT COUNT(*) AS n FROM seals WHERE revision_id = ?', [approved.id]))
    expect(after).toEqual(before)
    expect((after as Array<{ n: number }>)[0]!.n).toBe(1)
  })

  it('keeps the render and its print page when a re-render differs, and says that the printed data changed', async () => {
    await withDb(conn => conn.query('UPDATE projects SET name = ? WHERE id = ?', ['Alder Yard podium (renamed after sealing)', sheet.projectId]))
    try {
      const check = await records.json('POST', `/api/revisions/${approved.id}/reseal-check`)
      expect(check.status).toBe(200)
      expect(check.body).toMatchObject({ identical: false, printPageChanged: true })
      expect(check.body.message).toContain('print page differs')
      const [rows] = await withDb(conn => conn.query('SELECT detail FROM audit_events WHERE action = ? ORDER BY id DESC LIMIT 1', ['revision.reseal-check']))
      const detail = (rows as Array<{ detail: unknown }>)[0]!.detail
      const kept = (typeof detail === 'string' ? JSON.parse(detail) : detail).kept as { pdf: string, printPage: string }
      const folder = join(process.env.TENDONBOOK_TEST_BASE!, 'files')
      const keptPage = readFileSync(join(folder, ...kept.printPage.split(':')), 'utf8')
      expect(keptPage).toContain('renamed after sealing')
      expect(sha256Hex(readFileSync(join(folder, ...kept.pdf.split(':'))))).toBe(check.body.renderedSha256)
    }
    finally {
      await withDb(conn => conn.query('UPDATE projects SET name = ? WHERE id = ?', ['Alder Yard podium (records test)', sheet.projectId]))
    }
    expect((await records.json('POST', `/api/revisions/${approved.id}/reseal-check`)).body.identical).toBe(true)
  })
})

describe('page numbers found at approval', () => {
  it('are checked by the seal: numbers that do not match the print are settled afresh, and the seal re-renders to its bytes', async () => {
    const other = await makeSheet()
    const rev = (await issue(engineer, other.sheetId, { note: 'kept numbers put wrong' })).body
    expect((await checker.json('POST', `/api/revisions/${rev.id}/reviews`, { decision: 'approve' })).status).toBe(201)
    await untilPagesFound(rev.id)
    const file = join(process.env.TENDONBOOK_TEST_BASE!, 'files', 'section-pages', `revision-${rev.id}.txt`)
    const found = readFileSync(file, 'utf8')
    expect(found).toMatch(/^\d+(\.\d+)+$/)
    // every section on page 1: as if the kept numbers had gone stale or been tampered with
    writeFileSync(file, found.split('.').map(() => '1').join('.'))
    const res = await records.json('POST', `/api/revisions/${rev.id}/seal`)
    expect(res.status, JSON.stringify(res.body)).toBe(201)
    expect(res.body.numbering).toBe('at seal')
    // the contents list prints the page each heading is on, not the kept 1s
    const { pages } = await pdfText((await download(records, rev.id)).bytes)
    const contents = pages[0]!.replace(/\s+/g, ' ')
    const plain = (res.body.sections as Array<{ title: string, level: number }>).filter(x => x.level === 1 && /^[\w ,.()/'-]+$/.test(x.title))
    expect(plain.length).toBeGreaterThan(3)
    for (const section of plain) {
      const listed = new RegExp(`${section.title.replace(/[.*+?^${}()|[\]\\]/g, '\\$&')} (\\d+)`).exec(contents)
      expect(listed, section.title).not.toBeNull()
      const page = Number(listed![1])
      expect(page, section.title).toBeGreaterThan(1)
      expect(pages[page - 1]!.replace(/\s+/g, ' '), `${section.title} on page ${page}`).toContain(section.title)
    }
    const check = await records.json('POST', `/api/revisions/${rev.id}/reseal-check`)
    expect(check.body).toMatchObject({ identical: true, renders: 1 })
  })
})

describe('the sealed document in the history log', () => {
  it('prints the revision\'s leaf and the signed head it was sealed under, in the footer and the keywords', async () => {
    const { seal } = (await records.json('GET', `/api/revisions/${approved.id}`)).body
    const leaf = await withDb(async (c) => {
      const [rows] = await c.query('SELECT leaf_index AS i FROM log_leaves WHERE kind = \'revision\' AND row_id = ?', [approved.id])
      return Number((rows as Array<{ i: number }>)[0]!.i)
    })
    expect(seal.logLeafIndex).toBe(leaf)
    expect(seal.headTreeSize).toBeGreaterThan(leaf + 1)
    const heads = (await records.json('GET', '/api/log')).body.heads as Array<{ treeSize: number, rootHash: string }>
    expect(heads.find(h => h.treeSize === seal.headTreeSize)?.rootHash).toBe(seal.headRootHash)
    const keywords = (await PDFDocument.load(sealedBytes, { updateMetadata: false })).getKeywords()
    expect(keywords).toContain(`log-leaf:${leaf}`)
    expect(keywords).toContain(`log-head:${seal.headTreeSize}:${seal.headRootHash}`)
    const compact = (await pdfText(sealedBytes)).pages.join(' ').replace(/\s+/g, '')
    expect(compact).toContain(`Historylogleaf${leaf}·sealedundersignedheadsize${seal.headTreeSize},root${seal.headRootHash}`)
  })

  it('shows the seal\'s inclusion proof when a copy is verified by upload', async () => {
    const res = await records.upload('/api/verify', sealedBytes, 'from-site.pdf', 'application/pdf')
    const inclusion = res.body.inclusion
    expect(inclusion.head.signatureOk).toBe(true)
    expect(entryLeafHash(inclusion.entry)).toBe(inclusion.leafHash)
    expect(JSON.parse(inclusion.entry).row.pdfSha256).toBe(sha256Hex(sealedBytes))
    expect(verifyInclusion(inclusion.leafIndex, inclusion.head.treeSize, inclusion.leafHash, inclusion.proof, inclusion.head.rootHash)).toBe(true)
  })

  it('checks a copy offline against an exported head, with no server', async () => {
    const exported = await records.fetch('/api/log/export')
    expect(exported.headers.get('content-disposition')).toContain('tendonbook-head-')
    const file = await exported.json()
    expect(file.documents.map((d: { pdfSha256: string }) => d.pdfSha256)).toContain(sha256Hex(sealedBytes))
    const dir = mkdtempSync(join(tmpdir(), 'tb-verify-'))
    const head = join(dir, 'head.json')
    writeFileSync(head, JSON.stringify(file))
    const copy = join(dir, 'copy.pdf')
    writeFileSync(copy, sealedBytes)
    const root = resolve(import.meta.dirname, '..', '..')
    // no database, no server: an empty environment but the path (run without blocking this
    // process, whose idle connections to the test server must stay serviced)
    const run = (...args: string[]) => new Promise<{ status: number | null, stdout: string, stderr: string }>((done) => {
      const child = execFile(process.execPath, ['--import', 'tsx', join(root, 'scripts', 'verify.ts'), ...args], { cwd: root, env: { PATH: process.env.PATH } }, (_, stdout, stderr) => done({ status: child.exitCode, stdout, stderr }))
    })

    const ok = await run(copy, '--head', head)
    expect(ok.status, ok.stdout + ok.stderr).toBe(0)
    expect(ok.stdout).toContain('VERIFIED: this is the sealed document')
    expect(ok.stdout).toContain('competent engineer')
    expect(ok.stdout).not.toContain('✗')
    expect((await run(sha256Hex(sealedBytes), '--head', head)).status).toBe(0)

    const changed = new Uint8Array(sealedBytes)
    changed[Math.floor(changed.length / 3)] ^= 0x01
    writeFileSync(join(dir, 'changed.pdf'), changed)
    const bad = await run(join(dir, 'changed.pdf'), '--head', head)
    expect(bad.status).toBe(1)
    expect(bad.stdout).toContain('✗ a sealed document in the head file has this hash')

    const forged = join(dir, 'forged.json')
    writeFileSync(forged, JSON.stringify({ ...file, head: { ...file.head, treeSize: file.head.treeSize + 1 } }))
    const unsigned = await run(copy, '--head', forged)
    expect(unsigned.status).toBe(1)
    expect(unsigned.stdout).toMatch(/✗ head of size \d+ signed .*: signature verifies/)

    const reordered = join(dir, 'reordered.json')
    const doc = file.documents.find((d: { pdfSha256: string }) => d.pdfSha256 === sha256Hex(sealedBytes))
    writeFileSync(reordered, JSON.stringify({ ...file, documents: [{ ...doc, seal: { ...doc.seal, leafIndex: doc.seal.leafIndex + 1 } }] }))
    expect((await run(copy, '--head', reordered)).stdout).toContain(`✗ seal leaf ${doc.seal.leafIndex + 1} is included in the signed head`)

    expect((await run(copy, '--head', join(dir, 'none.json'))).status).toBe(2)
  })
})

describe('verification', () => {
  it('recognises the sealed PDF byte for byte, and a single changed byte as not sealed', async () => {
    const ok = await records.upload('/api/verify', sealedBytes, 'from-site.pdf', 'application/pdf')
    expect(ok.status).toBe(200)
    expect(ok.body).toMatchObject({ match: true, document: { revisionId: approved.id, superseded: false } })
    const changed = new Uint8Array(sealedBytes)
    changed[Math.floor(changed.length / 2)] ^= 0x01
    const bad = await records.upload('/api/verify', changed, 'from-site.pdf', 'application/pdf')
    expect(bad.body.match).toBe(false)
    expect(bad.body.message).toContain('Not a sealed document')
    expect(bad.body.sha256).toBe(sha256Hex(changed))
  })

  it('finds the document from a pasted PDF hash, content hash or verification reference', async () => {
    const detail = (await records.json('GET', `/api/revisions/${approved.id}`)).body
    for (const query of [detail.seal.pdfSha256, approved.contentHash, detail.seal.verificationRef.toLowerCase(), detail.seal.archiveRef]) {
      const res = await records.json('POST', '/api/verify', { query })
      expect(res.body.match, query).toBe(true)
      expect(res.body.document.archiveRef).toBe(detail.seal.archiveRef)
    }
    expect((await records.json('POST', '/api/verify', { query: 'f'.repeat(64) })).body.match).toBe(false)
    expect((await records.json('POST', '/api/verify', { query: '' })).status).toBe(400)
    expect((await engineer.json('POST', '/api/verify', { query: 'f'.repeat(64) })).status).toBe(403)
    // a records clerk of other projects finds nothing: the document does not show outside its project
    const elsewhere = (await newPerson('records', 'Records Elsewhere')).session
    for (const query of [detail.seal.pdfSha256, detail.seal.verificationRef]) {
      const res = await elsewhere.json('POST', '/api/verify', { query })
      expect(res.body.match, query).toBe(false)
      expect(res.body.message).toContain('of your projects')
    }
    expect((await elsewhere.json('GET', '/api/log/export')).body.documents.map((d: { archiveRef: string }) => d.archiveRef)).not.toContain(detail.seal.archiveRef)
    expect((await records.json('GET', '/api/log/export')).body.documents.map((d: { archiveRef: string }) => d.archiveRef)).toContain(detail.seal.archiveRef)
  })

  it('says a sealed document was superseded once a later revision is approved', async () => {
    await setSheetInputs(sheet.sheetId, { ...DEMO_PS2, loads: { ...DEMO_PS2.loads, superimposed: 2.5e-3 } })
    const next = (await issue(engineer, sheet.sheetId, { note: 'heavier finishes', failingChecksReason: 'Frequent top-fibre tension over support 3 is 110 %; agreed with the checker to review it with the finishes' })).body
    const c02 = (await checker.json('POST', `/api/revisions/${next.id}/reviews`, { decision: 'approve' })).body
    expect(c02.status.contractCode).toBe('C02')
    const res = await records.upload('/api/verify', sealedBytes, 'old.pdf', 'application/pdf')
    expect(res.body).toMatchObject({ match: true, document: { superseded: true, supersededBy: { revisionId: next.id, code: 'C02' } } })
    expect(res.body.message).toContain('superseded by C02')
  })
})

describe('archive register', () => {
  it('lists sealed documents with filters and exports CSV', async () => {
    const all = await records.json('GET', `/api/archive?project=${sheet.projectId}`)
    expect(all.status).toBe(200)
    expect(all.body.register.map((r: { archiveRef: string }) => r.archiveRef)).toEqual([`${sheet.jobNumber}-PS-2-C01`])
    expect(all.body.awaiting.some((a: { contractCode: string }) => a.contractCode === 'C02')).toBe(true)
    expect((await records.json('GET', `/api/archive?project=${sheet.projectId}&status=current`)).body.register).toEqual([])
    expect((await records.json('GET', `/api/archive?project=${sheet.projectId}&status=superseded`)).body.register).toHaveLength(1)
    expect((await records.json('GET', '/api/archive?from=2001-01-01&to=2001-12-31')).body.register).toEqual([])
    expect((await records.json('GET', '/api/archive?from=yesterday')).status).toBe(400)
    // a title that a spreadsheet would run as a formula is exported as text
    await withDb(c => c.query('UPDATE sheets SET title = ? WHERE id = ?', ['=HYPERLINK("http://evil.example","open")', sheet.sheetId]))
    const csv = await records.fetch(`/api/archive/export.csv?project=${sheet.projectId}`)
    expect(csv.headers.get('content-type')).toContain('text/csv')
    const text = await csv.text()
    const Papa = (await import('papaparse')).default
    const parsed = Papa.parse<Record<string, string>>(text.trim(), { header: true })
    expect(parsed.data).toHaveLength(1)
    expect(parsed.data[0]).toMatchObject({ 'Archive ref.': `${sheet.jobNumber}-PS-2-C01`, 'Revision': 'C01', 'Status': 'Superseded', 'PDF SHA-256': sha256Hex(sealedBytes) })
    expect(parsed.data[0]!.Title).toBe('\'=HYPERLINK("http://evil.example","open")')
    expect((await checker.json('GET', '/api/archive')).status).toBe(403)
  })

  it('comes a page at a time, and gives each document the status its revision shows', async () => {
    type Row = { archiveRef: string, revisionId: number, contractCode: string, superseded: boolean, status: string }
    const whole = (await records.json('GET', '/api/archive?per=200')).body as { register: Row[], total: number, page: number, pageSize: number }
    expect(whole.total).toBe(whole.register.length)
    expect(whole.total).toBeGreaterThan(0)
    // page by page, one document a page: the same documents in the same order, the same total each time
    const paged: string[] = []
    for (let page = 1; page <= whole.total; page++) {
      const one = (await records.json('GET', `/api/archive?per=1&page=${page}`)).body
      expect(one).toMatchObject({ total: whole.total, page, pageSize: 1 })
      paged.push(...one.register.map((r: Row) => r.archiveRef))
    }
    expect(paged).toEqual(whole.register.map(r => r.archiveRef))
    expect((await records.json('GET', `/api/archive?per=1&page=${whole.total + 1}`)).body).toMatchObject({ register: [], total: whole.total })
    // the default page is fifty
    expect((await records.json('GET', '/api/archive')).body.pageSize).toBe(50)
    // current and superseded split the register between them
    const current = (await records.json('GET', '/api/archive?per=200&status=current')).body
    const superseded = (await records.json('GET', '/api/archive?per=200&status=superseded')).body
    expect(current.total + superseded.total).toBe(whole.total)
    expect(superseded.register.every((r: Row) => r.superseded)).toBe(true)
    // the register reads its statuses in its own query; the revision's page derives them per sheet
    for (const row of whole.register) {
      const detail = (await records.json('GET', `/api/revisions/${row.revisionId}`)).body
      expect({ ref: row.archiveRef, code: row.contractCode, superseded: row.superseded, status: row.status })
        .toEqual({ ref: row.archiveRef, code: detail.status.contractCode, superseded: detail.status.superseded, status: detail.status.label })
    }
    const bad = await records.json('GET', '/api/archive?per=5000')
    expect(bad.status).toBe(400)
    expect(bad.body.message).toContain('Documents per page')
  })
})
