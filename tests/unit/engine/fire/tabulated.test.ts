/**
 * Fire resistance by tabulated data. Every table value here is FROM MEMORY, TO BE CHECKED AGAINST
 * EN 1992-1-2 (as /work/shared/references.md marks them); the 5.2(5) increase (+15 mm strands and
 * wires, +10 mm bars) is the clause's own rule.
 */
import { describe, expect, it } from 'vitest'
import { fireTabulated, tendonAxisIncrease } from '../../../../shared/engine/fire/tabulated'
import type { FireRating } from '../../../../shared/engine/fire/tabulated'
import { EngineInputError } from '../../../../shared/engine/contract'

describe('EN 1992-1-2 5.2(5): axis distance increase for prestressing steel', () => {
  it('+15 mm for strands and wires, +10 mm for bars, 0 for reinforcement alone', () => {
    expect(tendonAxisIncrease('strand')).toBe(15)
    expect(tendonAxisIncrease('wire')).toBe(15)
    expect(tendonAxisIncrease('bar')).toBe(10)
    expect(tendonAxisIncrease('none')).toBe(0)
  })
})

describe('solid slabs, Table 5.8 (from memory, to be checked against EN 1992-1-2)', () => {
  // rating: hs, a one-way, a two-way ly/lx ≤ 1.5, a two-way 1.5 < ly/lx ≤ 2 (references.md, from memory)
  const rows: Array<[FireRating, number, number, number, number]> = [
    ['R60', 80, 20, 10, 15], ['R90', 100, 30, 15, 20], ['R120', 120, 40, 20, 25], ['R180', 150, 55, 30, 40], ['R240', 175, 65, 40, 50],
  ]
  for (const [rating, hs, one, two15, two20] of rows) {
    it(`${rating}: hs ${hs}, a ${one} | ${two15} | ${two20}, plus 15 mm for strands`, () => {
      const o = fireTabulated({ member: 'slab-one-way', rating })
      expect(o.minThickness).toBe(hs)
      expect(o.axisDistanceTable).toBe(one)
      expect(o.axisDistance).toBe(one + 15)
      expect(o.fromMemory).toBe(true)
      expect(fireTabulated({ member: 'slab-two-way', rating, spanRatio: 1.2 }).axisDistance).toBe(two15 + 15)
      expect(fireTabulated({ member: 'slab-two-way', rating, spanRatio: 1.8 }).axisDistance).toBe(two20 + 15)
      expect(fireTabulated({ member: 'slab-two-way', rating, spanRatio: 1.8, tendon: 'none' }).axisDistance).toBe(two20)
    })
  }
  it('says which requirement governs when the slab is given', () => {
    // R90 one-way, strands: hs 100, a = 30 + 15 = 45 mm. A 200 mm slab with a = 40 mm: thickness 100/200 = 0.5, axis 45/40 = 1.125
    const r = fireTabulated({ member: 'slab-one-way', rating: 'R90', thickness: 200, axisDistance: 40 })
    expect(r.governs).toBe('axis distance')
    expect(r.utilisation).toBeCloseTo(45 / 40, 12)
    const t = fireTabulated({ member: 'slab-one-way', rating: 'R90', thickness: 90, axisDistance: 60 })
    expect(t.governs).toBe('thickness')
    expect(t.utilisation).toBeCloseTo(100 / 90, 12)
    expect(fireTabulated({ member: 'slab-one-way', rating: 'R90' }).governs).toBeNull()
  })
})

describe('flat slabs, Table 5.9 (from memory, to be checked against EN 1992-1-2)', () => {
  const rows: Array<[FireRating, number, number]> = [['R60', 180, 15], ['R90', 200, 25], ['R120', 200, 35], ['R180', 200, 45], ['R240', 200, 50]]
  for (const [rating, hs, a] of rows) {
    it(`${rating}: hs ${hs}, a ${a} + 15 (strands) / + 10 (bars)`, () => {
      expect(fireTabulated({ member: 'flat-slab', rating }).minThickness).toBe(hs)
      expect(fireTabulated({ member: 'flat-slab', rating }).axisDistance).toBe(a + 15)
      expect(fireTabulated({ member: 'flat-slab', rating, tendon: 'bar' }).axisDistance).toBe(a + 10)
    })
  }
})

describe('beams, Tables 5.5 and 5.6 (from memory, to be checked against EN 1992-1-2)', () => {
  it('continuous beam R120 (Table 5.6: 200/45, 300/35, 450/35, 500/30): the widest column within the width', () => {
    expect(fireTabulated({ member: 'beam', rating: 'R120', width: 350 })).toMatchObject({ minWidth: 300, axisDistanceTable: 35, axisDistance: 50 })
    expect(fireTabulated({ member: 'beam', rating: 'R120', width: 500 })).toMatchObject({ minWidth: 500, axisDistanceTable: 30 })
    const narrow = fireTabulated({ member: 'beam', rating: 'R120', width: 180 })
    expect(narrow.governs).toBe('width')
    expect(narrow.utilisation).toBeCloseTo(200 / 180, 12)
  })
  it('simply supported beam R90 (Table 5.5: 150/55, 200/45, 300/40, 400/35)', () => {
    expect(fireTabulated({ member: 'beam', rating: 'R90', continuity: 'simply-supported', width: 250 })).toMatchObject({ minWidth: 200, axisDistanceTable: 45, axisDistance: 60 })
  })
})

describe('bad input names the field', () => {
  it('rating, member, span ratio, tendon, sizes', () => {
    const bad: Array<[() => unknown, RegExp]> = [
      [() => fireTabulated({ member: 'flat-slab', rating: 'R30' as FireRating }), /^rating/],
      [() => fireTabulated({ member: 'wall' as 'beam', rating: 'R60' }), /^member/],
      [() => fireTabulated({ member: 'slab-two-way', rating: 'R60' }), /^spanRatio/],
      [() => fireTabulated({ member: 'slab-two-way', rating: 'R60', spanRatio: 0.8 }), /^spanRatio/],
      [() => fireTabulated({ member: 'flat-slab', rating: 'R60', tendon: 'rope' as 'bar' }), /^tendon/],
      [() => fireTabulated({ member: 'flat-slab', rating: 'R60', thickness: -200 }), /^thickness/],
      [() => fireTabulated({ member: 'beam', rating: 'R60', width: 0 }), /^width/],
    ]
    for (const [run, field] of bad) {
      expect(run).toThrow(EngineInputError)
      expect(run).toThrow(field)
    }
  })
})
