/**
 * The ULS envelope figures: the design moment and shear along the member against MRd and VRd. The
 * values are read back from the SVG by inverting the scales its own tick labels state, and must
 * equal the engine's series and its bending and shear checks within the 0.1 px rounding of the drawing.
 */
import { describe, expect, it } from 'vitest'
import { DEMO_BB1, DEMO_PS2 } from '../../../shared/engine/input/demo'
import { designMember } from '../../../shared/engine/member/design'
import type { Design } from '../../../shared/engine/member/design'
import { ptMemberModel } from '../../../shared/report/models'
import { compileTemplate } from '../../../shared/report/compile'
import { renderReport } from '../../../shared/report/render'
import { BUILTIN_TEMPLATES } from '../../../shared/report/builtins'
import { PALETTE } from '../../../shared/report/figures/svg'
import { startTags } from './helpers'

/** PS-2 with its last span a cantilever, a point load and a line load in span 2 (a member the demos do not cover). */
const CANTILEVER = {
  ...DEMO_PS2,
  geometry: { ...DEMO_PS2.geometry, supports: ['pinned', 'pinned', 'pinned', 'pinned', 'free'] },
  loads: { ...DEMO_PS2.loads, points: [{ span: 2, at: 3000, P: 20000 }], lines: [{ span: 2, at: 6000, w: 5 }] },
}
const DESIGNS: Record<string, Design> = { 'PS-2': designMember(DEMO_PS2), 'BB-1': designMember(DEMO_BB1), 'PS-2 with a cantilever and added loads': designMember(CANTILEVER) }

interface Axis { pixel: (v: number) => number; value: (px: number) => number; unitsPerPixel: number }

/** The linear map the figure used, from two of its own tick labels (the farthest apart). */
function axisFrom(ticks: Array<{ px: number; v: number }>): Axis {
  expect(ticks.length).toBeGreaterThanOrEqual(2)
  const a = ticks.reduce((p, t) => (t.px < p.px ? t : p))
  const b = ticks.reduce((p, t) => (t.px > p.px ? t : p))
  const k = (b.v - a.v) / (b.px - a.px)
  return { value: (px) => a.v + (px - a.px) * k, pixel: (v) => a.px + (v - a.v) / k, unitsPerPixel: Math.abs(k) }
}

function number(label: string): number {
  return Number(label.replace(/−/g, '-').replace(/,/g, ''))
}

/** The x and y scales from the tick labels: y labels end-anchored left of the plot, x labels centred under it. */
function scales(svg: string): { x: Axis; y: Axis } {
  const texts = [...svg.matchAll(/<text x="([-\d.]+)" y="([-\d.]+)"([^>]*)>([^<]*)<\/text>/g)].map((m) => ({ x: Number(m[1]), y: Number(m[2]), attrs: m[3]!, body: m[4]! }))
  const yTicks = texts.filter((t) => t.attrs.includes('text-anchor="end"') && t.x === 56 && /^[−\d.,]+$/.test(t.body)).map((t) => ({ px: t.y - 4, v: number(t.body) }))
  const bottom = Math.max(...texts.filter((t) => t.attrs.includes('text-anchor="middle"') && /^[−\d.,]+$/.test(t.body)).map((t) => t.y))
  const xTicks = texts.filter((t) => t.attrs.includes('text-anchor="middle"') && t.y === bottom && /^[−\d.,]+$/.test(t.body)).map((t) => ({ px: t.x, v: number(t.body) }))
  return { x: axisFrom(xTicks), y: axisFrom(yTicks) }
}

/** The markup inside the group that names a curve. */
function groupOf(svg: string, label: string): string {
  const m = svg.match(new RegExp(`<g role="group" aria-label="${label}">(.*?)</g>`))
  expect(m, `group ${label}`).not.toBeNull()
  return m![1]!
}

function pathPoints(markup: string): Array<[number, number]> {
  const d = startTags(markup).find((t) => t.name === 'path')!.attrs.find((a) => a.name === 'd')!.value
  return [...d.matchAll(/[ML](-?[\d.]+),(-?[\d.]+)/g)].map((m) => [Number(m[1]), Number(m[2])])
}

function markers(markup: string, name: 'circle' | 'rect'): Array<[number, number]> {
  return startTags(markup).filter((t) => t.name === name).map((t) => {
    const get = (k: string): number => Number(t.attrs.find((a) => a.name === k)!.value)
    return name === 'circle' ? [get('cx'), get('cy')] : [get('x') + 2.4, get('y') + 2.4]
  })
}

/** Within the drawing's rounding: 0.1 px on each coordinate and on the tick labels it is read by. */
function expectPlotted(actual: number, expected: number, axis: Axis, what: string): void {
  expect(Math.abs(actual - expected), `${what}: ${actual} against ${expected}`).toBeLessThanOrEqual(0.25 * axis.unitsPerPixel + 1e-9)
}

describe.each(Object.keys(DESIGNS))('ULS envelope figures of %s', (sheet) => {
  const d = DESIGNS[sheet]!
  const moments = ptMemberModel.figures['uls-moments']!.render(d, undefined)
  const shear = ptMemberModel.figures['uls-shear']!.render(d, undefined)

  it('name what they show in a title and in words beside the lines', () => {
    expect(moments).toContain('<title>Design moments at ULS against the bending resistance</title>')
    expect(moments).toContain('M (kNm), sagging + below')
    expect(moments).toContain('MEd envelope (greatest and least)')
    expect(shear).toContain('<title>Design shear at ULS against the shear resistance</title>')
    expect(shear).toContain('V (kN)')
    for (const svg of [moments, shear]) expect(svg).not.toMatch(/NaN|Infinity|undefined/)
  })

  it('draw the design moments where the engine has them, equal to its series and to the bending checks', () => {
    const { x, y } = scales(moments)
    const s = d.series
    const greatest = pathPoints(groupOf(moments, 'MEd, greatest'))
    const least = pathPoints(groupOf(moments, 'MEd, least'))
    expect(greatest).toHaveLength(s.X.length)
    expect(least).toHaveLength(s.X.length)
    greatest.forEach(([px, py], k) => {
      expectPlotted(x.value(px), (s.X[k] as number) / 1000, x, `X at station ${k}`)
      expectPlotted(y.value(py), (s.momentUlsMax[k] as number) / 1e6, y, `MEd,max at station ${k}`)
      expectPlotted(y.value(least[k]![1]), (s.momentUlsMin[k] as number) / 1e6, y, `MEd,min at station ${k}`)
    })
    // at each section the bending check looks at, the line passes through its MEd
    for (const u of d.uls.sections) {
      const k = s.X.findIndex((X) => Math.abs(X - u.X) < 1e-6)
      expect(k, u.label).toBeGreaterThanOrEqual(0)
      expectPlotted(y.value(greatest[k]![1]), u.MEdMax / 1e6, y, `${u.label} MEd,max`)
      expectPlotted(y.value(least[k]![1]), u.MEdMin / 1e6, y, `${u.label} MEd,min`)
    }
  })

  it('mark MRd at every section where the engine computes it, sagging below and hogging above', () => {
    const { x, y } = scales(moments)
    for (const [face, label, marker, sign] of [['sagging', 'MRd, sagging', 'circle', 1], ['hogging', 'MRd, hogging', 'rect', -1]] as const) {
      const expected = d.uls.sections.filter((u) => u[face] !== null)
      expect(expected.length, `${face} sections`).toBeGreaterThan(0)
      const group = groupOf(moments, label)
      expect(group).toContain('stroke-dasharray') // the resistance line is dashed, the design moments solid
      const drawn = markers(group, marker)
      expect(drawn).toHaveLength(expected.length)
      drawn.forEach(([px, py], k) => {
        const u = expected[k]!
        expectPlotted(x.value(px), u.X / 1000, x, `${u.label} X`)
        expectPlotted(y.value(py), (sign * u[face]!.MRd) / 1e6, y, `${u.label} MRd ${face}`)
      })
    }
    expect(moments).toContain('>MRd sagging<')
    expect(moments).toContain('>MRd hogging<')
  })

  it('draw the design shear along the member and VRd at every section the shear check looks at', () => {
    const { x, y } = scales(shear)
    const s = d.series
    const greatest = pathPoints(groupOf(shear, 'VEd, greatest'))
    const least = pathPoints(groupOf(shear, 'VEd, least'))
    expect(greatest).toHaveLength(s.X.length)
    greatest.forEach(([, py], k) => {
      expectPlotted(y.value(py), (s.shearUlsMax[k] as number) / 1e3, y, `VEd,max at station ${k}`)
      expectPlotted(y.value(least[k]![1]), (s.shearUlsMin[k] as number) / 1e3, y, `VEd,min at station ${k}`)
    })
    const drawn = markers(groupOf(shear, 'VRd'), 'rect')
    expect(drawn).toHaveLength(d.uls.shear.length)
    const starts = [0]
    for (const L of d.input.geometry.spans) starts.push(starts[starts.length - 1]! + L)
    drawn.forEach(([px, py], k) => {
      const v = d.uls.shear[k]!
      const at = s.X.findIndex((_, i) => s.span[i] === v.span && Math.abs((s.x[i] as number) - v.x) < 1e-6)
      expect(at, v.label).toBeGreaterThanOrEqual(0)
      // the design shear drawn there is the one the check uses
      expect(Math.max(Math.abs(s.shearUlsMax[at] as number), Math.abs(s.shearUlsMin[at] as number))).toBeCloseTo(v.VEd, 3)
      expectPlotted(x.value(px), ((starts[v.span] as number) + v.x) / 1000, x, `${v.label} X`)
      expectPlotted(Math.abs(y.value(py)), v.VRd / 1e3, y, `${v.label} VRd`)
      // on the side of the axis where the governing design shear lies
      const negative = Math.abs(s.shearUlsMin[at] as number) > Math.abs(s.shearUlsMax[at] as number)
      expect(y.value(py) < 0, v.label).toBe(negative)
      expect(shear).toContain(`VRd ${String(Math.round((negative ? -v.VRd : v.VRd) / 1e3)).replace('-', '−')}`)
    })
  })
})

describe('a cantilever in the ULS figures', () => {
  it('has no shear resistance at its free tip', () => {
    const d = DESIGNS['PS-2 with a cantilever and added loads']!
    expect(d.uls.shear.some((v) => v.support === 4)).toBe(false)
    const s = d.series
    // the tip carries no moment and no shear
    expect(Math.abs(s.momentUlsMax[s.X.length - 1] as number)).toBeLessThan(1e-3 * Math.max(...s.momentUlsMax.map(Math.abs)))
    expect(Math.abs(s.shearUlsMin[s.X.length - 1] as number)).toBeLessThan(1e-3 * Math.max(...s.shearUlsMin.map(Math.abs)))
  })

  it('marks the four supports but not the free tip, in every figure along the member', () => {
    const d = DESIGNS['PS-2 with a cantilever and added loads']!
    for (const name of ['tendon', 'moments', 'prestress-moments', 'force', 'deflection', 'uls-moments', 'uls-shear']) {
      const svg = ptMemberModel.figures[name]!.render(d, undefined)
      const marks = startTags(svg).filter((t) => t.name === 'path' && t.attrs.some((a) => a.name === 'fill' && a.value === PALETTE.axis))
      expect(marks, name).toHaveLength(4)
    }
  })
})

describe('the built-in sheets', () => {
  it.each(BUILTIN_TEMPLATES.filter((t) => /plot=uls-moments/.test(t.text)).map((t) => [t.file, t.text]))('%s draws both ULS figures with captions', (_file, text) => {
    const report = renderReport(compileTemplate(text, ptMemberModel), { inputs: DEMO_PS2, results: DESIGNS['PS-2'], mode: 'print' })
    expect(report.html).toContain('aria-label="Design moments at ULS against the bending resistance"')
    expect(report.html).toContain('aria-label="Design shear at ULS against the shear resistance"')
    expect(report.unresolved).toEqual([])
  })
})
