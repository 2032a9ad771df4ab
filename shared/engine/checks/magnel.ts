/**
 * Magnel diagram (G. Magnel's construction, in any prestressed-concrete textbook): each stress
 * inequality σ(P, e) within its limit is, after division by P, a straight line in (e, 1/P); the
 * feasible region is their intersection cut by the eccentricity limits; the least force is the
 * vertex of largest 1/P. Units: e in mm, 1/P in 1/N, compression positive, e below the centroid.
 */

export type Fibre = 'top' | 'bottom'

export interface MagnelCondition {
  id: string
  label: string
  stage: 'transfer' | 'service'
  fibre: Fibre
  bound: 'compression' | 'tension'
  /** factor on the transfer force P for this condition: r·η */
  forceFactor: number
  /** moment that acts with it, N·mm (sagging +); any secondary moment of prestress included */
  M: number
  /** stress limit as a positive magnitude, MPa */
  limit: number
}

/** a_e·e + a_u·(1/P) ≤ b */
export interface MagnelLine {
  id: string
  label: string
  stage: 'transfer' | 'service'
  fibre: Fibre
  bound: 'compression' | 'tension'
  forceFactor: number
  M: number
  limit: number
  ae: number
  au: number
  b: number
}

export interface MagnelResult {
  feasible: boolean
  /** least transfer force, N (null when no force works; 0 when any small force works) */
  minP: number | null
  eAtMinP: number | null
  lines: MagnelLine[]
  /** feasible polygon in (e mm, 1/P 1/N), counter-clockwise; empty when infeasible */
  region: Array<{ e: number; invP: number }>
  eLimits: { min: number; max: number }
  /** true when the region reaches 1/P → ∞ (no prestress needed for stresses) */
  unbounded: boolean
}

export interface MagnelSection {
  A: number
  Zt: number
  Zb: number
}

/** One stress condition as a half-plane in (e, u = 1/P): fibre stress σ = F(1/A + ke·e) + kM·M. */
export function magnelLine(s: MagnelSection, c: MagnelCondition): MagnelLine {
  const ke = c.fibre === 'top' ? -1 / s.Zt : 1 / s.Zb // fibre stress per unit P·e (bending theory)
  const kM = c.fibre === 'top' ? 1 / s.Zt : -1 / s.Zb // fibre stress per unit M
  const r = c.forceFactor
  const compression = c.bound === 'compression'
  return {
    id: c.id, label: c.label, stage: c.stage, fibre: c.fibre, bound: c.bound, forceFactor: r, M: c.M, limit: c.limit,
    ae: compression ? r * ke : -r * ke, // σ ≤ fc or σ ≥ −ft, multiplied by 1/P
    au: compression ? kM * c.M - c.limit : -(kM * c.M + c.limit),
    b: compression ? -r / s.A : r / s.A,
  }
}

type Pt = { e: number; invP: number }

function clip(poly: Pt[], l: { ae: number; au: number; b: number }): Pt[] {
  const f = (p: Pt): number => l.ae * p.e + l.au * p.invP - l.b
  const scale = Math.abs(l.b) + 1e-30
  const tol = 1e-12 * scale
  const out: Pt[] = []
  for (let i = 0; i < poly.length; i++) {
    const a = poly[i] as Pt
    const b = poly[(i + 1) % poly.length] as Pt
    const fa = f(a)
    const fb = f(b)
    if (fa <= tol) out.push(a)
    if ((fa <= tol) !== (fb <= tol)) {
      const t = fa / (fa - fb)
      out.push({ e: a.e + t * (b.e - a.e), invP: a.invP + t * (b.invP - a.invP) })
    }
  }
  return out
}

function clipAll(lines: MagnelLine[], eMin: number, eMax: number, U: number): Pt[] {
  let poly: Pt[] = [{ e: eMin, invP: 0 }, { e: eMax, invP: 0 }, { e: eMax, invP: U }, { e: eMin, invP: U }]
  for (const l of lines) {
    poly = clip(poly, l)
    if (poly.length === 0) break
  }
  return poly
}

/** Feasible region of any set of stress conditions within eMin ≤ e ≤ eMax. */
export function magnelRegion(s: MagnelSection, conditions: MagnelCondition[], eMin: number, eMax: number): MagnelResult {
  const lines = conditions.map((c) => magnelLine(s, c))
  const base = { lines, eLimits: { min: eMin, max: eMax } }
  if (!(eMax >= eMin)) return { ...base, feasible: false, minP: null, eAtMinP: null, region: [], unbounded: false }
  const far = 1 // 1/P up to 1 N⁻¹: far beyond any practical force
  const wide = clipAll(lines, eMin, eMax, far)
  const nonZero = wide.filter((p) => p.invP > 1e-18)
  if (nonZero.length === 0) return { ...base, feasible: false, minP: null, eAtMinP: null, region: [], unbounded: false }
  const uTop = Math.max(...wide.map((p) => p.invP))
  const unbounded = uTop >= far * (1 - 1e-9)
  const top = wide.filter((p) => p.invP >= uTop * (1 - 1e-9))
  const eMid = (eMin + eMax) / 2
  top.sort((a, b) => Math.abs(a.e - eMid) - Math.abs(b.e - eMid))
  const best = top[0] as Pt
  let region = wide
  if (unbounded) {
    const finite = wide.filter((p) => p.invP < far * (1 - 1e-9)).map((p) => p.invP)
    const cap = finite.length > 0 && Math.max(...finite) > 0 ? 1.5 * Math.max(...finite) : 1e-3
    region = clipAll(lines, eMin, eMax, cap)
  }
  return {
    ...base,
    feasible: true,
    minP: unbounded ? 0 : 1 / best.invP,
    eAtMinP: best.e,
    region,
    unbounded,
  }
}

export interface MagnelInput {
  A: number
  Zt: number
  Zb: number
  /** moment at transfer (minimum), N·mm */
  Mmin: number
  /** moment in service (maximum), N·mm */
  Mmax: number
  /** largest eccentricity below the centroid, mm */
  eMax: number
  /** largest eccentricity above the centroid as a negative e (default −eMax) */
  eMin?: number
  /** service force / transfer force */
  eta: number
  rsup?: number
  rinf?: number
  limits: { transferCompression: number; transferTension: number; serviceCompression: number; serviceTension: number }
}

/** The classic four conditions: transfer top tension and bottom compression, service top compression and bottom tension. */
export function magnel(i: MagnelInput): MagnelResult {
  const rsup = i.rsup ?? 1
  const rinf = i.rinf ?? 1
  const conditions: MagnelCondition[] = [
    { id: 'transfer.top.tension', label: 'Transfer, top fibre tension', stage: 'transfer', fibre: 'top', bound: 'tension', forceFactor: rsup, M: i.Mmin, limit: i.limits.transferTension },
    { id: 'transfer.bottom.compression', label: 'Transfer, bottom fibre compression', stage: 'transfer', fibre: 'bottom', bound: 'compression', forceFactor: rsup, M: i.Mmin, limit: i.limits.transferCompression },
    { id: 'service.top.compression', label: 'Service, top fibre compression', stage: 'service', fibre: 'top', bound: 'compression', forceFactor: rinf * i.eta, M: i.Mmax, limit: i.limits.serviceCompression },
    { id: 'service.bottom.tension', label: 'Service, bottom fibre tension', stage: 'service', fibre: 'bottom', bound: 'tension', forceFactor: rinf * i.eta, M: i.Mmax, limit: i.limits.serviceTension },
  ]
  return magnelRegion({ A: i.A, Zt: i.Zt, Zb: i.Zb }, conditions, i.eMin ?? -i.eMax, i.eMax)
}

/**
 * Least section moduli for a moment range (textbook necessary conditions, e.g. Lin & Burns):
 * Zt ≥ (Mmax − η·Mmin)/(fcs + η·ftt), Zb ≥ (Mmax − η·Mmin)/(η·fct + fts).
 */
export function requiredModuli(i: { Mmin: number; Mmax: number; eta: number; fct: number; ftt: number; fcs: number; fts: number }): { Zt: number; Zb: number } {
  const range = i.Mmax - i.eta * i.Mmin
  return {
    Zt: range / (i.fcs + i.eta * i.ftt), // top fibre: service compression and transfer tension
    Zb: range / (i.eta * i.fct + i.fts), // bottom fibre: transfer compression and service tension
  }
}
