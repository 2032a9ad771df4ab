// RFC 8785 canonical JSON (package `canonicalize`) and SHA-256: what every content hash and every
// log leaf of the records side is computed over. Pure, so the offline verifier can use it too.
import { createHash } from 'node:crypto'
import canonicalize from 'canonicalize'

/** RFC 8785 canonical JSON. @throws when the value holds something JSON cannot carry (NaN, a function). */
export function canonicalJson(value: unknown): string {
  assertPlainJson(value, '')
  const text = canonicalize(value)
  if (text === undefined) throw new TypeError('value has no JSON form')
  return text
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
