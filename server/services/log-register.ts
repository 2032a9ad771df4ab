import { and, count, desc, eq, inArray, isNotNull } from 'drizzle-orm'
import { entryLeafHash, logEntry } from '../../shared/log/entry'
import { verifyTreeHead } from '../../shared/log/tree-head'
import { rowsOf } from '../database/history-log'
import { CAUTION } from '../utils/print-templates'

const HEADS_SHOWN = 50

function signatureOk(head: PublishedHead) {
  const key = logSigningKey()
  return head.keyId === key.keyId && verifyTreeHead(head, head.signature, key.publicPem)
}

/** The latest signed head (publishing one first if the log has grown) and the heads published before it. */
export async function logRegister() {
  const latest = await publishHead()
  const h = tables.logHeads
  const rows = await useDb().select().from(h).orderBy(desc(h.treeSize)).limit(HEADS_SHOWN)
  const [{ n }] = await useDb().select({ n: count() }).from(h)
  const heads = rows.map(row => ({ id: row.id, treeSize: row.treeSize, rootHash: row.rootHash, timestamp: row.signedAt.toISOString(), signature: row.signature, keyId: row.keyId }))
  return {
    latest: { ...latest, signatureOk: signatureOk(latest) },
    heads: heads.map(head => ({ ...head, signatureOk: signatureOk(head) })),
    totalHeads: n,
    publicKey: logSigningKey().publicPem,
  }
}

/**
 * The inclusion proof of a seal's leaf in the latest signed head (RFC 6962 §2.1.1), with the seal
 * row's entry so that anyone can recompute the leaf. Null for a seal that is not in the log.
 */
export async function sealInclusion(sealId: number, head: PublishedHead) {
  const leafIndex = await leafIndexOf('seal', sealId)
  if (leafIndex === null || leafIndex >= head.treeSize) return null
  const row = (await rowsOf(useDb(), 'seal', [sealId])).get(sealId)
  if (!row) return null
  const entry = logEntry('seal', row)
  const tree = await storedTree(head.treeSize)
  return {
    leafIndex,
    entry,
    leafHash: entryLeafHash(entry),
    proof: tree.inclusionProof(leafIndex, head.treeSize).map(p => p.toString('hex')),
    head: { treeSize: head.treeSize, rootHash: head.rootHash, timestamp: head.timestamp, signatureOk: signatureOk(head) },
  }
}

/**
 * The head file for offline checking (`npm run verify -- <pdf> --head <file>`): the latest signed
 * head, its signature and the public key, and for every sealed document the inclusion proof of its
 * seal and of its revision, and the consistency proof from the head it was sealed under.
 */
export async function exportHead(userId: number) {
  const head = await publishHead()
  const tree = await storedTree(head.treeSize)
  const s = tables.seals
  const seals = await useDb().select({ id: s.id, revisionId: s.revisionId, archiveRef: s.archiveRef, pdfSha256: s.pdfSha256, logLeafIndex: s.logLeafIndex, headTreeSize: s.headTreeSize, headRootHash: s.headRootHash, contentHash: tables.revisions.contentHash })
    .from(s).innerJoin(tables.revisions, eq(tables.revisions.id, s.revisionId)).innerJoin(tables.sheets, eq(tables.sheets.id, tables.revisions.sheetId))
    .where(and(isNotNull(s.logLeafIndex), isNotNull(s.headTreeSize), inArray(tables.sheets.projectId, [0, ...await memberProjectIds(userId, 'records')])))
  const documents = []
  for (const seal of seals) {
    const inclusion = await sealInclusion(seal.id, head)
    if (!inclusion || seal.logLeafIndex === null || seal.headTreeSize === null || seal.headTreeSize > head.treeSize) continue
    documents.push({
      archiveRef: seal.archiveRef,
      pdfSha256: seal.pdfSha256,
      contentHash: seal.contentHash,
      seal: { leafIndex: inclusion.leafIndex, entry: inclusion.entry, proof: inclusion.proof },
      revision: { leafIndex: seal.logLeafIndex, leafHash: tree.leaf(seal.logLeafIndex).toString('hex'), proof: tree.inclusionProof(seal.logLeafIndex, head.treeSize).map(p => p.toString('hex')) },
      sealedUnder: { treeSize: seal.headTreeSize, rootHash: seal.headRootHash, consistency: tree.consistencyProof(seal.headTreeSize, head.treeSize).map(p => p.toString('hex')) },
    })
  }
  const key = logSigningKey()
  return {
    format: 'tendonbook.head-export.v1',
    caution: CAUTION,
    head: { treeSize: head.treeSize, rootHash: head.rootHash, timestamp: head.timestamp },
    signature: head.signature,
    keyId: key.keyId,
    publicKey: key.publicPem,
    documents,
  }
}
