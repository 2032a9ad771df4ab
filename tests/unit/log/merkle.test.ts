import { createHash } from 'node:crypto'
import { describe, expect, it } from 'vitest'
import { EMPTY_ROOT, leafHash, MerkleTree, nodeHash, verifyConsistency, verifyInclusion } from '../../../shared/log/merkle'
import { prng } from '../../helpers/prng'

// Leaves are the strings "entry 0" … "entry 6". Every hash below was worked out by hand with
// Python's hashlib (leaf = SHA-256(0x00 ‖ entry), node = SHA-256(0x01 ‖ left ‖ right), RFC 6962 §2.1),
// not with the module under test.
const L = [
  '773885a613489e24ce2cf76199d6a423f042e4bbf12d7eecee912ef276c65701',
  '2dfb36c6f66cac361429cf46df868ab8242d3a6441f1099c8fb3f98ec5d108a4',
  '57c79f4f31ae029c5d4bd30b073c27c94df93438b2b4697e1e1eef5bc0394a41',
  '61ca1139f6815841d5baf2d0d2d9bd9dfee97c898dd6f7ba0c0aa941ee6c01eb',
  '485335db7cfec965f15ff745fc625c41d5ea2646936930165828f73dd4b68854',
  '9ff537b618a257ef82908c45915acbaeb6d9dea035d6d93964fc88c19e98c8b3',
  'be15781b628a28414c1c8a11b86db8422fa1041215fe0d7c4496d23cda1e4142',
]
const a01 = '5a47662fd8a317d96049a3f9f47c55dc67ca66051baa3683dbb19b2fe09a07b0'
const a23 = 'ddbde80fccdeb3198ef69b8e1f0934fbce296c6babfb738574a4f62972266793'
const a45 = 'dd0379d83ac7f164e7eea30cdcefb57508254c48f766afccd3d976365e328ccc'
const a0123 = '9799f307517ef517c2205df9b67762bf34756b20099fb7dfcce76bcebd273b2e'
const a456 = '94afb8a2ca051c05458ea39dcd19b1bd68e7e33529f10b439d2a615a51f636e2'
// size 3: node(a01, L2); size 5: node(a0123, L4); size 7: node(a0123, a456)
const ROOT3 = '94fbd0dd836f50301692e6d0eade728ee19ec52bfff1606ed807c8575d5aaa19'
const ROOT5 = '7caa345dbd892a66454d6c6512ea3c3ea3f0d3ec21be3fc2e2375705fd38f672'
const ROOT7 = '98c97f0ba3175cd08b031dd084b9dc4e649b64d1a28e6ea694646503173ab587'

const hex = (hashes: Uint8Array[]) => hashes.map(h => Buffer.from(h).toString('hex'))
const entries = (n: number) => Array.from({ length: n }, (_, i) => leafHash(`entry ${i}`))

/** RFC 6962 §2.1 MTH written as the recursion in the text, to check the cached tree against. */
function mth(leaves: Buffer[]): Buffer {
  if (leaves.length === 0) return createHash('sha256').digest()
  if (leaves.length === 1) return leaves[0]!
  let k = 1
  while (k * 2 < leaves.length) k *= 2
  return nodeHash(mth(leaves.slice(0, k)), mth(leaves.slice(k)))
}

describe('hand-built trees of 3, 5 and 7 leaves', () => {
  const tree = new MerkleTree(entries(7))

  it('hashes leaves and nodes with the RFC 6962 prefixes', () => {
    expect(hex(entries(7))).toEqual(L)
    expect(nodeHash(Buffer.from(L[0]!, 'hex'), Buffer.from(L[1]!, 'hex')).toString('hex')).toBe(a01)
    expect(EMPTY_ROOT.toString('hex')).toBe('e3b0c44298fc1c149afbf4c8996fb92427ae41e4649b934ca495991b7852b855')
  })

  it('has the roots worked out by hand', () => {
    expect(tree.root(3).toString('hex')).toBe(ROOT3)
    expect(tree.root(5).toString('hex')).toBe(ROOT5)
    expect(tree.root(7).toString('hex')).toBe(ROOT7)
    expect(new MerkleTree(entries(3)).root().toString('hex')).toBe(ROOT3)
    expect(new MerkleTree([]).root().equals(EMPTY_ROOT)).toBe(true)
  })

  it('gives the audit paths of RFC 6962 §2.1.1 and they verify', () => {
    expect(hex(tree.inclusionProof(0, 3))).toEqual([L[1], L[2]])
    expect(hex(tree.inclusionProof(2, 3))).toEqual([a01])
    expect(hex(tree.inclusionProof(2, 5))).toEqual([L[3], a01, L[4]])
    expect(hex(tree.inclusionProof(4, 5))).toEqual([a0123])
    expect(hex(tree.inclusionProof(6, 7))).toEqual([a45, a0123])
    expect(hex(tree.inclusionProof(3, 7))).toEqual([L[2], a01, a456])
    expect(verifyInclusion(2, 5, L[2]!, [L[3]!, a01, L[4]!], ROOT5)).toBe(true)
    expect(verifyInclusion(6, 7, L[6]!, [a45, a0123], ROOT7)).toBe(true)
    expect(verifyInclusion(0, 3, L[0]!, [L[1]!, L[2]!], ROOT3)).toBe(true)
    // the right leaf at the wrong place, the wrong leaf at the right place, the wrong root
    expect(verifyInclusion(1, 3, L[0]!, [L[1]!, L[2]!], ROOT3)).toBe(false)
    expect(verifyInclusion(0, 3, L[1]!, [L[1]!, L[2]!], ROOT3)).toBe(false)
    expect(verifyInclusion(0, 3, L[0]!, [L[1]!, L[2]!], ROOT5)).toBe(false)
    expect(verifyInclusion(3, 3, L[0]!, [], ROOT3)).toBe(false)
  })

  it('gives the consistency proofs of RFC 6962 §2.1.2 and they verify', () => {
    expect(hex(tree.consistencyProof(3, 7))).toEqual([L[2], L[3], a01, a456])
    expect(hex(tree.consistencyProof(4, 5))).toEqual([L[4]])
    expect(hex(tree.consistencyProof(3, 5))).toEqual([L[2], L[3], a01, L[4]])
    expect(hex(tree.consistencyProof(5, 7))).toEqual([L[4], L[5], L[6], a0123])
    expect(verifyConsistency(3, 7, ROOT3, ROOT7, [L[2]!, L[3]!, a01, a456])).toBe(true)
    expect(verifyConsistency(3, 5, ROOT3, ROOT5, [L[2]!, L[3]!, a01, L[4]!])).toBe(true)
    expect(verifyConsistency(5, 7, ROOT5, ROOT7, [L[4]!, L[5]!, L[6]!, a0123])).toBe(true)
    expect(verifyConsistency(3, 7, ROOT5, ROOT7, [L[2]!, L[3]!, a01, a456])).toBe(false)
    expect(verifyConsistency(3, 7, ROOT3, ROOT5, [L[2]!, L[3]!, a01, a456])).toBe(false)
    expect(verifyConsistency(7, 7, ROOT7, ROOT7, [])).toBe(true)
    expect(verifyConsistency(7, 3, ROOT7, ROOT3, [])).toBe(false)
    expect(verifyConsistency(3, 7, ROOT3, ROOT7, [])).toBe(false)
  })
})

describe('seeded random trees', () => {
  const random = prng(6962)
  const sizes = [1, 2, 3, 4, 8, 9, 16, 17, ...Array.from({ length: 8 }, () => 2 + Math.floor(random() * 70))]

  it.each(sizes)('tree of %i leaves: every leaf is proven included, every older size consistent', (n) => {
    const leaves = Array.from({ length: n }, () => leafHash(String(random())))
    const tree = new MerkleTree(leaves)
    for (let size = 0; size <= n; size++) expect(tree.root(size).equals(mth(leaves.slice(0, size)))).toBe(true)
    for (let size = 1; size <= n; size++) {
      const root = tree.root(size)
      for (let i = 0; i < size; i++) expect(verifyInclusion(i, size, leaves[i]!, tree.inclusionProof(i, size), root), `leaf ${i} of ${size}`).toBe(true)
      expect(verifyConsistency(size, n, root, tree.root(), tree.consistencyProof(size, n)), `size ${size} → ${n}`).toBe(true)
    }
  })

  it.each(sizes.filter(n => n >= 2))('tree of %i leaves: a changed, deleted, reordered or inserted leaf fails against an earlier head', (n) => {
    const leaves = Array.from({ length: n }, () => leafHash(String(random())))
    const original = new MerkleTree(leaves)
    const at = Math.floor(random() * (n - 1))
    const other = (at + 1 + Math.floor(random() * (n - 1 - at))) % n
    const forgeries: Record<string, Buffer[]> = {
      changed: leaves.map((l, i) => (i === at ? leafHash('forged') : l)),
      deleted: [...leaves.slice(0, at), ...leaves.slice(at + 1), leafHash('padding so the size stays')],
      reordered: leaves.map((l, i) => (i === at ? leaves[other]! : i === other ? leaves[at]! : l)),
      inserted: [...leaves.slice(0, at), leafHash('inserted'), ...leaves.slice(at)],
    }
    for (const [what, forged] of Object.entries(forgeries)) {
      const tree = new MerkleTree(forged)
      // a head published before the forgery, covering the forged place
      const headSize = Math.max(at, other) + 1
      const headRoot = original.root(headSize)
      const proof = tree.consistencyProof(headSize, tree.size)
      expect(verifyConsistency(headSize, tree.size, headRoot, tree.root(), proof), what).toBe(false)
      expect(tree.root(headSize).equals(headRoot), what).toBe(false)
      // the original leaf at its index no longer proves into the forged tree
      expect(verifyInclusion(at, tree.size, leaves[at]!, tree.inclusionProof(at, tree.size), tree.root()), what).toBe(false)
    }
  })

  it('rejects a proof with one flipped bit', () => {
    const tree = new MerkleTree(entries(7))
    const proof = tree.inclusionProof(3, 7)
    proof[1] = Buffer.from(proof[1]!)
    proof[1][0]! ^= 1
    expect(verifyInclusion(3, 7, tree.leaf(3), proof, tree.root())).toBe(false)
    const consistency = tree.consistencyProof(3, 7)
    consistency[0] = Buffer.from(consistency[0]!)
    consistency[0][31]! ^= 0x80
    expect(verifyConsistency(3, 7, tree.root(3), tree.root(), consistency)).toBe(false)
  })
})
