/**
 * Fibre-stress envelopes along the member against their limits: the range of the top and of the
 * bottom fibre stress over the load cases of one stage, with the compression and tension limits.
 * Compression is positive (the engine's convention), plotted upwards.
 */
import { PALETTE, bandPath, esc, extent, frame, hline, legend, linear, seriesPath, svgOpen, xAxis, yAxis } from './svg'

export interface StressEnvelopeData {
  title: string
  X: readonly number[]
  topMin: readonly number[]
  topMax: readonly number[]
  bottomMin: readonly number[]
  bottomMax: readonly number[]
  /** compression limit (+) and tension limit (−), MPa; null where no limit applies */
  compressionLimit: readonly (number | null)[]
  tensionLimit: readonly (number | null)[]
}

const TOP_FILL = '#dbe6ee'
const BOTTOM_FILL = '#e6e9d6'

export function stressEnvelopeSvg(d: StressEnvelopeData): string {
  const f = frame(720, 270)
  const length = Math.max(...d.X, 1)
  const finite = (a: readonly (number | null)[]): number[] => a.map((v) => (v === null ? Number.NaN : v))
  const [lo, hi] = extent([...d.topMin, ...d.topMax, ...d.bottomMin, ...d.bottomMax, ...finite(d.compressionLimit), ...finite(d.tensionLimit), 0])
  const x = linear([0, length / 1000], [f.left, f.width - f.right])
  const y = linear([lo, hi], [f.height - f.bottom, f.top]).nice()
  const xs = d.X.map((v) => v / 1000)
  return svgOpen(f, d.title)
    + `<title>${esc(d.title)}</title>`
    + legend(f, [
      { label: 'top fibre', stroke: PALETTE.blue, fill: TOP_FILL },
      { label: 'bottom fibre', stroke: PALETTE.olive, fill: BOTTOM_FILL },
      { label: 'limits', stroke: PALETTE.limit, dash: 'dashed' },
    ])
    + xAxis(f, x, 'distance along the member (m)')
    + yAxis(f, y, 'σ (MPa), compression +')
    + hline(f.left, f.width - f.right, y(0), PALETTE.ink)
    + bandPath(xs, d.topMin, d.topMax, x, y, TOP_FILL)
    + bandPath(xs, d.bottomMin, d.bottomMax, x, y, BOTTOM_FILL)
    + seriesPath({ label: 'top min', x: xs, y: d.topMin, stroke: PALETTE.blue, width: 1.2 }, x, y)
    + seriesPath({ label: 'top max', x: xs, y: d.topMax, stroke: PALETTE.blue, width: 1.2 }, x, y)
    + seriesPath({ label: 'bottom min', x: xs, y: d.bottomMin, stroke: PALETTE.olive, width: 1.2 }, x, y)
    + seriesPath({ label: 'bottom max', x: xs, y: d.bottomMax, stroke: PALETTE.olive, width: 1.2 }, x, y)
    + seriesPath({ label: 'compression limit', x: xs, y: finite(d.compressionLimit), stroke: PALETTE.limit, dash: 'dashed', width: 1.4 }, x, y)
    + seriesPath({ label: 'tension limit', x: xs, y: finite(d.tensionLimit), stroke: PALETTE.limit, dash: 'dashed', width: 1.4 }, x, y)
    + '</svg>'
}
