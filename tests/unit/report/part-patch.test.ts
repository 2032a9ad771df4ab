// @vitest-environment happy-dom
/**
 * The editor's report patch: a part's html cut into its top-level blocks (each block one element
 * and the text after it), and a part patched block by block. Checked against a DOM parser
 * (happy-dom, from npm): the blocks make exactly the nodes the parser makes of the whole part, and a
 * patched part is the same DOM as a fresh parse of its new html, over the built-in templates'
 * reports of random members; blocks that did not change keep their very nodes.
 */
import { describe, expect, it } from 'vitest'
import { patchPart, partShown } from '../../../composables/reportPartPatch'
import { DEMO_PS2 } from '../../../shared/engine/input/demo'
import { designMember } from '../../../shared/engine/member/design'
import { BUILTIN_TEMPLATES } from '../../../shared/report/builtins/index'
import { compileTemplate } from '../../../shared/report/compile'
import { ptMemberModel } from '../../../shared/report/models'
import { renderReportParts } from '../../../shared/report/render'
import { topLevelBlocks } from '../../../shared/report/top-level-blocks'
import { setPath } from '../../../shared/utils/paths'
import { between, prng } from '../../helpers/prng'

/** The DOM a browser makes of the html in a part's element. */
function parsedPart(html: string): HTMLElement {
  const el = document.createElement('div')
  el.innerHTML = html
  return el
}

const kind = (n: ChildNode) => (n.nodeType === Node.ELEMENT_NODE ? n.nodeName.toLowerCase() : n.nodeType === Node.COMMENT_NODE ? '#comment' : '#text')

describe('a part cut into top-level blocks', () => {
  it('gives the blocks back together byte for byte, one element (or comment) each, then its text', () => {
    const html = '<p>a <em>b</em></p>\n<!-- c -->\n<div class="x" title="a > b"><svg><path d="M0 0"/></svg><br><img src="i.png" alt=""></div>tail<hr>'
    const blocks = topLevelBlocks(html)!
    expect(blocks.map(b => b.html).join('')).toBe(html)
    expect(blocks.map(b => [b.tag, b.nodes])).toEqual([['p', 2], ['#comment', 2], ['div', 2], ['hr', 1]])
    expect(topLevelBlocks('lead text<p>x</p>')!.map(b => [b.tag, b.nodes])).toEqual([['#text', 1], ['p', 1]])
    expect(topLevelBlocks('')).toEqual([])
  })

  it('gives up (null) on html it cannot follow, so the part is patched whole', () => {
    expect(topLevelBlocks('<p>open')).toBeNull()
    expect(topLevelBlocks('</p>')).toBeNull()
    expect(topLevelBlocks('<style>p > a {}</style>')).toBeNull()
    expect(topLevelBlocks('<p title="unclosed>x</p>')).toBeNull()
  })

  it.each(BUILTIN_TEMPLATES.map(t => [t.id, t] as const))('makes the nodes a DOM parser makes of each part of template %s', (_id, template) => {
    const compiled = compileTemplate(template.text, ptMemberModel)
    const design = designMember(DEMO_PS2)
    for (const mode of ['edit', 'print'] as const) {
      for (const part of renderReportParts(compiled, { inputs: design.input, results: design, mode }).parts.sections) {
        const blocks = topLevelBlocks(part.html)
        expect(blocks, part.key).not.toBeNull()
        expect(blocks!.map(b => b.html).join('')).toBe(part.html)
        const nodes = [...parsedPart(part.html).childNodes]
        expect(nodes.length, part.key).toBe(blocks!.reduce((n, b) => n + b.nodes, 0))
        let at = 0
        for (const b of blocks!) {
          expect(kind(nodes[at]!), part.key).toBe(b.tag)
          if (b.nodes === 2) expect(kind(nodes[at + 1]!)).toBe('#text')
          at += b.nodes
        }
      }
    }
  })
})

describe('a part patched block by block', () => {
  /** A part's element showing this html, as Vue's v-html makes it. */
  function shown(html: string): HTMLElement {
    const el = parsedPart(html)
    document.body.append(el)
    partShown(el, html)
    return el
  }

  it('ends as a fresh parse of the new html, and blocks that did not change keep their nodes', () => {
    const before = '<h2 id="a">A</h2>\n<p>one</p>\n<p>two <b>2</b></p>\n<p>three</p>\n'
    const after = '<h2 id="a">A</h2>\n<p>one</p>\n<p>two <b>22</b></p>\n<p>three</p>\n'
    const el = shown(before)
    const [heading, , , last] = el.children
    expect(patchPart(el, after)).toBe('blocks')
    expect(el.innerHTML).toBe(parsedPart(after).innerHTML)
    expect(el.children[0]).toBe(heading)
    expect(el.children[3]).toBe(last)
  })

  it('patches inside a changed block only what changed in it, down to the innermost element', () => {
    const row = (a: string, b: string) => `<tr><td>${a}</td><td>M = <b>${b}</b> kNm &amp; more</td></tr>`
    const before = `<table class="t"><tbody>${row('1', '120')}\n${row('2', '80')}</tbody></table>\n<p>x</p>\n`
    const after = `<table class="t"><tbody>${row('1', '131')}\n${row('2', '80')}</tbody></table>\n<p>x</p>\n`
    const el = shown(before)
    const table = el.querySelector('table')!
    const [first, second] = el.querySelectorAll('td')
    const [, secondRow] = el.querySelectorAll('tr')
    const bold = el.querySelector('b')!
    expect(patchPart(el, after)).toBe('blocks')
    expect(el.innerHTML).toBe(parsedPart(after).innerHTML)
    expect(el.querySelector('table')).toBe(table)
    expect(el.querySelectorAll('td')[0]).toBe(first)
    expect(el.querySelectorAll('td')[1]).toBe(second)
    expect(el.querySelectorAll('tr')[1]).toBe(secondRow)
    expect(el.querySelector('b')).toBe(bold)
    expect(bold.textContent).toBe('131')
  })

  it('patches a changed SVG or MathML element whole, in its own namespace, and a changed start tag by the DOM', () => {
    const steps = [
      '<div class="fig"><svg viewBox="0 0 10 10"><path d="M0 0"/></svg></div>\n<p><math><mi>x</mi></math></p>',
      '<div class="fig"><svg viewBox="0 0 10 10"><path d="M1 1"/><circle r="2"/></svg></div>\n<p><math><mi>y</mi><mn>2</mn></math></p>',
      '<div class="fig wide"><svg viewBox="0 0 10 10"><path d="M1 1"/></svg></div>\n<p title="t"><math><mi>y</mi></math></p>',
    ]
    const el = shown(steps[0]!)
    for (const html of steps.slice(1)) {
      expect(patchPart(el, html)).toBe('blocks')
      expect(el.isEqualNode(parsedPart(html)), html).toBe(true)
      expect(el.querySelector('path')!.namespaceURI).toBe('http://www.w3.org/2000/svg')
      // as the parser has it (happy-dom, unlike a browser, leaves MathML in the HTML namespace)
      expect(el.querySelector('mi')!.namespaceURI).toBe(parsedPart(html).querySelector('mi')!.namespaceURI)
    }
  })

  it('adds and removes blocks in the middle, at the ends, and text between them', () => {
    const steps = [
      '<p>a</p>\n<p>b</p>\n',
      '<p>a</p>\n<table><tbody><tr><td>1</td></tr></tbody></table>\n<p>b</p>\n',
      'lead<p>a</p><p>b</p>\n<ul><li>c</li></ul>',
      '<p>a</p>\n',
      '<div>x</div>\n<p>a</p>\n<!-- note -->\n',
      '<p>a</p>\n<p>b</p>\n',
    ]
    const el = shown(steps[0]!)
    for (const html of steps.slice(1)) {
      expect(patchPart(el, html)).toBe('blocks')
      expect(el.innerHTML, html).toBe(parsedPart(html).innerHTML)
    }
  })

  it('keeps a field being typed into: its element and what is typed in it', () => {
    const el = shown('<p>L = <input id="f" value="9.7"> m</p>\n<p>M = 120 kNm</p>\n')
    const field = el.querySelector<HTMLInputElement>('#f')!
    field.focus()
    field.value = '9.75'
    patchPart(el, '<p>L = <input id="f" value="9.8"> m</p>\n<p>M = 131 kNm</p>\n<p>new</p>\n')
    expect(el.querySelector('#f')).toBe(field)
    expect(field.value).toBe('9.75')
    expect(el.querySelectorAll('p')).toHaveLength(3)
  })

  it('over random members, each part patched from one report to the next is the DOM of a fresh parse', () => {
    const random = prng(20261204)
    for (const template of BUILTIN_TEMPLATES) {
      const compiled = compileTemplate(template.text, ptMemberModel)
      const render = (spans: number[]) => {
        const design = designMember(setPath(DEMO_PS2, 'geometry.spans', spans) as typeof DEMO_PS2)
        return new Map(renderReportParts(compiled, { inputs: design.input, results: design, mode: 'edit' }).parts.sections.map(p => [p.key, p.html]))
      }
      const base = DEMO_PS2.geometry.spans as number[]
      let now = render(base)
      const elements = new Map([...now].map(([key, html]) => [key, shown(html)]))
      for (let round = 0; round < 3; round += 1) {
        const next = render(base.map(s => Math.round(s * between(random, 0.85, 1.15))))
        for (const [key, html] of next) {
          const el = elements.get(key)
          if (!el) continue
          const untouched = now.get(key) === html ? [...el.childNodes] : null
          expect(patchPart(el, html)).toBe(untouched ? 'unchanged' : 'blocks')
          // the same DOM (attributes compared as sets: a morphed element may list them in another order)
          expect(el.isEqualNode(parsedPart(html)), `${template.id} ${key}`).toBe(true)
          if (untouched) expect([...el.childNodes]).toEqual(untouched)
        }
        now = next
      }
    }
  })
})
