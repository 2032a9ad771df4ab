/**
 * Small pieces shared by the figures: the palette, number rounding (every coordinate to 0.1 so
 * that the same data always gives the same bytes), escaping, and a line chart with axes, grid and
 * legend built on d3-scale and d3-shape. Output is plain SVG text: no script, no links, no ids.
 */
import { scaleLinear } from 'd3-scale'
import type { ScaleLinear } from 'd3-scale'
import { area, line } from 'd3-shape'
import { escapeHtml } from '../format'

/** Our own calm palette: ink and greys for the frame, four quiet hues for data, rust for limits. */
export const PALETTE = {
  ink: '#2b2f36',
  axis: '#7c838d',
  grid: '#e4e6e9',
  concrete: '#eceae6',
  concreteEdge: '#9a958c',
  blue: '#2f5d7c',
  olive: '#6b7a3a',
  plum: '#7a5a86',
  sand: '#b08a3e',
  limit: '#a8502a',
  region: '#d6e3ec',
  band: '#e3ebf1',
} as const

export const FONT_SIZE = 11

/** A coordinate rounded to 0.1, printed without trailing zeros; −0 prints as 0. */
export function n(value: number): string {
  const r = Math.round(value * 10) / 10
  return Object.is(r, -0) || r === 0 ? '0' : String(r)
}

export function esc(text: string): string {
  return escapeHtml(text)
}

export interface Frame {
  width: number
  height: number
  left: number
  right: number
  top: number
  bottom: number
}

export function frame(width: number, height: number, margins: Partial<Omit<Frame, 'width' | 'height'>> = {}): Frame {
  return { width, height, left: margins.left ?? 62, right: margins.right ?? 18, top: margins.top ?? 30, bottom: margins.bottom ?? 44 }
}

export function svgOpen(f: Frame, label: string): string {
  return `<svg xmlns="http://www.w3.org/2000/svg" class="tb-svg" viewBox="0 0 ${f.width} ${f.height}" width="${f.width}" height="${f.height}" role="img" aria-label="${esc(label)}" font-family="inherit" font-size="${FONT_SIZE}">`
}

export function text(x: number, y: number, content: string, attrs = ''): string {
  return `<text x="${n(x)}" y="${n(y)}"${attrs ? ` ${attrs}` : ''} fill="${PALETTE.ink}">${esc(content)}</text>`
}

export function hline(x1: number, x2: number, y: number, stroke: string, extra = ''): string {
  return `<line x1="${n(x1)}" y1="${n(y)}" x2="${n(x2)}" y2="${n(y)}" stroke="${stroke}"${extra ? ` ${extra}` : ''}/>`
}

export function vline(x: number, y1: number, y2: number, stroke: string, extra = ''): string {
  return `<line x1="${n(x)}" y1="${n(y1)}" x2="${n(x)}" y2="${n(y2)}" stroke="${stroke}"${extra ? ` ${extra}` : ''}/>`
}

export type Dash = 'solid' | 'dashed' | 'dotted'

export function dashAttr(dash: Dash): string {
  return dash === 'dashed' ? ' stroke-dasharray="6 4"' : dash === 'dotted' ? ' stroke-dasharray="1.5 3"' : ''
}

/** Axis ticks, grid lines and labels for a linear scale. */
export function xAxis(f: Frame, x: ScaleLinear<number, number>, label: string, ticks = 10): string {
  const y0 = f.height - f.bottom
  const format = x.tickFormat(ticks)
  const parts = x.ticks(ticks).map((t) => vline(x(t), f.top, y0, PALETTE.grid) + text(x(t), y0 + 14, format(t).replace('-', '−'), 'text-anchor="middle"'))
  return parts.join('') + hline(f.left, f.width - f.right, y0, PALETTE.axis) + text((f.left + f.width - f.right) / 2, f.height - 8, label, 'text-anchor="middle"')
}

export function yAxis(f: Frame, y: ScaleLinear<number, number>, label: string, ticks = 6): string {
  const format = y.tickFormat(ticks)
  const parts = y.ticks(ticks).map((t) => hline(f.left, f.width - f.right, y(t), PALETTE.grid) + text(f.left - 6, y(t) + 4, format(t).replace('-', '−'), 'text-anchor="end"'))
  const cx = 14
  const cy = (f.top + f.height - f.bottom) / 2
  return parts.join('') + vline(f.left, f.top, f.height - f.bottom, PALETTE.axis) + `<text x="${n(cx)}" y="${n(cy)}" transform="rotate(-90 ${n(cx)} ${n(cy)})" text-anchor="middle" fill="${PALETTE.ink}">${esc(label)}</text>`
}

export interface LegendItem {
  label: string
  stroke: string
  dash?: Dash
  fill?: string
}

/** Legend entries along the top edge, wrapping onto a second row when the first is full. */
export function legend(f: Frame, items: readonly LegendItem[]): string {
  let x = f.left
  let y = 14
  return items
    .map((item) => {
      const width = 28 + item.label.length * 5.8
      if (x > f.left && x + width > f.width - f.right) {
        x = f.left
        y += 15
      }
      const swatch = item.fill
        ? `<rect x="${n(x)}" y="${n(y - 7)}" width="16" height="9" fill="${item.fill}" stroke="${item.stroke}"/>`
        : `<line x1="${n(x)}" y1="${n(y - 3)}" x2="${n(x + 16)}" y2="${n(y - 3)}" stroke="${item.stroke}" stroke-width="2"${dashAttr(item.dash ?? 'solid')}/>`
      const out = swatch + text(x + 21, y, item.label)
      x += width
      return out
    })
    .join('')
}

export interface Series {
  label: string
  x: readonly number[]
  y: readonly number[]
  stroke: string
  dash?: Dash
  width?: number
}

/** A polyline through the points, as a d3-shape path rounded to 0.1. */
export function seriesPath(s: Series, x: ScaleLinear<number, number>, y: ScaleLinear<number, number>): string {
  const pts = s.x.map((xv, i) => [xv, s.y[i]!] as [number, number]).filter(([a, b]) => Number.isFinite(a) && Number.isFinite(b))
  const d = line<[number, number]>().x((p) => x(p[0])).y((p) => y(p[1])).digits(1)(pts) ?? ''
  return d ? `<path d="${d}" fill="none" stroke="${s.stroke}" stroke-width="${s.width ?? 1.6}"${dashAttr(s.dash ?? 'solid')}/>` : ''
}

/** The area between two curves over the same x (an envelope). */
export function bandPath(xs: readonly number[], lo: readonly number[], hi: readonly number[], x: ScaleLinear<number, number>, y: ScaleLinear<number, number>, fill: string): string {
  const pts = xs.map((xv, i) => [xv, lo[i]!, hi[i]!] as [number, number, number]).filter((p) => p.every(Number.isFinite))
  const d = area<[number, number, number]>().x((p) => x(p[0])).y0((p) => y(p[1])).y1((p) => y(p[2])).digits(1)(pts) ?? ''
  return d ? `<path d="${d}" fill="${fill}" stroke="none"/>` : ''
}

/** Domain of all finite values with a margin, never empty. */
export function extent(values: Iterable<number>, pad = 0.08): [number, number] {
  let lo = Infinity
  let hi = -Infinity
  for (const v of values) {
    if (!Number.isFinite(v)) continue
    lo = Math.min(lo, v)
    hi = Math.max(hi, v)
  }
  if (!Number.isFinite(lo)) return [0, 1]
  if (hi - lo < 1e-9) {
    const m = Math.abs(hi) > 1e-9 ? Math.abs(hi) * 0.1 : 1
    return [lo - m, hi + m]
  }
  const m = (hi - lo) * pad
  return [lo - m, hi + m]
}

export function linear(domain: [number, number], range: [number, number]): ScaleLinear<number, number> {
  return scaleLinear().domain(domain).range(range)
}

/** Support marks (small triangles) on a horizontal line. */
export function supports(xs: readonly number[], x: ScaleLinear<number, number>, yLine: number): string {
  return xs.map((xv) => {
    const cx = x(xv)
    return `<path d="M${n(cx)},${n(yLine)}L${n(cx - 6)},${n(yLine + 9)}L${n(cx + 6)},${n(yLine + 9)}Z" fill="${PALETTE.axis}" stroke="none"/>`
  }).join('')
}

/** A value the engineer marks on a figure, in the figure's plotted units (x in m along the member). */
export interface PlotMark {
  label: string
  axis: 'x' | 'y'
  value: number
}

/** The marks' values on the value axis, for the plot's extent: a marked value is always in view. */
export function markValues(marks: readonly PlotMark[] | undefined): number[] {
  return (marks ?? []).filter((m) => m.axis === 'y' && Number.isFinite(m.value)).map((m) => m.value)
}

/** A white outline behind a label's letters, so that a label over a curve stays readable. */
const HALO = 'stroke="#fff" stroke-width="3" stroke-linejoin="round" paint-order="stroke"'

/**
 * Each mark as a dash-dot line across the plot (horizontal at a value, vertical at a place along the
 * member) with its name and value at the end, in a group named for it. A place beyond the member
 * is left out of the drawing and said in words at the top of the plot.
 */
export function markLines(f: Frame, x: ScaleLinear<number, number>, y: ScaleLinear<number, number>, marks: readonly PlotMark[] | undefined, unit: string): string {
  const stroke = PALETTE.plum
  const dash = 'stroke-dasharray="8 3 2 3" stroke-width="1.3"'
  const [x0, x1] = x.domain() as [number, number]
  const round = (v: number): string => String(Number(v.toPrecision(4))).replace('-', '−')
  let beyond = 0
  return (marks ?? []).map((m) => {
    if (!Number.isFinite(m.value)) return ''
    if (m.axis === 'y') {
      const py = y(m.value)
      return `<g role="group" aria-label="${esc(`${m.label} = ${round(m.value)} ${unit}`)}">${hline(f.left, f.width - f.right, py, stroke, dash)}`
        + text(f.width - f.right - 2, py - 4, `${m.label} = ${round(m.value)} ${unit}`, `font-size="10" text-anchor="end" ${HALO}`) + '</g>'
    }
    if (m.value < x0 || m.value > x1) {
      beyond += 1
      return text(f.left + 4, f.top + 12 * beyond, `${m.label} = ${round(m.value)} m lies beyond the member`, 'font-size="9"')
    }
    const px = x(m.value)
    return `<g role="group" aria-label="${esc(`${m.label} = ${round(m.value)} m`)}">${vline(px, f.top, f.height - f.bottom, stroke, dash)}`
      + text(px + 3, f.top + 10, `${m.label} = ${round(m.value)} m`, `font-size="10" ${HALO}`) + '</g>'
  }).join('')
}
