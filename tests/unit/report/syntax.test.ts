import { describe, expect, it } from 'vitest'
import { parseTemplate } from '../../../shared/report/parse'
import { parseAttributes, parseKey, patternOf } from '../../../shared/report/syntax'
import type { BlockMeta, InlineMeta } from '../../../shared/report/markdown'
import { BODY_LINE, FRONT, renderBody, template, withoutMath } from './helpers'

function inlineDirectives(text: string): InlineMeta[] {
  const out: InlineMeta[] = []
  for (const t of parseTemplate(text).tokens) for (const c of t.children ?? []) if (c.type.startsWith('tb_')) out.push(c.meta as InlineMeta)
  return out
}

describe('keys and attributes', () => {
  it('reads dot paths with indices and the element number', () => {
    expect(parseKey('loads.sdl')).toEqual({ segments: ['loads', 'sdl'] })
    expect(parseKey('geometry.spans.2')).toEqual({ segments: ['geometry', 'spans', '2'] })
    expect(parseKey('#s')).toEqual({ segments: ['#s'] })
    expect(parseKey('profile.drapes.#s')).toEqual({ segments: ['profile', 'drapes', '#s'] })
    for (const bad of ['', '.a', 'a..b', '2a', 'a b', 'a.b-c', '#', '#1', 'a.#', 'a.#.b', '#s.a', 'a"b', 'a<b']) expect(parseKey(bad)).toHaveProperty('problem')
  })

  it('maps concrete paths to catalogue patterns', () => {
    expect(patternOf(['sections', '3', 'stress', 'transfer', 'top'])).toBe('sections[].stress.transfer.top')
    expect(patternOf(['geometry', 'spans', '0'])).toBe('geometry.spans[]')
    expect(patternOf(['a', '1', '2'])).toBe('a[][]')
    expect(patternOf(['profile', 'drapes', '#s'])).toBe('profile.drapes[]')
  })

  it('reads attribute lists, bare or quoted, and refuses anything else', () => {
    expect(parseAttributes('group=transfer')).toEqual({ attrs: { group: 'transfer' } })
    expect(parseAttributes('in=sections  as=s')).toEqual({ attrs: { in: 'sections', as: 's' } })
    expect(parseAttributes('plot="tendon profile"')).toEqual({ attrs: { plot: 'tendon profile' } })
    expect(parseAttributes('')).toEqual({ attrs: {} })
    for (const bad of ['group', 'group=a b', 'a=1 a=2', 'x="unterminated', 'x=<b>', 'onclick="a" b']) expect(parseAttributes(bad)).toHaveProperty('problem')
  })
})

describe('inline directives', () => {
  it('finds :in and :val with the line each is on', () => {
    const found = inlineDirectives(template('Intro.\n\nDepth :in[geometry.h] and\nload :val[input.loads.sdl].\n'))
    expect(found.map((d) => [d.directive, d.key, d.line])).toEqual([
      ['in', 'geometry.h', BODY_LINE + 2],
      ['val', 'input.loads.sdl', BODY_LINE + 3],
    ])
  })

  it('leaves escaped colons, code spans, code blocks and words with colons alone', () => {
    const body = 'Escaped \\:val[loads.sdl], code `:val[loads.sdl]`, a time 10:30[a], see http://x.org/a:b[c].\n\n    :val[loads.sdl]\n\n```\n:in[geometry.h]\n::: checks\n```\n'
    expect(inlineDirectives(template(body))).toEqual([])
    expect(parseTemplate(template(body)).errors).toEqual([])
    const html = renderBody(body).html
    expect(html).toContain('Escaped :val[loads.sdl]')
    expect(html).toContain('<code>:val[loads.sdl]</code>')
  })

  it('reports an unknown directive name and a malformed key as syntax errors', () => {
    const { errors } = parseTemplate(template('A :vla[loads.sdl] and :val[loads..sdl] and :in[]\n'))
    expect(errors.map((e) => [e.name, e.line])).toEqual([
      ['TemplateSyntaxError', BODY_LINE],
      ['TemplateSyntaxError', BODY_LINE],
      ['TemplateSyntaxError', BODY_LINE],
    ])
    expect(errors[0]!.message).toMatch(/unknown directive ":vla/)
  })
})

describe('blocks', () => {
  it('nests blocks and closes each with its own :::', () => {
    const body = '::: each{in=spans as=s}\n## Span :val[#s]\n::: checks{group=service}\nNote.\n:::\nAfter.\n:::\nOutside.\n'
    const tokens = parseTemplate(template(body)).tokens
    const blocks = tokens.filter((t) => t.type === 'tb_block_open').map((t) => t.meta as BlockMeta)
    expect(blocks.map((b) => [b.directive, b.line, b.attrs])).toEqual([
      ['each', BODY_LINE, { in: 'spans', as: 's' }],
      ['checks', BODY_LINE + 2, { group: 'service' }],
    ])
    const order = tokens.map((t) => t.type).filter((t) => t.startsWith('tb_block') || t === 'paragraph_open')
    expect(order).toEqual(['tb_block_open', 'tb_block_open', 'paragraph_open', 'tb_block_close', 'paragraph_open', 'tb_block_close', 'paragraph_open'])
  })

  it('skips ::: lines inside fenced code when it looks for the end of a block', () => {
    const body = '::: figure{plot=bars}\n```\n:::\n```\n:::\n'
    const parsed = parseTemplate(template(body))
    expect(parsed.errors).toEqual([])
    expect(parsed.tokens.filter((t) => t.type === 'fence').map((t) => t.content)).toEqual([':::\n'])
  })

  it('reports an unclosed block, a stray closer, an unknown block and bad attributes, each on its line', () => {
    const body = '::: chart{plot=bars}\n:::\n\n:::\n\n::: checks{group=a b}\n:::\n\n::: each{in=spans as=s}\nNever closed.\n'
    const { errors } = parseTemplate(template(body))
    expect(errors.map((e) => e.line)).toEqual([BODY_LINE, BODY_LINE + 3, BODY_LINE + 5, BODY_LINE + 8])
    expect(errors.map((e) => e.message.replace(/^line \d+: /, '').slice(0, 22))).toEqual([
      'unknown block "::: cha',
      'this ":::" closes no b',
      'cannot read the attrib',
      'the block "::: each" i',
    ])
  })
})

describe('front matter', () => {
  it('reads model, title, version and groups', () => {
    const { meta, errors, bodyLine } = parseTemplate(`${FRONT}# A\n`)
    expect(errors).toEqual([])
    expect(meta).toEqual({ model: 'test-beam', title: 'Test sheet', version: '1.0.0', groups: ['geometry', 'loads'] })
    expect(bodyLine).toBe(BODY_LINE)
  })

  it('names the line of a missing, unknown or malformed field', () => {
    expect(parseTemplate('# No front matter\n').errors.map((e) => e.line)).toEqual([1])
    const unknown = parseTemplate('---\nmodel: m\ntitle: T\nversion: 1\nauthor: x\n---\n')
    expect(unknown.errors.map((e) => [e.line, /author/.test(e.message)])).toEqual([[5, true]])
    const missing = parseTemplate('---\nmodel: m\nversion: 1\n---\n')
    expect(missing.errors).toHaveLength(1)
    expect(missing.errors[0]!.message).toMatch(/title/)
    const yaml = parseTemplate('---\nmodel: m\ntitle: [unclosed\n---\n')
    expect(yaml.errors[0]!.line).toBeGreaterThanOrEqual(2)
    expect(parseTemplate('---\nmodel: m\ntitle: T\nversion: 1\n').errors[0]!.message).toMatch(/never closed/)
  })

  it('renders headings with stable, unique ids', () => {
    const html = withoutMath(renderBody('# Loads\n\n# Loads\n\n## Stresses at transfer (5.10.2.2)\n').html)
    expect(html).toContain('<h1 id="sec-loads">')
    expect(html).toContain('<h1 id="sec-loads-2">')
    expect(html).toContain('<h2 id="sec-stresses-at-transfer-5-10-2-2">')
  })
})
