// RFC 8785 canonical JSON and SHA-256: what every content hash and every log leaf of the records
// side is computed over. Pure, so the offline verifier can use it too. The text is written by the
// package `safe-stable-stringify` with its members sorted: for plain JSON values (assertPlainJson)
// that is RFC 8785's form — strings and numbers as JSON.stringify writes them (§3.2.2), members
// sorted by the UTF-16 code units of their names (§3.2.3), no whitespace — at about twice the speed
// of the package `canonicalize`, against which the unit tests check it on the RFC's samples and on
// random values.
import { createHash } from 'node:crypto'
import { configure } from 'safe-stable-stringify'

// strict: a value JSON cannot carry throws rather than turning into null; a cycle throws too
const canonicalize = configure({ deterministic: true, strict: true, circularValue: Error, bigint: false })

/**
 * A value already put into canonical JSON, to stand in for it inside a larger value: the larger
 * value's canonical JSON takes this text as it is, so a large part hashed into several digests (a
 * revision's results in its content hash and in its log leaf) is walked once. Make one only with
 * `storedJson` or `storedText` (or from text one of them made).
 */
export class CanonicalPiece {
  #bytes: Buffer | undefined
  constructor(readonly text: string) {}
  /** The text in UTF-8, made once: each hash the piece goes into reads these bytes. */
  get bytes(): Buffer {
    return (this.#bytes ??= Buffer.from(this.text, 'utf8'))
  }
}

/**
 * RFC 8785 canonical JSON. A CanonicalPiece among an object's members (up to three objects deep)
 * is taken as the canonical text it holds. @throws when the value holds something JSON cannot
 * carry (NaN, a function).
 */
export function canonicalJson(value: unknown): string {
  const parts: string[] = []
  writeCanonical(value, part => parts.push(typeof part === 'string' ? part : part.text))
  return parts.length === 1 ? parts[0]! : parts.join('')
}

/**
 * SHA-256 (hex) of the canonical JSON of `value` after `prefix`, the text fed to the hash part by
 * part, each piece as its UTF-8 bytes: a value of pieces is never joined into one string nor
 * encoded again (for a revision of 1 MB, joining and encoding the whole text took about three times
 * as long as hashing its parts).
 */
export function canonicalSha256(value: unknown, prefix?: Uint8Array): string {
  const hash = createHash('sha256')
  if (prefix) hash.update(prefix)
  writeCanonical(value, part => hash.update(typeof part === 'string' ? part : part.bytes))
  return hash.digest('hex')
}

function writeCanonical(value: unknown, write: (part: string | CanonicalPiece) => void): void {
  if (value instanceof CanonicalPiece) return write(value)
  if (!holdsPiece(value, 3)) return write(plainCanonical(value))
  // RFC 8785 §3.2.3: members sorted by their names' UTF-16 code units (JavaScript's default sort),
  // name and value joined by ':' and members by ',', with no whitespace; members whose value is
  // undefined are left out, as JSON.stringify and the package do
  const members = value as Record<string, unknown>
  const names = Object.keys(members).filter(name => members[name] !== undefined).sort()
  write('{')
  names.forEach((name, i) => {
    write(`${i ? ',' : ''}${canonicalize(name)}:`)
    writeCanonical(members[name], write)
  })
  write('}')
}

/** The canonical JSON of a value without pieces. @throws naming the member JSON cannot carry. */
function plainCanonical(value: unknown): string {
  assertPlainJson(value, '')
  const text = canonicalize(value)
  if (text === undefined) throw new TypeError('value has no JSON form')
  return text
}

const isMembers = (value: unknown): value is Record<string, unknown> =>
  value !== null && typeof value === 'object' && !Array.isArray(value) && !(value instanceof Date) && !(value instanceof CanonicalPiece)

function holdsPiece(value: unknown, depth: number): boolean {
  if (!isMembers(value) || depth === 0) return false
  for (const member of Object.values(value)) if (member instanceof CanonicalPiece || holdsPiece(member, depth - 1)) return true
  return false
}

/** A column's value as it is written: the text the column stores, and the canonical JSON of what reads back from it. */
export interface StoredColumn {
  stored: string
  canonical: CanonicalPiece
}

/**
 * Puts a value for a JSON column into the two forms a history row needs, once each: the JSON text
 * to store, and the canonical JSON of what reads back from that text, so a re-hash of the stored
 * row gives the same digest. For a value assertPlainJson lets through, that is the canonical JSON
 * of the value itself (JSON.stringify and the canonical writer drop and convert the same things:
 * undefined members, a Date by its toJSON), which the unit tests check on random values; so the
 * text is not parsed again here. The log's read-back takes the canonical piece for a column whose
 * stored text comes back unchanged, instead of parsing and walking it again.
 * @throws naming the member that JSON cannot carry (NaN, a lone surrogate).
 */
export function storedJson(value: unknown): StoredColumn {
  const canonical = new CanonicalPiece(plainCanonical(value))
  return { stored: JSON.stringify(value), canonical }
}

/** The same two forms for a text column: the text itself, and its canonical JSON (a JSON string). */
export function storedText(text: string): StoredColumn {
  return { stored: text, canonical: new CanonicalPiece(plainCanonical(text)) }
}

export function sha256Hex(data: string | Uint8Array): string {
  return createHash('sha256').update(data).digest('hex')
}

export function assertPlainJson(value: unknown, path: string): void {
  if (typeof value === 'number' && !Number.isFinite(value)) throw new TypeError(`${path || '(root)'}: ${value} has no JSON form`)
  if (typeof value === 'function' || typeof value === 'symbol' || typeof value === 'bigint') throw new TypeError(`${path || '(root)'}: a ${typeof value} has no JSON form`)
  if (typeof value === 'string' && !value.isWellFormed()) throw new TypeError(`${path || '(root)'}: text with a broken character (a lone surrogate) has no stable stored form`)
  if (Array.isArray(value)) value.forEach((v, i) => assertPlainJson(v, `${path}[${i}]`))
  else if (value && typeof value === 'object' && !(value instanceof Date)) {
    for (const [k, v] of Object.entries(value)) if (v !== undefined) assertPlainJson(v, path ? `${path}.${k}` : k)
  }
}
