/**
 * Least bonded reinforcement for crack control, EN 1992-1-1 7.3.2, face by face: where the
 * characteristic combination (characteristic prestress) puts a face in tension beyond fct,eff
 * (7.3.2(4)), As,min of eq. (7.1) over the concrete in tension just before the first crack, with kc
 * of eq. (7.2) for a rectangle or web and eq. (7.3) for a flange, and k for the web depth or the
 * flange width. σs is lowered from fyk to the stress at which the bars provided meet Table 7.2N with
 * eq. (7.6N) (7.3.2(2) Note, 7.3.3(2)); Table 7.3N gives the bar spacing to keep at that stress.
 * The bonded tendons' share of 7.3.2(3) is left out (conservative).
 */
import type { CheckResult } from '../contract'
import { ratioCheck, atStation } from '../common/check'
import type { MemberInput } from '../input/schema'
import {
  crackSizeFactor, kcFlange, kcWeb, maxBarDiameter, maxBarSpacing, steelStressForBarSize,
} from '../sls/crack-control-steel'
import type { CrackWidthColumn } from '../sls/crack-control-steel'
import type { MemberSection } from './section'
import type { ServiceStresses } from './stress-limits'

export interface CrackSteelFace {
  face: 'bottom' | 'top'
  /** greatest tension of the uncracked section under the characteristic combination, MPa (tension +) */
  tension: number
  location: string
  /** false where 7.3.2(4) waives the steel (tension within fct,eff) or the precompression keeps kc at 0 */
  required: boolean
  /** mean precompression from the characteristic prestress rinf·Pm, eq. (7.4), MPa */
  sigmaC: number
  /** depth of the tensile zone just before the first crack, from the face, mm */
  hct: number
  /** concrete in tension just before the first crack, mm² */
  Act: number
  /** kc of the part that governs (web or rectangle, else flange) */
  kc: number
  k: number
  /** steel stress taken in eq. (7.1), MPa */
  sigmaS: number
  AsMin: number
  provided: number
  barDiameter: number
  /** Table 7.3N bar spacing at σs, mm; null without a crack width limit or beyond the table */
  maxSpacing: number | null
  /** bar spacing of a slab strip's bars (1 m width over the bar count), mm; null for a beam */
  spacing: number | null
}

export interface CrackSteelInput {
  input: MemberInput
  section: MemberSection
  stresses: ServiceStresses
  /** mean service force along the member, N */
  Pmean: number
  wmax: number | null
}

/** Column of Tables 7.2N/7.3N for a crack width limit: the largest of 0.2, 0.3, 0.4 mm not above it (0.2 below 0.2). */
function tableColumn(wmax: number): CrackWidthColumn {
  if (wmax >= 0.4) return 0.4
  if (wmax >= 0.3) return 0.3
  return 0.2
}

/** One part of the tensile zone (web or rectangle, or flange) with its share kc·k·fct,eff·Act of eq. (7.1). */
interface ZonePart {
  Act: number
  kc: number
  k: number
}

/**
 * The tensile zone just before cracking, split into its parts. The stress is linear: fct,eff at the
 * tension face, −σc at the centroid (Navier), so the zone is yFace·fct,eff/(fct,eff + σc) deep.
 */
function tensileZone(o: MemberSection['outline'], face: 'bottom' | 'top', yFace: number, sigmaC: number, fctEff: number): { hct: number; parts: ZonePart[] } {
  const h = o.h
  const hct = sigmaC <= -fctEff ? h : Math.min(h, (yFace * fctEff) / (fctEff + sigmaC)) // linear stress, fct,eff at the face
  if (o.kind === 'rectangle') {
    const Act = o.b * hct
    return { hct, parts: [{ Act, kc: kcWeb({ b: o.b, h, NEd: sigmaC * o.b * h, fctEff }), k: crackSizeFactor(h) }] } // 7.3.2(2), eq. (7.2)
  }
  const web = (depth: number): ZonePart => ({ Act: o.bw * depth, kc: kcWeb({ b: o.bw, h, NEd: sigmaC * o.bw * h, fctEff }), k: crackSizeFactor(h) }) // eq. (7.2) on the web
  const flange = (from: number, to: number): ZonePart => {
    // tensile force in the flange just before cracking: the linear stress integrated over [from, to] from the face
    const stress = (d: number): number => fctEff * (1 - d / hct)
    const Act = o.bf * (to - from)
    const Fcr = (o.bf * (to - from) * (stress(from) + stress(to))) / 2
    return { Act, kc: kcFlange({ Fcr, Act, fctEff }), k: crackSizeFactor(o.bf) } // eq. (7.3); k by the flange width
  }
  const parts: ZonePart[] = []
  if (face === 'top') {
    parts.push(flange(0, Math.min(hct, o.hf)))
    if (hct > o.hf) parts.push(web(hct - o.hf))
  }
  else {
    const webDepth = h - o.hf
    parts.push(web(Math.min(hct, webDepth)))
    if (hct > webDepth) parts.push(flange(webDepth, hct))
  }
  return { hct, parts }
}

/** As,min by eq. (7.1) for each face the characteristic combination puts in tension, and its checks. */
export function crackSteelFaces({ input, section, stresses, Pmean, wmax }: CrackSteelInput): { faces: CrackSteelFace[]; checks: CheckResult[] } {
  const sec = section.properties
  const o = section.outline
  const fctEff = section.at28.fctm // EN 1992-1-1 7.3.2(2): fct,eff = fctm
  const sigmaC = (stresses.rinf * Pmean) / sec.A // EN 1992-1-1 eq. (7.4) with the characteristic prestress rinf·Pm (5.10.9)
  const fyk = input.uls.fyk
  const faces: CrackSteelFace[] = []
  const checks: CheckResult[] = []
  for (const face of ['bottom', 'top'] as const) {
    // the section of greatest characteristic tension on this face (tension negative in the envelope)
    let worst: { tension: number; label: string; X: number } | null = null
    for (const s of stresses.sections) {
      const env = s.envelope.characteristic
      const t = -(face === 'bottom' ? env.bottomMin : env.topMin)
      if (t > 0 && (worst === null || t > worst.tension)) worst = { tension: t, label: s.label, X: s.X }
    }
    if (worst === null) continue // the face never goes into tension: no zone to control
    const bars = face === 'bottom' ? input.uls.barsBottom : input.uls.barsTop
    const location = atStation(worst.label, worst.X)
    const yFace = face === 'bottom' ? sec.yb : sec.yt
    const zone = tensileZone(o, face, yFace, sigmaC, fctEff)
    const governing = zone.parts[0] as ZonePart
    const spacing = section.isSlab && bars.area > 0 ? (1000 * Math.PI * bars.diameter ** 2) / 4 / bars.area : null
    const base = { face, tension: worst.tension, location, sigmaC, hct: zone.hct, Act: zone.parts.reduce((a, p) => a + p.Act, 0), kc: governing.kc, k: governing.k, provided: bars.area, barDiameter: bars.diameter, spacing }
    const title = `Least steel for crack control, ${face}`
    const waived = worst.tension <= fctEff // EN 1992-1-1 7.3.2(4): σct ≤ σct,p = fct,eff (recommended)
    if (waived || zone.parts.every((p) => p.kc === 0)) {
      faces.push({ ...base, required: false, sigmaS: fyk, AsMin: 0, maxSpacing: null })
      checks.push({
        id: `sls.crackSteel.${face}`, group: 'sls', title, clause: waived ? 'EN 1992-1-1 7.3.2(4)' : 'EN 1992-1-1 7.3.2(2), eq. (7.2)', location,
        actual: bars.area, limit: 0, unit: 'mm²', utilisation: 0, pass: true,
        note: waived
          ? `not required: the characteristic tension ${worst.tension.toFixed(2)} MPa stays within fct,eff = ${fctEff.toFixed(2)} MPa`
          : 'not required: the precompression keeps kc at 0',
      })
      continue
    }
    // σs: fyk, lowered so that the bars provided meet Table 7.2N through eq. (7.6N) (7.3.2(2) Note)
    const h = sec.h
    const dFace = bars.cover + bars.diameter / 2 // h − d
    let sigmaS = fyk
    let maxSpacing: number | null = null
    let tableNote = 'σs = fyk: no crack width limit applies'
    if (wmax !== null) {
      const col = tableColumn(wmax)
      const scale = maxBarDiameter({ phiStar: 1, fctEff, hcr: zone.hct, h, d: h - dFace, loading: 'bending', kc: governing.kc }) // φs per unit φ*s, eq. (7.6N)
      const allowed = steelStressForBarSize({ phiStar: bars.diameter / scale, wk: col })
      sigmaS = Math.min(fyk, allowed.sigmaS)
      maxSpacing = maxBarSpacing({ sigmaS, wk: col })
      tableNote = `σs = ${sigmaS.toFixed(0)} MPa: Table 7.2N (wk ${col} mm) for φ${bars.diameter} bars with eq. (7.6N)${allowed.beyondTable ? '; the bars are larger than the table allows at its least stress: use smaller bars' : ''}`
    }
    const AsMin = zone.parts.reduce((sum, p) => sum + p.kc * p.k * fctEff * p.Act, 0) / sigmaS // EN 1992-1-1 eq. (7.1), web and flange each with its kc and k
    faces.push({ ...base, required: true, sigmaS, AsMin, maxSpacing })
    const spacingNote = spacing !== null && maxSpacing !== null ? `; bars at ${spacing.toFixed(0)} mm, Table 7.3N allows ${maxSpacing.toFixed(0)} mm` : maxSpacing !== null ? `; keep the bars within ${maxSpacing.toFixed(0)} mm centres (Table 7.3N)` : ''
    checks.push(ratioCheck({
      id: `sls.crackSteel.${face}`, group: 'sls', title, clause: 'EN 1992-1-1 7.3.2 eq. (7.1), Table 7.2N', location,
      actual: bars.area, limit: AsMin, unit: 'mm²', atLeast: true,
      note: `${tableNote}; the bonded tendons' share (7.3.2(3)) left out${spacingNote}`,
    }))
  }
  return { faces, checks }
}
