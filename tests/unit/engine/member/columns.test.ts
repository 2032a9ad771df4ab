import { describe, expect, it } from 'vitest'
import { columnStiffness, designMember } from '../../../../shared/engine/index'
import type { MemberInputDraft } from '../../../../shared/engine/index'
import { fieldOf } from '../../../helpers/engine'
import { ONE_SPAN_SLAB, TWO_SPAN_SLAB } from '../../../helpers/members'

// 400 × 400 mm columns, 3.5 m below with the far end fixed, on an 8 m wide column line
const COLUMNS = { where: 'all' as const, c1: 400, c2: 400, heightBelow: 3500, farEndBelow: 'fixed' as const, heightAbove: 0, panelWidth: 8000 }

describe('columns at the supports (frame action, EN 1992-1-1 5.3, Annex I)', () => {
  it('a single span between equal springs: end moment (wL²/12)·k/(k + 2EI/L) under its self-weight (slope–deflection)', () => {
    const d = designMember({ ...ONE_SPAN_SLAB, columns: COLUMNS }, { proposal: false })
    const E = d.concrete.at28.Ecm
    const k = (1000 / 8000) * columnStiffness({ E, I: (400 * 400 ** 3) / 12, height: 3500, farEnd: 'fixed' }) // per metre of strip
    expect(d.columns!.joints[0]!.kBelow).toBeCloseTo(k, 3)
    const EI = E * d.section.I
    const w = d.loads.selfWeight
    const L = 8000
    const hand = ((w * L * L) / 12) * (k / (k + (2 * EI) / L)) // handbook: fixed-end moment reduced by the end rotation
    expect(d.loadCases.supportMoments.selfWeight[0]).toBeCloseTo(-hand, -2)
    expect(d.loadCases.supportMoments.selfWeight[1]).toBeCloseTo(-hand, -2)
    // the joint passes the same moment into the columns (all of it below: nothing above)
    const j = d.columns!.joints[0]!
    expect(j.shareBelow).toBe(1)
    expect(Math.abs(j.permanent) / ((d.loads.selfWeight + d.loads.superimposed) / w)).toBeCloseTo(hand, -2)
  })

  it('two equal spans with a column only at the middle support: unchanged by symmetry (no rotation there)', () => {
    const bare = designMember(TWO_SPAN_SLAB, { proposal: false })
    const framed = designMember({ ...TWO_SPAN_SLAB, columns: { ...COLUMNS, where: 'interior' } } as MemberInputDraft, { proposal: false })
    expect(framed.loadCases.supportMoments.selfWeight[1]).toBeCloseTo(bare.loadCases.supportMoments.selfWeight[1]!, 0)
    expect(framed.columns!.joints[0]!.permanent).toBeCloseTo(0, 0)
    // the symmetric tendon leaves the middle joint unturned as well: no prestress into the column
    expect(framed.columns!.joints[0]!.prestressService).toBeCloseTo(0, 0)
  })

  it('columns reduce the sagging and take a share of the secondary moment: the member and its columns stay in equilibrium', () => {
    const d = designMember({ ...TWO_SPAN_SLAB, columns: COLUMNS }, { proposal: false })
    const bare = designMember(TWO_SPAN_SLAB, { proposal: false })
    const mid = (x: typeof d) => Math.max(...x.sections.filter((s) => s.kind === 'lowPoint').map((s) => s.moments.selfWeight))
    expect(mid(d)).toBeLessThan(mid(bare))
    // joint equilibrium at an end support: the column takes the member's whole end moment; the two ends turn opposite ways
    const [first, , last] = d.columns!.joints
    const ratio = (d.loads.selfWeight + d.loads.superimposed) / d.loads.selfWeight
    expect(Math.abs(first!.permanent)).toBeCloseTo(Math.abs(d.loadCases.supportMoments.selfWeight[0]!) * ratio, -3)
    expect(last!.permanent).toBeCloseTo(-first!.permanent, -3)
    // the columns take part of the prestress: a secondary couple at each end joint
    expect(Math.abs(first!.prestressService)).toBeGreaterThan(0)
  })

  it('bad input names the field', () => {
    expect(fieldOf(() => designMember({ ...ONE_SPAN_SLAB, columns: { ...COLUMNS, heightBelow: 0 } }, { proposal: false }))).toBe('columns.heightBelow')
    expect(fieldOf(() => designMember({ ...ONE_SPAN_SLAB, geometry: { spans: [8000], supports: ['fixed', 'pinned'] }, columns: COLUMNS }, { proposal: false }))).toBe('columns.where')
  })
})
