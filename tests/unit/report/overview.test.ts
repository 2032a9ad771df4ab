import { describe, expect, it } from 'vitest'
import { designMember } from '../../../shared/engine/member/design'
import { DEMO_BB1, DEMO_PS2 } from '../../../shared/engine/input/demo'
import { compileSheet, renderSheet } from '../../../shared/sheet/runtime'
import { PT_BAND_BEAM, PT_SLAB_STRIP } from '../../../shared/report/builtins/texts'
import { ptMemberModel } from '../../../shared/report/models'
import { compileTemplate, TemplateLoadError } from '../../../shared/report'
import { tallyByGroup, tallyChecks, tallyText } from '../../../shared/report/tally'
import { checkSectionsIn } from '../../../shared/report/render'
import { contentsSections, decodePages, encodePages, withPageReferences } from '../../../shared/report/page-references'

function overviewOf(html: string) {
  return /<div class="tb-overview" data-overview="true">([\s\S]*?)<\/div>\n/.exec(html)?.[1] ?? ''
}

describe('the front page of results (::: overview)', () => {
  it('names the member and links every governing quantity and check group to a section the report has', () => {
    for (const [text, inputs, per] of [[PT_SLAB_STRIP, DEMO_PS2, 'per metre width'], [PT_BAND_BEAM, DEMO_BB1, 'per beam']] as const) {
      const compiled = compileSheet(text)
      if (!compiled.ok) throw new Error(compiled.errors.join('\n'))
      const design = designMember(inputs)
      const report = renderSheet(compiled.template, design.input, design, 'frozen')
      const front = overviewOf(report.html)
      expect(front).toContain(`${design.input.geometry.spans.length} spans`)
      expect(front).toContain(design.input.materials.concreteClass)
      expect(front).toContain(per)
      for (const label of ['Prestress to balance', 'Strands and spacing', 'Average precompression', 'Load balanced by the tendons', 'Largest long-term deflection']) expect(front).toContain(label)
      const ids = new Set(report.sections.map(s => s.id))
      const links = [...front.matchAll(/<a class="tb-xref" href="#([^"]+)">/g)].map(m => m[1]!)
      // one link per check group and per quantity, each to a section of this report
      expect(links.length).toBe(tallyByGroup(design.checks).length + 6)
      for (const id of links) expect(ids.has(id), id).toBe(true)
      expect(report.unresolved).toEqual([])
    }
  })

  it('refuses the block for a model without a front page, naming the line', () => {
    const { overview: _, ...bare } = ptMemberModel
    expect(() => compileTemplate('---\nmodel: pt-member\ntitle: t\nversion: 1\n---\n# A\n\n::: overview\n:::\n', bare)).toThrow(TemplateLoadError)
    expect(() => compileTemplate('---\nmodel: pt-member\ntitle: t\nversion: 1\n---\n# A\n\n::: overview\n:::\n', bare)).toThrow(/line 8: the model pt-member has no front page/)
  })
})

describe('check tallies', () => {
  it('count passes and failures and name the governing check', () => {
    const checks = designMember(DEMO_PS2).checks
    const t = tallyChecks(checks)
    expect(t.pass + t.fail).toBe(checks.length)
    expect(t.governing!.utilisation).toBe(Math.max(...checks.map(c => c.utilisation)))
    expect(tallyText(t)).toMatch(/^\d+ checks: \d+ pass, \d+ fail; highest utilisation \d\.\d\d/)
    expect(tallyChecks([])).toEqual({ count: 0, pass: 0, fail: 0, governing: null })
  })

  it('finds each check\'s section in a rendered report', () => {
    const compiled = compileSheet(PT_SLAB_STRIP)
    if (!compiled.ok) throw new Error('template')
    const design = designMember(DEMO_PS2)
    const report = renderSheet(compiled.template, design.input, design, 'frozen')
    expect(checkSectionsIn(report.html)).toEqual(report.checkSections)
  })
})

describe('page references for print', () => {
  const sections = [{ id: 'a', title: 'A', level: 1 }, { id: 'a1', title: 'A.1', level: 2 }, { id: 'a11', title: 'A.1.1', level: 3 }, { id: 'b', title: 'B', level: 1 }]
  it('round-trips the page of each section and refuses anything else', () => {
    const pages = new Map([['a', 2], ['a1', 2], ['a11', 3], ['b', 5]])
    const text = encodePages(sections, pages)
    expect(text).toBe('2.2.3.5')
    expect(decodePages(sections, text)).toEqual(pages)
    for (const bad of ['2.2.3', '2.2.3.5.6', '2.x.3.5', '', undefined, ['2']]) expect(decodePages(sections, bad).size).toBe(0)
    expect(contentsSections(sections).map(s => s.id)).toEqual(['a', 'a1', 'b'])
  })
  it('puts the page on each link of the front page, a placeholder while unknown', () => {
    const html = '<a class="tb-xref" href="#a">A</a> <a class="tb-xref" href="#b">B</a>'
    expect(withPageReferences(html, new Map([['a', 4]]))).toBe('<a class="tb-xref" href="#a" data-page="4">A</a> <a class="tb-xref" href="#b" data-page="00">B</a>')
    // a render that finds the pages asks with every page 0, and gets the placeholder everywhere
    const finding = decodePages(sections, encodePages(sections, new Map()))
    expect(encodePages(sections, new Map())).toBe('0.0.0.0')
    expect(withPageReferences(html, finding)).toBe('<a class="tb-xref" href="#a" data-page="00">A</a> <a class="tb-xref" href="#b" data-page="00">B</a>')
  })
  it('leaves a link unnumbered where no page is known and no placeholder is asked for', () => {
    const html = '<a class="tb-xref" href="#a">A</a> <a class="tb-xref" href="#b">B</a>'
    expect(withPageReferences(html, new Map([['a', 4]]), null)).toBe('<a class="tb-xref" href="#a" data-page="4">A</a> <a class="tb-xref" href="#b">B</a>')
  })
})
