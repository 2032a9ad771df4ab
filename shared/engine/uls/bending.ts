/**
 * Bending resistance of a prestressed section at the ultimate limit state (EN 1992-1-1 6.1):
 * rectangular stress block (3.1.7(3)), bonded tendons by strain compatibility with their prestrain
 * and the design curve of 3.3.6(7), passive bars in tension and compression with the curve of
 * 3.2.7(2), unbonded tendons at σpm,∞ + Δσp,ULS (5.10.8(2)). Depths d are measured from the
 * compression face; `face` says which face that is ('sagging': top, 'hogging': bottom), so a T or L
 * section with its flange at the top has the flange in compression in sagging and the web in
 * hogging. Forces N, lengths mm, stresses MPa, moments N·mm; strains are pure numbers, tension +.
 */
import { EngineInputError } from '../contract'
import { requireNonNegative, requirePositive, requireRange } from '../common/guards'
import { bisect } from '../common/numeric'

/** Rectangle, or a flanged (T/L) section with its flange at the top of the member. */
export type SectionOutline =
  | { kind: 'rectangle'; b: number; h: number }
  | { kind: 'flanged'; bw: number; h: number; bf: number; hf: number }

/** 'inclined': top branch rising to k·fyk/γs (bars) or fpk/γs (tendons) with a strain limit εud; 'horizontal': no strain limit. */
export type DesignBranch = 'inclined' | 'horizontal'

export interface TendonLayer {
  /** area of prestressing steel in the layer, mm² */
  Ap: number
  /** depth of the layer below the compression face, mm */
  d: number
  fpk: number
  fp01k: number
  Ep: number
  /** effective prestress after all losses at this section, MPa */
  sigmaPmInf: number
  bonded: boolean
  /** characteristic strain at maximum load; default 0.02/0.9 so that εud = 0.02 (3.3.6(7) note) */
  epsUk?: number
  /** unbonded only: stress increase at ULS, MPa (default 100, 5.10.8(2)) */
  deltaSigmaULS?: number
}

export interface BarLayer {
  /** area of the bars, mm² */
  As: number
  /** depth below the compression face, mm */
  d: number
  /** default 500 MPa */
  fyk?: number
  /** default 200 000 MPa (3.2.7(4)) */
  Es?: number
  /** ratio ft/fy, default 1.08 (Annex C Table C.1, class B) */
  k?: number
  /** default 0.05 (Annex C Table C.1, class B) */
  epsUk?: number
}

export interface BendingInput {
  section: SectionOutline
  face: 'sagging' | 'hogging'
  fck: number
  tendons: TendonLayer[]
  bars?: BarLayer[]
  branch?: DesignBranch
  /** default 1.5 (2.4.2.4 Table 2.1N) */
  gammaC?: number
  /** default 1.15 (Table 2.1N) */
  gammaS?: number
  /** default 1.0 (3.1.6(1) recommended) */
  alphaCC?: number
  /** design moment on this face (magnitude), N·mm; gives the utilisation and the steel needed */
  MEd?: number
  /** where bars would be added if the section is short; default the deepest layer */
  addedBar?: { d: number; fyk?: number }
}

export interface LayerState {
  d: number
  strain: number
  stress: number
  force: number
}

export interface BendingResult {
  MRd: number
  x: number
  /** depth of the resultant tension force below the compression face, mm */
  dTension: number
  xOverD: number
  /** 0.45 for fck ≤ 50, 0.35 above: the ductility limit of 5.6.3(2) used in practice for sections */
  xOverDLimit: number
  lambda: number
  eta: number
  fcd: number
  epsCu: number
  /** compression in the concrete block, N */
  Cc: number
  tendons: LayerState[]
  bars: LayerState[]
  /** false when even a full-depth block cannot balance the steel (over-reinforced section) */
  equilibrium: boolean
  /** true when a layer's strain passed εud on the inclined branch and its stress was held at εud */
  strainLimited: boolean
  utilisation: number | null
  /** extra bars needed at addedBar.d to reach MEd, mm²; 0 when not short; null when none suffices up to 0.04 Ac */
  AsRequired: number | null
}

/** Compression-zone widths from the compression face: [thickness, width][] */
function zoneLayers(section: SectionOutline, face: 'sagging' | 'hogging'): Array<[number, number]> {
  if (section.kind === 'rectangle') return [[section.h, section.b]]
  const layers: Array<[number, number]> = [[section.hf, section.bf], [section.h - section.hf, section.bw]]
  return face === 'sagging' ? layers : layers.reverse()
}

/** Area and first moment (about the compression face) of the zone of depth s. */
function zoneArea(layers: Array<[number, number]>, s: number): { area: number; moment: number } {
  let top = 0
  let area = 0
  let moment = 0
  for (const [t, b] of layers) {
    const part = Math.max(0, Math.min(s, top + t) - top)
    area += part * b
    moment += part * b * (top + part / 2)
    top += t
  }
  return { area, moment }
}

export function sectionHeight(section: SectionOutline): number {
  return section.h
}

export function grossArea(section: SectionOutline): number {
  return section.kind === 'rectangle' ? section.b * section.h : section.bf * section.hf + section.bw * (section.h - section.hf)
}

function validateSection(s: SectionOutline): void {
  requirePositive('section.h', s.h)
  if (s.kind === 'rectangle') requirePositive('section.b', s.b)
  else {
    requirePositive('section.bw', s.bw)
    requirePositive('section.bf', s.bf)
    requirePositive('section.hf', s.hf)
    if (s.hf >= s.h) throw new EngineInputError('section.hf', 'the flange must be thinner than the section')
    if (s.bf < s.bw) throw new EngineInputError('section.bf', 'the flange must be at least as wide as the web')
  }
}

/** Stress block factors λ and η and the ultimate strain εcu3 (EN 1992-1-1 3.1.7(3), Table 3.1). */
export function stressBlock(fck: number): { lambda: number; eta: number; epsCu: number } {
  requireRange('fck', fck, 12, 90, 'fck must lie between 12 and 90 MPa (EN 1992-1-1 Table 3.1)')
  const lambda = fck <= 50 ? 0.8 : 0.8 - (fck - 50) / 400 // EN 1992-1-1 eqs. (3.19), (3.20)
  const eta = fck <= 50 ? 1.0 : 1.0 - (fck - 50) / 200 // EN 1992-1-1 eqs. (3.21), (3.22)
  const epsCu = fck <= 50 ? 0.0035 : (2.6 + 35 * ((90 - fck) / 100) ** 4) / 1000 // EN 1992-1-1 Table 3.1, εcu3
  return { lambda, eta, epsCu }
}

/** Design stress of reinforcing steel at strain ε (tension +), EN 1992-1-1 3.2.7(2) Fig. 3.8. */
export function barDesignStress(eps: number, bar: Required<Omit<BarLayer, 'As' | 'd'>>, branch: DesignBranch, gammaS: number): { stress: number; limited: boolean } {
  const fyd = bar.fyk / gammaS // EN 1992-1-1 3.2.7(2)
  const epsYd = fyd / bar.Es
  const a = Math.abs(eps)
  let s: number
  let limited = false
  if (a <= epsYd) s = bar.Es * a
  else if (branch === 'horizontal') s = fyd // 3.2.7(2) b): horizontal top branch, no strain limit
  else {
    const epsUd = 0.9 * bar.epsUk // 3.2.7(2) note 1: εud = 0.9 εuk recommended
    limited = a > epsUd
    const e = Math.min(a, epsUd)
    s = fyd + ((e - epsYd) * (bar.k * fyd - fyd)) / (bar.epsUk - epsYd) // 3.2.7(2) a): line to k·fyk/γs at εuk
  }
  return { stress: Math.sign(eps) * s, limited }
}

/** Design stress of prestressing steel at total strain ε, EN 1992-1-1 3.3.6(7) Fig. 3.10. */
export function tendonDesignStress(eps: number, t: { fpk: number; fp01k: number; Ep: number; epsUk?: number }, branch: DesignBranch, gammaS: number): { stress: number; limited: boolean } {
  const fpd = t.fp01k / gammaS // EN 1992-1-1 3.3.6(6): fpd = fp0.1k/γs
  const epsPd = fpd / t.Ep
  if (eps <= epsPd) return { stress: t.Ep * eps, limited: false } // elastic part (compression too)
  if (branch === 'horizontal') return { stress: fpd, limited: false } // 3.3.6(7) b)
  const epsUk = t.epsUk ?? 0.02 / 0.9
  const epsUd = 0.9 * epsUk // 3.3.6(7) note: εud = 0.9 εuk (0.02 when not known)
  const e = Math.min(eps, epsUd)
  const stress = fpd + ((e - epsPd) * (t.fpk / gammaS - fpd)) / (epsUk - epsPd) // 3.3.6(7) a): line to fpk/γs at εuk
  return { stress, limited: eps > epsUd }
}

const BAR_DEFAULTS = { fyk: 500, Es: 200000, k: 1.08, epsUk: 0.05 }

function validate(input: BendingInput): void {
  validateSection(input.section)
  const h = input.section.h
  input.tendons.forEach((t, i) => {
    const f = `tendons.${i}`
    requireNonNegative(`${f}.Ap`, t.Ap)
    requireRange(`${f}.d`, t.d, 0, h, 'the tendon must lie within the section depth')
    requirePositive(`${f}.fpk`, t.fpk)
    requirePositive(`${f}.fp01k`, t.fp01k)
    if (t.fp01k > t.fpk) throw new EngineInputError(`${f}.fp01k`, 'fp0.1k cannot exceed fpk')
    requirePositive(`${f}.Ep`, t.Ep)
    requireRange(`${f}.sigmaPmInf`, t.sigmaPmInf, 0, t.fp01k, 'the effective prestress must lie between 0 and fp0.1k')
    if (t.epsUk !== undefined) requireRange(`${f}.epsUk`, t.epsUk, t.fp01k / t.Ep, 0.2, 'εuk must exceed the yield strain')
    if (t.deltaSigmaULS !== undefined) requireNonNegative(`${f}.deltaSigmaULS`, t.deltaSigmaULS)
  })
  ;(input.bars ?? []).forEach((b, i) => {
    const f = `bars.${i}`
    requireNonNegative(`${f}.As`, b.As)
    requireRange(`${f}.d`, b.d, 0, h, 'the bar must lie within the section depth')
    if (b.fyk !== undefined) requireRange(`${f}.fyk`, b.fyk, 200, 700, 'fyk must lie between 200 and 700 MPa (3.2.2(3))')
    if (b.Es !== undefined) requirePositive(`${f}.Es`, b.Es)
    if (b.k !== undefined) requireRange(`${f}.k`, b.k, 1, 1.5, 'k = ft/fy must lie between 1.0 and 1.5')
    if (b.epsUk !== undefined) requireRange(`${f}.epsUk`, b.epsUk, 0.01, 0.2, 'εuk must lie between 1 % and 20 %')
  })
  if (input.tendons.length === 0 && (input.bars ?? []).length === 0) throw new EngineInputError('tendons', 'give at least one tendon or bar layer')
  if (input.gammaC !== undefined) requireRange('gammaC', input.gammaC, 1, 2, 'γc must lie between 1.0 and 2.0')
  if (input.gammaS !== undefined) requireRange('gammaS', input.gammaS, 1, 1.5, 'γs must lie between 1.0 and 1.5')
  if (input.alphaCC !== undefined) requireRange('alphaCC', input.alphaCC, 0.8, 1, 'αcc must lie between 0.8 and 1.0 (3.1.6(1))')
  if (input.MEd !== undefined) requireNonNegative('MEd', input.MEd)
  if (input.addedBar !== undefined) requireRange('addedBar.d', input.addedBar.d, 0, h, 'the added bars must lie within the section depth')
}

interface Solved {
  MRd: number
  x: number
  Cc: number
  dTension: number
  tendons: LayerState[]
  bars: LayerState[]
  equilibrium: boolean
  strainLimited: boolean
}

function solve(input: BendingInput, fcd: number, block: { lambda: number; eta: number; epsCu: number }): Solved {
  const branch = input.branch ?? 'inclined'
  const gammaS = input.gammaS ?? 1.15
  const layers = zoneLayers(input.section, input.face)
  const h = input.section.h
  const bars = (input.bars ?? []).map((b) => ({ ...BAR_DEFAULTS, ...b }))
  const { lambda, eta, epsCu } = block
  const state = (x: number): Solved => {
    const zone = zoneArea(layers, Math.min(lambda * x, h))
    let Cc = eta * fcd * zone.area // EN 1992-1-1 3.1.7(3): uniform η·fcd over λx
    let McFace = eta * fcd * zone.moment
    let limitedAny = false
    const tendons = input.tendons.map((t) => {
      let strain: number
      let stress: number
      if (t.bonded) {
        strain = t.sigmaPmInf / t.Ep + (epsCu * (t.d - x)) / x // prestrain + flexural strain (compatibility; decompression strain neglected)
        const r = tendonDesignStress(strain, t, branch, gammaS)
        stress = r.stress
        limitedAny ||= r.limited
      } else {
        stress = Math.min(t.sigmaPmInf + (t.deltaSigmaULS ?? 100), t.fp01k / gammaS) // EN 1992-1-1 5.10.8(2), capped at fpd
        strain = stress / t.Ep
      }
      return { d: t.d, strain, stress, force: t.Ap * stress }
    })
    const barStates = bars.map((b) => {
      const strain = (epsCu * (b.d - x)) / x // plane sections (6.1(2))
      const r = barDesignStress(strain, b, branch, gammaS)
      limitedAny ||= r.limited
      if (b.d < lambda * x) {
        Cc -= b.As * eta * fcd // concrete displaced by bars inside the block
        McFace -= b.As * eta * fcd * b.d
      }
      return { d: b.d, strain, stress: r.stress, force: b.As * r.stress }
    })
    const steel = [...tendons, ...barStates]
    const Msteel = steel.reduce((s, l) => s + l.force * l.d, 0)
    const tension = steel.filter((l) => l.force > 0)
    const Tpos = tension.reduce((s, l) => s + l.force, 0)
    const dTension = Tpos > 0 ? tension.reduce((s, l) => s + l.force * l.d, 0) / Tpos : Math.max(...steel.map((l) => l.d))
    // moments about the compression face: tension forces × depth − concrete force × its depth
    return { MRd: Msteel - McFace, x, Cc, dTension, tendons, bars: barStates, equilibrium: true, strainLimited: limitedAny }
  }
  const net = (x: number): number => {
    const s = state(x)
    return s.Cc - [...s.tendons, ...s.bars].reduce((a, l) => a + l.force, 0)
  }
  const xMax = h / lambda
  if (net(xMax) < 0) {
    const s = state(xMax)
    return { ...s, equilibrium: false }
  }
  const x = bisect(net, 1e-6 * h, xMax, 64)
  return state(x)
}

export function bendingResistance(input: BendingInput): BendingResult {
  validate(input)
  const block = stressBlock(input.fck)
  const fcd = ((input.alphaCC ?? 1.0) * input.fck) / (input.gammaC ?? 1.5) // EN 1992-1-1 eq. (3.15)
  const s = solve(input, fcd, block)
  const MEd = input.MEd
  const utilisation = MEd === undefined ? null : s.MRd > 0 ? MEd / s.MRd : MEd > 0 ? 1e9 : 0
  let AsRequired: number | null = null
  if (MEd !== undefined) {
    if (MEd <= s.MRd) AsRequired = 0
    else {
      const deepest = Math.max(...input.tendons.map((t) => t.d), ...(input.bars ?? []).map((b) => b.d))
      const added: BarLayer = { As: 0, d: input.addedBar?.d ?? deepest, ...(input.addedBar?.fyk !== undefined ? { fyk: input.addedBar.fyk } : {}) }
      const AsMax = 0.04 * grossArea(input.section) // 9.2.1.1(3): As,max = 0.04 Ac
      const withAs = (As: number): Solved => solve({ ...input, bars: [...(input.bars ?? []), { ...added, As }] }, fcd, block)
      const top = withAs(AsMax)
      if (top.equilibrium && top.MRd >= MEd) AsRequired = bisect((As) => withAs(As).MRd - MEd, 0, AsMax, 40)
    }
  }
  return {
    MRd: s.MRd,
    x: s.x,
    dTension: s.dTension,
    xOverD: s.x / s.dTension,
    xOverDLimit: input.fck <= 50 ? 0.45 : 0.35, // EN 1992-1-1 5.6.3(2): xu/d ≤ 0.45 (≤ C50/60), 0.35 above
    lambda: block.lambda,
    eta: block.eta,
    fcd,
    epsCu: block.epsCu,
    Cc: s.Cc,
    tendons: s.tendons,
    bars: s.bars,
    equilibrium: s.equilibrium,
    strainLimited: s.strainLimited,
    utilisation,
    AsRequired,
  }
}
