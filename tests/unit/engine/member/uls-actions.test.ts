import { describe, expect, it } from 'vitest'
import { DEMO_BB1, DEMO_PS2, parseMemberInput, ulsCaseNames, ulsLoadCases } from '../../../../shared/engine/index'
import type { MemberInputDraft, ResponseQuantity } from '../../../../shared/engine/index'
import { quantityOf } from '../../../../shared/engine/analysis/pattern-loading'
import { designForService } from '../../../../shared/engine/member/service-design'
import { ulsActions } from '../../../../shared/engine/member/uls-actions'
import { between, prng } from '../../../helpers/prng'

/** Every case of EN 1990 (6.10) or (6.10a/b) solved on its own, the way a hand check lists them. */
function bruteForce(draft: MemberInputDraft) {
  const input = parseMemberInput(draft)
  const d = designForService(input)
  const u = input.uls
  const cases = ulsLoadCases(input.geometry.spans.length, u.combination, { gammaGsup: u.gammaG, gammaQ: u.gammaQ, psi0: input.loads.psi0, xi: u.xi, gammaP: u.gammaP })
    .filter((c) => input.loads.pattern !== 'all-spans' || c.id.endsWith('.all'))
  const G = d.loads.selfWeight + d.loads.superimposed
  const Q = d.loads.imposed
  const solved = cases.map((c) => d.loads.responses.combine(input.geometry.spans.map((_, i) => c.g[i]! * G + c.q[i]! * Q)))
  return { input, d, actions: ulsActions(input, d.section, d.loads, d.analysis), cases, solved }
}

describe('ULS actions as envelopes agree with every case solved on its own', () => {
  const members: MemberInputDraft[] = [DEMO_PS2, DEMO_BB1, { ...DEMO_PS2, uls: { combination: '6.10a/b' } }]
  const r = prng(6101)
  for (let t = 0; t < 12; t++) {
    const n = 1 + Math.floor(r() * 14)
    members.push({ ...DEMO_PS2, geometry: { spans: Array.from({ length: n }, () => Math.round(between(r, 4000, 11000))) }, profile: { ...DEMO_PS2.profile, lowPointAt: Array.from({ length: n }, () => 0.5) }, uls: { combination: r() < 0.5 ? '6.10' : '6.10a/b' } })
  }

  it('moments, shears and reactions at every support and tenth point (demo members and 12 seeded strips)', () => {
    members.forEach((m, k) => {
      const { input, actions, cases, solved } = bruteForce(m)
      expect(actions.cases.map((c) => c.id)).toEqual(cases.map((c) => c.id))
      const points: ResponseQuantity[] = []
      input.geometry.spans.forEach((L, span) => {
        for (let f = 0; f <= 10; f++) points.push({ kind: 'moment', span, x: (f * L) / 10 }, { kind: 'shear', span, x: (f * L) / 10 })
      })
      input.geometry.spans.concat(0).forEach((_, support) => points.push({ kind: 'reaction', support }))
      // round-off is judged against the member's largest value of each kind (a pinned end holds ±1e-8 N·mm)
      const all = points.map((q) => solved.map((s) => quantityOf(s, q)))
      const scaleOf = (kind: string): number => Math.max(1, ...points.flatMap((q, i) => (q.kind === kind ? all[i]!.map(Math.abs) : [])))
      const scales = { moment: scaleOf('moment'), shear: scaleOf('shear'), reaction: scaleOf('reaction') }
      points.forEach((q, i) => {
        const values = all[i]!
        const e = actions.envelope(q)
        expect(Math.abs(e.max - Math.max(...values)) / scales[q.kind], `member ${k} ${JSON.stringify(q)}`).toBeLessThan(1e-9)
        expect(Math.abs(e.min - Math.min(...values)) / scales[q.kind], `member ${k} ${JSON.stringify(q)}`).toBeLessThan(1e-9)
      })
    })
  })

  it('the case names without their span factors are those of the full cases', () => {
    for (const n of [1, 2, 3, 7]) {
      for (const rule of ['6.10', '6.10a/b'] as const) {
        expect(ulsCaseNames(n, rule)).toEqual(ulsLoadCases(n, rule).map(({ id, label, clause }) => ({ id, label, clause })))
      }
    }
  })
})
