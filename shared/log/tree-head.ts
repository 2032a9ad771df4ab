// Signed tree heads of the history log: the server signs (size, root, time) with an Ed25519 key
// (RFC 8032, Node's own crypto) kept outside the database; anyone with the public key checks them.
import { createPrivateKey, createPublicKey, sign, verify, type KeyObject } from 'node:crypto'
import { canonicalJson, sha256Hex } from './canonical'

export interface TreeHead {
  treeSize: number
  /** hex SHA-256 root of the first `treeSize` leaves */
  rootHash: string
  /** ISO 8601 UTC, milliseconds */
  timestamp: string
}

/** The exact bytes that are signed: RFC 8785 canonical JSON of the head with its kind. */
export function treeHeadMessage(head: TreeHead): string {
  return canonicalJson({ kind: 'tendonbook.tree-head', treeSize: head.treeSize, rootHash: head.rootHash, timestamp: head.timestamp })
}

/** Base64 Ed25519 signature of the head. */
export function signTreeHead(head: TreeHead, privateKeyPem: string | KeyObject): string {
  const key = typeof privateKeyPem === 'string' ? createPrivateKey(privateKeyPem) : privateKeyPem
  return sign(null, Buffer.from(treeHeadMessage(head), 'utf8'), key).toString('base64')
}

export function verifyTreeHead(head: TreeHead, signature: string, publicKeyPem: string): boolean {
  try {
    return verify(null, Buffer.from(treeHeadMessage(head), 'utf8'), createPublicKey(publicKeyPem), Buffer.from(signature, 'base64'))
  }
  catch {
    return false
  }
}

/** Public key (SPKI PEM) of a private key, and its id: SHA-256 of the DER form, in hex. */
export function publicKeyOf(privateKeyPem: string) {
  const pub = createPublicKey(createPrivateKey(privateKeyPem))
  return { pem: pub.export({ type: 'spki', format: 'pem' }).toString(), id: sha256Hex(pub.export({ type: 'spki', format: 'der' })) }
}

export function keyIdOf(publicKeyPem: string): string {
  return sha256Hex(createPublicKey(publicKeyPem).export({ type: 'spki', format: 'der' }))
}
