import { describe, expect, it } from 'vitest'
import { DEMO_BB1, DEMO_PS2, designMember } from '../../../../shared/engine/index'
import type { Design, MemberInputDraft } from '../../../../shared/engine/index'
import { ONE_SPAN_SLAB } from '../../../helpers/members'
import { between, prng } from '../../../helpers/prng'

type Ends = 'left' | 'right' | 'both'

function withEnds(draft: MemberInputDraft, ends: Ends): Design {
  return designMember({ ...draft, tendon: { ...draft.tendon, stressing: ends }, site: { ...draft.site, alternateEnds: 'no' } }, { proposal: false })
}

/** Largest relative difference between the member's force after lock-off and tendon T1 of its stressing schedule, per unit jacking force. */
function mismatch(d: Design): number {
  const member = d.series.forceDrawIn.map((P) => P / d.jacking.Pjack)
  const t = d.site.stressing.tendons[0]!
  const site = (d.site.stressing.series.force[0] as number[]).map((P) => P / t.Pjack)
  expect(site.length).toBe(member.length)
  return Math.max(...member.map((v, k) => Math.abs(v - site[k]!) / v))
}

function randomMember(r: () => number): MemberInputDraft {
  const n = 1 + Math.floor(r() * 5)
  const spans = Array.from({ length: n }, () => Math.round(between(r, 4000, 12000)))
  const slab = r() < 0.6
  return {
    geometry: { spans },
    section: slab ? { kind: 'slab-strip', h: Math.round(Math.max(...spans) / 35 / 10) * 10 + 20 } : DEMO_BB1.section,
    materials: { concreteClass: 'C35/45' },
    tendon: slab ? { strandsPerTendon: 4, spacing: 900, coverTop: 25, coverBottom: 25 } : DEMO_BB1.tendon,
    profile: { mode: 'deepest', inflection: between(r, 0.05, 0.15) },
    loads: { superimposed: between(r, 1, 2) * 1e-3, imposed: between(r, 1.5, 4) * 1e-3 },
    losses: { mu: between(r, 0.04, 0.25), wobble: between(r, 0, 1e-5), drawIn: between(r, 2, 8) },
  }
}

describe('force after lock-off: the member and its stressing schedule', () => {
  it('a 6 m span with 6 mm draw-in at each end, both jacks together, loses 2·6/6000·195 000 = 390 MPa of mean stress (slip compatibility: ∫ΔP ds = 2Δ·Ep·Ap, textbook method)', () => {
    const d = designMember({ ...ONE_SPAN_SLAB, geometry: { spans: [6000] }, tendon: { ...ONE_SPAN_SLAB.tendon, stressing: 'both' }, losses: { drawIn: 6 } }, { proposal: false })
    expect(d.strand.Ep).toBe(195000)
    const lossMPa = (d.force.meanAfterFriction - d.force.meanAfterDrawIn) / d.jacking.Ap
    // the member averages over its horizontal stations and the slip acts along the tendon (longer by ≈ (8/3)(a/L)², under 0.1 % here)
    expect(Math.abs(lossMPa / 390 - 1)).toBeLessThan(2e-3)
    expect(d.warnings.some((w) => w.includes('draw-in reaches the far end'))).toBe(true)
  })

  it.each([['PS-2', DEMO_PS2], ['BB-1', DEMO_BB1]] as const)('%s from the left, the right and both ends: the same numbers within 1e-9', (_, demo) => {
    for (const ends of ['left', 'right', 'both'] as const) expect(mismatch(withEnds(demo, ends)), ends).toBeLessThan(1e-9)
  })

  it('50 seeded members from the left, the right and both ends: the same numbers within 1e-9', { timeout: 300_000 }, () => {
    const r = prng(7331)
    for (let i = 0; i < 50; i++) {
      const draft = randomMember(r)
      const ends = (['left', 'right', 'both'] as const)[i % 3] as Ends
      expect(mismatch(withEnds(draft, ends)), `member ${i} from ${ends}`).toBeLessThan(1e-9)
    }
  })
})
