/** Seeded random continuous beams with springs, fixed and free ends, non-prismatic spans and mixed loads. */
import type { BeamLoad, SpanEI, SupportKind } from '../../../../shared/engine/analysis/continuous-beam'
import { between } from '../../../helpers/prng'

export interface RandomBeam {
  spans: number[]
  EI: SpanEI[]
  supports: SupportKind[]
  springs: number[]
  loads: BeamLoad[]
}

const round = (v: number): number => Math.round(v / 10) * 10

export function randomBeam(r: () => number, maxSpans = 6): RandomBeam {
  const n = 1 + Math.floor(r() * maxSpans)
  const spans = Array.from({ length: n }, () => round(between(r, 2500, 12000)))
  const EI: SpanEI[] = spans.map((L) => {
    const base = between(r, 0.5, 3) * 1e13
    if (r() < 0.5) return base
    // a drop panel or band at one or both ends, or a few random segments
    const cuts = [0, ...Array.from({ length: 1 + Math.floor(r() * 3) }, () => round(between(r, 0.05, 0.95) * L)), L]
      .sort((a, b) => a - b).filter((x, k, xs) => k === 0 || x > (xs[k - 1] as number))
    return cuts.slice(0, -1).map((from, k) => ({ from, to: cuts[k + 1] as number, EI: base * between(r, 0.5, 4) }))
  })
  const supports: SupportKind[] = Array.from({ length: n + 1 }, () => (r() < 0.15 ? 'fixed' as const : 'pinned' as const))
  if (r() < 0.3 && n >= 2) supports[0] = 'free'
  if (r() < 0.3 && n >= 2) supports[n] = 'free'
  if (n === 1 && r() < 0.3) supports[r() < 0.5 ? 0 : 1] = 'free'
  const springs = supports.map((s, j) => {
    if (s === 'free') return 0
    const L = spans[Math.min(j, n - 1)] as number
    return r() < 0.5 ? 0 : between(r, 0.1, 20) * 1e13 / L
  })
  // a beam made only of cantilevers needs a restrained root
  const coreless = (n === 1 && (supports[0] === 'free' || supports[1] === 'free')) || (n === 2 && supports[0] === 'free' && supports[2] === 'free')
  if (coreless) {
    const root = supports[0] === 'free' ? 1 : 0
    if (supports[root] !== 'fixed' && !((springs[root] as number) > 0)) springs[root] = 5e13 / (spans[0] as number)
  }
  const loads: BeamLoad[] = []
  spans.forEach((L, span) => {
    if (r() < 0.7) loads.push({ kind: 'udl', span, w: between(r, -5, 30) })
    if (r() < 0.5) {
      const a = round(between(r, 0, 0.6) * L)
      const b = round(between(r, 0.6, 1) * L)
      loads.push({ kind: 'patch', span, from: a, to: Math.max(a, b), w: between(r, -10, 40) })
    }
    const points = Math.floor(r() * 3)
    for (let k = 0; k < points; k++) loads.push({ kind: 'point', span, at: round(between(r, 0, 1) * L), P: between(r, -20000, 60000) })
    if (r() < 0.4) loads.push({ kind: 'couple', span, at: round(between(r, 0, 1) * L), M: between(r, -5e7, 5e7) })
  })
  return { spans, EI, supports, springs, loads }
}

/** The same beam seen from the other end: x → L − x, couples change sense. */
export function mirrorBeam(b: RandomBeam): RandomBeam {
  const n = b.spans.length
  const mirrorSpan = (i: number): number => n - 1 - i
  return {
    spans: [...b.spans].reverse(),
    EI: [...b.EI].reverse().map((v, i) => {
      const L = b.spans[mirrorSpan(i)] as number
      return typeof v === 'number' ? v : [...v].reverse().map((s) => ({ from: L - s.to, to: L - s.from, EI: s.EI }))
    }),
    supports: [...b.supports].reverse(),
    springs: [...b.springs].reverse(),
    loads: b.loads.map((l): BeamLoad => {
      const L = b.spans[l.span] as number
      const span = mirrorSpan(l.span)
      switch (l.kind) {
        case 'udl': return { ...l, span }
        case 'patch': return { ...l, span, from: L - l.to, to: L - l.from }
        case 'point': return { ...l, span, at: L - l.at }
        case 'couple': return { ...l, span, at: L - l.at, M: -l.M }
      }
    }),
  }
}
