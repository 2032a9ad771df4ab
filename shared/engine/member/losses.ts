/**
 * Losses stage: friction and anchorage draw-in along the tendon, elastic shortening, and the
 * time-dependent losses (creep, shrinkage, relaxation), giving the force at every station at
 * transfer and in service; then the strands the balanced load needs at the mean service force.
 */
import { EngineInputError } from '../contract'
import { fail } from '../common/guards'
import { at, meanAlong } from '../common/numeric'
import { ratioCheck } from '../common/check'
import type { StageOutcome } from '../common/stage'
import type { MemberInput } from '../input/schema'
import { creepCoefficient, shrinkageStrain } from '../materials/creep-shrinkage'
import { RHO1000, relaxationLoss } from '../materials/strand'
import { balancedLoad } from '../prestress/equivalent-loads'
import { segmentWords, segmentedForce, tendonSegments } from '../prestress/segments'
import type { SegmentForce } from '../prestress/segments'
import { elasticShorteningLoss, timeDependentParts } from '../prestress/losses'
import { tendonPath } from '../prestress/path'
import type { BalancingNeed } from './balancing'
import type { MemberLoads } from './loads'
import type { MemberProfile } from './profile'
import type { MemberSection } from './section'
import type { Station } from './stations'

export interface LossItem { force: number | null; percent: number | null }

/** Force along the tendon at one stage: N at each station, and its mean along the tendon. */
export interface StageForce { P: number[]; Pmean: number }

export interface ForceSummary {
  jacking: number
  meanAfterFriction: number
  meanAfterDrawIn: number
  meanTransfer: number
  meanService: number
  maxAfterLockOff: number
  /** the longest over the segments */
  drawInLength: number
  eta: number
  /** friction and draw-in segment by segment */
  segments: SegmentLosses[]
}

/** Friction and draw-in of one segment of the tendon (the whole tendon where it has no joints). */
export interface SegmentLosses {
  number: number
  /** support numbers at its ends, from 1 */
  from: number
  to: number
  ends: 'left' | 'right' | 'both'
  /** its supports and joints in words */
  words: string
  /** along the tendon, mm; total angular deviation, rad */
  length: number
  theta: number
  /** mean force along the segment after friction and after draw-in, N */
  meanAfterFriction: number
  meanAfterDrawIn: number
  /** length the draw-in reaches from each stressed end, mm (null where that end is not stressed) */
  drawInLength: { left: number | null; right: number | null }
}

export interface LossSummary {
  basis: 'mean along the tendon'
  model: 'detailed' | 'percentage'
  phi: number | null
  epsCs: number | null
  friction: LossItem
  drawIn: LossItem
  elasticShortening: LossItem
  creep: LossItem
  shrinkage: LossItem
  relaxation: LossItem
  longTerm: LossItem
  total: LossItem
}

export interface BalancingProvided {
  strandsNeeded: number
  strandsProvided: number
  tendonsNeeded: number
  spacingNeeded: number | null
  /** load balanced in each span by the mean service force, N/mm */
  balancedProvided: number[]
  ratio: number[]
}

export interface MemberLosses {
  /** after friction, and after friction and draw-in (lock-off), N at each station */
  afterFriction: number[]
  afterDrawIn: number[]
  drawInLength: number
  elasticShortening: number[]
  transfer: StageForce
  service: StageForce
  parts: { creep: number[]; shrinkage: number[]; relaxation: number[]; longTerm: number[] }
  phi: number | null
  epsCs: number | null
  force: ForceSummary
  summary: LossSummary
  balancing: BalancingProvided
}

interface LossesInput {
  input: MemberInput
  section: MemberSection
  loads: MemberLoads
  profile: MemberProfile
  balancing: BalancingNeed
  stations: Station[]
}

/** A draw-in too large for the tendon is reported against the member's own field. */
function asDrawIn<T>(f: () => T): T {
  try {
    return f()
  } catch (e) {
    if (e instanceof EngineInputError && e.field === 'slip') throw new EngineInputError('losses.drawIn', e.message.replace(/^slip: /, ''))
    throw e
  }
}

export function lossesStage({ input, section, loads, profile, balancing, stations }: LossesInput): StageOutcome<MemberLosses> {
  const warnings: string[] = []
  const { strand, Ap, Pjack, strands } = section
  const sec = section.properties
  const e = profile.e
  const m2Unit = profile.secondaryPerUnitForce
  const cases = loads.cases

  // friction from the stressed end(s) of each segment (EN 1992-1-1 eq. (5.45)) with θ the true change of direction
  // and x along the tendon, and the draw-in of every stressed anchor (5.10.5.3): the same routines, on the same
  // path, as the stressing schedule; a tendon without joints is one segment
  const X = stations.map((s) => s.X)
  const path = tendonPath(profile.pieces, input.geometry.spans, stations)
  const segmentList = tendonSegments(input.geometry.spans.length, input.tendon.stressing, input.tendon.joints)
  const forces = asDrawIn(() => segmentedForce({
    s: path.s, slopes: path.slopes, spanOf: stations.map((st) => st.span), segments: segmentList,
    Pjack, mu: input.losses.mu, k: input.losses.wobble, slip: input.losses.drawIn, EpAp: strand.Ep * Ap,
    sequence: 'simultaneous', // both jacks together, as the stressing schedule's default
  }))
  const Pfr = forces.afterFriction
  const Pdi = forces.afterLockOff
  // the length the draw-in reaches from the anchorage it is reported for, the longest over the segments
  const setLengthOf = (f: SegmentForce): number => (f.segment.ends === 'right' ? f.lockOff.setLength.right : f.lockOff.setLength.left) ?? 0
  const drawInLength = Math.max(...forces.segments.map(setLengthOf))
  forces.segments.forEach((f) => {
    if (f.lockOff.wholeLength.left !== true && f.lockOff.wholeLength.right !== true) return
    warnings.push(forces.segments.length === 1
      ? 'The anchorage draw-in reaches the far end of the tendon: check the draw-in and the stressing sequence.'
      : `The anchorage draw-in reaches the far end of segment ${f.segment.number} (${segmentWords(f.segment)}): check the draw-in and the stressing sequence.`)
  })
  const segments: SegmentLosses[] = forces.segments.map((f) => {
    const Xs = X.slice(f.first, f.last + 1)
    return {
      number: f.segment.number, from: f.segment.fromSupport, to: f.segment.toSupport, ends: f.segment.ends, words: segmentWords(f.segment),
      length: f.length, theta: f.theta,
      meanAfterFriction: meanAlong(Xs, f.afterFriction), meanAfterDrawIn: meanAlong(Xs, f.lockOff.force),
      drawInLength: { left: f.lockOff.setLength.left ?? null, right: f.lockOff.setLength.right ?? null },
    }
  })

  // elastic shortening (EN 1992-1-1 eq. (5.44)): concrete stress at the tendon under P and self-weight
  const bonded = section.bonded
  const meanDi = meanAlong(X, Pdi)
  const nInTurn = section.isSlab ? Infinity : input.tendon.count
  const sigmaAtTendon = (P: number, k: number, M: number): number => P / sec.A - (M * at(e, k)) / sec.I // Navier: σ at the tendon, compression +
  const esRaw = stations.map((_, k) => {
    const Mtot = at(cases.selfWeight, k) - at(Pdi, k) * at(e, k) + meanDi * at(m2Unit, k)
    return elasticShorteningLoss({ Ap, Ep: strand.Ep, EcmT: section.atTransfer.Ecm, sigmaC: sigmaAtTendon(at(Pdi, k), k, Mtot), n: nInTurn })
  })
  const esMean = meanAlong(X, esRaw)
  const dPel = bonded ? esRaw : esRaw.map(() => esMean) // unbonded: the tendon shortens with the mean strain
  const P0 = Pdi.map((v, k) => v - at(dPel, k))
  const mean0 = meanAlong(X, P0)

  // time-dependent losses
  const zeros = stations.map(() => 0)
  let phi: number | null = null
  let epsCs: number | null = null
  let parts = { creep: zeros, shrinkage: zeros, relaxation: zeros, longTerm: zeros }
  if (input.losses.model === 'detailed') {
    const fck = section.fck
    const RH = input.materials.RH * 100
    const t0 = input.materials.ageAtStressing
    const tEnd = input.losses.serviceLife
    phi = creepCoefficient({ fck, RH, h0: sec.h0, t0, t: tEnd, cement: input.materials.cement }) // EN 1992-1-1 Annex B eq. (B.1)
    const shr = (t: number): number => shrinkageStrain({ fck, RH, h0: sec.h0, ts: input.losses.curingEnd, t, cement: input.materials.cement }).total
    epsCs = shr(tEnd) - shr(t0) // only the shrinkage after stressing shortens the tendon
    const cls = Number(input.losses.relaxationClass) as 1 | 2 | 3
    const qpAll = cases.imposedAllQuasiPermanent // quasi-permanent imposed loads on all spans, each at ψ2
    const sigmaQP = stations.map((_, k) => {
      const Mext = at(cases.selfWeight, k) + at(cases.superimposed, k) + at(cases.addedPermanent, k) + at(qpAll, k) // EN 1990 eq. (6.16b)
      const Mtot = Mext - at(P0, k) * at(e, k) + mean0 * at(m2Unit, k)
      return sigmaAtTendon(at(P0, k), k, Mtot)
    })
    const partsAt = (sigmaPi: number, sigmaC: number, zcp: number): { creep: number; shrinkage: number; relaxation: number; total: number } => {
      const muR = sigmaPi / strand.fpk
      const dSigmaPr = relaxationLoss(cls, RHO1000[cls], muR, 500000) * sigmaPi // EN 1992-1-1 3.3.2(8): final value at 500 000 h
      // EN 1992-1-1 eq. (5.46)
      return timeDependentParts({ epsCs: epsCs as number, Ep: strand.Ep, Ecm: section.at28.Ecm, phi: phi as number, sigmaCQP: sigmaC, dSigmaPr, Ap, Ac: sec.A, Ic: sec.I, zcp })
    }
    const each = bonded
      ? stations.map((_, k) => partsAt(at(P0, k) / Ap, at(sigmaQP, k), Math.abs(at(e, k))))
      : (() => {
        // EN 1992-1-1 5.10.6(3): unbonded tendons take the mean strain along the tendon
        const one = partsAt(mean0 / Ap, meanAlong(X, sigmaQP), meanAlong(X, e.map(Math.abs)))
        return stations.map(() => one)
      })()
    parts = {
      creep: each.map((t) => t.creep * Ap),
      shrinkage: each.map((t) => t.shrinkage * Ap),
      relaxation: each.map((t) => t.relaxation * Ap),
      longTerm: each.map((t) => t.total * Ap),
    }
  } else {
    parts = { creep: zeros, shrinkage: zeros, relaxation: zeros, longTerm: P0.map((v) => v * input.losses.longTermShare) }
  }
  const Pinf = P0.map((v, k) => v - at(parts.longTerm, k))
  if (Pinf.some((v) => !(v > 0))) fail('losses.model', 'the losses exceed the force in the tendon')
  const meanInf = meanAlong(X, Pinf)

  const meanFr = meanAlong(X, Pfr)
  const lossOf = (force: number | null): LossItem => ({ force, percent: force === null ? null : force / Pjack })
  const detailed = input.losses.model === 'detailed'
  const summary: LossSummary = {
    basis: 'mean along the tendon',
    model: input.losses.model,
    phi,
    epsCs,
    friction: lossOf(Pjack - meanFr),
    drawIn: lossOf(meanFr - meanDi),
    elasticShortening: lossOf(meanAlong(X, dPel)),
    creep: lossOf(detailed ? meanAlong(X, parts.creep) : null),
    shrinkage: lossOf(detailed ? meanAlong(X, parts.shrinkage) : null),
    relaxation: lossOf(detailed ? meanAlong(X, parts.relaxation) : null),
    longTerm: lossOf(meanAlong(X, parts.longTerm)),
    total: lossOf(Pjack - meanInf),
  }
  const force: ForceSummary = {
    jacking: Pjack, meanAfterFriction: meanFr, meanAfterDrawIn: meanDi, meanTransfer: mean0, meanService: meanInf,
    maxAfterLockOff: Math.max(...Pdi), drawInLength, eta: meanInf / mean0, segments,
  }

  // balancing (Lin): strands needed for the chosen load at the mean service force per strand
  const strandsNeeded = balancing.governing / (meanInf / strands)
  const provided = balancedLoad(profile.profile, meanInf)
  const checks = [ratioCheck({
    id: 'balancing.strands', group: 'balancing', title: 'Strands provided for the balanced load', clause: 'Lin, load balancing: P = wL²/8a',
    actual: strands, limit: strandsNeeded, unit: '', atLeast: true,
  })]
  if (strandsNeeded > strands * (1 + 1e-9)) {
    warnings.push(`The tendons provided balance ${(100 * strands / strandsNeeded).toFixed(0)} % of the chosen load in the governing span.`)
  }
  if ((Pjack - meanFr) / Pjack > 0.2) warnings.push('Friction takes more than 20 % of the jacking force on average: consider stressing from both ends or shorter tendons.')
  const balancingProvided: BalancingProvided = {
    strandsNeeded, strandsProvided: strands, tendonsNeeded: strandsNeeded / input.tendon.strandsPerTendon,
    spacingNeeded: section.isSlab ? (1000 * input.tendon.strandsPerTendon) / strandsNeeded : null,
    balancedProvided: provided, ratio: provided.map((w) => (balancing.load > 0 ? w / balancing.load : 0)),
  }
  return {
    result: {
      afterFriction: Pfr, afterDrawIn: Pdi, drawInLength, elasticShortening: dPel,
      transfer: { P: P0, Pmean: mean0 }, service: { P: Pinf, Pmean: meanInf }, parts, phi, epsCs,
      force, summary, balancing: balancingProvided,
    },
    checks,
    warnings,
  }
}
