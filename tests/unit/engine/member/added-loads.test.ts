/**
 * Point loads, line loads across the member and uniform loads over part of a span: their moments
 * against statics and handbook coefficients, their place in the load arrangements and
 * combinations at their own ψ, equilibrium, and the messages for a load outside its span.
 */
import { describe, expect, it } from 'vitest'
import { loadsStage } from '../../../../shared/engine/member/loads'
import { sectionStage } from '../../../../shared/engine/member/section'
import { stationGrid } from '../../../../shared/engine/member/stations'
import { designMember } from '../../../../shared/engine/member/design'
import { parseMemberInput } from '../../../../shared/engine/input/schema'
import type { MemberInputDraft } from '../../../../shared/engine/input/schema'
import { EngineInputError } from '../../../../shared/engine/contract'
import { ONE_SPAN_SLAB, TWO_SPAN_SLAB } from '../../../helpers/members'

const rel = (a: number, b: number): number => Math.abs(a - b) / Math.max(Math.abs(b), 1e-30)

function stage(draft: MemberInputDraft) {
  const input = parseMemberInput(draft)
  const stations = stationGrid(input)
  return { input, stations, loads: loadsStage(input, sectionStage(input).result, stations).result }
}

const noImposed = (d: MemberInputDraft, loads: Partial<MemberInputDraft['loads']>): MemberInputDraft => ({ ...d, loads: { superimposed: 0, imposed: 0, ...loads } })

describe('a point load on a simple span', () => {
  const L = 8000
  const a = 3000
  const P = 20000 // 20 kN
  const { stations, loads } = stage(noImposed(ONE_SPAN_SLAB, { points: [{ span: 1, at: a, P, type: 'imposed', psi0: 0.7, psi1: 0.7, psi2: 0.6 }] }))
  const k = stations.findIndex((s) => Math.abs(s.x - a) < 1e-6)
  it('has a station under the load', () => expect(k).toBeGreaterThan(0))
  it('gives P·a·b/L under it (statics), and ψ1·, ψ2· of it in the frequent and quasi-permanent combinations', () => {
    const M = (P * a * (L - a)) / L
    expect(rel(loads.cases.imposedRange.max[k] as number, M)).toBeLessThan(1e-12)
    expect(rel(loads.cases.imposedRangeFrequent.max[k] as number, 0.7 * M)).toBeLessThan(1e-12) // its own ψ1
    expect(rel(loads.cases.imposedRangeQuasiPermanent.max[k] as number, 0.6 * M)).toBeLessThan(1e-12) // its own ψ2, not the sheet's 0.3
    expect(rel(loads.cases.imposedAllQuasiPermanent[k] as number, 0.6 * M)).toBeLessThan(1e-12)
  })
})

describe('a line load across a slab strip', () => {
  it('is a point load of w_l × the 1 m strip (statics)', () => {
    const w = 8 // 8 kN/m façade
    const { stations, loads } = stage(noImposed(ONE_SPAN_SLAB, { lines: [{ span: 1, at: 8000, w, type: 'permanent' }] }))
    expect(loads.added[0]?.value).toBe(w * 1000)
    // a line load right over the support goes straight into it: no moment in the span
    expect(Math.max(...loads.cases.addedPermanent.map(Math.abs))).toBeLessThan(1e-6)
    expect(stations.length).toBeGreaterThan(0)
    const mid = stage(noImposed(ONE_SPAN_SLAB, { lines: [{ span: 1, at: 4000, w, type: 'permanent' }] }))
    const k = mid.stations.findIndex((s) => s.x === 4000)
    expect(rel(mid.loads.cases.addedPermanent[k] as number, (w * 1000 * 8000) / 4)).toBeLessThan(1e-12) // P·L/4
  })
})

describe('a uniform load over part of a span', () => {
  it('q over [a, a + c] of a simple span: the moment at mid-span by statics', () => {
    const q = 5e-3 // 5 kN/m² on the 1 m strip: 5 N/mm
    const L = 8000
    const from = 1000
    const c = 2000
    const { stations, loads } = stage(noImposed(ONE_SPAN_SLAB, { partials: [{ span: 1, from, length: c, q, type: 'permanent' }] }))
    const w = q * 1000
    const W = w * c
    const RA = (W * (L - (from + c / 2))) / L // statics
    const k = stations.findIndex((s) => s.x === 4000)
    expect(rel(loads.cases.addedPermanent[k] as number, RA * 4000 - W * (4000 - (from + c / 2)))).toBeLessThan(1e-12)
  })
})

describe('two equal spans', () => {
  const L = 8000
  const P = 30000
  it('a point load at the middle of one span: −3PL/32 over the middle support (handbook coefficient 0.094)', () => {
    const { stations, loads } = stage(noImposed(TWO_SPAN_SLAB, { points: [{ span: 1, at: L / 2, P, type: 'permanent' }] }))
    const k = stations.findIndex((s) => s.span === 1 && s.x === 0)
    expect(rel(loads.cases.addedPermanent[k] as number, (-3 * P * L) / 32)).toBeLessThan(1e-12)
  })
  it('an imposed point load follows the arrangement of its span (EN 1992-1-1 5.1.3): at mid-span 1, from −3PL/64 to nil', () => {
    const { stations, loads } = stage(noImposed(TWO_SPAN_SLAB, { points: [{ span: 2, at: L / 2, P, type: 'imposed' }] }))
    const k = stations.findIndex((s) => s.span === 0 && s.x === L / 2)
    expect(rel(loads.cases.imposedRange.min[k] as number, (-3 * P * L) / 64)).toBeLessThan(1e-12) // half the support moment
    expect(Math.abs(loads.cases.imposedRange.max[k] as number)).toBeLessThan(1e-6) // span 2 unloaded: nothing
  })
  it('reactions balance every load, the added ones included (equilibrium)', () => {
    const { loads } = stage({ ...TWO_SPAN_SLAB, loads: { superimposed: 1e-3, imposed: 2e-3, points: [{ span: 2, at: 2500, P, type: 'permanent' }], partials: [{ span: 1, from: 500, length: 3000, q: 4e-3, type: 'permanent' }] } })
    const total = loads.permanent.reactions.reduce((s, r) => s + r, 0)
    expect(rel(total, (loads.selfWeight + loads.superimposed) * 2 * L + P + 4e-3 * 1000 * 3000)).toBeLessThan(1e-12)
  })
})

describe('a member with added loads', () => {
  const draft: MemberInputDraft = { ...TWO_SPAN_SLAB, loads: { ...TWO_SPAN_SLAB.loads, lines: [{ span: 1, at: 3000, w: 6, type: 'permanent' }], points: [{ span: 2, at: 4000, P: 8000, type: 'imposed', psi0: 0.7, psi1: 0.5, psi2: 0.3 }] } }
  const d = designMember(draft)
  const base = designMember(TWO_SPAN_SLAB)
  it('runs without NaN and carries more moment than the member without them', () => {
    expect(JSON.stringify(d)).not.toMatch(/NaN/)
    const mid = (x: typeof d): number => Math.max(...x.uls.sections.map((s) => s.MEdMax))
    expect(mid(d)).toBeGreaterThan(mid(base))
  })
  it('lists each force with its factors and values (EN 1990 6.4.3.2, 6.5.3)', () => {
    expect(d.designForces.map((f) => f.name)).toEqual(['Point load 1 (span 2 at 4.00 m)', 'Line load 1 (span 1 at 3.00 m)'])
    const point = d.designForces[0]
    expect(point?.uls).toBeCloseTo(1.5 * 8000, 9) // γQ = 1.5
    expect(point?.quasiPermanent).toBeCloseTo(0.3 * 8000, 9)
    expect(d.designForces[1]?.uls).toBeCloseTo(1.35 * 6000, 9) // γG = 1.35 on 6 kN/m × 1 m
  })
})

describe('a load outside its span', () => {
  const message = (draft: MemberInputDraft): string => {
    try {
      parseMemberInput(draft)
    }
    catch (e) {
      if (e instanceof EngineInputError) return e.message
      throw e
    }
    return ''
  }
  it('names the load and the span, never NaN', () => {
    expect(message(noImposed(TWO_SPAN_SLAB, { points: [{ span: 2, at: 9000, P: 1000 }] }))).toBe('loads.points.0.at: Point load 1: it lies beyond the end of span 2 (8.00 m long)')
    expect(message(noImposed(TWO_SPAN_SLAB, { lines: [{ span: 3, at: 1000, w: 1 }] }))).toBe('loads.lines.0.span: Line load 1: there is no span 3; the member has 2 spans')
    expect(message(noImposed(TWO_SPAN_SLAB, { partials: [{ span: 1, from: 7000, length: 2000, q: 1e-3 }] }))).toBe('loads.partials.0.length: Partial load 1: it lies beyond the end of span 1 (8.00 m long)')
  })
})
