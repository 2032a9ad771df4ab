/**
 * The stations along the member where every stage evaluates forces, moments and stresses: a grid
 * of twentieths of each span, the low point, the ends of the profile's parabolas (where the
 * curvature of the tendon jumps) and the point, line and partial loads' positions (where the moment
 * peaks or changes its law) and the ends of drops (where the section steps), so that no change of
 * the profile, the loads or the section falls between two stations.
 */
import { at } from '../common/numeric'
import type { MemberInput } from '../input/schema'

export interface Station {
  span: number
  /** from the span's left support, mm */
  x: number
  /** along the member from its left end, mm */
  X: number
}

function uniqueSorted(v: number[]): number[] {
  const s = [...v].sort((a, b) => a - b)
  const out: number[] = []
  for (const x of s) if (out.length === 0 || x - at(out, out.length - 1) > 1e-6) out.push(x)
  return out
}

/** The low point of each span as a share of the span (0.5 where the input leaves it out). */
export function lowPointShares(input: MemberInput): number[] {
  return input.geometry.spans.map((_, i) => input.profile.lowPointAt?.[i] ?? 0.5)
}

/**
 * Stations of the member. The parabolas of each span end at the support, at λL from an interior
 * support (the inflection of the reverse curve), and at the low point: these depend on the spans,
 * the low points and λ only, never on the eccentricities, so the grid is known before the profile.
 */
export function stationGrid(input: MemberInput): Station[] {
  const spans = input.geometry.spans
  const n = spans.length
  const lowAt = lowPointShares(input)
  const lambda = input.profile.inflection
  const out: Station[] = []
  // where the added loads sit (the schema keeps them within their spans)
  const loadsAt = new Map<number, number[]>()
  const mark = (span: number, ...x: number[]): void => void loadsAt.set(span - 1, [...(loadsAt.get(span - 1) ?? []), ...x])
  for (const l of input.loads.points) mark(l.span, l.at)
  for (const l of input.loads.lines) mark(l.span, l.at)
  for (const l of input.loads.partials) mark(l.span, l.from, l.from + l.length)
  // each end of a drop within a span, and a millimetre inside it: the section steps there
  for (const d of input.section.drops) {
    const j = d.support - 1
    if (j > 0 && d.left > 0 && spans[j - 1] !== undefined) mark(j, (spans[j - 1] as number) - d.left, (spans[j - 1] as number) - d.left + 1)
    if (j < n && d.right > 0) mark(j + 1, d.right, d.right - 1)
  }
  let offset = 0
  spans.forEach((L, i) => {
    const xs: number[] = [...(loadsAt.get(i) ?? [])]
    for (let k = 0; k <= 20; k++) xs.push((L * k) / 20)
    xs.push(at(lowAt, i) * L)
    const lamL = i > 0 ? lambda * L : 0
    const lamR = i < n - 1 ? lambda * L : 0
    // the ends of the parabolas (prestress/profile.ts): 0, λL, the low point, L − λL, L
    if (lamL > 0) xs.push(lamL)
    if (lamR > 0) xs.push(L - lamR)
    for (const x of uniqueSorted(xs.map((v) => Math.min(L, Math.max(0, v))))) out.push({ span: i, x, X: offset + x })
    offset += L
  })
  return out
}

/**
 * A lookup of the station at (span, x) within 1e-6 mm, or −1: the stations of each span are
 * searched alone, so a lookup costs the stations of one span, not of the member.
 */
export function stationFinder(stations: Station[]): (span: number, x: number) => number {
  const first: number[] = []
  stations.forEach((s, k) => {
    if (first[s.span] === undefined) first[s.span] = k
  })
  return (span, x) => {
    for (let k = first[span] ?? stations.length; k < stations.length && (stations[k] as Station).span === span; k++) {
      if (Math.abs((stations[k] as Station).x - x) < 1e-6) return k
    }
    return -1
  }
}
