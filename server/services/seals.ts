import type { H3Event } from 'h3'
import { eq } from 'drizzle-orm'
import { sha256Hex, verificationRef } from '../utils/hashing'
import { makeReproducible, namedDestinationPages, PdfRenderError, printOrigin, renderPdf } from '../utils/pdf'
import { CAUTION, footerTemplate, headerTemplate, isoDay, type TitleBlock } from '../utils/print-templates'
import { encodePages } from '../../shared/report/page-references'
import type { OfficeStamp } from './office'

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
 * Chromium now and then lays a page out differently when the machine is under heavy load, so one
 * render is not proof of the document's bytes: render until two renders agree (three at most) and
 * take the agreed bytes. The page numbers are settled first; the render that settled them is the
 * first candidate. @throws 502 when no two renders agree.
 */
async function agreedRevisionPdf(event: H3Event, detail: Detail, accept?: (sha256: string) => boolean) {
  const printer = await revisionPrinter(event, detail)
  const { pages, raw } = await printer.settlePageNumbers()
  const seen = new Map<string, number>()
  for (let attempt = 1; attempt <= 3; attempt++) {
    const rendered = await printer.reproducible(attempt === 1 ? raw : await printer.render(pages))
    const sha = sha256Hex(rendered.bytes)
    if (accept?.(sha) || seen.has(sha)) return { ...rendered, sha256: sha, renders: attempt }
    seen.set(sha, attempt)
  }
  throw createError({ statusCode: 502, message: 'The PDF could not be rendered reproducibly: three renders of the same revision gave different bytes; try again when the server is less busy' })
}

/** What the print page shows: the frozen report, its sections and the title block, all fixed at approval. */
export async function printViewOf(detail: Detail) {
  const office = await officeStamp(detail.approvedBy?.officeVersion ?? null)
  return { id: detail.id, titleBlock: titleBlockOf(detail, office), sections: detail.sections, reportHtml: detail.reportHtml, caution: CAUTION }
}

function renderFailure(error: unknown): never {
  const reason = error instanceof PdfRenderError ? error.message : error instanceof Error ? error.message : String(error)
  throw createError({ statusCode: 502, message: `The PDF could not be rendered: ${reason}` })
}

/**
 * Prints an approved revision's print page to PDF with its title block. Page numbers take two
 * passes at least: the first tells the page of every section heading, the next prints the contents
 * and the page references with those numbers; one more if the numbers moved a heading.
 */
async function revisionPrinter(event: H3Event, detail: Detail) {
  const { titleBlock: block } = await printViewOf(detail)
  const origin = printOrigin()
  const session = useRuntimeConfig().session as { name?: string }
  const cookieName = session.name || 'nuxt-session'
  const value = getCookie(event, cookieName)
  /** @throws 502 saying why rendering failed. */
  const render = (pages: string | null) => renderPdf({
    url: `${origin}/revisions/${detail.id}/print${pages === null ? '' : `?pages=${pages}`}`,
    origin,
    cookies: value ? [{ name: cookieName, value }] : [],
    headerTemplate: headerTemplate(block),
    footerTemplate: footerTemplate(block),
  }).catch(renderFailure)
  const pagesOf = async (raw: Uint8Array) => encodePages(detail.sections, await namedDestinationPages(raw))
  return {
    render,
    async settlePageNumbers() {
      let pages = await pagesOf(await render(null))
      let raw = await render(pages)
      const moved = await pagesOf(raw)
      if (moved !== pages) {
        pages = moved
        raw = await render(pages)
      }
      return { pages, raw }
    },
    reproducible: (raw: Uint8Array) => makeReproducible(raw, {
      title: `${block.jobNumber} ${block.sheetReference} ${block.revision} ${block.title}`,
      subject: `${block.projectName}: ${block.title}`,
      keywords: [block.archiveRef, block.verificationRef, detail.contentHash],
      date: new Date(detail.approvedBy?.at ?? detail.issuedAt),
      documentId: detail.contentHash.slice(0, 32),
    }).catch(renderFailure),
  }
}

/**
 * Seals an approved revision: renders it, stores the PDF under a generated key, and records its
 * SHA-256 and archive reference in a seal row with its audit event.
 * @throws 409 when the revision is not approved or already sealed.
 */
export async function sealRevision(event: H3Event, revisionId: number, user: SessionUser) {
  const detail = await getRevisionDetail(revisionId, user)
  if (detail.status.status !== 'approved') {
    throw createError({ statusCode: 409, message: `${detail.sheet.reference} ${detail.code} is ${detail.status.label.toLowerCase()}: only an approved, unsealed revision can be sealed` })
  }
  const { bytes, pages, sha256: pdfSha256 } = await agreedRevisionPdf(event, detail)
  const archiveRef = archiveRefOf(detail)
  const storageKey = generatedKey('seals', 'pdf')
  await writeStored(storageKey, bytes)
  try {
    await useDb().transaction(async (tx) => {
      await tx.insert(tables.seals).values({
        revisionId, archiveRef, verificationRef: verificationRef(detail.contentHash), storageKey, pdfSha256,
        pdfBytes: bytes.length, pages, sealedBy: user.id, sealedAt: new Date(),
      })
      await recordAudit(event, { action: 'revision.sealed', subject: archiveRef, actorId: user.id, detail: { revisionId, pdfSha256, pages } }, tx)
    })
  }
  catch (error) {
    if ((error as { code?: string }).code === 'ER_DUP_ENTRY' || (error as { cause?: { code?: string } }).cause?.code === 'ER_DUP_ENTRY') {
      throw createError({ statusCode: 409, message: `${archiveRef} was sealed by someone else a moment ago` })
    }
    throw error
  }
  return getRevisionDetail(revisionId, user)
}

/** Renders a sealed revision again and says whether the bytes are identical to the sealed ones. */
export async function resealCheck(event: H3Event, revisionId: number, user: SessionUser) {
  const detail = await getRevisionDetail(revisionId, user)
  if (!detail.seal) throw createError({ statusCode: 409, message: `${detail.sheet.reference} ${detail.code} is not sealed` })
  const sealed = detail.seal.pdfSha256
  const { bytes, sha256: renderedSha256, renders } = await agreedRevisionPdf(event, detail, sha => sha === sealed)
  const identical = renderedSha256 === sealed
  await recordAudit(event, { action: 'revision.reseal-check', subject: detail.seal.archiveRef, actorId: user.id, detail: { revisionId, identical, renderedSha256, renders } })
  return { identical, sealedSha256: sealed, renderedSha256, bytes: bytes.length, renders }
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
