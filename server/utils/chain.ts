import { asc, eq } from 'drizzle-orm'
import { auditHash, reviewHash, revisionHash, sha256Hex } from './hashing'

export interface ChainBreak {
  chain: 'revisions' | 'reviews' | 'audit' | 'seals'
  id: number
  /** what a person can look up: "PS-2 P02", "audit event 17" */
  label: string
  reason: string
}

export interface ChainReport {
  ok: boolean
  checked: { revisions: number, reviews: number, auditEvents: number, seals: number }
  /** the first broken link of each chain, in the order revisions, reviews, audit, seals */
  breaks: ChainBreak[]
  firstBreak: ChainBreak | null
  checkedAt: string
}

/**
 * Walks every hash chain from its start: each sheet's revisions (content hash recomputed from the
 * stored fields, link to the previous revision, no gap in the numbering), each review's hash, the
 * audit trail (hash, link, sequence, head), and each sealed PDF in storage against its recorded hash.
 */
export async function verifyChains(): Promise<ChainReport> {
  const db = useDb()
  const breaks: ChainBreak[] = []
  const checked = { revisions: 0, reviews: 0, auditEvents: 0, seals: 0 }

  const revs = await db.select({ rev: tables.revisions, sheetRef: tables.sheets.reference }).from(tables.revisions)
    .innerJoin(tables.sheets, eq(tables.sheets.id, tables.revisions.sheetId))
    .orderBy(asc(tables.revisions.sheetId), asc(tables.revisions.seq))
  const lastBySheet = new Map<number, { seq: number, hash: string }>()
  let revBreak: ChainBreak | null = null
  for (const { rev, sheetRef } of revs) {
    checked.revisions += 1
    if (revBreak) continue
    const label = `${sheetRef} ${rev.code}`
    const before = lastBySheet.get(rev.sheetId)
    const expectedSeq = (before?.seq ?? 0) + 1
    const recomputed = revisionHash(rev)
    if (rev.seq !== expectedSeq) revBreak = { chain: 'revisions', id: rev.id, label, reason: `numbering jumps from ${before?.seq ?? 0} to ${rev.seq}` }
    else if ((before?.hash ?? null) !== rev.prevHash) revBreak = { chain: 'revisions', id: rev.id, label, reason: 'the link to the previous revision does not match its hash' }
    else if (recomputed !== rev.contentHash) revBreak = { chain: 'revisions', id: rev.id, label, reason: 'the stored content no longer matches its hash (changed after issue)' }
    lastBySheet.set(rev.sheetId, { seq: rev.seq, hash: rev.contentHash })
  }
  if (revBreak) breaks.push(revBreak)

  const reviews = await db.select().from(tables.reviews).orderBy(asc(tables.reviews.id))
  for (const r of reviews) {
    checked.reviews += 1
    if (breaks.some(b => b.chain === 'reviews')) continue
    if (reviewHash(r) !== r.contentHash) breaks.push({ chain: 'reviews', id: r.id, label: `review ${r.id}`, reason: 'the stored decision no longer matches its hash' })
  }

  const events = await db.select().from(tables.auditEvents).orderBy(asc(tables.auditEvents.seq))
  let prev: string | null = null
  let auditBreak: ChainBreak | null = null
  for (const e of events) {
    checked.auditEvents += 1
    if (auditBreak) continue
    const label = `audit event ${e.seq} (${e.action})`
    if (e.seq !== checked.auditEvents) auditBreak = { chain: 'audit', id: e.id, label, reason: `sequence jumps to ${e.seq} where ${checked.auditEvents} was expected` }
    else if (e.prevHash !== prev) auditBreak = { chain: 'audit', id: e.id, label, reason: 'the link to the previous event does not match its hash' }
    else if (auditHash(e) !== e.hash) auditBreak = { chain: 'audit', id: e.id, label, reason: 'the stored event no longer matches its hash' }
    prev = e.hash
  }
  if (!auditBreak) {
    const [head] = await db.select().from(tables.chainHeads).where(eq(tables.chainHeads.name, 'audit'))
    if (head && (head.seq !== checked.auditEvents || head.hash !== prev)) {
      auditBreak = { chain: 'audit', id: 0, label: 'audit chain head', reason: 'events are missing from the end of the trail' }
    }
  }
  if (auditBreak) breaks.push(auditBreak)

  const seals = await db.select().from(tables.seals).orderBy(asc(tables.seals.id))
  for (const s of seals) {
    checked.seals += 1
    if (breaks.some(b => b.chain === 'seals')) continue
    const bytes = await readStored(s.storageKey)
    if (!bytes) breaks.push({ chain: 'seals', id: s.id, label: s.archiveRef, reason: 'the sealed PDF is missing from storage' })
    else if (sha256Hex(bytes) !== s.pdfSha256) breaks.push({ chain: 'seals', id: s.id, label: s.archiveRef, reason: 'the stored PDF no longer matches its recorded hash' })
  }

  return { ok: breaks.length === 0, checked, breaks, firstBreak: breaks[0] ?? null, checkedAt: new Date().toISOString() }
}
