/**
 * Secondary moments of prestress (EN 1992-1-1 5.10.7) with columns (rotational springs) and
 * cantilevers, against hand calculations and invariants.
 */
import { describe, expect, it } from 'vitest'
import { prestressMoments } from '../../../../shared/engine/prestress/secondary'
import { tendonEccentricity } from '../../../../shared/engine/prestress/profile'
import type { TendonProfile } from '../../../../shared/engine/prestress/profile'
import type { SupportKind } from '../../../../shared/engine/analysis/continuous-beam'
import { between, prng } from '../../../helpers/prng'

const rel = (a: number, b: number): number => Math.abs(a - b) / Math.max(Math.abs(b), 1e-30)

describe('straight tendon between columns (slope–deflection)', () => {
  const L = 8000
  const EI = 2.5e13
  const e = 60
  const P = 1.2e6
  const straight: TendonProfile = { spans: [L], supportEcc: [e, e], spanEcc: [e] }
  it('one span between equal springs k: M2 = P·e·k/(k + 2EI/L), constant along the span', () => {
    // primary −P·e everywhere; end rotations of the hogging curvature are held by kθ:
    // θ = (P·e − M2)·L/(2EI), M2 = k·θ ⇒ M2 = P·e·k/(k + 2EI/L)
    for (const k of [0.5 * EI / L, 2 * EI / L, 20 * EI / L]) {
      const m = prestressMoments({ spans: [L], EI, springs: [k, k], profile: straight, P })
      const M2 = (P * e * k) / (k + (2 * EI) / L)
      expect(rel(m.secondary[0] as number, M2)).toBeLessThan(1e-12)
      expect(rel(m.secondary[1] as number, M2)).toBeLessThan(1e-12)
      expect(rel(m.secondaryAt(0, 0.3 * L), M2)).toBeLessThan(1e-12)
      expect(rel(m.totalAt(0, 0.3 * L), -P * e + M2)).toBeLessThan(1e-12)
      expect(rel(m.reactionCouples[0] as number, -M2)).toBeLessThan(1e-12) // the column's couple on the slab
    }
  })
  it('no springs: a single span is determinate, M2 = 0; fixed ends: M2 = P·e (full restraint)', () => {
    const free = prestressMoments({ spans: [L], EI, profile: straight, P })
    expect(Math.abs(free.secondaryAt(0, L / 2))).toBeLessThan(1e-6 * P * e)
    const fixed = prestressMoments({ spans: [L], EI, supports: ['fixed', 'fixed'], profile: straight, P })
    expect(rel(fixed.secondaryAt(0, L / 2), P * e)).toBeLessThan(1e-12) // limit k → ∞ of P·e·k/(k + 2EI/L)
  })
  it('two equal spans: +1.5·P·e at the middle support (Lin & Burns), unchanged by a column there (symmetry)', () => {
    const profile: TendonProfile = { spans: [L, L], supportEcc: [e, e, e], spanEcc: [e, e], inflection: 0 }
    const bare = prestressMoments({ spans: [L, L], EI, profile, P })
    const col = prestressMoments({ spans: [L, L], EI, springs: [0, 3 * EI / L, 0], profile, P })
    expect(rel(bare.secondary[1] as number, 1.5 * P * e)).toBeLessThan(1e-12)
    expect(rel(col.secondary[1] as number, 1.5 * P * e)).toBeLessThan(1e-12)
    expect(Math.abs(col.reactionCouples[1] as number)).toBeLessThan(1e-9 * P * e)
  })
})

describe('a cantilever: the tendon anchors at its tip', () => {
  // back span 9 m, cantilever 2.5 m on the right; tendon anchored at the tip on the centroid
  const profile: TendonProfile = { spans: [9000, 2500], supportEcc: [0, -80, 0], spanEcc: [90, -20], lowPointAt: [0.45, 0.5], inflection: 0.1 }
  const P = 1e6
  for (const springs of [undefined, [0, 8e10, 0]]) {
    it(`the cantilever is determinate: total = −P·e(x) and no secondary moment along it${springs ? ', with a column at its root' : ''} (statics)`, () => {
      const m = prestressMoments({ spans: profile.spans, supports: ['pinned', 'pinned', 'free'], springs, profile, P })
      for (const x of [0, 400, 1250, 2000, 2500]) {
        expect(Math.abs(m.totalAt(1, x) + P * tendonEccentricity(profile, 1, x))).toBeLessThan(1e-6 * P * 80)
        expect(Math.abs(m.secondaryAt(1, x))).toBeLessThan(1e-6 * P * 80)
      }
      expect(m.reactions[2]).toBe(0)
      // the prestress is self-equilibrating: reactions sum to zero in force and moment (statics)
      expect(Math.abs(m.reactions.reduce((s, v) => s + v, 0))).toBeLessThan(1e-9 * P)
      const xs = [0, 9000, 11500]
      const moment = m.reactions.reduce((s, v, j) => s + v * (xs[j] as number), 0) + m.reactionCouples.reduce((s, v) => s + v, 0)
      expect(Math.abs(moment)).toBeLessThan(1e-9 * P * 11500)
    })
  }
  it('the back span still has a secondary moment, linear, ending at its root value', () => {
    const m = prestressMoments({ spans: profile.spans, supports: ['pinned', 'pinned', 'free'], springs: [0, 8e10, 0], profile, P })
    const ends = m.secondaryEnds[0] as { start: number; end: number }
    expect(Math.abs(ends.start)).toBeLessThan(1e-6 * P) // pinned end without a column
    expect(Math.abs(ends.end)).toBeGreaterThan(1e3) // the column restrains the root
    expect(rel(m.secondaryAt(0, 4500), (ends.start + ends.end) / 2)).toBeLessThan(1e-12)
    expect(rel(m.totalAt(0, 4500) + P * tendonEccentricity(profile, 0, 4500), m.secondaryAt(0, 4500))).toBeLessThan(1e-9) // M2 = M − (−P·e)
  })
})

describe('secondary moments with columns, random members (invariant)', () => {
  it('M2 = M − (−P·e) is linear along each span, and the reactions of prestress are self-equilibrating', () => {
    const r = prng(5107)
    for (let trial = 0; trial < 60; trial++) {
      const n = 1 + Math.floor(r() * 4)
      const spans = Array.from({ length: n }, () => Math.round(between(r, 5000, 11000)))
      const profile: TendonProfile = {
        spans,
        supportEcc: Array.from({ length: n + 1 }, (_, j) => (j === 0 || j === n ? between(r, -30, 30) : between(r, -110, -40))),
        spanEcc: spans.map(() => between(r, 40, 110)),
        lowPointAt: spans.map(() => between(r, 0.4, 0.6)),
        inflection: r() < 0.3 ? 0 : between(r, 0.05, 0.12),
      }
      const supports: SupportKind[] = Array.from({ length: n + 1 }, () => (r() < 0.2 ? 'fixed' : 'pinned'))
      const springs = supports.map(() => (r() < 0.5 ? 0 : between(r, 1e10, 2e11)))
      const EI = spans.map(() => between(r, 1e13, 4e13))
      const P = between(r, 5e5, 3e6)
      const m = prestressMoments({ spans, EI, supports, springs, profile, P })
      spans.forEach((L, i) => {
        const atX = (x: number): number => m.totalAt(i, x) + P * tendonEccentricity(profile, i, x)
        const a = atX(0.1 * L)
        const b = atX(0.6 * L)
        const c = atX(0.85 * L)
        // collinear: the secondary moment comes from the support reactions only (5.10.7)
        expect(Math.abs(c - (a + ((b - a) * 0.75) / 0.5))).toBeLessThan(1e-7 * P * 100)
        expect(Math.abs(m.secondaryAt(i, 0.6 * L) - b)).toBeLessThan(1e-7 * P * 100)
      })
      expect(Math.abs(m.reactions.reduce((s, v) => s + v, 0))).toBeLessThan(1e-9 * P)
    }
  })
})
