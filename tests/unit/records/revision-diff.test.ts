import { describe, expect, it } from 'vitest'
import type { ReportModel } from '../../../shared/report'
import { differsBeyond, diffRevisions, flattenLeaves, type DiffSide } from '../../../server/utils/revision-diff'
import { prng } from '../../helpers/prng'

function check(id: string, utilisation: number, group = 'service') {
  return { id, group, title: `Check ${id}`, clause: '7.2(2)', actual: utilisation * 10, limit: 10, unit: 'MPa' as const, utilisation, pass: utilisation <= 1 }
}

/** A model of the test's own: two input fields (one applies only in 'custom' mode), a few result specs. */
const model: ReportModel = {
  id: 'test',
  label: 'test',
  inputFields: [
    { path: 'spans', spec: { label: 'Spans', unit: 'm', precision: 2, group: 'geometry' }, kind: 'array' },
    { path: 'mode', spec: { label: 'Profile', unit: '', precision: 0, group: 'profile' }, kind: 'enum', options: ['deepest', 'custom'] },
    { path: 'ecc', spec: { label: 'Eccentricity', unit: 'mm', precision: 1, group: 'profile' }, kind: 'number' },
    { path: 'sdl', spec: { label: 'Superimposed dead load', unit: 'kN/m²', precision: 2, group: 'loads' }, kind: 'number' },
  ],
  inputGroups: [],
  resultSpecs: {
    'force.service': { label: 'Mean force in service', unit: 'kN', precision: 0 },
    'deflection[].long': { label: 'Long-term deflection', unit: 'mm', precision: 1 },
    'other': { label: 'Some other result', unit: 'mm', precision: 1 },
  },
  resultSpec: pattern => (/^sections\[\]\.r\d+$/.test(pattern) ? { label: pattern, unit: '', precision: 3 } : undefined),
  resultShape: new Map(),
  checkGroups: ['service'],
  figures: {},
  governingKeys: ['force.service', 'deflection[].long'],
  inputApplies: (path, inputs) => path !== 'ecc' || (inputs as { mode?: string }).mode === 'custom',
  checksOf: r => (r as { checks?: ReturnType<typeof check>[] }).checks ?? [],
  run: () => null,
}

const SECTIONS = [
  { id: 'sec-loads', title: 'Loads', level: 1 },
  { id: 'sec-stresses', title: 'Stresses in service', level: 1 },
  { id: 'sec-stresses-top', title: 'Top fibre', level: 2 },
  { id: 'sec-deflection', title: 'Deflection', level: 1 },
]

function side(inputs: unknown, results: unknown): DiffSide {
  return {
    inputs,
    results,
    sections: SECTIONS,
    checkSections: { a: 'sec-stresses-top', b: 'sec-stresses', c: 'sec-stresses' },
    keySections: { 'force.service': 'sec-loads', 'deflection.1.long': 'sec-deflection' },
  }
}

describe('revision diff', () => {
  it('lists every result that moved in the full list, on random runs, and only governing ones in the sections', () => {
    const rand = prng(2417)
    for (let trial = 0; trial < 50; trial++) {
      const n = 5 + Math.floor(rand() * 30)
      const before: Record<string, number> = {}
      const after: Record<string, number> = {}
      const moved = new Set<string>()
      for (let i = 0; i < n; i++) {
        const key = `r${i}`
        const value = (rand() - 0.5) * 10 ** Math.floor(rand() * 8)
        before[key] = value
        if (rand() < 0.3) {
          after[key] = value * (1 + (rand() < 0.5 ? -1 : 1) * (0.002 + rand() * 0.5))
          if (value !== 0) moved.add(`sections.0.${key}`)
        }
        else {
          after[key] = value * (1 + (rand() - 0.5) * 1e-7)
        }
      }
      const diff = diffRevisions(model,
        side({ spans: [7800] }, { sections: [before], series: { x: [1, 2] } }),
        side({ spans: [7800] }, { sections: [after], series: { x: [1, 3] } }))
      expect(new Set(diff.all.map(c => c.path))).toEqual(moved)
      expect(diff.sections).toEqual([])
      expect(diff.inputs).toEqual([])
    }
  })

  it('shows inputs by label in display units and leaves out one that applies to neither run', () => {
    const diff = diffRevisions(model,
      side({ spans: [7800, 9600], mode: 'deepest', ecc: 80, sdl: 0.002 }, {}),
      side({ spans: [7800, 9700], mode: 'deepest', ecc: 95, sdl: 0.0025 }, {}))
    expect(diff.inputs.map(c => [c.label, c.before, c.after].map(s => s.replace(/\s/g, ' ')))).toEqual([
      ['Spans', '7.80 m, 9.60 m', '7.80 m, 9.70 m'],
      ['Superimposed dead load', '2.00 kN/m²', '2.50 kN/m²'],
    ])
    const custom = diffRevisions(model, side({ mode: 'deepest', ecc: 80 }, {}), side({ mode: 'custom', ecc: 95 }, {}))
    expect(custom.inputs.map(c => c.label)).toEqual(['Profile', 'Eccentricity'])
  })

  it('groups results by top-level section: state changes first, then governing values beyond the threshold', () => {
    const diff = diffRevisions(model,
      side({}, { checks: [check('a', 0.9), check('b', 1.2), check('c', 0.5)], force: { service: 500_000 }, deflection: [{ long: 3 }, { long: 5 }], other: 1 }),
      side({}, { checks: [check('a', 1.1), check('b', 0.95), check('c', 0.6)], force: { service: 503_000 }, deflection: [{ long: 3 }, { long: 5.2 }], other: 2 }))
    expect(diff.sections.map(s => [s.title, s.checks.map(c => `${c.id}:${c.change}`), s.values.map(v => v.path)])).toEqual([
      ['Stresses in service', ['a:now-fails', 'b:now-passes', 'c:utilisation'], []],
      ['Deflection', [], ['deflection.1.long']],
    ])
    expect(diff.sections[1]!.values[0]!.label).toBe('Long-term deflection, greatest of 2')
    expect(diff.sections[1]!.values[0]!.after.replace(/\s/g, ' ')).toBe('5.2 mm')
    expect(diff.counts).toEqual({ nowFails: 1, nowPasses: 1, governingMoved: 1 })
    // a 0.6 % move of the force is in the full list only; the other result is not governing; a value the catalogue does not describe is counted
    expect(diff.all.map(c => c.path)).toEqual(['deflection.1.long', 'force.service', 'other'])
    expect(diff.uncatalogued).toBe(0)
    const samples = diffRevisions(model, side({}, { samples: [1, 2] }), side({}, { samples: [1, 3] }))
    expect([samples.all.length, samples.uncatalogued]).toEqual([0, 1])
  })

  it('applies |a − b| > abs + rel·max(|a|,|b|)', () => {
    expect(differsBeyond(100, 100.05, 1e-3, 0)).toBe(false)
    expect(differsBeyond(100, 100.2, 1e-3, 0)).toBe(true)
    expect(differsBeyond(0, 1e-12, 1e-3, 1e-9)).toBe(false)
    expect([...flattenLeaves({ a: [{ b: 1 }, null] }).keys()]).toEqual(['a.0.b', 'a.1'])
  })
})
