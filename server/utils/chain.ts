import { asc, eq } from 'drizzle-orm'
import { LOG_KINDS, type LogKind } from '../../shared/log/entry'
import { rowsOf } from '../database/history-log'
import type { AuditEvent, Review, Revision, Seal } from '../database/schema'
import { auditHash, reviewHash, revisionHash, sha256Hex } from './hashing'
import { checkLog, type LogBreak } from './log-check'

export interface ChainBreak {
  chain: 'revisions' | 'reviews' | 'audit' | 'seals' | 'log'
  id: number
  /** what a person can look up: "PS-2 P02", "audit event 17" */
  label: string
  /** content: hash no longer matches; link: wrong link to the record before; missing: a record is gone */
  problem: 'content' | 'link' | 'missing' | 'file' | LogBreak['problem']
  reason: string
}

export interface ChainReport {
  ok: boolean
  checked: { revisions: number, reviews: number, auditEvents: number, seals: number, logLeaves: number, heads: number }
  /** every break found, in the order revisions, reviews, audit, seals, log */
  breaks: ChainBreak[]
  firstBreak: ChainBreak | null
  checkedAt: string
}

/** A chain numbered 1, 2, 3… where each record links to the hash of the one before. */
interface Linked { id: number, seq: number, label: string, prevHash: string | null, hash: string, recomputed: string }

function walkChain(chain: 'revisions' | 'audit', records: Linked[], what: string): ChainBreak[] {
  const breaks: ChainBreak[] = []
  let before: Linked | null = null
  for (const rec of records) {
    const expectedSeq = (before?.seq ?? 0) + 1
    if (rec.seq > expectedSeq) {
      breaks.push({ chain, id: rec.id, label: rec.label, problem: 'missing', reason: `${what} ${expectedSeq}${rec.seq - 1 > expectedSeq ? `…${rec.seq - 1}` : ''} before it ${rec.seq - 1 > expectedSeq ? 'are' : 'is'} missing` })
    }
    else if ((before?.hash ?? null) !== rec.prevHash) {
      breaks.push({ chain, id: rec.id, label: rec.label, problem: 'link', reason: `the link to the previous ${what} does not match its hash` })
    }
    if (rec.recomputed !== rec.hash) {
      breaks.push({ chain, id: rec.id, label: rec.label, problem: 'content', reason: `the stored ${what} no longer matches its hash (changed after it was written)` })
    }
    before = rec
  }
  return breaks
}

/**
 * Checks every record, and lists every break: each sheet's revisions (content hash recomputed,
 * link to the previous revision, no revision missing), each review's hash, the audit trail (hash,
 * link, sequence, head), each sealed PDF in storage against its recorded hash, and the history log
 * (every row logged and unchanged, every published head still the root of the rows, every
 * decision made with its audit event).
 */
export async function verifyChains(): Promise<ChainReport> {
  const db = useDb()
  const rows = Object.fromEntries(await Promise.all(LOG_KINDS.map(async k => [k, await rowsOf(db, k)] as const))) as Record<LogKind, Map<number, Record<string, unknown>>>
  const revisions = [...rows.revision.values()] as Revision[]
  const reviews = [...rows.review.values()] as Review[]
  const events = ([...rows.audit.values()] as AuditEvent[]).sort((a, b) => a.seq - b.seq)
  const seals = [...rows.seal.values()] as Seal[]
  const breaks: ChainBreak[] = []

  const sheetRefs = new Map((await db.select({ id: tables.sheets.id, reference: tables.sheets.reference }).from(tables.sheets)).map(s => [s.id, s.reference]))
  const bySheet = new Map<number, Revision[]>()
  for (const rev of revisions) bySheet.set(rev.sheetId, [...(bySheet.get(rev.sheetId) ?? []), rev])
  for (const [sheetId, revs] of [...bySheet].sort((a, b) => a[0] - b[0])) {
    revs.sort((a, b) => a.seq - b.seq)
    breaks.push(...walkChain('revisions', revs.map(r => ({ id: r.id, seq: r.seq, label: `${sheetRefs.get(sheetId) ?? `sheet ${sheetId}`} ${r.code}`, prevHash: r.prevHash, hash: r.contentHash, recomputed: revisionHash(r) })), 'revision'))
  }

  for (const r of reviews) {
    if (reviewHash(r) !== r.contentHash) breaks.push({ chain: 'reviews', id: r.id, label: `review ${r.id}`, problem: 'content', reason: 'the stored decision no longer matches its hash' })
  }

  breaks.push(...walkChain('audit', events.map(e => ({ id: e.id, seq: e.seq, label: `audit event ${e.seq} (${e.action})`, prevHash: e.prevHash, hash: e.hash, recomputed: auditHash(e) })), 'audit event'))
  const [auditHead] = await db.select().from(tables.chainHeads).where(eq(tables.chainHeads.name, 'audit'))
  const last = events.at(-1)
  if (auditHead && auditHead.seq > (last?.seq ?? 0)) {
    breaks.push({ chain: 'audit', id: 0, label: 'audit chain head', problem: 'missing', reason: `events ${(last?.seq ?? 0) + 1}…${auditHead.seq} are missing from the end of the trail` })
  }

  for (const s of seals) {
    const bytes = await readStored(s.storageKey)
    if (!bytes) breaks.push({ chain: 'seals', id: s.id, label: s.archiveRef, problem: 'file', reason: 'the sealed PDF is missing from storage' })
    else if (sha256Hex(bytes) !== s.pdfSha256) breaks.push({ chain: 'seals', id: s.id, label: s.archiveRef, problem: 'file', reason: 'the stored PDF no longer matches its recorded hash' })
  }

  const leaves = await db.select().from(tables.logLeaves).orderBy(asc(tables.logLeaves.leafIndex))
  const heads = await db.select().from(tables.logHeads).orderBy(asc(tables.logHeads.treeSize))
  breaks.push(...checkLog({ rows, leaves, heads, publicKeyPem: logSigningKey().publicPem }).breaks)

  return {
    ok: breaks.length === 0,
    checked: { revisions: revisions.length, reviews: reviews.length, auditEvents: events.length, seals: seals.length, logLeaves: leaves.length, heads: heads.length },
    breaks,
    firstBreak: breaks[0] ?? null,
    checkedAt: new Date().toISOString(),
  }
}
