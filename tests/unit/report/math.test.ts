/**
 * \val{key} inside formulas. Check values: the fixture's strip is 260 mm deep, self-weight
 * 25 kN/m³ × 0.26 m × 1 m = 6.50 kN/m (EN 1991-1-1 Table A.1, 25 kN/m³ for reinforced concrete);
 * with 2.0 + 5.0 kN/m² on 1 m, w = 13.5 kN/m, and the simply supported moment wL²/8 on 7.8 m is
 * 13.5 × 7.8² / 8 = 102.67 kNm (any handbook's simple-span formula).
 */
import katex from 'katex'
import { describe, expect, it } from 'vitest'
import { escapeTexText, unitTex, valueTex } from '../../../shared/report/format'
import { renderBody } from './helpers'

function annotations(html: string): string[] {
  return [...html.matchAll(/<annotation encoding="application\/x-tex">([\s\S]*?)<\/annotation>/g)].map((m) => m[1]!.trim())
}

describe('values in formulas', () => {
  it('substitutes \\val{key} with the value and unit at the key\'s precision', () => {
    const body = '$$\ng_{sw} = \\gamma_c h = \\val{selfWeight}\n$$\n\n$M = \\frac{w L^2}{8} = \\val{spans.0.M}$ on $L = \\val{input.geometry.spans.0}$\n'
    const tex = annotations(renderBody(body).html)
    expect(tex).toEqual([
      'g_{sw} = \\gamma_c h = \\text{6.50}\\,\\mathrm{kN/m}',
      'M = \\frac{w L^2}{8} = \\text{102.7}\\,\\mathrm{kNm}',
      'L = \\text{7.80}\\,\\mathrm{m}',
    ])
  })

  it('reads a formula as symbols = numbers = result', () => {
    const body = '$$\nM = \\frac{w L^2}{8} = \\frac{(\\val{selfWeight} + \\val{input.loads.sdl} + \\val{input.loads.qk}) \\cdot \\val{input.geometry.spans.0}^2}{8} = \\val{spans.0.M}\n$$\n'
    const [tex] = annotations(renderBody(body).html)
    expect(tex).toBe('M = \\frac{w L^2}{8} = \\frac{(\\text{6.50}\\,\\mathrm{kN/m} + \\text{2.00}\\,\\mathrm{kN/m^{2}} + \\text{5.00}\\,\\mathrm{kN/m^{2}}) \\cdot \\text{7.80}\\,\\mathrm{m}^2}{8} = \\text{102.7}\\,\\mathrm{kNm}')
  })

  it('uses the element of an each block and its number', () => {
    const body = '::: each{in=spans as=s}\n$M_{\\val{#s}} = \\val{s.M}$\n:::\n'
    const tex = annotations(renderBody(body).html)
    // span 2: 13.5 × 9.6² / 8 = 155.52 kNm
    expect(tex).toEqual(['M_{\\text{1}} = \\text{102.7}\\,\\mathrm{kNm}', 'M_{\\text{2}} = \\text{155.5}\\,\\mathrm{kNm}'])
  })

  it('typesets negative values with a math minus, units upright, text escaped', () => {
    expect(valueTex(-1.25e6, { label: 'M', unit: 'kNm', precision: 2 })).toBe('-\\text{1.25}\\,\\mathrm{kNm}')
    expect(valueTex(-0.0004, { label: 'x', unit: 'MPa', precision: 2 })).toBe('\\text{0.00}\\,\\mathrm{MPa}')
    expect(valueTex(0.6, { label: 'ψ2', unit: '%', precision: 0 })).toBe('\\text{60}\\%')
    expect(valueTex(null, { label: 'x', unit: 'mm', precision: 0 })).toBe('\\text{—}')
    expect(unitTex('mm⁴')).toBe('\\mathrm{mm^{4}}')
    expect(unitTex('kN/m³')).toBe('\\mathrm{kN/m^{3}}')
    expect(escapeTexText('a_b {c} 50% #1 $ & ~ ^ \\x')).toBe('a\\_b \\{c\\} 50\\% \\#1 \\$ \\& \\textasciitilde{} \\textasciicircum{} \\textbackslash{}x')
    // KaTeX itself must accept every escaped string as plain text
    const html = katex.renderToString(`\\text{${escapeTexText('a_b {c} 50% #1 $ & ~ ^ \\x')}}`, { throwOnError: true })
    const mathml = html.slice(0, html.indexOf('<annotation')).replace(/<[^>]+>/g, '').replace(/\u00a0/g, ' ')
    expect(mathml).toBe('a_b {c} 50% #1 $ &amp; ~ ^ \\x')
  })

  it('shows a missing value as a dash and lists it as unresolved with its line', () => {
    const report = renderBody('Text.\n\n$x = \\val{input.label} + \\val{selfWeight}$\n', 'frozen', { geometry: { spans: [7800], h: 260 }, loads: { sdl: 0.002, qk: 0.005 }, concrete: { grade: 'C30/37' } })
    expect(report.unresolved).toEqual([{ key: 'input.label', path: 'input.label', line: 9 }])
    expect(annotations(report.html)).toEqual(['x = \\text{—} + \\text{6.50}\\,\\mathrm{kN/m}'])
  })
})
