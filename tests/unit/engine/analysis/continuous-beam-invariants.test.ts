/**
 * Invariants over seeded random members (tests/helpers/prng.ts) with rotational springs, fixed and
 * free ends and non-prismatic spans: statics (equilibrium of forces and moments), mirror symmetry,
 * superposition, and agreement with an independent dense stiffness model solved with ml-matrix.
 */
import { describe, expect, it } from 'vitest'
import { analyseContinuousBeam, spanUnitResponses } from '../../../../shared/engine/analysis/continuous-beam'
import type { BeamLoad, ContinuousBeamResult } from '../../../../shared/engine/analysis/continuous-beam'
import { prng } from '../../../helpers/prng'
import { denseBeam } from './dense-beam'
import { mirrorBeam, randomBeam } from './random-beam'
import type { RandomBeam } from './random-beam'

const offsets = (spans: number[]): number[] => spans.map((_, i) => spans.slice(0, i).reduce((s, v) => s + v, 0))

/** resultant downward force and its moment about the left end (counter-clockwise +) — statics */
function loadResultants(b: RandomBeam): { V: number; M: number } {
  const o = offsets(b.spans)
  let V = 0
  let M = 0
  for (const l of b.loads) {
    const x0 = o[l.span] as number
    const L = b.spans[l.span] as number
    if (l.kind === 'udl') { V += l.w * L; M -= l.w * L * (x0 + L / 2) }
    if (l.kind === 'patch') { const F = l.w * (l.to - l.from); V += F; M -= F * (x0 + (l.from + l.to) / 2) }
    if (l.kind === 'point') { V += l.P; M -= l.P * (x0 + l.at) }
    if (l.kind === 'couple') M += l.M
  }
  return { V, M }
}

function sampleXs(b: RandomBeam, span: number): number[] {
  const L = b.spans[span] as number
  const couples = b.loads.filter((l) => l.span === span && l.kind === 'couple').map((l) => (l as { at: number }).at)
  return [0, 0.13, 0.37, 0.5, 0.63, 0.87, 1].map((f) => f * L).filter((x) => couples.every((c) => Math.abs(c - x) > 1))
}

function moments(r: ContinuousBeamResult, b: RandomBeam): number[] {
  return b.spans.flatMap((_, i) => sampleXs(b, i).map((x) => r.momentAt(i, x)))
}

describe('continuous beam: invariants over 200 random members (springs, fixed and free ends, non-prismatic spans)', () => {
  const r = prng(4242)
  const beams = Array.from({ length: 200 }, () => randomBeam(r))

  it('equilibrium: the reactions balance the loads in force and in moment (statics)', () => {
    for (const b of beams) {
      const res = analyseContinuousBeam(b)
      const { V, M } = loadResultants(b)
      const o = [...offsets(b.spans), b.spans.reduce((s, v) => s + v, 0)]
      const sumR = res.reactions.reduce((s, v) => s + v, 0)
      const momentR = res.reactions.reduce((s, v, j) => s + v * (o[j] as number), 0) + res.reactionCouples.reduce((s, v) => s + v, 0)
      const scaleV = b.loads.reduce((s, l) => s + Math.abs(l.kind === 'point' ? l.P : l.kind === 'couple' ? 0 : l.w * (b.spans[l.span] as number)), 1)
      const scaleM = scaleV * (o[o.length - 1] as number)
      expect(Math.abs(sumR - V) / scaleV).toBeLessThan(1e-9)
      expect(Math.abs(momentR + M) / scaleM).toBeLessThan(1e-9)
      b.supports.forEach((s, j) => { if (s === 'free') expect(res.reactions[j]).toBe(0) })
      for (const v of [...res.reactions, ...res.reactionCouples, ...res.rotations, ...moments(res, b)]) expect(Number.isFinite(v)).toBe(true)
    }
  })

  it('mirror symmetry: the beam seen from the other end gives the mirrored results', () => {
    let compared = 0
    for (const b of beams) {
      const m = mirrorBeam(b)
      const a = analyseContinuousBeam(b)
      const c = analyseContinuousBeam(m)
      const n = b.spans.length
      const scaleM = Math.max(1e6, ...moments(a, b).map(Math.abs))
      const scaleR = Math.max(1, ...a.reactions.map(Math.abs))
      for (let j = 0; j <= n; j++) {
        expect(Math.abs((a.reactions[j] as number) - (c.reactions[n - j] as number)) / scaleR).toBeLessThan(1e-9)
        expect(Math.abs((a.reactionCouples[j] as number) + (c.reactionCouples[n - j] as number)) / scaleM).toBeLessThan(1e-9)
      }
      b.spans.forEach((L, i) => {
        for (const x of sampleXs(b, i)) {
          if (sampleXs(m, n - 1 - i).every((y) => Math.abs(y - (L - x)) > 1e-6)) continue
          expect(Math.abs(a.momentAt(i, x) - c.momentAt(n - 1 - i, L - x)) / scaleM).toBeLessThan(1e-9)
          compared++
        }
      })
    }
    expect(compared).toBeGreaterThan(1000)
  })

  it('superposition: two load sets analysed together equal the sum of each analysed alone', () => {
    const rr = prng(77)
    for (const b of beams) {
      const A: BeamLoad[] = []
      const B: BeamLoad[] = []
      b.loads.forEach((l) => (rr() < 0.5 ? A : B).push(l))
      const all = analyseContinuousBeam(b)
      const ra = analyseContinuousBeam({ ...b, loads: A })
      const rb = analyseContinuousBeam({ ...b, loads: B })
      const scaleM = Math.max(1e6, ...moments(all, b).map(Math.abs))
      const ma = moments(ra, b)
      const mb = moments(rb, b)
      moments(all, b).forEach((v, k) => expect(Math.abs(v - (ma[k] as number) - (mb[k] as number)) / scaleM).toBeLessThan(1e-9))
      all.reactions.forEach((v, j) => expect(v).toBeCloseTo((ra.reactions[j] as number) + (rb.reactions[j] as number), 3))
    }
  })
})

describe('continuous beam against a dense ml-matrix stiffness model (many prismatic elements)', () => {
  it('moments at every node, reactions, couple reactions and rotations agree on 60 random members', () => {
    const r = prng(90210)
    for (let trial = 0; trial < 60; trial++) {
      const b = randomBeam(r, 5)
      const mine = analyseContinuousBeam(b)
      const dense = denseBeam(b.spans, b.EI, b.supports, b.springs, b.loads, 6)
      const nodeMoments = b.spans.flatMap((_, i) => dense.nodesOf(i).map((x) => ({ i, x, M: dense.momentAt(i, x) })))
      const scaleM = Math.max(1e6, ...nodeMoments.map((p) => Math.abs(p.M)))
      for (const p of nodeMoments) expect(Math.abs(mine.momentAt(p.i, p.x) - p.M) / scaleM).toBeLessThan(1e-7)
      const scaleR = Math.max(1, ...dense.reactions.map(Math.abs))
      dense.reactions.forEach((v, j) => expect(Math.abs((mine.reactions[j] as number) - v) / scaleR).toBeLessThan(1e-7))
      dense.reactionCouples.forEach((v, j) => expect(Math.abs((mine.reactionCouples[j] as number) - v) / scaleM).toBeLessThan(1e-7))
      const scaleT = Math.max(1e-12, ...dense.rotations.map(Math.abs))
      dense.rotations.forEach((v, j) => expect(Math.abs((mine.rotations[j] as number) - v) / scaleT).toBeLessThan(1e-6))
    }
  })
})

describe('unit responses for pattern loading', () => {
  it('combine(w) equals the sum of w[i]·unit(i) and the direct analysis (superposition)', () => {
    const r = prng(31337)
    for (let trial = 0; trial < 30; trial++) {
      const b = randomBeam(r)
      const u = spanUnitResponses(b)
      const w = b.spans.map(() => (r() < 0.5 ? 0 : 5 + 20 * r()))
      const combined = u.combine(w)
      const direct = analyseContinuousBeam({ ...b, loads: w.map((wi, span) => ({ kind: 'udl' as const, span, w: wi })) })
      const scale = Math.max(1e6, ...direct.supportMoments.map(Math.abs))
      b.supports.forEach((_, j) => {
        const sum = w.reduce((s, wi, i) => s + wi * (u.unit(i).supportMoments[j] as number), 0)
        expect(Math.abs(sum - (direct.supportMoments[j] as number)) / scale).toBeLessThan(1e-9)
        expect(Math.abs((combined.supportMoments[j] as number) - (direct.supportMoments[j] as number)) / scale).toBeLessThan(1e-12)
      })
      expect(u.unit(0)).toBe(u.unit(0)) // kept after the first use
    }
  })
})
