import { readFileSync } from 'node:fs'
import { asc, desc, eq, gte, and, lt } from 'drizzle-orm'
import { MerkleTree } from '../../shared/log/merkle'
import { publicKeyOf, signTreeHead, type TreeHead } from '../../shared/log/tree-head'
import type { LogKind } from '../../shared/log/entry'
import { appendToLog, type Runner, type WrittenColumns } from '../database/history-log'
import type { Tx } from './audit'
import { markIdempotentWorkDone } from './idempotency'

let signingKey: { privatePem: string, publicPem: string, keyId: string } | undefined

/**
 * The Ed25519 key that signs tree heads, read from the file named by runtime config
 * `log.signingKeyPath` (NUXT_LOG_SIGNING_KEY_PATH). It lives outside the database, so nobody who
 * can only write to the database can sign a head. scripts/db.mjs makes it once per data folder.
 */
export function logSigningKey() {
  if (signingKey) return signingKey
  const path = (useRuntimeConfig().log as { signingKeyPath?: string } | undefined)?.signingKeyPath
  if (!path) throw createError({ statusCode: 500, message: 'The history log has no signing key configured (NUXT_LOG_SIGNING_KEY_PATH)' })
  let privatePem: string
  try {
    privatePem = readFileSync(path, 'utf8')
  }
  catch {
    throw createError({ statusCode: 500, message: `The history log signing key is missing at ${path}` })
  }
  const pub = publicKeyOf(privatePem)
  signingKey = { privatePem, publicPem: pub.pem, keyId: pub.id }
  return signingKey
}

// Leaf hashes already read, by index: the log only grows, so a publish reads only the new ones.
const knownLeaves: Buffer[] = []

/**
 * The first `size` leaf hashes. `runner` is the transaction of a caller that holds a lock: reading
 * through another pooled connection there could wait for a connection held by a request that is
 * itself waiting for that lock (the pool starved, every request stuck until the lock wait times out).
 */
async function leafHashesUpTo(size: number, runner: Pick<Runner, 'select'> = useDb()) {
  if (knownLeaves.length < size) {
    const l = tables.logLeaves
    const rows = await runner.select({ leafIndex: l.leafIndex, leafHash: l.leafHash }).from(l)
      .where(and(gte(l.leafIndex, knownLeaves.length), lt(l.leafIndex, size))).orderBy(asc(l.leafIndex))
    for (const row of rows) {
      // another read of this process may have added these leaves while this one waited for its rows
      if (row.leafIndex < knownLeaves.length) continue
      if (row.leafIndex !== knownLeaves.length) throw createError({ statusCode: 500, message: `The history log has no leaf ${knownLeaves.length}` })
      knownLeaves.push(Buffer.from(row.leafHash, 'hex'))
    }
  }
  return knownLeaves.slice(0, size)
}

export type PublishedHead = TreeHead & { id: number, signature: string, keyId: string }

function asPublished(row: typeof tables.logHeads.$inferSelect): PublishedHead {
  return { id: row.id, treeSize: row.treeSize, rootHash: row.rootHash, timestamp: row.signedAt.toISOString(), signature: row.signature, keyId: row.keyId }
}

/**
 * The latest signed tree head, first publishing a new one when the log has grown since: reads the
 * committed size, computes the root of that many leaves, signs and stores it. The `log-heads` row
 * of chain_heads serialises publishers; appends are never held up by it.
 */
export async function publishHead(): Promise<PublishedHead> {
  const key = logSigningKey()
  return useDb().transaction(async (tx) => {
    const heads = tables.chainHeads
    await tx.select().from(heads).where(eq(heads.name, 'log-heads')).for('update')
    const [last] = await tx.select().from(tables.logHeads).orderBy(desc(tables.logHeads.treeSize)).limit(1)
    const [log] = await tx.select({ seq: heads.seq }).from(heads).where(eq(heads.name, 'log'))
    const size = log?.seq ?? 0
    if (last && last.treeSize >= size) return asPublished(last)
    const tree = new MerkleTree(await leafHashesUpTo(size, tx))
    const head: TreeHead = { treeSize: size, rootHash: tree.root().toString('hex'), timestamp: new Date().toISOString() }
    const signature = signTreeHead(head, key.privatePem)
    const [{ id }] = await tx.insert(tables.logHeads).values({ treeSize: head.treeSize, rootHash: head.rootHash, signedAt: new Date(head.timestamp), signature, keyId: key.keyId }).$returningId()
    await tx.update(heads).set({ seq: size, hash: head.rootHash }).where(eq(heads.name, 'log-heads'))
    return { ...head, id, signature, keyId: key.keyId }
  }, { isolationLevel: 'read committed' })
}

/** Runs `work` as one transaction, then publishes a signed head covering what it appended. */
export async function historyTransaction<T>(work: (tx: Tx) => Promise<T>, config?: Parameters<ReturnType<typeof useDb>['transaction']>[1]): Promise<T> {
  // a request under an Idempotency-Key records, in the same commit, that its work was done
  const result = await useDb().transaction(async (tx) => {
    const out = await work(tx)
    await markIdempotentWorkDone(tx, out)
    return out
  }, config)
  await publishHead()
  return result
}

/**
 * Appends a row just written in `tx` to the log. Where the row carries a content hash, the row as
 * the database gives it back must give that same hash, or nothing is written: what is hashed is
 * exactly what is stored. `written` names the large columns the caller wrote from storedJson or
 * storedText, so their unchanged text is hashed from the pieces already made. @throws 422 when the stored row
 * differs from what was hashed.
 */
export async function logWrittenRow<R>(tx: Tx, kind: LogKind, id: number, content?: { hash: string, of: (row: R) => string, written?: WrittenColumns }) {
  const [appended] = await appendToLog(tx, [{ kind, id, written: content?.written }])
  if (content && content.of(appended!.row as R) !== content.hash) {
    throw createError({ statusCode: 422, message: `The ${kind} could not be stored exactly as written (the database changed some of its text), so nothing was saved` })
  }
  return appended!
}

/** The leaf index of a history row, or null when it is not in the log. */
export async function leafIndexOf(kind: LogKind, rowId: number) {
  const l = tables.logLeaves
  const [row] = await useDb().select({ leafIndex: l.leafIndex }).from(l).where(and(eq(l.kind, kind), eq(l.rowId, rowId)))
  return row?.leafIndex ?? null
}

/** A tree over the stored leaf hashes of the first `size` leaves, for proofs. */
export async function storedTree(size: number) {
  return new MerkleTree(await leafHashesUpTo(size))
}
