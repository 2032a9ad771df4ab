/**
 * Proposal stage: the least prestress, a profile and any passive bars that pass every check of the
 * sheet — stresses at transfer and in service, the strands for the balanced load, ULS bending and
 * shear, least and greatest steel, ductility, deflection and crack control — as an input patch the
 * engineer can apply (mergeInputPatch) and run again. The stress search (proposal-search.ts) gives
 * the least force for the stresses; from there the strands are stepped up while checks other than
 * the stresses fail, adding bars where ULS bending or the least steel needs them, and of the
 * arrangements that pass the cheapest by steel cost is proposed.
 */
import type { CheckResult } from '../contract'
import type { StageOutcome } from '../common/stage'
import { parseMemberInput } from '../input/schema'
import type { MemberInput } from '../input/schema'
import { mergeInputPatch } from '../input/patch'
import type { InputPatch } from '../input/patch'
import type { MagnelResult } from '../checks/magnel'
import { stressSearch } from './proposal-search'
import type { StressFound } from './proposal-search'
import { stressesPass } from './service-design'
import type { ServiceDesign } from './service-design'
import type { MemberUls } from './uls'

export interface Proposal {
  feasible: boolean
  reason: string | null
  /** strands in the member width modelled */
  strands: number | null
  /** mean force along the tendon at transfer, N */
  forceTransfer: number | null
  /** slab strip: tendon spacing; beams: tendon count */
  spacing: number | null
  count: number | null
  supportEcc: number[] | null
  spanEcc: number[] | null
  /** merge into the input (mergeInputPatch) and run again: every check in claims passes */
  inputPatch: InputPatch | null
  verified: boolean
  /** passive bars the patch adds to the input's, mm² in the width designed; null where none are added */
  barsBottom: number | null
  barsTop: number | null
  /** ids of the checks the patched design passes: every check of the sheet but the site records and those outside the proposal's reach */
  claims: string[]
  /** the claimed checks nearest their limits in the patched design (utilisation ≥ 0.95), most used first: what bounds the proposal, in words (title and place) */
  boundBy: string[]
  /** the same checks by id */
  boundByChecks: string[]
  /** failing checks the proposal cannot change (the engineer's covers and jacking stress), or null */
  note: string | null
}

export function noProposal(reason: string): Proposal {
  return {
    feasible: false, reason, strands: null, forceTransfer: null, spacing: null, count: null, supportEcc: null, spanEcc: null, inputPatch: null, verified: false,
    barsBottom: null, barsTop: null, claims: [], boundBy: [], boundByChecks: [], note: null,
  }
}

/** A check as the report names it: its title and, where it has one, its place. */
function checkWords(c: CheckResult): string {
  return c.location ? `${c.title} (${c.location})` : c.title
}

/** Checks in words, each once. */
function listWords(checks: readonly CheckResult[]): string {
  return [...new Set(checks.map(checkWords))].join('; ')
}

/** The checks of the whole sheet for an input, and its ULS result (for the bars it asks for). */
export type VerifyMember = (input: MemberInput) => { checks: CheckResult[]; uls: MemberUls }

/** Checks the proposal does not change: the covers and the jacking stress (and so the stress after lock-off) are the engineer's, the site records are measured. */
const OUTSIDE_REACH = new Set(['tendon.jacking', 'tendon.lockOff', 'tendon.coverBond'])
const claimed = (c: CheckResult): boolean => c.group !== 'site' && !OUTSIDE_REACH.has(c.id)

/**
 * Relative cost of steel in place per unit weight: prestressing strand with its ducts, anchorages and
 * stressing taken at three times reinforcing bar (common practice, from memory; an order of magnitude
 * only). Bars are costed over the whole length, which favours strands where bars are needed locally.
 */
const STRAND_COST_FACTOR = 3
/** Arrangements tried above the least for the stresses before the search stops. */
const STEPS_UP = 8

/** Areas are proposed in whole tens of mm². */
const roundUp10 = (v: number): number => Math.ceil(v / 10 - 1e-9) * 10

interface Arrangement { found: StressFound; patch: InputPatch; barsBottom: number; barsTop: number; checks: CheckResult[] }

/**
 * The bars an arrangement needs: the extra bars ULS bending asks for (6.1) and any shortfall on the
 * least steel (eq. (9.1N)), the crack-control steel (eq. (7.1)) or the top steel over the supports, added to the input's own bars, run
 * again until nothing more is asked for (at most three rounds: the bars move the neutral axis).
 */
function withBars(input: MemberInput, found: StressFound, patchOf: (f: StressFound) => InputPatch, verify: VerifyMember): Arrangement | { failing: CheckResult[] } {
  const base = patchOf(found)
  let addBottom = 0
  let addTop = 0
  let last: CheckResult[] = []
  for (let round = 0; round < 3; round++) {
    const patch: InputPatch = {
      ...base,
      uls: {
        barsBottom: { ...input.uls.barsBottom, area: input.uls.barsBottom.area + addBottom },
        barsTop: { ...input.uls.barsTop, area: input.uls.barsTop.area + addTop },
      },
    }
    let run: { checks: CheckResult[]; uls: MemberUls }
    try {
      run = verify(parseMemberInput(mergeInputPatch(input, patch)))
    } catch {
      return { failing: last }
    }
    last = run.checks.filter((c) => claimed(c) && !c.pass)
    if (last.length === 0) return { found, patch, barsBottom: addBottom, barsTop: addTop, checks: run.checks }
    const r = run.uls.reinforcement
    const needBottom = run.uls.proposal.AsBottom
    const needTop = run.uls.proposal.AsTop
    if (needBottom === null || needTop === null) return { failing: last } // no bars up to 4 % of the section suffice
    const minBottom = r.AsMinBottom - (r.providedBottom + r.bondedTendon)
    const minTop = r.AsMinTop - (r.providedTop + r.bondedTendon)
    const supportTop = r.supportSteel && input.geometry.spans.length > 1 ? r.supportSteel.As - r.providedTop : 0
    const moreBottom = Math.max(0, needBottom, minBottom, crackSteelShortfall(run.checks, 'bottom'))
    const moreTop = Math.max(0, needTop, minTop, supportTop, crackSteelShortfall(run.checks, 'top'))
    if (moreBottom <= 0 && moreTop <= 0) return { failing: last } // bars would not help what fails
    addBottom += roundUp10(moreBottom)
    addTop += roundUp10(moreTop)
  }
  return { failing: last }
}

/** Bars short of the least crack-control steel of eq. (7.1) on a face, mm² (0 where the check passes). */
function crackSteelShortfall(checks: CheckResult[], face: 'bottom' | 'top'): number {
  const c = checks.find((k) => k.id === `sls.crackSteel.${face}`)
  return c && !c.pass ? c.limit - c.actual : 0
}

/** The least-cost arrangement passing every claimed check, or why none does. */
export function proposeDesign(first: ServiceDesign, magnel: MagnelResult[], verify: VerifyMember): Proposal {
  const search = stressSearch(first, magnel)
  if (search.least === null) return noProposal(search.reason ?? 'no arrangement passes the stress checks')
  const patchOf = (f: StressFound): InputPatch => search.patchOf(f.candidate, f.supportEcc, f.spanEcc)
  const strandArea = first.section.strand.Ap
  const cost = (a: Arrangement): number => STRAND_COST_FACTOR * a.found.candidate.strands * strandArea + a.barsBottom + a.barsTop
  let best: Arrangement | null = null
  let failing: CheckResult[] = []
  let about = search.least.run
  const cands = search.candidates
  for (let i = search.least.index, tried = 0; i < cands.length && tried <= STEPS_UP; tried++) {
    const found = i === search.least.index ? search.least : search.at(i, about)
    let next = i + 1
    if (found !== null) {
      about = found.run
      const r = withBars(first.input, found, patchOf, verify)
      if ('failing' in r) {
        failing = r.failing
        // the balanced load asks for a known number of strands (Lin: P = wL²/8a at the mean service force per strand): go there at once
        const balance = r.failing.find((c) => c.id === 'balancing.strands')
        if (balance) next = Math.max(next, cands.findIndex((k) => k.strands >= balance.limit * (1 + 1e-9)))
      } else {
        if (best === null || cost(r) < cost(best)) best = r
        // more strands cost more once no bars are added
        if (r.barsBottom === 0 && r.barsTop === 0) break
      }
    }
    if (next <= i) break
    i = next
  }
  if (best === null) {
    return noProposal(`The least prestress for the stresses and up to ${STEPS_UP} arrangements more, with bars added where they help, still fail ${listWords(failing) || 'a check'} at the last one tried: `
      + 'these need a change the proposal does not make (depth, concrete class, links, spans or the engineer\'s limits).')
  }
  const { found, patch, checks } = best
  const outside = checks.filter((c) => !claimed(c) && c.group !== 'site' && !c.pass)
  const bounding = checks.filter((c) => claimed(c) && c.utilisation >= 0.95).sort((x, y) => y.utilisation - x.utilisation)
  return {
    feasible: true, reason: null, strands: found.candidate.strands, forceTransfer: found.run.losses.transfer.Pmean,
    spacing: found.candidate.spacing, count: found.candidate.count, supportEcc: found.supportEcc, spanEcc: found.spanEcc,
    inputPatch: patch, verified: true,
    barsBottom: best.barsBottom > 0 ? best.barsBottom : null,
    barsTop: best.barsTop > 0 ? best.barsTop : null,
    claims: checks.filter(claimed).map((c) => c.id),
    boundBy: bounding.map(checkWords),
    boundByChecks: bounding.map((c) => c.id),
    note: outside.length > 0 ? `Not changed by the proposal and failing: ${listWords(outside)} (the covers and the jacking stress are the engineer's).` : null,
  }
}

/** The proposal, or none when the caller asked for none; a warning where it needs fewer strands. */
export function proposalStage(first: ServiceDesign, magnel: MagnelResult[], options: { compute: boolean; verify: VerifyMember }): StageOutcome<Proposal> {
  const proposal = options.compute ? proposeDesign(first, magnel, options.verify) : noProposal('not computed')
  const warnings: string[] = []
  if (proposal.feasible && proposal.strands !== null && proposal.strands < first.section.strands - 1e-9 && stressesPass(first)) {
    warnings.push('The proposal passes every check it claims with fewer strands than provided.')
  }
  return { result: proposal, checks: [], warnings }
}
