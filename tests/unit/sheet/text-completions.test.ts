/** The text editor's offers: keys with their labels and units, blocks, a calculation block's names and units. */
import { describe, expect, it } from 'vitest'
import { completionsAt, problemLines } from '../../../shared/sheet/text-completions'

const at = (text: string) => completionsAt(text, text.length)

describe('completions while typing', () => {
  it('results and inputs inside :val[…], with label and unit', () => {
    const c = at('Depth :val[section.')!
    expect(c.from).toBe('Depth :val['.length)
    const h = c.options.find((o) => o.label === 'section.h')!
    expect(h.info).toBe('Overall depth')
    expect(h.detail).toBe('mm')
    expect(c.options.some((o) => o.label === 'input.loads.imposed')).toBe(true)
  })

  it('input fields only inside :in[…]; the blocks after :::', () => {
    expect(at('Load :in[loads.')!.options.every((o) => o.type === 'input')).toBe(true)
    expect(at('::: ca')!.options.map((o) => o.label)).toContain('calc')
  })

  it('in a calculation block: the quantities above and the units; after a number, units only', () => {
    const text = '::: calc\nh_f = 3.6 m\ng_f = 0.75 kN/m^2\nw = h'
    expect(at(text)!.options.map((o) => o.label)).toEqual(expect.arrayContaining(['h_f', 'g_f', 'kN/m']))
    expect(at('::: calc\nh_f = 3.6 k')!.options.every((o) => o.type === 'unit')).toBe(true)
    expect(at('Plain prose h')).toBeNull()
  })

  it('the quantities of every block by calc.name inside :val[…]', () => {
    expect(at('::: calc\nw_f = 2 kN/m\n:::\n\nIt is :val[calc.')!.options.map((o) => o.label)).toContain('calc.w_f')
  })
})

describe('problems by line', () => {
  it('reads the checker\'s "line N: …"', () => {
    expect(problemLines(['line 14: unknown key "x"', 'no line'])).toEqual([{ line: 14, message: 'unknown key "x"' }, { line: 1, message: 'no line' }])
  })
})
