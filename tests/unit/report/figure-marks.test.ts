/**
 * The engineer's own quantities marked on the figures of the results: a line at the quantity's
 * value, placed on the plot's own scale (read back from the axis ticks), the plot's range grown to
 * show it, places along the member as upright lines, and every mistake said in words — to the
 * template author when the sheet is checked, under the figure when a value does not fit.
 */
import { describe, expect, it } from 'vitest'
import { DEMO_PS2 } from '../../../shared/engine/input/demo'
import { designMember } from '../../../shared/engine/member/design'
import { compileTemplate, lintTemplate } from '../../../shared/report/compile'
import { ptMemberModel } from '../../../shared/report/models'
import { renderReport } from '../../../shared/report/render'
import { startTags } from './helpers'

const FRONT = '---\nmodel: pt-member\ntitle: Marks\nversion: 1.0.0\n---\n'
const DESIGN = designMember(DEMO_PS2)

// A façade on a 2.4 m cantilever, by hand: w = 3.6 m × 0.75 kN/m² = 2.70 kN/m;
// M = w·L²/2 = 2.70 × 2.4² / 2 = 7.776 kNm; the shear at the root w·L = 6.48 kN.
const CALC = [
  '::: calc',
  'h_f = 3.6 m  # Façade height',
  'g_f = 0.75 kN/m^2  # Façade weight',
  'w_f = h_f * g_f  # Façade line load',
  'L_c = 2.4 m  # Cantilever',
  'M_c = w_f * L_c^2 / 2  # Root moment, by hand',
  'V_c = w_f * L_c  # Root shear, by hand',
  'M_big = 2000 kNm  # Far beyond the design moments',
  'x_s = 3 m  # A place along the member',
  ':::',
  '',
].join('\n')

function render(body: string): string {
  const text = FRONT + CALC + body
  expect(lintTemplate(text, ptMemberModel)).toEqual([])
  return renderReport(compileTemplate(text, ptMemberModel), { inputs: DEMO_PS2, results: DESIGN, mode: 'frozen' }).html
}

/** The figure's SVG, by its plot name. */
function svgOf(html: string, plot: string): string {
  const m = html.match(new RegExp(`<figure class="tb-figure" data-plot="${plot}">([\\s\\S]*?)</figure>`))
  expect(m, plot).not.toBeNull()
  return m![1]!
}

/** The value axis read back from its tick labels (x = left margin − 6, y = tick + 4): value → y. */
function valueAxis(svg: string): { valueAt(y: number): number; ticks: number[] } {
  const ticks = [...svg.matchAll(/<text x="56" y="([\d.-]+)" text-anchor="end" fill="[^"]+">([^<]+)<\/text>/g)]
    .map((m) => ({ y: Number(m[1]) - 4, v: Number(m[2]!.replace('−', '-').replace(/,/g, '')) }))
  expect(ticks.length).toBeGreaterThanOrEqual(2)
  const [a, b] = [ticks[0]!, ticks[ticks.length - 1]!]
  return { valueAt: (y) => a.v + ((y - a.y) * (b.v - a.v)) / (b.y - a.y), ticks: ticks.map((t) => t.v) }
}

/** The mark's line: the group named for it holds one line. */
function markLine(svg: string, label: string): { x1: number; y1: number; x2: number; y2: number } {
  const group = svg.match(new RegExp(`<g role="group" aria-label="${label.replace(/[.*+?^${}()|[\]\\]/g, '\\$&')}">([\\s\\S]*?)</g>`))
  expect(group, label).not.toBeNull()
  const line = startTags(group![1]!).find((t) => t.name === 'line')!
  const at = (name: string): number => Number(line.attrs.find((a) => a.name === name)!.value)
  return { x1: at('x1'), y1: at('y1'), x2: at('x2'), y2: at('y2') }
}

describe('a quantity marked on a figure of the results', () => {
  it('a moment by hand (7.776 kNm) is a line across the moment diagram at 7.776 on its own scale', () => {
    const svg = svgOf(render('::: figure{plot=moments mark=M_c}\nMoments, with the cantilever root moment by hand.\n:::\n'), 'moments')
    const line = markLine(svg, 'M_c = 7.776 kNm')
    expect(line.y1).toBe(line.y2)
    expect(line.x1).toBe(62) // across the whole plot: left margin …
    expect(line.x2).toBe(720 - 18) // … to the right margin
    // the scale is rounded to 0.1 px; one px is a few kNm on this plot, so compare to 0.5 % of its range
    const axis = valueAxis(svg)
    const range = Math.max(...axis.ticks) - Math.min(...axis.ticks)
    expect(Math.abs(axis.valueAt(line.y1) - 7.776)).toBeLessThan(0.005 * range)
    expect(svg).toContain('M_c = 7.776 kNm</text>')
  })

  it('the plot grows to show a value beyond the design moments', () => {
    const plain = valueAxis(svgOf(render('::: figure{plot=moments}\n:::\n'), 'moments'))
    const marked = svgOf(render('::: figure{plot=moments mark=M_big}\n:::\n'), 'moments')
    expect(Math.max(...plain.ticks)).toBeLessThan(2000)
    const axis = valueAxis(marked)
    expect(Math.max(...axis.ticks)).toBeGreaterThanOrEqual(2000)
    expect(Math.abs(axis.valueAt(markLine(marked, 'M_big = 2000 kNm').y1) - 2000)).toBeLessThan(0.005 * 2000)
  })

  it('a shear in kN on the shear envelope, a place in m upright on the moment diagram, several marks at once', () => {
    const html = render('::: figure{plot=uls-shear mark=V_c}\n:::\n\n::: figure{plot=prestress-moments mark="M_c, x_s"}\n:::\n')
    const shear = svgOf(html, 'uls-shear')
    const v = markLine(shear, 'V_c = 6.48 kN')
    const axis = valueAxis(shear)
    expect(Math.abs(axis.valueAt(v.y1) - 6.48)).toBeLessThan(0.005 * (Math.max(...axis.ticks) - Math.min(...axis.ticks)))
    const moments = svgOf(html, 'prestress-moments')
    markLine(moments, 'M_c = 7.776 kNm')
    const x = markLine(moments, 'x_s = 3 m')
    expect(x.x1).toBe(x.x2)
    // along the member: 0 m at the left margin (62), the member's length at 702
    const length = DEMO_PS2.geometry.spans.reduce((a, b) => a + b, 0) / 1000
    expect(x.x1).toBeCloseTo(62 + (3 / length) * (702 - 62), 0)
  })

  it('a quantity of another kind is said in words under the figure; the figure is still drawn', () => {
    const html = render('::: figure{plot=moments mark=g_f}\n:::\n')
    const svg = svgOf(html, 'moments')
    expect(svg).toContain('<svg')
    expect(svg).toContain('&quot;g_f&quot; (kN/m²) cannot be marked: this figure plots moments along the member.')
    expect(svg).not.toContain('aria-label="g_f')
  })

  it('a different mark draws a different figure (the figure cache keys on the marks)', () => {
    const a = svgOf(render('::: figure{plot=moments mark=M_c}\n:::\n'), 'moments')
    const b = svgOf(render('::: figure{plot=moments mark=M_big}\n:::\n'), 'moments')
    const none = svgOf(render('::: figure{plot=moments}\n:::\n'), 'moments')
    expect(new Set([a, b, none]).size).toBe(3)
  })

  it('the template author is told of a name no block defines, and of a figure that takes no marks', () => {
    const errors = lintTemplate(`${FRONT}${CALC}::: figure{plot=moments mark=M_x}\n:::\n\n::: figure{plot=tendon mark=M_c}\n:::\n\n::: figure{image="site.png" mark=M_c}\n:::\n`, ptMemberModel)
    const messages = errors.map((e) => e.message)
    expect(messages.some((m) => m.includes('no calculation block defines "M_x"'))).toBe(true)
    expect(messages.some((m) => m.includes('this figure takes no mark=…'))).toBe(true)
    expect(messages.some((m) => m.includes('an attached image takes no mark=…'))).toBe(true)
    // each on the line of its figure: the front matter is lines 1–5, the calculation block 6–15
    expect(errors.map((e) => e.line)).toEqual([16, 19, 22])
  })
})
