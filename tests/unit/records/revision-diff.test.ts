import { describe, expect, it } from 'vitest'
import { differsBeyond, diffRevisions, flattenLeaves } from '../../../server/utils/revision-diff'
import { prng } from '../../helpers/prng'


function check(id: string, utilisation: number) {
  return { id, group: 'service', title: `Check ${id}`, clause: '7.2(2)', actual: utilisation * 10, limit: 10, unit: 'MPa' as const, utilisation, pass: utilisation <= 1 }
}

describe('revision diff', () => {
  it('lists exactly the results moved beyond the tolerance, on random runs', () => {
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
          after[key] = value * (1 + (rand() - 0.5) * 1e-4)
        }
      }
      const diff = diffRevisions(
        { inputs: { a: 1 }, results: { sections: [before], series: { x: [1, 2] } } },
        { inputs: { a: 1 }, results: { sections: [after], series: { x: [1, 3] } } },
      )
      expect(new Set(diff.results.map(c => c.path))).toEqual(moved)
      expect(diff.inputs).toEqual([])
    }
  })

  it('reports changed, added and removed inputs with the spec label and unit', () => {
    const diff = diffRevisions(
      { inputs: { spans: [7800, 9600], concrete: 'C32/40', cover: 25 }, results: {} },
      { inputs: { spans: [7800, 9700, 7800], concrete: 'C40/50', cover: 25 }, results: {} },
      { specFor: p => (p.startsWith('spans') ? { label: 'Span', unit: 'm', precision: 2 } : undefined) },
    )
    expect(diff.inputs.map(c => [c.path, c.before, c.after].map(s => s.replace(/\s/g, ' ')))).toEqual([
      ['concrete', 'C32/40', 'C40/50'],
      ['spans.1', '9.60 m', '9.70 m'],
      ['spans.2', '—', '7.80 m'],
    ])
  })

  it('names checks that now fail, now pass, appeared or went, and ignores tiny utilisation drift', () => {
    const diff = diffRevisions(
      { inputs: {}, results: { checks: [check('a', 0.9), check('b', 1.2), check('c', 0.5), check('d', 0.7)] } },
      { inputs: {}, results: { checks: [check('a', 1.1), check('b', 0.95), check('c', 0.5000001), check('e', 0.3)] } },
    )
    expect(diff.checks.map(c => [c.id, c.change])).toEqual([['a', 'now-fails'], ['b', 'now-passes'], ['d', 'removed'], ['e', 'added']])
  })

  it('applies |a − b| > abs + rel·max(|a|,|b|)', () => {
    expect(differsBeyond(100, 100.05, 1e-3, 0)).toBe(false)
    expect(differsBeyond(100, 100.2, 1e-3, 0)).toBe(true)
    expect(differsBeyond(0, 1e-12, 1e-3, 1e-9)).toBe(false)
    expect([...flattenLeaves({ a: [{ b: 1 }, null] }).keys()]).toEqual(['a.0.b', 'a.1'])
  })
})
