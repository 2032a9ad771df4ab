/**
 * Deflected shape under the quasi-permanent unbalanced load, short-term and long-term, drawn
 * downwards as the member deflects and upwards where it cambers: one sign throughout, downward
 * positive, as in the engine's results and the deflection table. Values in mm along the member.
 */
import { PALETTE, esc, extent, frame, hline, legend, linear, markLines, markValues, seriesPath, supports, svgOpen, xAxis, yAxis } from './svg'
import type { PlotMark } from './svg'

export interface DeflectionData {
  /** along the member, mm */
  X: readonly number[]
  /** deflection, mm, downwards + */
  shortTerm: readonly number[]
  longTerm: readonly number[]
  supportsX: readonly number[]
  /** the engineer's own quantities marked on the plot (mm; places in m) */
  marks?: readonly PlotMark[]
}

export function deflectionSvg(d: DeflectionData): string {
  const f = frame(720, 230)
  const length = Math.max(...d.X, ...d.supportsX, 1)
  const [lo, hi] = extent([...d.shortTerm, ...d.longTerm, ...markValues(d.marks), 0], 0.15)
  const x = linear([0, length / 1000], [f.left, f.width - f.right])
  // downwards deflection drawn downwards
  const y = linear([lo, hi], [f.top, f.height - f.bottom]).nice()
  const xs = d.X.map((v) => v / 1000)
  const title = 'Deflection under the quasi-permanent unbalanced load'
  return svgOpen(f, title)
    + `<title>${esc(title)}</title>`
    + legend(f, [
      { label: 'short-term', stroke: PALETTE.sand, dash: 'dashed' },
      { label: 'long-term (with creep)', stroke: PALETTE.blue },
    ])
    + xAxis(f, x, 'distance along the member (m)')
    + yAxis(f, y, 'deflection (mm), downwards +, upwards (camber) −')
    + hline(f.left, f.width - f.right, y(0), PALETTE.ink)
    + seriesPath({ label: 'short-term', x: xs, y: d.shortTerm, stroke: PALETTE.sand, dash: 'dashed' }, x, y)
    + seriesPath({ label: 'long-term', x: xs, y: d.longTerm, stroke: PALETTE.blue, width: 2 }, x, y)
    + supports(d.supportsX.map((v) => v / 1000), x, y(0))
    + markLines(f, x, y, d.marks, 'mm')
    + '</svg>'
}
