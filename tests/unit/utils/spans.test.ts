import { describe, expect, it } from 'vitest'
import { DEMO_PS2, memberInputSchema } from '../../../shared/engine/index'
import { isSymmetric, resizeSpanLists } from '../../../shared/sheet/spans'

const symmetric = {
  geometry: { spans: [7800, 9600, 9600, 7800], supports: ['pinned', 'pinned', 'fixed', 'pinned', 'pinned'] },
  profile: { supportEcc: [0, -90, -95, -90, 0], spanEcc: [90, 85, 85, 90], lowPointAt: [0.4, 0.5, 0.5, 0.6] },
}
const lopsided = {
  geometry: { spans: [6000, 9000, 12000], supports: ['fixed', 'pinned', 'pinned', 'pinned'] },
  profile: { supportEcc: [10, -80, -90, 0], spanEcc: [70, 80, 95], lowPointAt: [0.4, 0.5, 0.55] },
}

describe('adding and removing spans', () => {
  it('keeps a symmetric member symmetric, spans going and coming in the middle', () => {
    expect(isSymmetric(symmetric)).toBe(true)
    const three = resizeSpanLists(symmetric, 3)
    expect(three.geometry.spans).toEqual([7800, 9600, 7800])
    expect(three.geometry.supports).toEqual(['pinned', 'pinned', 'pinned', 'pinned'])
    expect(three.profile.supportEcc).toEqual([0, -90, -90, 0])
    expect(three.profile.spanEcc).toEqual([90, 85, 90])
    expect(three.profile.lowPointAt).toEqual([0.4, 0.5, 0.6])
    expect(isSymmetric(three)).toBe(true)
    const five = resizeSpanLists(symmetric, 5)
    expect(five.geometry.spans).toEqual([7800, 9600, 9600, 9600, 7800])
    expect(isSymmetric(five)).toBe(true)
    for (let n = 1; n <= 10; n += 1) {
      const resized = resizeSpanLists(symmetric, n)
      expect(isSymmetric(resized), `${n} spans`).toBe(true)
      expect(resized.geometry.supports).toHaveLength(n + 1)
      expect(resized.profile.supportEcc).toHaveLength(n + 1)
      expect(resized.profile.spanEcc).toHaveLength(n)
      expect(resized.profile.lowPointAt).toHaveLength(n)
    }
  })

  it('takes the last span off any other member and keeps its end support the end', () => {
    expect(isSymmetric(lopsided)).toBe(false)
    const two = resizeSpanLists(lopsided, 2)
    expect(two.geometry.spans).toEqual([6000, 9000])
    expect(two.geometry.supports).toEqual(['fixed', 'pinned', 'pinned'])
    expect(two.profile.supportEcc).toEqual([10, -80, 0])
    expect(two.profile.spanEcc).toEqual([70, 80])
    const four = resizeSpanLists(lopsided, 4)
    expect(four.geometry.spans).toEqual([6000, 9000, 12000, 12000])
    expect(four.profile.supportEcc).toEqual([10, -80, -90, -90, 0])
  })

  it('leaves inputs the engine accepts, for every count from 1 to 10', () => {
    const demo = memberInputSchema.parse(DEMO_PS2)
    for (let n = 1; n <= 10; n += 1) expect(memberInputSchema.safeParse(resizeSpanLists(demo, n)).success, `${n} spans`).toBe(true)
  })
})
