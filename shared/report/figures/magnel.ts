/**
 * The Magnel diagram of one section (Magnel's construction): each stress condition at transfer and
 * in service is a straight line in (e, 1/P); the feasible region lies on the allowed side of all of
 * them and between the eccentricity limits. Marked: the point of least force and the design's own
 * point (its eccentricity and transfer force).
 */
import { PALETTE, dashAttr, esc, frame, legend, linear, n, svgOpen, text, vline, xAxis, yAxis } from './svg'
import type { LegendItem } from './svg'

export interface MagnelLineData {
  label: string
  stage: 'transfer' | 'service'
  fibre: 'top' | 'bottom'
  /** ae·e + au·(1/P) ≤ b, e in mm, 1/P in 1/N */
  ae: number
  au: number
  b: number
}

export interface MagnelPoint {
  e: number
  invP: number
}

export interface MagnelData {
  title: string
  lines: readonly MagnelLineData[]
  region: readonly MagnelPoint[]
  eLimits: { min: number; max: number }
  least: MagnelPoint | null
  design: MagnelPoint | null
}

type Box = { e0: number; e1: number; u0: number; u1: number }

/** The part of the line ae·e + au·u = b inside the box, or null. */
export function clipLine(l: Pick<MagnelLineData, 'ae' | 'au' | 'b'>, box: Box): [MagnelPoint, MagnelPoint] | null {
  const pts: MagnelPoint[] = []
  const inE = (e: number): boolean => e >= box.e0 - 1e-9 * Math.abs(box.e1 - box.e0) && e <= box.e1 + 1e-9 * Math.abs(box.e1 - box.e0)
  const inU = (u: number): boolean => u >= box.u0 - 1e-9 * box.u1 && u <= box.u1 + 1e-9 * box.u1
  if (l.au !== 0) {
    for (const e of [box.e0, box.e1]) {
      const u = (l.b - l.ae * e) / l.au
      if (inU(u)) pts.push({ e, invP: u })
    }
  }
  if (l.ae !== 0) {
    for (const u of [box.u0, box.u1]) {
      const e = (l.b - l.au * u) / l.ae
      if (inE(e)) pts.push({ e, invP: u })
    }
  }
  const unique = pts.filter((p, i) => pts.findIndex((q) => Math.abs(q.e - p.e) < 1e-9 && Math.abs(q.invP - p.invP) < 1e-18) === i)
  if (unique.length < 2) return null
  unique.sort((a, b) => a.e - b.e || a.invP - b.invP)
  return [unique[0]!, unique[unique.length - 1]!]
}

const FIBRE_COLOUR = { top: PALETTE.blue, bottom: PALETTE.olive } as const

export function magnelSvg(d: MagnelData): string {
  const f = frame(720, 330, { left: 70, top: 44 })
  const perMN = (u: number): number => u * 1e6
  const ePad = Math.max(20, (d.eLimits.max - d.eLimits.min) * 0.15)
  const e0 = d.eLimits.min - ePad
  const e1 = d.eLimits.max + ePad
  const heights = [...d.region.map((p) => p.invP), d.least?.invP ?? 0, d.design?.invP ?? 0].filter((u) => Number.isFinite(u) && u > 0)
  const u1 = heights.length > 0 ? Math.max(...heights) * 1.35 : 1e-6
  const x = linear([e0, e1], [f.left, f.width - f.right])
  const y = linear([0, perMN(u1)], [f.height - f.bottom, f.top]).nice()
  const box: Box = { e0, e1, u0: 0, u1: y.domain()[1]! / 1e6 }
  const px = (p: MagnelPoint): string => `${n(x(p.e))},${n(y(perMN(p.invP)))}`

  const region = d.region.length >= 3
    ? `<path d="M${d.region.map(px).join('L')}Z" fill="${PALETTE.region}" stroke="${PALETTE.blue}" stroke-width="1"/>`
    : ''
  const lines = d.lines.map((l) => {
    const seg = clipLine(l, box)
    if (!seg) return ''
    return `<path d="M${px(seg[0])}L${px(seg[1])}" fill="none" stroke="${FIBRE_COLOUR[l.fibre]}" stroke-width="1.4"${dashAttr(l.stage === 'transfer' ? 'dashed' : 'solid')}/>`
  }).join('')
  const limits = [d.eLimits.min, d.eLimits.max].map((e) => vline(x(e), f.top, f.height - f.bottom, PALETTE.limit, `stroke-width="1.4"${dashAttr('dotted')}`)).join('')
  const marks: string[] = []
  if (d.least && Number.isFinite(d.least.invP)) {
    marks.push(`<circle cx="${n(x(d.least.e))}" cy="${n(y(perMN(d.least.invP)))}" r="4" fill="${PALETTE.ink}"/>` + text(x(d.least.e) + 7, y(perMN(d.least.invP)) - 6, 'least force'))
  }
  if (d.design && Number.isFinite(d.design.invP)) {
    marks.push(`<circle cx="${n(x(d.design.e))}" cy="${n(y(perMN(d.design.invP)))}" r="4.5" fill="none" stroke="${PALETTE.sand}" stroke-width="2"/>` + text(x(d.design.e) + 7, y(perMN(d.design.invP)) + 14, 'design'))
  }
  const items: LegendItem[] = [
    { label: 'feasible region', stroke: PALETTE.blue, fill: PALETTE.region },
    { label: 'transfer, top', stroke: PALETTE.blue, dash: 'dashed' },
    { label: 'transfer, bottom', stroke: PALETTE.olive, dash: 'dashed' },
    { label: 'service, top', stroke: PALETTE.blue },
    { label: 'service, bottom', stroke: PALETTE.olive },
    { label: 'e limits', stroke: PALETTE.limit, dash: 'dotted' },
  ]
  return svgOpen(f, d.title)
    + `<title>${esc(d.title)}</title>`
    + legend(f, items)
    + xAxis(f, x, 'e (mm), below the centroid +')
    + yAxis(f, y, '1/P (1/MN)')
    + region + lines + limits + marks.join('')
    + '</svg>'
}
