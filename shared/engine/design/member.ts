/**
 * designMember: the whole design of a post-tensioned continuous member to EN 1992-1-1 in one call —
 * section, materials, eccentricity limits, tendon profile, load balancing, losses, prestress
 * moments, load cases with pattern loading, fibre stresses at the critical sections, checks, the
 * Magnel region per section and a proposal of the least force and profile that make every stress
 * check pass. Sign conventions: sagging +, gravity +, e below the centroid +, compression +.
 * The result is plain JSON data in engine units (N, mm, MPa, N·mm).
 */
import { EngineInputError } from '../contract'
import type { CheckResult } from '../contract'
import { ENGINE_VERSION } from '../version'
import { memberInputSchema } from '../schema'
import type { MemberInput } from '../schema'
import { sectionProperties } from '../section'
import type { SectionProperties } from '../section'
import { CONCRETE_CLASSES, concreteAtAge, concreteProperties } from '../materials/concrete'
import type { ConcreteAtAge, ConcreteProperties } from '../materials/concrete'
import { creepCoefficient, shrinkageStrain } from '../materials/creep-shrinkage'
import { RHO1000, STRANDS, jackingLimits, relaxationLoss } from '../materials/strand'
import type { JackingLimits, Strand, StrandType } from '../materials/strand'
import { analyseContinuousBeam } from '../analysis/continuous-beam'
import type { ContinuousBeamResult, SupportKind } from '../analysis/continuous-beam'
import { drapes, eccentricityIn, resolveProfile, slopeIn } from '../prestress/profile'
import type { ProfilePiece, TendonProfile } from '../prestress/profile'
import { balancedLoad, balancingForce } from '../prestress/equivalent-loads'
import { prestressMoments } from '../prestress/secondary'
import { drawInForces, elasticShorteningLoss, frictionForce, timeDependentParts } from '../prestress/losses'
import { compressionUtilisation, fibreStresses, tensionRules, tensionUtilisation } from '../checks/stresses'
import type { ExposureClass, ServiceCombination, TensionRule } from '../checks/stresses'
import { magnelRegion, requiredModuli } from '../checks/magnel'
import type { MagnelCondition, MagnelResult } from '../checks/magnel'
import { mergeInputPatch } from './patch'
import { withPartTwo } from '../uls/part2'
import type { DesignPartOne } from '../uls/design-part-one'
import type { MemberUls } from '../uls/member-uls'
import type { MemberCracking, MemberDeflection } from '../sls/member-sls'
import type { MemberSite } from '../site/member-site'
import type { InputPatch } from './patch'

export type Stage = 'transfer' | ServiceCombination
export const STAGES: readonly Stage[] = ['transfer', 'characteristic', 'frequent', 'quasiPermanent']
const SERVICE: readonly ServiceCombination[] = ['characteristic', 'frequent', 'quasiPermanent']

export interface FibrePair { top: number; bottom: number }
export interface StressEnvelope { topMin: number; topMax: number; bottomMin: number; bottomMax: number }
export interface MomentRange { min: number; max: number }
export interface StageLimits { compression: number | null; tension: number | null; tensionClause: string | null }
export interface LossItem { force: number | null; percent: number | null }

export interface CriticalSection {
  id: string
  label: string
  kind: 'support' | 'lowPoint' | 'tenth'
  span: number
  /** from the span's left support, mm */
  x: number
  /** along the member from its left end, mm */
  X: number
  e: number
  force: { transfer: number; service: number }
  moments: {
    selfWeight: number
    superimposed: number
    imposed: MomentRange
    transfer: number
    characteristic: MomentRange
    frequent: MomentRange
    quasiPermanent: MomentRange
    primaryTransfer: number
    secondaryTransfer: number
    totalTransfer: number
    primaryService: number
    secondaryService: number
    totalService: number
  }
  /** the governing stress per stage and fibre (the one nearest its limit) */
  stress: Record<Stage, FibrePair>
  envelope: Record<Stage, StressEnvelope>
  utilisation: number
  magnel: MagnelResult
}

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
  /** merge into the input (mergeInputPatch) and run again: every transfer and service check passes */
  inputPatch: InputPatch | null
  verified: boolean
}

export interface Design {
  engineVersion: string
  input: MemberInput
  section: SectionProperties & { tributaryWidth: number; spanDepth: number[] }
  concrete: { class: string; at28: ConcreteProperties; atTransfer: ConcreteAtAge & { age: number } }
  strand: Strand & { type: StrandType }
  jacking: JackingLimits & {
    sigmaJack: number
    PjackStrand: number
    strandsPerTendon: number
    tendonsPerWidth: number
    strands: number
    Ap: number
    Pjack: number
  }
  eccentricity: { top: number; bottom: number; dTop: number; dBottom: number; coverForBond: number }
  profile: {
    supportEcc: number[]
    spanEcc: number[]
    lowPointAt: number[]
    inflection: number
    drapes: number[]
    lowPointX: number[]
    length: number
  }
  loads: { selfWeight: number; superimposed: number; imposed: number; balanced: number }
  balancing: {
    load: number
    perSpan: number[]
    governing: number
    strandsNeeded: number
    strandsProvided: number
    tendonsNeeded: number
    spacingNeeded: number | null
    balancedProvided: number[]
    ratio: number[]
  }
  force: {
    jacking: number
    meanAfterFriction: number
    meanAfterDrawIn: number
    meanTransfer: number
    meanService: number
    maxAfterLockOff: number
    drawInLength: number
    eta: number
  }
  losses: {
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
  prestressMoments: Record<'transfer' | 'service', { primary: number[]; secondary: number[]; total: number[] }>
  loadCases: {
    patterns: Array<{ id: string; label: string; loadedSpans: number[] }>
    supportMoments: { selfWeight: number[]; superimposed: number[]; imposed: number[][] }
  }
  limits: Record<Stage, StageLimits> & { tendonService: number }
  sections: CriticalSection[]
  checks: CheckResult[]
  precompression: { transfer: number; service: number; min: number; max: number }
  proposal: Proposal
  series: {
    X: number[]
    span: number[]
    x: number[]
    e: number[]
    eLimitTop: number[]
    eLimitBottom: number[]
    depth: number[]
    centroid: number[]
    forceFriction: number[]
    forceDrawIn: number[]
    forceTransfer: number[]
    forceService: number[]
    primaryTransfer: number[]
    secondaryTransfer: number[]
    totalTransfer: number[]
    primaryService: number[]
    secondaryService: number[]
    totalService: number[]
    momentTransfer: number[]
    momentServiceMax: number[]
    momentServiceMin: number[]
    stressTransferTopMin: number[]
    stressTransferTopMax: number[]
    stressTransferBottomMin: number[]
    stressTransferBottomMax: number[]
    stressServiceTopMin: number[]
    stressServiceTopMax: number[]
    stressServiceBottomMin: number[]
    stressServiceBottomMax: number[]
    limitTransferCompression: number[]
    limitTransferTension: number[]
    limitServiceCompression: number[]
    limitServiceTension: number[]
  }
  warnings: string[]
  /** part 2: design moments and shears, resistances, detailing limits, punching (design.md §1 step 9) */
  uls: MemberUls
  /** part 2: short- and long-term deflection under the unbalanced quasi-permanent load (7.4) */
  deflection: MemberDeflection
  /** part 2: crack control by exposure, crack widths and decompression (7.3) */
  cracking: MemberCracking
  /** part 2: tendon height schedule and stressing schedule */
  site: MemberSite
}

export interface DesignOptions {
  /** compute the proposal (default true); the proposal's own verification runs without it */
  proposal?: boolean
}

/** Utilisations are capped so that the result stays finite JSON. */
const UTILISATION_CAP = 999
const at = (a: readonly number[], i: number): number => a[i] as number
const sum = (a: readonly number[]): number => a.reduce((s, v) => s + v, 0)

/** Validate raw input with the schema; the first issue becomes an EngineInputError naming its path. */
export function parseMemberInput(raw: unknown): MemberInput {
  const r = memberInputSchema.safeParse(raw)
  if (!r.success) {
    const issue = r.error.issues[0]
    const path = issue ? issue.path.map(String).join('.') : ''
    throw new EngineInputError(path || 'input', issue?.message ?? 'invalid input')
  }
  return r.data
}

interface Station { span: number; x: number; X: number }

/** Mean of f along the tendon by the trapezoidal rule. */
function meanAlong(X: number[], f: number[]): number {
  let area = 0
  for (let i = 1; i < X.length; i++) area += ((at(f, i - 1) + at(f, i)) / 2) * (at(X, i) - at(X, i - 1))
  const Lt = at(X, X.length - 1) - at(X, 0)
  return Lt > 0 ? area / Lt : at(f, 0)
}

function uniqueSorted(v: number[]): number[] {
  const s = [...v].sort((a, b) => a - b)
  const out: number[] = []
  for (const x of s) if (out.length === 0 || x - at(out, out.length - 1) > 1e-6) out.push(x)
  return out
}

/** Stations along the member: a fine grid, every tenth point, low point and parabola end. */
function buildStations(spans: number[], pieces: ProfilePiece[][], lowAt: number[]): Station[] {
  const out: Station[] = []
  let offset = 0
  spans.forEach((L, i) => {
    const xs: number[] = []
    for (let k = 0; k <= 20; k++) xs.push((L * k) / 20)
    xs.push(at(lowAt, i) * L)
    for (const p of pieces[i] as ProfilePiece[]) xs.push(p.x0, p.x1)
    for (const x of uniqueSorted(xs.map((v) => Math.min(L, Math.max(0, v))))) out.push({ span: i, x, X: offset + x })
    offset += L
  })
  return out
}

interface CaseMoments {
  selfWeight: number[]
  superimposed: number[]
  imposedByPattern: number[][]
}

interface StageForces { P: number[]; M2: number[]; Pmean: number }

interface Core {
  input: MemberInput
  n: number
  spans: number[]
  supports: SupportKind[]
  sec: SectionProperties
  trib: number
  c28: ConcreteProperties
  ct: ConcreteAtAge
  strand: Strand
  jack: JackingLimits
  tendonsPerWidth: number
  strands: number
  Ap: number
  sigmaJack: number
  Pjack: number
  eTop: number
  eBot: number
  dTop: number
  dBot: number
  profile: TendonProfile
  pieces: ProfilePiece[][]
  lowAt: number[]
  stations: Station[]
  e: number[]
  unitSpan: ContinuousBeamResult[]
  m2Unit: number[]
  g: { sw: number; swTransfer: number; sdl: number; q: number }
  patterns: Array<{ id: string; label: string; loadedSpans: number[] }>
  cases: CaseMoments
  Pfr: number[]
  Pdi: number[]
  drawInLength: number
  dPel: number[]
  transfer: StageForces
  service: StageForces
  lossParts: { creep: number[]; shrinkage: number[]; relaxation: number[]; longTerm: number[] }
  phi: number | null
  epsCs: number | null
  rsup: number
  rinf: number
  limits: Record<Stage, StageLimits> & { tendonService: number }
  rules: TensionRule[]
  warnings: string[]
}

function fail(field: string, message: string): never {
  throw new EngineInputError(field, message)
}

function runCore(input: MemberInput): Core {
  const warnings: string[] = []
  const spans = input.geometry.spans
  const n = spans.length
  const supports: SupportKind[] = input.geometry.supports ?? spans.map(() => 'pinned' as SupportKind).concat('pinned')

  const sec = sectionProperties(input.section)
  const isSlab = input.section.kind === 'slab-strip'
  const width = isSlab ? 1000 : input.section.kind === 'rectangle' ? (input.section.b as number) : (input.section.bf as number)
  const trib = isSlab ? 1000 : input.section.tributaryWidth ?? width
  if (trib < width && !isSlab) warnings.push('The loaded width is less than the section width: loads come only from the tributary width given.')

  const fck = CONCRETE_CLASSES[input.materials.concreteClass]
  const c28 = concreteProperties(fck)
  const ct = concreteAtAge(fck, input.materials.ageAtStressing, input.materials.cement)

  const strand = STRANDS[input.tendon.strand]
  const jack = jackingLimits(strand, input.annex)
  const tendonsPerWidth = isSlab ? 1000 / input.tendon.spacing : input.tendon.count // slab strip: 1000 mm / spacing
  const strands = tendonsPerWidth * input.tendon.strandsPerTendon
  const Ap = strands * strand.Ap
  const sigmaJack = input.tendon.jackingFactor * jack.sigmaPmax
  const Pjack = sigmaJack * Ap

  // eccentricity limits: practice e = h/2 − cover − duct/2, less the strands' offset in the duct, since at high
  // and low points the tendon is pulled towards the centre of curvature, against the far side of the duct
  const offset = input.tendon.centroidOffset ?? Math.max(0, (input.tendon.ductHeight - strand.diameter) / 2)
  const dTop = input.tendon.coverTop + input.tendon.ductHeight / 2 + offset
  const dBot = input.tendon.coverBottom + input.tendon.ductHeight / 2 + offset
  const eTop = sec.yt - dTop
  const eBot = sec.yb - dBot
  if (!(eTop > 0)) fail('tendon.coverTop', 'the top cover and duct reach below the centroid of the section')
  if (!(eBot > 0)) fail('tendon.coverBottom', 'the bottom cover and duct reach above the centroid of the section')

  const p = input.profile
  const supportEcc = p.mode === 'custom' && p.supportEcc
    ? [...p.supportEcc]
    : [p.anchorLeft, ...spans.slice(1).map(() => -eTop), p.anchorRight]
  const spanEcc = p.mode === 'custom' && p.spanEcc ? [...p.spanEcc] : spans.map(() => eBot)
  const eccField = (j: number, end: boolean): string =>
    p.mode === 'custom' ? `profile.supportEcc.${j}` : end ? (j === 0 ? 'profile.anchorLeft' : 'profile.anchorRight') : 'profile.mode'
  supportEcc.forEach((e, j) => {
    if (e < -eTop - 1e-9 || e > eBot + 1e-9) {
      fail(eccField(j, j === 0 || j === n), `e = ${e.toFixed(1)} mm leaves the concrete: it must lie between −${eTop.toFixed(1)} and +${eBot.toFixed(1)} mm`)
    }
  })
  spanEcc.forEach((e, i) => {
    if (e < -eTop - 1e-9 || e > eBot + 1e-9) {
      fail(`profile.spanEcc.${i}`, `e = ${e.toFixed(1)} mm leaves the concrete: it must lie between −${eTop.toFixed(1)} and +${eBot.toFixed(1)} mm`)
    }
  })
  const lowAt = spans.map((_, i) => p.lowPointAt?.[i] ?? 0.5)
  const profile: TendonProfile = { spans, supportEcc, spanEcc, lowPointAt: lowAt, inflection: p.inflection }
  const pieces = resolveProfile(profile)
  const stations = buildStations(spans, pieces, lowAt)
  const e = stations.map((s) => eccentricityIn(pieces[s.span] as ProfilePiece[], s.x))
  // parabolas stay between their end values, but a custom profile may still leave the section
  e.forEach((v, k) => {
    if (v < -eTop - 1e-6 || v > eBot + 1e-6) {
      const st = stations[k] as Station
      fail('profile.inflection', `the tendon leaves the concrete in span ${st.span + 1} at x = ${(st.x / 1000).toFixed(2)} m`)
    }
  })

  // line loads (N/mm): self-weight of the section and of any slab beyond the flange within the loaded width
  const extraSlab = !isSlab && input.section.hf !== undefined && trib > width && input.section.kind !== 'rectangle' ? input.section.hf * (trib - width) : 0
  const sw = input.materials.density * (sec.A + extraSlab) // EN 1991-1-1 5.2: self-weight from the nominal dimensions
  const sdl = input.loads.superimposed * trib
  const q = input.loads.imposed * trib

  const EI = c28.Ecm * sec.I
  const unitSpan = spans.map((_, i) => analyseContinuousBeam({ spans, EI, supports, loads: [{ kind: 'udl', span: i, w: 1 }] }))
  const unitAt = (s: Station): number[] => unitSpan.map((b) => b.momentAt(s.span, s.x))
  const unitMoments = stations.map(unitAt)

  const all = spans.map((_, i) => i)
  const patterns: Array<{ id: string; label: string; loadedSpans: number[] }> = [{ id: 'all', label: 'All spans', loadedSpans: all }]
  if (input.loads.pattern === 'alternate-and-adjacent' && n > 1) {
    patterns.push({ id: 'odd', label: 'Alternate spans 1, 3, …', loadedSpans: all.filter((i) => i % 2 === 0) })
    if (n > 2 || n === 2) patterns.push({ id: 'even', label: 'Alternate spans 2, 4, …', loadedSpans: all.filter((i) => i % 2 === 1) })
    for (let j = 1; j < n; j++) {
      if (n > 2) patterns.push({ id: `adjacent-${j}`, label: `Adjacent spans ${j} and ${j + 1}`, loadedSpans: [j - 1, j] })
    }
  }
  const cases: CaseMoments = {
    selfWeight: unitMoments.map((u) => sw * sum(u)),
    superimposed: unitMoments.map((u) => sdl * sum(u)),
    imposedByPattern: patterns.map((pt) => unitMoments.map((u) => q * sum(pt.loadedSpans.map((i) => at(u, i))))),
  }

  // friction along the tendon from either end (EN 1992-1-1 eq. (5.45)) with the angle summed along the profile
  const X = stations.map((s) => s.X)
  const slopes = stations.map((s) => slopeIn(pieces[s.span] as ProfilePiece[], s.x))
  const thetaL: number[] = [0]
  for (let k = 1; k < stations.length; k++) thetaL.push(at(thetaL, k - 1) + Math.abs(at(slopes, k) - at(slopes, k - 1)))
  const thetaTotal = at(thetaL, thetaL.length - 1)
  const Ltot = sum(spans)
  const mu = input.losses.mu
  const kw = input.losses.wobble
  const fromLeft = X.map((x, k) => frictionForce(Pjack, mu, at(thetaL, k), kw, x))
  const fromRight = X.map((x, k) => frictionForce(Pjack, mu, thetaTotal - at(thetaL, k), kw, Ltot - x))
  const EpAp = strand.Ep * Ap
  const slip = input.losses.drawIn
  const leftSet = drawInForces(X, fromLeft, slip, EpAp)
  const rightRev = drawInForces([...X].reverse().map((x) => Ltot - x), [...fromRight].reverse(), slip, EpAp)
  const rightSet = { ...rightRev, P: [...rightRev.P].reverse() }
  const mode = input.tendon.stressing
  const Pfr = mode === 'left' ? fromLeft : mode === 'right' ? fromRight : fromLeft.map((v, k) => Math.max(v, at(fromRight, k)))
  const Pdi = mode === 'left' ? leftSet.P : mode === 'right' ? rightSet.P : leftSet.P.map((v, k) => Math.max(v, at(rightSet.P, k)))
  const drawInLength = mode === 'right' ? rightSet.lset : leftSet.lset
  if ((mode !== 'right' && leftSet.wholeLength) || (mode !== 'left' && rightSet.wholeLength)) {
    warnings.push('The anchorage draw-in reaches the far end of the tendon: check the draw-in and the stressing sequence.')
  }

  // secondary moment per unit force (EN 1992-1-1 5.10.7), scaled by the mean force of each stage
  const unitPs = prestressMoments({ spans, EI, supports, profile, P: 1 })
  const m2Unit = stations.map((s) => unitPs.secondaryAt(s.span, s.x))

  const bonded = input.tendon.bond === 'bonded'
  const rsup = bonded ? input.annex.rsupBonded : input.annex.rsupUnbonded
  const rinf = bonded ? input.annex.rinfBonded : input.annex.rinfUnbonded

  // elastic shortening (EN 1992-1-1 eq. (5.44)): concrete stress at the tendon under P and self-weight
  const meanDi = meanAlong(X, Pdi)
  const nInTurn = isSlab ? Infinity : input.tendon.count
  const sigmaAtTendon = (P: number, k: number, M: number): number => P / sec.A - (M * at(e, k)) / sec.I // Navier: σ at the tendon, compression +
  const esRaw = stations.map((_, k) => {
    const Mtot = at(cases.selfWeight, k) - at(Pdi, k) * at(e, k) + meanDi * at(m2Unit, k)
    return elasticShorteningLoss({ Ap, Ep: strand.Ep, EcmT: ct.Ecm, sigmaC: sigmaAtTendon(at(Pdi, k), k, Mtot), n: nInTurn })
  })
  const esMean = meanAlong(X, esRaw)
  const dPel = bonded ? esRaw : esRaw.map(() => esMean) // unbonded: the tendon shortens with the mean strain
  const P0 = Pdi.map((v, k) => v - at(dPel, k))
  const mean0 = meanAlong(X, P0)

  // time-dependent losses
  const zeros = stations.map(() => 0)
  let phi: number | null = null
  let epsCs: number | null = null
  let lossParts = { creep: zeros, shrinkage: zeros, relaxation: zeros, longTerm: zeros }
  if (input.losses.model === 'detailed') {
    const RH = input.materials.RH * 100
    const t0 = input.materials.ageAtStressing
    const tEnd = input.losses.serviceLife
    phi = creepCoefficient({ fck, RH, h0: sec.h0, t0, t: tEnd, cement: input.materials.cement })
    const shr = (t: number): number => shrinkageStrain({ fck, RH, h0: sec.h0, ts: input.losses.curingEnd, t, cement: input.materials.cement }).total
    epsCs = shr(tEnd) - shr(t0) // only the shrinkage after stressing shortens the tendon
    const cls = Number(input.losses.relaxationClass) as 1 | 2 | 3
    const psi2 = input.loads.psi2
    const qpAll = cases.imposedByPattern[0] as number[] // quasi-permanent imposed load on all spans
    const sigmaQP = stations.map((_, k) => {
      const Mext = at(cases.selfWeight, k) + at(cases.superimposed, k) + psi2 * at(qpAll, k)
      const Mtot = Mext - at(P0, k) * at(e, k) + mean0 * at(m2Unit, k)
      return sigmaAtTendon(at(P0, k), k, Mtot)
    })
    const partsAt = (sigmaPi: number, sigmaC: number, zcp: number): { creep: number; shrinkage: number; relaxation: number; total: number } => {
      const muR = sigmaPi / strand.fpk
      const dSigmaPr = relaxationLoss(cls, RHO1000[cls], muR, 500000) * sigmaPi // EN 1992-1-1 3.3.2(8): final value at 500 000 h
      return timeDependentParts({ epsCs: epsCs as number, Ep: strand.Ep, Ecm: c28.Ecm, phi: phi as number, sigmaCQP: sigmaC, dSigmaPr, Ap, Ac: sec.A, Ic: sec.I, zcp })
    }
    const parts = bonded
      ? stations.map((_, k) => partsAt(at(P0, k) / Ap, at(sigmaQP, k), Math.abs(at(e, k))))
      : (() => {
        // EN 1992-1-1 5.10.6(3): unbonded tendons take the mean strain along the tendon
        const one = partsAt(mean0 / Ap, meanAlong(X, sigmaQP), meanAlong(X, e.map(Math.abs)))
        return stations.map(() => one)
      })()
    lossParts = {
      creep: parts.map((t) => t.creep * Ap),
      shrinkage: parts.map((t) => t.shrinkage * Ap),
      relaxation: parts.map((t) => t.relaxation * Ap),
      longTerm: parts.map((t) => t.total * Ap),
    }
  } else {
    lossParts = { creep: zeros, shrinkage: zeros, relaxation: zeros, longTerm: P0.map((v) => v * input.losses.longTermShare) }
  }
  const Pinf = P0.map((v, k) => v - at(lossParts.longTerm, k))
  if (Pinf.some((v) => !(v > 0))) fail('losses.model', 'the losses exceed the force in the tendon')
  const meanInf = meanAlong(X, Pinf)

  const transfer: StageForces = { P: P0, Pmean: mean0, M2: m2Unit.map((m) => m * mean0) }
  const service: StageForces = { P: Pinf, Pmean: meanInf, M2: m2Unit.map((m) => m * meanInf) }

  // stress limits
  const exposure = input.limits.exposure as ExposureClass
  const rules = tensionRules(exposure, bonded)
  const tensionFor = (c: ServiceCombination): { limit: number | null; clause: string | null } => {
    const r = rules.filter((t) => t.combination === c)
    if (r.length === 0) return { limit: null, clause: null }
    const strict = r.find((t) => t.kind === 'decompression')
    if (strict) return { limit: 0, clause: strict.clause }
    return { limit: input.limits.serviceTension * c28.fctm, clause: (r[0] as TensionRule).clause } // EN 1992-1-1 7.1(2): fct,eff = fctm
  }
  const lim = (compression: number | null, c: ServiceCombination): StageLimits => {
    const t = tensionFor(c)
    return { compression, tension: t.limit, tensionClause: t.clause }
  }
  const limits = {
    transfer: {
      compression: input.annex.transferCompression * ct.fck, // EN 1992-1-1 5.10.2.2(5): 0.6 fck(t)
      tension: input.limits.transferTension * ct.fctm, // EN 1992-1-1 7.1(2) with fctm(t), eq. (3.4)
      tensionClause: 'EN 1992-1-1 7.1(2), fctm(t) eq. (3.4)',
    },
    characteristic: lim(input.annex.k1Service * fck, 'characteristic'), // EN 1992-1-1 7.2(2): k1 fck
    frequent: lim(null, 'frequent'),
    quasiPermanent: lim(input.annex.k2Service * fck, 'quasiPermanent'), // EN 1992-1-1 7.2(3): k2 fck
    tendonService: input.annex.k5 * strand.fpk, // EN 1992-1-1 7.2(5): k5 fpk
  }

  return {
    input, n, spans, supports, sec, trib, c28, ct, strand, jack, tendonsPerWidth, strands, Ap, sigmaJack, Pjack,
    eTop, eBot, dTop, dBot, profile, pieces, lowAt, stations, e, unitSpan, m2Unit,
    g: { sw, swTransfer: sw, sdl, q }, patterns, cases, Pfr, Pdi, drawInLength, dPel, transfer, service,
    lossParts, phi, epsCs, rsup, rinf, limits, rules, warnings,
  }
}

/** External moment at a station for each stage: [min, max]; transfer carries self-weight only. */
function stageMoments(c: Core, k: number): Record<Stage, MomentRange> {
  const G = at(c.cases.selfWeight, k) + at(c.cases.superimposed, k)
  const qs = c.cases.imposedByPattern.map((m) => at(m, k))
  const qMax = Math.max(0, ...qs) // an unloaded arrangement is always possible (imposed load absent)
  const qMin = Math.min(0, ...qs)
  const psi = { characteristic: 1, frequent: c.input.loads.psi1, quasiPermanent: c.input.loads.psi2 } // EN 1990 6.5.3
  const t = at(c.cases.selfWeight, k)
  return {
    transfer: { min: t, max: t },
    characteristic: { min: G + psi.characteristic * qMin, max: G + psi.characteristic * qMax }, // EN 1990 eq. (6.14b)
    frequent: { min: G + psi.frequent * qMin, max: G + psi.frequent * qMax }, // EN 1990 eq. (6.15b)
    quasiPermanent: { min: G + psi.quasiPermanent * qMin, max: G + psi.quasiPermanent * qMax }, // EN 1990 eq. (6.16b)
  }
}

interface StageStress { envelope: StressEnvelope; governing: FibrePair; utilisation: Record<'topC' | 'topT' | 'botC' | 'botT', number> }

function stressAt(c: Core, k: number, stage: Stage, M: MomentRange): StageStress {
  const f = stage === 'transfer' ? c.transfer : c.service
  const P = at(f.P, k)
  const e = at(c.e, k)
  const M2 = at(f.M2, k)
  const rs = c.rsup === c.rinf ? [c.rsup] : [c.rsup, c.rinf]
  let topMin = Infinity
  let topMax = -Infinity
  let bottomMin = Infinity
  let bottomMax = -Infinity
  for (const r of rs) {
    for (const m of [M.min, M.max]) {
      // EN 1992-1-1 5.10.9: characteristic force r·Pm,t; the secondary moment scales with the force
      const s = fibreStresses({ A: c.sec.A, Zt: c.sec.Zt, Zb: c.sec.Zb, P: r * P, e, M: m + r * M2 })
      topMin = Math.min(topMin, s.top)
      topMax = Math.max(topMax, s.top)
      bottomMin = Math.min(bottomMin, s.bottom)
      bottomMax = Math.max(bottomMax, s.bottom)
    }
  }
  const L = c.limits[stage]
  const fref = c.c28.fctm
  const uC = (s: number): number => (L.compression === null ? 0 : compressionUtilisation(s, L.compression))
  const uT = (s: number): number => (L.tension === null ? 0 : tensionUtilisation(s, L.tension, fref))
  const cap = (u: number): number => Math.min(UTILISATION_CAP, u)
  const utilisation = { topC: cap(uC(topMax)), topT: cap(uT(topMin)), botC: cap(uC(bottomMax)), botT: cap(uT(bottomMin)) }
  return {
    envelope: { topMin, topMax, bottomMin, bottomMax },
    governing: {
      top: utilisation.topT > utilisation.topC ? topMin : topMax,
      bottom: utilisation.botT > utilisation.botC ? bottomMin : bottomMax,
    },
    utilisation,
  }
}

interface SectionSite { id: string; label: string; kind: CriticalSection['kind']; k: number }

function criticalSites(c: Core): SectionSite[] {
  const out: SectionSite[] = []
  const find = (span: number, x: number): number => c.stations.findIndex((s) => s.span === span && Math.abs(s.x - x) < 1e-6)
  const seen = new Set<number>()
  const add = (site: SectionSite): void => {
    if (site.k < 0 || seen.has(site.k)) return
    seen.add(site.k)
    out.push(site)
  }
  for (let i = 0; i < c.n; i++) {
    const L = at(c.spans, i)
    add({ id: `support-${i + 1}`, label: `Support ${i + 1}`, kind: 'support', k: find(i, 0) })
    const lowX = at(c.lowAt, i) * L
    const tenths = [1, 2, 3, 4, 5, 6, 7, 8, 9].map((t) => ({ t, x: (t * L) / 10 }))
    const items: SectionSite[] = [{ id: `span-${i + 1}-low`, label: `Span ${i + 1}, low point`, kind: 'lowPoint', k: find(i, lowX) }]
    for (const { t, x } of tenths) items.push({ id: `span-${i + 1}-${t}`, label: `Span ${i + 1}, ${t / 10}L`, kind: 'tenth', k: find(i, x) })
    items.sort((a, b) => a.k - b.k)
    items.forEach(add)
  }
  add({ id: `support-${c.n + 1}`, label: `Support ${c.n + 1}`, kind: 'support', k: find(c.n - 1, at(c.spans, c.n - 1)) })
  return out
}

/** Magnel conditions at a station: every fibre, bound and characteristic force factor of every stage. */
function magnelConditions(c: Core, k: number, M: Record<Stage, MomentRange>): MagnelCondition[] {
  const out: MagnelCondition[] = []
  const rs = c.rsup === c.rinf ? [c.rsup] : [c.rsup, c.rinf]
  const P0 = at(c.transfer.P, k)
  const eta = at(c.service.P, k) / P0
  for (const stage of STAGES) {
    const L = c.limits[stage]
    const f = stage === 'transfer' ? c.transfer : c.service
    const etaS = stage === 'transfer' ? 1 : eta
    const M2 = at(f.M2, k)
    for (const r of rs) {
      const add = (fibre: 'top' | 'bottom', bound: 'compression' | 'tension', m: number, limit: number | null): void => {
        if (limit === null) return
        out.push({
          id: `${stage}.${fibre}.${bound}${rs.length > 1 ? (r === c.rsup ? '.sup' : '.inf') : ''}`,
          label: `${STAGE_LABEL[stage]}, ${fibre} fibre ${bound}${rs.length > 1 ? ` (r = ${r})` : ''}`,
          stage: stage === 'transfer' ? 'transfer' : 'service',
          fibre, bound, forceFactor: r * etaS, M: m + r * M2, limit,
        })
      }
      add('top', 'compression', M[stage].max, L.compression)
      add('top', 'tension', M[stage].min, L.tension)
      add('bottom', 'compression', M[stage].min, L.compression)
      add('bottom', 'tension', M[stage].max, L.tension)
    }
  }
  return out
}

const STAGE_LABEL: Record<Stage, string> = {
  transfer: 'Transfer',
  characteristic: 'Characteristic',
  frequent: 'Frequent',
  quasiPermanent: 'Quasi-permanent',
}

function stageClause(stage: Stage, bound: 'compression' | 'tension', c: Core): string {
  if (stage === 'transfer') return bound === 'compression' ? 'EN 1992-1-1 5.10.2.2(5)' : (c.limits.transfer.tensionClause as string)
  if (bound === 'compression') return stage === 'characteristic' ? 'EN 1992-1-1 7.2(2)' : 'EN 1992-1-1 7.2(3)'
  return c.limits[stage].tensionClause ?? 'EN 1992-1-1 7.1(2)'
}

function buildChecks(c: Core, sections: CriticalSection[], stressBySection: Array<Record<Stage, StageStress>>, extra: CheckResult[]): CheckResult[] {
  const checks: CheckResult[] = []
  for (const stage of STAGES) {
    const L = c.limits[stage]
    const items: Array<{ fibre: 'top' | 'bottom'; bound: 'compression' | 'tension'; key: 'topC' | 'topT' | 'botC' | 'botT' }> = [
      { fibre: 'top', bound: 'tension', key: 'topT' },
      { fibre: 'top', bound: 'compression', key: 'topC' },
      { fibre: 'bottom', bound: 'tension', key: 'botT' },
      { fibre: 'bottom', bound: 'compression', key: 'botC' },
    ]
    for (const it of items) {
      const limit = it.bound === 'compression' ? L.compression : L.tension
      if (limit === null) continue
      let worst = 0
      let u = -1
      stressBySection.forEach((s, i) => {
        const v = s[stage].utilisation[it.key]
        if (v > u) { u = v; worst = i }
      })
      const sec = sections[worst] as CriticalSection
      const env = (stressBySection[worst] as Record<Stage, StageStress>)[stage].envelope
      const sigma = it.fibre === 'top' ? (it.bound === 'compression' ? env.topMax : env.topMin) : it.bound === 'compression' ? env.bottomMax : env.bottomMin
      const actual = it.bound === 'compression' ? Math.max(0, sigma) : Math.max(0, -sigma)
      checks.push({
        id: `${stage}.${it.fibre}.${it.bound}`,
        group: stage === 'transfer' ? 'transfer' : 'service',
        title: `${STAGE_LABEL[stage]}: ${it.fibre} fibre ${it.bound === 'compression' ? 'compression' : limit === 0 ? 'decompression' : 'tension'}`,
        location: `${sec.label}, x = ${(sec.X / 1000).toFixed(2)} m`,
        clause: stageClause(stage, it.bound, c),
        actual,
        limit,
        unit: 'MPa',
        utilisation: u,
        pass: u <= 1 + 1e-9,
        ...(limit === 0 ? { note: 'no tension allowed; utilisation above 1 grows with the tension over fctm' } : {}),
      })
    }
  }
  return checks.concat(extra)
}

/** actual ≤ limit, or with atLeast actual ≥ limit (utilisation limit/actual). */
function ratioCheck(id: string, group: string, title: string, clause: string, actual: number, limit: number, unit: CheckResult['unit'], note?: string, atLeast = false): CheckResult {
  const utilisation = Math.min(UTILISATION_CAP, atLeast ? (actual > 0 ? limit / actual : UTILISATION_CAP) : limit > 0 ? actual / limit : actual > 0 ? UTILISATION_CAP : 0)
  return { id, group, title, clause, actual, limit, unit, utilisation, pass: utilisation <= 1 + 1e-9, ...(note ? { note } : {}) }
}

interface Assembled {
  core: Core
  sections: CriticalSection[]
  checks: CheckResult[]
  stressBySection: Array<Record<Stage, StageStress>>
  momentsBySection: Array<Record<Stage, MomentRange>>
}

function assemble(input: MemberInput, withMagnel = true): Assembled {
  const c = runCore(input)
  const sites = criticalSites(c)
  const stressBySection: Array<Record<Stage, StageStress>> = []
  const momentsBySection: Array<Record<Stage, MomentRange>> = []
  const sections: CriticalSection[] = sites.map((site) => {
    const k = site.k
    const st = c.stations[k] as Station
    const M = stageMoments(c, k)
    const s = {} as Record<Stage, StageStress>
    for (const stage of STAGES) s[stage] = stressAt(c, k, stage, M[stage])
    stressBySection.push(s)
    momentsBySection.push(M)
    const u = Math.max(...STAGES.flatMap((stage) => Object.values(s[stage].utilisation)))
    const qs = c.cases.imposedByPattern.map((m) => at(m, k))
    const P0 = at(c.transfer.P, k)
    const Pi = at(c.service.P, k)
    const eK = at(c.e, k)
    const stress = {} as Record<Stage, FibrePair>
    const envelope = {} as Record<Stage, StressEnvelope>
    for (const stage of STAGES) {
      stress[stage] = s[stage].governing
      envelope[stage] = s[stage].envelope
    }
    return {
      id: site.id, label: site.label, kind: site.kind, span: st.span, x: st.x, X: st.X, e: eK,
      force: { transfer: P0, service: Pi },
      moments: {
        selfWeight: at(c.cases.selfWeight, k),
        superimposed: at(c.cases.superimposed, k),
        imposed: { min: Math.min(0, ...qs), max: Math.max(0, ...qs) },
        transfer: M.transfer.min,
        characteristic: M.characteristic,
        frequent: M.frequent,
        quasiPermanent: M.quasiPermanent,
        primaryTransfer: -P0 * eK, // primary moment −P·e
        secondaryTransfer: at(c.transfer.M2, k),
        totalTransfer: -P0 * eK + at(c.transfer.M2, k),
        primaryService: -Pi * eK,
        secondaryService: at(c.service.M2, k),
        totalService: -Pi * eK + at(c.service.M2, k),
      },
      stress, envelope, utilisation: u,
      magnel: withMagnel
        ? magnelRegion({ A: c.sec.A, Zt: c.sec.Zt, Zb: c.sec.Zb }, magnelConditions(c, k, M), -c.eTop, c.eBot)
        : { feasible: false, minP: null, eAtMinP: null, lines: [], region: [], eLimits: { min: -c.eTop, max: c.eBot }, unbounded: false },
    }
  })

  // tendon and detailing checks
  const extra: CheckResult[] = []
  const maxLockOff = Math.max(...c.Pdi) / c.Ap
  extra.push(ratioCheck('tendon.jacking', 'tendon', 'Stress at jacking', 'EN 1992-1-1 5.10.2.1(1) eq. (5.41)', c.sigmaJack, c.jack.sigmaPmax, 'MPa'))
  extra.push(ratioCheck('tendon.lockOff', 'tendon', 'Largest stress after lock-off (friction and draw-in)', 'EN 1992-1-1 5.10.3(2) eq. (5.43)', maxLockOff, c.jack.sigmaPm0, 'MPa'))
  const maxService = Math.max(...c.service.P) / c.Ap
  extra.push(ratioCheck('tendon.service', 'tendon', 'Tendon stress in service (uncracked, characteristic)', 'EN 1992-1-1 7.2(5)', maxService, c.limits.tendonService, 'MPa', 'the stress increase of an uncracked section under live load is neglected'))
  const t = c.input.tendon
  // EN 1992-1-1 Table 4.2: post-tensioned ducts — round: diameter; rectangular: greater of the smaller dimension or half the larger, at most 80 mm
  const cminb = Math.min(80, t.ductShape === 'round' ? t.ductHeight : Math.max(t.ductHeight, t.ductWidth / 2))
  extra.push(ratioCheck('tendon.coverBond', 'tendon', 'Cover to duct for bond', 'EN 1992-1-1 4.4.1.2, Table 4.2', Math.min(t.coverTop, t.coverBottom), cminb, 'mm', 'the durability cover of Table 4.5N and Δcdev are the designer\'s to add', true))
  const pa0 = c.transfer.Pmean / c.sec.A
  const pa = c.service.Pmean / c.sec.A
  const pmin = c.input.limits.precompressionMin
  const pmax = c.input.limits.precompressionMax
  extra.push(ratioCheck('precompression.min', 'precompression', 'Average precompression in service, at least', 'common practice (P/A)', pa, pmin, 'MPa', undefined, true))
  extra.push(ratioCheck('precompression.max', 'precompression', 'Average precompression at transfer, at most', 'common practice (P/A)', pa0, pmax, 'MPa'))
  return { core: c, sections, checks: buildChecks(c, sections, stressBySection, extra), stressBySection, momentsBySection }
}

/** Transfer and service stress checks all pass. */
function stressesPass(a: Assembled): boolean {
  return a.checks.filter((k) => k.group === 'transfer' || k.group === 'service').every((k) => k.pass)
}

// ---------------------------------------------------------------------------------------------
// Proposal: least strands and a profile that satisfy every stress condition at every section.
// For a given force the fibre stresses are linear in the profile's eccentricities (the profile and
// its secondary moment are linear in them), so each condition is a half-space; a point of the
// intersection is found by cyclic projection onto the violated half-spaces (Kaczmarz/POCS).
// ---------------------------------------------------------------------------------------------

interface Basis { phi: number[][]; psi: number[][] }

function profileBasis(c: Core, ks: number[]): Basis {
  const m = 2 * c.n + 1
  const EI = c.c28.Ecm * c.sec.I
  const phi: number[][] = ks.map(() => new Array<number>(m).fill(0))
  const psi: number[][] = ks.map(() => new Array<number>(m).fill(0))
  for (let j = 0; j < m; j++) {
    const sup = c.spans.map(() => 0).concat(0)
    const spn = c.spans.map(() => 0)
    if (j <= c.n) sup[j] = 1
    else spn[j - c.n - 1] = 1
    const prof: TendonProfile = { ...c.profile, supportEcc: sup, spanEcc: spn }
    const pcs = resolveProfile(prof)
    const ps = prestressMoments({ spans: c.spans, EI, supports: c.supports, profile: prof, P: 1 })
    ks.forEach((k, r) => {
      const st = c.stations[k] as Station
      ;(phi[r] as number[])[j] = eccentricityIn(pcs[st.span] as ProfilePiece[], st.x)
      ;(psi[r] as number[])[j] = ps.secondaryAt(st.span, st.x)
    })
  }
  return { phi, psi }
}

/**
 * The stress conditions of every section, stage, force factor and fibre as rows g·p ≤ c0/s − c1,
 * where p are the profile eccentricities and s the strands relative to the run linearised about
 * (the force and its secondary moment scale with s; the external moments do not).
 */
interface LinearModel { m: number; k: number; G: Float64Array; c0: Float64Array; c1: Float64Array; N2: Float64Array; boxMax: Float64Array }

function linearModel(c: Core, a: Assembled, basis: Basis, margin: number): LinearModel {
  const rows: Array<{ g: number[]; c0: number; c1: number }> = []
  const rs = c.rsup === c.rinf ? [c.rsup] : [c.rsup, c.rinf]
  const sites = siteIndex(a)
  a.sections.forEach((_, r) => {
    const site = sites[r] as number
    const phi = basis.phi[r] as number[]
    const psi = basis.psi[r] as number[]
    const M = a.momentsBySection[r] as Record<Stage, MomentRange>
    for (const stage of STAGES) {
      const f = stage === 'transfer' ? c.transfer : c.service
      const P = at(f.P, site)
      const Pm = f.Pmean
      const L = c.limits[stage]
      for (const rr of rs) {
        for (const fibre of ['top', 'bottom'] as const) {
          const ke = fibre === 'top' ? -1 / c.sec.Zt : 1 / c.sec.Zb
          const kM = fibre === 'top' ? 1 / c.sec.Zt : -1 / c.sec.Zb
          const g = phi.map((v, j) => rr * P * ke * v + kM * rr * Pm * at(psi, j)) // dσ/dp per unit s
          if (g.every((v) => v === 0)) continue
          const mC = fibre === 'top' ? M[stage].max : M[stage].min
          const mT = fibre === 'top' ? M[stage].min : M[stage].max
          // σ = s·(rP/A + g·p) + kM·M within [−ft, fc], divided by s
          if (L.compression !== null) rows.push({ g, c0: L.compression - margin - kM * mC, c1: (rr * P) / c.sec.A })
          if (L.tension !== null) rows.push({ g: g.map((v) => -v), c0: L.tension - margin + kM * mT, c1: (-rr * P) / c.sec.A })
        }
      }
    }
  })
  const m = 2 * c.n + 1
  const k = rows.length
  const G = new Float64Array(k * m)
  const c0 = new Float64Array(k)
  const c1 = new Float64Array(k)
  const N2 = new Float64Array(k)
  const boxMax = new Float64Array(k)
  rows.forEach((row, r) => {
    let n2 = 0
    let bm = 0
    row.g.forEach((g, j) => {
      G[r * m + j] = g
      n2 += g * g
      bm += Math.max(-g * c.eTop, g * c.eBot) // greatest g·p over the eccentricity box
    })
    c0[r] = row.c0
    c1[r] = row.c1
    N2[r] = n2
    boxMax[r] = bm
  })
  return { m, k, G, c0, c1, N2, boxMax }
}

/** Cyclic projection onto the violated rows at strand ratio s, within lo ≤ p ≤ hi. */
function project(model: LinearModel, s: number, start: number[], lo: number, hi: number, sweeps: number): { p: number[]; violation: number } {
  const { m, k, G, c0, c1, N2, boxMax } = model
  const H = new Float64Array(k)
  const live: number[] = []
  for (let r = 0; r < k; r++) {
    H[r] = c0[r]! / s - c1[r]!
    if (boxMax[r]! > H[r]!) live.push(r) // a row no point of the box can violate needs no projection
  }
  const p = Float64Array.from(start, (v) => Math.min(hi, Math.max(lo, v)))
  for (let it = 0; it < sweeps; it++) {
    let violated = false
    for (const r of live) {
      const o = r * m
      let v = -H[r]!
      for (let j = 0; j < m; j++) v += G[o + j]! * p[j]!
      if (v > 0) {
        violated = true
        const f = (1.02 * v) / N2[r]! // a slight over-relaxation speeds the cycle
        for (let j = 0; j < m; j++) p[j] = p[j]! - f * G[o + j]!
      }
    }
    for (let j = 0; j < m; j++) p[j] = Math.min(hi, Math.max(lo, p[j]!))
    if (!violated) break
  }
  let final = 0
  for (let r = 0; r < k; r++) {
    let v = -H[r]!
    for (let j = 0; j < m; j++) v += G[r * m + j]! * p[j]!
    final = Math.max(final, v * s) // back in MPa
  }
  return { p: Array.from(p), violation: final }
}

function noProposal(reason: string): Proposal {
  return { feasible: false, reason, strands: null, forceTransfer: null, spacing: null, count: null, supportEcc: null, spanEcc: null, inputPatch: null, verified: false }
}

function sectionTooSmallReason(a: Assembled): string | null {
  const c = a.core
  for (let r = 0; r < a.sections.length; r++) {
    const sec = a.sections[r] as CriticalSection
    if (sec.magnel.feasible) continue
    const M = a.momentsBySection[r] as Record<Stage, MomentRange>
    const eta = sec.force.service / sec.force.transfer
    const fcs = c.limits.characteristic.compression ?? c.limits.quasiPermanent.compression ?? Infinity
    const fts = c.limits.frequent.tension ?? c.limits.quasiPermanent.tension ?? 0
    const need = requiredModuli({
      Mmin: M.transfer.min, Mmax: M.characteristic.max, eta,
      fct: c.limits.transfer.compression ?? 0, ftt: c.limits.transfer.tension ?? 0, fcs, fts,
    })
    const kNm = (v: number): string => (v / 1e6).toFixed(1)
    return `No prestress force satisfies the stress limits at ${sec.label} within the eccentricity limits −${c.eTop.toFixed(0)} mm … +${c.eBot.toFixed(0)} mm`
      + ` (moments ${kNm(M.transfer.min)} kNm at transfer to ${kNm(M.characteristic.max)} kNm in service): the section is too small`
      + ` — it would need about Zt ≥ ${(Math.abs(need.Zt) / 1e6).toFixed(1)}·10⁶ mm³ and Zb ≥ ${(Math.abs(need.Zb) / 1e6).toFixed(1)}·10⁶ mm³`
      + ` against ${(c.sec.Zt / 1e6).toFixed(1)}·10⁶ and ${(c.sec.Zb / 1e6).toFixed(1)}·10⁶ mm³. Deepen the section or raise the concrete class.`
  }
  return null
}

/** Candidate arrangements, fewest strands first. */
function candidates(c: Core): Array<{ spacing: number | null; count: number | null; strands: number }> {
  const perTendon = c.input.tendon.strandsPerTendon
  const out: Array<{ spacing: number | null; count: number | null; strands: number }> = []
  if (c.input.section.kind === 'slab-strip') {
    for (let s = 3000; s >= 150; s -= 25) out.push({ spacing: s, count: null, strands: (1000 / s) * perTendon })
  } else {
    for (let n = 1; n <= 60; n++) out.push({ spacing: null, count: n, strands: n * perTendon })
  }
  return out
}

/** To 0.1 mm, but never past the eccentricity limits: a profile on a limit must not round out of the concrete. */
function round1(v: number, lo: number, hi: number): number {
  const r = Math.round(v * 10) / 10
  if (r > hi) return Math.floor(hi * 10) / 10
  if (r < lo) return Math.ceil(lo * 10) / 10
  return r
}

function siteIndex(a: Assembled): number[] {
  return a.sections.map((s) => a.core.stations.findIndex((st) => st.span === s.span && Math.abs(st.x - s.x) < 1e-6))
}

type Candidate = { spacing: number | null; count: number | null; strands: number }

/** A verified arrangement: its index among the candidates, the proposal and the run that passed. */
interface Found { index: number; proposal: Proposal; run: Assembled }

/**
 * The least force and a profile that pass every stress check. The fibre stresses are linear in the
 * eccentricities at a given force, but the force per strand (friction, elastic shortening, creep)
 * moves with the strands and the profile, so a linearisation holds only near the member it was made
 * about: bracket with it, verify by full runs, then linearise again about the verified member and look
 * below it, until no smaller force verifies.
 */
function propose(first: Assembled): Proposal {
  const c0 = first.core
  const cands = candidates(c0)
  const n = c0.n
  // the eccentricity limits follow the section and covers only, never the strands or the profile
  const eLo = -c0.eTop
  const eHi = c0.eBot
  // the unit profiles keep the input's low points and inflection, so one basis serves every run
  const basis = profileBasis(c0, siteIndex(first))
  // a margin (MPa) below the limits absorbs what the linearisation leaves out: wide far from the
  // input's force, narrow about a verified member, where little is left out
  const WIDE = 0.03
  const NARROW = 0.002
  // a linearisation about another force misjudges the force per strand (elastic shortening, creep) by
  // about this much (MPa): a rejection by less is tried by a run at the candidate's own force
  const MISJUDGED = 0.1
  const modelCache = new Map<Assembled, Map<number, LinearModel>>()
  const modelOf = (a: Assembled, margin: number): LinearModel => {
    const byMargin = modelCache.get(a) ?? new Map<number, LinearModel>()
    const mdl = byMargin.get(margin) ?? linearModel(a.core, a, basis, margin)
    byMargin.set(margin, mdl)
    modelCache.set(a, byMargin)
    return mdl
  }
  const profileOf = (a: Assembled): number[] => [...a.core.profile.supportEcc, ...a.core.profile.spanEcc]
  const patchOf = (cand: Candidate, supportEcc: number[], spanEcc: number[]): InputPatch => ({
    tendon: cand.spacing !== null ? { spacing: cand.spacing } : { count: cand.count as number },
    profile: { mode: 'custom', supportEcc, spanEcc, lowPointAt: c0.lowAt },
  })
  const accepted = (cand: Candidate, supportEcc: number[], spanEcc: number[], run: Assembled): Proposal => ({
    feasible: true, reason: null, strands: cand.strands, forceTransfer: run.core.transfer.Pmean,
    spacing: cand.spacing, count: cand.count, supportEcc, spanEcc, verified: true,
    inputPatch: patchOf(cand, supportEcc, spanEcc),
  })
  // the last full run of a failed verification: a member nearer the answer than the input
  let nearest: Assembled | null = null
  // one arrangement: solve the linearised conditions, verify by a full run, linearise again if needed
  const attempt = (index: number, about: Assembled, margin: number): Found | null => {
    const cand = cands[index] as Candidate
    let a = about
    let start = profileOf(about)
    for (let t = 0; t < 3; t++) {
      const res = project(modelOf(a, margin), cand.strands / a.core.strands, start, eLo, eHi, 150)
      const sameForce = Math.abs(a.core.strands - cand.strands) < 1e-9
      if (res.violation > (sameForce ? 1e-6 : MISJUDGED)) return null
      const supportEcc = res.p.slice(0, n + 1).map((v) => round1(v, eLo, eHi))
      const spanEcc = res.p.slice(n + 1).map((v) => round1(v, eLo, eHi))
      let rerun: Assembled
      try {
        rerun = assemble(parseMemberInput(mergeInputPatch(c0.input, patchOf(cand, supportEcc, spanEcc))), false)
      } catch {
        return null
      }
      if (stressesPass(rerun)) return { index, proposal: accepted(cand, supportEcc, spanEcc, rerun), run: rerun }
      nearest = rerun
      // friction, losses and the secondary moment follow the new profile: linearise again about it
      a = rerun
      start = res.p
    }
    return null
  }
  // feasibility of the conditions linearised about a member: cheap, used to bracket the least force
  const linearOK = (about: Assembled, i: number, margin: number): boolean =>
    project(modelOf(about, margin), (cands[i] as Candidate).strands / about.core.strands, profileOf(about), eLo, eHi, 150).violation <= 1e-6
  // least index from lo up that the linearisation about a member accepts, or −1; the feasible forces
  // form an interval (the conditions are convex in e and 1/P), so gallop up to one and bisect below it
  const leastLinear = (about: Assembled, from: number, margin: number): number => {
    let lo = from
    let hi = -1
    for (let i = lo, step = 1; i < cands.length; i += step, step *= 2) {
      if (linearOK(about, i, margin)) { hi = i; break }
      lo = i + 1
    }
    if (hi < 0) for (let i = lo; i < cands.length && hi < 0; i++) if (linearOK(about, i, margin)) hi = i
    if (hi < 0) return -1
    let failed = Math.min(lo, hi) - 1
    while (hi - failed > 1) {
      const mid = Math.floor((hi + failed) / 2)
      if (linearOK(about, mid, margin)) hi = mid
      else failed = mid
    }
    return hi
  }
  // least index below a verified one that the linearisation about it accepts, or −1: gallop down, bisect
  const leastBelow = (about: Assembled, top: number, margin: number): number => {
    let ok = top
    let failed = -1
    for (let step = 1; top - step >= 0; step *= 2) {
      if (linearOK(about, top - step, margin)) ok = top - step
      else { failed = top - step; break }
    }
    if (ok === top) return -1
    while (ok - failed > 1) {
      const mid = Math.floor((ok + failed) / 2)
      if (linearOK(about, mid, margin)) ok = mid
      else failed = mid
    }
    return ok
  }
  // verify from the bracketed force upwards, stepping up where friction and losses moved with the profile
  const verifyFrom = (about: Assembled, i0: number, limit: number, margin: number): Found | null => {
    for (let i = i0; i >= 0 && i < Math.min(cands.length, limit); i++) {
      const f = attempt(i, about, margin)
      if (f) return f
    }
    return null
  }

  // the per-section Magnel regions give the least force each section needs on its own: a start
  const need = Math.max(0, ...first.sections.map((s) => (s.magnel.minP ?? 0) / s.force.transfer))
  const start = Math.max(0, cands.findIndex((k) => k.strands >= 0.9 * need * c0.strands))
  let about: Assembled = first
  let best: Found | null = null
  for (let round = 0; round < 3 && best === null; round++) {
    const i0 = leastLinear(about, start, WIDE)
    if (i0 < 0) break
    nearest = null
    best = verifyFrom(about, i0, i0 + 6, WIDE)
    // far from the input its linearisation misjudges the force per strand: start again about the last run
    const next: Assembled | null = nearest
    if (best === null && next === null) break
    if (next !== null) about = next
  }
  // linearise about the verified member, whose force is near the least, and look below it
  for (let round = 0; best !== null && best.index > 0 && round < 4; round++) {
    const lower = leastBelow(best.run, best.index, NARROW)
    // none below by this linearisation: the next smaller force may still pass, judged about its own run
    const found = lower >= 0
      ? verifyFrom(best.run, lower, Math.min(best.index, lower + 3), NARROW)
      : attempt(best.index - 1, best.run, NARROW)
    if (found === null) break
    best = found
  }

  const current = cands.findIndex((k) => Math.abs(k.strands - c0.strands) < 1e-9)
  if (current >= 0 && stressesPass(first) && (best === null || (best.proposal.strands as number) > c0.strands)) {
    return accepted(cands[current] as Candidate, c0.profile.supportEcc, c0.profile.spanEcc, first)
  }
  if (best === null) {
    return noProposal(sectionTooSmallReason(first) ?? 'No single force and profile satisfies every section at once within the eccentricity limits: revise the section, the spans or the concrete class.')
  }
  return best.proposal
}

// ---------------------------------------------------------------------------------------------

export function designMember(raw: unknown, options: DesignOptions = {}): Design {
  const input = parseMemberInput(raw)
  const a = assemble(input)
  const c = a.core
  const X = c.stations.map((s) => s.X)
  const warnings = [...c.warnings]

  // balancing (Lin): force per span for the chosen load, strands needed at the mean service force
  const wbal = input.loads.balanceSelfWeight * c.g.sw + input.loads.balanceSuperimposed * c.g.sdl + input.loads.balanceImposed * c.g.q
  const bal = balancingForce(c.profile, wbal)
  const perStrandService = c.service.Pmean / c.strands
  const strandsNeeded = bal.governing / perStrandService
  const tendonsNeeded = strandsNeeded / input.tendon.strandsPerTendon
  const provided = balancedLoad(c.profile, c.service.Pmean)
  if (strandsNeeded > c.strands * (1 + 1e-9)) {
    warnings.push(`The tendons provided balance ${(100 * c.strands / strandsNeeded).toFixed(0)} % of the chosen load in the governing span.`)
  }
  const ratioCheck2 = ratioCheck('balancing.strands', 'balancing', 'Strands provided for the balanced load', 'Lin, load balancing: P = wL²/8a', c.strands, strandsNeeded, '', undefined, true)
  a.checks.push(ratioCheck2)

  // span/depth against the usual practice (from memory: slabs 35–45, band beams 20–30)
  const spanDepth = c.spans.map((L) => L / input.section.h)
  const sdMax = input.section.kind === 'slab-strip' ? 45 : 30
  spanDepth.forEach((r, i) => {
    if (r > sdMax) warnings.push(`Span ${i + 1}: span/depth ${r.toFixed(1)} exceeds the usual ${sdMax} for this kind of member; check deflection.`)
  })

  const meanFr = meanAlong(X, c.Pfr)
  const meanDi = meanAlong(X, c.Pdi)
  const lossOf = (force: number | null): LossItem => ({ force, percent: force === null ? null : force / c.Pjack })
  const detailed = input.losses.model === 'detailed'
  if ((c.Pjack - meanFr) / c.Pjack > 0.2) warnings.push('Friction takes more than 20 % of the jacking force on average: consider stressing from both ends or shorter tendons.')

  const stressAll = c.stations.map((_, k) => {
    const M = stageMoments(c, k)
    const s = {} as Record<Stage, StageStress>
    for (const stage of STAGES) s[stage] = stressAt(c, k, stage, M[stage])
    return { M, s }
  })
  const primary0 = c.stations.map((_, k) => -at(c.transfer.P, k) * at(c.e, k))
  const primaryS = c.stations.map((_, k) => -at(c.service.P, k) * at(c.e, k))
  const supportK = c.supports.map((_, j) => (j < c.n
    ? c.stations.findIndex((s) => s.span === j && s.x === 0)
    : c.stations.length - 1))
  const psAtSupports = (f: StageForces, prim: number[]): { primary: number[]; secondary: number[]; total: number[] } => ({
    primary: supportK.map((k) => at(prim, k)),
    secondary: supportK.map((k) => at(f.M2, k)),
    total: supportK.map((k) => at(prim, k) + at(f.M2, k)),
  })
  const serviceTensionLimit = c.limits.frequent.tension ?? c.limits.quasiPermanent.tension ?? 0
  let offset = 0
  const lowPointX = c.spans.map((L, i) => {
    const x = offset + at(c.lowAt, i) * L
    offset += L
    return x
  })

  const proposal = options.proposal === false ? noProposal('not computed') : propose(a)
  if (proposal.feasible && proposal.strands !== null && proposal.strands < c.strands - 1e-9 && stressesPass(a)) {
    warnings.push('The proposal passes every stress check with fewer strands than provided.')
  }

  const partOne: DesignPartOne = {
    engineVersion: ENGINE_VERSION,
    input,
    section: { ...c.sec, tributaryWidth: c.trib, spanDepth },
    concrete: { class: input.materials.concreteClass, at28: c.c28, atTransfer: { ...c.ct, age: input.materials.ageAtStressing } },
    strand: { ...c.strand, type: input.tendon.strand },
    jacking: {
      ...c.jack, sigmaJack: c.sigmaJack, PjackStrand: c.sigmaJack * c.strand.Ap, strandsPerTendon: input.tendon.strandsPerTendon,
      tendonsPerWidth: c.tendonsPerWidth, strands: c.strands, Ap: c.Ap, Pjack: c.Pjack,
    },
    eccentricity: {
      top: c.eTop, bottom: c.eBot, dTop: c.dTop, dBottom: c.dBot,
      coverForBond: Math.min(80, input.tendon.ductShape === 'round' ? input.tendon.ductHeight : Math.max(input.tendon.ductHeight, input.tendon.ductWidth / 2)),
    },
    profile: {
      supportEcc: c.profile.supportEcc, spanEcc: c.profile.spanEcc, lowPointAt: c.lowAt, inflection: input.profile.inflection,
      drapes: drapes(c.profile), lowPointX, length: sum(c.spans),
    },
    loads: { selfWeight: c.g.sw, superimposed: c.g.sdl, imposed: c.g.q, balanced: wbal },
    balancing: {
      load: wbal, perSpan: bal.perSpan, governing: bal.governing, strandsNeeded, strandsProvided: c.strands, tendonsNeeded,
      spacingNeeded: input.section.kind === 'slab-strip' ? (1000 * input.tendon.strandsPerTendon) / strandsNeeded : null,
      balancedProvided: provided, ratio: provided.map((w) => (wbal > 0 ? w / wbal : 0)),
    },
    force: {
      jacking: c.Pjack, meanAfterFriction: meanFr, meanAfterDrawIn: meanDi, meanTransfer: c.transfer.Pmean, meanService: c.service.Pmean,
      maxAfterLockOff: Math.max(...c.Pdi), drawInLength: c.drawInLength, eta: c.service.Pmean / c.transfer.Pmean,
    },
    losses: {
      basis: 'mean along the tendon',
      model: input.losses.model,
      phi: c.phi,
      epsCs: c.epsCs,
      friction: lossOf(c.Pjack - meanFr),
      drawIn: lossOf(meanFr - meanDi),
      elasticShortening: lossOf(meanAlong(X, c.dPel)),
      creep: lossOf(detailed ? meanAlong(X, c.lossParts.creep) : null),
      shrinkage: lossOf(detailed ? meanAlong(X, c.lossParts.shrinkage) : null),
      relaxation: lossOf(detailed ? meanAlong(X, c.lossParts.relaxation) : null),
      longTerm: lossOf(meanAlong(X, c.lossParts.longTerm)),
      total: lossOf(c.Pjack - c.service.Pmean),
    },
    prestressMoments: { transfer: psAtSupports(c.transfer, primary0), service: psAtSupports(c.service, primaryS) },
    loadCases: {
      patterns: c.patterns,
      supportMoments: {
        selfWeight: supportK.map((k) => at(c.cases.selfWeight, k)),
        superimposed: supportK.map((k) => at(c.cases.superimposed, k)),
        imposed: c.cases.imposedByPattern.map((m) => supportK.map((k) => at(m, k))),
      },
    },
    limits: c.limits,
    sections: a.sections,
    checks: a.checks,
    precompression: {
      transfer: c.transfer.Pmean / c.sec.A, service: c.service.Pmean / c.sec.A,
      min: input.limits.precompressionMin, max: input.limits.precompressionMax,
    },
    proposal,
    series: {
      X,
      span: c.stations.map((s) => s.span),
      x: c.stations.map((s) => s.x),
      e: c.e,
      eLimitTop: X.map(() => -c.eTop),
      eLimitBottom: X.map(() => c.eBot),
      depth: X.map(() => c.sec.h),
      centroid: X.map(() => c.sec.yt),
      forceFriction: c.Pfr,
      forceDrawIn: c.Pdi,
      forceTransfer: c.transfer.P,
      forceService: c.service.P,
      primaryTransfer: primary0,
      secondaryTransfer: c.transfer.M2,
      totalTransfer: primary0.map((v, k) => v + at(c.transfer.M2, k)),
      primaryService: primaryS,
      secondaryService: c.service.M2,
      totalService: primaryS.map((v, k) => v + at(c.service.M2, k)),
      momentTransfer: stressAll.map((r) => r.M.transfer.min),
      momentServiceMax: stressAll.map((r) => r.M.characteristic.max),
      momentServiceMin: stressAll.map((r) => r.M.characteristic.min),
      stressTransferTopMin: stressAll.map((r) => r.s.transfer.envelope.topMin),
      stressTransferTopMax: stressAll.map((r) => r.s.transfer.envelope.topMax),
      stressTransferBottomMin: stressAll.map((r) => r.s.transfer.envelope.bottomMin),
      stressTransferBottomMax: stressAll.map((r) => r.s.transfer.envelope.bottomMax),
      stressServiceTopMin: stressAll.map((r) => Math.min(...SERVICE.map((s) => r.s[s].envelope.topMin))),
      stressServiceTopMax: stressAll.map((r) => Math.max(...SERVICE.map((s) => r.s[s].envelope.topMax))),
      stressServiceBottomMin: stressAll.map((r) => Math.min(...SERVICE.map((s) => r.s[s].envelope.bottomMin))),
      stressServiceBottomMax: stressAll.map((r) => Math.max(...SERVICE.map((s) => r.s[s].envelope.bottomMax))),
      limitTransferCompression: X.map(() => c.limits.transfer.compression as number),
      limitTransferTension: X.map(() => -(c.limits.transfer.tension as number)),
      limitServiceCompression: X.map(() => c.limits.characteristic.compression as number),
      limitServiceTension: X.map(() => -serviceTensionLimit),
    },
    warnings,
  }
  return withPartTwo(partOne)
}
