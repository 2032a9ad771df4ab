/** Force along the tendon at each stage of losses (friction, draw-in, transfer, service), in kN. */
import { PALETTE, esc, extent, frame, legend, linear, markLines, markValues, seriesPath, supports, svgOpen, xAxis, yAxis } from './svg'
import type { Dash, LegendItem, PlotMark } from './svg'

export interface ForceCurve {
  label: string
  /** N */
  values: readonly number[]
  stroke: string
  dash?: Dash
}

export interface ForceAlongTendonData {
  X: readonly number[]
  curves: readonly ForceCurve[]
  supportsX: readonly number[]
  /** the engineer's own quantities marked on the plot (kN; places in m) */
  marks?: readonly PlotMark[]
}

export function forceAlongTendonSvg(d: ForceAlongTendonData): string {
  const f = frame(720, 250)
  const length = Math.max(...d.X, ...d.supportsX, 1)
  const kN = (v: readonly number[]): number[] => v.map((p) => p / 1000)
  const [lo, hi] = extent([...d.curves.flatMap((c) => kN(c.values)), ...markValues(d.marks)], 0.15)
  const x = linear([0, length / 1000], [f.left, f.width - f.right])
  const y = linear([lo, hi], [f.height - f.bottom, f.top]).nice()
  const xs = d.X.map((v) => v / 1000)
  const items: LegendItem[] = d.curves.map((c) => ({ label: c.label, stroke: c.stroke, ...(c.dash ? { dash: c.dash } : {}) }))
  const title = 'Force along the tendon'
  return svgOpen(f, title)
    + `<title>${esc(title)}</title>`
    + legend(f, items)
    + xAxis(f, x, 'distance along the member (m)')
    + yAxis(f, y, 'P (kN)')
    + d.curves.map((c) => seriesPath({ label: c.label, x: xs, y: kN(c.values), stroke: c.stroke, ...(c.dash ? { dash: c.dash } : {}) }, x, y)).join('')
    + supports(d.supportsX.map((v) => v / 1000), x, f.height - f.bottom)
    + markLines(f, x, y, d.marks, 'kN')
    + '</svg>'
}
