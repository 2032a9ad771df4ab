/**
 * Design actions at the ultimate limit state shared by the bending, shear and punching checks: the
 * EN 1990 fundamental combinations with pattern loading as envelopes of any moment, shear or
 * reaction, from the beam factored once (analysis/pattern-loading.ts, linear in the spans), and the
 * secondary effects of prestress at γP (EN 1992-1-1 2.4.2.2(1), 5.10.8(1)).
 */
import type { MemberInput } from '../input/schema'
import { ulsCaseNames, ulsExpressions } from '../loads/uls-combinations'
import { quantityOf } from '../analysis/pattern-loading'
import type { ResponseQuantity } from '../analysis/pattern-loading'
import type { PrestressAnalysis } from './analysis'
import type { MemberLoads } from './loads'
import type { MemberSection } from './section'

export interface UlsActions {
  cases: Array<{ id: string; label: string; clause: string }>
  /** least and greatest design value of a response quantity over the cases, secondary effects not included */
  envelope: (q: ResponseQuantity) => { min: number; max: number }
  /** secondary moments at the two ends of each span, transfer and service (linear along each span, 5.10.7; with columns they step at a support) */
  secondaryEnds: Record<'transfer' | 'service', Array<{ start: number; end: number }>>
  /** the secondary moment of a stage at x in a span */
  secondaryAt: (stage: 'transfer' | 'service', span: number, x: number) => number
  /** depths of the bottom and top bar layers from the top and bottom faces, mm */
  dBottomBars: number
  dTopBars: number
}

export function ulsActions(input: MemberInput, section: MemberSection, loads: MemberLoads, analysis: PrestressAnalysis): UlsActions {
  const spans = input.geometry.spans
  const n = spans.length
  const u = input.uls
  const factors = { gammaGsup: u.gammaG, gammaQ: u.gammaQ, psi0: input.loads.psi0, xi: u.xi, gammaP: u.gammaP }
  const cases = ulsCaseNames(n, u.combination, factors).filter((c) => input.loads.pattern !== 'all-spans' || c.id.endsWith('.all'))
  const expressions = ulsExpressions(u.combination, factors)
  const permanent = loads.permanent // every permanent load, one solve
  // each case: γG·G on every span and γQ·Q on the loaded ones; γQ ≥ 0, so the extremes over the
  // arrangements of the imposed loads give the extremes over the cases (superposition); eq. (6.10a)
  // takes each imposed load at its own ψ0
  const envelope = (q: ResponseQuantity): { min: number; max: number } => {
    const g = quantityOf(permanent, q)
    let min = Infinity
    let max = -Infinity
    for (const e of expressions) {
      const r = e.key === '6.10a' ? loads.imposedRange(q, 'psi0') : loads.imposedRange(q, 'characteristic')
      const gQ = e.key === '6.10a' ? u.gammaQ : e.gQ // EN 1990 eq. (6.10a): γQ·ψ0,i·Qk,i
      min = Math.min(min, e.gG * g + gQ * r.min)
      max = Math.max(max, e.gG * g + gQ * r.max)
    }
    return { min, max }
  }
  const ends = (stage: 'transfer' | 'service'): Array<{ start: number; end: number }> =>
    analysis.spanEndStations.map(([k0, k1]) => ({ start: analysis[stage].secondary[k0] as number, end: analysis[stage].secondary[k1] as number }))
  const secondaryEnds = { transfer: ends('transfer'), service: ends('service') }
  const secondaryAt = (stage: 'transfer' | 'service', span: number, x: number): number => {
    const e = secondaryEnds[stage][span] as { start: number; end: number }
    const L = spans[span] as number
    return e.start * (1 - x / L) + (e.end * x) / L
  }
  const h = section.properties.h
  return {
    cases, envelope,
    secondaryEnds,
    secondaryAt,
    dBottomBars: h - u.barsBottom.cover - u.barsBottom.diameter / 2,
    dTopBars: h - u.barsTop.cover - u.barsTop.diameter / 2,
  }
}
