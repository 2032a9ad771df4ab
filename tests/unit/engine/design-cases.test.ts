import { describe, expect, it } from 'vitest'
import { designMember } from '../../../shared/engine/index'
import type { MemberInputDraft } from '../../../shared/engine/index'

const L = 8000
const threeSpans: MemberInputDraft = {
  geometry: { spans: [L, L, L] },
  section: { kind: 'slab-strip', h: 220 },
  materials: { concreteClass: 'C32/40' },
  tendon: { coverTop: 25, coverBottom: 25, ductHeight: 19, ductWidth: 50, strandsPerTendon: 4, spacing: 900 },
  profile: { lowPointAt: [0.45, 0.5, 0.55] },
  loads: { superimposed: 1.5e-3, imposed: 4e-3 },
}

describe('pattern loading in the member design (EN 1992-1-1 5.1.3) against handbook coefficients for three equal spans', () => {
  const d = designMember(threeSpans, { proposal: false })
  const q = 4e-3 * 1000 // N/mm on the 1 m strip
  it('greatest imposed sagging in an end span: 0.101 qL² near 0.45L with spans 1 and 3 loaded (handbook)', () => {
    const s = d.sections.find((x) => x.id === 'span-1-low')
    expect(s).toBeDefined()
    expect((s?.moments.imposed.max as number) / (q * L * L)).toBeCloseTo(0.10125, 4)
  })
  it('greatest imposed hogging at an interior support: −0.117 qL² with the two adjacent spans loaded (handbook)', () => {
    const s = d.sections.find((x) => x.id === 'support-2')
    expect((s?.moments.imposed.min as number) / (q * L * L)).toBeCloseTo(-0.1167, 3)
  })
  it('the middle span\'s greatest imposed sagging is 0.075 qL² with only the middle span loaded (handbook)', () => {
    const s = d.sections.find((x) => x.id === 'span-2-low')
    expect((s?.moments.imposed.max as number) / (q * L * L)).toBeCloseTo(0.075, 4)
  })
  it('self-weight moments follow the all-spans coefficients: −0.100 gL² at the supports (handbook)', () => {
    const g = 25e-6 * 220 * 1000
    expect((d.loadCases.supportMoments.selfWeight[1] as number) / (g * L * L)).toBeCloseTo(-0.1, 6)
  })
})

describe('custom profile equal to the deepest one gives the same design', () => {
  it('same stresses at every section', () => {
    const a = designMember(threeSpans, { proposal: false })
    const b = designMember({
      ...threeSpans,
      profile: { ...threeSpans.profile, mode: 'custom', supportEcc: a.profile.supportEcc, spanEcc: a.profile.spanEcc },
    }, { proposal: false })
    a.sections.forEach((s, i) => expect(b.sections[i]?.stress.characteristic.top).toBeCloseTo(s.stress.characteristic.top, 9))
  })
})

describe('losses in the member', () => {
  it('stressing from both ends gives a higher mean force after friction than from one end (eq. (5.45))', () => {
    const both = designMember({ ...threeSpans, tendon: { ...threeSpans.tendon, stressing: 'both' } }, { proposal: false })
    const one = designMember({ ...threeSpans, tendon: { ...threeSpans.tendon, stressing: 'left' } }, { proposal: false })
    expect(both.force.meanAfterFriction).toBeGreaterThan(one.force.meanAfterFriction)
    // from one end the force falls monotonically along the tendon
    const f = one.series.forceFriction
    for (let k = 1; k < f.length; k++) expect(f[k] as number).toBeLessThanOrEqual((f[k - 1] as number) + 1e-6)
  })
  it('the percentage model takes the accepted share of the transfer force as the long-term loss', () => {
    const d = designMember({ ...threeSpans, losses: { model: 'percentage', longTermShare: 0.15 } }, { proposal: false })
    expect(d.force.meanService / d.force.meanTransfer).toBeCloseTo(0.85, 9)
    expect(d.losses.creep.force).toBeNull()
  })
  it('unbonded tendons take one long-term loss along the whole tendon (mean strain, 5.10.6(3))', () => {
    const d = designMember({ ...threeSpans, tendon: { ...threeSpans.tendon, bond: 'unbonded' } }, { proposal: false })
    const loss = d.series.forceTransfer.map((p, k) => p - (d.series.forceService[k] as number))
    for (const v of loss) expect(v).toBeCloseTo(loss[0] as number, 6)
  })
})
