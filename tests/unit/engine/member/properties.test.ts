/**
 * Properties of the whole member design over seeded random members: 1–30 spans of 2–15 m, slab
 * strips and band beams 150–600 mm deep, bonded and unbonded, pinned and fixed ends, cantilevers at
 * either end, columns below and above (frame action), point, line and partial loads (permanent and
 * imposed, each with its own ψ), drops over supports, fire ratings, every profile kind (reverse curves and kinks over the
 * supports), each stressing end. Invented members.
 */
import { describe, expect, it } from 'vitest'
import { designMember } from '../../../../shared/engine/index'
import type { Design, MemberInputDraft } from '../../../../shared/engine/index'
import { equivalentLoads } from '../../../../shared/engine/prestress/equivalent-loads'
import { between, prng } from '../../../helpers/prng'

type Ends = 'left' | 'right' | 'both'

function randomMember(r: () => number, maxSpans = 30): MemberInputDraft {
  const n = 1 + Math.floor(r() ** 2 * maxSpans) // every count from 1 to maxSpans, the short members more often (they are the common ones)
  const spans = Array.from({ length: n }, () => Math.round(between(r, 2000, 15000) / 10) * 10)
  const slab = r() < 0.6
  const h = Math.round(between(r, slab ? 150 : 300, 600) / 10) * 10
  const inflection = r() < 0.25 ? 0 : between(r, 0.05, 0.15) // 0: a kink over each interior support
  // one tendon runs the whole member: past about 60 m a real strip is split into lapped tendons, so a
  // longer one is stressed from both ends and its friction scaled down to keep a force along it
  const length = spans.reduce((a, b) => a + b, 0)
  const long = length > 60000
  const friction = Math.min(1, 60000 / length)
  const ends = long ? 'both' as const : (['left', 'right', 'both'] as const)[Math.floor(r() * 3)]
  const supports: Array<'pinned' | 'fixed' | 'free'> = Array.from({ length: n + 1 }, (_, j) => ((j === 0 || j === n) && r() < 0.15 ? 'fixed' as const : 'pinned' as const))
  // a cantilever at either end of a member of three spans or more
  if (n >= 3 && r() < 0.2) { supports[0] = 'free'; spans[0] = Math.round(between(r, 1000, 3500) / 10) * 10 }
  if (n >= 3 && r() < 0.2) { supports[n] = 'free'; spans[n - 1] = Math.round(between(r, 1000, 3500) / 10) * 10 }
  // point, line and partial loads on random spans
  const type = (): 'permanent' | 'imposed' => (r() < 0.5 ? 'permanent' : 'imposed')
  const psis = (): { psi0: number; psi1: number; psi2: number } => ({ psi0: 0.7, psi1: between(r, 0.3, 0.9), psi2: between(r, 0.2, 0.8) })
  const onSpan = (): { span: number; L: number } => { const i = Math.floor(r() * n); return { span: i + 1, L: spans[i] as number } }
  const points = r() < 0.4 ? Array.from({ length: 1 + Math.floor(r() * 3) }, () => { const { span, L } = onSpan(); return { span, at: Math.round(between(r, 0, 1) * L), P: between(r, 2, 25) * 1e3, type: type(), ...psis() } }) : []
  const lines = r() < 0.4 ? Array.from({ length: 1 + Math.floor(r() * 2) }, () => { const { span, L } = onSpan(); return { span, at: Math.round(between(r, 0, 1) * L), w: between(r, 2, 12), type: type(), ...psis() } }) : []
  const partials = r() < 0.4 ? Array.from({ length: 1 + Math.floor(r() * 2) }, () => { const { span, L } = onSpan(); const from = Math.round(between(r, 0, 0.6) * L); return { span, from, length: Math.round(between(r, 0.1, 0.4) * L), q: between(r, 1, 5) * 1e-3, type: type(), ...psis() } }) : []
  // columns below (and sometimes above) at pinned supports: frame action in every load case and in the prestress
  const framed = r() < 0.3
  const where = supports.some((k) => k === 'fixed' || k === 'free') ? 'interior' as const : r() < 0.5 ? 'all' as const : 'interior' as const
  const member: MemberInputDraft = {
    geometry: { spans, supports },
    ...(framed ? { columns: { where, c1: Math.round(between(r, 250, 700)), c2: Math.round(between(r, 250, 700)), heightBelow: Math.round(between(r, 2800, 4500)), heightAbove: r() < 0.5 ? 0 : 3200 } } : {}),
    ...(r() < 0.3 ? { fire: { rating: (['R60', 'R90', 'R120'] as const)[Math.floor(r() * 3)] } } : {}),
    section: slab ? { kind: 'slab-strip', h } : { kind: 'tee-beam', h, bw: Math.round(between(r, 1200, 2400) / 100) * 100, bf: 7200, hf: Math.min(h - 100, 200) },
    materials: { concreteClass: r() < 0.5 ? 'C32/40' : 'C40/50' },
    tendon: slab
      ? { strand: '12.9', strandsPerTendon: 4, spacing: Math.round(between(r, 400, 1200) / 50) * 50, coverTop: 25, coverBottom: 25, bond: r() < 0.5 ? 'bonded' : 'unbonded', stressing: ends }
      : { strand: '12.9', strandsPerTendon: 5, count: 2 + Math.floor(r() * 4), ductShape: 'flat', ductHeight: 20, ductWidth: 75, coverTop: 40, coverBottom: 40, bond: r() < 0.5 ? 'bonded' : 'unbonded', stressing: ends },
    profile: { mode: 'deepest', inflection, lowPointAt: spans.map(() => between(r, 0.4, 0.6)) },
    loads: { superimposed: between(r, 0.5, 2.5) * 1e-3, imposed: between(r, 1.5, 5) * 1e-3, pattern: r() < 0.8 ? 'alternate-and-adjacent' : 'all-spans', points, lines, partials },
    losses: { mu: between(r, 0.04, 0.2) * friction, wobble: between(r, 0, 1e-5) * friction, drawIn: between(r, 2, 8) },
    uls: { barsBottom: { area: Math.round(between(r, 0, 800)) }, barsTop: { area: Math.round(between(r, 0, 1200)) } },
  }
  // drops over some supports (never a free tip): a share of each adjacent span, a full or part width
  if (r() < 0.3) {
    const drops = supports.flatMap((k, j) => {
      if (k === 'free' || r() < 0.5) return []
      const left = j > 0 ? Math.round(between(r, 0.1, 0.3) * (spans[j - 1] as number)) : 0
      const right = j < n ? Math.round(between(r, 0.1, 0.3) * (spans[j] as number)) : 0
      return [{ support: j + 1, left, right, depth: Math.round(between(r, 80, 250)), ...(slab && r() < 0.5 ? { width: Math.round(between(r, 300, 900)) } : {}) }]
    })
    member.section = { ...member.section!, drops }
  }
  return member
}

/** The same member seen from the other end: spans, supports and low points reversed, the stressing end swapped. */
function mirrored(m: MemberInputDraft): MemberInputDraft {
  const g = m.geometry!
  const swap: Record<Ends, Ends> = { left: 'right', right: 'left', both: 'both' }
  const n = g.spans!.length
  const span = (k: number): number => g.spans![k - 1] as number
  return {
    ...m,
    geometry: { ...g, spans: [...g.spans!].reverse(), ...(g.supports ? { supports: [...g.supports].reverse() } : {}) },
    tendon: { ...m.tendon, stressing: swap[(m.tendon?.stressing ?? 'both') as Ends] },
    profile: { ...m.profile, lowPointAt: (m.profile!.lowPointAt as number[]).map((b) => 1 - b).reverse() },
    section: { ...m.section!, drops: (m.section!.drops ?? []).map((d) => ({ ...d, support: n + 2 - d.support, left: d.right, right: d.left })) },
    loads: {
      ...m.loads!,
      points: (m.loads!.points ?? []).map((l) => ({ ...l, span: n + 1 - l.span, at: span(l.span) - l.at })),
      lines: (m.loads!.lines ?? []).map((l) => ({ ...l, span: n + 1 - l.span, at: span(l.span) - l.at })),
      partials: (m.loads!.partials ?? []).map((l) => ({ ...l, span: n + 1 - l.span, from: span(l.span) - l.from - l.length })),
    },
  }
}

const finiteLeaves = (v: unknown, path: string, out: string[]): void => {
  if (typeof v === 'number') { if (!Number.isFinite(v)) out.push(path) }
  else if (Array.isArray(v)) v.forEach((x, i) => finiteLeaves(x, `${path}.${i}`, out))
  else if (v && typeof v === 'object') for (const [k, x] of Object.entries(v)) finiteLeaves(x, path ? `${path}.${k}` : k, out)
}

describe('the member design over random members (seeded)', () => {
  it('200 members of 1–30 spans: every result finite, nothing thrown', { timeout: 600_000 }, () => {
    const r = prng(3001)
    for (let t = 0; t < 200; t++) {
      const m = randomMember(r)
      let d: Design
      try {
        d = designMember(m, { proposal: false })
      } catch (error) {
        throw new Error(`member ${t} (${m.geometry!.spans!.length} spans, h ${m.section!.h}): ${(error as Error).message}`)
      }
      const bad: string[] = []
      finiteLeaves(d, '', bad)
      expect(bad, `member ${t}`).toEqual([])
      expect(d.checks.every((c) => Number.isFinite(c.utilisation) && typeof c.pass === 'boolean')).toBe(true)
    }
  })

  it('100 members and their mirror images: the same check results and mirrored stresses (every profile kind, each stressing end)', { timeout: 600_000 }, () => {
    const r = prng(3002)
    for (let t = 0; t < 100; t++) {
      const m = randomMember(r, 12)
      const a = designMember(m, { proposal: false })
      const b = designMember(mirrored(m), { proposal: false })
      const byId = new Map(b.checks.map((c) => [c.id, c]))
      const ids = (x: Design): string[] => x.checks.map((c) => c.id).sort()
      expect(ids(b).filter((id) => !ids(a).includes(id)).concat(ids(a).filter((id) => !ids(b).includes(id))), `member ${t}`).toEqual([])
      for (const c of a.checks) {
        const o = byId.get(c.id)!
        expect(o.pass, `member ${t}, ${c.id}`).toBe(c.pass)
        expect(Math.abs(o.utilisation - c.utilisation), `member ${t}, ${c.id}`).toBeLessThan(1e-6 * Math.max(1, c.utilisation))
      }
      // a section at X and its mirror at L − X carry the same stresses
      const L = a.profile.length
      for (const s of a.sections) {
        // a support with columns is two sections, its left and right sides: mirrored, each becomes the other
        const side = (label: string): string => (label.endsWith('left side') ? 'left' : label.endsWith('right side') ? 'right' : '')
        const mirrorSide = { left: 'right', right: 'left', '': '' }[side(s.label)]
        const o = b.sections.find((x) => Math.abs(x.X - (L - s.X)) < 1e-6 && side(x.label) === mirrorSide)
        if (!o) continue
        for (const stage of ['transfer', 'quasiPermanent'] as const) {
          expect(o.stress[stage].top, `member ${t}, ${s.label}`).toBeCloseTo(s.stress[stage].top, 6)
          expect(o.stress[stage].bottom, `member ${t}, ${s.label}`).toBeCloseTo(s.stress[stage].bottom, 6)
        }
      }
    }
  })

  it('200 profiles of 1–30 spans, kinks included: the equivalent loads are in equilibrium (Lin: a tendon exerts no net force or moment on the concrete)', () => {
    const r = prng(3003)
    for (let t = 0; t < 200; t++) {
      const n = 1 + Math.floor(r() * 30)
      const spans = Array.from({ length: n }, () => Math.round(between(r, 2000, 15000)))
      const h = between(r, 150, 600)
      const ecc = (): number => between(r, -0.35, 0.35) * h
      const profile = {
        spans, supportEcc: Array.from({ length: n + 1 }, ecc), spanEcc: spans.map(() => between(r, 0.1, 0.4) * h),
        lowPointAt: spans.map(() => between(r, 0.35, 0.65)), inflection: r() < 0.3 ? 0 : between(r, 0.03, 0.15),
        // cantilevers: one parabola from the root to the anchorage at the tip
        ...(n >= 2 ? { cantilever: { left: r() < 0.25, right: r() < 0.25 } } : {}),
      }
      const P = 1e6
      let F = 0
      let M = 0 // about the left end, clockwise (downward force times distance) positive
      const starts = spans.reduce<number[]>((acc, L, i) => [...acc, (acc[i] as number) + L], [0])
      for (const l of equivalentLoads(profile, P)) {
        const x0 = starts[l.span] as number
        if (l.kind === 'patch') { F += l.w * (l.to - l.from); M += l.w * (l.to - l.from) * (x0 + (l.from + l.to) / 2) }
        else if (l.kind === 'udl') { const L = spans[l.span] as number; F += l.w * L; M += l.w * L * (x0 + L / 2) }
        else if (l.kind === 'point') { F += l.P; M += l.P * (x0 + l.at) }
        else if (l.kind === 'couple') M -= l.M // a counter-clockwise couple
      }
      expect(Math.abs(F) / P, `profile ${t}, ${n} spans`).toBeLessThan(1e-9)
      expect(Math.abs(M) / (P * (starts[n] as number)), `profile ${t}, ${n} spans`).toBeLessThan(1e-9)
    }
  })
})
