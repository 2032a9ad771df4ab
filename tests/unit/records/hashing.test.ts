import { describe, expect, it } from 'vitest'
import { createHash } from 'node:crypto'
import fc from 'fast-check'
import canonicalize from 'canonicalize'
import { auditHash, canonicalJson, hashCanonical, parseVerifyQuery, plainJson, revisionHash, sha256Hex, storedJson, type RevisionHashFields } from '../../../server/utils/hashing'
import { CanonicalPiece, canonicalSha256 } from '../../../shared/log/canonical'
import { entryLeafHash, logEntry, rowLeafHash } from '../../../shared/log/entry'
import { verificationRef } from '../../../shared/utils/verification-ref'

describe('canonical JSON (RFC 8785)', () => {
  it('matches the sample of RFC 8785 §3.2.2 (sorting, numbers, string escapes)', () => {
    // RFC 8785 §3.2.2: the input object and its canonical form, copied from the RFC
    const input = JSON.parse('{"numbers":[333333333.33333329,1E30,4.50,2e-3,0.000000000000000000000000001],"string":"\\u20ac$\\u000F\\u000aA\'\\u0042\\u0022\\u005c\\\\\\"\\/","literals":[null,true,false]}')
    expect(canonicalJson(input)).toBe('{"literals":[null,true,false],"numbers":[333333333.3333333,1e+30,4.5,0.002,1e-27],"string":"€$\\u000f\\nA\'B\\"\\\\\\\\\\"/"}')
  })

  it('sorts keys by UTF-16 code units, as RFC 8785 §3.2.3 requires', () => {
    // RFC 8785 §3.2.3 sorting example (subset): "\r" < "1" < "\u0080" < "\u00f6" < "\u20ac" < "\ud83d\ude00" < "\ufb33"
    const keys = ['\ufb33', '\u20ac', '\r', '\ud83d\ude00', '1', '\u00f6', '\u0080']
    const obj = Object.fromEntries(keys.map((k, i) => [k, i]))
    const order = ['\r', '1', '\u0080', '\u00f6', '\u20ac', '\ud83d\ude00', '\ufb33']
    // read the order off the text: JS objects put integer-like keys first, so no JSON.parse here
    expect(canonicalJson(obj)).toBe(`{${order.map(k => `${JSON.stringify(k)}:${keys.indexOf(k)}`).join(',')}}`)
  })

  it('refuses values JSON cannot carry, naming where they are', () => {
    expect(() => canonicalJson({ a: { b: [1, Number.NaN] } })).toThrow('a.b[1]')
    expect(() => plainJson({ x: Number.POSITIVE_INFINITY })).toThrow('x')
  })
})

describe('canonical pieces (a large part put into canonical JSON once, then composed)', () => {
  const isMembers = (v: unknown): v is Record<string, unknown> => v !== null && typeof v === 'object' && !Array.isArray(v)
  /** `value` with some of its members, up to `depth` objects deep, replaced by their canonical pieces. */
  const pieced = (value: unknown, depth: number, pick: () => boolean): unknown => !isMembers(value) || depth === 0
    ? value
    : Object.fromEntries(Object.entries(value).map(([k, v]) => [k, pick() ? new CanonicalPiece(canonicalize(v)!) : pieced(v, depth - 1, pick)]))

  it('gives the text the package `canonicalize` gives the whole value, over random objects', () => {
    const objects = fc.dictionary(fc.string({ unit: 'binary', maxLength: 6 }), fc.jsonValue({ maxDepth: 4 }), { maxKeys: 6 })
    fc.assert(fc.property(objects, fc.array(fc.boolean(), { minLength: 1, maxLength: 20 }), (value, choices) => {
      let i = 0
      const withPieces = pieced({ top: value }, 3, () => choices[i++ % choices.length]!)
      // the independent reference: the package over the plain value, as a JSON column gives it back
      const reference = canonicalize({ top: JSON.parse(JSON.stringify(value)) })!
      expect(canonicalJson(withPieces)).toBe(reference)
      // hashed part by part, the same digest as the whole text hashed at once (node:crypto)
      expect(canonicalSha256(withPieces)).toBe(createHash('sha256').update(reference).digest('hex'))
    }), { numRuns: 300 })
  })

  it('makes the canonical JSON of what reads back from the stored text, over random values', () => {
    // values as the engine gives them: JSON values with members left undefined and dates among them
    const member = fc.oneof(fc.jsonValue({ maxDepth: 3 }), fc.constant(undefined), fc.date({ noInvalidDate: true }))
    const values = fc.dictionary(fc.string({ maxLength: 5 }), fc.oneof(member, fc.array(member, { maxLength: 4 }), fc.dictionary(fc.string({ maxLength: 3 }), member, { maxKeys: 4 })), { maxKeys: 6 })
    fc.assert(fc.property(values, (value) => {
      const written = storedJson(value)
      expect(written.stored).toBe(JSON.stringify(value))
      // the reference: the package `canonicalize` over the value parsed back from the stored text
      expect(written.canonical.text).toBe(canonicalize(JSON.parse(written.stored)))
    }), { numRuns: 300 })
  })

  it('makes the stored text and the canonical JSON of what reads back from it', () => {
    const value = { b: [1, 2.50, { z: null, a: 'é' }], a: { '10': 1, '2': 2 } }
    const written = storedJson(value)
    expect(written.stored).toBe(JSON.stringify(value))
    expect(written.canonical.text).toBe(canonicalize(JSON.parse(written.stored)))
    expect(() => storedJson({ x: [Number.NaN] })).toThrow('x[0]')
  })

  it('gives a revision the same content hash and log leaf from pieces as from its values', () => {
    const r = revision()
    const pieces = { inputs: storedJson(r.inputs).canonical, results: storedJson(r.results).canonical, reportSections: storedJson(r.reportSections).canonical }
    expect(revisionHash({ ...r, ...pieces })).toBe(revisionHash(r))
    const row = { id: 4, ...r, contentHash: 'c'.repeat(64) } as unknown as Record<string, unknown>
    expect(logEntry('revision', { ...row, ...pieces })).toBe(logEntry('revision', row))
    // RFC 6962 §2.1 leaf hash SHA-256(0x00 ‖ entry), streamed, against the entry's text hashed whole
    expect(rowLeafHash('revision', { ...row, ...pieces })).toBe(entryLeafHash(logEntry('revision', row)))
  })
})

describe('SHA-256', () => {
  it('gives the FIPS 180-2 digest of "abc"', () => {
    // FIPS 180-2, Appendix B.1
    expect(sha256Hex('abc')).toBe('ba7816bf8f01cfea414140de5dae2223b00361a396177a9cb410ff61f20015ad')
  })

  it('hashes the canonical form, so key order does not matter', () => {
    expect(hashCanonical({ b: 1, a: [1, { d: 2, c: 3 }] })).toBe(hashCanonical({ a: [1, { c: 3, d: 2 }], b: 1 }))
  })
})

function revision(): RevisionHashFields {
  return {
    sheetId: 3, seq: 2, code: 'P02', note: 'spans revised', inputs: { spans: [7800, 9600] }, results: { checks: [{ id: 'a', pass: true }] },
    templateId: 1, templateSlug: 'pt-slab', templateVersion: 1, templateTitle: 'Slab', model: 'pt-member', templateBody: '# Slab',
    engineVersion: '1.0.0', reportHtml: '<h1>Slab</h1>', reportSections: [{ id: 'slab', title: 'Slab', level: 1 }],
    authorId: 7, issuedAt: new Date('2026-03-02T10:11:12.345Z'), prevHash: 'a'.repeat(64),
  }
}

describe('revision and audit hashes', () => {
  it('changes when any hashed field changes', () => {
    const base = revisionHash(revision())
    const variants: Array<Partial<RevisionHashFields>> = [
      { seq: 3 }, { code: 'P03' }, { note: '' }, { inputs: { spans: [7800, 9601] } }, { results: { checks: [{ id: 'a', pass: false }] } },
      { templateBody: '# Slab ' }, { templateVersion: 2 }, { engineVersion: '1.0.1' }, { reportHtml: '<h1>Slab.</h1>' },
      { authorId: 8 }, { issuedAt: new Date('2026-03-02T10:11:12.346Z') }, { prevHash: null },
    ]
    const hashes = variants.map(v => revisionHash({ ...revision(), ...v }))
    for (const h of hashes) expect(h).not.toBe(base)
    expect(new Set(hashes).size).toBe(hashes.length)
  })

  it('covers the reason for failing checks and the replies, and leaves revisions without them as they were hashed', () => {
    const before = revisionHash(revision())
    // a row read back after the columns were added: '' and null stand for "not given"
    expect(revisionHash({ ...revision(), failingChecksReason: '', replies: null })).toBe(before)
    const reason = revisionHash({ ...revision(), failingChecksReason: 'for the layout meeting' })
    const replies = revisionHash({ ...revision(), replies: [{ reviewId: 1, index: 0, anchor: '', commentText: 'Check cover', text: 'Raised' }] })
    expect(new Set([before, reason, replies]).size).toBe(3)
  })

  it('survives the round trip through a JSON column', () => {
    const r = revision()
    const stored = { ...r, inputs: JSON.parse(JSON.stringify(r.inputs)), results: JSON.parse(JSON.stringify(r.results)) }
    expect(revisionHash(stored)).toBe(revisionHash(r))
  })

  it('chains audit events through prevHash', () => {
    const e = { seq: 1, action: 'signin', subject: 'a@b', actorId: 1, address: '127.0.0.1', detail: {}, createdAt: new Date(0), prevHash: null }
    const h1 = auditHash(e)
    const h2 = auditHash({ ...e, seq: 2, prevHash: h1 })
    expect(auditHash({ ...e, seq: 2, prevHash: h1.replace(/^./, c => (c === '0' ? '1' : '0')) })).not.toBe(h2)
  })
})

describe('verification references', () => {
  it('reads back a reference typed with spaces, lower case or no dashes', () => {
    const hash = sha256Hex('some revision')
    const ref = verificationRef(hash)
    expect(ref).toMatch(/^TB-[0-9A-F]{4}-[0-9A-F]{4}-[0-9A-F]{4}$/)
    expect(parseVerifyQuery(ref.toLowerCase())).toEqual({ kind: 'ref', value: ref })
    expect(parseVerifyQuery(ref.replace(/-/g, ' '))).toEqual({ kind: 'ref', value: ref })
    expect(parseVerifyQuery(` ${hash.toUpperCase()} `)).toEqual({ kind: 'hash', value: hash })
    expect(parseVerifyQuery('TB-12')).toBeNull()
  })
})
