// npm run verify -- <copy.pdf | sha256> [--head exported-head.json]
// Checks a copy of a sealed document OFFLINE, with no server: against a head file exported from the
// archive register ("Export head"). The head's Ed25519 signature, the seal's leaf and its inclusion
// proof (RFC 6962 §2.1.1), the revision's leaf printed on the PDF, and the consistency of the head
// the PDF was sealed under with the exported one (§2.1.2). Exit 0 verified, 1 not verified, 2 usage.
import { existsSync, readFileSync } from 'node:fs'
import { resolve } from 'node:path'
import { PDFDocument } from 'pdf-lib'
import { sha256Hex } from '../shared/log/canonical'
import { entryLeafHash } from '../shared/log/entry'
import { verifyConsistency, verifyInclusion } from '../shared/log/merkle'
import { keyIdOf, verifyTreeHead, type TreeHead } from '../shared/log/tree-head'

interface ExportedDocument {
  archiveRef: string
  pdfSha256: string
  contentHash: string
  seal: { leafIndex: number, entry: string, proof: string[] }
  revision: { leafIndex: number, leafHash: string, proof: string[] }
  sealedUnder: { treeSize: number, rootHash: string, consistency: string[] }
}
interface HeadFile {
  format: string
  caution: string
  head: TreeHead
  signature: string
  keyId: string
  publicKey: string
  documents: ExportedDocument[]
}

interface CheckResult { ok: boolean, lines: string[] }

/** Reads the history-log stamp the sealing wrote into the PDF's keywords. */
async function pdfStamp(bytes: Uint8Array) {
  const doc = await PDFDocument.load(bytes, { updateMetadata: false })
  const keywords = doc.getKeywords() ?? ''
  const leaf = /log-leaf:(\d+)/.exec(keywords)
  const head = /log-head:(\d+):([0-9a-f]{64})/.exec(keywords)
  return { leafIndex: leaf ? Number(leaf[1]) : null, treeSize: head ? Number(head[1]) : null, rootHash: head?.[2] ?? null, keywords }
}

async function checkCopy(target: { bytes?: Uint8Array, hash?: string }, file: HeadFile): Promise<CheckResult> {
  const lines: string[] = []
  let ok = true
  const check = (passed: boolean, what: string) => {
    lines.push(`${passed ? '✓' : '✗'} ${what}`)
    ok &&= passed
    return passed
  }
  if (file.format !== 'tendonbook.head-export.v1') return { ok: false, lines: [`✗ not a Tendonbook head file (format "${file.format}")`] }
  check(keyIdOf(file.publicKey) === file.keyId, `public key ${file.keyId.slice(0, 16)}… is the key the head names`)
  check(verifyTreeHead(file.head, file.signature, file.publicKey), `head of size ${file.head.treeSize} signed ${file.head.timestamp}: signature verifies`)

  const hash = target.bytes ? sha256Hex(target.bytes) : target.hash!.toLowerCase()
  lines.push(`  SHA-256 ${hash}`)
  const doc = file.documents.find(d => d.pdfSha256 === hash || d.contentHash === hash)
  if (!check(doc !== undefined, 'a sealed document in the head file has this hash')) return { ok: false, lines }
  lines.push(`  ${doc!.archiveRef}`)
  const { seal, revision, sealedUnder } = doc!

  const entry = JSON.parse(seal.entry) as { kind: string, row: Record<string, unknown> }
  check(entry.kind === 'seal' && entry.row.pdfSha256 === doc!.pdfSha256, 'the seal leaf records this PDF\'s SHA-256')
  check(verifyInclusion(seal.leafIndex, file.head.treeSize, entryLeafHash(seal.entry), seal.proof, file.head.rootHash), `seal leaf ${seal.leafIndex} is included in the signed head`)
  check(entry.row.logLeafIndex === revision.leafIndex && verifyInclusion(revision.leafIndex, file.head.treeSize, revision.leafHash, revision.proof, file.head.rootHash), `revision leaf ${revision.leafIndex} is included in the signed head`)
  check(entry.row.headTreeSize === sealedUnder.treeSize && entry.row.headRootHash === sealedUnder.rootHash
    && verifyConsistency(sealedUnder.treeSize, file.head.treeSize, sealedUnder.rootHash, file.head.rootHash, sealedUnder.consistency),
  `the head it was sealed under (size ${sealedUnder.treeSize}) is a prefix of the signed head`)

  if (target.bytes) {
    const stamp = await pdfStamp(target.bytes)
    check(stamp.leafIndex === revision.leafIndex && stamp.treeSize === sealedUnder.treeSize && stamp.rootHash === sealedUnder.rootHash,
      `the PDF names leaf ${stamp.leafIndex ?? '(none)'} and head size ${stamp.treeSize ?? '(none)'} as sealed`)
    check(stamp.keywords.includes(doc!.contentHash), 'the PDF names the revision\'s content hash')
  }
  lines.push(ok ? 'VERIFIED: this is the sealed document, logged under the signed head.' : 'NOT VERIFIED.')
  lines.push(file.caution)
  return { ok, lines }
}

async function main(args: string[]) {
  const at = args.indexOf('--head')
  const headPath = resolve(at >= 0 ? args[at + 1] ?? '' : 'tendonbook-head.json')
  const subject = args.find((a, i) => !a.startsWith('--') && (at < 0 || i !== at + 1))
  if (!subject) {
    process.stderr.write('usage: npm run verify -- <copy.pdf | sha256> [--head exported-head.json]\n')
    return 2
  }
  if (!existsSync(headPath)) {
    process.stderr.write(`No head file at ${headPath}: export one from the archive register ("Export head") and pass it with --head\n`)
    return 2
  }
  let file: HeadFile
  try {
    file = JSON.parse(readFileSync(headPath, 'utf8')) as HeadFile
  }
  catch {
    process.stderr.write(`${headPath} is not JSON\n`)
    return 2
  }
  const target = /^[0-9a-f]{64}$/i.test(subject) ? { hash: subject } : existsSync(subject) ? { bytes: new Uint8Array(readFileSync(subject)) } : null
  if (!target) {
    process.stderr.write(`${subject} is neither a file nor a SHA-256 (64 hex digits)\n`)
    return 2
  }
  const result = await checkCopy(target, file)
  process.stdout.write(`${result.lines.join('\n')}\n`)
  return result.ok ? 0 : 1
}

main(process.argv.slice(2)).then(code => process.exit(code), (error) => {
  process.stderr.write(`${error instanceof Error ? error.message : String(error)}\n`)
  process.exit(2)
})
