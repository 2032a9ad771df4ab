/**
 * Ultimate limit state envelopes along the member against the resistances the checks found: the
 * design moment MEd (greatest and least over the load arrangements) with the bending resistance
 * MRd at the sections where it is computed, and the design shear VEd with VRd at both sides of each
 * support. Moments are drawn on the tension side as in the moments figure (sagging + below);
 * shear is drawn upwards where positive. Each curve sits in a group named for what it shows, and
 * design values and resistances differ by line dash, marker shape and text, not by colour alone.
 */
import { PALETTE, bandPath, dashAttr, esc, extent, frame, hline, legend, linear, markLines, markValues, n, seriesPath, supports, svgOpen, text, xAxis, yAxis } from './svg'
import type { LegendItem, PlotMark } from './svg'

/** A resistance at one section, signed as plotted (hogging and negative shear −); X along the member, mm. */
export interface ResistancePoint {
  X: number
  value: number
}

export interface UlsMomentData {
  /** along the member, mm */
  X: readonly number[]
  /** design moments, N·mm, sagging + */
  max: readonly number[]
  min: readonly number[]
  /** MRd at the sections in order along the member; null where the section has no such face (breaks the line) */
  sagging: ReadonlyArray<ResistancePoint | null>
  /** hogging resistances as negative moments */
  hogging: ReadonlyArray<ResistancePoint | null>
  supportsX: readonly number[]
  unit: string
  /** the engineer's own quantities marked on the plot (kNm; places in m) */
  marks?: readonly PlotMark[]
}

export interface UlsShearData {
  X: readonly number[]
  /** design shears, N */
  max: readonly number[]
  min: readonly number[]
  /** VRd at each checked section, signed as the governing design shear there; toward: the side of the support the span lies on */
  resistances: ReadonlyArray<ResistancePoint & { toward: 'left' | 'right' }>
  supportsX: readonly number[]
  unit: string
  /** the engineer's own quantities marked on the plot (kN; places in m) */
  marks?: readonly PlotMark[]
}

/** A whole number with a true minus sign, as the axes print them. */
function signed(v: number): string {
  return String(v).replace('-', '−')
}

/** A group named for the curve it holds, so that a reader (and a test) can tell the curves apart without colour. */
function group(label: string, body: string): string {
  return body ? `<g role="group" aria-label="${esc(label)}">${body}</g>` : ''
}

/** A dashed line through the resistances, broken where a section has none, with a marker at each. */
function resistanceLine(points: ReadonlyArray<ResistancePoint | null>, x: (v: number) => number, y: (v: number) => number, marker: 'circle' | 'square'): string {
  let d = ''
  let open = false
  let marks = ''
  for (const p of points) {
    if (!p || !Number.isFinite(p.value)) {
      open = false
      continue
    }
    const px = x(p.X / 1000)
    const py = y(p.value / 1e6)
    d += `${open ? 'L' : 'M'}${n(px)},${n(py)}`
    open = true
    marks += marker === 'circle'
      ? `<circle cx="${n(px)}" cy="${n(py)}" r="2.6" fill="#ffffff" stroke="${PALETTE.limit}" stroke-width="1.2"/>`
      : `<rect x="${n(px - 2.4)}" y="${n(py - 2.4)}" width="4.8" height="4.8" fill="${PALETTE.limit}" stroke="none"/>`
  }
  return d ? `<path d="${d}" fill="none" stroke="${PALETTE.limit}" stroke-width="1.4"${dashAttr('dashed')}/>${marks}` : ''
}

/** A text label beside the largest resistance of a line, on its outer side, clear of the markers. */
function lineLabel(points: ReadonlyArray<ResistancePoint | null>, label: string, x: (v: number) => number, y: (v: number) => number, below: boolean): string {
  const peak = points.reduce<ResistancePoint | null>((a, p) => (p && Number.isFinite(p.value) && (!a || Math.abs(p.value) > Math.abs(a.value)) ? p : a), null)
  if (!peak) return ''
  return text(x(peak.X / 1000), y(peak.value / 1e6) + (below ? 15 : -7), label, 'font-size="10" text-anchor="middle"')
}

export function ulsMomentSvg(d: UlsMomentData): string {
  const f = frame(720, 300, { top: 46 })
  const length = Math.max(...d.X, ...d.supportsX, 1)
  const kNm = (v: readonly number[]): number[] => v.map((m) => m / 1e6)
  const resist = [...d.sagging, ...d.hogging].filter((p): p is ResistancePoint => p !== null).map((p) => p.value / 1e6)
  const [lo, hi] = extent([...kNm(d.max), ...kNm(d.min), ...resist, ...markValues(d.marks), 0])
  const x = linear([0, length / 1000], [f.left, f.width - f.right])
  // tension side: sagging (+) downwards, as the moments figure
  const y = linear([lo, hi], [f.top, f.height - f.bottom]).nice()
  const xs = d.X.map((v) => v / 1000)
  const title = 'Design moments at ULS against the bending resistance'
  const items: LegendItem[] = [
    { label: 'MEd envelope (greatest and least)', stroke: PALETTE.blue, fill: PALETTE.band },
    { label: 'MRd, sagging (○ at each section checked)', stroke: PALETTE.limit, dash: 'dashed' },
    { label: 'MRd, hogging (■ at each section checked)', stroke: PALETTE.limit, dash: 'dashed' },
  ]
  return svgOpen(f, title)
    + `<title>${esc(title)}</title>`
    + legend(f, items)
    + xAxis(f, x, 'distance along the member (m)')
    + yAxis(f, y, `M (${d.unit}), sagging + below`)
    + hline(f.left, f.width - f.right, y(0), PALETTE.ink, 'stroke-width="1"')
    + bandPath(xs, kNm(d.min), kNm(d.max), x, y, PALETTE.band)
    + group('MEd, greatest', seriesPath({ label: 'MEd, greatest', x: xs, y: kNm(d.max), stroke: PALETTE.blue }, x, y))
    + group('MEd, least', seriesPath({ label: 'MEd, least', x: xs, y: kNm(d.min), stroke: PALETTE.blue }, x, y))
    + group('MRd, sagging', resistanceLine(d.sagging, x, y, 'circle'))
    + group('MRd, hogging', resistanceLine(d.hogging, x, y, 'square'))
    + lineLabel(d.sagging, 'MRd sagging', x, y, true)
    + lineLabel(d.hogging, 'MRd hogging', x, y, false)
    + supports(d.supportsX.map((v) => v / 1000), x, y(0))
    + markLines(f, x, y, d.marks, d.unit)
    + '</svg>'
}

export function ulsShearSvg(d: UlsShearData): string {
  const f = frame(720, 290, { top: 46 })
  const length = Math.max(...d.X, ...d.supportsX, 1)
  const kN = (v: readonly number[]): number[] => v.map((V) => V / 1e3)
  const [lo, hi] = extent([...kN(d.max), ...kN(d.min), ...d.resistances.map((r) => r.value / 1e3), ...markValues(d.marks), 0])
  const x = linear([0, length / 1000], [f.left, f.width - f.right])
  const y = linear([lo, hi], [f.height - f.bottom, f.top]).nice()
  const xs = d.X.map((v) => v / 1000)
  const title = 'Design shear at ULS against the shear resistance'
  // each resistance as a short dashed step into its span from the support, a marker at the section and its value
  const reach = 0.035 * (f.width - f.left - f.right)
  const marks = d.resistances.map((r) => {
    const px = x(r.X / 1000)
    const py = y(r.value / 1e3)
    const end = r.toward === 'right' ? px + reach : px - reach
    return `<line x1="${n(px)}" y1="${n(py)}" x2="${n(end)}" y2="${n(py)}" stroke="${PALETTE.limit}" stroke-width="1.6"${dashAttr('dashed')}/>`
      + `<rect x="${n(px - 2.4)}" y="${n(py - 2.4)}" width="4.8" height="4.8" fill="${PALETTE.limit}" stroke="none"/>`
      + text(r.toward === 'right' ? px + 4 : px - 4, py + (r.value >= 0 ? -5 : 13), `VRd ${signed(Math.round(r.value / 1e3))}`, `font-size="9" text-anchor="${r.toward === 'right' ? 'start' : 'end'}"`)
  }).join('')
  return svgOpen(f, title)
    + `<title>${esc(title)}</title>`
    + legend(f, [
      { label: 'VEd envelope (greatest and least)', stroke: PALETTE.blue, fill: PALETTE.band },
      { label: 'VRd at each side of a support (■, value in kN)', stroke: PALETTE.limit, dash: 'dashed' },
    ])
    + xAxis(f, x, 'distance along the member (m)')
    + yAxis(f, y, `V (${d.unit})`)
    + hline(f.left, f.width - f.right, y(0), PALETTE.ink, 'stroke-width="1"')
    + bandPath(xs, kN(d.min), kN(d.max), x, y, PALETTE.band)
    + group('VEd, greatest', seriesPath({ label: 'VEd, greatest', x: xs, y: kN(d.max), stroke: PALETTE.blue }, x, y))
    + group('VEd, least', seriesPath({ label: 'VEd, least', x: xs, y: kN(d.min), stroke: PALETTE.blue }, x, y))
    + group('VRd', marks)
    + supports(d.supportsX.map((v) => v / 1000), x, y(0))
    + markLines(f, x, y, d.marks, d.unit)
    + '</svg>'
}
