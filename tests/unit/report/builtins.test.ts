/**
 * The built-in templates against the real engine: they load against pt-member, render the demo
 * sheets of design.md §6 (PS-2, BB-1) with every key resolved and the check tables filled, and the
 * browser copies of their texts match the Markdown sources.
 */
import { readFileSync } from 'node:fs'
import { fileURLToPath } from 'node:url'
import { describe, expect, it } from 'vitest'
import { DEMO_BB1, DEMO_PS2, DEMO_PS3 } from '../../../shared/engine/input/demo'
import { designMember } from '../../../shared/engine/member/design'
import { BUILTIN_TEMPLATES, TEMPLATE_LANGUAGE_DOC, builtinTemplate } from '../../../shared/report/builtins/index'
import { loadBuiltinTemplates } from '../../../shared/report/builtins/node'
import { textsModule } from '../../../shared/report/builtins/sync'
import { compileTemplate, lintTemplate } from '../../../shared/report/compile'
import { TemplateKeyError } from '../../../shared/report/errors'
import { templateLanguageHelpHtml } from '../../../shared/report/help'
import { MODELS, ptMemberModel } from '../../../shared/report/models'
import { REPORT_CAUTION, renderReport } from '../../../shared/report/render'
import { startTags } from './helpers'

const root = fileURLToPath(new URL('../../../', import.meta.url))
const read = (file: string): string => readFileSync(`${root}${file}`, 'utf8')

const DEMOS = { 'PS-2': DEMO_PS2, 'BB-1': DEMO_BB1, 'PS-3': DEMO_PS3 } as const
const DESIGNS = { 'PS-2': designMember(DEMO_PS2), 'BB-1': designMember(DEMO_BB1), 'PS-3': designMember(DEMO_PS3) }
/** which demo sheets each template is for (design.md §6: PS-2 a slab strip, BB-1 a band beam) */
const SHEETS: Record<string, Array<keyof typeof DEMOS>> = {
  'pt-slab-strip': ['PS-2', 'PS-3'],
  'pt-band-beam': ['BB-1'],
  'pt-section-check': ['PS-2', 'BB-1'],
}

describe('built-in template texts', () => {
  it('texts.ts holds exactly the Markdown sources (run shared/report/builtins/sync.ts after an edit)', () => {
    expect(read('shared/report/builtins/texts.ts')).toBe(textsModule(read))
    expect(TEMPLATE_LANGUAGE_DOC).toBe(read('docs/template-language.md'))
  })

  it('the server loader reads the same texts from the files', async () => {
    const loaded = await loadBuiltinTemplates(root)
    expect(loaded).toEqual(BUILTIN_TEMPLATES)
    expect(builtinTemplate('pt-band-beam')?.file).toBe('content-templates/pt-band-beam.md')
    expect(builtinTemplate('nope')).toBeUndefined()
  })

  it('registers the pt-member model', () => {
    expect(MODELS['pt-member']).toBe(ptMemberModel)
  })
})

describe.each(BUILTIN_TEMPLATES.map((t) => [t.id, t] as const))('built-in template %s', (id, template) => {
  it('is meant for at least one demo sheet', () => {
    expect(SHEETS[id]?.length).toBeGreaterThan(0)
  })

  it('loads against pt-member without a problem', () => {
    expect(lintTemplate(template.text, ptMemberModel).map((e) => e.message)).toEqual([])
    const compiled = compileTemplate(template.text, ptMemberModel)
    expect(compiled.meta.model).toBe('pt-member')
    expect(compiled.meta.groups.every((g) => ptMemberModel.inputGroups.includes(g))).toBe(true)
  })

  it('cites the clauses it uses', () => {
    expect(template.text).toMatch(/EN 1992-1-1/)
    for (const clause of ['5.10.2.2', '7.2', '5.10.9']) expect(template.text).toContain(clause)
  })

  it.each(SHEETS[id] ?? [])('renders demo sheet %s with every key resolved and the checks filled', (sheet) => {
    const compiled = compileTemplate(template.text, ptMemberModel)
    const results = DESIGNS[sheet]
    for (const mode of ['edit', 'frozen', 'print'] as const) {
      const report = renderReport(compiled, { inputs: DEMOS[sheet], results, mode })
      expect(report.unresolved, mode).toEqual([])
      expect(report.html).not.toContain('katex-error')
      expect(report.html).not.toContain('tb-missing')
      // the summary table lists every check of the design, each tied to a section of the sheet
      const rows = [...report.html.matchAll(/<tr class="tb-check (?:tb-pass|tb-fail)" data-check="([^"]+)" data-section="([^"]*)">/g)]
      expect(new Set(rows.map((r) => r[1]))).toEqual(new Set(results.checks.map((c) => c.id)))
      expect(report.checks).toHaveLength(results.checks.length)
      const ids = new Set(report.sections.map((s) => s.id))
      for (const c of report.checks) expect(ids.has(c.sectionId ?? ''), c.id).toBe(true)
      for (const r of rows) expect(ids.has(r[2]!), r[1]).toBe(true)
      // it ends with the summary of all checks, then the caution
      expect(report.sections[report.sections.length - 1]!.title).toBe('Summary of checks')
      expect(report.html).toContain(REPORT_CAUTION)
      expect(report.html.indexOf('<aside class="tb-caution"')).toBeGreaterThan(report.html.lastIndexOf('<table class="tb-check-table">'))
    }
  })

  it('gives every input field of the editor a key of the input schema', () => {
    const report = renderReport(compileTemplate(template.text, ptMemberModel), { inputs: DEMO_PS2, results: DESIGNS['PS-2'], mode: 'edit' })
    const fields = new Set(ptMemberModel.inputFields.map((f) => f.path))
    const keys = startTags(report.html).filter((t) => t.name === 'input' || t.name === 'select').map((t) => t.attrs.find((a) => a.name === 'data-key')!.value)
    expect(keys.length).toBeGreaterThan(5)
    for (const k of keys) expect(fields.has(k), k).toBe(true)
  })

  it('is deterministic and follows the inputs', () => {
    const compiled = compileTemplate(template.text, ptMemberModel)
    const a = renderReport(compiled, { inputs: DEMO_PS2, results: designMember(DEMO_PS2), mode: 'print' }).html
    const b = renderReport(compileTemplate(template.text, ptMemberModel), { inputs: DEMO_PS2, results: designMember(structuredClone(DEMO_PS2)), mode: 'print' }).html
    expect(b).toBe(a)
    const longer = { ...DEMO_PS2, geometry: { spans: [7800, 10200, 9600, 7800] } }
    const c = renderReport(compiled, { inputs: longer, results: designMember(longer), mode: 'print' }).html
    expect(c).not.toBe(a)
    expect(c).toContain('10.20\u202fm')
  })
})

describe('the language doc', () => {
  it('renders as a plain help page: directives stay text, headings get ids', () => {
    const { html, headings } = templateLanguageHelpHtml()
    expect(headings[0]).toEqual({ id: 'doc-the-calc-sheet-template-language', title: 'The calc-sheet template language', level: 1 })
    expect(headings.map((h) => h.title)).toContain('A worked example')
    expect(html).toContain('<code>:val[input.loads.superimposed]</code>')
    expect(html).not.toContain('tb-val')
    expect(html).not.toContain('<input')
    expect(templateLanguageHelpHtml('<script>alert(1)</script>').html).toBe('<p>&lt;script&gt;alert(1)&lt;/script&gt;</p>\n')
  })

  const example = /## A worked example[\s\S]*?```markdown\n([\s\S]*?)\n```/.exec(TEMPLATE_LANGUAGE_DOC)![1]!

  it('has a worked example that loads and renders the demo sheet with every key resolved', () => {
    const compiled = compileTemplate(example, ptMemberModel)
    const report = renderReport(compiled, { inputs: DEMO_PS2, results: DESIGNS['PS-2'], mode: 'frozen' })
    expect(report.unresolved).toEqual([])
    expect(report.checks.filter((c) => c.sectionId === 'sec-stresses-at-transfer').map((c) => c.group)).toEqual(DESIGNS['PS-2'].checks.filter((c) => c.group === 'transfer').map((c) => c.group))
  })

  it('tells the truth about the error a misspelt key gives', () => {
    const errors = lintTemplate(example.replace('force.meanTransfer', 'force.meanTransfr'), ptMemberModel)
    expect(errors).toHaveLength(1)
    expect(errors[0]).toBeInstanceOf(TemplateKeyError)
    expect(errors[0]!.message).toMatch(/^line 14: unknown key "force.meanTransfr": .*\(did you mean force.meanTransfer\?\)$/)
    expect(TEMPLATE_LANGUAGE_DOC).toContain('`line 14: unknown key "force.meanTransfr": …')
  })
})
