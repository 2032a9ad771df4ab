import { describe, expect, it } from 'vitest'
import { compileTemplate, lintTemplate } from '../../../shared/report/compile'
import { TemplateKeyError, TemplateLoadError, TemplateSyntaxError } from '../../../shared/report/errors'
import { beamModel } from './fixtures/beam-model'
import { BODY_LINE, compileBody, template } from './helpers'

function loadErrors(body: string): TemplateLoadError {
  try {
    compileBody(body)
  } catch (error) {
    if (error instanceof TemplateLoadError) return error
    throw error
  }
  throw new Error('the template loaded')
}

describe('binding keys to the model', () => {
  it('loads a template whose keys all exist, and lists the keys it uses', () => {
    const compiled = compileBody(':in[geometry.h] :val[selfWeight] $\\val{input.loads.qk}$\n\n::: each{in=spans as=s}\n:val[s.M] :val[#s]\n:::\n')
    expect(compiled.keys).toEqual(['geometry.h', 'input.loads.qk', 'selfWeight', 'spans', 'spans[].M'])
    expect(compiled.meta.model).toBe('test-beam')
  })

  it('collects every unknown key with its line, not only the first', () => {
    const body = [
      '# Loads', //                         BODY_LINE
      '',
      'Depth :in[geometry.hh].', //         +2
      'Loads :val[input.loads.sdll] and', //  +3
      ':val[input.loads.qk] (known).', //   +4
      '',
      '$$',
      'M = \\val{spans.0.MM}', //           +7
      '$$',
      '',
      '::: each{in=spanz as=s}', //         +10
      ':val[s.M]', //                       +11: not checked again under a wrong each
      ':::',
    ].join('\n')
    const error = loadErrors(body)
    const keyErrors = error.errors.filter((e): e is TemplateKeyError => e instanceof TemplateKeyError)
    expect(keyErrors.map((e) => [e.line, e.key])).toEqual([
      [BODY_LINE + 2, 'geometry.hh'],
      [BODY_LINE + 3, 'input.loads.sdll'],
      [BODY_LINE + 7, 'spans.0.MM'],
      [BODY_LINE + 10, 'spanz'],
    ])
    expect(error.errors).toHaveLength(4)
    expect(keyErrors[1]!.message).toMatch(/did you mean input\.loads\.sdl/)
    expect(error.message).toContain(`line ${BODY_LINE + 2}: unknown key "geometry.hh"`)
    expect(keyErrors[0]!.detail).toMatch(/^unknown key "geometry.hh"/)
  })

  it('counts lines in the whole template, front matter included, and through CRLF line ends', () => {
    const errors = lintTemplate(template('\n\n\n:val[nope]\n').replace(/\n/g, '\r\n'), beamModel)
    expect(errors.map((e) => e.line)).toEqual([BODY_LINE + 3])
  })

  it('refuses a key used for the wrong purpose', () => {
    const body = ':in[selfWeight]\n\n:val[input.loads]\n\n:val[spans]\n\n::: each{in=selfWeight as=s}\n:::\n\n:in[geometry]\n\n:val[geometry.h]\n'
    const errors = loadErrors(body).errors
    expect(errors.map((e) => e.line)).toEqual([0, 2, 4, 6, 9, 11].map((n) => BODY_LINE + n))
    const expected = [
      /:in\[…\] takes an input field, but "selfWeight" is a result: show it with :val\[selfWeight\]/,
      /"input.loads" is a group of values, not one value/,
      /"spans" is a group of values, not one value/,
      /::: each\{in=…\} repeats over a list, but "selfWeight" is not one/,
      /"geometry" is a group of inputs/,
      /"geometry.h" is an input field, not a result: show its value with :val\[input.geometry.h\] or its field with :in\[geometry.h\]/,
    ]
    expected.forEach((re, i) => expect(errors[i]!.message).toMatch(re))
  })

  it('lets :val show a list of numbers (an input array) whole, and :in take the input. prefix too', () => {
    expect(() => compileBody(':val[input.geometry.spans] and :in[geometry.spans] and :val[input.geometry.spans.1] and :in[input.geometry.h]\n')).not.toThrow()
  })

  it('checks block attributes against the model', () => {
    const body = [
      '::: checks{group=uls}', //                 BODY_LINE
      ':::',
      '::: figure{plot=magnel}', //               +2
      ':::',
      '::: figure{plot=bars at=spans.0}', //      +4: bars takes no at
      ':::',
      '::: figure{plot=span at=selfWeight}', //   +6: not an element of spans
      ':::',
      '::: figure{}', //                          +8: no plot
      ':::',
      '::: each{in=spans as=selfWeight}', //      +10: hides a key
      ':::',
      '::: each{in=spans}', //                    +12: no local name
      ':::',
      '::: checks{group=service colour=red}', //  +14
      ':::',
    ].join('\n')
    const errors = loadErrors(body).errors
    expect(errors.map((e) => e.line)).toEqual([0, 2, 4, 6, 8, 10, 12, 12, 14].map((n) => BODY_LINE + n))
    expect(errors[0]!.message).toMatch(/unknown check group "uls".*service, transfer/)
    expect(errors[1]!.message).toMatch(/unknown figure "magnel".*bars, span/)
    expect(errors[5]!.message).toMatch(/hides a key/)
    expect(errors[8]).toBeInstanceOf(TemplateSyntaxError)
    expect(errors[8]!.message).toMatch(/no attribute "colour"/)
  })

  it('scopes local names to their each block, and #name to local names', () => {
    const ok = ':::  each{in=spans as=s}\n:val[#s] :val[s.M] :val[input.geometry.spans.#s]\n:::\n'
    expect(compileBody(ok).keys).toEqual(['input.geometry.spans[]', 'spans', 'spans[].M'])
    const errors = loadErrors('::: each{in=spans as=s}\n:val[s.M]\n:::\n\n:val[s.M]\n\n:val[spans.#t]\n\n:val[#s]\n\n::: each{in=spans as=s}\n:in[#s]\n:::\n').errors
    expect(errors.map((e) => [e.line, (e as TemplateKeyError).key])).toEqual([
      [BODY_LINE + 4, 's.M'],
      [BODY_LINE + 6, 'spans.#t'],
      [BODY_LINE + 8, '#s'],
      [BODY_LINE + 11, '#s'],
    ])
  })

  it('filters an each with where=… is=…, and checks both', () => {
    expect(() => compileBody('::: each{in=spans as=s where=s.label is="Span 2"}\n:val[s.M]\n:::\n')).not.toThrow()
    const errors = loadErrors('::: each{in=spans as=s where=s.lable is=x}\n:::\n\n::: each{in=spans as=s where=s.label}\n:::\n\n::: each{in=spans as=s where=selfWeight is=x}\n:::\n').errors
    expect(errors.map((e) => e.line)).toEqual([BODY_LINE, BODY_LINE + 3, BODY_LINE + 6])
    expect(errors[0]!.message).toMatch(/unknown key "s.lable"/)
    expect(errors[1]!.message).toMatch(/where=… and is=… together/)
    expect(errors[2]!.message).toMatch(/starts with the local name/)
  })

  it('refuses a template written for another model, or listing groups the model lacks', () => {
    const text = template('# A\n').replace('model: test-beam', 'model: pt-member').replace('groups: [geometry, loads]', 'groups: [geometry, wind]')
    const errors = lintTemplate(text, beamModel)
    expect(errors.map((e) => [e.line, e.message.replace(/^line \d+: /, '')])).toEqual([
      [2, 'the template is for the model "pt-member", not "test-beam"'],
      [5, 'unknown input group "wind": the model test-beam has geometry, loads, materials'],
    ])
    expect(() => compileTemplate(text, beamModel)).toThrow(TemplateLoadError)
  })
})
