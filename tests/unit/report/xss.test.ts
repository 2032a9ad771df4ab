/**
 * Templates never run code. Attack strings after the OWASP Cross Site Scripting Prevention and XSS
 * Filter Evasion cheat sheets, and KaTeX's own list of commands gated by its `trust` option
 * (KaTeX documentation, "Options: trust": \href, \url, \includegraphics, \htmlClass, \htmlId,
 * \htmlStyle, \htmlData). Every rendered report is scanned tag by tag.
 */
import { describe, expect, it } from 'vitest'
import { lintTemplate } from '../../../shared/report/compile'
import { renderReport } from '../../../shared/report/render'
import { BEAM_INPUT, beamModel, runBeam } from './fixtures/beam-model'
import type { BeamResult } from './fixtures/beam-model'
import { compileBody, renderBody, startTags, template } from './helpers'

const ALLOWED_TAGS = new Set([
  'article', 'aside', 'p', 'h1', 'h2', 'h3', 'h4', 'h5', 'h6', 'em', 'strong', 'code', 'pre', 'blockquote', 'ul', 'ol', 'li', 'a', 'img',
  'table', 'thead', 'tbody', 'tr', 'th', 'td', 'br', 'hr', 'small', 's', 'span', 'div', 'figure', 'figcaption', 'input', 'select', 'option',
  // KaTeX's MathML
  'math', 'semantics', 'mrow', 'mi', 'mo', 'mn', 'ms', 'mtext', 'mspace', 'msup', 'msub', 'msubsup', 'mfrac', 'msqrt', 'mroot', 'mstyle',
  'mover', 'munder', 'munderover', 'mtable', 'mtr', 'mtd', 'mpadded', 'mphantom', 'menclose', 'annotation', 'svg', 'path', 'line',
])

/** No script, no event handler, no scriptable or remote URL, no tag outside the report's vocabulary. */
function expectInert(html: string): void {
  for (const tag of startTags(html)) {
    expect(ALLOWED_TAGS.has(tag.name), `tag <${tag.name}>`).toBe(true)
    for (const a of tag.attrs) {
      expect(a.name.startsWith('on'), `attribute ${a.name} on <${tag.name}>`).toBe(false)
      if (a.name === 'href' || a.name === 'src' || a.name === 'xlink:href' || a.name === 'action' || a.name === 'formaction') {
        expect(a.value.replace(/[\s\u0000-\u001f]/g, '').toLowerCase()).not.toMatch(/^(javascript|vbscript|data|file):/)
      }
      if (a.name === 'src') expect(a.value).not.toMatch(/^(?:[a-z][a-z0-9+.-]*:|\/\/)/i)
    }
  }
  expect(html).not.toMatch(/<\s*script/i)
  expect(html).not.toMatch(/<\s*iframe/i)
}

describe('templates render inert', () => {
  it('escapes raw HTML, in blocks and inline', () => {
    const body = [
      '<script>alert(1)</script>',
      '',
      'Text <img src=x onerror=alert(1)> and <a href="javascript:alert(1)">x</a>.',
      '',
      '<div onmouseover="alert(1)">block</div>',
      '',
      '<svg/onload=alert(1)>',
      '',
      '<!-- comment --> <iframe src="//evil.example"></iframe>',
    ].join('\n')
    const { html } = renderBody(body)
    expectInert(html)
    expect(html).toContain('&lt;script&gt;alert(1)&lt;/script&gt;')
    expect(html).toContain('&lt;img src=x onerror=alert(1)&gt;')
  })

  it('keeps scriptable links as text and allows web, mail and in-page links', () => {
    const body = [
      '[a](javascript:alert(1)) [b](JaVaScRiPt:alert(1)) [c](vbscript:msgbox(1)) [d](data:text/html;base64,PHNjcmlwdD4=)',
      '[e]( javascript:alert(1)) [f](file:///etc/passwd) <javascript:alert(1)>',
      '[ok](https://example.org/a) [mail](mailto:office@example.org) [here](#sec-loads) [rel](notes.md)',
    ].join('\n')
    const { html } = renderBody(body)
    expectInert(html)
    const hrefs = startTags(html).filter((t) => t.name === 'a').map((t) => t.attrs.find((a) => a.name === 'href')!.value)
    expect(hrefs).toEqual(['https://example.org/a', 'mailto:office@example.org', '#sec-loads', 'notes.md'])
  })

  it('shows no remote or data: image, only local ones', () => {
    const body = '![remote](https://evil.example/t.png) ![proto](//evil.example/t.png) ![data](data:image/png;base64,iVBORw0KGgo=) ![local](figures/section.png)'
    const { html } = renderBody(body)
    expectInert(html)
    const srcs = startTags(html).filter((t) => t.name === 'img').map((t) => t.attrs.find((a) => a.name === 'src')!.value)
    expect(srcs).toEqual(['figures/section.png'])
    expect(html).toContain('[image not shown: remote]')
  })

  it('renders KaTeX commands that need trust as text, and math errors as escaped text', () => {
    const body = [
      '$\\href{javascript:alert(1)}{x}$ $\\url{javascript:alert(2)}$ $\\htmlClass{x}{y}$ $\\htmlId{sec-loads}{y}$',
      '',
      '$\\htmlStyle{background:url(x)}{y}$ $\\htmlData{foo=bar}{y}$ $\\includegraphics{https://evil.example/a.png}$',
      '',
      '$$',
      '\\frac{1}{<img src=x onerror=alert(1)>',
      '$$',
      '',
      '$\\def\\a{\\a\\a}\\a$ $\\rule{1000em}{1000em}$',
    ].join('\n')
    const { html } = renderBody(body)
    expectInert(html)
    for (const cmd of ['href', 'url', 'htmlClass', 'htmlId', 'htmlStyle', 'htmlData', 'includegraphics']) {
      expect(html).toMatch(new RegExp(`<mtext>\\\\${cmd}</mtext>`))
    }
    expect(html).not.toMatch(/id="sec-loads"/)
    expect(html).not.toContain('<img src=x')
    expect(html).toContain('katex-error')
    expect(html).toMatch(/Too many expansions/)
    // maxSize caps the rule at 10 em (KaTeX documentation, "Options: maxSize")
    expect(html).toContain('border-right-width:10em')
    expect(html).not.toMatch(/width:1000em/)
  })

  it('refuses attribute injection through a block attribute or a key before anything is rendered', () => {
    const attempts = [
      '::: checks{group="x" onmouseover="alert(1)"}\n:::\n',
      '::: figure{plot="<img src=x onerror=alert(1)>"}\n:::\n',
      '::: checks{group=service"><script>alert(1)</script>}\n:::\n',
      ':val[loads.sdl" onmouseover="alert(1)]\n',
      ':in[geometry.h"><script>]\n',
      '$\\val{loads.sdl" onload="x}$\n',
    ]
    for (const body of attempts) expect(lintTemplate(template(body), beamModel).length, body).toBeGreaterThan(0)
  })

  it('escapes text that comes from the data: input strings, check titles and notes, in prose and in formulas', () => {
    const evil = '<img src=x onerror=alert(1)>"\'&}\\href{javascript:alert(1)}{x}'
    const input = { ...BEAM_INPUT, label: evil }
    const results: BeamResult = runBeam(input)
    results.checks[0] = { ...results.checks[0]!, title: evil, note: evil, location: evil, id: `a" onclick="alert(1)` }
    results.spans[0]!.label = evil
    const compiled = compileBody(':val[input.label] $\\text{Strip: }\\val{input.label}$\n\n::: each{in=spans as=s}\n## :val[s.label]\n:::\n\n::: checks\n:::\n')
    for (const mode of ['edit', 'frozen', 'print'] as const) {
      const { html, sections } = renderReport(compiled, { inputs: input, results, mode })
      expectInert(html)
      expect(html).not.toContain('<img src=x')
      expect(html).toContain('&lt;img src=x onerror=alert(1)&gt;')
      expect(html).toContain('data-check="a&quot; onclick=&quot;alert(1)"')
      expect(html).not.toMatch(/<mtext>\\href<\/mtext>/)
      expect(sections[0]!.title).toBe(evil)
    }
  })
})
