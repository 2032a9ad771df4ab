/**
 * Design actions at the ultimate limit state shared by the bending, shear and punching checks: the
 * EN 1990 fundamental combinations with pattern loading, each solved once on the factored beam, and the secondary effects of prestress at γP (EN 1992-1-1 2.4.2.2(1), 5.10.8(1)).
 */
import type { MemberInput } from '../input/schema'
import { ulsLoadCases } from '../loads/uls-combinations'
import type { UlsCase } from '../loads/uls-combinations'
import type { ContinuousBeamResult } from '../analysis/continuous-beam'
import type { PrestressAnalysis } from './analysis'
import type { MemberLoads } from './loads'
import type { MemberSection } from './section'

export interface UlsActions {
  cases: UlsCase[]
  /** a value f of the member's response to a case (one O(n) solve per case, made once) */
  caseValue: (c: UlsCase, f: (response: ContinuousBeamResult) => number) => number
  /** secondary moments at the supports, transfer and service (they vary linearly along each span, 5.10.7) */
  secondaryTransfer: number[]
  secondaryService: number[]
  /** the secondary moment of a support line m at x in a span */
  secondaryAt: (m: number[], span: number, x: number) => number
  /** depths of the bottom and top bar layers from the top and bottom faces, mm */
  dBottomBars: number
  dTopBars: number
}

export function ulsActions(input: MemberInput, section: MemberSection, loads: MemberLoads, analysis: PrestressAnalysis): UlsActions {
  const spans = input.geometry.spans
  const n = spans.length
  const u = input.uls
  const cases = ulsLoadCases(n, u.combination, { gammaGsup: u.gammaG, gammaQ: u.gammaQ, psi0: input.loads.psi0, xi: u.xi, gammaP: u.gammaP })
    .filter((c) => input.loads.pattern !== 'all-spans' || c.id.endsWith('.all'))
  const G = loads.selfWeight + loads.superimposed
  const Q = loads.imposed
  // each case: γG·G on every span and γQ·Q on the loaded ones, solved once by superposition of the unit-span cases
  const responses = new Map(cases.map((c) => [c, loads.responses.combine(spans.map((_, i) => (c.g[i] as number) * G + (c.q[i] as number) * Q))]))
  const caseValue = (c: UlsCase, f: (response: ContinuousBeamResult) => number): number => f(responses.get(c) as ContinuousBeamResult)
  const secondaryAt = (m: number[], span: number, x: number): number =>
    (m[span] as number) * (1 - x / (spans[span] as number)) + ((m[span + 1] as number) * x) / (spans[span] as number)
  const h = section.properties.h
  return {
    cases, caseValue,
    secondaryTransfer: analysis.atSupports.transfer.secondary,
    secondaryService: analysis.atSupports.service.secondary,
    secondaryAt,
    dBottomBars: h - u.barsBottom.cover - u.barsBottom.diameter / 2,
    dTopBars: h - u.barsTop.cover - u.barsTop.diameter / 2,
  }
}
