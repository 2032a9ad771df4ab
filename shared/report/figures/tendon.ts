/**
 * Tendon profile in elevation: the section outline from the top fibre to the soffit, the centroid,
 * the eccentricity limits and the tendon, with supports. Lengths are to scale on each axis; the
 * vertical scale is exaggerated (stated on the figure) because a slab is some 40 times longer than deep.
 */
import { PALETTE, esc, frame, hline, legend, linear, n, seriesPath, supports, svgOpen, text, xAxis, yAxis } from './svg'

export interface TendonProfileData {
  /** along the member, mm */
  X: readonly number[]
  /** tendon eccentricity below the centroid (+), mm */
  e: readonly number[]
  /** least and greatest eccentricity the cover and duct allow, mm (above the centroid −) */
  eLimitTop: readonly number[]
  eLimitBottom: readonly number[]
  /** overall depth and depth of the centroid below the top fibre, mm */
  depth: readonly number[]
  centroid: readonly number[]
  /** support positions along the member, mm */
  supportsX: readonly number[]
}

export function tendonProfileSvg(d: TendonProfileData): string {
  const f = frame(720, 250, { bottom: 48 })
  const length = Math.max(...d.X, ...d.supportsX, 1)
  const h = Math.max(...d.depth, 1)
  const x = linear([0, length / 1000], [f.left, f.width - f.right])
  const y = linear([0, h], [f.top + 6, f.height - f.bottom - 12])
  const xs = d.X.map((v) => v / 1000)
  const below = (offsets: readonly number[]): number[] => offsets.map((v, i) => (d.centroid[i] ?? 0) + v)
  const outline = `<path d="M${n(x(xs[0] ?? 0))},${n(y(0))}${xs.map((xv) => `L${n(x(xv))},${n(y(0))}`).join('')}${[...xs].reverse().map((xv, i) => `L${n(x(xv))},${n(y(d.depth[xs.length - 1 - i] ?? h))}`).join('')}Z" fill="${PALETTE.concrete}" stroke="${PALETTE.concreteEdge}"/>`
  const centroid = seriesPath({ label: 'centroid', x: xs, y: d.centroid, stroke: PALETTE.axis, dash: 'dotted', width: 1 }, x, y)
  const limTop = seriesPath({ label: 'limit', x: xs, y: below(d.eLimitTop), stroke: PALETTE.limit, dash: 'dashed', width: 1.2 }, x, y)
  const limBottom = seriesPath({ label: 'limit', x: xs, y: below(d.eLimitBottom), stroke: PALETTE.limit, dash: 'dashed', width: 1.2 }, x, y)
  const tendon = seriesPath({ label: 'tendon', x: xs, y: below(d.e), stroke: PALETTE.blue, width: 2.2 }, x, y)
  const plotW = f.width - f.left - f.right
  const plotH = y(h) - y(0)
  const exaggeration = plotH / h / (plotW / length)
  const note = text(f.width - f.right, f.height - f.bottom + 28, `vertical scale ×${Math.round(exaggeration)}`, 'text-anchor="end"')
  return svgOpen(f, 'Tendon profile with the eccentricity limits')
    + `<title>${esc('Tendon profile with the eccentricity limits')}</title>`
    + legend(f, [
      { label: 'tendon (centroid of strands)', stroke: PALETTE.blue },
      { label: 'eccentricity limits', stroke: PALETTE.limit, dash: 'dashed' },
      { label: 'centroid of section', stroke: PALETTE.axis, dash: 'dotted' },
    ])
    + xAxis({ ...f, bottom: f.bottom }, x, 'distance along the member (m)')
    + yAxis(f, y, 'depth below top (mm)', 4)
    + outline + centroid + limTop + limBottom + tendon
    + supports(d.supportsX.map((v) => v / 1000), x, y(h))
    + hline(f.left, f.width - f.right, y(0), PALETTE.concreteEdge)
    + note
    + '</svg>'
}
