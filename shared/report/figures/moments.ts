/**
 * Bending-moment diagrams along the member, drawn on the tension side as engineers draw them:
 * sagging (+) below the axis, hogging above. Values in N·mm, shown in kNm.
 */
import { PALETTE, bandPath, esc, extent, frame, hline, legend, linear, markLines, markValues, n, seriesPath, supports, svgOpen, text, xAxis, yAxis } from './svg'
import type { Dash, LegendItem, PlotMark } from './svg'

export interface MomentCurve {
  label: string
  values: readonly number[]
  stroke: string
  dash?: Dash
}

export interface MomentBand {
  label: string
  min: readonly number[]
  max: readonly number[]
}

export interface MomentDiagramData {
  title: string
  /** along the member, mm */
  X: readonly number[]
  curves: readonly MomentCurve[]
  /** an envelope drawn as a shaded band behind the curves */
  band?: MomentBand
  supportsX: readonly number[]
  /** moment unit label, e.g. 'kNm' or 'kNm per strip' */
  unit: string
  /** point, line and partial loads drawn on the member above the plot: X (and X2 for a partial load) in mm */
  loads?: ReadonlyArray<{ label: string; X: number; X2?: number }>
  /** the engineer's own quantities marked on the plot (kNm; places in m) */
  marks?: readonly PlotMark[]
}

/** Each load as an arrow (point and line loads) or a bar with arrows (partial loads) above the plot, with its label. */
function loadMarks(d: MomentDiagramData, x: (v: number) => number, top: number): string {
  let out = ''
  for (const l of d.loads ?? []) {
    const x1 = x(l.X / 1000)
    const tip = top + 2
    const tail = top - 16
    if (l.X2 === undefined) {
      out += `<line x1="${n(x1)}" y1="${n(tail)}" x2="${n(x1)}" y2="${n(tip - 5)}" stroke="${PALETTE.ink}" stroke-width="1.4"/>`
        + `<path d="M${n(x1 - 3.5)},${n(tip - 6)} L${n(x1 + 3.5)},${n(tip - 6)} L${n(x1)},${n(tip)} Z" fill="${PALETTE.ink}"/>`
    } else {
      const x2 = x(l.X2 / 1000)
      out += `<rect x="${n(x1)}" y="${n(tail)}" width="${n(Math.max(1, x2 - x1))}" height="6" fill="${PALETTE.band}" stroke="${PALETTE.ink}" stroke-width="0.8"/>`
      for (const xi of [x1, (x1 + x2) / 2, x2]) out += `<line x1="${n(xi)}" y1="${n(tail + 6)}" x2="${n(xi)}" y2="${n(tip)}" stroke="${PALETTE.ink}" stroke-width="0.8"/>`
    }
    out += text(x1 + 4, tail + 2, l.label, 'font-size="9"')
  }
  return out
}

export function momentDiagramSvg(d: MomentDiagramData): string {
  const f = d.loads?.length ? frame(720, 290, { top: 48 }) : frame(720, 270)
  const length = Math.max(...d.X, ...d.supportsX, 1)
  const kNm = (v: readonly number[]): number[] => v.map((m) => m / 1e6)
  const all = [...d.curves.flatMap((c) => kNm(c.values)), ...(d.band ? [...kNm(d.band.min), ...kNm(d.band.max)] : []), ...markValues(d.marks), 0]
  const [lo, hi] = extent(all)
  const x = linear([0, length / 1000], [f.left, f.width - f.right])
  // tension side: sagging (+) downwards
  const y = linear([lo, hi], [f.top, f.height - f.bottom]).nice()
  const xs = d.X.map((v) => v / 1000)
  const items: LegendItem[] = []
  let body = ''
  if (d.band) {
    body += bandPath(xs, kNm(d.band.min), kNm(d.band.max), x, y, PALETTE.band)
    items.push({ label: d.band.label, stroke: PALETTE.band, fill: PALETTE.band })
  }
  for (const c of d.curves) {
    body += seriesPath({ label: c.label, x: xs, y: kNm(c.values), stroke: c.stroke, ...(c.dash ? { dash: c.dash } : {}) }, x, y)
    items.push({ label: c.label, stroke: c.stroke, ...(c.dash ? { dash: c.dash } : {}) })
  }
  return svgOpen(f, d.title)
    + `<title>${esc(d.title)}</title>`
    + legend(f, items)
    + xAxis(f, x, 'distance along the member (m)')
    + yAxis(f, y, `M (${d.unit}), sagging + below`)
    + hline(f.left, f.width - f.right, y(0), PALETTE.ink, 'stroke-width="1"')
    + body
    + supports(d.supportsX.map((v) => v / 1000), x, y(0))
    + loadMarks(d, x, f.top)
    + markLines(f, x, y, d.marks, d.unit)
    + '</svg>'
}
