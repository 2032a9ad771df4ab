/**
 * Ultimate-limit-state load cases for a continuous member: the fundamental combination of EN 1990
 * eq. (6.10), or the less favourable of eqs. (6.10a) and (6.10b), with the recommended factors of
 * EN 1990 Table A1.2(B), arranged by the pattern loading of EN 1992-1-1 5.1.3(1) note (alternate
 * spans, any two adjacent spans, all spans) with the same γG on every span. The prestress enters at
 * γP = 1.0 through its secondary effects (EN 1992-1-1 2.4.2.2(1), 5.10.8(1)); its primary effect is
 * in the resistance of the section.
 */
import { requireRange } from '../common/guards'
import { EngineInputError } from '../contract'

export type UlsRule = '6.10' | '6.10a/b'

export interface UlsFactors {
  /** 1.35 recommended (EN 1990 Table A1.2(B)) */
  gammaGsup: number
  /** 1.5 recommended (Table A1.2(B)) */
  gammaQ: number
  /** ψ0 of the imposed load, 0.7 for categories A–D (EN 1990 Table A1.1) */
  psi0: number
  /** reduction factor ξ of eq. (6.10b), 0.85 recommended */
  xi: number
  /** 1.0 for the secondary effects of prestress (EN 1992-1-1 2.4.2.2(1)) */
  gammaP: number
}

export const ULS_FACTORS: UlsFactors = { gammaGsup: 1.35, gammaQ: 1.5, psi0: 0.7, xi: 0.85, gammaP: 1.0 }

export interface UlsCase {
  id: string
  label: string
  clause: string
  /** factor on the permanent load of each span */
  g: number[]
  /** factor on the imposed load of each span */
  q: number[]
}

function patterns(n: number): Array<{ id: string; label: string; loaded: boolean[] }> {
  const out: Array<{ id: string; label: string; loaded: boolean[] }> = [{ id: 'all', label: 'all spans loaded', loaded: Array.from({ length: n }, () => true) }]
  if (n > 1) {
    out.push({ id: 'odd', label: 'spans 1, 3, … loaded', loaded: Array.from({ length: n }, (_, i) => i % 2 === 0) })
    out.push({ id: 'even', label: 'spans 2, 4, … loaded', loaded: Array.from({ length: n }, (_, i) => i % 2 === 1) })
  }
  for (let i = 0; i + 1 < n && n > 2; i++) {
    out.push({ id: `adj${i + 1}-${i + 2}`, label: `spans ${i + 1} and ${i + 2} loaded`, loaded: Array.from({ length: n }, (_, k) => k === i || k === i + 1) })
  }
  return out
}

export function validateUlsFactors(f: UlsFactors): void {
  requireRange('uls.gammaGsup', f.gammaGsup, 1, 2, 'γG,sup must lie between 1.0 and 2.0')
  requireRange('uls.gammaQ', f.gammaQ, 1, 2, 'γQ must lie between 1.0 and 2.0')
  requireRange('uls.psi0', f.psi0, 0, 1, 'ψ0 must lie between 0 and 1')
  requireRange('uls.xi', f.xi, 0.5, 1, 'ξ must lie between 0.5 and 1.0')
  requireRange('uls.gammaP', f.gammaP, 0.8, 1.2, 'γP must lie between 0.8 and 1.2')
}

/** One expression of the fundamental combination: γG on the permanent load of every span, γQ on the loaded spans' imposed load. */
export interface UlsExpression { key: string; gG: number; gQ: number; clause: string }

/** The expressions of the chosen rule: eq. (6.10), or eqs. (6.10a) and (6.10b). */
export function ulsExpressions(rule: UlsRule, f: UlsFactors = ULS_FACTORS): UlsExpression[] {
  if (rule !== '6.10' && rule !== '6.10a/b') throw new EngineInputError('uls.combination', "the rule is '6.10' or '6.10a/b'")
  validateUlsFactors(f)
  return rule === '6.10'
    ? [{ key: '6.10', gG: f.gammaGsup, gQ: f.gammaQ, clause: 'EN 1990 eq. (6.10)' }] // γG Gk + γQ Qk
    : [
        { key: '6.10a', gG: f.gammaGsup, gQ: f.gammaQ * f.psi0, clause: 'EN 1990 eq. (6.10a)' }, // γG Gk + γQ ψ0 Qk
        { key: '6.10b', gG: f.xi * f.gammaGsup, gQ: f.gammaQ, clause: 'EN 1990 eq. (6.10b)' }, // ξ γG Gk + γQ Qk
      ]
}

/** The case list without its span factors: what each case is called and which clause it follows. */
export function ulsCaseNames(nSpans: number, rule: UlsRule, f: UlsFactors = ULS_FACTORS): Array<{ id: string; label: string; clause: string }> {
  if (!Number.isInteger(nSpans) || nSpans < 1) throw new EngineInputError('spans', 'at least one span is needed')
  const list = patterns(nSpans)
  return ulsExpressions(rule, f).flatMap((e) => list.map((p) => ({ id: `${e.key}.${p.id}`, label: `${e.key}, ${p.label}`, clause: `${e.clause}; EN 1992-1-1 5.1.3(1)` })))
}

/** Every ULS load case of the chosen rule with its pattern of imposed load. */
export function ulsLoadCases(nSpans: number, rule: UlsRule, f: UlsFactors = ULS_FACTORS): UlsCase[] {
  if (!Number.isInteger(nSpans) || nSpans < 1) throw new EngineInputError('spans', 'at least one span is needed')
  const cases: UlsCase[] = []
  for (const e of ulsExpressions(rule, f)) {
    for (const p of patterns(nSpans)) {
      cases.push({
        id: `${e.key}.${p.id}`,
        label: `${e.key}, ${p.label}`,
        clause: `${e.clause}; EN 1992-1-1 5.1.3(1)`,
        g: p.loaded.map(() => e.gG), // the same γG on every span (5.1.3(1) note)
        q: p.loaded.map((l) => (l ? e.gQ : 0)),
      })
    }
  }
  return cases
}
