/**
 * Gross section properties: solid slab strip per metre width, T or L band beam (a web with a top
 * flange; T and L differ only in how the flange width was chosen), general rectangle and flanged
 * section. y is measured down from the top fibre. Units mm.
 */
import { EngineInputError } from './contract'

export type SectionKind = 'slab-strip' | 'tee-beam' | 'ell-beam' | 'rectangle' | 'flanged'

export interface SectionGeometry {
  kind: SectionKind
  /** overall depth h */
  h: number
  /** width of a rectangle (slab strip: 1000) */
  b?: number
  /** web (band) width */
  bw?: number
  /** flange width */
  bf?: number
  /** flange (slab) thickness */
  hf?: number
}

export interface SectionProperties {
  kind: SectionKind
  h: number
  A: number
  /** centroid depth from the top fibre */
  yt: number
  /** centroid height above the bottom fibre */
  yb: number
  I: number
  Zt: number
  Zb: number
  /** perimeter exposed to drying, for h0 = 2Ac/u (EN 1992-1-1 3.1.4(6)) */
  u: number
  h0: number
  /** width at the top and bottom fibres */
  bTop: number
  bBottom: number
  /** radii of the kern: top kern above the centroid, bottom kern below (Zb/A, Zt/A) */
  kernTop: number
  kernBottom: number
}

interface Rect { b: number; h: number; y0: number }

function fromRects(kind: SectionKind, h: number, rects: Rect[], u: number, bTop: number, bBottom: number): SectionProperties {
  const A = rects.reduce((s, r) => s + r.b * r.h, 0)
  const yt = rects.reduce((s, r) => s + r.b * r.h * (r.y0 + r.h / 2), 0) / A // first moment of area
  const I = rects.reduce((s, r) => s + (r.b * r.h ** 3) / 12 + r.b * r.h * (r.y0 + r.h / 2 - yt) ** 2, 0) // parallel axis theorem
  const yb = h - yt
  return {
    kind, h, A, yt, yb, I,
    Zt: I / yt, Zb: I / yb, u,
    h0: (2 * A) / u, // EN 1992-1-1 3.1.4(6): h0 = 2Ac/u
    bTop, bBottom,
    kernTop: I / yb / A, kernBottom: I / yt / A,
  }
}

function need(v: number | undefined, field: string, what: string): number {
  if (v === undefined || !(v > 0) || !Number.isFinite(v)) throw new EngineInputError(field, `${what} must be positive`)
  return v
}

export function sectionProperties(g: SectionGeometry, fieldPrefix = 'section'): SectionProperties {
  const h = need(g.h, `${fieldPrefix}.h`, 'the depth')
  switch (g.kind) {
    case 'slab-strip': {
      const b = 1000
      // slab strip: both faces dry (EN 1992-1-1 3.1.4(6)); the cut edges of the strip are not exposed
      return fromRects(g.kind, h, [{ b, h, y0: 0 }], 2 * b, b, b)
    }
    case 'rectangle': {
      const b = need(g.b, `${fieldPrefix}.b`, 'the width')
      return fromRects(g.kind, h, [{ b, h, y0: 0 }], 2 * (b + h), b, b)
    }
    case 'tee-beam':
    case 'ell-beam':
    case 'flanged': {
      const bw = need(g.bw, `${fieldPrefix}.bw`, 'the web width')
      const bf = need(g.bf, `${fieldPrefix}.bf`, 'the flange width')
      const hf = need(g.hf, `${fieldPrefix}.hf`, 'the flange thickness')
      if (bf < bw) throw new EngineInputError(`${fieldPrefix}.bf`, 'the flange width must not be less than the web width')
      if (hf >= h) throw new EngineInputError(`${fieldPrefix}.hf`, 'the flange thickness must be less than the overall depth')
      // exposed perimeter: top of flange, flange soffits either side, the two web sides and the soffit
      const u = bf + (bf - bw) + 2 * (h - hf) + bw
      return fromRects(g.kind, h, [{ b: bf, h: hf, y0: 0 }, { b: bw, h: h - hf, y0: hf }], u, bf, bw)
    }
  }
}
