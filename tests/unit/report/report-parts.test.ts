/**
 * The report in parts (one per top-level heading), which the editor patches part by part: the parts
 * put together are exactly the whole render, each part is keyed by the heading that opens it, and a
 * change of one input leaves the parts it does not reach byte for byte as they were.
 */
import { describe, expect, it } from 'vitest'
import { DEMO_BB1, DEMO_PS2 } from '../../../shared/engine/input/demo'
import { designMember } from '../../../shared/engine/member/design'
import { BUILTIN_TEMPLATES } from '../../../shared/report/builtins/index'
import { compileTemplate } from '../../../shared/report/compile'
import { ptMemberModel } from '../../../shared/report/models'
import { renderReport, renderReportParts } from '../../../shared/report/render'
import type { RenderMode } from '../../../shared/report/render'
import { setPath } from '../../../shared/utils/paths'
import { compileBody } from './helpers'
import { BEAM_INPUT, runBeam } from './fixtures/beam-model'

const MODES: RenderMode[] = ['edit', 'frozen', 'print']

describe.each(BUILTIN_TEMPLATES.map((t) => [t.id, t] as const))('the parts of built-in template %s', (_id, template) => {
  const compiled = compileTemplate(template.text, ptMemberModel)
  const design = designMember(DEMO_PS2)

  it.each(MODES)('put together give the whole render, byte for byte (%s)', (mode) => {
    const options = { inputs: design.input, results: design, mode }
    const whole = renderReport(compiled, options)
    const { parts, ...rest } = renderReportParts(compiled, options)
    expect(parts.open + parts.sections.map((s) => s.html).join('') + parts.close).toBe(whole.html)
    expect(rest).toEqual(whole)
    expect(whole.html).not.toContain('\u0000')
  })

  it('are keyed by the id of the heading that opens each, every key once', () => {
    const { parts, sections } = renderReportParts(compiled, { inputs: design.input, results: design, mode: 'edit' })
    const keys = parts.sections.map((s) => s.key)
    expect(new Set(keys).size).toBe(keys.length)
    expect(keys.at(-1)).toBe('caution')
    expect(parts.sections.length).toBeGreaterThan(5)
    for (const part of parts.sections.filter((s) => s.key !== 'lead' && s.key !== 'caution')) {
      expect(part.html.startsWith(`<h`)).toBe(true)
      expect(part.html).toMatch(new RegExp(`^<h[1-6] id="${part.key}">`))
      expect(sections.some((s) => s.id === part.key)).toBe(true)
    }
  })

  it('keep the same keys, and the parts a change does not reach stay as they were', () => {
    const before = renderReportParts(compiled, { inputs: design.input, results: design, mode: 'edit' }).parts.sections
    const changed = designMember(setPath(DEMO_PS2 as Record<string, unknown>, 'loads.superimposed', 2.1e-3))
    const after = renderReportParts(compiled, { inputs: changed.input, results: changed, mode: 'edit' }).parts.sections
    expect(after.map((s) => s.key)).toEqual(before.map((s) => s.key))
    const same = after.filter((s, i) => s.html === before[i]!.html)
    expect(same.length).toBeGreaterThan(0)
    expect(same.length).toBeLessThan(after.length)
  })
})

describe('where a part starts', () => {
  it('only at a heading among the report\'s own elements: not in a block that wraps its content, nor in a quote', () => {
    const compiled = compileBody('Lead text.\n\n# One\n\nText.\n\n::: checks\n## Inside the checks\n:::\n\n> ## In a quote\n\n# Two\n\nMore.\n')
    const results = runBeam(BEAM_INPUT)
    const { parts, html } = renderReportParts(compiled, { inputs: BEAM_INPUT, results, mode: 'frozen' })
    expect(parts.sections.map((s) => s.key)).toEqual(['lead', 'sec-one', 'sec-two', 'caution'])
    expect(parts.sections[1]!.html).toContain('id="sec-inside-the-checks"')
    expect(parts.sections[1]!.html).toContain('id="sec-in-a-quote"')
    expect(parts.open + parts.sections.map((s) => s.html).join('') + parts.close).toBe(html)
  })

  it('at each heading a repeated block writes at the top level, one part per element', () => {
    const compiled = compileBody('::: each{in=spans as=s}\n## Span :val[#s]\n\nMoment :val[s.M].\n:::\n')
    const results = runBeam(BEAM_INPUT)
    const { parts } = renderReportParts(compiled, { inputs: BEAM_INPUT, results, mode: 'frozen' })
    expect(parts.sections.map((s) => s.key)).toEqual(['sec-span-1', 'sec-span-2', 'caution'])
  })
})

describe('a band beam', () => {
  it('renders in parts as a whole', () => {
    const compiled = compileTemplate(BUILTIN_TEMPLATES.find((t) => t.id === 'pt-band-beam')!.text, ptMemberModel)
    const design = designMember(DEMO_BB1)
    const options = { inputs: design.input, results: design, mode: 'edit' as const }
    const { parts } = renderReportParts(compiled, options)
    expect(parts.open + parts.sections.map((s) => s.html).join('') + parts.close).toBe(renderReport(compiled, options).html)
  })
})
