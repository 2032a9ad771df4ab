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

  it('round-trips JSON in engine units and checks the model', () => {
    const json = exportJson('pt-member', inputs)
    expect(importInputs(json, 'x.json', {}, fields, 'pt-member')).toEqual(inputs)
    expect(() => importInputs(json, 'x.json', {}, fields, 'other')).toThrow(/model/)
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
        'line 4: nope is not an input of this sheet',
      ])
    }
  })
})
