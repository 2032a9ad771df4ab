import { describe, expect, it } from 'vitest'
import { editableText, readNumber } from '../../../shared/utils/number-text'

describe('reading a number as it is typed', () => {
  it('reads finished numbers, with a decimal comma or a typographic minus', () => {
    expect(readNumber('9.6')).toEqual({ kind: 'number', value: 9.6 })
    expect(readNumber(' -8.4 ')).toEqual({ kind: 'number', value: -8.4 })
    expect(readNumber('7,8')).toEqual({ kind: 'number', value: 7.8 })
    expect(readNumber('−3')).toEqual({ kind: 'number', value: -3 })
    expect(readNumber('8.')).toEqual({ kind: 'number', value: 8 })
    expect(readNumber('.5')).toEqual({ kind: 'number', value: 0.5 })
    expect(readNumber('1e3')).toEqual({ kind: 'number', value: 1000 })
  })

  it('takes a number on its way as still typing, never as a mistake', () => {
    for (const text of ['', '-', '+', '.', '-.', '1e', '1e-', '  ']) expect(readNumber(text), text).toEqual({ kind: 'partial' })
  })

  it('calls anything else not a number', () => {
    for (const text of ['abc', '8.4.2', '--8', '8a', 'e', '1e5e']) expect(readNumber(text), text).toEqual({ kind: 'invalid' })
  })

  it('writes an engine value back as the text of its field, in the display unit', () => {
    expect(editableText(9600, 'm', 2)).toBe('9.6')
    expect(editableText(0.002, 'kN/m²', 2)).toBe('2')
    expect(editableText(undefined, 'm', 2)).toBe('')
  })
})
