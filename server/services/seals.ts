import type { H3Event } from 'h3'
import { eq } from 'drizzle-orm'
import { sha256Hex } from '../utils/hashing'
import { verificationRef } from '../../shared/utils/verification-ref'
import { makeReproducible, namedDestinationPages, PdfBusyError, pdfSlotFree, PdfRenderError, printOrigin, renderPdf } from '../utils/pdf'
import { CAUTION, footerTemplate, headerTemplate, isoDay, logStampKeywords, type LogStamp, type TitleBlock } from '../utils/print-templates'
import { encodePages } from '../../shared/report/page-references'
import type { OfficeStamp } from './office'
import { withSealProgress, type SealStep } from '../utils/seal-progress'

type SessionUser = { id: number, name: string, email: string, role: import('../../shared/types/roles').Role }
type Detail = Awaited<ReturnType<typeof getRevisionDetail>>

/** 2417-PS-2-C01: job, calc reference and contractual code; unique because the contractual code is. */
export function archiveRefOf(detail: Pick<Detail, 'project' | 'sheet' | 'status'>) {
  return `${detail.project.jobNumber}-${detail.sheet.reference}-${detail.status.contractCode}`.replace(/[^A-Za-z0-9._-]+/g, '-')
}

/** The title block of a printed revision: only facts fixed at approval, so a re-print gives the same bytes. */
export function titleBlockOf(detail: Detail, office: OfficeStamp | null): TitleBlock {
  return {
    office: office?.name ?? '',
    officeLogo: office?.logoDataUrl ?? null,
    projectName: detail.project.name,
    jobNumber: detail.project.jobNumber,
    client: detail.project.client,
    site: detail.project.site,
    sheetReference: detail.sheet.reference,
    title: detail.sheet.title,
    partOfStructure: detail.sheet.partOfStructure,
    revision: detail.status.contractCode ? `${detail.status.contractCode} (checked as ${detail.code})` : detail.code,
    status: detail.status.contractCode ? 'A1 Approved' : `${detail.status.suitability} ${detail.status.label}`,
    madeBy: detail.author.name,
    madeOn: isoDay(detail.issuedAt),
    checkedBy: detail.approvedBy?.name ?? '',
    checkedOn: isoDay(detail.approvedBy?.at),
    archiveRef: detail.status.contractCode ? archiveRefOf(detail) : '',
    contentHash: detail.contentHash,
    verificationRef: verificationRef(detail.contentHash),
  }
}

/**
 * One render is not proof of the document's bytes, so render until two renders agree (three at
 * most) and take the agreed bytes with the print page they came from. The page numbers are settled
 * first; the render that settles them and a second render with the same numbers run side by side
 * in two print tabs when a slot is free, and agree in the usual case. A check against sealed bytes
 * (`accept`) that finds no match answers with the last render rather than an error.
 * @throws 502 when no two renders agree.
 */
async function agreedRevisionPdf(event: H3Event, detail: Detail, stamp: LogStamp | undefined, step: (step: SealStep) => void, accept?: (sha256: string) => boolean, keptPages: string | null = null) {
  const printer = await revisionPrinter(event, detail, stamp)
  const { pages, raw, second } = await printer.settlePageNumbers(step, keptPages)
  // what every answer below tells of how it was made
  const made = () => ({ sectionPages: pages, chromiumRenders: printer.renders(), keptPagesHeld: keptPages !== null && pages === keptPages })
  step('comparing')
  const seen = new Map<string, number>()
  let last: Rendered | null = null
  for (let attempt = 1; attempt <= 3; attempt++) {
    let bytes = attempt === 1 ? raw : attempt === 2 && second ? second : null
    if (!bytes) {
      step('again')
      bytes = await printer.render(pages)
      step('comparing')
    }
    last = await printer.reproducible(bytes)
    const sha = sha256Hex(last.bytes)
    if (accept?.(sha) || seen.has(sha)) return { ...last, sha256: sha, renders: attempt, agreed: true, ...made() }
    seen.set(sha, attempt)
  }
  if (accept && last) return { ...last, sha256: sha256Hex(last.bytes), renders: 3, agreed: false, ...made() }
  throw createError({ statusCode: 502, message: 'The PDF could not be rendered reproducibly: three renders of the same revision gave different bytes; try again when the server is less busy' })
}

type Rendered = { bytes: Uint8Array, pages: number, html: string }

/** Where the print page of a seal is kept beside its PDF, to explain a later render that differs. */
const printPageKey = (pdfKey: string) => pdfKey.replace(/\.pdf$/, '.print.html')

/** Where the page of every section a seal printed is kept beside its PDF ('3.3.4.7', see encodePages), for its re-renders. */
const sectionPagesKey = (pdfKey: string) => pdfKey.replace(/\.pdf$/, '.pages.txt')

/** The storage key of a revision's sealed PDF, or null when it has no seal. */
async function sealStorageKey(revisionId: number) {
  const [seal] = await useDb().select({ storageKey: tables.seals.storageKey }).from(tables.seals).where(eq(tables.seals.revisionId, revisionId))
  return seal?.storageKey ?? null
}

/** What the print page shows: the frozen report, its sections and the title block, all fixed at approval. */
export async function printViewOf(detail: Detail) {
  const office = await officeStamp(detail.approvedBy?.officeVersion ?? null)
  return { id: detail.id, titleBlock: titleBlockOf(detail, office), sections: detail.sections, reportHtml: detail.reportHtml, caution: CAUTION }
}

/** The page of every section as the seal printed them ('3.3.4.7'), or null when not sealed or not kept (older seals). */
export async function sealedSectionPages(detail: Detail): Promise<string | null> {
  if (!detail.seal) return null
  const key = await sealStorageKey(detail.id)
  const kept = key ? await readStored(sectionPagesKey(key)).catch(() => null) : null
  return kept ? new TextDecoder().decode(kept) : null
}

function renderFailure(event: H3Event) {
  return (error: unknown): never => {
    if (error instanceof PdfBusyError) {
      setResponseHeader(event, 'Retry-After', String(error.retryAfterSeconds))
      throw createError({ statusCode: 503, message: `The PDF could not be rendered now: ${error.message}` })
    }
    const reason = error instanceof PdfRenderError ? error.message : error instanceof Error ? error.message : String(error)
    throw createError({ statusCode: 502, message: `The PDF could not be rendered: ${reason}` })
  }
}

/**
 * Prints an approved revision's print page to PDF with its title block and, once sealed or being
 * sealed, its place in the history log. Page numbers take two passes at least: the first tells the
 * page of every section heading, the next prints the contents and the page references with those
 * numbers; one more if the numbers moved a heading.
 */
async function revisionPrinter(event: H3Event, detail: Detail, stamp: LogStamp | undefined) {
  const { titleBlock: block } = await printViewOf(detail)
  const origin = printOrigin()
  const session = useRuntimeConfig().session as { name?: string }
  const cookieName = session.name || 'nuxt-session'
  const value = getCookie(event, cookieName)
  const failed = renderFailure(event)
  let html = ''
  /**
   * `keepPage` false for a render whose print page is never kept (the first pass for page numbers,
   * a check's render that is set aside when it differs): reading the page back costs a moment.
   * @throws 502 saying why rendering failed, 503 when this server's renders are all busy.
   */
  let renders = 0
  const render = (pages: string, keepPage = true, background?: { onStart: () => void }) => (renders += 1, renderPdf({
    background: Boolean(background),
    onStart: background?.onStart,
    onHtml: keepPage ? (page) => { html = page } : undefined,
    url: `${origin}/revisions/${detail.id}/print?pages=${pages}`,
    origin,
    cookies: value ? [{ name: cookieName, value }] : [],
    headerTemplate: headerTemplate(block),
    footerTemplate: footerTemplate(block, stamp),
  }).catch(failed))
  const pagesOf = async (raw: Uint8Array) => encodePages(detail.sections, await namedDestinationPages(raw))
  /** The page of every section: a render with placeholders, whose named destinations say where each heading fell. */
  const firstPass = async (background?: { onStart: () => void }) => pagesOf(await render(encodePages(detail.sections, new Map()), false, background))
  return {
    render,
    firstPass,
    /** how many times this printer has had the revision rendered */
    renders: () => renders,
    /**
     * The page of every section (`kept`, found when the revision was approved, or a first render with
     * placeholders), then the render with those numbers and, beside it, a second one to compare it
     * with (null when this server's renders are all taken: it is then made after). One more render
     * when the numbers moved a heading — which is also what a kept number that is wrong would do, so
     * kept numbers need no trust.
     */
    async settlePageNumbers(step: (step: SealStep) => void, kept: string | null = null) {
      step(kept === null ? 'numbering' : 'numbered')
      // every page 0: the print page sets '00' where a number goes, as wide as the numbers to come
      let pages = kept ?? await firstPass()
      step('printing')
      // both print the same print page, so the first one's copy of it serves for either
      let [raw, second] = await Promise.all([render(pages), pdfSlotFree() ? render(pages, false) : null])
      const moved = await pagesOf(raw)
      if (moved !== pages) {
        step('again')
        pages = moved
        raw = await render(pages)
        second = null
      }
      return { pages, raw, second }
    },
    /** the render made reproducible, with the print page of the last render */
    reproducible: async (raw: Uint8Array): Promise<Rendered> => ({
      ...await makeReproducible(raw, {
        title: `${block.jobNumber} ${block.sheetReference} ${block.revision} ${block.title}`,
        subject: `${block.projectName}: ${block.title}`,
        keywords: [block.archiveRef, block.verificationRef, detail.contentHash, ...(stamp ? logStampKeywords(stamp) : [])],
        date: new Date(detail.approvedBy?.at ?? detail.issuedAt),
        documentId: detail.contentHash.slice(0, 32),
      }).catch(failed),
      html,
    }),
  }
}

/** Where the page of every section of an approved revision, found in the background at its approval, waits for its seal. */
const approvalPagesKey = (revisionId: number) => `section-pages:revision-${revisionId}.txt`

/**
 * The approved revisions whose pages this server is finding now, each with the job that finds them,
 * whether its render has begun, and whether a seal has gone ahead without it.
 */
const numberingNow = new Map<number, { job: Promise<string | null>, rendering: boolean, dropped: boolean }>()

/**
 * Finds the page of every section of a revision just approved (the first, placeholder render of its
 * seal) in the background and keeps it, so that sealing it later is one render and its verification,
 * side by side. Everything a print of an approved revision shows is fixed at approval (the history
 * log's place goes in the footer, outside the page's layout), so these numbers are the seal's; a seal
 * checks them anyway (a wrong number moves no heading back into place, and is settled afresh).
 * It renders only when no one's render waits (so it delays none by more than the one it is
 * running), and is left to the seal when many such renders already wait; a failure here costs the
 * approval nothing.
 */
export function numberApprovedRevision(event: H3Event, revisionId: number, user: SessionUser) {
  if (numberingNow.has(revisionId)) return
  const entry = { job: Promise.resolve<string | null>(null), rendering: false, dropped: false }
  entry.job = (async () => {
    const detail = await getRevisionDetail(revisionId, user)
    if (detail.status.status !== 'approved' || detail.seal) return null
    const printer = await revisionPrinter(event, detail, undefined)
    const pages = await printer.firstPass({
      onStart: () => {
        if (entry.dropped) throw new Error('its seal began first')
        entry.rendering = true
      },
    })
    if (entry.dropped) return null
    await writeStored(approvalPagesKey(revisionId), new TextEncoder().encode(pages))
    return pages
  })().catch((error: unknown) => {
    if (!entry.dropped) console.warn(`[seal] the page numbers of revision ${revisionId} were not found at its approval (its seal will find them): ${error instanceof Error ? error.message : String(error)}`)
    return null
  }).finally(() => numberingNow.delete(revisionId))
  numberingNow.set(revisionId, entry)
}

/** Whether this server is finding the page numbers of an approved revision now. */
export function numberingRevision(revisionId: number) {
  return numberingNow.has(revisionId)
}

/**
 * The page numbers found at the revision's approval, or null. A job still rendering here is waited
 * for (it is the first render the seal would make); one still waiting for a slot is dropped, and the
 * seal makes that render itself, in its own turn.
 */
async function approvalPages(revisionId: number): Promise<string | null> {
  const running = numberingNow.get(revisionId)
  if (running?.rendering) return running.job
  if (running) {
    running.dropped = true
    return null
  }
  const kept = await readStored(approvalPagesKey(revisionId)).catch(() => null)
  return kept ? new TextDecoder().decode(kept) : null
}

/**
 * The revision's leaf and the latest signed head, which covers it and its approval: what the
 * sealed PDF prints. @throws 409 when the revision is not in the history log.
 */
async function logStampFor(detail: Detail): Promise<LogStamp> {
  const head = await publishHead()
  const leafIndex = await leafIndexOf('revision', detail.id)
  if (leafIndex === null || leafIndex >= head.treeSize) {
    throw createError({ statusCode: 409, message: `${detail.sheet.reference} ${detail.code} is not in the history log, so it cannot be sealed; run the chain verification` })
  }
  return { leafIndex, treeSize: head.treeSize, rootHash: head.rootHash }
}

/** The stamp a seal was made with (none on seals made before the history log). */
function sealedStamp(seal: NonNullable<Detail['seal']>): LogStamp | undefined {
  return seal.logLeafIndex !== null && seal.headTreeSize !== null && seal.headRootHash !== null
    ? { leafIndex: seal.logLeafIndex, treeSize: seal.headTreeSize, rootHash: seal.headRootHash }
    : undefined
}

/**
 * The answer to sealing a revision that already has its seal (sealed earlier, or a moment ago by
 * another server): that seal, with 200 instead of 201 and a message that says so.
 */
function existingSeal(event: H3Event, detail: Detail & { seal: NonNullable<Detail['seal']> }) {
  setResponseStatus(event, 200)
  const when = new Date(detail.seal.sealedAt).toISOString().slice(0, 16).replace('T', ' ')
  return { ...detail, alreadySealed: true, message: `${detail.seal.archiveRef} was already sealed by ${detail.seal.sealedByName} at ${when} UTC: this is that seal` }
}

/**
 * Seals an approved revision: renders it, stores the PDF under a generated key, and records its
 * SHA-256 and archive reference in a seal row with its audit event. Idempotent per revision: a
 * revision that already has its seal gets that seal back (see `existingSeal`), also when another
 * server sealed it while this one was rendering.
 * @throws 409 when the revision is not approved.
 */
export async function sealRevision(event: H3Event, revisionId: number, user: SessionUser) {
  const detail = await getRevisionDetail(revisionId, user)
  if (detail.seal) return existingSeal(event, { ...detail, seal: detail.seal })
  if (detail.status.status !== 'approved') {
    throw createError({ statusCode: 409, message: `${detail.sheet.reference} ${detail.code} is ${detail.status.label.toLowerCase()}: only an approved, unsealed revision can be sealed` })
  }
  const stamp = await logStampFor(detail)
  return withSealProgress(revisionId, 'seal', async (step) => {
    step('numbering')
    const kept = await approvalPages(revisionId)
    const agreed = await agreedRevisionPdf(event, detail, stamp, step, undefined, kept)
    step('storing')
    const sealed = await storeSeal(event, detail, stamp, agreed, user)
    // kept beside the seal from now on (sectionPagesKey)
    if (kept !== null) await useStorage('records').removeItem(approvalPagesKey(revisionId)).catch(() => {})
    return sealed
  })
}

/** Stores an agreed render as the revision's seal: the PDF and what explains it, then the seal row, its log leaf and audit event. */
async function storeSeal(event: H3Event, detail: Detail, stamp: LogStamp, agreed: Awaited<ReturnType<typeof agreedRevisionPdf>>, user: SessionUser) {
  const { bytes, pages, html, sha256: pdfSha256, sectionPages, chromiumRenders: renders, keptPagesHeld } = agreed
  // where the page numbers came from, for the record: found at approval, or by a first render now
  const numbering = keptPagesHeld ? 'at approval' : 'at seal'
  const revisionId = detail.id
  const archiveRef = archiveRefOf(detail)
  const storageKey = generatedKey('seals', 'pdf')
  await writeStored(storageKey, bytes)
  await writeStored(printPageKey(storageKey), new TextEncoder().encode(html))
  await writeStored(sectionPagesKey(storageKey), new TextEncoder().encode(sectionPages))
  try {
    await withRetry(() => historyTransaction(async (tx) => {
      const [{ id }] = await tx.insert(tables.seals).values({
        revisionId, archiveRef, verificationRef: verificationRef(detail.contentHash), storageKey, pdfSha256,
        pdfBytes: bytes.length, pages, sealedBy: user.id, sealedAt: new Date(),
        logLeafIndex: stamp.leafIndex, headTreeSize: stamp.treeSize, headRootHash: stamp.rootHash,
      }).$returningId()
      await logWrittenRow(tx, 'seal', id)
      await recordAudit(event, { action: 'revision.sealed', subject: archiveRef, actorId: user.id, detail: { revisionId, sealId: id, pdfSha256, pages, renders, numbering } }, tx)
    }), `${archiveRef} could not be sealed because the records changed a moment ago: try again`)
  }
  catch (error) {
    // the unique key on seals.revision_id (one server), or a certification conflict (Galera nodes)
    const duplicate = (error as { code?: string }).code === 'ER_DUP_ENTRY' || (error as { cause?: { code?: string } }).cause?.code === 'ER_DUP_ENTRY'
    if (duplicate || isWriteConflict(error)) {
      const now = await getRevisionDetail(revisionId, user)
      if (now.seal) {
        for (const key of [storageKey, printPageKey(storageKey), sectionPagesKey(storageKey)]) await useStorage('records').removeItem(key).catch(() => {})
        return existingSeal(event, { ...now, seal: now.seal })
      }
    }
    throw error
  }
  return { ...(await getRevisionDetail(revisionId, user)), alreadySealed: false, renders, numbering }
}

/**
 * A sealed revision rendered again for comparison. The page of every section, kept beside the seal
 * (or, for a seal made before that was kept, read from the sealed copy's own named destinations),
 * makes one render the render the seal made; only when its bytes differ (or neither can be read) do
 * the page numbers get settled afresh and renders repeated, as when sealing. The kept numbers need
 * no trust: a render from wrong ones gives other bytes, and is then done again from scratch.
 */
async function renderAsSealed(event: H3Event, detail: Detail & { seal: NonNullable<Detail['seal']> }, sealed: string, step: (step: SealStep) => void) {
  const stamp = sealedStamp(detail.seal)
  let pages = await sealedSectionPages(detail)
  if (pages === null) {
    const copy = await sealedPdf(detail.id).catch(() => null)
    if (copy) pages = encodePages(detail.sections, await namedDestinationPages(copy.bytes))
  }
  if (pages !== null) {
    const printer = await revisionPrinter(event, detail, stamp)
    step('printing')
    // its print page is not needed: the same bytes need no explaining, and other bytes are rendered again below
    const raw = await printer.render(pages, false)
    step('comparing')
    const once = await printer.reproducible(raw)
    const sha = sha256Hex(once.bytes)
    if (sha === sealed) return { ...once, sha256: sha, renders: 1, agreed: true }
  }
  step('again')
  // the seal's own steps from here on show as the check's one step of printing again
  const again = await agreedRevisionPdf(event, detail, stamp, s => step(s === 'comparing' ? 'comparing' : 'again'), sha => sha === sealed)
  return { ...again, renders: again.renders + (pages !== null ? 1 : 0) }
}

/**
 * Renders a sealed revision again and says whether the bytes are identical to the sealed ones.
 * When they are not, the render and its print page are kept beside the seal, and the answer says
 * whether the print page itself changed (the revision's data) or only Chromium's output did.
 */
export async function resealCheck(event: H3Event, revisionId: number, user: SessionUser) {
  const detail = await getRevisionDetail(revisionId, user)
  if (!detail.seal) throw createError({ statusCode: 409, message: `${detail.sheet.reference} ${detail.code} is not sealed` })
  const sealed = detail.seal.pdfSha256
  const seal = detail.seal
  const { bytes, html, sha256: renderedSha256, renders } = await withSealProgress(revisionId, 'check', step => renderAsSealed(event, { ...detail, seal }, sealed, step))
  const identical = renderedSha256 === sealed
  let kept: { pdf: string, printPage: string, printPageChanged: boolean | null } | null = null
  if (!identical) {
    const key = await sealStorageKey(revisionId)
    const sealedPage = key ? await readStored(printPageKey(key)) : null
    const pdf = generatedKey('reseal-checks', 'pdf')
    await writeStored(pdf, bytes)
    await writeStored(printPageKey(pdf), new TextEncoder().encode(html))
    kept = { pdf, printPage: printPageKey(pdf), printPageChanged: sealedPage ? new TextDecoder().decode(sealedPage) !== html : null }
  }
  await recordAudit(event, { action: 'revision.reseal-check', subject: detail.seal.archiveRef, actorId: user.id, detail: { revisionId, identical, renderedSha256, renders, kept } })
  return {
    identical, sealedSha256: sealed, renderedSha256, bytes: bytes.length, renders,
    ...(kept && { printPageChanged: kept.printPageChanged, message: kept.printPageChanged ? 'The print page differs from the one sealed: the revision\'s printed data has changed since sealing' : 'The print page is the one sealed but the PDF bytes differ: the renderer produced other bytes' }),
  }
}

/** The sealed PDF's bytes, checked against the recorded hash before they are handed out. */
export async function sealedPdf(revisionId: number) {
  const [seal] = await useDb().select().from(tables.seals).where(eq(tables.seals.revisionId, revisionId))
  if (!seal) throw createError({ statusCode: 404, message: `Revision ${revisionId} has no sealed PDF` })
  const bytes = await readStored(seal.storageKey)
  if (!bytes) throw createError({ statusCode: 410, message: `The sealed PDF ${seal.archiveRef} is missing from storage` })
  if (sha256Hex(bytes) !== seal.pdfSha256) throw createError({ statusCode: 500, message: `The stored PDF ${seal.archiveRef} no longer matches its recorded hash` })
  return { seal, bytes }
}
