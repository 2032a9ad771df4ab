import { describe, expect, it } from 'vitest'
import { exportCsv, exportJson, importInputs, InputsFileError, type FieldUnit } from '../../../shared/sheet/io'

const fields: FieldUnit[] = [
  { path: 'spans', unit: 'm', kind: 'array' },
  { path: 'loads.sdl', unit: 'kN/m²', kind: 'number' },
  { path: 'concrete.grade', unit: '', kind: 'enum' },
]
const inputs = { spans: [7800, 9600], loads: { sdl: 0.002 }, concrete: { grade: 'C32/40' } }

describe('inputs files', () => {
  it('round-trips CSV in display units', () => {
    const csv = exportCsv(inputs, fields)
    expect(csv).toContain('spans.0,7.8,m')
    expect(csv).toContain('loads.sdl,2,kN/m²')
    const back = importInputs(csv, 'x.csv', inputs, fields, 'pt-member')
    expect(back.spans).toEqual([7800, 9600])
    expect((back.loads as { sdl: number }).sdl).toBeCloseTo(0.002, 12)
  })

  it('writes a text cell that a spreadsheet would run as a formula with a leading \' and reads it back unchanged; numbers stay numbers', () => {
    const textFields: FieldUnit[] = [...fields, { path: 'note', unit: '', kind: 'text' }, { path: 'offset', unit: 'mm', kind: 'number' }]
    // OWASP CSV injection: = + - @ tab CR at a cell's start; a line break after the formula must not hide it
    for (const hostile of ['=HYPERLINK("http://x.example","y")', '+1+1', '-2+3', '@SUM(A1)', '\t=1', '\r=1', '=1\n2']) {
      const csv = exportCsv({ ...inputs, note: hostile, offset: -25 }, textFields)
      const cells = csv.split('\n').filter(l => l.startsWith('note,') || l.startsWith('"note"'))
      expect(csv).toMatch(/note,"'/)
      expect(cells.length).toBe(1)
      expect(csv).toContain('offset,-25,mm')
      const back = importInputs(csv, 'x.csv', inputs, textFields, 'pt-member') as { note: string, offset: number }
      expect(back.note).toBe(hostile)
      expect(back.offset).toBe(-25)
    }
  })

  it('writes JSON in the units the engineer types, each value naming its unit, and reads it back', () => {
    const json = exportJson('pt-member', inputs, fields)
    const doc = JSON.parse(json)
    expect(doc.format).toBe('tendonbook-inputs/2')
    expect(doc.inputs.spans).toMatchObject({ value: [7.8, 9.6], unit: 'm' })
    expect(doc.inputs.loads.sdl).toMatchObject({ value: 2, unit: 'kN/m²' })
    expect(doc.inputs.concrete.grade.value).toBe('C32/40')
    const back = importInputs(json, 'x.json', {}, fields, 'pt-member')
    expect(back.spans).toEqual([7800, 9600])
    expect((back.loads as { sdl: number }).sdl).toBeCloseTo(0.002, 12)
    expect(back.concrete).toEqual({ grade: 'C32/40' })
    expect(() => importInputs(json, 'x.json', {}, fields, 'other')).toThrow(/model/)
  })

  it('still reads files of the first format, in engine units, by their format marker', () => {
    const old = JSON.stringify({ format: 'tendonbook-inputs/1', model: 'pt-member', units: 'N, mm, MPa (engine units)', inputs })
    expect(importInputs(old, 'old.json', {}, fields, 'pt-member')).toEqual(inputs)
  })

  it('refuses a JSON value in another unit than the field is typed in, naming the field', () => {
    const doc = { format: 'tendonbook-inputs/2', model: 'pt-member', inputs: { spans: { value: [7800, 9600], unit: 'mm' }, loads: { sdl: { value: 'two', unit: 'kN/m²' } } } }
    try {
      importInputs(JSON.stringify(doc), 'x.json', {}, fields, 'pt-member')
      expect.unreachable()
    }
    catch (error) {
      expect((error as InputsFileError).problems).toEqual([
        'spans.0 is given in m, not "mm"',
        'spans.1 is given in m, not "mm"',
        'loads.sdl must be a number, not "two"',
      ])
    }
  })

  it('names the real inputs by their labels', () => {
    const real: FieldUnit[] = [{ path: 'geometry.spans', unit: 'm', kind: 'array' }, { path: 'loads.superimposed', unit: 'kN/m²', kind: 'number' }]
    try {
      importInputs('field,value,unit\ngeometry.spans.1,eight,m\nloads.superimposed,2,kN/m\n', 'x.csv', {}, real, 'pt-member')
      expect.unreachable()
    }
    catch (error) {
      expect((error as InputsFileError).problems).toEqual([
        'line 2: Span 2 must be a number, not "eight"',
        'line 3: Superimposed dead load is given in kN/m², not "kN/m"',
      ])
    }
  })

  it('names the line and the field of every problem', () => {
    const csv = 'field,value,unit\nspans.0,seven,m\nloads.sdl,2,kN\nnope,1,\n'
    try {
      importInputs(csv, 'x.csv', inputs, fields, 'pt-member')
      expect.unreachable()
    }
    catch (error) {
      expect(error).toBeInstanceOf(InputsFileError)
      const problems = (error as InputsFileError).problems
      expect(problems).toEqual([
        'line 2: spans.0 must be a number, not "seven"',
        'line 3: loads.sdl is given in kN/m², not "kN"',
        'line 4: "nope" is not an input of this sheet',
      ])
    }
  })
})
