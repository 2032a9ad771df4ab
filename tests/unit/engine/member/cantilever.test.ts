/**
 * A member with a cantilever at an end: the tendon's parabola from the root to the anchorage at the
 * tip, its balancing force, the tip deflection and its limit, the sections checked, the load
 * arrangements with the cantilever loaded and unloaded, mirror symmetry, and the messages for a
 * free support in the wrong place — each against statics, a handbook formula or the other side.
 */
import { describe, expect, it } from 'vitest'
import { designMember } from '../../../../shared/engine/member/design'
import { memberDeflection } from '../../../../shared/engine/sls/deflection'
import { balancingForce, equivalentLoads } from '../../../../shared/engine/prestress/equivalent-loads'
import { drapes, tendonEccentricity, tendonSlope } from '../../../../shared/engine/prestress/profile'
import type { TendonProfile } from '../../../../shared/engine/prestress/profile'
import { parseMemberInput } from '../../../../shared/engine/input/schema'
import type { MemberInputDraft } from '../../../../shared/engine/input/schema'
import { loadPatterns } from '../../../../shared/engine/member/loads'
import { EngineInputError } from '../../../../shared/engine/contract'
import { ONE_SPAN_SLAB } from '../../../helpers/members'

const rel = (a: number, b: number): number => Math.abs(a - b) / Math.max(Math.abs(b), 1e-30)

/** An invented edge strip: a 2.4 m cantilever, then two 8 m spans, 250 mm slab. */
const EDGE: MemberInputDraft = {
  ...ONE_SPAN_SLAB,
  geometry: { spans: [2400, 8000, 8000], supports: ['free', 'pinned', 'pinned', 'pinned'] },
  tendon: { ...ONE_SPAN_SLAB.tendon, stressing: 'both' },
}

/** The same strip turned end for end. */
const EDGE_MIRRORED: MemberInputDraft = {
  ...EDGE,
  geometry: { spans: [8000, 8000, 2400], supports: ['pinned', 'pinned', 'pinned', 'free'] },
}

describe('the tendon in a cantilever', () => {
  const eRoot = -80
  const eTip = 0
  const a = 2500
  const profile: TendonProfile = { spans: [9000, a], supportEcc: [0, eRoot, eTip], spanEcc: [90, 0], lowPointAt: [0.45, 0.5], inflection: 0.1, cantilever: { right: true } }
  it('is one parabola with its vertex at the root: e = e_root + (e_tip − e_root)(x/a)², zero slope at the root (geometry)', () => {
    for (const x of [0, 600, 1250, 2000, a]) {
      expect(tendonEccentricity(profile, 1, x)).toBeCloseTo(eRoot + (eTip - eRoot) * (x / a) ** 2, 9)
    }
    expect(tendonSlope(profile, 1, 0)).toBe(0)
    expect(tendonSlope(profile, 0, 9000)).toBeCloseTo(0, 12) // the back span's reverse curve has its vertex there too: no kink
    expect(tendonEccentricity(profile, 1, a)).toBe(eTip) // anchored at the tip, the end entry of supportEcc
  })
  it('balances w with P = w·a²/(2·fall), half a parabola of span 2a (load balancing, Lin)', () => {
    const w = 10
    const fall = eTip - eRoot
    expect(drapes(profile)[1]).toBe(fall)
    expect(rel(balancingForce(profile, w).perSpan[1] as number, (w * a * a) / (2 * fall))).toBeLessThan(1e-12)
  })
  it('its equivalent loads are self-equilibrating, in force and in moment (statics)', () => {
    const P = 1e6
    const loads = equivalentLoads(profile, P)
    const offsets = [0, 9000]
    let F = 0
    let M = 0
    for (const l of loads) {
      const X0 = offsets[l.span] as number
      if (l.kind === 'patch') {
        F += l.w * (l.to - l.from)
        M += l.w * (l.to - l.from) * (X0 + (l.from + l.to) / 2)
      } else if (l.kind === 'point') {
        F += l.P
        M += l.P * (X0 + l.at)
      } else if (l.kind === 'couple') {
        M -= l.M // a counter-clockwise couple against clockwise moments of downward forces
      }
    }
    expect(Math.abs(F)).toBeLessThan(1e-6 * P)
    expect(Math.abs(M)).toBeLessThan(1e-6 * P * 11500)
  })
})

describe('tip deflection', () => {
  const E = 33000
  const I = 1e9
  const w = 10
  const a = 2000
  it('a cantilever fixed at its root: w·a⁴/(8EI) at the tip (handbook cantilever)', () => {
    const r = memberDeflection({ spans: [a], supports: ['fixed', 'free'], loads: [{ kind: 'udl', span: 0, w }], Ecm: E, phi: 0, I, stations: 200 })
    const s = r.spans[0]
    expect(s?.cantilever).toBe(true)
    expect(rel(s?.shortTerm.down as number, (w * a ** 4) / (8 * E * I))).toBeLessThan(1e-4)
    expect(s?.shortTerm.at).toBe(a)
    expect(s?.limitTotal).toBe((2 * a) / 250) // twice the overhang / 250 (common practice)
  })
  it('an overhang beyond a simple span, only the overhang loaded: w·a³(4L + 3a)/(24EI) at the tip (handbook overhanging beam)', () => {
    const L = 6000
    const right = memberDeflection({ spans: [L, a], supports: ['pinned', 'pinned', 'free'], loads: [{ kind: 'udl', span: 1, w }], Ecm: E, phi: 0, I, stations: 400 })
    const hand = (w * a ** 3 * (4 * L + 3 * a)) / (24 * E * I)
    expect(rel(right.spans[1]?.shortTerm.down as number, hand)).toBeLessThan(1e-4)
    // the back span lifts: its largest upward deflection w·a²·L²/(2·9√3·EI) at L/√3 (handbook)
    expect(rel(-(right.spans[0]?.shortTerm.up as number), (w * a * a * L * L) / (2 * 9 * Math.sqrt(3) * E * I))).toBeLessThan(1e-3)
    const left = memberDeflection({ spans: [a, L], supports: ['free', 'pinned', 'pinned'], loads: [{ kind: 'udl', span: 0, w }], Ecm: E, phi: 0, I, stations: 400 })
    expect(rel(left.spans[0]?.shortTerm.down as number, hand)).toBeLessThan(1e-4) // mirror symmetry
    expect(left.spans[0]?.shortTerm.at).toBe(0)
  })
})

describe('a member with a cantilever edge', () => {
  const d = designMember(EDGE)
  const m = designMember(EDGE_MIRRORED)
  it('runs without NaN and anchors the tendon at the tip', () => {
    expect(JSON.stringify(d)).not.toMatch(/NaN|null,"value":NaN/)
    expect(d.profile.supportEcc[0]).toBe(d.input.profile.anchorLeft)
    expect(d.profile.supportEcc[1]).toBeCloseTo(-d.eccentricity.top, 9) // high over the root
  })
  it('checks the tip as a tip, not a support, and has no shear check there', () => {
    expect(d.sections.find((s) => s.id === 'support-1')?.label).toBe('Tip of the cantilever (span 1)')
    expect(d.sections.some((s) => s.id === 'span-1-low')).toBe(false)
    expect(d.uls.shear.some((s) => s.support === 0)).toBe(false)
    expect(d.uls.shear.some((s) => s.support === 1 && s.side === 'left')).toBe(true) // the root, on the cantilever's side
  })
  it('reports the tip deflection against twice the overhang', () => {
    const tip = d.deflection.spans[0]
    expect(tip?.cantilever).toBe(true)
    expect(tip?.limitTotal).toBeCloseTo((2 * 2400) / d.input.deflection.ratioTotal, 9)
  })
  it('loads the cantilever with and without its back span (EN 1992-1-1 5.1.3)', () => {
    const patterns = loadPatterns(parseMemberInput(EDGE))
    expect(patterns.some((p) => p.loadedSpans.includes(0) && !p.loadedSpans.includes(1))).toBe(true)
    expect(patterns.some((p) => !p.loadedSpans.includes(0) && p.loadedSpans.includes(1))).toBe(true)
  })
  it('gives the same results turned end for end (mirror symmetry)', () => {
    const n = 3
    d.prestressMoments.service.total.forEach((v, j) => expect(v).toBeCloseTo(m.prestressMoments.service.total[n - j] as number, 3))
    d.loadCases.supportMoments.selfWeight.forEach((v, j) => expect(v).toBeCloseTo(m.loadCases.supportMoments.selfWeight[n - j] as number, 3))
    expect(d.deflection.spans[0]?.longTerm.value).toBeCloseTo(m.deflection.spans[2]?.longTerm.value as number, 6)
    const root = d.uls.sections.find((s) => s.id === 'support-2')
    const rootMirrored = m.uls.sections.find((s) => s.id === 'support-3')
    expect(root?.MEdMin).toBeCloseTo(rootMirrored?.MEdMin as number, 0)
    expect(root?.MEdMin).toBeLessThan(0) // hogging at the root
  })
})

describe('a free support in the wrong place', () => {
  const message = (draft: MemberInputDraft): string => {
    try {
      parseMemberInput(draft)
    }
    catch (e) {
      if (e instanceof EngineInputError) return e.message
      throw e
    }
    return ''
  }
  it('an interior support cannot be free', () => {
    expect(message({ ...EDGE, geometry: { spans: [8000, 8000], supports: ['pinned', 'free', 'pinned'] } })).toMatch(/Support 2: only the first or last support can be free/)
  })
  it('two cantilevers need a span between them', () => {
    expect(message({ ...EDGE, geometry: { spans: [2000, 2000], supports: ['free', 'pinned', 'free'] } })).toMatch(/Two cantilevers need a span/)
    expect(message({ ...EDGE, geometry: { spans: [2000], supports: ['free', 'free'] } })).toMatch(/no support/)
  })
  it('punching at the tip is refused in words', () => {
    expect(() => designMember({ ...EDGE, punching: { column: 'edge', support: 1 } })).toThrow(/free tip of a cantilever/)
  })
})

describe('a lone cantilever', () => {
  it('needs a fixed root or columns, said in words', () => {
    expect(() => parseMemberInput({ ...EDGE, geometry: { spans: [2000], supports: ['free', 'pinned'] } })).toThrow(/Support 2: a lone cantilever turns about a pinned root/)
    expect(() => parseMemberInput({ ...EDGE, geometry: { spans: [2000], supports: ['free', 'fixed'] } })).not.toThrow()
  })
})
