import { generateKeyPairSync } from 'node:crypto'
import { describe, expect, it } from 'vitest'
import { entryLeafHash, LOG_KINDS, logEntry, type LogKind } from '../../../shared/log/entry'
import { MerkleTree } from '../../../shared/log/merkle'
import { signTreeHead } from '../../../shared/log/tree-head'
import { checkLog, type LogCheckInput } from '../../../server/utils/log-check'

const { privateKey, publicKey } = generateKeyPairSync('ed25519')
const publicKeyPem = publicKey.export({ type: 'spki', format: 'pem' }).toString()
const keyId = (await import('../../../shared/log/tree-head')).keyIdOf(publicKeyPem)

type Row = Record<string, unknown>
const at = new Date('2026-03-01T10:00:00.000Z')

/** A small consistent history: a review with its audit event, a seal with its audit event, heads after each batch. */
function history() {
  const rows = Object.fromEntries(LOG_KINDS.map(k => [k, new Map<number, Row>()])) as Record<LogKind, Map<number, Row>>
  rows.revision.set(1, { id: 1, seq: 1, note: 'first', issuedAt: at })
  rows.review.set(7, { id: 7, revisionId: 1, decision: 'approve', comments: [] })
  rows.audit.set(20, { id: 20, action: 'revision.approved', detail: { reviewId: 7 } })
  rows.seal.set(3, { id: 3, revisionId: 1, pdfSha256: 'ab'.repeat(32) })
  rows.audit.set(21, { id: 21, action: 'revision.sealed', detail: { revisionId: 1, sealId: 3 } })
  const order: Array<[LogKind, number, number]> = [['revision', 1, 0], ['review', 7, 1], ['audit', 20, 1], ['seal', 3, 3], ['audit', 21, 3]]
  const leaves = order.map(([kind, rowId, batch], leafIndex) => ({ leafIndex, kind, rowId, batch, leafHash: entryLeafHash(logEntry(kind, rows[kind].get(rowId)!)) }))
  const tree = new MerkleTree(leaves.map(l => Buffer.from(l.leafHash, 'hex')))
  const heads = [1, 3, 5].map((treeSize, i) => {
    const head = { treeSize, rootHash: tree.root(treeSize).toString('hex'), timestamp: new Date(at.getTime() + i * 1000).toISOString() }
    return { id: i + 1, treeSize, rootHash: head.rootHash, signedAt: new Date(head.timestamp), signature: signTreeHead(head, privateKey), keyId }
  })
  return { rows, leaves, heads, publicKeyPem } satisfies LogCheckInput
}

const problems = (input: LogCheckInput) => checkLog(input).breaks.map(b => `${b.problem} ${b.label}`)

describe('checking the history log against its rows and heads', () => {
  it('finds nothing wrong with an untouched history', () => {
    expect(checkLog(history()).breaks).toEqual([])
  })

  it('flags an edited row, and the heads that covered it', () => {
    const h = history()
    h.rows.revision.set(1, { ...h.rows.revision.get(1)!, note: 'rewritten' })
    expect(problems(h)).toEqual([
      'changed revision 1 (log leaf 0)',
      'head signed head of size 1 (2026-03-01T10:00:00.000Z) and 2 later heads',
    ])
  })

  it('flags a deleted row and a deleted leaf', () => {
    const h = history()
    h.rows.seal.delete(3)
    expect(problems(h)).toContain('missing seal 3 (log leaf 3)')
    const g = history()
    g.leaves.splice(1, 1)
    const found = checkLog(g).breaks
    expect(found.map(b => b.problem)).toEqual(expect.arrayContaining(['missing', 'unlogged', 'decision', 'head']))
    expect(found.find(b => b.problem === 'missing')!.reason).toBe('leaves 1…1 are missing from the log')
  })

  it('flags a row inserted behind the application\'s back, and a decision without its audit event', () => {
    const h = history()
    h.rows.review.set(8, { id: 8, revisionId: 1, decision: 'return', comments: [] })
    expect(problems(h)).toEqual(['unlogged review 8', 'decision review 8'])
  })

  it('flags reordered leaves against the heads signed before', () => {
    const h = history()
    const [a, b] = [h.leaves[3]!, h.leaves[4]!]
    h.leaves[3] = { ...b, leafIndex: 3 }
    h.leaves[4] = { ...a, leafIndex: 4 }
    expect(problems(h)).toEqual(['head signed head of size 5 (2026-03-01T10:00:02.000Z)'])
  })

  it('flags a head whose signature does not verify, and a head larger than the log', () => {
    const h = history()
    h.heads.push({ ...h.heads[2]!, id: 4, treeSize: 6, signature: h.heads[2]!.signature })
    const other = generateKeyPairSync('ed25519').privateKey
    const forged = { treeSize: 5, rootHash: h.heads[2]!.rootHash, timestamp: at.toISOString() }
    h.heads[2] = { ...h.heads[2]!, signedAt: at, signature: signTreeHead(forged, other) }
    const found = checkLog(h).breaks
    expect(found.map(b => b.reason)).toEqual([
      'its signature does not verify with the log\'s key: it was not published by this server',
    ])
    expect(found[0]!.label).toContain('and 1 later head')
    const g = history()
    const longer = { treeSize: 9, rootHash: g.heads[2]!.rootHash, timestamp: at.toISOString() }
    g.heads.push({ id: 9, treeSize: 9, rootHash: longer.rootHash, signedAt: at, signature: signTreeHead(longer, privateKey), keyId })
    expect(checkLog(g).breaks.map(b => b.reason)).toEqual(['the log now holds 5 leaves, fewer than it covered'])
  })
})
