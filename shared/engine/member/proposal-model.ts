/**
 * The stress conditions of a member, linearised for the proposal. For a given force the fibre
 * stresses are linear in the profile's eccentricities (the profile and its secondary moment are
 * linear in them), so each condition is a half-space; a point of the intersection is found by
 * cyclic projection onto the violated half-spaces (Kaczmarz's method, projections onto convex sets).
 */
import { continuousBeamModel } from '../analysis/continuous-beam'
import { equivalentLoadsOfSpans } from '../prestress/equivalent-loads'
import { eccentricityIn, spanPieces } from '../prestress/profile'
import type { TendonProfile } from '../prestress/profile'
import type { ServiceDesign } from './service-design'
import type { Station } from './stations'
import { STAGES, forceFactors } from './stress-limits'
import type { MomentRange, Stage } from './stress-limits'

/**
 * e and the secondary moment per unit force at the sections for a unit value of each profile
 * ordinate (each support, then each low point), sparse: section r's entries lie at
 * start[r]…start[r + 1] − 1, ordinate idx, e phi, secondary moment psi. A unit ordinate bends only
 * the spans it belongs to, and its secondary moment dies away geometrically along a continuous
 * beam, so an entry below RELATIVE_CUT of that ordinate's largest secondary moment is left out:
 * the rows stay short whatever the number of spans.
 */
export interface ProfileBasis { m: number; start: Int32Array; idx: Int32Array; phi: Float64Array; psi: Float64Array }

/** Secondary moments below this share of the unit ordinate's largest are dropped (far below any stress margin). */
const RELATIVE_CUT = 1e-9

export function profileBasis(d: ServiceDesign, ks: number[]): ProfileBasis {
  const spans = d.input.geometry.spans
  const n = spans.length
  const m = 2 * n + 1
  const model = continuousBeamModel({ spans, EI: d.section.spanEI, supports: d.loads.supports, ...(d.loads.springs ? { springs: d.loads.springs } : {}) }) // factored once for every unit profile
  const rowsOfSpan: number[][] = spans.map(() => [])
  ks.forEach((k, r) => (rowsOfSpan[(d.stations[k] as Station).span] as number[]).push(r))
  const entries: Array<{ j: number[]; phi: number[]; psi: number[] }> = ks.map(() => ({ j: [], phi: [], psi: [] }))
  const sup = new Array<number>(n + 1).fill(0)
  const spn = new Array<number>(n).fill(0)
  const starts = new Float64Array(n)
  const ends = new Float64Array(n)
  for (let j = 0; j < m; j++) {
    if (j <= n) sup[j] = 1
    else spn[j - n - 1] = 1
    const prof: TendonProfile = { ...d.profile.profile, supportEcc: sup, spanEcc: spn }
    const touched = j <= n ? [j - 1, j].filter((i) => i >= 0 && i < n) : [j - n - 1]
    const pieces = new Map(touched.map((i) => [i, spanPieces(prof, i)] as const))
    const beam = model.analyse(equivalentLoadsOfSpans(prof, 1, touched))
    // EN 1992-1-1 5.10.7: M2 = M − M1 with M1 = −P·e; linear along each span (reactions only)
    let scale = 0
    for (let i = 0; i < n; i++) {
      const ps = pieces.get(i)
      const L = spans[i] as number
      starts[i] = beam.momentAt(i, 0) + (ps ? eccentricityIn(ps, 0) : 0)
      ends[i] = beam.momentAt(i, L) + (ps ? eccentricityIn(ps, L) : 0)
      scale = Math.max(scale, Math.abs(starts[i] as number), Math.abs(ends[i] as number))
    }
    for (let i = 0; i < n; i++) {
      const ps = pieces.get(i)
      if (!ps && Math.max(Math.abs(starts[i] as number), Math.abs(ends[i] as number)) <= RELATIVE_CUT * scale) continue
      const L = spans[i] as number
      for (const r of rowsOfSpan[i] as number[]) {
        const x = (d.stations[ks[r] as number] as Station).x
        const e = entries[r] as { j: number[]; phi: number[]; psi: number[] }
        e.j.push(j)
        e.phi.push(ps ? eccentricityIn(ps, x) : 0)
        e.psi.push((starts[i] as number) * (1 - x / L) + ((ends[i] as number) * x) / L)
      }
    }
    if (j <= n) sup[j] = 0
    else spn[j - n - 1] = 0
  }
  const start = new Int32Array(ks.length + 1)
  entries.forEach((e, r) => (start[r + 1] = (start[r] as number) + e.j.length))
  const total = start[ks.length] as number
  const idx = new Int32Array(total)
  const phi = new Float64Array(total)
  const psi = new Float64Array(total)
  entries.forEach((e, r) => {
    const o = start[r] as number
    idx.set(e.j, o)
    phi.set(e.phi, o)
    psi.set(e.psi, o)
  })
  return { m, start, idx, phi, psi }
}

/**
 * The stress conditions of every section, stage, force factor and fibre as rows g·p ≤ c0/s − c1,
 * where p are the profile eccentricities and s the strands relative to the run linearised about
 * (the force and its secondary moment scale with s; the external moments do not). A row's g is
 * a·phi + b·psi of its section's basis, so the rows of one section share its entries.
 */
export interface LinearModel {
  m: number
  basis: ProfileBasis
  /** rows, grouped by section: section r's rows are rowStart[r]…rowStart[r + 1] − 1 */
  rowStart: Int32Array
  a: Float64Array
  b: Float64Array
  c0: Float64Array
  c1: Float64Array
  N2: Float64Array
  boxMax: Float64Array
  /** Gram entries of each section's basis: phi·phi, phi·psi, psi·psi */
  pp: Float64Array
  pq: Float64Array
  qq: Float64Array
}

export function linearModel(d: ServiceDesign, basis: ProfileBasis, margin: number): LinearModel {
  const rows: Array<{ a: number; b: number; c0: number; c1: number }> = []
  const { rsup, rinf, limits, momentsBySection } = d.stresses
  const rs = forceFactors(rsup, rinf)
  const sections = d.stresses.sections.length
  const rowStart = new Int32Array(sections + 1)
  d.stresses.sections.forEach((s, r) => {
    const M = momentsBySection[r] as Record<Stage, MomentRange>
    // over a drop: its own section, e smaller by the centroid's shift, and the secondary moment of the steps
    const ks = d.stresses.sectionStations[r] as number
    const local = d.section.at(s.span, s.x)
    const sec = local.properties
    const m2Steps = d.profile.shiftSecondaryPerUnitForce[ks] ?? 0
    for (const stage of STAGES) {
      const f = stage === 'transfer' ? d.losses.transfer : d.losses.service
      const P = stage === 'transfer' ? s.force.transfer : s.force.service
      const Pm = f.Pmean
      const L = limits[stage]
      for (const rr of rs) {
        for (const fibre of ['top', 'bottom'] as const) {
          const ke = fibre === 'top' ? -1 / sec.Zt : 1 / sec.Zb
          const kM = fibre === 'top' ? 1 / sec.Zt : -1 / sec.Zb
          const a = rr * P * ke // dσ/de per unit s (σ = P/A − P·e·y/I)
          const b = kM * rr * Pm // dσ/dM2 per unit s, the secondary moment of the mean force
          const mC = fibre === 'top' ? M[stage].max : M[stage].min
          const mT = fibre === 'top' ? M[stage].min : M[stage].max
          // σ = s·(rP/A + g·p) + kM·M within [−ft, fc], divided by s
          const fixed = (rr * P) / sec.A - a * local.shift + b * m2Steps // the parts that do not move with the profile
          if (L.compression !== null) rows.push({ a, b, c0: L.compression - margin - kM * mC, c1: fixed })
          if (L.tension !== null) rows.push({ a: -a, b: -b, c0: L.tension - margin + kM * mT, c1: -fixed })
        }
      }
    }
    rowStart[r + 1] = rows.length
  })
  const k = rows.length
  const { start, phi, psi } = basis
  const pp = new Float64Array(sections)
  const pq = new Float64Array(sections)
  const qq = new Float64Array(sections)
  for (let r = 0; r < sections; r++) {
    for (let t = start[r] as number; t < (start[r + 1] as number); t++) {
      pp[r] = (pp[r] as number) + (phi[t] as number) ** 2
      pq[r] = (pq[r] as number) + (phi[t] as number) * (psi[t] as number)
      qq[r] = (qq[r] as number) + (psi[t] as number) ** 2
    }
  }
  const a = new Float64Array(k)
  const b = new Float64Array(k)
  const c0 = new Float64Array(k)
  const c1 = new Float64Array(k)
  const N2 = new Float64Array(k)
  const boxMax = new Float64Array(k)
  const { top: eTop, bottom: eBot } = d.section.eccentricity
  for (let r = 0; r < sections; r++) {
    for (let q = rowStart[r] as number; q < (rowStart[r + 1] as number); q++) {
      const row = rows[q] as { a: number; b: number; c0: number; c1: number }
      a[q] = row.a
      b[q] = row.b
      c0[q] = row.c0
      c1[q] = row.c1
      N2[q] = row.a * row.a * (pp[r] as number) + 2 * row.a * row.b * (pq[r] as number) + row.b * row.b * (qq[r] as number)
      let bm = 0
      for (let t = start[r] as number; t < (start[r + 1] as number); t++) {
        const g = row.a * (phi[t] as number) + row.b * (psi[t] as number)
        bm += Math.max(-g * eTop, g * eBot) // greatest g·p over the eccentricity box
      }
      boxMax[q] = bm
    }
  }
  return { m: basis.m, basis, rowStart, a, b, c0, c1, N2, boxMax, pp, pq, qq }
}

/**
 * Cyclic projection onto the violated rows at strand ratio s, within lo ≤ p ≤ hi. A section's rows
 * share its entries, so phi·p and psi·p are formed once per section and kept up to date through the
 * Gram entries as its rows project: a sweep costs the basis entries, not the rows times the ordinates.
 */
export function project(model: LinearModel, s: number, start: number[], lo: number, hi: number, sweeps: number): { p: number[]; violation: number } {
  const { rowStart, a, b, c0, c1, N2, boxMax, pp, pq, qq } = model
  const { start: bStart, idx, phi, psi } = model.basis
  const sections = rowStart.length - 1
  const H = new Float64Array(a.length)
  // a section whose rows no point of the box can violate needs no projection
  const live: number[] = []
  for (let r = 0; r < sections; r++) {
    let any = false
    for (let q = rowStart[r] as number; q < (rowStart[r + 1] as number); q++) {
      H[q] = (c0[q] as number) / s - (c1[q] as number)
      if ((N2[q] as number) > 0 && (boxMax[q] as number) > (H[q] as number)) any = true
    }
    if (any) live.push(r)
  }
  const p = Float64Array.from(start, (v) => Math.min(hi, Math.max(lo, v)))
  const dots = (r: number): [number, number] => {
    let dp = 0
    let dq = 0
    for (let t = bStart[r] as number; t < (bStart[r + 1] as number); t++) {
      const v = p[idx[t] as number] as number
      dp += (phi[t] as number) * v
      dq += (psi[t] as number) * v
    }
    return [dp, dq]
  }
  for (let it = 0; it < sweeps; it++) {
    let violated = false
    for (const r of live) {
      let [dp, dq] = dots(r)
      for (let q = rowStart[r] as number; q < (rowStart[r + 1] as number); q++) {
        const n2 = N2[q] as number
        if (!(n2 > 0) || (boxMax[q] as number) <= (H[q] as number)) continue
        const aq = a[q] as number
        const bq = b[q] as number
        const v = aq * dp + bq * dq - (H[q] as number)
        if (v > 0) {
          violated = true
          const f = (1.02 * v) / n2 // a slight over-relaxation speeds the cycle
          for (let t = bStart[r] as number; t < (bStart[r + 1] as number); t++) {
            const j = idx[t] as number
            p[j] = (p[j] as number) - f * (aq * (phi[t] as number) + bq * (psi[t] as number))
          }
          // the section's dot products after the step p −= f·g, g = a·phi + b·psi
          const dpNew = dp - f * (aq * (pp[r] as number) + bq * (pq[r] as number))
          dq = dq - f * (aq * (pq[r] as number) + bq * (qq[r] as number))
          dp = dpNew
        }
      }
    }
    for (let j = 0; j < p.length; j++) p[j] = Math.min(hi, Math.max(lo, p[j] as number))
    if (!violated) break
  }
  let final = 0
  for (let r = 0; r < sections; r++) {
    const [dp, dq] = dots(r)
    for (let q = rowStart[r] as number; q < (rowStart[r + 1] as number); q++) {
      if (!((N2[q] as number) > 0)) continue
      final = Math.max(final, ((a[q] as number) * dp + (b[q] as number) * dq - (H[q] as number)) * s) // back in MPa
    }
  }
  return { p: Array.from(p), violation: final }
}
