import { describe, expect, it } from 'vitest'
import { tensionRules } from '../../../../shared/engine/index'

describe('service tension rules, EN 1992-1-1 Table 7.1N (recommended values)', () => {
  it('bonded, XC1: uncracked under the frequent combination (wmax 0.2 mm beyond)', () => {
    expect(tensionRules('XC1', true)).toEqual([{ combination: 'frequent', kind: 'uncracked', clause: expect.any(String) }])
  })
  it('bonded, XC3: decompression under the quasi-permanent combination as well', () => {
    const r = tensionRules('XC3', true)
    expect(r.some((t) => t.combination === 'quasiPermanent' && t.kind === 'decompression')).toBe(true)
  })
  it('bonded, XD1 and XS1: decompression under the frequent combination', () => {
    for (const x of ['XD1', 'XS1'] as const) expect(tensionRules(x, true)[0]).toMatchObject({ combination: 'frequent', kind: 'decompression' })
  })
  it('unbonded: treated as reinforced, quasi-permanent combination', () => {
    expect(tensionRules('XC3', false)[0]).toMatchObject({ combination: 'quasiPermanent' })
  })
})
