/**
 * The renderer's parts on their own, through the seams they take: the typeset cache one thread
 * hands another, the calculation blocks against a sheet given as a lookup, and a figure block
 * given its caption and only what it reads. The whole report through renderReport is in the
 * other tests of this folder.
 */
import { describe, expect, it, vi } from 'vitest'
import type { CalcBlockResult, CalcQuantity, SheetValue } from '../../../shared/calc/quantities'
import { evaluateCalcBlocks, renderCalc } from '../../../shared/report/calc-blocks'
import { renderFigure } from '../../../shared/report/figure-blocks'
import type { FigureSource } from '../../../shared/report/figure-blocks'
import type { BlockMeta } from '../../../shared/report/markdown'
import type { ModelFigure } from '../../../shared/report/model'
import { parseTemplate } from '../../../shared/report/parse'
import { seedTypesetCache, typeset, typesetCacheEntries } from '../../../shared/report/typeset'

const FRONT = '---\nmodel: test-beam\ntitle: Parts\nversion: 1.0.0\n---\n'

function calcBlocks(body: string, sheetValue: (key: string) => SheetValue | undefined) {
  const into = { calc: new Map<BlockMeta, CalcBlockResult>(), quantities: new Map<string, CalcQuantity>() }
  const { tokens } = parseTemplate(FRONT + body)
  evaluateCalcBlocks(tokens, sheetValue, into)
  const metas = tokens.filter((t) => t.type === 'tb_block_open').map((t) => t.meta as BlockMeta)
  return { ...into, metas }
}

describe('typeset', () => {
  it('gives a formula the same html from the cache, and hands its entries to another cache', () => {
    const tex = 'x_{\\mathrm{parts}} = 1'
    const html = typeset(tex, true)
    expect(html).toContain('katex-display')
    expect(typeset(tex, true)).toBe(html)
    expect(typesetCacheEntries()).toContainEqual([`D${tex}`, html])
    // a seeded entry is what the cache answers: the other thread's KaTeX gave it for the same TeX and mode
    seedTypesetCache([['Iseeded-only', '<span>seeded</span>']])
    expect(typeset('seeded-only', false)).toBe('<span>seeded</span>')
    expect(typeset('seeded-only', true)).not.toBe('<span>seeded</span>')
  })
})

describe('calculation blocks against a sheet lookup', () => {
  it('evaluates the blocks in order, each seeing the quantities above it and the sheet\'s values', () => {
    const asked: string[] = []
    const sheet = (key: string): SheetValue | undefined => {
      asked.push(key)
      return key === 'geometry.h' ? { value: 600, unit: 'mm', precision: 0, label: 'Depth' } : undefined
    }
    const r = calcBlocks('::: calc\nb = 2 m  # Width\n:::\n\n::: calc\nA = b * val("geometry.h")  # Area\n:::\n', sheet)
    expect(asked).toEqual(['geometry.h'])
    expect(r.metas).toHaveLength(2)
    expect(r.calc.get(r.metas[0]!)!.quantities.map((q) => q.name)).toEqual(['b'])
    expect(r.calc.get(r.metas[1]!)!.problems).toEqual([])
    expect(r.quantities.get('A')!.value).toBeCloseTo(1.2, 6)
  })

  it('shows each problem at its template line, and nothing for a block it has no result of', () => {
    const r = calcBlocks('# Façade\n\n::: calc\na = 3 kN\nx = y + 1\n:::\n', () => undefined)
    const meta = r.metas[0]!
    const html = renderCalc(r.calc.get(meta), meta.line ?? 0)
    // the front matter is five lines: the block opens on line 8 and `x = y + 1` stands on line 10
    expect(html).toContain('<p class="tb-calc-problem" role="note">Line 10 (x): &quot;y&quot; is neither a quantity defined above nor a unit</p>')
    expect(html).toContain('data-name="a"')
    expect(renderCalc(undefined, 8)).toBe('')
  })
})

describe('a figure block given only what it reads', () => {
  const meta = (attrs: Record<string, string>): BlockMeta => ({ name: 'figure', directive: 'figure', attrs, problems: [] })
  const quantity = (name: string, value: number, unit: string): CalcQuantity => {
    const r = calcBlocks(`::: calc\n${name} = ${value} ${unit}\n:::\n`, () => undefined)
    return r.quantities.get(name)!
  }

  function source(figure: ModelFigure, results: unknown, extra: Partial<FigureSource> = {}): FigureSource {
    return { figures: { span: figure }, results, scopes: [], images: {}, quantities: new Map(), ...extra }
  }

  it('draws with the at resolved in the enclosing scope, and draws the same figure of the same results once', () => {
    const render = vi.fn((_results: unknown, at?: string) => `<svg data-at="${at ?? ''}"></svg>`)
    const figure: ModelFigure = { label: 'Span', at: 'spans[]', render }
    const results = { spans: [{}, {}] }
    const src = source(figure, results, { scopes: [{ name: 's', path: 'spans.1', index: 1 }] })
    const html = renderFigure(meta({ plot: 'span', at: 's' }), 'Span <em>2</em>', src)
    expect(html).toBe('<figure class="tb-figure" data-plot="span"><svg data-at="spans.1"></svg><figcaption>Span <em>2</em></figcaption></figure>\n')
    expect(renderFigure(meta({ plot: 'span', at: 's' }), '', src)).toBe('<figure class="tb-figure" data-plot="span"><svg data-at="spans.1"></svg></figure>\n')
    expect(render).toHaveBeenCalledTimes(1)
    renderFigure(meta({ plot: 'span', at: 's' }), '', source(figure, { spans: [{}, {}] }, { scopes: src.scopes }))
    expect(render).toHaveBeenCalledTimes(2)
  })

  it('marks a quantity on the axis its unit converts to, and says in words why another cannot be', () => {
    const render = vi.fn((_r: unknown, _at?: string, marks?: readonly unknown[]) => `<svg>${JSON.stringify(marks)}</svg>`)
    const figure: ModelFigure = { label: 'Moments', marks: { x: 'mm', y: 'N mm' }, render }
    const quantities = new Map([['M', quantity('M', 5, 'kNm')], ['x', quantity('x', 2, 'm')], ['F', quantity('F', 3, 'kN')]])
    const html = renderFigure(meta({ plot: 'span', mark: 'M, x, F, nope' }), '', source(figure, {}, { quantities }))
    expect(render.mock.calls[0]![2]).toEqual([{ label: 'M', axis: 'y', value: 5e6 }, { label: 'x', axis: 'x', value: 2000 }])
    expect(html).toContain('<p class="tb-missing">&quot;F&quot; (kN) cannot be marked: this figure plots moments along the member.</p>')
    expect(html).toContain('<p class="tb-missing">&quot;nope&quot; cannot be marked: no calculation block gives it a value.</p>')
  })

  it('says so where there are no results or the figure cannot be drawn', () => {
    const figure: ModelFigure = { label: 'Span', render: () => { throw new Error('no <span> here') } }
    expect(renderFigure(meta({ plot: 'span' }), '', source(figure, null))).toContain('No results yet: the figure appears once the inputs are complete.')
    expect(renderFigure(meta({ plot: 'span' }), '', source(figure, {}))).toContain('The figure could not be drawn: no &lt;span&gt; here')
  })

  it('shows an attached image from the sheet\'s own list only, its caption as its text', () => {
    const figure: ModelFigure = { label: 'Span', render: () => '' }
    const images = { 'site.png': { src: 'data:image/png;base64,iVBORw0KGgo=', sha256: 'ab' }, 'far.png': { src: 'https://elsewhere.example/x.png', sha256: '' } }
    const shown = renderFigure(meta({ image: 'site.png' }), 'The <strong>drop</strong>', source(figure, null, { images }))
    expect(shown).toBe('<figure class="tb-figure" data-image="site.png"><img class="tb-image" src="data:image/png;base64,iVBORw0KGgo=" alt="The drop" data-sha256="ab"><figcaption>The <strong>drop</strong></figcaption></figure>\n')
    for (const name of ['far.png', 'missing.png', 'toString']) {
      expect(renderFigure(meta({ image: name }), '', source(figure, null, { images }))).toContain('is not attached to this sheet')
    }
  })
})
