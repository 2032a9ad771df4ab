/**
 * Elastic section analysis under an axial compression N (at the gross centroid) and a moment M,
 * concrete without tensile strength when it cracks, steel layers linear (EN 1992-1-1 7.1(2), 7.3.4(1)
 * "stress in the tension reinforcement assuming a cracked section"). With the prestress taken as the
 * external N and its total moment in M, a bonded tendon layer gives the stress change from the state
 * of zero concrete strain at its level (Δσp of 7.3.4(1)). Depths are from the compression face;
 * M positive compresses that face. N, mm, MPa.
 */
import { EngineInputError } from '../contract'
import type { SectionOutline } from '../uls/bending'
import { requireNonNegative, requirePositive, requireRange } from '../common/guards'
import { bisect } from '../common/numeric'

export interface SteelLayer {
  A: number
  /** depth below the compression face, mm */
  d: number
  E: number
}

export interface CrackedSectionInput {
  section: SectionOutline
  /** which face is in compression: 'sagging' top, 'hogging' bottom */
  face: 'sagging' | 'hogging'
  Ec: number
  steel: SteelLayer[]
  /** axial compression at the gross centroid, N (≥ 0) */
  N: number
  /** moment about the gross centroid compressing the chosen face, N·mm (≥ 0) */
  M: number
}

export interface CrackedSectionResult {
  cracked: boolean
  /** neutral-axis depth from the compression face; the section depth or more when uncracked, mm */
  x: number | null
  /** curvature, 1/mm (positive: compression face shortens) */
  curvature: number
  /** concrete stress at the compression face, MPa (compression +) */
  sigmaCFace: number
  /** concrete stress at the other face, MPa (compression +; negative only when uncracked) */
  sigmaCOther: number
  /** stress in each steel layer, tension +, MPa */
  steelStress: number[]
}

function layers(section: SectionOutline, face: 'sagging' | 'hogging'): Array<[number, number, number]> {
  // [from, to, width] measured from the compression face
  if (section.kind === 'rectangle') return [[0, section.h, section.b]]
  const top: Array<[number, number, number]> = [[0, section.hf, section.bf], [section.hf, section.h, section.bw]]
  if (face === 'sagging') return top
  return [[0, section.h - section.hf, section.bw], [section.h - section.hf, section.h, section.bf]]
}

/** ∫ y^n b(y) dy from 0 to s over the layered outline. */
function moment(ls: Array<[number, number, number]>, s: number, n: 0 | 1 | 2): number {
  let sum = 0
  for (const [a, b, w] of ls) {
    const hi = Math.min(b, s)
    if (hi <= a) continue
    sum += (w * (hi ** (n + 1) - a ** (n + 1))) / (n + 1)
  }
  return sum
}

export function crackedSection(i: CrackedSectionInput): CrackedSectionResult {
  requirePositive('Ec', i.Ec)
  requireNonNegative('N', i.N)
  requireNonNegative('M', i.M)
  requirePositive('section.h', i.section.h)
  const h = i.section.h
  i.steel.forEach((s, k) => {
    requireNonNegative(`steel.${k}.A`, s.A)
    requireRange(`steel.${k}.d`, s.d, 0, h, 'the steel must lie within the section depth')
    requirePositive(`steel.${k}.E`, s.E)
  })
  if (i.N === 0 && i.steel.every((s) => s.A === 0)) throw new EngineInputError('steel', 'a cracked section needs steel or an axial force')
  const ls = layers(i.section, i.face)
  const area = moment(ls, h, 0)
  const yc = moment(ls, h, 1) / area // gross centroid below the compression face
  // uncracked: ε(y) = εf − κ y over the whole transformed section (plane sections)
  const A0 = i.Ec * area + i.steel.reduce((s, l) => s + l.E * l.A, 0)
  const A1 = i.Ec * moment(ls, h, 1) + i.steel.reduce((s, l) => s + l.E * l.A * l.d, 0)
  const A2 = i.Ec * moment(ls, h, 2) + i.steel.reduce((s, l) => s + l.E * l.A * l.d * l.d, 0)
  // N = εf A0 − κ A1 ; M = εf (yc A0 − A1) − κ (yc A1 − A2)
  const a11 = A0, a12 = -A1, a21 = yc * A0 - A1, a22 = -(yc * A1 - A2)
  const det = a11 * a22 - a12 * a21
  const epsF = (i.N * a22 - a12 * i.M) / det
  const kappaU = (a11 * i.M - a21 * i.N) / det
  const otherU = i.Ec * (epsF - kappaU * h)
  if (otherU >= 0) {
    return { cracked: false, x: null, curvature: kappaU, sigmaCFace: i.Ec * epsF, sigmaCOther: otherU, steelStress: i.steel.map((l) => -l.E * (epsF - kappaU * l.d)) }
  }
  // cracked: ε(y) = κ (x − y) above the neutral axis, no concrete below it
  const S = (x: number): number => i.Ec * (x * moment(ls, x, 0) - moment(ls, x, 1)) + i.steel.reduce((s, l) => s + l.E * l.A * (x - l.d), 0)
  const T = (x: number): number =>
    i.Ec * (x * yc * moment(ls, x, 0) - (x + yc) * moment(ls, x, 1) + moment(ls, x, 2)) + i.steel.reduce((s, l) => s + l.E * l.A * (x - l.d) * (yc - l.d), 0)
  const g = (x: number): number => i.N * T(x) - i.M * S(x)
  const lo = 1e-6 * h
  if (Math.sign(g(lo)) === Math.sign(g(h))) throw new EngineInputError('M', 'no cracked equilibrium exists for this moment (more moment than the section can carry elastically)')
  const x = bisect(g, lo, h, 200)
  const Tx = T(x)
  const kappa = Math.abs(Tx) > 0 ? i.M / Tx : i.N / S(x)
  return { cracked: true, x, curvature: kappa, sigmaCFace: i.Ec * kappa * x, sigmaCOther: 0, steelStress: i.steel.map((l) => l.E * kappa * (l.d - x)) }
}
