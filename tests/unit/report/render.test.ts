import { describe, expect, it } from 'vitest'
import { compileTemplate } from '../../../shared/report/compile'
import { REPORT_CAUTION, renderReport } from '../../../shared/report/render'
import { BEAM_INPUT, beamModel, runBeam } from './fixtures/beam-model'
import { compileBody, renderBody, startTags, template, withoutMath } from './helpers'

const SHEET = [
  '# Loads',
  '',
  'Depth :in[geometry.h], SDL :in[loads.sdl], concrete :in[concrete.grade], spans :in[geometry.spans].',
  'Again :in[geometry.h].',
  '',
  '::: each{in=spans as=s}',
  '## Span :val[#s]',
  'Moment :val[s.M] over :val[s.L].',
  '',
  '::: figure{plot=span at=s}',
  'Span :val[#s] to scale.',
  ':::',
  ':::',
  '',
  '# Stresses in service',
  '',
  '::: checks{group=service}',
  'Top fibre against 0.6 fck (7.2(2)).',
  ':::',
  '',
  '# Summary of checks',
  '',
  '::: checks',
  ':::',
].join('\n')

describe('rendering a sheet', () => {
  it('shows input fields in edit mode, in display units, with ids that survive re-rendering', () => {
    const { html } = renderBody(SHEET, 'edit')
    const inputs = startTags(html).filter((t) => t.name === 'input' || t.name === 'select').map((t) => Object.fromEntries(t.attrs.map((a) => [a.name, a.value])))
    expect(inputs.map((i) => [i.id, i['data-key'], i.value])).toEqual([
      ['tb-in-geometry-h', 'geometry.h', '260'],
      ['tb-in-loads-sdl', 'loads.sdl', '2'], // 0.002 N/mm² = 2 kN/m²
      ['tb-in-concrete-grade', 'concrete.grade', undefined],
      ['tb-in-geometry-spans', 'geometry.spans', '7.8, 9.6'],
      ['tb-in-geometry-h-2', 'geometry.h', '260'],
    ])
    expect(html).toContain('<option value="C30/37" selected>C30/37</option>')
    expect(html).toContain('<span class="tb-unit">kN/m²</span>')
    // another value, the same markup around it: the editor can keep focus by id
    const changed = renderBody(SHEET, 'edit', { ...BEAM_INPUT, geometry: { ...BEAM_INPUT.geometry, h: 280 } }).html
    const ids = (h: string): string[] => startTags(h).map((t) => t.attrs.find((a) => a.name === 'id')?.value ?? '').filter(Boolean)
    expect(ids(changed)).toEqual(ids(html))
  })

  it('shows frozen values with their units in frozen and print modes', () => {
    for (const mode of ['frozen', 'print'] as const) {
      const html = withoutMath(renderBody(SHEET, mode).html)
      expect(html).not.toContain('<input')
      expect(html).toContain('<span class="tb-field tb-frozen" data-key="geometry.h">260\u202fmm</span>')
      expect(html).toContain('<span class="tb-field tb-frozen" data-key="geometry.spans">7.80\u202fm, 9.60\u202fm</span>')
      expect(html).toContain(`class="tb-report tb-mode-${mode}"`)
    }
  })

  it('repeats an each block per element, with its own section ids and figures', () => {
    const report = renderBody(SHEET)
    expect(report.sections.map((s) => [s.id, s.title, s.level])).toEqual([
      ['sec-loads', 'Loads', 1],
      ['sec-span-1', 'Span 1', 2],
      ['sec-span-2', 'Span 2', 2],
      ['sec-stresses-in-service', 'Stresses in service', 1],
      ['sec-summary-of-checks', 'Summary of checks', 1],
    ])
    // 13.5 kN/m on 9.6 m: wL²/8 = 155.5 kNm (simple-span formula)
    expect(report.html).toContain('Moment <span class="tb-val">155.5\u202fkNm</span> over <span class="tb-val">9.60\u202fm</span>.')
    expect([...report.html.matchAll(/<figure class="tb-figure" data-plot="span"><svg[^>]*><text x="1" y="5">([\d.]+)<\/text><\/svg><figcaption><p>Span <span class="tb-val">(\d)<\/span>/g)].map((m) => [m[1], m[2]])).toEqual([['7.8', '1'], ['9.6', '2']])
  })

  it('repeats the body rows of a table held by an each, once per kept element', () => {
    const body = '::: each{in=spans as=s}\n| Span | L | M |\n| --- | --- | --- |\n| :val[#s] | :val[input.geometry.spans.#s] | :val[s.M] |\n:::\n'
    const html = renderBody(body).html
    expect((html.match(/<table>/g) ?? []).length).toBe(1)
    expect((html.match(/<th>/g) ?? []).length).toBe(3)
    const rows = [...html.matchAll(/<tr>\s*<td><span class="tb-val">(\d)<\/span><\/td>\s*<td><span class="tb-val">([^<]+)<\/span><\/td>\s*<td><span class="tb-val">([^<]+)<\/span><\/td>/g)].map((m) => m.slice(1))
    expect(rows).toEqual([['1', '7.80\u202fm', '102.7\u202fkNm'], ['2', '9.60\u202fm', '155.5\u202fkNm']])
    const only = renderBody('::: each{in=spans as=s where=s.label is="Span 2"}\n- :val[#s]: :val[s.M]\n:::\n').html
    expect(only).toContain('<li><span class="tb-val">2</span>: <span class="tb-val">155.5\u202fkNm</span></li>')
    expect(only).not.toContain('102.7')
  })

  it('fills the check tables and ties every check to the section that shows it', () => {
    const report = renderBody(SHEET)
    const rows = [...report.html.matchAll(/<tr class="tb-check (tb-pass|tb-fail)" data-check="([^"]+)" data-section="([^"]*)">/g)].map((m) => [m[2], m[3]])
    expect(rows).toEqual([
      ['service.top.0', 'sec-stresses-in-service'],
      ['service.top.1', 'sec-stresses-in-service'],
      ['service.top.0', 'sec-stresses-in-service'],
      ['transfer.top.0', 'sec-summary-of-checks'],
      ['service.top.1', 'sec-stresses-in-service'],
      ['transfer.top.1', 'sec-summary-of-checks'],
    ])
    expect(report.checks.map((c) => [c.id, c.sectionId])).toEqual([
      ['service.top.0', 'sec-stresses-in-service'],
      ['transfer.top.0', 'sec-summary-of-checks'],
      ['service.top.1', 'sec-stresses-in-service'],
      ['transfer.top.1', 'sec-summary-of-checks'],
    ])
    // 155.52 kNm / (1000 × 260² / 6 mm³) = 13.80 MPa against 0.6 × 30 = 18 MPa (EN 1992-1-1 7.2(2)): 0.77
    expect(report.html).toContain('<td class="tb-num">13.80\u202fMPa</td><td class="tb-num">18.00\u202fMPa</td><td class="tb-num">0.77</td><td class="tb-verdict">pass</td>')
    expect(report.html).toContain('4 checks: 4 pass, 0 fail; highest utilisation 0.77 (Top fibre compression, Span 2)')
  })

  it('marks failing checks and counts them', () => {
    const heavy = { ...BEAM_INPUT, loads: { sdl: 0.002, qk: 0.015 } }
    const report = renderBody(SHEET, 'frozen', heavy)
    expect(report.checks.filter((c) => !c.pass).map((c) => c.id)).toEqual(['service.top.1'])
    expect(report.html).toMatch(/<tr class="tb-check tb-fail" data-check="service.top.1"/)
    expect(report.html).toContain('2 checks: 1 pass, 1 fail')
  })

  it('renders without results (the engine refused the inputs) and lists what it could not show', () => {
    const compiled = compileBody(SHEET)
    const report = renderReport(compiled, { inputs: { geometry: { h: 260 } }, results: null, mode: 'edit' })
    expect(report.checks).toEqual([])
    expect(report.html).toContain('No results yet: the checks appear once the inputs are complete.')
    expect(report.unresolved.map((u) => [u.key, u.line])).toEqual([
      ['loads.sdl', 9],
      ['concrete.grade', 9],
      ['geometry.spans', 9],
      ['spans', 12],
    ])
    expect(report.html).toContain('value="260"')
  })

  it('shows a part the engine left out (null) or an optional input not given as —, without listing it', () => {
    const compiled = compileBody('::: each{in=spans as=s}\n- :val[#s] :val[s.M]\n:::\n\nImposed :val[input.loads.qk], field :in[loads.qk].\n')
    const inputs = { ...BEAM_INPUT, loads: { sdl: 0.002, qk: 0.005 } }
    const results = runBeam(inputs) as unknown as { spans: unknown[]; input: { loads: Record<string, unknown> } }
    results.spans[1] = null
    results.input = { ...results.input, loads: { sdl: 0.002 } }
    const report = renderReport(compiled, { inputs: { ...inputs, loads: { sdl: 0.002 } }, results, mode: 'frozen' })
    expect(report.unresolved).toEqual([])
    expect(report.html).toContain('<li><span class="tb-val">2</span> <span class="tb-val">—</span></li>')
    expect(report.html).toContain('Imposed <span class="tb-val">—</span>, field <span class="tb-field tb-frozen" data-key="loads.qk">—</span>.')
  })

  it('is deterministic: the same inputs give the same bytes, from a fresh compile too', () => {
    const results = runBeam(BEAM_INPUT)
    const a = renderReport(compileTemplate(template(SHEET), beamModel), { inputs: BEAM_INPUT, results, mode: 'print' })
    const b = renderReport(compileTemplate(template(SHEET), beamModel), { inputs: structuredClone(BEAM_INPUT), results: runBeam(structuredClone(BEAM_INPUT)), mode: 'print' })
    const compiled = compileTemplate(template(SHEET), beamModel)
    renderReport(compiled, { inputs: BEAM_INPUT, results, mode: 'edit' })
    const c = renderReport(compiled, { inputs: BEAM_INPUT, results, mode: 'print' })
    expect(b.html).toBe(a.html)
    expect(c.html).toBe(a.html)
  })

  it('ends every report with the caution', () => {
    for (const body of ['', SHEET, '# Only a heading\n']) {
      const { html } = renderBody(body)
      expect(html.trimEnd().endsWith(`<aside class="tb-caution" role="note"><p>${REPORT_CAUTION}</p></aside>\n</article>`)).toBe(true)
    }
    expect(REPORT_CAUTION).toMatch(/competent engineer/)
    expect(REPORT_CAUTION).toMatch(/national annex/)
  })
})
