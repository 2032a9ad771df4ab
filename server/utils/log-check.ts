// Checks the history log against the rows it covers and against every head it published: the
// tree is recomputed from the rows themselves (never from the stored leaf hashes), so a row
// deleted, reordered, inserted or edited behind the application's back no longer gives the root
// of a head signed before. Pure: rows, leaves and heads in, breaks out.
import { LOG_KINDS, rowLeafHash, type LogKind } from '../../shared/log/entry'
import { KNOWN_ROW_FORMS } from '../../shared/log/row-form'
import { leafHash, MerkleTree } from '../../shared/log/merkle'
import { keyIdOf, verifyTreeHead } from '../../shared/log/tree-head'
import { rowLabel } from '../database/history-log'

export interface LogBreak {
  chain: 'log'
  id: number
  label: string
  problem: 'missing' | 'changed' | 'unlogged' | 'head' | 'decision'
  reason: string
}

type Row = Record<string, unknown>
export interface LogCheckInput {
  rows: Record<LogKind, Map<number, Row>>
  /** `form`: the row form the leaf was written in (1 when not given) */
  leaves: Array<{ leafIndex: number, kind: LogKind, rowId: number, batch: number, leafHash: string, form?: number }>
  heads: Array<{ id: number, treeSize: number, rootHash: string, signedAt: Date, signature: string, keyId: string }>
  publicKeyPem: string
}

/** A decision (return, approve) and a seal must come with their audit event in the same transaction. */
function decisionEvent(kind: LogKind, row: Row): { actions: string[], matches: (detail: Row) => boolean } | null {
  if (kind === 'review' && (row.decision === 'approve' || row.decision === 'return')) {
    return { actions: [row.decision === 'approve' ? 'revision.approved' : 'revision.returned'], matches: d => d.reviewId === row.id }
  }
  if (kind === 'seal') return { actions: ['revision.sealed'], matches: d => d.sealId === row.id || (d.sealId === undefined && d.revisionId === row.revisionId) }
  return null
}

export function checkLog(input: LogCheckInput): { breaks: LogBreak[], tree: MerkleTree } {
  const breaks: LogBreak[] = []
  const logged = new Map<LogKind, Set<number>>(LOG_KINDS.map(k => [k, new Set()]))
  const recomputed: Buffer[] = []
  const auditByBatch = new Map<number, Row[]>()

  for (const leaf of input.leaves) {
    if (leaf.leafIndex > recomputed.length) {
      const from = recomputed.length
      breaks.push({ chain: 'log', id: from, label: `log leaf ${from}`, problem: 'missing', reason: `leaves ${from}…${leaf.leafIndex - 1} are missing from the log` })
      // keep each later leaf at its own index: the heads that cover the gap then fail on their own
      while (recomputed.length < leaf.leafIndex) recomputed.push(leafHash(`missing leaf ${recomputed.length}`))
    }
    logged.get(leaf.kind)!.add(leaf.rowId)
    const row = input.rows[leaf.kind].get(leaf.rowId)
    const label = `${rowLabel(leaf.kind, leaf.rowId)} (log leaf ${leaf.leafIndex})`
    if (!row) {
      breaks.push({ chain: 'log', id: leaf.leafIndex, label, problem: 'missing', reason: 'the row was deleted after it was logged' })
      recomputed.push(leafHash(`missing ${leaf.kind} ${leaf.rowId}`))
      continue
    }
    const form = leaf.form ?? 1
    if (!KNOWN_ROW_FORMS.includes(form)) {
      breaks.push({ chain: 'log', id: leaf.leafIndex, label, problem: 'changed', reason: `the leaf names row form ${form}, which this version of Tendonbook does not know` })
      recomputed.push(Buffer.from(leaf.leafHash, 'hex'))
      continue
    }
    const hash = rowLeafHash(leaf.kind, row, form)
    if (hash !== leaf.leafHash) breaks.push({ chain: 'log', id: leaf.leafIndex, label, problem: 'changed', reason: 'the row no longer matches the leaf it was logged as (changed after it was written)' })
    recomputed.push(Buffer.from(hash, 'hex'))
    if (leaf.kind === 'audit') auditByBatch.set(leaf.batch, [...(auditByBatch.get(leaf.batch) ?? []), row])
  }

  for (const kind of LOG_KINDS) {
    for (const id of input.rows[kind].keys()) {
      if (!logged.get(kind)!.has(id)) breaks.push({ chain: 'log', id, label: rowLabel(kind, id), problem: 'unlogged', reason: 'the row is not in the history log: it was written behind the application\'s back' })
    }
  }

  // decisions are accepted only from the session that made them: the audit event in the same batch
  const leafOf = new Map(input.leaves.map(l => [`${l.kind}:${l.rowId}`, l]))
  for (const kind of ['review', 'seal'] as const) {
    for (const [id, row] of input.rows[kind]) {
      const rule = decisionEvent(kind, row)
      if (!rule) continue
      const leaf = leafOf.get(`${kind}:${id}`)
      const events = leaf ? auditByBatch.get(leaf.batch) ?? [] : []
      const found = events.some(e => rule.actions.includes(String(e.action)) && rule.matches((e.detail ?? {}) as Row))
      if (!found) breaks.push({ chain: 'log', id, label: rowLabel(kind, id), problem: 'decision', reason: `no ${rule.actions.join(' or ')} audit event was written with it: it was not made through a signed-in session` })
    }
  }

  const tree = new MerkleTree(recomputed)
  const keyId = keyIdOf(input.publicKeyPem)
  // every head published after a forgery fails with it: one break names the first and counts the rest
  const failed = new Map<string, Array<LogCheckInput['heads'][number]>>()
  for (const head of input.heads) {
    const signed = { treeSize: head.treeSize, rootHash: head.rootHash, timestamp: head.signedAt.toISOString() }
    const reason = head.keyId !== keyId || !verifyTreeHead(signed, head.signature, input.publicKeyPem)
      ? 'its signature does not verify with the log\'s key: it was not published by this server'
      : head.treeSize > tree.size
        ? `the log now holds ${tree.size} leaves, fewer than it covered`
        : tree.root(head.treeSize).toString('hex') !== head.rootHash
          ? 'the rows no longer give the root it signed: history it covered was deleted, reordered, inserted or edited'
          : null
    if (reason) failed.set(reason, [...(failed.get(reason) ?? []), head])
  }
  for (const [reason, heads] of failed) {
    const first = heads[0]!
    const more = heads.length > 1 ? ` and ${heads.length - 1} later head${heads.length > 2 ? 's' : ''}` : ''
    breaks.push({ chain: 'log', id: first.id, label: `signed head of size ${first.treeSize} (${first.signedAt.toISOString()})${more}`, problem: 'head', reason })
  }
  return { breaks, tree }
}
