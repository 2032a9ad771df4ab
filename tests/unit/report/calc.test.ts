/**
 * The engineer's own calculations: quantities with units against hand calculations written out
 * here, dimension errors named on both sides, the closed scope against hostile expressions
 * (fast-check), and a calculation block in a sheet — its lines typeset, its checks in the summary,
 * its quantities shown by :val[calc.name] — with the problems a template author sees.
 */
import { describe, expect, it } from 'vitest'
import fc from 'fast-check'
import { evaluateCalcBlock } from '../../../shared/calc/quantities'
import type { SheetValue } from '../../../shared/calc/quantities'
import { compileTemplate, lintTemplate } from '../../../shared/report/compile'
import { renderReport } from '../../../shared/report/render'
import { BEAM_INPUT, beamModel, runBeam } from './fixtures/beam-model'
import { BODY_LINE, renderBody, template, withoutMath } from './helpers'

const SHEET: Record<string, SheetValue> = {
  'section.h': { value: 260, unit: 'mm', precision: 0, symbol: 'h', label: 'Overall depth' },
  'loads.imposed': { value: 5, unit: 'kN/m²', precision: 2, symbol: 'q_k', label: 'Imposed load' },
}
const run = (text: string) => evaluateCalcBlock(text, { lookup: (k) => SHEET[k], blockId: '1' })

describe('quantities with units (hand calculations)', () => {
  it('a façade line load: 3.6 m × 0.75 kN/m² = 2.70 kN/m', () => {
    const r = run('h_f = 3.6 m  # Façade height\ng_f = 0.75 kN/m^2  # Façade weight\nw_f = h_f * g_f  # Façade line load')
    expect(r.problems).toEqual([])
    const w = r.quantities.find((q) => q.name === 'w_f')!
    expect(w.unit).toBe('kN/m') // by hand: m × kN/m² = kN/m
    expect(w.value).toBeCloseTo(2.7, 12) // by hand: 3.6 × 0.75 = 2.70
    expect(w.description).toBe('Façade line load')
    expect(w.tex.given).toBe(false)
    expect(r.quantities[0]!.tex.given).toBe(true)
  })

  it('a hand check of a support moment: w·L²/8 with w = 12.5 kN/m, L = 9.6 m is 144.0 kNm', () => {
    const r = run('w = 12.5 kN/m\nL = 9.6 m\nM_0 = w * L^2 / 8')
    expect(r.problems).toEqual([])
    const M = r.quantities.find((q) => q.name === 'M_0')!
    expect(M.unit).toBe('kNm')
    expect(M.value).toBeCloseTo(144, 9) // by hand: 12.5 × 9.6² / 8 = 144.0
  })

  it('a moment written as one word: 12 kNm + 3 kN × 2 m = 18 kNm, and 12 kNm ≤ 20 kNm has utilisation 0.6', () => {
    const r = run('a = 12 kNm\nb = 3 kN * 2 m\nc = a + b\ncheck a <= 20 kNm')
    expect(r.problems).toEqual([])
    expect(r.quantities.map((q) => [q.name, q.value, q.unit])).toEqual([['a', 12, 'kNm'], ['b', 6, 'kNm'], ['c', 18, 'kNm']]) // by hand
    expect(r.checks[0]!.utilisation).toBeCloseTo(0.6, 12) // by hand: 12 / 20
  })

  it('the sheet\'s own values by key, in their display units: 2 × q_k = 10 kN/m²; h in m = 0.26 m', () => {
    const r = run('q_2 = 2 * val("loads.imposed")\nh_m = val("section.h") to m')
    expect(r.problems).toEqual([])
    expect(r.quantities[0]!.value).toBeCloseTo(10, 12)
    expect(r.quantities[0]!.unit).toBe('kN/m²')
    expect(r.quantities[1]!.value).toBeCloseTo(0.26, 12)
    expect(r.quantities[0]!.tex.symbols).toContain('q_k')
  })

  it('the engineer\'s checks: utilisation actual/limit for ≤, limit/actual for ≥ (as the engine\'s checks)', () => {
    const r = run('w = 2.7 kN/m\ncheck w <= 7.5 kN/m  # within the design value\ncheck val("section.h") >= 300 mm  # deep enough')
    expect(r.problems).toEqual([])
    expect(r.checks[0]!.pass).toBe(true)
    expect(r.checks[0]!.utilisation).toBeCloseTo(2.7 / 7.5, 12)
    expect(r.checks[0]!.title).toBe('within the design value')
    expect(r.checks[1]!.pass).toBe(false)
    expect(r.checks[1]!.utilisation).toBeCloseTo(300 / 260, 12)
    expect(r.checks[1]!.group).toBe('own')
  })
})

describe('mistakes, in words', () => {
  it('adding kN to m names both quantities and their units', () => {
    const r = run('a = 3 kN\nb = 2 m\nc = a + b')
    expect(r.problems).toEqual([{ line: 3, name: 'c', message: 'adding a (kN) and b (m): the units do not match' }])
  })

  it('a name used before it is defined, a taken name, a check that compares nothing, a key the sheet lacks', () => {
    const r = run('x = y * 2\nm = 3\ncheck 3 kN\nz = val("no.such.key")')
    expect(r.problems.map((p) => [p.line, p.message])).toEqual([
      [1, '"y" is neither a quantity defined above nor a unit'],
      [2, '"m" is taken (a unit, a function or a word of the language): choose another name'],
      [3, 'a check compares two values: check a <= b (or <, >=, >)'],
      [4, 'the sheet has no value "no.such.key"'],
    ])
  })

  it('hostile forms stay inert: definitions, imports, property access, prototype names, huge numbers, deep nesting', () => {
    const hostile = [
      'f(x) = x', 'a = import({})', 'a = createUnit("foo")', 'a = evaluate("1")', 'a = constructor', 'a = x.constructor',
      '__proto__ = 1', 'constructor = 1', 'a = [1, 2]', 'a = {b: 1}', 'a = "text"', 'a = 10^10^10', 'a = 1 / 0',
      `a = ${'('.repeat(200)}1${')'.repeat(200)}`, 'a = 1 ? 2 : 3', 'a = 1:10', 'a = parse("1")', 'a = sqrt', 'a = cos(1 m)',
    ]
    for (const line of hostile) {
      const r = run(line)
      expect(r.quantities, line).toEqual([])
      expect(r.problems.length, line).toBe(1)
    }
  })

  it('random text never throws and never defines a quantity it should not (fast-check)', () => {
    fc.assert(fc.property(fc.string({ maxLength: 120 }), (text) => {
      const r = run(text)
      expect(Array.isArray(r.problems)).toBe(true)
      for (const q of r.quantities) expect(Number.isFinite(q.value)).toBe(true)
    }), { numRuns: 1000 })
  })

  it('random expressions over defined quantities and units stay finite or give a problem (fast-check)', () => {
    const atom = fc.constantFrom('a', 'b', '2', '3.5 m', '1 kN', '0', 'val("section.h")', 'pi')
    const expr = fc.letrec((tie) => ({
      e: fc.oneof({ depthSize: 'small' }, atom, fc.tuple(tie('e'), fc.constantFrom('+', '-', '*', '/', '^'), tie('e')).map(([x, o, y]) => `(${x as string} ${o} ${y as string})`)),
    })).e
    fc.assert(fc.property(expr, (e) => {
      const r = run(`a = 2 m\nb = 3 kN\nc = ${e as string}`)
      for (const q of r.quantities) expect(Number.isFinite(q.value)).toBe(true)
      expect(r.quantities.length + r.problems.length).toBe(3)
    }), { numRuns: 500 })
  })
})

describe('a calculation block in a sheet', () => {
  const BODY = [
    '# Façade',
    '',
    '::: calc',
    'h_f = 3.6 m  # Façade height',
    'g_f = 0.75 kN/m^2  # Façade weight',
    'w_f = h_f * g_f  # Façade line load',
    'check w_f <= 7.5 kN/m  # Façade load within the load designed for',
    ':::',
    '',
    'The façade brings :val[calc.w_f] to the edge.',
    '',
    '# Summary of checks',
    '',
    '::: checks',
    ':::',
  ].join('\n')

  it('loads, typesets each quantity, shows its value by :val, and puts its check in the summary', () => {
    expect(lintTemplate(template(BODY), beamModel)).toEqual([])
    const r = renderBody(BODY)
    expect(r.html).toContain('data-name="w_f"')
    expect(withoutMath(r.html)).toContain('The façade brings <span class="tb-val">2.70\u202fkN/m</span> to the edge.')
    const own = r.checks.find((c) => c.id === 'calc.1.1')!
    expect(own.pass).toBe(true)
    expect(own.sectionId).toBe('sec-summary-of-checks')
    expect(r.html).toContain('data-check="calc.1.1"')
  })

  it('a mistake in a block shows its template line and the quantity; the rest of the sheet renders', () => {
    const body = '# Façade\n\n::: calc\na = 3 kN\nb = 2 m\nc = a + b\n:::\n\nAfter.'
    const problems = lintTemplate(template(body), beamModel)
    expect(problems).toEqual([]) // the units are known only when it runs
    const r = renderBody(body)
    expect(r.html).toContain(`Line ${BODY_LINE + 5} (c): adding a (kN) and b (m): the units do not match`)
    expect(r.html).toContain('After.')
  })

  it('the author is told of a name not defined, a key the model lacks, and a quantity no block defines', () => {
    const body = '::: calc\nx = y + 1\nz = val("geometry.nope")\n:::\n\n:val[calc.q]'
    const messages = lintTemplate(template(body), beamModel).map((e) => e.message)
    expect(messages.some((m) => m.includes(`line ${BODY_LINE + 1}`) && m.includes('"y" is neither a quantity defined above nor a unit'))).toBe(true)
    expect(messages.some((m) => m.includes(`line ${BODY_LINE + 2}`) && m.includes('geometry.nope'))).toBe(true)
    expect(messages.some((m) => m.includes('no calculation block defines "q"'))).toBe(true)
  })
})

describe('an image attached to the sheet as a figure', () => {
  const BODY = '# Site\n\n::: figure{image="soffit-drop.png"}\nThe drop over column B2 as cast.\n:::\n'

  it('shows the attached image with its caption and SHA-256, numbered like the other figures', () => {
    expect(lintTemplate(template(BODY), beamModel)).toEqual([])
    const r = renderReport(compileTemplate(template(BODY), beamModel), { inputs: BEAM_INPUT, results: runBeam(BEAM_INPUT), mode: 'frozen', images: { 'soffit-drop.png': { src: 'data:image/png;base64,iVBORw0KGgo=', sha256: 'ab'.repeat(32) } } })
    expect(r.html).toContain('<img class="tb-image" src="data:image/png;base64,iVBORw0KGgo=" alt="The drop over column B2 as cast."')
    expect(r.html).toContain(`data-sha256="${'ab'.repeat(32)}"`)
    expect(r.html).toContain('<figcaption>')
  })

  it('a name not attached, or a source that is not the sheet\'s own, shows a message instead of loading anything', () => {
    const missing = renderBody(BODY)
    expect(missing.html).toContain('The image "soffit-drop.png" is not attached to this sheet')
    const hostile = renderReport(compileTemplate(template(BODY), beamModel), { inputs: BEAM_INPUT, results: runBeam(BEAM_INPUT), mode: 'frozen', images: { 'soffit-drop.png': { src: 'https://elsewhere.example/x.png', sha256: '' } } })
    expect(hostile.html).not.toContain('elsewhere.example')
  })

  it('a figure takes a plot or an image, not both or neither', () => {
    expect(lintTemplate(template('::: figure{plot=span image=x.png}\n:::'), beamModel).map((e) => e.detail)).toContain('::: figure takes plot=… (a figure of the results) or image=… (an image attached to the sheet, by its file name), one of them')
    expect(lintTemplate(template('::: figure\n:::'), beamModel).length).toBeGreaterThan(0)
  })
})
