/**
 * The stress conditions of a member, linearised for the proposal. For a given force the fibre
 * stresses are linear in the profile's eccentricities (the profile and its secondary moment are
 * linear in them), so each condition is a half-space; a point of the intersection is found by
 * cyclic projection onto the violated half-spaces (Kaczmarz's method, projections onto convex sets).
 */
import { at } from '../common/numeric'
import { eccentricityIn, resolveProfile } from '../prestress/profile'
import type { ProfilePiece, TendonProfile } from '../prestress/profile'
import { prestressMoments } from '../prestress/secondary'
import type { ServiceDesign } from './service-design'
import type { Station } from './stations'
import { STAGES, forceFactors } from './stress-limits'
import type { MomentRange, Stage } from './stress-limits'

/** e and the secondary moment per unit force at the sections, for a unit value of each profile ordinate. */
export interface ProfileBasis { phi: number[][]; psi: number[][] }

/** One unit profile per ordinate (each support, then each low point), evaluated at the stations ks. */
export function profileBasis(d: ServiceDesign, ks: number[]): ProfileBasis {
  const spans = d.input.geometry.spans
  const n = spans.length
  const m = 2 * n + 1
  const phi: number[][] = ks.map(() => new Array<number>(m).fill(0))
  const psi: number[][] = ks.map(() => new Array<number>(m).fill(0))
  for (let j = 0; j < m; j++) {
    const sup = spans.map(() => 0).concat(0)
    const spn = spans.map(() => 0)
    if (j <= n) sup[j] = 1
    else spn[j - n - 1] = 1
    const prof: TendonProfile = { ...d.profile.profile, supportEcc: sup, spanEcc: spn }
    const pcs = resolveProfile(prof)
    const ps = prestressMoments({ spans, EI: d.section.EI, supports: d.loads.supports, profile: prof, P: 1 })
    ks.forEach((k, r) => {
      const st = d.stations[k] as Station
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
export interface LinearModel { m: number; k: number; G: Float64Array; c0: Float64Array; c1: Float64Array; N2: Float64Array; boxMax: Float64Array }

export function linearModel(d: ServiceDesign, basis: ProfileBasis, margin: number): LinearModel {
  const rows: Array<{ g: number[]; c0: number; c1: number }> = []
  const { rsup, rinf, limits, momentsBySection } = d.stresses
  const rs = forceFactors(rsup, rinf)
  const sec = d.section.properties
  d.stresses.sections.forEach((s, r) => {
    const phi = basis.phi[r] as number[]
    const psi = basis.psi[r] as number[]
    const M = momentsBySection[r] as Record<Stage, MomentRange>
    for (const stage of STAGES) {
      const f = stage === 'transfer' ? d.losses.transfer : d.losses.service
      const P = stage === 'transfer' ? s.force.transfer : s.force.service
      const Pm = f.Pmean
      const L = limits[stage]
      for (const rr of rs) {
        for (const fibre of ['top', 'bottom'] as const) {
          const ke = fibre === 'top' ? -1 / sec.Zt : 1 / sec.Zb
          const kM = fibre === 'top' ? 1 / sec.Zt : -1 / sec.Zb
          const g = phi.map((v, j) => rr * P * ke * v + kM * rr * Pm * at(psi, j)) // dσ/dp per unit s
          if (g.every((v) => v === 0)) continue
          const mC = fibre === 'top' ? M[stage].max : M[stage].min
          const mT = fibre === 'top' ? M[stage].min : M[stage].max
          // σ = s·(rP/A + g·p) + kM·M within [−ft, fc], divided by s
          if (L.compression !== null) rows.push({ g, c0: L.compression - margin - kM * mC, c1: (rr * P) / sec.A })
          if (L.tension !== null) rows.push({ g: g.map((v) => -v), c0: L.tension - margin + kM * mT, c1: (-rr * P) / sec.A })
        }
      }
    }
  })
  const m = 2 * d.input.geometry.spans.length + 1
  const k = rows.length
  const G = new Float64Array(k * m)
  const c0 = new Float64Array(k)
  const c1 = new Float64Array(k)
  const N2 = new Float64Array(k)
  const boxMax = new Float64Array(k)
  const { top: eTop, bottom: eBot } = d.section.eccentricity
  rows.forEach((row, r) => {
    let n2 = 0
    let bm = 0
    row.g.forEach((g, j) => {
      G[r * m + j] = g
      n2 += g * g
      bm += Math.max(-g * eTop, g * eBot) // greatest g·p over the eccentricity box
    })
    c0[r] = row.c0
    c1[r] = row.c1
    N2[r] = n2
    boxMax[r] = bm
  })
  return { m, k, G, c0, c1, N2, boxMax }
}

/** Cyclic projection onto the violated rows at strand ratio s, within lo ≤ p ≤ hi. */
export function project(model: LinearModel, s: number, start: number[], lo: number, hi: number, sweeps: number): { p: number[]; violation: number } {
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
