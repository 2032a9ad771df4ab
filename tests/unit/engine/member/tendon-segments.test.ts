import { describe, expect, it } from 'vitest'
import { DEMO_BB1, DEMO_PS2, designMember } from '../../../../shared/engine/index'
import { EngineInputError } from '../../../../shared/engine/contract'
import { parseMemberInput } from '../../../../shared/engine/input/schema'
import { inputFieldSpecs } from '../../../../shared/engine/input/field-specs'
import type { MemberInputDraft } from '../../../../shared/engine/input/schema'
import { fieldOf, rel } from '../../../helpers/engine'

/** The demo podium strip (symmetric: 7.8 / 9.6 / 9.6 / 7.8 m, low points mirrored) built in two halves. */
const halves = (joint: Record<string, unknown>, stressing: 'left' | 'right' | 'both' = 'both'): MemberInputDraft => ({
  ...DEMO_PS2, tendon: { ...DEMO_PS2.tendon, stressing, joints: [{ support: 3, ...joint }] },
} as MemberInputDraft)

/** The message an input gives, or 'accepted'. */
function messageOf(draft: unknown): string {
  try {
    parseMemberInput(draft)
  } catch (e) {
    if (e instanceof EngineInputError) return `${e.field} — ${e.message.slice(e.field.length + 2)}`
    throw e
  }
  return 'accepted'
}

describe('a member built in segments', () => {
  it('joints in the input: refused at an end support or past the member, with the joint named in words', () => {
    expect(messageOf(halves({ support: 1 }))).toBe('tendon.joints.0.support — Joint 1: support 1 is an end of the member; a joint sits over an interior support, 2 to 4')
    expect(messageOf(halves({ support: 7 }))).toBe('tendon.joints.0.support — Joint 1: there is no support 7; the member has 5 supports')
    expect(messageOf(halves({ support: 3, kind: 'coupler', stressed: 'neither' }))).toMatch(/^tendon\.joints\.0\.stressed — Joint 1: at a coupler/)
    expect(messageOf(halves({ support: 3, stressed: 'left' }, 'left'))).toBe('tendon.joints.0.stressed — Joint 1: the segment from support 3 to support 5 is stressed at neither end; stress it at joint 1 or at the right end')
    expect(messageOf(halves({ support: 0 }))).toBe('tendon.joints.0.support — Joint: supports are numbered from 1 at the left end')
    expect(messageOf(halves({ support: 3 }))).toBe('accepted') // an intermediate anchorage stressed from the left by default
  })

  it('no joints: the same design as before joints existed (one segment, the whole tendon)', () => {
    const plain = designMember(DEMO_PS2, { proposal: false })
    const empty = designMember({ ...DEMO_PS2, tendon: { ...DEMO_PS2.tendon, joints: [] } }, { proposal: false })
    expect(empty.series.forceFriction).toEqual(plain.series.forceFriction)
    expect(empty.force.meanTransfer).toBe(plain.force.meanTransfer)
    expect(plain.force.segments).toHaveLength(1)
    expect(plain.force.segments[0]!.words).toBe('supports 1 to 5')
    expect(plain.site.stressing.tendons[0]!.segments).toHaveLength(1)
  })

  it('two halves of the symmetric demo strip, each stressed from its outer end: the force is the mirror image about the joint (symmetry)', () => {
    const d = designMember(halves({ support: 3, stressed: 'neither' }), { proposal: false })
    expect(d.force.segments.map((s) => [s.from, s.to, s.ends])).toEqual([[1, 3, 'left'], [3, 5, 'right']])
    const P = d.series.forceFriction
    const n = P.length
    expect(Math.max(...P.map((v, j) => Math.abs(v - P[n - 1 - j]!) / v))).toBeLessThan(1e-9)
    // the jacks sit at the member's ends; at the joint both segments have lost their friction
    expect(P[0]).toBeCloseTo(d.force.jacking, 6)
    const plain = designMember({ ...DEMO_PS2, tendon: { ...DEMO_PS2.tendon, stressing: 'left' } }, { proposal: false })
    const atJoint = d.series.X.findIndex((x) => x === 7800 + 9600)
    expect(P[atJoint]).toBeCloseTo(plain.series.forceFriction[atJoint]!, 6) // the first half is the left-stressed tendon's first half
    // the stressing schedule lists each segment's extension; they mirror one another
    const t = d.site.stressing.tendons[0]!
    expect(t.segments.map((s) => s.ends)).toEqual(['left', 'right'])
    expect(rel(t.segments[0]!.extension.total, t.segments[1]!.extension.total)).toBeLessThan(1e-9)
    expect(t.extension.left).toBe(t.segments[0]!.extension.left)
    expect(t.extension.right).toBe(t.segments[1]!.extension.right)
    expect(t.extension.total).toBeCloseTo(t.segments[0]!.extension.total + t.segments[1]!.extension.total, 9)
  })

  it('stressing pocket at the joint, both segments stressed there: friction restarts from the joint in each (EN 1992-1-1 eq. (5.45))', () => {
    const d = designMember(halves({ support: 3, stressed: 'both' }, 'left'), { proposal: false })
    expect(d.force.segments.map((s) => s.ends)).toEqual(['both', 'left'])
    const X = d.series.X
    const P = d.series.forceFriction
    const j = X.findIndex((x) => x === 7800 + 9600)
    expect(P[j]).toBeCloseTo(d.force.jacking, 6) // end of segment 1, stressed at the joint
    expect(P[j + 1]).toBeCloseTo(d.force.jacking, 6) // start of segment 2, stressed at the joint
    // segment 2 from its left end is the mirror of segment 1 stressed from its right end alone (the strip is symmetric)
    const mirror = designMember(halves({ support: 3, stressed: 'left' }, 'right'), { proposal: false })
    expect(mirror.force.segments.map((s) => s.ends)).toEqual(['right', 'right'])
    const Q = mirror.series.forceFriction
    const n = P.length
    for (let k = j + 1; k < n; k++) expect(rel(P[k]!, Q[n - 1 - k]!)).toBeLessThan(1e-9)
  })

  it('a beam keeps its own tendons; joints run through its schedule as well', () => {
    const d = designMember({ ...DEMO_BB1, tendon: { ...DEMO_BB1.tendon, joints: [{ support: 2, kind: 'coupler', stressed: 'left' }] }, site: { stripWidth: 6000 } }, { proposal: false })
    expect(d.site.stressing.tendons).toHaveLength(4)
    expect(d.warnings.some((w) => w.includes('applies to slab strips only'))).toBe(true)
    expect(d.site.stressing.tendons[0]!.segments.map((s) => [s.from, s.to, s.ends, s.words])).toEqual([[1, 2, 'both', 'supports 1 to 2, coupler at 2'], [2, 4, 'right', 'supports 2 to 4, coupler at 2']])
  })

  it('the form edits the joints as a table whose new row is a valid joint over the first interior support', () => {
    const f = inputFieldSpecs().find((x) => x.path === 'tendon.joints')!
    expect(f.kind).toBe('table')
    expect(f.spec.group).toBe('tendon')
    expect(f.columns!.map((c) => [c.path, c.kind])).toEqual([['support', 'number'], ['kind', 'enum'], ['stressed', 'enum']])
    expect(f.emptyRow).toEqual({ support: 2, kind: 'intermediate-anchorage', stressed: 'left' })
    expect(messageOf({ ...DEMO_PS2, tendon: { ...DEMO_PS2.tendon, joints: [f.emptyRow] } })).toBe('accepted')
    expect(inputFieldSpecs().find((x) => x.path === 'site.stripWidth')?.spec).toMatchObject({ unit: 'm', group: 'site' })
  })

  it('quantities: two anchorages per tendon, two more at an intermediate anchorage, one and a coupler at a coupler', () => {
    // demo strip: 1000/750 tendons per metre (common practice: an intermediate anchorage anchors both segments at the joint)
    const d = designMember({ ...DEMO_PS2, tendon: { ...DEMO_PS2.tendon, joints: [{ support: 2, stressed: 'left' }, { support: 4, kind: 'coupler', stressed: 'left' }] } }, { proposal: false })
    expect(d.quantities.anchorages).toBeCloseTo(5 * (1000 / 750), 12)
    expect(d.quantities.couplers).toBeCloseTo(1000 / 750, 12)
    expect(designMember(DEMO_PS2, { proposal: false }).quantities.couplers).toBe(0)
  })

  it('members with joints anywhere give finite results throughout (no NaN reaches a check)', () => {
    const cases: MemberInputDraft[] = [
      halves({ support: 2, stressed: 'both' }),
      halves({ support: 4, kind: 'coupler', stressed: 'right' }, 'left'),
      { ...DEMO_PS2, tendon: { ...DEMO_PS2.tendon, joints: [{ support: 2, stressed: 'neither' }, { support: 3, stressed: 'both' }, { support: 4, kind: 'coupler', stressed: 'left' }] } } as MemberInputDraft,
      { ...DEMO_BB1, tendon: { ...DEMO_BB1.tendon, stressing: 'left', joints: [{ support: 3, stressed: 'both' }] } } as MemberInputDraft,
    ]
    for (const c of cases) {
      const d = designMember(c, { proposal: false })
      for (const ch of d.checks) expect(Number.isFinite(ch.utilisation), ch.id).toBe(true)
      for (const v of [...d.series.forceFriction, d.force.meanAfterDrawIn, d.force.meanService]) expect(Number.isFinite(v)).toBe(true)
      for (const t of d.site.stressing.tendons) for (const g of t.segments) expect(g.extension.total).toBeGreaterThan(0)
    }
  })

  it('a joint the engine cannot place names the joints field', () => {
    expect(fieldOf(() => designMember(halves({ support: 5 }), { proposal: false }))).toBe('tendon.joints.0.support')
  })
})

describe('anchorages at the joints', () => {
  it('each joint has its anchor plate checked like an end: eq. (6.58) ties by hand, at the tendon\'s depth over the support', () => {
    const d = designMember(halves({ support: 3, stressed: 'both' }, 'both'), { proposal: false })
    expect(d.anchorages.map((a) => a.label)).toEqual(['Left end', 'Right end', 'Joint at support 3'])
    const j = d.anchorages[2]!
    // the plate centre over support 3 lies at yt + e there (the tendon near the top)
    expect(j.depth).toBeCloseTo(d.section.yt + d.profile.supportEcc[2]!, 9)
    // eq. (6.58) by hand: T = ¼·(b − a)/b·F across the tendon's share of the width
    const a = Math.min(j.plateWidth, j.bAcross)
    expect(j.tieAcross).toBeCloseTo(0.25 * ((j.bAcross - a) / j.bAcross) * j.FEd, 6)
    expect(d.checks.find((c) => c.id === 'detailing.anchorageBearing')).toBeDefined()
  })
})
