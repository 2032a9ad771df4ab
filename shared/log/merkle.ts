// The Merkle tree of the history log, in the manner of RFC 6962 §2.1 (RFC 9162 §2.1 for the
// verification steps). Pure functions over bytes: the server, the offline verifier
// (scripts/verify.ts) and the unit tests all use this one module.
import { createHash } from 'node:crypto'

export type Hash = Buffer

/** SHA-256 of the empty string: the root of a tree without leaves (RFC 6962 §2.1). */
export const EMPTY_ROOT: Hash = createHash('sha256').digest()

function sha256(...parts: Uint8Array[]): Hash {
  const h = createHash('sha256')
  for (const part of parts) h.update(part)
  return h.digest()
}

/** RFC 6962 §2.1: leaf hash = SHA-256(0x00 ‖ entry). */
export function leafHash(entry: string | Uint8Array): Hash {
  return sha256(Uint8Array.of(0), typeof entry === 'string' ? Buffer.from(entry, 'utf8') : entry)
}

/** RFC 6962 §2.1: interior node = SHA-256(0x01 ‖ left ‖ right). */
export function nodeHash(left: Uint8Array, right: Uint8Array): Hash {
  return sha256(Uint8Array.of(1), left, right)
}

/** The largest power of two strictly below n (n ≥ 2): where RFC 6962 splits a tree of n leaves. */
export function splitPoint(n: number): number {
  let k = 1
  while (k * 2 < n) k *= 2
  return k
}

function isPowerOfTwo(n: number) {
  return n > 0 && (n & (n - 1)) === 0
}

/** Hex or bytes in, bytes out: proofs travel as hex in JSON. */
export function toHash(value: string | Uint8Array): Hash {
  if (typeof value !== 'string') return Buffer.from(value)
  if (!/^[0-9a-f]{64}$/i.test(value)) throw new TypeError(`not a SHA-256 in hex: "${value.slice(0, 80)}"`)
  return Buffer.from(value, 'hex')
}

/**
 * A tree over a list of leaf hashes. Every complete, aligned subtree is hashed once up front, so
 * the root of any earlier size and every proof costs O(log² n) lookups instead of a full rehash.
 */
export class MerkleTree {
  private readonly levels: Hash[][]

  constructor(leaves: readonly Uint8Array[]) {
    this.levels = [leaves.map(l => Buffer.from(l))]
    for (let level = this.levels[0]!; level.length > 1;) {
      const up: Hash[] = []
      for (let i = 0; i + 1 < level.length; i += 2) up.push(nodeHash(level[i]!, level[i + 1]!))
      this.levels.push(up)
      level = up
    }
  }

  get size() {
    return this.levels[0]!.length
  }

  leaf(index: number): Hash {
    this.checkRange(index, 0, this.size - 1, 'leaf index')
    return this.levels[0]![index]!
  }

  /** MTH(D[start:end]) of RFC 6962 §2.1; `start` is always aligned to the subtrees the split makes. */
  private mth(start: number, end: number): Hash {
    const n = end - start
    if (n === 0) return EMPTY_ROOT
    if (isPowerOfTwo(n) && start % n === 0) return this.levels[Math.log2(n)]![start / n]!
    const k = splitPoint(n)
    return nodeHash(this.mth(start, start + k), this.mth(start + k, end))
  }

  /** The root of the tree made of the first `size` leaves. */
  root(size = this.size): Hash {
    this.checkRange(size, 0, this.size, 'tree size')
    return this.mth(0, size)
  }

  /** RFC 6962 §2.1.1 PATH(m, D[n]): the audit path of leaf m in the tree of the first n leaves. */
  inclusionProof(index: number, size = this.size): Hash[] {
    this.checkRange(size, 1, this.size, 'tree size')
    this.checkRange(index, 0, size - 1, 'leaf index')
    const path = (m: number, start: number, end: number): Hash[] => {
      const n = end - start
      if (n === 1) return []
      const k = splitPoint(n)
      return m < k
        ? [...path(m, start, start + k), this.mth(start + k, end)]
        : [...path(m - k, start + k, end), this.mth(start, start + k)]
    }
    return path(index, 0, size)
  }

  /** RFC 6962 §2.1.2 PROOF(m, D[n]): that the tree of m leaves is a prefix of the tree of n. */
  consistencyProof(m: number, n = this.size): Hash[] {
    this.checkRange(n, 0, this.size, 'tree size')
    this.checkRange(m, 0, n, 'older tree size')
    if (m === 0 || m === n) return []
    const subproof = (mm: number, start: number, end: number, complete: boolean): Hash[] => {
      const size = end - start
      if (mm === size) return complete ? [] : [this.mth(start, end)]
      const k = splitPoint(size)
      return mm <= k
        ? [...subproof(mm, start, start + k, complete), this.mth(start + k, end)]
        : [...subproof(mm - k, start + k, end, false), this.mth(start, start + k)]
    }
    return subproof(m, 0, n, true)
  }

  private checkRange(value: number, low: number, high: number, what: string) {
    if (!Number.isInteger(value) || value < low || value > high) throw new RangeError(`${what} ${value} is outside ${low}…${high}`)
  }
}

/**
 * One level up a proof (RFC 9162 §2.1.3.2 step 3, §2.1.4.2 step 6): whether the next proof hash
 * sits to the left of the running hash, and the indexes `fn`, `sn` of the level above.
 */
function climb(fn: number, sn: number) {
  const left = (fn & 1) === 1 || fn === sn
  if (left) {
    while ((fn & 1) === 0 && fn !== 0) {
      fn = Math.floor(fn / 2)
      sn = Math.floor(sn / 2)
    }
  }
  return { left, fn: Math.floor(fn / 2), sn: Math.floor(sn / 2) }
}

/** RFC 9162 §2.1.3.2: checks an audit path of leaf `index` in a tree of `size` against `root`. */
export function verifyInclusion(index: number, size: number, leaf: string | Uint8Array, proof: ReadonlyArray<string | Uint8Array>, root: string | Uint8Array): boolean {
  if (!Number.isInteger(index) || !Number.isInteger(size) || index < 0 || index >= size) return false
  let fn = index
  let sn = size - 1
  let r = toHash(leaf)
  for (const item of proof) {
    if (sn === 0) return false
    const p = toHash(item)
    const up = climb(fn, sn)
    r = up.left ? nodeHash(p, r) : nodeHash(r, p)
    fn = up.fn
    sn = up.sn
  }
  return sn === 0 && r.equals(toHash(root))
}

/**
 * RFC 9162 §2.1.4.2: checks that the tree of `first` leaves with root `firstRoot` is a prefix of
 * the tree of `second` leaves with root `secondRoot`. Equal sizes need equal roots and no proof;
 * every tree extends the empty one.
 */
export function verifyConsistency(first: number, second: number, firstRoot: string | Uint8Array, secondRoot: string | Uint8Array, proof: ReadonlyArray<string | Uint8Array>): boolean {
  if (!Number.isInteger(first) || !Number.isInteger(second) || first < 0 || first > second) return false
  const oldRoot = toHash(firstRoot)
  const newRoot = toHash(secondRoot)
  if (first === 0) return proof.length === 0 && oldRoot.equals(EMPTY_ROOT)
  if (first === second) return proof.length === 0 && oldRoot.equals(newRoot)
  if (proof.length === 0) return false
  const path = proof.map(toHash)
  if (isPowerOfTwo(first)) path.unshift(oldRoot)
  let fn = first - 1
  let sn = second - 1
  while ((fn & 1) === 1) {
    fn = Math.floor(fn / 2)
    sn = Math.floor(sn / 2)
  }
  let fr = path[0]!
  let sr = path[0]!
  for (const c of path.slice(1)) {
    if (sn === 0) return false
    const up = climb(fn, sn)
    if (up.left) {
      fr = nodeHash(c, fr)
      sr = nodeHash(c, sr)
    }
    else {
      sr = nodeHash(sr, c)
    }
    fn = up.fn
    sn = up.sn
  }
  return fr.equals(oldRoot) && sr.equals(newRoot) && sn === 0
}
