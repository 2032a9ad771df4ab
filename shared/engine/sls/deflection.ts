/**
 * Deflection of a continuous member under the unbalanced quasi-permanent load (gravity minus the
 * tendon's equivalent loads), short term with Ecm and long term with the effective modulus
 * Ec,eff = Ecm/(1 + φ) (EN 1992-1-1 eq. (7.20)). Curvatures are computed at frequent stations and
 * integrated twice in each span (7.4.3(7), the rigorous method); where a section cracks the curvature
 * is interpolated between the uncracked and the fully cracked state with ζ = 1 − β(Mcr/M)²
 * (eqs. (7.18), (7.19), with σsr/σs = Mcr/M for bending). A cantilever is integrated from its root
 * with the slope of the member there (the back span's, or the support's rotation where none), and its
 * tip deflection is limited to 2 × overhang / ratio (common practice: a cantilever as half of a span
 * twice its length). Deflection positive downward, mm.
 */
import { analyseContinuousBeam } from '../analysis/continuous-beam'
import type { BeamLoad, SupportKind } from '../analysis/continuous-beam'
import { EngineInputError } from '../contract'
import { requireNonNegative, requirePositive, requireRange } from '../common/guards'

/** Cracking data of one span: net moments at first cracking and the cracked second moments. */
export interface SpanCracking {
  /** sagging moment (positive) at which the bottom fibre reaches fct,eff, N·mm */
  McrSagging: number
  /** hogging moment magnitude at which the top fibre reaches fct,eff, N·mm */
  McrHogging: number
  IcrSagging: number
  IcrHogging: number
}

export interface DeflectionInput {
  spans: number[]
  supports?: SupportKind[]
  /** rotational springs at the supports divided by the modulus (k/E, mm⁴/rad·mm⁻¹), as the member's I is: the columns creep as the member does */
  springs?: number[]
  /** unbalanced quasi-permanent loads, gravity positive */
  loads: BeamLoad[]
  Ecm: number
  /** creep coefficient φ(∞, t0) (Annex B) */
  phi: number
  /** uncracked second moment, one value or one per span, mm⁴ */
  I: number | number[]
  /** omit for an uncracked member; one entry or one per span */
  cracking?: SpanCracking | SpanCracking[]
  /** β of eq. (7.19): 1.0 single short-term load, 0.5 sustained (default) */
  beta?: number
  /** span/ratio limits: total 250 (7.4.1(4)), after construction 500 (7.4.1(5)) */
  ratioTotal?: number
  ratioAfter?: number
  /** engineer's own limit on the long-term deflection, mm */
  limit?: number | null
  /** stations per span (even) */
  stations?: number
}

export interface SpanDeflection {
  span: number
  L: number
  /** largest downward (positive) and upward (negative) deflection, mm, and where (x from the span's left support) */
  shortTerm: { down: number; up: number; at: number }
  longTerm: { down: number; up: number; at: number }
  /** long-term minus short-term: the part after the partitions and finishes are in place (common practice), mm */
  afterConstruction: number
  limitTotal: number
  limitAfter: number
  limitEngineer: number | null
  /** largest of |long-term| / limit-total, after / limit-after, |long-term| / engineer's limit */
  utilisation: number
  cracked: boolean
  /** the span is a cantilever: its deflection is the tip's, its limits taken on twice the overhang */
  cantilever: boolean
}

export interface DeflectionResult {
  EcEff: number
  spans: SpanDeflection[]
  /** sampled for figures: global x, span index, short- and long-term deflection */
  series: { x: number[]; span: number[]; shortTerm: number[]; longTerm: number[] }
}

function perSpan<T>(v: T | T[], n: number, field: string): T[] {
  if (!Array.isArray(v)) return Array.from({ length: n }, () => v)
  if (v.length !== n) throw new EngineInputError(field, `give one value per span (${n})`)
  return v
}

/** Distribution coefficient ζ = 1 − β(σsr/σs)², EN 1992-1-1 eq. (7.19); 0 when uncracked. */
export function distributionCoefficient(beta: number, ratio: number): number {
  if (!(ratio >= 0) || !Number.isFinite(ratio)) throw new EngineInputError('ratio', 'σsr/σs must be a non-negative number')
  if (ratio >= 1) return 0 // uncracked: the cracking stress is not reached
  return 1 - beta * ratio * ratio // EN 1992-1-1 eq. (7.19)
}

/** α = ζ αII + (1 − ζ) αI, EN 1992-1-1 eq. (7.18). */
export function interpolate(zeta: number, uncracked: number, cracked: number): number {
  return zeta * cracked + (1 - zeta) * uncracked // EN 1992-1-1 eq. (7.18)
}

/** ∫κ and ∫∫κ from x = 0 at equal stations (trapezoidal rule). */
function integrals(kappa: number[], L: number): { slope: number[]; I2: number[] } {
  const n = kappa.length - 1
  const h = L / n
  const slope: number[] = [0]
  for (let j = 1; j <= n; j++) slope.push((slope[j - 1] as number) + ((kappa[j - 1] as number) + (kappa[j] as number)) * h / 2) // ∫κ, trapezoidal rule
  const I2: number[] = [0]
  for (let j = 1; j <= n; j++) I2.push((I2[j - 1] as number) + ((slope[j - 1] as number) + (slope[j] as number)) * h / 2) // ∫∫κ
  return { slope, I2 }
}

/** Deflection w(x) of one span from curvatures at equal stations: w'' = −κ, w(0) = w(L) = 0. */
export function deflectionFromCurvature(kappa: number[], L: number): number[] {
  const n = kappa.length - 1
  const { I2 } = integrals(kappa, L)
  const end = I2[n] as number
  return I2.map((v, j) => -v + (end * j) / n) // the chord term restores w(L) = 0
}

/** Slopes w' at the two ends of a span supported at both, from its curvatures (w = −∫∫κ + x·end/L). */
export function endSlopes(kappa: number[], L: number): { start: number; end: number } {
  const n = kappa.length - 1
  const { slope, I2 } = integrals(kappa, L)
  const chord = (I2[n] as number) / L
  return { start: chord, end: -(slope[n] as number) + chord }
}

/**
 * Deflection of a cantilever from its curvatures, w'' = −κ, with w = 0 and w' = rootSlope at the
 * root: at x = L for a cantilever on the left of the member ('left'), at x = 0 on the right.
 */
export function cantileverDeflection(kappa: number[], L: number, side: 'left' | 'right', rootSlope: number): number[] {
  const n = kappa.length - 1
  const { slope, I2 } = integrals(kappa, L)
  if (side === 'right') return I2.map((v, j) => rootSlope * ((L * j) / n) - v) // w = θ·x − ∫∫κ
  // root at L: w(x) = w'(L)·(x − L) − [∫∫κ(x) − ∫∫κ(L) − ∫κ(L)·(x − L)]
  const SL = slope[n] as number
  const IL = I2[n] as number
  return I2.map((v, j) => {
    const d = (L * j) / n - L
    return rootSlope * d - (v - IL - SL * d)
  })
}

export function memberDeflection(i: DeflectionInput): DeflectionResult {
  const n = i.spans.length
  requirePositive('Ecm', i.Ecm)
  requireRange('phi', i.phi, 0, 10, 'the creep coefficient must lie between 0 and 10')
  const Is = perSpan(i.I, n, 'I')
  Is.forEach((v, k) => requirePositive(`I.${k}`, v))
  const cracking = i.cracking === undefined ? null : perSpan(i.cracking, n, 'cracking')
  cracking?.forEach((c, k) => {
    requireNonNegative(`cracking.${k}.McrSagging`, c.McrSagging)
    requireNonNegative(`cracking.${k}.McrHogging`, c.McrHogging)
    requirePositive(`cracking.${k}.IcrSagging`, c.IcrSagging)
    requirePositive(`cracking.${k}.IcrHogging`, c.IcrHogging)
  })
  const beta = i.beta ?? 0.5
  requireRange('beta', beta, 0.5, 1, 'β is 1.0 for a single short-term load and 0.5 for sustained loads (7.4.3(3))')
  const ratioTotal = requirePositive('ratioTotal', i.ratioTotal ?? 250)
  const ratioAfter = requirePositive('ratioAfter', i.ratioAfter ?? 500)
  if (i.limit !== undefined && i.limit !== null) requirePositive('limit', i.limit)
  const stations = Math.max(20, Math.round((i.stations ?? 100) / 2) * 2)
  const EcEff = i.Ecm / (1 + i.phi) // EN 1992-1-1 eq. (7.20)
  // moments do not depend on a uniform modulus, only on the relative stiffness of the spans
  const beam = analyseContinuousBeam({ spans: i.spans, EI: Is, ...(i.supports ? { supports: i.supports } : {}), ...(i.springs ? { springs: i.springs } : {}), loads: i.loads })
  const series = { x: [] as number[], span: [] as number[], shortTerm: [] as number[], longTerm: [] as number[] }
  const free = (j: number): boolean => i.supports?.[j] === 'free'
  const sideOf = (s: number): 'left' | 'right' | null => (s === 0 && free(0) ? 'left' : s === n - 1 && free(n) ? 'right' : null)
  const xs = (L: number): number[] => Array.from({ length: stations + 1 }, (_, j) => (L * j) / stations)
  const crackedSpans = new Set<number>()
  /** curvatures of span s under modulus E, interpolated where it cracks (7.4.3) */
  const curvatures = (s: number, E: number): number[] => {
    const L = i.spans[s] as number
    const I = Is[s] as number
    const c = cracking?.[s] ?? null
    return xs(L).map((x) => {
      const M = beam.momentAt(s, x)
      const uncr = M / (E * I)
      if (!c) return uncr
      const Mcr = M >= 0 ? c.McrSagging : c.McrHogging
      const Icr = M >= 0 ? c.IcrSagging : c.IcrHogging
      const zeta = Math.abs(M) > 0 ? distributionCoefficient(beta, Mcr / Math.abs(M)) : 0
      if (zeta > 0) crackedSpans.add(s)
      return interpolate(zeta, uncr, M / (E * Icr)) // EN 1992-1-1 eq. (7.18)
    })
  }
  /** w along span s under modulus E: between supports, or a cantilever from the slope at its root */
  const deflected = (s: number, E: number): number[] => {
    const L = i.spans[s] as number
    const side = sideOf(s)
    if (!side) return deflectionFromCurvature(curvatures(s, E), L)
    const back = side === 'left' ? 1 : n - 2
    const root = side === 'left' ? 1 : n - 1
    let rootSlope: number
    if (back >= 0 && back < n && !sideOf(back)) {
      const ends = endSlopes(curvatures(back, E), i.spans[back] as number) // slope continuity over the root support
      rootSlope = side === 'left' ? ends.start : ends.end
    } else {
      rootSlope = -(beam.rotations[root] as number) / E // the support's rotation (counter-clockwise +) with w downward: w' = −θ
    }
    return cantileverDeflection(curvatures(s, E), L, side, rootSlope)
  }
  let x0 = 0
  const spans = i.spans.map((L, s) => {
    const side = sideOf(s)
    const xs = Array.from({ length: stations + 1 }, (_, j) => (L * j) / stations)
    const wShort = deflected(s, i.Ecm)
    const wLong = deflected(s, EcEff)
    const extreme = (w: number[]): { down: number; up: number; at: number } => {
      let down = 0
      let up = 0
      let at = L / 2
      w.forEach((v, j) => {
        if (v > down) {
          down = v
          at = xs[j] as number
        }
        if (v < up) up = v
      })
      return { down, up, at }
    }
    const shortTerm = extreme(wShort)
    const longTerm = extreme(wLong)
    const afterConstruction = Math.max(...wLong.map((v, j) => Math.abs(v - (wShort[j] as number))))
    const Lref = side ? 2 * L : L // a cantilever: twice the overhang (common practice)
    const limitTotal = Lref / ratioTotal // EN 1992-1-1 7.4.1(4): span/250 under quasi-permanent loads
    const limitAfter = Lref / ratioAfter // EN 1992-1-1 7.4.1(5): span/500 after construction
    const limitEngineer = i.limit ?? null
    const longMax = Math.max(longTerm.down, -longTerm.up)
    const utilisation = Math.max(longMax / limitTotal, afterConstruction / limitAfter, limitEngineer ? longMax / limitEngineer : 0)
    xs.forEach((x, j) => {
      if (s > 0 && j === 0) return
      series.x.push(x0 + x)
      series.span.push(s)
      series.shortTerm.push(wShort[j] as number)
      series.longTerm.push(wLong[j] as number)
    })
    x0 += L
    return { span: s, L, shortTerm, longTerm, afterConstruction, limitTotal, limitAfter, limitEngineer, utilisation, cracked: crackedSpans.has(s), cantilever: side !== null }
  })
  return { EcEff, spans, series }
}
