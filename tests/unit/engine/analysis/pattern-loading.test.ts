import { describe, expect, it } from 'vitest'
import { spanUnitResponses } from '../../../../shared/engine/analysis/continuous-beam'
import { patternLoading, quantityOf } from '../../../../shared/engine/analysis/pattern-loading'
import type { ResponseQuantity } from '../../../../shared/engine/analysis/pattern-loading'
import { prng } from '../../../helpers/prng'
import { randomBeam } from './random-beam'

/** The arrangements of EN 1992-1-1 5.1.3: all spans, alternate spans, each adjacent pair. */
function arrangements(n: number): number[][] {
  const all = Array.from({ length: n }, (_, i) => i)
  const out = [all]
  if (n > 1) out.push(all.filter((i) => i % 2 === 0), all.filter((i) => i % 2 === 1))
  for (let j = 1; j < n && n > 2; j++) out.push([j - 1, j])
  return out
}

describe('pattern loading on a beam factored once', () => {
  it('agrees with one full solve per arrangement at every point (seeded random beams, 1–30 spans)', () => {
    const r = prng(5131)
    for (let t = 0; t < 60; t++) {
      const b = randomBeam(r, 30)
      const responses = spanUnitResponses({ spans: b.spans, EI: b.EI, supports: b.supports, springs: b.springs })
      const patterns = arrangements(b.spans.length)
      const pl = patternLoading(responses, patterns)
      // the brute force: each arrangement solved on its own with 1 N/mm on its spans
      const solved = patterns.map((p) => responses.model.analyse(p.map((span) => ({ kind: 'udl' as const, span, w: 1 }))))
      const points: ResponseQuantity[] = []
      b.spans.forEach((L, span) => {
        for (const f of [0, 0.3, 0.5, 1]) points.push({ kind: 'moment', span, x: f * L }, { kind: 'shear', span, x: f * L })
      })
      b.supports.forEach((_, support) => points.push({ kind: 'reaction', support }))
      // one solve of the sum and the sum of solves differ by round-off only (stiff springs beside soft spans: ~1e-9)
      for (const q of points) {
        const values = solved.map((s) => quantityOf(s, q))
        const scale = Math.max(1, ...values.map(Math.abs))
        const got = pl.range(q)
        expect(Math.abs(got.max - Math.max(...values)) / scale, JSON.stringify(q)).toBeLessThan(1e-7)
        expect(Math.abs(got.min - Math.min(...values)) / scale).toBeLessThan(1e-7)
        patterns.forEach((_, p) => expect(Math.abs(pl.value(q, p) - (values[p] as number)) / scale).toBeLessThan(1e-7))
      }
    }
  })

  it('a point far from two loaded adjacent spans feels them as nil: 200 equal spans', () => {
    const spans = Array.from({ length: 200 }, () => 8000)
    const responses = spanUnitResponses({ spans, EI: 1e13 })
    const patterns = arrangements(200)
    const pl = patternLoading(responses, patterns)
    // mid-span of span 100: the greatest moment is the pair (99, 100) or (100, 101), the least the
    // alternate arrangement that leaves span 100 unloaded; a full solve of each says the same
    const q: ResponseQuantity = { kind: 'moment', span: 100, x: 4000 }
    const values = patterns.map((p) => quantityOf(responses.model.analyse(p.map((span) => ({ kind: 'udl' as const, span, w: 1 }))), q))
    const got = pl.range(q)
    expect(got.max).toBeCloseTo(Math.max(...values), 3)
    expect(got.min).toBeCloseTo(Math.min(...values), 3)
    // statics of an equal-span continuous beam: the pair's sagging at mid-span lies below wL²/8
    expect(got.max).toBeLessThan((8000 ** 2) / 8)
  })
})
